/**
 * The estimate form, the same on a case and in the quick calculator: choose a kind, fill its
 * form, run. `run` decides where it is computed (the server stores a record; the browser stores
 * nothing). Field errors — from the schema in the browser or the server's 400 — sit beside
 * their fields; nothing typed is lost.
 */
import { useState, type FormEvent } from 'react'
import { Notice } from '@/components/ui/notice'
import { SelectField } from '@/components/ui/select-field'
import { SubmitButton } from '@/components/ui/submit-button'
import { FormAlert } from '@/components/ui/form-alert'
import { formProblem, type FormProblem } from '@/lib/form-errors'
import type { EstimateSources, KindForm } from '../forms/kind-form'
import type { FieldErrors, FormState } from '../lib/form-state'
import { EstimateInputError, type EstimateOutcome, type RunEstimate } from '../lib/run-estimate'
import { EstimateFormProvider, UnplacedErrors } from './form-controls'

export interface EstimatePanelProps {
  kind: string
  state: FormState
  onChange: (kind: string, state: FormState) => void
  run: RunEstimate
  onRan: (outcome: EstimateOutcome) => void
  sources?: EstimateSources
  runLabel: string
  idPrefix: string
  /** The kinds offered here. */
  forms: KindForm[]
}

export function EstimatePanel({ kind, state, onChange, run, onRan, sources = {}, runLabel, idPrefix, forms }: EstimatePanelProps) {
  const form = forms.find((f) => f.kind === kind) ?? forms[0]!
  const [errors, setErrors] = useState<FieldErrors>({})
  const [refusal, setRefusal] = useState<{ message: string; other: string[] } | null>(null)
  const [problem, setProblem] = useState<FormProblem | null>(null)
  const [running, setRunning] = useState(false)

  const change = (next: FormState) => {
    // an edited field's error goes as it is edited; the others stay until the next run
    setErrors((e) => Object.fromEntries(Object.entries(e).filter(([p]) => next[p] === state[p] && next[`${p}~unit`] === state[`${p}~unit`])))
    onChange(form.kind, next)
  }

  async function submit(e: FormEvent) {
    e.preventDefault()
    setRunning(true)
    setProblem(null)
    setRefusal(null)
    try {
      const outcome = await run({ kind: form.kind, inputs: form.toInputs(state, sources) })
      setErrors({})
      onRan(outcome)
    } catch (err) {
      if (err instanceof EstimateInputError) {
        setErrors(err.fieldErrors)
        const unplaced = Object.keys(err.fieldErrors).length === 0
        setRefusal({ message: unplaced ? err.message : 'Some fields need attention: see the messages beside them.', other: err.otherProblems })
      } else setProblem(formProblem(err))
    } finally {
      setRunning(false)
    }
  }

  return (
    <form noValidate onSubmit={(e) => void submit(e)} className="flex min-w-0 flex-col gap-5 [&_.flex-col>select]:w-full [&_.flex-col>select]:min-w-0" aria-label={form.label}>
      <SelectField
        label="Estimate"
        name={`${idPrefix}-kind`}
        options={forms.map((f) => ({ value: f.kind, label: f.label }))}
        value={form.kind}
        hint={form.purpose}
        onChange={(e) => {
          setErrors({})
          setRefusal(null)
          const next = forms.find((f) => f.kind === e.target.value) ?? form
          onChange(next.kind, { ...next.initial })
        }}
      />
      <EstimateFormProvider value={{ state, onChange: change, errors, idPrefix, shown: new Set<string>() }}>
        <form.Fields sources={sources} />
        <UnplacedErrors />
      </EstimateFormProvider>
      {refusal && (
        <Notice tone="danger" title={refusal.message} live>
          {refusal.other.length > 0 && (
            <ul className="list-disc pl-5">
              {refusal.other.map((o) => (
                <li key={o}>{o}</li>
              ))}
            </ul>
          )}
        </Notice>
      )}
      <FormAlert problem={problem} />
      <div>
        <SubmitButton submitting={running} pendingLabel="Running…">
          {runLabel}
        </SubmitButton>
      </div>
    </form>
  )
}
