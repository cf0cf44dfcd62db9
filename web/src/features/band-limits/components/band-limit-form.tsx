/**
 * Edits one band limit. Numbers are typed with their unit ("2400 MHz", "20 dBm") and read by
 * the same strict parser as the server's; a reason is required, and the edit is made on the
 * version shown (someone else's change in between is refused, with a reload offered).
 */
import { useState, type FormEvent } from 'react'
import { bandLimitPatchSchema } from '@shared/schemas/band-limits'
import { TextField } from '@/components/ui/text-field'
import { TextAreaField } from '@/components/ui/text-area-field'
import { SubmitButton } from '@/components/ui/submit-button'
import { Button } from '@/components/ui/button'
import { FormAlert } from '@/components/ui/form-alert'
import { isApiError } from '@/lib/api-client'
import { formProblem, type FormProblem } from '@/lib/form-errors'
import type { BandLimit } from '../api/get-band-limits'
import { useReviseBandLimit } from '../api/revise-band-limit'
import { frequencyText, LIMIT_FIELD_HINT, limitFieldText, limitNumberFields, specWithTexts } from '../lib/describe-limit'

type Texts = Record<string, string>

function initialTexts(b: BandLimit): Texts {
  const texts: Texts = {
    'changes.title': b.title,
    'changes.citation': b.citation,
    'changes.statusNote': b.statusNote,
    'changes.conditions': b.conditions ?? '',
    reason: '',
  }
  b.bandsHz.forEach((band, i) => {
    texts[`changes.bandsHz.${i}.lowHz`] = frequencyText(band.lowHz)
    texts[`changes.bandsHz.${i}.highHz`] = frequencyText(band.highHz)
  })
  for (const f of limitNumberFields(b.spec)) texts[`changes.spec.${f.path}`] = limitFieldText(f)
  return texts
}

export function BandLimitForm({ bandLimit, onDone }: { bandLimit: BandLimit; onDone: () => void }) {
  const revise = useReviseBandLimit()
  const [texts, setTexts] = useState<Texts>(() => initialTexts(bandLimit))
  const [verified, setVerified] = useState(bandLimit.verified)
  // the frequency ranges on screen, by a key of their own (a removed range leaves no gap)
  const [rangeKeys, setRangeKeys] = useState<number[]>(() => bandLimit.bandsHz.map((_, i) => i))
  const [nextRangeKey, setNextRangeKey] = useState(bandLimit.bandsHz.length)
  const [errors, setErrors] = useState<Record<string, string>>({})
  const [problem, setProblem] = useState<FormProblem | null>(null)
  const numberFields = limitNumberFields(bandLimit.spec)
  const idOf = (path: string) => `band-limit-${bandLimit.id}-${path.replace(/\./g, '-')}`

  const field = (path: string, label: string, hint?: string) => ({
    id: idOf(path),
    name: path,
    label,
    hint,
    value: texts[path] ?? '',
    error: errors[path],
    onChange: (e: { target: { value: string } }) => setTexts((t) => ({ ...t, [path]: e.target.value })),
  })

  /** "changes.bandsHz.1.highHz" names the second range shown: its key may differ after a removal. */
  const rangePathToKey = (path: string) => path.replace(/^changes\.bandsHz\.(\d+)/, (_, i: string) => `changes.bandsHz.${rangeKeys[Number(i)] ?? i}`)
  const addRange = () => {
    setRangeKeys((keys) => [...keys, nextRangeKey])
    setNextRangeKey((k) => k + 1)
  }
  const removeRange = (key: number) => setRangeKeys((keys) => keys.filter((k) => k !== key))

  const onSubmit = async (event: FormEvent) => {
    event.preventDefault()
    setProblem(null)
    const specTexts = Object.fromEntries(numberFields.map((f) => [f.path, texts[`changes.spec.${f.path}`] ?? '']))
    const body = {
      version: bandLimit.version,
      reason: texts.reason,
      changes: {
        title: texts['changes.title'],
        citation: texts['changes.citation'],
        statusNote: texts['changes.statusNote'],
        conditions: texts['changes.conditions'],
        verified,
        bandsHz: rangeKeys.map((k) => ({ lowHz: texts[`changes.bandsHz.${k}.lowHz`], highHz: texts[`changes.bandsHz.${k}.highHz`] })),
        spec: specWithTexts(bandLimit.spec, specTexts),
      },
    }
    const parsed = bandLimitPatchSchema.safeParse(body)
    if (!parsed.success) {
      setErrors(Object.fromEntries(parsed.error.issues.map((i) => [rangePathToKey(i.path.join('.')), i.message])))
      return
    }
    setErrors({})
    try {
      await revise.mutateAsync({ bandLimitId: bandLimit.id, patch: parsed.data })
      onDone()
    } catch (error) {
      if (isApiError(error) && error.details.length > 0) setErrors(Object.fromEntries(error.details.map((d) => [rangePathToKey(d.path), d.message])))
      setProblem(
        formProblem(error, {
          byCode: {
            stale_version: 'Someone else changed this limit while you were editing. Close the form to see their change, then edit again.',
            no_change: 'Nothing was changed: every value is the one already stored.',
          },
        }),
      )
    }
  }

  return (
    <form noValidate onSubmit={(e) => void onSubmit(e)} aria-label={`Edit ${bandLimit.title}`} className="flex flex-col gap-4 border-t border-rule pt-4">
      <TextField {...field('changes.title', 'Title')} />
      <fieldset className="flex flex-col gap-3">
        <legend className="font-semibold">Frequency ranges</legend>
        {rangeKeys.map((k, i) => (
          <div key={k} className="grid items-end gap-3 sm:grid-cols-[1fr_1fr_auto]">
            <TextField {...field(`changes.bandsHz.${k}.lowHz`, `Range ${i + 1}: lower edge`, 'With its unit: Hz, kHz, MHz or GHz')} />
            <TextField {...field(`changes.bandsHz.${k}.highHz`, `Range ${i + 1}: upper edge`)} />
            {rangeKeys.length > 1 && (
              <Button variant="secondary" onClick={() => removeRange(k)} aria-label={`Remove range ${i + 1}`}>
                Remove
              </Button>
            )}
          </div>
        ))}
        <div>
          <Button variant="secondary" onClick={addRange}>
            Add a frequency range
          </Button>
        </div>
      </fieldset>
      <fieldset className="grid gap-3 sm:grid-cols-2">
        <legend className="font-semibold">Limit</legend>
        {numberFields.map((f) => (
          <TextField key={f.path} {...field(`changes.spec.${f.path}`, f.label, LIMIT_FIELD_HINT[f.kind])} />
        ))}
      </fieldset>
      {errors['changes.spec'] && <p className="text-danger">{errors['changes.spec']}</p>}
      <TextAreaField {...field('changes.citation', 'Citation')} rows={2} />
      <TextAreaField {...field('changes.conditions', 'Conditions', 'Leave empty when none apply')} rows={2} />
      <label className="flex min-h-11 items-center gap-3">
        <input type="checkbox" className="size-5" checked={verified} onChange={(e) => setVerified(e.target.checked)} />
        <span>Verified against the regulation’s text</span>
      </label>
      <TextAreaField {...field('changes.statusNote', 'What is verified and what is not')} rows={2} />
      <TextAreaField {...field('reason', 'Reason for the change', 'Required. Kept in the history with your name.')} rows={2} required />
      {errors.changes && <p className="text-danger">{errors.changes}</p>}
      <FormAlert problem={problem} />
      <div className="flex flex-wrap gap-3">
        <SubmitButton submitting={revise.isPending} pendingLabel="Saving…">
          Save change
        </SubmitButton>
        <Button variant="secondary" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  )
}
