/**
 * New staff account: name, e-mail, role, office. No password here: the person receives an
 * e-mail link and chooses their own.
 */
import { zodResolver } from '@hookform/resolvers/zod'
import { useState } from 'react'
import { useForm } from 'react-hook-form'
import type { z } from 'zod'
import { ROLE_LABELS } from '@shared/domain/roles'
import { createStaffSchema } from '@shared/schemas/auth'
import { FormAlert } from '@/components/ui/form-alert'
import { SubmitButton } from '@/components/ui/submit-button'
import { Notice } from '@/components/ui/notice'
import { SelectField } from '@/components/ui/select-field'
import { TextField } from '@/components/ui/text-field'
import { isApiError } from '@/lib/api-client'
import { applyFieldErrors, formProblem, type FormProblem } from '@/lib/form-errors'
import { useCreateUser } from '../api/create-user'

type FormInput = z.input<typeof createStaffSchema>
type FormOutput = z.output<typeof createStaffSchema>

const FIELDS = ['name', 'email', 'role', 'officeId'] as const
const STAFF_ROLE_OPTIONS = (['investigator', 'supervisor', 'admin'] as const).map((r) => ({ value: r, label: ROLE_LABELS[r] }))

export function CreateUserForm({ offices }: { offices: { id: string; name: string }[] }) {
  const { register, handleSubmit, setError, reset, formState } = useForm<FormInput, unknown, FormOutput>({
    resolver: zodResolver(createStaffSchema),
    defaultValues: { name: '', email: '', role: 'investigator', officeId: null },
  })
  const createUser = useCreateUser()
  const [problem, setProblem] = useState<FormProblem | null>(null)
  const [invited, setInvited] = useState<string | null>(null)

  const onSubmit = handleSubmit(async (values) => {
    setProblem(null)
    setInvited(null)
    try {
      const { user } = await createUser.mutateAsync(values)
      setInvited(user.email)
      reset()
    } catch (error) {
      if (isApiError(error) && error.code === 'email_taken') {
        setError('email', { type: 'server', message: 'An account already uses this e-mail.' }, { shouldFocus: true })
        return
      }
      if (applyFieldErrors({ error, setError, fields: FIELDS })) return
      setProblem(formProblem(error))
    }
  })

  const officeOptions = [{ value: '', label: 'Choose an office (none for administrators)' }, ...offices.map((o) => ({ value: o.id, label: o.name }))]

  return (
    <form noValidate onSubmit={onSubmit} className="flex flex-col gap-4" aria-labelledby="create-user-title">
      <h2 id="create-user-title" className="text-xl font-bold">
        Add a staff member
      </h2>
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField label="Name" autoComplete="off" error={formState.errors.name?.message} {...register('name')} />
        <TextField
          label="E-mail"
          type="email"
          autoComplete="off"
          spellCheck={false}
          error={formState.errors.email?.message}
          {...register('email')}
        />
        <SelectField label="Role" options={STAFF_ROLE_OPTIONS} error={formState.errors.role?.message} {...register('role')} />
        <SelectField
          label="Office"
          options={officeOptions}
          error={formState.errors.officeId?.message}
          {...register('officeId', { setValueAs: (v: string | null) => (v ? v : null) })}
        />
      </div>
      <p className="text-sm text-ink-muted">Investigators and supervisors work for one office; administrators for none.</p>
      <FormAlert problem={problem} />
      {invited && (
        <Notice tone="ok" title="Account created." live>
          <p>
            We sent <span className="font-mono">{invited}</span> a link to choose a password.
          </p>
        </Notice>
      )}
      <div>
        <SubmitButton submitting={formState.isSubmitting} pendingLabel="Adding…">
          Add and send invitation
        </SubmitButton>
      </div>
    </form>
  )
}
