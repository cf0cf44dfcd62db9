/** Choose a password from an e-mailed link (a reset, or a new staff member's invitation). */
import { zodResolver } from '@hookform/resolvers/zod'
import { useEffect, useState } from 'react'
import { useForm } from 'react-hook-form'
import { z } from 'zod'
import { passwordSchema, type SignedIn } from '@shared/schemas/auth'
import { FormAlert } from '@/components/ui/form-alert'
import { SubmitButton } from '@/components/ui/submit-button'
import { TextField } from '@/components/ui/text-field'
import { isApiError } from '@/lib/api-client'
import { applyFieldErrors, formProblem, type FormProblem } from '@/lib/form-errors'
import { useSetPassword } from '../api/set-password'

/** The form adds a repeat of the password; only `password` (with the token) goes to the server. */
const formSchema = z
  .object({ password: passwordSchema, confirm: z.string() })
  .refine((v) => v.password === v.confirm, { message: 'The two passwords are not the same.', path: ['confirm'] })
type FormValues = z.infer<typeof formSchema>

export function SetPasswordForm({ token, onDone, onInvalidToken }: { token: string; onDone: (session: SignedIn) => void; onInvalidToken: () => void }) {
  const { register, handleSubmit, setError, setFocus, formState } = useForm<FormValues>({
    resolver: zodResolver(formSchema),
    defaultValues: { password: '', confirm: '' },
  })
  const setPassword = useSetPassword()
  const [problem, setProblem] = useState<FormProblem | null>(null)

  useEffect(() => setFocus('password'), [setFocus])

  const onSubmit = handleSubmit(async ({ password }) => {
    setProblem(null)
    try {
      onDone(await setPassword.mutateAsync({ token, password }))
    } catch (error) {
      const badToken = isApiError(error) && (error.code === 'invalid_token' || error.details.some((d) => d.path === 'token'))
      if (badToken) return onInvalidToken()
      if (applyFieldErrors({ error, setError, fields: ['password'] })) return
      setProblem(formProblem(error))
    }
  })

  return (
    <form noValidate onSubmit={onSubmit} className="flex flex-col gap-5">
      <TextField
        label="New password"
        type="password"
        autoComplete="new-password"
        hint="At least 10 characters. A short sentence is easy to remember and hard to guess."
        error={formState.errors.password?.message}
        {...register('password')}
      />
      <TextField
        label="Repeat the password"
        type="password"
        autoComplete="new-password"
        error={formState.errors.confirm?.message}
        {...register('confirm')}
      />
      <FormAlert problem={problem} />
      <div>
        <SubmitButton submitting={formState.isSubmitting} pendingLabel="Saving…">
          Save password and sign in
        </SubmitButton>
      </div>
    </form>
  )
}
