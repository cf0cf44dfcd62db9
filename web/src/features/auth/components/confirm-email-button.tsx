/**
 * Confirms the address from an e-mailed link. It waits for a press rather than acting when the
 * page opens, so a mail scanner that follows links confirms nothing.
 */
import { useState } from 'react'
import type { SignedIn } from '@shared/schemas/auth'
import { Button } from '@/components/ui/button'
import { FormAlert } from '@/components/ui/form-alert'
import { isApiError } from '@/lib/api-client'
import { formProblem, type FormProblem } from '@/lib/form-errors'
import { useConfirmEmail } from '../api/confirm-email'

export function ConfirmEmailButton({ token, onDone, onInvalidToken }: { token: string; onDone: (session: SignedIn) => void; onInvalidToken: () => void }) {
  const confirm = useConfirmEmail()
  const [problem, setProblem] = useState<FormProblem | null>(null)

  const onConfirm = async () => {
    setProblem(null)
    try {
      onDone(await confirm.mutateAsync({ token }))
    } catch (error) {
      if (isApiError(error) && (error.code === 'invalid_token' || error.details.some((d) => d.path === 'token'))) return onInvalidToken()
      setProblem(formProblem(error, { byStatus: { 429: 'Too many requests from your connection. Wait a while and try again.' } }))
    }
  }

  return (
    <div className="flex flex-col gap-5">
      <FormAlert problem={problem} />
      <div>
        <Button onClick={() => void onConfirm()} disabled={confirm.isPending}>
          {confirm.isPending ? 'Confirming…' : 'Confirm my address and sign in'}
        </Button>
      </div>
    </div>
  )
}
