/** A quiet loading line; screen readers hear the label once. */
export function Loading({ label }: { label: string }) {
  return (
    <p role="status" className="flex items-center gap-2 text-ink-muted">
      <span aria-hidden="true" className="inline-block h-2 w-8 animate-pulse rounded-full bg-rule" />
      {label}
    </p>
  )
}
