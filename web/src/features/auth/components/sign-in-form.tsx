/**
 * E-mail and password sign-in. Field problems sit beside fields; the server's verdict above the
 * button, in its own plain words (wrong password, slowed down, refused for a while, address not
 * confirmed yet), with the way out: a password link by e-mail.
 */
import { zodResolver } from '@hookform/resolvers/zod'
import { useEffect, useState } from 'react'
import { useForm } from 'react-hook-form'
import { Link } from 'react-router-dom'
import { signInSchema, type SignedIn, type SignInInput } from '@shared/schemas/auth'
import { FormAlert } from '@/components/ui/form-alert'
import { SubmitButton } from '@/components/ui/submit-button'
import { TextField } from '@/components/ui/text-field'
import { isApiError } from '@/lib/api-client'
import { applyFieldErrors, formProblem, type FormProblem } from '@/lib/form-errors'
import { useSignIn } from '../api/sign-in'
import { paths } from '@/lib/paths'

const FIELDS = ['email', 'password'] as const
/** How long a sign-in may take before the form says why it is slow [ms]. */
const SLOW_ANSWER_MS = 1_200

/** True once `pending` has lasted `afterMs`. */
function useTakingLong(pending: boolean, afterMs: number): boolean {
  const [long, setLong] = useState(false)
  useEffect(() => {
    if (!pending) {
      setLong(false)
      return
    }
    const timer = setTimeout(() => setLong(true), afterMs)
    return () => clearTimeout(timer)
  }, [pending, afterMs])
  return long
}

export function SignInForm({ onSignedIn }: { onSignedIn: (session: SignedIn) => void }) {
  const { register, handleSubmit, setError, setFocus, formState } = useForm<SignInInput>({
    resolver: zodResolver(signInSchema),
    defaultValues: { email: '', password: '' },
  })
  const signIn = useSignIn()
  const [problem, setProblem] = useState<FormProblem | null>(null)
  const [offerReset, setOfferReset] = useState(false)
  const slow = useTakingLong(formState.isSubmitting, SLOW_ANSWER_MS)

  useEffect(() => setFocus('email'), [setFocus])

  const onSubmit = handleSubmit(async (values) => {
    setProblem(null)
    setOfferReset(false)
    try {
      onSignedIn(await signIn.mutateAsync(values))
    } catch (error) {
      if (applyFieldErrors({ error, setError, fields: FIELDS })) return
      // The server's own words: the generic 401, the slow-down, the refusal, the unconfirmed address.
      setProblem(formProblem(error))
      setOfferReset(isApiError(error) && [401, 403, 429].includes(error.status))
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
      {slow && (
        <p role="status" className="text-ink-muted">
          Still checking. After several wrong passwords on an account, each try is answered more slowly for a while, to protect it.
        </p>
      )}
      <FormAlert problem={problem} />
      {offerReset && (
        <p>
          <Link to={paths.forgotPassword.href()}>Get a link by e-mail to choose a new password</Link> — it signs you in at once.
        </p>
      )}
      <div>
        <SubmitButton submitting={formState.isSubmitting} pendingLabel="Signing in…">
          Sign in
        </SubmitButton>
      </div>
    </form>
  )
}
