/** Splits plain text into text and web-address pieces, so e-mailed links can be clicked. */
export type TextPiece = { kind: 'text'; text: string } | { kind: 'link'; href: string }

// Trailing punctuation usually ends the sentence, not the address.
const URL_PATTERN = /https?:\/\/[^\s<>"]+[^\s<>".,;:!?)\]']/g

export function splitLinks(text: string): TextPiece[] {
  const pieces: TextPiece[] = []
  let last = 0
  for (const match of text.matchAll(URL_PATTERN)) {
    const start = match.index ?? 0
    if (start > last) pieces.push({ kind: 'text', text: text.slice(last, start) })
    pieces.push({ kind: 'link', href: match[0] })
    last = start + match[0].length
  }
  if (last < text.length) pieces.push({ kind: 'text', text: text.slice(last) })
  return pieces
}
