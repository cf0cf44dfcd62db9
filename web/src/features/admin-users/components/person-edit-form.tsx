/**
 * Moving a person to another role or office. Says beforehand what follows (their sessions end;
 * an investigator's open cases in the old office return to its triage) and afterwards what did.
 * The server checks the combination and names the field; the last active administrator is
 * refused with its reason.
 */
import { zodResolver } from '@hookform/resolvers/zod'
import { useState } from 'react'
import { useForm } from 'react-hook-form'
import { z } from 'zod'
import { ROLE_LABELS } from '@shared/domain/roles'
import type { PersonChangedResponse } from '@shared/schemas/people'
import { Button } from '@/components/ui/button'
import { FormAlert } from '@/components/ui/form-alert'
import { Notice } from '@/components/ui/notice'
import { SelectField } from '@/components/ui/select-field'
import { SubmitButton } from '@/components/ui/submit-button'
import { applyFieldErrors, formProblem, type FormProblem } from '@/lib/form-errors'
import type { AdminUser } from '../api/get-users'
import { useUpdatePerson } from '../api/update-person'

const STAFF_ROLES = ['investigator', 'supervisor', 'admin'] as const
const schema = z.object({ role: z.enum(STAFF_ROLES, { message: 'Choose a role.' }), officeId: z.uuid().nullable() })
type FormValues = z.infer<typeof schema>
const ROLE_OPTIONS = STAFF_ROLES.map((r) => ({ value: r, label: ROLE_LABELS[r] }))

export function PersonEditForm({ user, offices, onClose }: { user: AdminUser; offices: { id: string; name: string }[]; onClose: () => void }) {
  const update = useUpdatePerson()
  const [problem, setProblem] = useState<FormProblem | null>(null)
  const [result, setResult] = useState<PersonChangedResponse | null>(null)
  const staffRole = user.role === 'complainant' ? 'investigator' : user.role
  const { register, handleSubmit, setError, formState } = useForm<FormValues>({
    resolver: zodResolver(schema),
    defaultValues: { role: staffRole, officeId: user.officeId },
  })

  const onSubmit = handleSubmit(async (values) => {
    setProblem(null)
    setResult(null)
    try {
      setResult(await update.mutateAsync({ userId: user.id, changes: { role: values.role, officeId: values.officeId } }))
    } catch (error) {
      if (applyFieldErrors({ error, setError, fields: ['role', 'officeId'] })) return
      setProblem(formProblem(error))
    }
  })

  const officeOptions = [{ value: '', label: 'No office (administrators)' }, ...offices.map((o) => ({ value: o.id, label: o.name }))]
  const headingId = `person-edit-${user.id}`

  return (
    <form noValidate onSubmit={onSubmit} className="flex flex-col gap-4" aria-labelledby={headingId}>
      <h2 id={headingId} className="text-xl font-bold">
        Change role or office: {user.name}
      </h2>
      <div className="grid gap-4 sm:grid-cols-2">
        <SelectField label="Role" options={ROLE_OPTIONS} error={formState.errors.role?.message} {...register('role')} />
        <SelectField label="Office" options={officeOptions} error={formState.errors.officeId?.message} {...register('officeId', { setValueAs: (v: string | null) => (v ? v : null) })} />
      </div>
      <p className="text-sm text-ink-muted">
        Saving signs {user.name} out everywhere. An investigator’s open cases in the office they leave go back to that office’s triage, each with a timeline entry.
      </p>
      <FormAlert problem={problem} />
      {result && (
        <Notice tone="ok" title="Saved." live>
          <p>
            Now {ROLE_LABELS[result.user.role].toLowerCase()}
            {result.user.officeName ? ` at ${result.user.officeName}` : ''}. Sessions ended: {result.sessionsEnded}. Cases returned to triage: {result.casesReturnedToTriage}.
          </p>
        </Notice>
      )}
      <div className="flex flex-wrap gap-2">
        <SubmitButton submitting={formState.isSubmitting} pendingLabel="Saving…">
          Save change
        </SubmitButton>
        <Button variant="secondary" onClick={onClose}>
          {result ? 'Close' : 'Cancel'}
        </Button>
      </div>
    </form>
  )
}
