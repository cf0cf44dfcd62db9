/**
 * Asks for a reset link. The answer is the same whether or not an account exists, so the page
 * never reveals who has one: the e-mail says which.
 */
import { zodResolver } from '@hookform/resolvers/zod'
import { useEffect, useState } from 'react'
import { useForm } from 'react-hook-form'
import { resetRequestSchema, type ResetRequestInput } from '@shared/schemas/auth'
import { FormAlert } from '@/components/ui/form-alert'
import { SubmitButton } from '@/components/ui/submit-button'
import { Notice } from '@/components/ui/notice'
import { TextField } from '@/components/ui/text-field'
import { applyFieldErrors, formProblem, type FormProblem } from '@/lib/form-errors'
import { useRequestPasswordReset } from '../api/request-password-reset'

export function ForgotPasswordForm() {
  const { register, handleSubmit, setError, setFocus, formState } = useForm<ResetRequestInput>({
    resolver: zodResolver(resetRequestSchema),
    defaultValues: { email: '' },
  })
  const requestReset = useRequestPasswordReset()
  const [problem, setProblem] = useState<FormProblem | null>(null)

  useEffect(() => setFocus('email'), [setFocus])

  const onSubmit = handleSubmit(async (values) => {
    setProblem(null)
    try {
      await requestReset.mutateAsync(values)
    } catch (error) {
      if (applyFieldErrors({ error, setError, fields: ['email'] })) return
      setProblem(formProblem(error, { byStatus: { 429: 'Too many requests. Wait a few minutes and try again.' } }))
    }
  })

  if (requestReset.isSuccess) {
    return (
      <Notice tone="ok" title="Check your e-mail." live>
        <p>
          We have sent a message to that address. If it belongs to an account, the message holds a link to choose a new password; it
          works once and expires after 30 minutes. Choosing a password also ends any slow-down or refusal of sign-ins after wrong
          passwords.
        </p>
        <p>Check your spam folder if nothing arrives within a few minutes.</p>
      </Notice>
    )
  }

  return (
    <form noValidate onSubmit={onSubmit} className="flex flex-col gap-5">
      <TextField
        label="E-mail"
        type="email"
        autoComplete="email"
        inputMode="email"
        spellCheck={false}
        error={formState.errors.email?.message}
        {...register('email')}
      />
      <FormAlert problem={problem} />
      <div>
        <SubmitButton submitting={formState.isSubmitting} pendingLabel="Sending…">
          Send me a link
        </SubmitButton>
      </div>
    </form>
  )
}
