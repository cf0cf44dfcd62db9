/** When it happens and what the complainant experiences, in their own words. */
import type { UseFormReturn } from 'react-hook-form'
import { EXPERIENCES, EXPERIENCE_LABELS, OCCURRENCE_LABELS, OCCURRENCE_PATTERNS } from '@shared/domain/services'
import { TextField } from '@/components/ui/text-field'
import { ChoiceGroup } from '@/components/ui/choice-group'
import { TextAreaField } from '@/components/ui/text-area-field'
import { FormSection } from './form-section'
import type { ReportFormInput, ReportFormOutput } from './report-form-types'

const PATTERN_OPTIONS = OCCURRENCE_PATTERNS.map((p) => ({ value: p, label: OCCURRENCE_LABELS[p] }))
const EXPERIENCE_OPTIONS = EXPERIENCES.map((x) => ({ value: x, label: EXPERIENCE_LABELS[x] }))

export function TimingFields({ form }: { form: UseFormReturn<ReportFormInput, unknown, ReportFormOutput> }) {
  const { register, formState, watch } = form
  const e = formState.errors
  const today = new Date().toISOString().slice(0, 10)
  return (
    <FormSection title="When, and what you notice">
      <div className="max-w-xs">
        <TextField label="Date it started" type="date" max={today} error={e.since?.message} {...register('since')} />
      </div>
      <ChoiceGroup legend="When does it happen?" name="pattern" type="radio" options={PATTERN_OPTIONS} columns={3} error={e.pattern?.message} inputProps={register('pattern')} />
      {watch('pattern') === 'certain_hours' && (
        <TextField label="Which hours?" hint="For example: weekdays 18:00–23:00, or at high tide." error={e.patternDetail?.message} {...register('patternDetail')} />
      )}
      <ChoiceGroup legend="What do you experience?" name="experience" type="radio" options={EXPERIENCE_OPTIONS} error={e.experience?.message} inputProps={register('experience')} />
      <TextAreaField
        label="Describe what you notice"
        hint="What you hear or see, on which equipment or channel, and anything that makes it better or worse."
        rows={5}
        error={e.description?.message}
        {...register('description')}
      />
    </FormSection>
  )
}
