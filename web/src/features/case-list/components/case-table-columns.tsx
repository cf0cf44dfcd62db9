/**
 * The case list's columns (TanStack Table v9). Module scope: stable column sets keep the row
 * models from being rebuilt on every render.
 */
import { createColumnHelper, rowSortingFeature, tableFeatures } from '@tanstack/react-table'
import { format, formatDistanceToNow, parseISO } from 'date-fns'
import { Link } from 'react-router-dom'
import { PriorityBadge } from '@/components/ui/priority-badge'
import { formatFrequencyRangeHz } from '@/lib/frequency'
import { serviceShortLabel } from '@/lib/service-label'
import type { CaseListItem } from '../api/get-cases'
import { OverdueFlag } from '@/components/cases/status-tag'
import { paths } from '@/lib/paths'

export const caseTableFeatures = tableFeatures({ rowSortingFeature })
const helper = createColumnHelper<typeof caseTableFeatures, CaseListItem>()

const when = (iso: string) => (
  <time dateTime={iso} className="font-mono text-sm">
    {format(parseISO(iso), 'd MMM yy, HH:mm')}
  </time>
)

const reference = helper.accessor('reference', {
  id: 'reference',
  header: 'Reference',
  cell: (c) => (
    <Link to={paths.case.href(c.row.original.id)} className="font-mono font-semibold">
      {c.getValue()}
    </Link>
  ),
})
const priority = helper.accessor('priority', { id: 'priority', header: 'Harm', sortDescFirst: false, cell: (c) => <PriorityBadge level={c.getValue()} /> })
const status = helper.accessor('statusLabel', { id: 'status', header: 'Status' })
const service = helper.accessor('service', { id: 'service', header: 'Service', cell: (c) => serviceShortLabel(c.getValue()) })
const frequency = helper.accessor('freqLowHz', {
  id: 'frequency',
  header: 'Frequency',
  sortDescFirst: false,
  cell: (c) => <span className="font-mono text-sm">{formatFrequencyRangeHz({ lowHz: c.row.original.freqLowHz, highHz: c.row.original.freqHighHz })}</span>,
})
const place = helper.accessor('address', { id: 'address', header: 'Location', enableSorting: false, cell: (c) => <span className="line-clamp-2 min-w-32">{c.getValue()}</span> })
const office = helper.accessor('officeName', { id: 'office', header: 'Office', enableSorting: false })
const investigator = helper.accessor('investigatorName', {
  id: 'investigator',
  header: 'Investigator',
  enableSorting: false,
  cell: (c) => c.getValue() ?? <span className="text-ink-muted">Unassigned</span>,
})
const received = helper.accessor('receivedAt', {
  id: 'receivedAt',
  header: 'Received',
  sortDescFirst: true,
  cell: (c) => (
    <span className="flex flex-col" title={formatDistanceToNow(parseISO(c.getValue()), { addSuffix: true })}>
      {when(c.getValue())}
    </span>
  ),
})
const due = helper.accessor('dueAt', {
  id: 'dueAt',
  header: 'Due',
  sortDescFirst: false,
  cell: (c) => (
    <span className="flex flex-col items-start gap-1">
      {c.row.original.closedAt ? <span className="text-sm text-ink-muted">Closed</span> : when(c.getValue())}
      {c.row.original.overdue && <OverdueFlag compact />}
    </span>
  ),
})

/** Columns whose figures must not break across lines. */
export const NOWRAP_COLUMNS = new Set(['reference', 'priority', 'frequency', 'receivedAt', 'dueAt'])

export const CASE_COLUMNS = helper.columns([reference, priority, status, due, service, frequency, place, investigator, received])
export const CASE_COLUMNS_WITH_OFFICE = helper.columns([reference, priority, status, due, service, frequency, place, office, investigator, received])
