/** E-mail and password sign-in. Field problems sit beside fields; the server's verdict above the button. */
import { zodResolver } from '@hookform/resolvers/zod'
import { useEffect, useState } from 'react'
import { useForm } from 'react-hook-form'
import { signInSchema, type SessionUser, type SignInInput } from '../../../../../shared/schemas/auth'
import { Button } from '../../../components/ui/button'
import { FormAlert } from '../../../components/ui/form-alert'
import { TextField } from '../../../components/ui/text-field'
import { applyFieldErrors, formProblem, type FormProblem } from '../../../lib/form-errors'
import { useSignIn } from '../api/sign-in'

const FIELDS = ['email', 'password'] as const

export const SIGN_IN_MESSAGES = {
  tooManyAttempts: 'Too many attempts. Wait a few minutes and try again.',
}

export function SignInForm({ onSignedIn }: { onSignedIn: (user: SessionUser) => void }) {
  const form = useForm<SignInInput>({ resolver: zodResolver(signInSchema), defaultValues: { email: '', password: '' } })
  const { register, handleSubmit, setError, setFocus, formState } = form
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
      setProblem(
        formProblem(error, {
          // A 401 shows the server's own generic words ("E-mail or password is not correct.").
          byStatus: { 429: SIGN_IN_MESSAGES.tooManyAttempts },
        }),
      )
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
        <Button type="submit" disabled={formState.isSubmitting}>
          {formState.isSubmitting ? 'Signing in…' : 'Sign in'}
        </Button>
      </div>
    </form>
  )
}
