/**
 * An office's response targets, one figure of hours per priority. Changing them moves the due
 * time of the office's open cases.
 */
import { useState } from 'react'
import { useForm } from 'react-hook-form'
import { zodResolver } from '@hookform/resolvers/zod'
import { responseTargetsSchema } from '@shared/schemas/auth'
import { PRIORITIES, PRIORITY_LABELS, type Priority } from '@shared/domain/services'
import { TextField } from '@/components/ui/text-field'
import { SubmitButton } from '@/components/ui/submit-button'
import { FormAlert } from '@/components/ui/form-alert'
import { applyFieldErrors, formProblem, type FormProblem } from '@/lib/form-errors'
import type { Office } from '../api/get-offices'
import { useSetResponseTargets, type ResponseTargets } from '../api/set-response-targets'

const key = (p: Priority) => `p${p}` as const

export function ResponseTargetsForm({ office }: { office: Office }) {
  const save = useSetResponseTargets()
  const [problem, setProblem] = useState<FormProblem | null>(null)
  const [saved, setSaved] = useState(false)
  const form = useForm<ResponseTargets>({ resolver: zodResolver(responseTargetsSchema), defaultValues: office.responseTargetsHours })
  const onSubmit = form.handleSubmit(async (targets) => {
    setProblem(null)
    setSaved(false)
    try {
      await save.mutateAsync({ officeId: office.id, targets })
      setSaved(true)
    } catch (error) {
      if (!applyFieldErrors({ error, setError: form.setError, fields: ['p1', 'p2', 'p3', 'p4'] })) setProblem(formProblem(error))
    }
  })
  return (
    <form noValidate onSubmit={onSubmit} aria-label={`Response targets of ${office.name}`} className="flex flex-col gap-4">
      <div className="grid gap-4 sm:grid-cols-4">
        {PRIORITIES.map((p) => (
          <TextField
            key={p}
            id={`targets-${office.id}-${key(p)}`}
            label={`P${p} ${PRIORITY_LABELS[p].short} (hours)`}
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
          Saved. Due times of the office's open cases now follow these targets.
        </p>
      )}
      <div>
        <SubmitButton submitting={form.formState.isSubmitting} pendingLabel="Saving…" variant="secondary">
          Save response targets
        </SubmitButton>
      </div>
    </form>
  )
}
