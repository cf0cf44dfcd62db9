/**
 * For administrators: what the daily retention run would erase and delete if it ran now — each
 * case with the fields and timeline entries it would redact and the evidence objects it would
 * delete — and the expired cases it keeps (legal hold, open follow-up). Loaded on request.
 */
import { useState } from 'react'
import { ERASED_CASE_FIELDS, type ErasedCaseField } from '@shared/domain/retention'
import { Button } from '@/components/ui/button'
import { Loading } from '@/components/ui/loading'
import { QueryError } from '@/components/ui/query-error'
import { useRetentionDryRun } from '../api/retention-dry-run'

const FIELD_LABELS: Record<ErasedCaseField, string> = {
  complainantName: 'name',
  complainantEmail: 'e-mail',
  complainantPhone: 'phone',
  complainantOrganisation: 'organisation',
  description: 'description (redacted copy)',
  patternDetail: 'pattern detail (redacted copy)',
}
const KEPT_REASONS = { legal_hold: 'legal hold', open_follow_up: 'open follow-up' } as const

export function RetentionDryRun() {
  const [asked, setAsked] = useState(false)
  const run = useRetentionDryRun(asked)
  return (
    <section aria-labelledby="retention-dry-run" className="rounded-panel border border-rule bg-surface p-5">
      <h2 id="retention-dry-run" className="mb-1 text-lg font-bold">
        Retention run: what would go now
      </h2>
      <p className="mb-4 text-sm text-ink-muted">A dry run: nothing is erased or deleted. The real run happens once a day and records each erasure and deletion.</p>
      {!asked && (
        <Button variant="secondary" className="w-full sm:w-auto" onClick={() => setAsked(true)}>
          Show what would go
        </Button>
      )}
      {asked && run.isPending && <Loading label="Working out what would go…" />}
      {run.isError && <QueryError error={run.error} what="the dry run" onRetry={() => void run.refetch()} />}
      {run.data && (
        <div className="flex flex-col gap-3">
          {run.data.cases.length === 0 ? (
            <p role="status">Nothing would go now.</p>
          ) : (
            <ul aria-label="Cases the run would erase" className="flex flex-col gap-2">
              {run.data.cases.map((c) => (
                <li key={c.caseId} className="break-words text-sm">
                  <strong>{c.reference}</strong> (period ended {c.retentionEndedAt.slice(0, 10)}):{' '}
                  {c.fields.length > 0 ? ERASED_CASE_FIELDS.filter((f) => c.fields.includes(f)).map((f) => FIELD_LABELS[f]).join(', ') : 'personal data already erased'}
                  {c.redactedEventIds.length > 0 && `; ${c.redactedEventIds.length} timeline entr${c.redactedEventIds.length === 1 ? 'y' : 'ies'} redacted`}
                  {c.evidence.length > 0 && `; ${c.evidence.length} evidence file${c.evidence.length === 1 ? '' : 's'} deleted`}
                </li>
              ))}
            </ul>
          )}
          {run.data.kept.length > 0 && (
            <p className="text-sm">
              Kept: {run.data.kept.map((k) => `${k.reference} (${KEPT_REASONS[k.reason]})`).join(', ')}.
            </p>
          )}
        </div>
      )}
    </section>
  )
}
