/** The investigator's move to start field work (proposing a finding: finding-form.tsx). */
import { useStartFieldWork } from '../api/start-field-work'
import { ActionForm } from './action-form'
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
