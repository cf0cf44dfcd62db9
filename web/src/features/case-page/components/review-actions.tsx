/** The supervisor's review of a finding (approve and close, or send back) and reopening a closed case. */
import { zodResolver } from '@hookform/resolvers/zod'
import { useForm } from 'react-hook-form'
import type { z } from 'zod'
import { CLOSE_RESOLUTIONS, RESOLUTION_LABELS } from '@shared/domain/case-lifecycle'
import { closeSchema, reopenSchema, returnFindingSchema } from '@shared/schemas/cases'
import { SelectField } from '@/components/ui/select-field'
import { TextAreaField } from '@/components/ui/text-area-field'
import { useCloseCase } from '../api/close-case'
import { useReopenCase } from '../api/reopen-case'
import { useReturnFinding } from '../api/return-finding'
import { ActionForm } from './action-form'
import { ReasonMoveForm } from './reason-move-form'
import { useCaseActionForm } from './use-case-action-form'

// The server's own schema, without the version the form adds when it sends.
const closeFields = closeSchema.omit({ version: true })
const RESOLUTION_OPTIONS = [{ value: '', label: 'Choose the outcome' }, ...CLOSE_RESOLUTIONS.map((r) => ({ value: r, label: RESOLUTION_LABELS[r] }))]

export function CloseCaseForm() {
  const action = useCaseActionForm()
  const form = useForm<z.input<typeof closeFields>>({ resolver: zodResolver(closeFields), defaultValues: { reason: '' } })
  const close = useCloseCase(action.detail.id)
  const e = form.formState.errors
  const onSubmit = form.handleSubmit((v) =>
    action.run({ send: (version) => close.mutateAsync({ ...v, version }), success: 'Case closed. The complainant has been sent the outcome.', setFieldError: form.setError, fields: ['resolution', 'reason'] }),
  )
  return (
    <ActionForm
      id="close"
      title="Approve and close"
      intro={
        <>
          {/* on a narrow screen the finding comes after this panel */}
          <p className="mb-1 lg:hidden">
            <a href="#finding-heading">Read the finding first</a>
          </p>
          <p>The complainant receives the outcome and your summary by e-mail, and sees them on their tracking page.</p>
        </>
      }
      submitLabel="Approve and close"
      pendingLabel="Closing…"
      submitting={form.formState.isSubmitting}
      onSubmit={onSubmit}
      action={action}
    >
      <SelectField label="Resolution" id="close-resolution" options={RESOLUTION_OPTIONS} error={e.resolution?.message} {...form.register('resolution')} />
      <TextAreaField label="Summary for the complainant" id="close-reason" hint="Plain words: what was found and what was done." error={e.reason?.message} {...form.register('reason')} />
    </ActionForm>
  )
}

export function ReturnFindingForm() {
  return (
    <ReasonMoveForm
      id="return-finding"
      title="Send back for more work"
      submitLabel="Send back for more work"
      pendingLabel="Sending back…"
      variant="secondary"
      schema={returnFindingSchema}
      useMove={useReturnFinding}
      label="What more is needed"
      rows={3}
      success="Sent back to the investigator for more work."
    />
  )
}

export function ReopenCaseForm() {
  return (
    <ReasonMoveForm
      id="reopen"
      title="Reopen the case"
      intro={<p>It goes back to its investigator, or to triage if it had none. The complainant is told why.</p>}
      submitLabel="Reopen case"
      pendingLabel="Reopening…"
      variant="secondary"
      schema={reopenSchema}
      useMove={useReopenCase}
      label="Why reopen"
      rows={3}
      success="Case reopened. The complainant has been told."
    />
  )
}
