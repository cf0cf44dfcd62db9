/** Hand a new report to another office, which triages it afresh. */
import { zodResolver } from '@hookform/resolvers/zod'
import { useForm } from 'react-hook-form'
import type { z } from 'zod'
import { transferSchema } from '@shared/schemas/cases'
import { SelectField } from '@/components/ui/select-field'
import { formatDistanceM } from '@/lib/coordinates'
import { ActionForm } from './action-form'
import { TextAreaField } from '@/components/ui/text-area-field'
import { useCaseActionForm } from './use-case-action-form'
import { useTransferCase } from '../api/transfer-case'
import type { OfficeChoice } from '../api/get-transfer-offices'

const schema = transferSchema.omit({ version: true })
type In = z.input<typeof schema>

export function TransferForm({ destinations }: { destinations: OfficeChoice[] }) {
  const action = useCaseActionForm()
  const form = useForm<In>({ resolver: zodResolver(schema), defaultValues: { officeId: '', reason: '' } })
  const transfer = useTransferCase(action.detail.id)
  const e = form.formState.errors
  const options = [{ value: '', label: 'Choose an office' }, ...destinations.map((o) => ({ value: o.id, label: `${o.name} (${formatDistanceM(o.distanceM)} from the report)` }))]

  const onSubmit = form.handleSubmit((v) => {
    const name = destinations.find((o) => o.id === v.officeId)?.name ?? 'the other office'
    return action.run({ send: (version) => transfer.mutateAsync({ ...v, version }), success: `Transferred to ${name}.`, setFieldError: form.setError, fields: ['officeId', 'reason'] })
  })

  return (
    <ActionForm
      id="transfer"
      title="Transfer to another office"
      headingless
      submitLabel="Transfer"
      pendingLabel="Transferring…"
      submitting={form.formState.isSubmitting}
      onSubmit={onSubmit}
      action={action}
      variant="secondary"
    >
      <SelectField label="Office" id="transfer-office" options={options} error={e.officeId?.message} {...form.register('officeId')} />
      <TextAreaField label="Reason for the transfer" id="transfer-reason" rows={2} error={e.reason?.message} {...form.register('reason')} />
    </ActionForm>
  )
}
