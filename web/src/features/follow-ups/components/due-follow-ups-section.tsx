/**
 * Follow-ups due today or overdue, on the office's calendar: the investigator's own cases, or
 * the whole office for its supervisor. Shown on the work queue.
 */
import { Link } from 'react-router-dom'
import { Loading } from '@/components/ui/loading'
import { QueryError } from '@/components/ui/query-error'
import { paths } from '@/lib/paths'
import { useDueFollowUps } from '../api/get-due-follow-ups'
import { FollowUpStanding } from './follow-up-standing'

export function DueFollowUpsSection({ showInvestigator = false }: { showInvestigator?: boolean }) {
  const q = useDueFollowUps()
  const d = q.data
  return (
    <section aria-labelledby="queue-follow-ups" className="flex flex-col gap-3 rounded-panel border border-rule bg-surface p-4 sm:p-5">
      <h2 id="queue-follow-ups" className="text-lg font-bold">
        Follow-ups due or overdue{d && d.items.length > 0 ? ` (${d.items.length})` : ''}
      </h2>
      {q.isPending && <Loading label="Loading the follow-ups…" />}
      {q.isError && <QueryError error={q.error} what="the follow-ups" onRetry={() => void q.refetch()} />}
      {d && d.items.length === 0 && <p className="text-ink-muted">No follow-up is due today ({d.today}) or overdue.</p>}
      {d && d.items.length > 0 && (
        <ul className="flex flex-col gap-2">
          {d.items.map((i) => (
            <li key={i.id} className="flex flex-col gap-1 border-b border-rule pb-2 last:border-b-0 sm:flex-row sm:flex-wrap sm:items-baseline sm:gap-3">
              <FollowUpStanding standing={i.standing} />
              <Link to={paths.case.href(i.caseId)} className="font-semibold">
                {i.caseReference}
              </Link>
              <span>Deadline {i.dueOn}</span>
              <span className="min-w-0 break-words text-ink-muted">{i.expected}</span>
              {showInvestigator && <span className="text-sm text-ink-muted">{i.investigatorName ?? 'No investigator'}</span>}
            </li>
          ))}
        </ul>
      )}
    </section>
  )
}
