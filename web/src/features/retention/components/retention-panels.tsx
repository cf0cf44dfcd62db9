/**
 * Each office's retention period: how many months after closing a case keeps its complainant's
 * personal data and evidence files. Administrators change it (the server's abilities say so);
 * a period shorter than a closed case's open follow-up needs is refused beside the field.
 */
import { useState, type FormEvent } from 'react'
import { setRetentionSchema, type RetentionSettingView } from '@shared/schemas/retention'
import { FormAlert } from '@/components/ui/form-alert'
import { SubmitButton } from '@/components/ui/submit-button'
import { TextField } from '@/components/ui/text-field'
import { ApiError } from '@/lib/api-client'
import { formProblem, type FormProblem } from '@/lib/form-errors'
import { useRetentionSetting, useSetRetention } from '../api/retention-setting'

export function RetentionPanels({ offices }: { offices: { id: string; name: string }[] }) {
  return (
    <>
      {offices.map((o) => (
        <RetentionPanel key={o.id} office={o} />
      ))}
    </>
  )
}

function RetentionPanel({ office }: { office: { id: string; name: string } }) {
  const setting = useRetentionSetting(office.id)
  if (!setting.data) return null
  const s = setting.data
  return (
    <section aria-labelledby={`retention-${office.id}`} className="rounded-panel border border-rule bg-surface p-5">
      <h2 id={`retention-${office.id}`} className="mb-1 text-lg font-bold">
        Retention — {office.name}
      </h2>
      <p className="mb-4 text-sm text-ink-muted">
        {s.retentionMonths} months after a case is closed, the complainant’s name and contact details are erased, the text they wrote is kept only as a redacted copy, and the case’s evidence files
        are deleted (their records stay). A case under a legal hold, or with an open follow-up, is kept.
        {s.minimumMonths !== null && s.minimumBecause && (
          <>
            {' '}
            The period cannot be shorter than {s.minimumMonths} months while closed case {s.minimumBecause.reference} has a follow-up due {s.minimumBecause.dueOn}.
          </>
        )}
      </p>
      {s.abilities.set && <RetentionForm setting={s} officeName={office.name} />}
    </section>
  )
}

function RetentionForm({ setting, officeName }: { setting: RetentionSettingView; officeName: string }) {
  const save = useSetRetention(setting.officeId)
  const [fieldError, setFieldError] = useState<string | undefined>()
  const [problem, setProblem] = useState<FormProblem | null>(null)
  const [saved, setSaved] = useState(false)
  const onSubmit = async (e: FormEvent<HTMLFormElement>) => {
    e.preventDefault()
    const typed = String(new FormData(e.currentTarget).get('retentionMonths') ?? '')
    setFieldError(undefined)
    setProblem(null)
    setSaved(false)
    const checked = setRetentionSchema.safeParse({ retentionMonths: typed })
    if (!checked.success) {
      setFieldError(checked.error.issues[0]?.message)
      return
    }
    try {
      await save.mutateAsync(typed)
      setSaved(true)
    } catch (error) {
      const detail = error instanceof ApiError ? error.details.find((d) => d.path === 'retentionMonths') : undefined
      if (detail) setFieldError(detail.message)
      else setProblem(formProblem(error))
    }
  }
  return (
    <form noValidate onSubmit={onSubmit} aria-label={`Retention period of ${officeName}`} className="flex flex-col gap-4">
      <div className="max-w-sm">
        <TextField
          id={`retention-months-${setting.officeId}`}
          label="Retention period (months after closing)"
          name="retentionMonths"
          inputMode="numeric"
          hint="Whole months; 24 is a common choice."
          error={fieldError}
          defaultValue={String(setting.retentionMonths)}
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
          Save retention period
        </SubmitButton>
      </div>
    </form>
  )
}
