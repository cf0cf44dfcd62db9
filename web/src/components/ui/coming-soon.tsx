/** Marks a page or panel that is a placeholder, so nobody mistakes it for a finished screen. */
import type { ReactNode } from 'react'

export function ComingSoon({ arrivesWith, children }: { arrivesWith: string; children?: ReactNode }) {
  return (
    <section aria-label="Not built yet" className="rounded-panel border-2 border-dashed border-field bg-surface p-5">
      <p className="mb-2 inline-block rounded-sm bg-caution-soft px-2 py-0.5 font-mono text-sm font-semibold text-caution">
        Coming with {arrivesWith}
      </p>
      <div className="flex flex-col gap-2 text-ink">{children}</div>
    </section>
  )
}
