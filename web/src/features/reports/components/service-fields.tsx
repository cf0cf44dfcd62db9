/** Which service suffers, its licence, and on what frequency. */
import type { UseFormReturn } from 'react-hook-form'
import { AFFECTED_SERVICES, SERVICE_LABELS } from '@shared/domain/services'
import { SelectField } from '@/components/ui/select-field'
import { TextField } from '@/components/ui/text-field'
import { FREQUENCY_UNIT_OPTIONS } from '@/lib/frequency'
import { FormSection, figureOrUndefined } from './form-section'
import type { ReportFormInput, ReportFormOutput } from './report-form-types'
import { SafetyNote } from './safety-note'

const SERVICE_OPTIONS = [{ value: '', label: 'Choose the service' }, ...AFFECTED_SERVICES.map((s) => ({ value: s, label: SERVICE_LABELS[s] }))]
const UNIT_OPTIONS = FREQUENCY_UNIT_OPTIONS.map((u) => ({ value: u, label: u }))

export function ServiceFields({ form, safety }: { form: UseFormReturn<ReportFormInput, unknown, ReportFormOutput>; safety: boolean }) {
  const { register, formState } = form
  const e = formState.errors
  return (
    <FormSection title="What is affected">
      <div className="flex flex-col gap-3">
        <SelectField label="Affected service" options={SERVICE_OPTIONS} error={e.service?.message} {...register('service')} />
        <div aria-live="polite">{safety && <SafetyNote />}</div>
      </div>
      <TextField
        label="Licence or station reference (optional)"
        hint="From your licence, or the call sign or station name, if you have one."
        error={e.licenceRef?.message}
        {...register('licenceRef')}
      />
      <fieldset className="flex flex-col gap-2">
        <legend className="font-semibold">Frequency or frequency range</legend>
        <p className="text-sm text-ink-muted">One frequency, or the lower and upper end of a band. Give the channel in the description if you know it.</p>
        <div className="grid grid-cols-2 gap-4 sm:grid-cols-[1fr_1fr_8rem]">
          <TextField label="Frequency" inputMode="decimal" autoComplete="off" error={e.frequencyFrom?.message} {...register('frequencyFrom', { setValueAs: figureOrUndefined })} />
          <TextField label="Up to (optional)" inputMode="decimal" autoComplete="off" error={e.frequencyTo?.message} {...register('frequencyTo', { setValueAs: figureOrUndefined })} />
          <SelectField label="Unit" options={UNIT_OPTIONS} error={e.frequencyUnit?.message} {...register('frequencyUnit')} />
        </div>
      </fieldset>
    </FormSection>
  )
}
