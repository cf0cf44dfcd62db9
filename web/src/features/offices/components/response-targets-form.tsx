/**
 * One of an office's two targets (shared/domain/case-clocks.ts), one figure of hours per harm
 * class: first response or resolution. Changing them moves the due times of the office's cases
 * whose clock still runs.
 */
import { useState } from 'react'
import { useForm } from 'react-hook-form'
import { zodResolver } from '@hookform/resolvers/zod'
import { responseTargetsSchema } from '@shared/schemas/auth'
import { PRIORITIES, PRIORITY_LABELS, type Priority } from '@shared/domain/services'
import type { CaseClockName } from '@shared/domain/case-clocks'
import { TextField } from '@/components/ui/text-field'
import { SubmitButton } from '@/components/ui/submit-button'
import { FormAlert } from '@/components/ui/form-alert'
import { applyFieldErrors, formProblem, type FormProblem } from '@/lib/form-errors'
import type { Office } from '../api/get-offices'
import { useSetResponseTargets, type ResponseTargets } from '../api/set-response-targets'

const key = (p: Priority) => `p${p}` as const

const WORDS: Record<CaseClockName, { name: string; saved: string }> = {
  firstResponse: { name: 'First-response targets', saved: 'Saved. Cases still waiting for a first response now follow these targets.' },
  resolution: { name: 'Resolution targets', saved: "Saved. Due times of the office's open cases now follow these targets." },
}

export function ResponseTargetsForm({ office, clock }: { office: Office; clock: CaseClockName }) {
  const save = useSetResponseTargets()
  const [problem, setProblem] = useState<FormProblem | null>(null)
  const [saved, setSaved] = useState(false)
  const form = useForm<ResponseTargets>({ resolver: zodResolver(responseTargetsSchema), defaultValues: clock === 'firstResponse' ? office.firstResponseTargetsHours : office.responseTargetsHours })
  const onSubmit = form.handleSubmit(async (targets) => {
    setProblem(null)
    setSaved(false)
    try {
      await save.mutateAsync({ officeId: office.id, clock, targets })
      setSaved(true)
    } catch (error) {
      if (!applyFieldErrors({ error, setError: form.setError, fields: ['p1', 'p2', 'p3', 'p4'] })) setProblem(formProblem(error))
    }
  })
  return (
    <form noValidate onSubmit={onSubmit} aria-label={`${WORDS[clock].name} of ${office.name}`} className="flex flex-col gap-4">
      <h3 className="font-bold">{WORDS[clock].name}</h3>
      <div className="grid gap-4 sm:grid-cols-4">
        {PRIORITIES.map((p) => (
          <TextField
            key={p}
            id={`targets-${clock}-${office.id}-${key(p)}`}
            label={`${PRIORITY_LABELS[p].short} (hours)`}
            type="number"
            min={1}
            step={1}
            inputMode="numeric"
            error={form.formState.errors[key(p)]?.message}
            {...form.register(key(p), { valueAsNumber: true })}
          />
        ))}
      </div>
      <FormAlert problem={problem} />
      {saved && (
        <p role="status" className="text-sm">
          {WORDS[clock].saved}
        </p>
      )}
      <div>
        <SubmitButton submitting={form.formState.isSubmitting} pendingLabel="Saving…" variant="secondary">
          Save {WORDS[clock].name.toLowerCase()}
        </SubmitButton>
      </div>
    </form>
  )
}
