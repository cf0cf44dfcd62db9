/**
 * A complainant account: name, e-mail, password. Optional — reporting needs no account.
 * The answer never says whether the address has an account already: the page then asks the
 * person to check their e-mail, where a confirmation link (or a note) is waiting.
 */
import { zodResolver } from '@hookform/resolvers/zod'
import { useEffect, useState } from 'react'
import { useForm } from 'react-hook-form'
import { registerSchema, type RegisterInput } from '@shared/schemas/auth'
import { FormAlert } from '@/components/ui/form-alert'
import { Notice } from '@/components/ui/notice'
import { SubmitButton } from '@/components/ui/submit-button'
import { TextField } from '@/components/ui/text-field'
import { applyFieldErrors, formProblem, type FormProblem } from '@/lib/form-errors'
import { useRegister } from '../api/register'

const FIELDS = ['name', 'email', 'password'] as const

export function RegisterForm() {
  const { register, handleSubmit, setError, setFocus, formState } = useForm<RegisterInput>({
    resolver: zodResolver(registerSchema),
    defaultValues: { name: '', email: '', password: '' },
  })
  const registerAccount = useRegister()
  const [problem, setProblem] = useState<FormProblem | null>(null)
  const [sentTo, setSentTo] = useState<string | null>(null)

  useEffect(() => setFocus('name'), [setFocus])

  const onSubmit = handleSubmit(async (values) => {
    setProblem(null)
    try {
      await registerAccount.mutateAsync(values)
      setSentTo(values.email)
    } catch (error) {
      if (applyFieldErrors({ error, setError, fields: FIELDS })) return
      setProblem(formProblem(error, { byStatus: { 429: 'Too many requests from your connection. Wait a while and try again.' } }))
    }
  })

  if (sentTo) {
    return (
      <Notice tone="ok" title="Check your e-mail." live>
        <p>
          We have sent a message to <strong>{sentTo}</strong>. Open the link in it to confirm the address: your account works from then
          on. The link expires after two days.
        </p>
        <p>Nothing there after a few minutes? Look in the spam folder, and check the address for typing mistakes.</p>
      </Notice>
    )
  }

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
