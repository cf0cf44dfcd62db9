/**
 * A case's legal hold on the case page: whether one is in force (who set it, why, until when),
 * and, for the office's supervisors and administrators (the server's abilities), a form to set
 * or change it and one to lift it. While a hold is in force the retention run leaves the case.
 */
import { zodResolver } from '@hookform/resolvers/zod'
import { useState } from 'react'
import { useForm } from 'react-hook-form'
import type { z } from 'zod'
import { liftLegalHoldSchema, setLegalHoldSchema, type LegalHoldView, type LiftLegalHoldInput, type SetLegalHoldInput } from '@shared/schemas/retention'
import { Button } from '@/components/ui/button'
import { FormAlert } from '@/components/ui/form-alert'
import { Panel } from '@/components/ui/panel'
import { SubmitButton } from '@/components/ui/submit-button'
import { TextAreaField } from '@/components/ui/text-area-field'
import { TextField } from '@/components/ui/text-field'
import { applyFieldErrors, formProblem, type FormProblem } from '@/lib/form-errors'
import { useLegalHold, useLiftLegalHold, useSetLegalHold } from '../api/legal-hold'

const day = (iso: string) => iso.slice(0, 10)

export function LegalHoldPanel({ caseId }: { caseId: string }) {
  const hold = useLegalHold(caseId)
  const [open, setOpen] = useState<'set' | 'lift' | null>(null)
  if (!hold.data) return null
  const h = hold.data
  return (
    <Panel label="Legal hold">
      <h2 className="text-lg font-bold">Legal hold</h2>
      {h.active ? (
        <p role="status" className="mt-1 text-sm">
          <strong>On hold</strong> {h.active.until ? `until ${h.active.until} (inclusive)` : 'until lifted'}, set by {h.active.byName} on {day(h.active.since)}: {h.active.reason}
        </p>
      ) : (
        <p className="mt-1 text-sm text-ink-muted">No legal hold. When the office’s retention period after closing ends, the complainant’s personal data and the evidence files are erased.</p>
      )}
      {open === null && (h.abilities.set || h.abilities.lift) && (
        <div className="mt-3 flex flex-wrap gap-2">
          {h.abilities.set && (
            <Button variant="secondary" className="w-full sm:w-auto" onClick={() => setOpen('set')}>
              {h.active ? 'Change the hold…' : 'Set a legal hold…'}
            </Button>
          )}
          {h.abilities.lift && (
            <Button variant="danger" className="w-full sm:w-auto" onClick={() => setOpen('lift')}>
              Lift the hold…
            </Button>
          )}
        </div>
      )}
      {open === 'set' && <SetHoldForm caseId={caseId} hold={h} onDone={() => setOpen(null)} />}
      {open === 'lift' && <LiftHoldForm caseId={caseId} onDone={() => setOpen(null)} />}
    </Panel>
  )
}

function SetHoldForm({ caseId, hold, onDone }: { caseId: string; hold: LegalHoldView; onDone: () => void }) {
  const [problem, setProblem] = useState<FormProblem | null>(null)
  const save = useSetLegalHold(caseId)
  const { register, handleSubmit, setError, formState } = useForm<z.input<typeof setLegalHoldSchema>, unknown, SetLegalHoldInput>({
    resolver: zodResolver(setLegalHoldSchema),
    defaultValues: { reason: hold.active?.reason ?? '', until: hold.active?.until ?? undefined },
  })
  const onSubmit = handleSubmit(async (values) => {
    setProblem(null)
    try {
      await save.mutateAsync(values)
      onDone()
    } catch (error) {
      if (applyFieldErrors({ error, setError, fields: ['reason', 'until'] })) return
      setProblem(formProblem(error))
    }
  })
  return (
    <form noValidate onSubmit={onSubmit} className="mt-3 flex flex-col gap-3" aria-label="Set a legal hold">
      <TextAreaField label="Why hold the case?" rows={3} hint="Kept with the hold and on the timeline (staff only)." error={formState.errors.reason?.message} {...register('reason')} />
      <TextField label="Last day of the hold (optional)" type="date" hint="Leave empty to hold the case until someone lifts the hold." error={formState.errors.until?.message} {...register('until')} />
      <FormAlert problem={problem} />
      <div className="flex flex-wrap gap-2">
        <SubmitButton submitting={formState.isSubmitting} pendingLabel="Saving…">
          Hold the case
        </SubmitButton>
        <Button variant="secondary" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  )
}

function LiftHoldForm({ caseId, onDone }: { caseId: string; onDone: () => void }) {
  const [problem, setProblem] = useState<FormProblem | null>(null)
  const lift = useLiftLegalHold(caseId)
  const { register, handleSubmit, setError, formState } = useForm<LiftLegalHoldInput>({ resolver: zodResolver(liftLegalHoldSchema), defaultValues: { reason: '' } })
  const onSubmit = handleSubmit(async (values) => {
    setProblem(null)
    try {
      await lift.mutateAsync(values)
      onDone()
    } catch (error) {
      if (applyFieldErrors({ error, setError, fields: ['reason'] })) return
      setProblem(formProblem(error))
    }
  })
  return (
    <form noValidate onSubmit={onSubmit} className="mt-3 flex flex-col gap-3" aria-label="Lift the legal hold">
      <TextAreaField label="Why lift it?" rows={3} hint="Once lifted, the retention run may erase the case when its period has ended." error={formState.errors.reason?.message} {...register('reason')} />
      <FormAlert problem={problem} />
      <div className="flex flex-wrap gap-2">
        <SubmitButton variant="danger" submitting={formState.isSubmitting} pendingLabel="Lifting…">
          Lift the hold
        </SubmitButton>
        <Button variant="secondary" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  )
}
