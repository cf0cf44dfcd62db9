/** Close a report at triage: no interference, or a matter for another authority. */
import { zodResolver } from '@hookform/resolvers/zod'
import { useForm } from 'react-hook-form'
import type { z } from 'zod'
import { DISMISS_RESOLUTIONS, RESOLUTION_LABELS } from '@shared/domain/case-lifecycle'
import { dismissSchema } from '@shared/schemas/cases'
import { SelectField } from '@/components/ui/select-field'
import { ActionForm } from './action-form'
import { TextAreaField } from '@/components/ui/text-area-field'
import { useCaseActionForm } from './use-case-action-form'
import { useDismissReport } from '../api/dismiss-report'

const schema = dismissSchema.omit({ version: true })
type In = z.input<typeof schema>
const OPTIONS = DISMISS_RESOLUTIONS.map((r) => ({ value: r, label: RESOLUTION_LABELS[r] }))

export function DismissForm() {
  const action = useCaseActionForm()
  const form = useForm<In>({ resolver: zodResolver(schema), defaultValues: { resolution: 'no_interference_found', reason: '' } })
  const dismiss = useDismissReport(action.detail.id)
  const e = form.formState.errors

  const onSubmit = form.handleSubmit((v) =>
    action.run({ send: (version) => dismiss.mutateAsync({ ...v, version }), success: 'Report closed at triage. The complainant has been told.', setFieldError: form.setError, fields: ['resolution', 'reason'] }),
  )

  return (
    <ActionForm
      id="dismiss"
      title="Close at triage"
      headingless
      intro={<p>For a report that needs no field work. The complainant receives the summary by e-mail.</p>}
      submitLabel="Close report"
      pendingLabel="Closing…"
      submitting={form.formState.isSubmitting}
      onSubmit={onSubmit}
      action={action}
      variant="danger"
    >
      <SelectField label="Resolution" id="dismiss-resolution" options={OPTIONS} error={e.resolution?.message} {...form.register('resolution')} />
      <TextAreaField label="Summary for the complainant" id="dismiss-reason" error={e.reason?.message} {...form.register('reason')} />
    </ActionForm>
  )
}
