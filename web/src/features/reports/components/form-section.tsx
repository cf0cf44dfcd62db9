/** One titled part of the report form: a fieldset whose legend is a heading. */
import type { ReactNode } from 'react'

export function FormSection({ title, lead, children }: { title: string; lead?: ReactNode; children: ReactNode }) {
  return (
    // min-w-0: a fieldset does not shrink below its content by default, which widened the page on phones
    <fieldset className="flex min-w-0 flex-col gap-5 rounded-panel border border-rule bg-surface p-5">
      <legend className="float-left mb-1 w-full">
        <h2 className="text-xl font-bold">{title}</h2>
      </legend>
      {lead && <div className="-mt-3 text-ink-muted">{lead}</div>}
      {children}
    </fieldset>
  )
}

/**
 * Typed figures: blank means "not given"; anything else goes to the shared number parser as
 * typed (it understands a typographic minus and a decimal comma, and asks about "1,000").
 */
export function figureOrUndefined(value: unknown): unknown {
  if (typeof value !== 'string') return value
  const t = value.trim()
  return t === '' ? undefined : t
}
