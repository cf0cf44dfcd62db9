/**
 * The case list under 640 px: one card per case, with the same facts as the table's row, in
 * reading order (reference and harm, state and due time, what and where, who). Overdue cards
 * carry the same red edge and sign as overdue rows.
 */
import { format, parseISO } from 'date-fns'
import { Link } from 'react-router-dom'
import { OverdueFlag } from '@/components/cases/status-tag'
import { PriorityBadge } from '@/components/ui/priority-badge'
import { formatFrequencyRangeHz } from '@/lib/frequency'
import { paths } from '@/lib/paths'
import { serviceShortLabel } from '@/lib/service-label'
import type { CaseListItem } from '../api/get-cases'

export function CaseCards({ items, caption, showOffice }: { items: CaseListItem[]; caption: string; showOffice: boolean }) {
  return (
    <ul aria-label={caption} className="flex flex-col gap-2">
      {items.map((c) => (
        <li key={c.id} className={`flex flex-col gap-1 rounded-panel border border-rule bg-surface px-3 py-2 text-sm ${c.overdue ? 'border-l-4 border-l-danger bg-danger-soft' : ''}`}>
          <div className="flex flex-wrap items-center justify-between gap-2">
            <Link to={paths.case.href(c.id)} className="font-mono text-base font-semibold">
              {c.reference}
            </Link>
            <PriorityBadge level={c.priority} />
          </div>
          <p>
            <span className="font-semibold">{c.statusLabel}</span>
            {' · '}
            {c.closedAt ? (
              'Closed'
            ) : (
              <>
                due <time dateTime={c.dueAt}>{format(parseISO(c.dueAt), 'd MMM, HH:mm')}</time>
              </>
            )}
          </p>
          {c.overdue && <OverdueFlag compact />}
          <p>
            {serviceShortLabel(c.service)} · <span className="font-mono">{formatFrequencyRangeHz({ lowHz: c.freqLowHz, highHz: c.freqHighHz })}</span>
          </p>
          <p className="line-clamp-2 text-ink-muted">{c.address}</p>
          <p className="text-ink-muted">
            {showOffice ? `${c.officeName} · ` : ''}
            {c.investigatorName ?? 'Unassigned'}
          </p>
        </li>
      ))}
    </ul>
  )
}
