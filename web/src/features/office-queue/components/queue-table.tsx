/**
 * A short work list: priority first, then the case, and its age against the response target
 * (a bar, words, and an "Overdue" flag when past it).
 */
import { Link } from 'react-router-dom'
import { PriorityBadge } from '@/components/ui/priority-badge'
import { TableFrame } from '@/components/ui/table'
import type { CaseListItem } from '@shared/schemas/views'
import { OverdueFlag } from '@/components/cases/status-tag'
import { formatFrequencyRangeHz } from '@/lib/frequency'
import { formatTargetHours, responseClock } from '@/lib/response-clock'
import { serviceShortLabel } from '@/lib/service-label'
import { paths } from '@/lib/paths'

export function QueueTable({ items, caption, now, showInvestigator = false }: { items: CaseListItem[]; caption: string; now: Date; showInvestigator?: boolean }) {
  const head = (
    <tr>
      <th scope="col" className="px-3 py-2">Priority</th>
      <th scope="col" className="px-3 py-2">Reference</th>
      <th scope="col" className="px-3 py-2">Status</th>
      <th scope="col" className="px-3 py-2">Service and frequency</th>
      <th scope="col" className="px-3 py-2">Location</th>
      {showInvestigator && <th scope="col" className="px-3 py-2">Investigator</th>}
      <th scope="col" className="px-3 py-2">Age against target</th>
    </tr>
  )
  return (
    <TableFrame caption={caption} head={head}>
      {items.map((c) => (
        <QueueRow key={c.id} item={c} now={now} showInvestigator={showInvestigator} />
      ))}
    </TableFrame>
  )
}

function QueueRow({ item: c, now, showInvestigator }: { item: CaseListItem; now: Date; showInvestigator: boolean }) {
  const clock = responseClock({ status: c.status, receivedAt: c.receivedAt, dueAt: c.dueAt, closedAt: c.closedAt, now })
  return (
    <tr className={`border-b border-rule align-top last:border-b-0 ${c.overdue ? 'border-l-4 border-l-danger bg-danger-soft' : ''}`}>
      <td className="px-3 py-2 whitespace-nowrap">
        <PriorityBadge level={c.priority} />
      </td>
      <td className="px-3 py-2 whitespace-nowrap">
        <Link to={paths.case.href(c.id)} className="font-mono font-semibold">
          {c.reference}
        </Link>
      </td>
      <td className="px-3 py-2">{c.statusLabel}</td>
      <td className="px-3 py-2">
        {serviceShortLabel(c.service)}
        <span className="block font-mono text-sm">{formatFrequencyRangeHz({ lowHz: c.freqLowHz, highHz: c.freqHighHz })}</span>
      </td>
      <td className="px-3 py-2">{c.address}</td>
      {showInvestigator && <td className="px-3 py-2">{c.investigatorName ?? <span className="text-ink-muted">Unassigned</span>}</td>}
      <td className="min-w-48 px-3 py-2">
        <div className="flex flex-col gap-1">
          <span>
            {clock.ageText} <span className="text-ink-muted">of {formatTargetHours(clock.targetHours)}</span>
          </span>
          <span aria-hidden="true" className="block h-1.5 w-32 overflow-hidden rounded-full bg-rule">
            <span className={`block h-full ${c.overdue ? 'bg-danger' : 'bg-signal'}`} style={{ width: `${Math.min(100, Math.round(clock.usedFraction * 100))}%` }} />
          </span>
          {c.overdue ? <OverdueFlag compact /> : <span className="text-sm text-ink-muted">{clock.standingText}</span>}
        </div>
      </td>
    </tr>
  )
}
