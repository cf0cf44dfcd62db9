/** Join this report to an open case nearby on an overlapping frequency; the report closes as a duplicate. */
import { zodResolver } from '@hookform/resolvers/zod'
import { useForm } from 'react-hook-form'
import type { z } from 'zod'
import { CASE_STATE_LABELS, type CaseState } from '@shared/domain/case-lifecycle'
import { mergeSchema } from '@shared/schemas/cases'
import { Loading } from '@/components/ui/loading'
import { QueryError } from '@/components/ui/query-error'
import { FieldError } from '@/components/ui/field'
import { ActionForm } from './action-form'
import { useCaseActionForm } from './use-case-action-form'
import { formatDistanceM } from '@/lib/coordinates'
import { formatFrequencyRangeHz } from '@/lib/frequency'
import { serviceShortLabel } from '@/lib/service-label'
import { useMergeCandidates } from '../api/get-merge-candidates'
import { useMergeCase } from '../api/merge-case'

const schema = mergeSchema.omit({ version: true })
type In = z.input<typeof schema>

export function MergeForm() {
  const action = useCaseActionForm()
  const candidates = useMergeCandidates(action.detail.id)
  const form = useForm<In>({ resolver: zodResolver(schema), defaultValues: { intoCaseId: '' } })
  const merge = useMergeCase(action.detail.id)
  const fieldError = form.formState.errors.intoCaseId?.message

  if (candidates.isPending) return <Loading label="Looking for open cases nearby…" />
  if (candidates.isError) return <QueryError error={candidates.error} what="open cases nearby" onRetry={() => void candidates.refetch()} />
  if (candidates.data.length === 0) return <p>No open case of this office lies within 5 km on an overlapping frequency.</p>

  const onSubmit = form.handleSubmit((v) => {
    const ref = candidates.data.find((c) => c.id === v.intoCaseId)?.reference ?? 'the chosen case'
    return action.run({ send: (version) => merge.mutateAsync({ ...v, version }), success: `Merged into ${ref}. This report is closed as a duplicate.`, setFieldError: form.setError, fields: ['intoCaseId'] })
  })

  return (
    <ActionForm
      id="merge"
      title="Merge into an open case"
      headingless
      intro={<p>The complainant is told their report joins the chosen case; the report closes as a duplicate.</p>}
      submitLabel="Merge into the chosen case"
      pendingLabel="Merging…"
      submitting={form.formState.isSubmitting}
      onSubmit={onSubmit}
      action={action}
      variant="secondary"
    >
      <fieldset aria-describedby={fieldError ? 'merge-error' : undefined} className="flex flex-col gap-2">
        <legend className="mb-1 font-semibold">Open cases nearby, nearest first</legend>
        {candidates.data.map((c) => (
          <div key={c.id} className="flex items-start gap-3">
            <input id={`merge-${c.id}`} type="radio" value={c.id} aria-describedby={`merge-${c.id}-info`} className="mt-1 h-5 w-5 shrink-0 accent-signal" {...form.register('intoCaseId')} />
            <div>
              <label htmlFor={`merge-${c.id}`} className="font-mono font-semibold">
                {c.reference}
              </label>
              <p id={`merge-${c.id}-info`} className="text-sm">
                {formatDistanceM(c.distanceM)} away · <span className="font-mono">{formatFrequencyRangeHz({ lowHz: c.freqLowHz, highHz: c.freqHighHz })}</span> ·{' '}
                {serviceShortLabel(c.service)} · {CASE_STATE_LABELS[c.status as CaseState] ?? c.status} · {c.address}
              </p>
            </div>
          </div>
        ))}
        <FieldError id="merge-error" message={fieldError} />
      </fieldset>
    </ActionForm>
  )
}
