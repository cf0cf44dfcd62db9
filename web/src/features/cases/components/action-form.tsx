/** The frame of one action on the case page: a titled form, its fields, its problem and its button. */
import type { FormEventHandler, ReactNode } from 'react'
import { Button } from '../../../components/ui/button'
import { MoveProblem } from './move-problem'

export interface ActionFormProps {
  id: string
  title: string
  intro?: ReactNode
  submitLabel: string
  pendingLabel: string
  submitting: boolean
  onSubmit: FormEventHandler<HTMLFormElement>
  error: unknown
  onReload: () => void
  reloading: boolean
  variant?: 'primary' | 'secondary' | 'danger'
  children?: ReactNode
  /** Inside a disclosure the disclosure's summary is the title. */
  headingless?: boolean
}

export function ActionForm({ id, title, intro, submitLabel, pendingLabel, submitting, onSubmit, error, onReload, reloading, variant = 'primary', children, headingless }: ActionFormProps) {
  const titleId = `${id}-title`
  return (
    // Deliberately unnamed: a form named like its only field would make that field's label ambiguous.
    <form noValidate onSubmit={onSubmit} className="flex flex-col gap-4">
      {!headingless && (
        <h3 id={titleId} className="text-lg font-bold">
          {title}
        </h3>
      )}
      {intro && <div className="text-sm text-ink-muted">{intro}</div>}
      {children}
      <MoveProblem error={error} onReload={onReload} reloading={reloading} />
      <div>
        <Button type="submit" variant={variant} disabled={submitting}>
          {submitting ? pendingLabel : submitLabel}
        </Button>
      </div>
    </form>
  )
}

/** A less common action, folded away until asked for (native disclosure: keyboard and screen readers for free). */
export function FoldedAction({ summary, children }: { summary: string; children: ReactNode }) {
  return (
    <details className="group rounded-control border border-rule">
      <summary className="flex min-h-11 cursor-pointer list-none items-center gap-2 px-3 font-semibold [&::-webkit-details-marker]:hidden">
        <svg aria-hidden="true" width="12" height="12" viewBox="0 0 12 12" className="shrink-0 transition-transform group-open:rotate-90">
          <path d="M4 2l4 4-4 4" fill="none" stroke="currentColor" strokeWidth="2" strokeLinecap="round" strokeLinejoin="round" />
        </svg>
        {summary}
      </summary>
      <div className="border-t border-rule p-3">{children}</div>
    </details>
  )
}
