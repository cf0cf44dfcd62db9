/** The frame of one action on the case page: a titled form, its fields, its problem and its button. */
import type { FormEventHandler, ReactNode } from 'react'
import { SubmitButton } from '@/components/ui/submit-button'
import { MoveProblem } from './move-problem'
import type { CaseActionForm } from './use-case-action-form'

export interface ActionFormProps {
  id: string
  title: string
  intro?: ReactNode
  submitLabel: string
  pendingLabel: string
  submitting: boolean
  onSubmit: FormEventHandler<HTMLFormElement>
  /** The form's useCaseActionForm(): what went wrong last, and how to reload the case. */
  action: CaseActionForm
  variant?: 'primary' | 'secondary' | 'danger'
  children?: ReactNode
  /** Inside a disclosure the disclosure's summary is the title. */
  headingless?: boolean
}

export function ActionForm({ id, title, intro, submitLabel, pendingLabel, submitting, onSubmit, action, variant = 'primary', children, headingless }: ActionFormProps) {
  return (
    // Deliberately unnamed: a form named like its only field would make that field's label ambiguous.
    <form noValidate onSubmit={onSubmit} className="flex flex-col gap-4">
      {!headingless && (
        <h3 id={`${id}-title`} className="text-lg font-bold">
          {title}
        </h3>
      )}
      {intro && <div className="text-sm text-ink-muted">{intro}</div>}
      {children}
      <MoveProblem error={action.error} onReload={action.reload} reloading={action.reloading} />
      <div>
        <SubmitButton submitting={submitting} pendingLabel={pendingLabel} variant={variant}>
          {submitLabel}
        </SubmitButton>
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

/** One action in the actions panel, set off from the next by a rule. */
export function Block({ children }: { children: ReactNode }) {
  return <div className="border-t border-rule pt-4 first-of-type:border-t-0 first-of-type:pt-0">{children}</div>
}
