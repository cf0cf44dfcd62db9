/**
 * An office's time zone, chosen from the zones the browser knows (the server checks the name
 * again with its own time-zone data and answers beside the field when it does not know it).
 */
import { useState, type FormEvent } from 'react'
import { SelectField } from '@/components/ui/select-field'
import { SubmitButton } from '@/components/ui/submit-button'
import { FormAlert } from '@/components/ui/form-alert'
import { formProblem, type FormProblem } from '@/lib/form-errors'
import { ApiError } from '@/lib/api-client'
import type { Office } from '../api/get-offices'
import { useSetTimeZone } from '../api/set-time-zone'

/** Every IANA zone the platform knows (Intl.supportedValuesOf), the office's own kept when absent. */
export function zoneOptions(current: string): { value: string; label: string }[] {
  const known = typeof Intl.supportedValuesOf === 'function' ? Intl.supportedValuesOf('timeZone') : []
  // the platform's list may leave out UTC itself; an office's own zone is always offered
  const all = [...new Set([current, 'UTC', ...known])].sort((a, b) => a.localeCompare(b))
  return all.map((z) => ({ value: z, label: z.replace(/_/g, ' ') }))
}

export function TimeZoneForm({ office }: { office: Office }) {
  const save = useSetTimeZone()
  const [problem, setProblem] = useState<FormProblem | null>(null)
  const [fieldError, setFieldError] = useState<string | undefined>()
  const [saved, setSaved] = useState(false)
  const onSubmit = async (e: FormEvent<HTMLFormElement>) => {
    e.preventDefault()
    const timeZone = String(new FormData(e.currentTarget).get('timeZone') ?? '')
    setProblem(null)
    setFieldError(undefined)
    setSaved(false)
    try {
      await save.mutateAsync({ officeId: office.id, timeZone })
      setSaved(true)
    } catch (error) {
      const detail = error instanceof ApiError ? error.details.find((d) => d.path === 'timeZone') : undefined
      if (detail) setFieldError(detail.message)
      else setProblem(formProblem(error))
    }
  }
  return (
    <form noValidate onSubmit={onSubmit} aria-label={`Time zone of ${office.name}`} className="flex flex-col gap-4">
      <div className="max-w-sm">
        <SelectField
          id={`time-zone-${office.id}`}
          label="Time zone"
          name="timeZone"
          hint="The office’s day: “today” on the dashboard and the daily digest follow it."
          error={fieldError}
          defaultValue={office.timeZone}
          options={zoneOptions(office.timeZone)}
        />
      </div>
      <FormAlert problem={problem} />
      {saved && (
        <p role="status" className="text-sm">
          Saved.
        </p>
      )}
      <div>
        <SubmitButton submitting={save.isPending} pendingLabel="Saving…" variant="secondary">
          Save time zone
        </SubmitButton>
      </div>
    </form>
  )
}
