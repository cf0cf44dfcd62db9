/** E-mail and password sign-in. Field problems sit beside fields; the server's verdict above the button. */
import { zodResolver } from '@hookform/resolvers/zod'
import { useEffect, useState } from 'react'
import { useForm } from 'react-hook-form'
import { signInSchema, type SessionUser, type SignInInput } from '../../../../../shared/schemas/auth'
import { FormAlert } from '../../../components/ui/form-alert'
import { SubmitButton } from '../../../components/ui/submit-button'
import { TextField } from '../../../components/ui/text-field'
import { applyFieldErrors, formProblem, type FormProblem } from '../../../lib/form-errors'
import { useSignIn } from '../api/sign-in'

const FIELDS = ['email', 'password'] as const

export function SignInForm({ onSignedIn }: { onSignedIn: (user: SessionUser) => void }) {
  const { register, handleSubmit, setError, setFocus, formState } = useForm<SignInInput>({
    resolver: zodResolver(signInSchema),
    defaultValues: { email: '', password: '' },
  })
  const signIn = useSignIn()
  const [problem, setProblem] = useState<FormProblem | null>(null)

  useEffect(() => setFocus('email'), [setFocus])

  const onSubmit = handleSubmit(async (values) => {
    setProblem(null)
    try {
      const { user } = await signIn.mutateAsync(values)
      onSignedIn(user)
    } catch (error) {
      if (applyFieldErrors({ error, setError, fields: FIELDS })) return
      // A 401 shows the server's own generic words ("E-mail or password is not correct.").
      setProblem(formProblem(error, { byStatus: { 429: 'Too many attempts. Wait a few minutes and try again.' } }))
    }
  })

  return (
    <form noValidate onSubmit={onSubmit} className="flex flex-col gap-5">
      <TextField
        label="E-mail"
        type="email"
        autoComplete="username"
        inputMode="email"
        spellCheck={false}
        error={formState.errors.email?.message}
        {...register('email')}
      />
      <TextField
        label="Password"
        type="password"
        autoComplete="current-password"
        error={formState.errors.password?.message}
        {...register('password')}
      />
      <FormAlert problem={problem} />
      <div>
        <SubmitButton submitting={formState.isSubmitting} pendingLabel="Signing in…">
          Sign in
        </SubmitButton>
      </div>
    </form>
  )
}
