/** Who is reporting. Phone and organisation are optional. */
import type { UseFormReturn } from 'react-hook-form'
import { TextField } from '@/components/ui/text-field'
import type { ReportFormInput, ReportFormOutput } from './report-form-types'
import { FormSection } from './form-section'

export function ContactFields({ form }: { form: UseFormReturn<ReportFormInput, unknown, ReportFormOutput> }) {
  const { register, formState } = form
  const e = formState.errors
  return (
    <FormSection title="About you" lead={<p>So the office can reach you. Your details are not shared with whoever causes the interference.</p>}>
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField label="Your name" autoComplete="name" error={e.name?.message} {...register('name')} />
        <TextField label="E-mail" type="email" autoComplete="email" inputMode="email" spellCheck={false} hint="Your reference and tracking link go here." error={e.email?.message} {...register('email')} />
        <TextField label="Phone (optional)" type="tel" autoComplete="tel" error={e.phone?.message} {...register('phone')} />
        <TextField label="Organisation (optional)" autoComplete="organization" hint="If you report for a company, a station or an agency." error={e.organisation?.message} {...register('organisation')} />
      </div>
    </FormSection>
  )
}
