/** A white working surface on the paper background. */
import type { ReactNode } from 'react'

export function Panel({ children, className = '', label }: { children: ReactNode; className?: string; label?: string }) {
  return (
    <section aria-label={label} className={`rounded-panel border border-rule bg-surface p-5 ${className}`}>
      {children}
    </section>
  )
}
