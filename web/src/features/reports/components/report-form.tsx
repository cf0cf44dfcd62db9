/**
 * The public report form. Validated in the browser with the same schema the server uses;
 * the server's field errors land beside the same fields. The location picker (a map) is
 * handed in by the page, so this feature does not depend on the map's.
 */
import { zodResolver } from '@hookform/resolvers/zod'
import { useState, type ReactNode } from 'react'
import { useForm, type DefaultValues } from 'react-hook-form'
import { SAFETY_SERVICES, type AffectedService } from '@shared/domain/services'
import { reportSchema } from '@shared/schemas/cases'
import { FormAlert } from '@/components/ui/form-alert'
import { SubmitButton } from '@/components/ui/submit-button'
import { applyFieldErrors, formProblem, type FormProblem } from '@/lib/form-errors'
import { useSubmitReport, type SubmittedReport } from '../api/submit-report'
import { ContactFields } from './contact-fields'
import { Honeypot } from './honeypot'
import { LocationFields } from './location-fields'
import { ServiceFields } from './service-fields'
import type { LocationPickerArgs, ReportFormInput, ReportFormOutput } from './report-form-types'
import { TimingFields } from './timing-fields'

/** Every field the server may name in details[].path. */
const FIELDS = [
  'name',
  'email',
  'phone',
  'organisation',
  'service',
  'licenceRef',
  'frequencyFrom',
  'frequencyTo',
  'frequencyUnit',
  'address',
  'latDeg',
  'lonDeg',
  'since',
  'pattern',
  'patternDetail',
  'experience',
  'description',
  'website',
] as const

export interface ReportFormProps {
  /** A signed-in complainant's name and e-mail. */
  contact?: { name: string; email: string }
  renderLocationPicker: (args: LocationPickerArgs) => ReactNode
  onSubmitted: (result: SubmittedReport, email: string) => void
}

export function ReportForm({ contact, renderLocationPicker, onSubmitted }: ReportFormProps) {
  const form = useForm<ReportFormInput, unknown, ReportFormOutput>({
    resolver: zodResolver(reportSchema),
    defaultValues: {
      name: contact?.name ?? '',
      email: contact?.email ?? '',
      frequencyUnit: 'MHz',
      website: '',
    } satisfies DefaultValues<ReportFormInput>,
  })
  const submit = useSubmitReport()
  const [problem, setProblem] = useState<FormProblem | null>(null)
  const service = form.watch('service') as AffectedService | undefined

  const onSubmit = form.handleSubmit(async (values) => {
    setProblem(null)
    try {
      onSubmitted(await submit.mutateAsync(values), values.email)
    } catch (error) {
      if (applyFieldErrors({ error, setError: form.setError, fields: FIELDS })) return
      setProblem(
        formProblem(error, {
          byStatus: { 429: 'Too many reports have come from this address in the last hour. Please try again later, or phone your regional field office.' },
        }),
      )
    }
  })

  return (
    <form noValidate onSubmit={onSubmit} className="flex flex-col gap-8" aria-label="Interference report">
      <ContactFields form={form} />
      <ServiceFields form={form} safety={service !== undefined && SAFETY_SERVICES.includes(service)} />
      <LocationFields form={form} renderLocationPicker={renderLocationPicker} />
      <TimingFields form={form} />
      <Honeypot form={form} />
      <FormAlert problem={problem} />
      <div className="flex flex-wrap items-center gap-4">
        <SubmitButton submitting={form.formState.isSubmitting} pendingLabel="Sending report…" className="min-h-12 px-6 text-lg">
          Submit report
        </SubmitButton>
        <p className="text-sm text-ink-muted">You get a reference and a private tracking link straight away, and by e-mail.</p>
      </div>
    </form>
  )
}
