/**
 * "Close tracking links": a supervisor of the case's office stops every private link the
 * complainant was sent (a link forwarded to the wrong person, posted in public…). Two steps:
 * the button opens a short form asking why; only its own button closes the links. Shown from
 * the case's abilities only.
 */
import { zodResolver } from '@hookform/resolvers/zod'
import { useState } from 'react'
import { useForm } from 'react-hook-form'
import { revokeTrackingLinksSchema, type RevokeTrackingLinksInput } from '@shared/schemas/people'
import { Button } from '@/components/ui/button'
import { FormAlert } from '@/components/ui/form-alert'
import { Panel } from '@/components/ui/panel'
import { SubmitButton } from '@/components/ui/submit-button'
import { TextAreaField } from '@/components/ui/text-area-field'
import { applyFieldErrors, formProblem, type FormProblem } from '@/lib/form-errors'
import type { CaseDetail } from '../api/get-case'
import { useRevokeTrackingLinks } from '../api/revoke-tracking-links'

export function TrackingLinksRevoke({ detail }: { detail: CaseDetail }) {
  const [open, setOpen] = useState(false)
  const [done, setDone] = useState<number | null>(null)
  const [problem, setProblem] = useState<FormProblem | null>(null)
  const revoke = useRevokeTrackingLinks(detail.id)
  const { register, handleSubmit, setError, reset, formState } = useForm<RevokeTrackingLinksInput>({
    resolver: zodResolver(revokeTrackingLinksSchema),
    defaultValues: { reason: '' },
  })
  if (!detail.abilities.revokeTrackingLinks) return null

  const onSubmit = handleSubmit(async (values) => {
    setProblem(null)
    try {
      const { revokedCount } = await revoke.mutateAsync(values)
      setDone(revokedCount)
      setOpen(false)
      reset()
    } catch (error) {
      if (applyFieldErrors({ error, setError, fields: ['reason'] })) return
      setProblem(formProblem(error))
    }
  })

  return (
    <Panel label="Complainant’s tracking links">
      <h2 className="text-lg font-bold">Complainant’s tracking links</h2>
      <p className="mt-1 text-sm text-ink-muted">
        If a link reached the wrong person, close every link sent for this case. The complainant’s account, if they have one, keeps working; the next e-mail to them carries a new link.
      </p>
      {done !== null && (
        <p role="status" className="mt-3 text-sm font-semibold">
          {done === 0 ? 'No link was open; nothing changed.' : done === 1 ? '1 link closed. It now answers “not valid”.' : `${done} links closed. They now answer “not valid”.`}
        </p>
      )}
      {!open ? (
        <Button
          variant="danger"
          className="mt-3 w-full sm:w-auto"
          onClick={() => {
            setDone(null)
            setOpen(true)
          }}
        >
          Close tracking links…
        </Button>
      ) : (
        <form noValidate onSubmit={onSubmit} className="mt-3 flex flex-col gap-3" aria-label="Close tracking links">
          <TextAreaField label="Why close them?" rows={3} hint="Kept on the timeline (staff only)." error={formState.errors.reason?.message} {...register('reason')} />
          <FormAlert problem={problem} />
          <div className="flex flex-wrap gap-2">
            <SubmitButton variant="danger" submitting={formState.isSubmitting} pendingLabel="Closing…">
              Close all links
            </SubmitButton>
            <Button
              variant="secondary"
              onClick={() => {
                setOpen(false)
                setProblem(null)
                reset()
              }}
            >
              Cancel
            </Button>
          </div>
        </form>
      )}
    </Panel>
  )
}
