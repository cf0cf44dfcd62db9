/**
 * Evidence file names: the name a browser sent is never used as a path nor sent back as is.
 * Path separators, control characters and characters Windows refuses become '_', leading dots
 * and spaces are dropped, and a name longer than 255 characters is shortened keeping its
 * extension. The name as sent is kept beside it, JSON-escaped (every character visible).
 */

export const MAX_FILE_NAME_CHARS = 255

// eslint-disable-next-line no-control-regex
const UNSAFE = /[\u0000-\u001f\u007f-\u009f/\\:*?"<>|\u2028\u2029\u202a-\u202e\u2066-\u2069]/g
const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/g

/** The name shown and offered on download. */
export function cleanFileName(raw: string): string {
  let name = raw.replace(LONE_SURROGATE, '_').replace(UNSAFE, '_').trim().replace(/^[.\s]+/, '')
  if (name === '' || /^_+$/.test(name)) name = 'evidence'
  const chars = Array.from(name)
  if (chars.length > MAX_FILE_NAME_CHARS) {
    const dot = name.lastIndexOf('.')
    const ext = dot > 0 ? Array.from(name.slice(dot)) : []
    const keepExt = ext.length > 0 && ext.length <= 16 ? ext : []
    name = chars.slice(0, MAX_FILE_NAME_CHARS - keepExt.length).join('') + keepExt.join('')
  }
  return name
}

/** The name as sent, for the record: JSON-escaped, at most 4000 characters. */
export function submittedNameRecord(raw: string): string {
  return JSON.stringify(raw.slice(0, 2000))
}

/** A Content-Disposition header for an attachment: an ASCII fallback and the UTF-8 name (RFC 6266, RFC 5987). */
export function attachmentDisposition(name: string): string {
  const ascii = name.replace(/[^\x20-\x7e]/g, '_').replace(/["\\%;]/g, '_')
  const encoded = encodeURIComponent(name).replace(/['()*]/g, (c) => `%${c.charCodeAt(0).toString(16).toUpperCase()}`)
  return `attachment; filename="${ascii}"; filename*=UTF-8''${encoded}`
}
