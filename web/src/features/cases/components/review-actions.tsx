/** The supervisor's review of a finding (approve and close, or send back) and reopening a closed case. */
import { zodResolver } from '@hookform/resolvers/zod'
import { useForm } from 'react-hook-form'
import { z } from 'zod'
import { CLOSE_RESOLUTIONS, RESOLUTION_LABELS } from '../../../../../shared/domain/case-lifecycle'
import { closeSchema, reopenSchema, returnFindingSchema } from '../../../../../shared/schemas/cases'
import { SelectField } from '../../../components/ui/select-field'
import { useCloseCase } from '../api/close-case'
import { useReopenCase } from '../api/reopen-case'
import { useReturnFinding } from '../api/return-finding'
import { ActionForm } from './action-form'
import { TextAreaField } from '../../../components/ui/text-area-field'
import { useCaseActionForm } from './use-case-action-form'

// The server's own schema, without the version the form adds when it sends.
const closeFields = closeSchema.omit({ version: true })
const RESOLUTION_OPTIONS = [{ value: '', label: 'Choose the outcome' }, ...CLOSE_RESOLUTIONS.map((r) => ({ value: r, label: RESOLUTION_LABELS[r] }))]

export function CloseCaseForm() {
  const { detail, run, error, reload, reloading } = useCaseActionForm()
  const form = useForm<z.input<typeof closeFields>>({ resolver: zodResolver(closeFields), defaultValues: { reason: '' } })
  const close = useCloseCase(detail.id)
  const e = form.formState.errors
  const onSubmit = form.handleSubmit((v) =>
    run({ send: (version) => close.mutateAsync({ ...v, version }), success: 'Case closed. The complainant has been sent the outcome.', setFieldError: form.setError, fields: ['resolution', 'reason'] }),
  )
  return (
    <ActionForm
      id="close"
      title="Approve and close"
      intro={<p>The complainant receives the outcome and your summary by e-mail, and sees them on their tracking page.</p>}
      submitLabel="Approve and close"
      pendingLabel="Closing…"
      submitting={form.formState.isSubmitting}
      onSubmit={onSubmit}
      error={error}
      onReload={reload}
      reloading={reloading}
    >
      <SelectField label="Resolution" id="close-resolution" options={RESOLUTION_OPTIONS} error={e.resolution?.message} {...form.register('resolution')} />
      <TextAreaField label="Summary for the complainant" id="close-reason" hint="Plain words: what was found and what was done." error={e.reason?.message} {...form.register('reason')} />
    </ActionForm>
  )
}

const returnFields = returnFindingSchema.omit({ version: true })

export function ReturnFindingForm() {
  const { detail, run, error, reload, reloading } = useCaseActionForm()
  const form = useForm<z.input<typeof returnFields>>({ resolver: zodResolver(returnFields), defaultValues: { reason: '' } })
  const send = useReturnFinding(detail.id)
  const onSubmit = form.handleSubmit((v) =>
    run({ send: (version) => send.mutateAsync({ ...v, version }), success: 'Sent back to the investigator for more work.', setFieldError: form.setError, fields: ['reason'] }),
  )
  return (
    <ActionForm
      id="return-finding"
      title="Send back for more work"
      submitLabel="Send back for more work"
      pendingLabel="Sending back…"
      submitting={form.formState.isSubmitting}
      onSubmit={onSubmit}
      error={error}
      onReload={reload}
      reloading={reloading}
      variant="secondary"
    >
      <TextAreaField label="What more is needed" id="return-reason" rows={3} error={form.formState.errors.reason?.message} {...form.register('reason')} />
    </ActionForm>
  )
}

const reopenFields = reopenSchema.omit({ version: true })

export function ReopenCaseForm() {
  const { detail, run, error, reload, reloading } = useCaseActionForm()
  const form = useForm<z.input<typeof reopenFields>>({ resolver: zodResolver(reopenFields), defaultValues: { reason: '' } })
  const reopen = useReopenCase(detail.id)
  const onSubmit = form.handleSubmit((v) =>
    run({ send: (version) => reopen.mutateAsync({ ...v, version }), success: 'Case reopened. The complainant has been told.', setFieldError: form.setError, fields: ['reason'] }),
  )
  return (
    <ActionForm
      id="reopen"
      title="Reopen the case"
      intro={<p>It goes back to its investigator, or to triage if it had none. The complainant is told why.</p>}
      submitLabel="Reopen case"
      pendingLabel="Reopening…"
      submitting={form.formState.isSubmitting}
      onSubmit={onSubmit}
      error={error}
      onReload={reload}
      reloading={reloading}
      variant="secondary"
    >
      <TextAreaField label="Why reopen" id="reopen-reason" rows={3} error={form.formState.errors.reason?.message} {...form.register('reason')} />
    </ActionForm>
  )
}
