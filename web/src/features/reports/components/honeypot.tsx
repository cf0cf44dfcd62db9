/** A field people never see and robots fill in; the server refuses reports that fill it. */
import type { UseFormReturn } from 'react-hook-form'
import type { ReportFormInput, ReportFormOutput } from './report-form-types'

export function Honeypot({ form }: { form: UseFormReturn<ReportFormInput, unknown, ReportFormOutput> }) {
  return (
    <div aria-hidden="true" className="absolute -left-[10000px] h-px w-px overflow-hidden">
      <label htmlFor="field-website">Leave this empty</label>
      <input id="field-website" type="text" tabIndex={-1} autoComplete="off" {...form.register('website')} />
    </div>
  )
}
