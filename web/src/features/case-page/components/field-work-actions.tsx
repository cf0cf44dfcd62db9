/** The investigator's moves: start field work, propose a finding. */
import { proposeFindingSchema } from '@shared/schemas/cases'
import { useProposeFinding } from '../api/propose-finding'
import { useStartFieldWork } from '../api/start-field-work'
import { ActionForm } from './action-form'
import { ReasonMoveForm } from './reason-move-form'
import { useCaseActionForm } from './use-case-action-form'

export function StartFieldWorkForm() {
  const action = useCaseActionForm()
  const start = useStartFieldWork(action.detail.id)
  return (
    <ActionForm
      id="start-field-work"
      title="Field work"
      intro={<p>Record that you are going out to measure. The complainant sees the case as under investigation.</p>}
      submitLabel="Start field work"
      pendingLabel="Starting…"
      submitting={start.isPending}
      onSubmit={(e) => {
        e.preventDefault()
        void action.run({ send: (version) => start.mutateAsync({ version }), success: 'Field work started.' })
      }}
      action={action}
    />
  )
}

export function ProposeFindingForm() {
  return (
    <ReasonMoveForm
      id="propose-finding"
      title="Propose a finding"
      intro={<p>Your supervisor reviews it, then closes the case or sends it back.</p>}
      submitLabel="Propose finding"
      pendingLabel="Sending…"
      schema={proposeFindingSchema}
      useMove={useProposeFinding}
      label="Finding summary"
      hint="The source you found, the evidence (where and what you measured) and what you recommend."
      rows={6}
      success="Finding proposed. Your supervisor has been asked to review it."
    />
  )
}
