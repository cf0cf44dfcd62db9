/** One titled work list on the staff start page, with its loading, error and empty states. */
import type { ReactNode } from 'react'
import { formatCaseTotal } from '@shared/domain/case-list'
import { Loading } from '@/components/ui/loading'
import { QueryError } from '@/components/ui/query-error'
import type { CaseListState } from '@/lib/case-list-state'
import { useQueue } from '../api/get-queue'
import { QueueTable } from './queue-table'

export function QueueSection({ id, title, list, empty, now, footer, showInvestigator }: { id: string; title: string; list: CaseListState; empty: string; now: Date; footer?: ReactNode; showInvestigator?: boolean }) {
  const q = useQueue(list)
  const total = q.data ? formatCaseTotal(q.data.total, q.data.totalCapped) : undefined
  return (
    <section aria-labelledby={id} className="flex flex-col gap-3">
      <h2 id={id} className="text-xl font-bold">
        {title}
        {total !== undefined && <span className="ml-2 font-mono text-base font-semibold text-ink-muted">({total})</span>}
      </h2>
      {/* The title in quotes: "Loading assigned to you…" would not read. */}
      {q.isPending && <Loading label={`Loading “${title}”…`} />}
      {q.isError && <QueryError error={q.error} what={`“${title}”`} onRetry={() => void q.refetch()} />}
      {q.data && q.data.items.length === 0 && <p className="rounded-panel border border-rule bg-surface p-4 text-ink-muted">{empty}</p>}
      {q.data && q.data.items.length > 0 && <QueueTable items={q.data.items} caption={title} now={now} showInvestigator={showInvestigator} />}
      {q.data && q.data.total > q.data.items.length && <p className="text-sm">Showing the first {q.data.items.length} of {total}.</p>}
      {footer}
    </section>
  )
}
