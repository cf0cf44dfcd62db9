/**
 * The case page's actions, built only from the `abilities` the server sent with the case:
 * nothing here checks a role.
 */
import { useRef, useState } from 'react'
import type { CaseDetail } from '../api/get-case'
import { Block } from './action-form'
import { CaseActionContext } from './case-action-context'
import { StartFieldWorkForm } from './field-work-actions'
import { ProposeFindingForm } from './finding-form'
import { InternalNoteForm, MessageComplainantForm } from './note-forms'
import { CloseCaseForm, ReopenCaseForm, ReturnFindingForm } from './review-actions'
import { TriageActions } from './triage-actions'

export interface CaseActionsPanelProps {
  detail: CaseDetail
  reload: () => void
  reloading: boolean
}

export function CaseActionsPanel({ detail, reload, reloading }: CaseActionsPanelProps) {
  const [message, setMessage] = useState('')
  const messageRef = useRef<HTMLParagraphElement>(null)
  const a = detail.abilities
  const anything = Object.values(a).some(Boolean)

  const announce = (text: string) => {
    setMessage(text)
    requestAnimationFrame(() => messageRef.current?.focus())
  }

  return (
    <CaseActionContext value={{ detail, reload: () => { setMessage(''); reload() }, reloading, announce }}>
      <section aria-labelledby="actions-heading" className="flex flex-col gap-5 rounded-panel border border-rule bg-surface p-5">
        <h2 id="actions-heading" className="text-xl font-bold">
          Actions
        </h2>
        <p
          ref={messageRef}
          tabIndex={-1}
          role="status"
          className={message ? 'rounded-control border-l-4 border-ok bg-ok-soft px-3 py-2 font-semibold focus:outline-none' : 'sr-only'}
        >
          {message}
        </p>
        {!anything && <p className="text-ink-muted">You can read this case. Changes are made by the staff of its office.</p>}
        <TriageActions />
        {a.startFieldWork && <Block><StartFieldWorkForm /></Block>}
        {a.proposeFinding && <Block><ProposeFindingForm /></Block>}
        {a.close && <Block><CloseCaseForm /></Block>}
        {a.returnFinding && <Block><ReturnFindingForm /></Block>}
        {a.reopen && <Block><ReopenCaseForm /></Block>}
        {a.messageComplainant && <Block><MessageComplainantForm /></Block>}
        {a.addInternalNote && <Block><InternalNoteForm /></Block>}
      </section>
    </CaseActionContext>
  )
}
