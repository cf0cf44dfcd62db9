/** A description from the document: `backticked` words set as code, the rest as written (no other markup is read). */
export function InlineText({ text }: { text: string }) {
  const parts = text.split(/`([^`\n]+)`/)
  return (
    <>
      {parts.map((part, i) =>
        i % 2 === 1 ? (
          <code key={i} className="rounded-control bg-paper px-1">
            {part}
          </code>
        ) : (
          part
        ),
      )}
    </>
  )
}
