/**
 * For administrators: what the daily retention run would erase and delete if it ran now — each
 * case with the fields and timeline entries it would redact and the evidence objects it would
 * delete — and the expired cases it keeps (legal hold, open follow-up). Loaded on request.
 */
import { useState } from 'react'
import { ERASED_CASE_FIELDS, type ErasedCaseField } from '@shared/domain/retention'
import type { RetentionPlanCase } from '@shared/schemas/retention'
import { Button } from '@/components/ui/button'
import { Loading } from '@/components/ui/loading'
import { QueryError } from '@/components/ui/query-error'
import { useRetentionDryRun } from '../api/retention-dry-run'

const FIELD_LABELS: Record<ErasedCaseField, string> = {
  complainantName: 'name',
  complainantEmail: 'e-mail',
  complainantPhone: 'phone',
  complainantOrganisation: 'organisation',
  address: 'address (the position is kept, rounded to 0.01°)',
  description: 'description (redacted copy)',
  patternDetail: 'pattern detail (redacted copy)',
}
const KEPT_REASONS = { legal_hold: 'legal hold', open_follow_up: 'open follow-up' } as const
const plural = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`

/** What becomes of the complainant's account, in words. */
function accountWords(account: RetentionPlanCase['account']): string | null {
  if (!account) return null
  if (account.outcome === 'deactivated') return 'account closed (name and e-mail erased)'
  if (account.reason === 'other_cases') return `account kept: has ${plural(account.otherCases, 'other case', 'other cases')}`
  if (account.reason === 'signed_in') return `account kept: signed in on ${account.lastSignedInAt.slice(0, 10)}`
  return 'account kept: not a complainant account'
}

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
                  {c.evidence.some((e) => e.thumbnailKey) && ` (with ${plural(c.evidence.filter((e) => e.thumbnailKey).length, 'thumbnail', 'thumbnails')})`}
                  {c.fileNames.length > 0 && `; ${plural(c.fileNames.length, 'file name', 'file names')} replaced`}
                  {c.mergeEventIds.length > 0 && `; ${plural(c.mergeEventIds.length, 'merge entry', 'merge entries')} of other cases redacted`}
                  {c.queuedMails.length > 0 && `; ${plural(c.queuedMails.length, 'unsent e-mail', 'unsent e-mails')} cancelled`}
                  {accountWords(c.account) && `; ${accountWords(c.account)}`}
                </li>
              ))}
            </ul>
          )}
          {run.data.pendingDisposals.length > 0 && (
            <p className="text-sm">Left over from an earlier run: {plural(run.data.pendingDisposals.length, 'object deletion', 'object deletions')} to finish.</p>
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
