/** Set (or confirm) the priority. Starts at the priority the report suggests. */
import { zodResolver } from '@hookform/resolvers/zod'
import { useForm } from 'react-hook-form'
import type { z } from 'zod'
import { triageSchema } from '@shared/schemas/cases'
import { PRIORITIES, PRIORITY_LABELS, type Priority } from '@shared/domain/services'
import { SelectField } from '@/components/ui/select-field'
import { ActionForm } from './action-form'
import { TextAreaField } from '@/components/ui/text-area-field'
import { useCaseActionForm } from './use-case-action-form'
import { useTriageCase } from '../api/triage-case'

const schema = triageSchema.omit({ version: true })
type In = z.input<typeof schema>
type Out = z.output<typeof schema>

export function TriageForm() {
  const action = useCaseActionForm()
  const { detail } = action
  const initial = detail.status === 'received' ? detail.suggestedPriority : detail.priority
  const form = useForm<In, unknown, Out>({ resolver: zodResolver(schema), defaultValues: { priority: initial, note: '' } })
  const triage = useTriageCase(detail.id)
  const options = PRIORITIES.map((p) => ({
    value: String(p),
    label: `${PRIORITY_LABELS[p].short}${p === detail.suggestedPriority ? ' (suggested)' : ''}`,
  }))

  const onSubmit = form.handleSubmit((v) =>
    action.run({
      send: (version) => triage.mutateAsync({ ...v, version }),
      success: `Harm class set: ${PRIORITY_LABELS[v.priority as Priority].short}.`,
      setFieldError: form.setError,
      fields: ['priority', 'note'],
      after: () => form.reset({ priority: v.priority, note: '' }),
    }),
  )

  return (
    <ActionForm
      id="triage"
      title={detail.status === 'received' ? 'Set the priority' : 'Change the priority'}
      intro={<p>Suggested from the report: {PRIORITY_LABELS[detail.suggestedPriority].short}. The response target follows the harm class.</p>}
      submitLabel="Set priority"
      pendingLabel="Setting priority…"
      submitting={form.formState.isSubmitting}
      onSubmit={onSubmit}
      action={action}
    >
      <SelectField label="Harm class" options={options} error={form.formState.errors.priority?.message} {...form.register('priority', { valueAsNumber: true })} />
      <TextAreaField label="Triage note (optional, internal)" rows={2} error={form.formState.errors.note?.message} {...form.register('note')} />
    </ActionForm>
  )
}
