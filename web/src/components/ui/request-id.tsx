/** The server's request id, in figures type, for quoting to support. */
export function RequestId({ id }: { id: string | null | undefined }) {
  if (!id) return null
  return (
    <p className="text-sm text-ink-muted">
      Request id <code className="rounded-sm bg-paper px-1 font-mono text-ink">{id}</code>
    </p>
  )
}
