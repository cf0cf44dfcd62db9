/** The investigator's moves: start field work, propose a finding. */
import { zodResolver } from '@hookform/resolvers/zod'
import { useForm } from 'react-hook-form'
import type { z } from 'zod'
import { proposeFindingSchema } from '../../../../../shared/schemas/cases'
import { useProposeFinding } from '../api/propose-finding'
import { useStartFieldWork } from '../api/start-field-work'
import { ActionForm } from './action-form'
import { TextAreaField } from '../../../components/ui/text-area-field'
import { useCaseActionForm } from './use-case-action-form'

export function StartFieldWorkForm() {
  const { detail, run, error, reload, reloading } = useCaseActionForm()
  const start = useStartFieldWork(detail.id)
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
        void run({ send: (version) => start.mutateAsync({ version }), success: 'Field work started.' })
      }}
      error={error}
      onReload={reload}
      reloading={reloading}
    />
  )
}

const findingSchema = proposeFindingSchema.omit({ version: true })
type FindingIn = z.input<typeof findingSchema>

export function ProposeFindingForm() {
  const { detail, run, error, reload, reloading } = useCaseActionForm()
  const form = useForm<FindingIn>({ resolver: zodResolver(findingSchema), defaultValues: { reason: '' } })
  const propose = useProposeFinding(detail.id)
  const onSubmit = form.handleSubmit((v) =>
    run({
      send: (version) => propose.mutateAsync({ ...v, version }),
      success: 'Finding proposed. Your supervisor has been asked to review it.',
      setFieldError: form.setError,
      fields: ['reason'],
      after: () => form.reset({ reason: '' }),
    }),
  )
  return (
    <ActionForm
      id="propose-finding"
      title="Propose a finding"
      intro={<p>Your supervisor reviews it, then closes the case or sends it back.</p>}
      submitLabel="Propose finding"
      pendingLabel="Sending…"
      submitting={form.formState.isSubmitting}
      onSubmit={onSubmit}
      error={error}
      onReload={reload}
      reloading={reloading}
    >
      <TextAreaField
        label="Finding summary"
        hint="The source you found, the evidence (where and what you measured) and what you recommend."
        rows={6}
        error={form.formState.errors.reason?.message}
        {...form.register('reason')}
      />
    </ActionForm>
  )
}
