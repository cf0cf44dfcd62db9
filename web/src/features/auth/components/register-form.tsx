/** A complainant account: name, e-mail, password. Optional — reporting needs no account. */
import { zodResolver } from '@hookform/resolvers/zod'
import { useEffect, useState } from 'react'
import { useForm } from 'react-hook-form'
import { registerSchema, type RegisterInput, type SessionUser } from '../../../../../shared/schemas/auth'
import { FormAlert } from '../../../components/ui/form-alert'
import { SubmitButton } from '../../../components/ui/submit-button'
import { TextField } from '../../../components/ui/text-field'
import { isApiError } from '../../../lib/api-client'
import { applyFieldErrors, formProblem, type FormProblem } from '../../../lib/form-errors'
import { useRegister } from '../api/register'

const FIELDS = ['name', 'email', 'password'] as const

export function RegisterForm({ onRegistered }: { onRegistered: (user: SessionUser) => void }) {
  const { register, handleSubmit, setError, setFocus, formState } = useForm<RegisterInput>({
    resolver: zodResolver(registerSchema),
    defaultValues: { name: '', email: '', password: '' },
  })
  const registerAccount = useRegister()
  const [problem, setProblem] = useState<FormProblem | null>(null)

  useEffect(() => setFocus('name'), [setFocus])

  const onSubmit = handleSubmit(async (values) => {
    setProblem(null)
    try {
      const { user } = await registerAccount.mutateAsync(values)
      onRegistered(user)
    } catch (error) {
      if (isApiError(error) && error.code === 'email_taken') {
        setError('email', { type: 'server', message: 'An account already uses this e-mail. Sign in, or reset the password.' }, { shouldFocus: true })
        return
      }
      if (applyFieldErrors({ error, setError, fields: FIELDS })) return
      setProblem(formProblem(error))
    }
  })

  return (
    <form noValidate onSubmit={onSubmit} className="flex flex-col gap-5">
      <TextField label="Your name" autoComplete="name" error={formState.errors.name?.message} {...register('name')} />
      <TextField
        label="E-mail"
        type="email"
        autoComplete="email"
        inputMode="email"
        spellCheck={false}
        hint="We send your report references and updates here."
        error={formState.errors.email?.message}
        {...register('email')}
      />
      <TextField
        label="Password"
        type="password"
        autoComplete="new-password"
        hint="At least 10 characters. A short sentence is easy to remember and hard to guess."
        error={formState.errors.password?.message}
        {...register('password')}
      />
      <FormAlert problem={problem} />
      <div>
        <SubmitButton submitting={formState.isSubmitting} pendingLabel="Creating account…">
          Create account
        </SubmitButton>
      </div>
    </form>
  )
}
