/**
 * One page of cases (TanStack Table v9). Sorting and paging happen on the server: the table
 * only renders the rows it is given and reports header clicks as a new sort for the URL.
 * Overdue rows carry a red edge and the word "Overdue" with a sign.
 */
import { createColumnHelper, rowSortingFeature, tableFeatures, useTable, type SortingState, type Updater } from '@tanstack/react-table'
import { format, formatDistanceToNow, parseISO } from 'date-fns'
import { useMemo } from 'react'
import { Link } from 'react-router-dom'
import type { CaseSort } from '../../../../../shared/schemas/cases'
import { PriorityBadge } from '../../../components/ui/priority-badge'
import type { CaseListItem } from '../api/get-cases'
import { formatFrequencyRangeHz } from '../../../lib/frequency'
import { serviceShortLabel } from '../../../lib/service-label'
import { OverdueFlag } from './status-tag'

const features = tableFeatures({ rowSortingFeature })
const helper = createColumnHelper<typeof features, CaseListItem>()

const when = (iso: string) => (
  <time dateTime={iso} className="font-mono text-sm">
    {format(parseISO(iso), 'd MMM yy, HH:mm')}
  </time>
)

const reference = helper.accessor('reference', {
  id: 'reference',
  header: 'Reference',
  cell: (c) => (
    <Link to={`/cases/${c.row.original.id}`} className="font-mono font-semibold">
      {c.getValue()}
    </Link>
  ),
})
const priority = helper.accessor('priority', { id: 'priority', header: 'Priority', sortDescFirst: false, cell: (c) => <PriorityBadge level={c.getValue()} /> })
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
const NOWRAP = new Set(['reference', 'priority', 'frequency', 'receivedAt', 'dueAt'])

// Module scope: stable column sets keep the row models from being rebuilt on every render.
const COLUMNS = helper.columns([reference, priority, status, due, service, frequency, place, investigator, received])
const COLUMNS_WITH_OFFICE = helper.columns([reference, priority, status, due, service, frequency, place, office, investigator, received])

export interface CaseTableProps {
  items: CaseListItem[]
  sort: CaseSort
  dir: 'asc' | 'desc'
  onSort: (sort: CaseSort, dir: 'asc' | 'desc') => void
  showOffice: boolean
  caption: string
}

export function CaseTable({ items, sort, dir, onSort, showOffice, caption }: CaseTableProps) {
  const sorting = useMemo<SortingState>(() => [{ id: sort, desc: dir === 'desc' }], [sort, dir])
  const table = useTable({
    features,
    columns: showOffice ? COLUMNS_WITH_OFFICE : COLUMNS,
    data: items,
    getRowId: (row) => row.id,
    state: { sorting },
    onSortingChange: (updater: Updater<SortingState>) => {
      const next = typeof updater === 'function' ? updater(sorting) : updater
      const first = next[0]
      if (first) onSort(first.id as CaseSort, first.desc ? 'desc' : 'asc')
    },
    manualSorting: true,
    enableMultiSort: false,
    enableSortingRemoval: false,
  })

  return (
    <div className="overflow-x-auto rounded-panel border border-rule bg-surface">
      <table className="w-full border-collapse text-left">
        <caption className="sr-only">{caption}. Column headers with a button sort the list.</caption>
        <thead className="border-b-2 border-ink text-sm">
          {table.getHeaderGroups().map((group) => (
            <tr key={group.id}>
              {group.headers.map((header) => {
                const sorted = header.column.getIsSorted()
                return (
                  <th key={header.id} scope="col" aria-sort={sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : undefined} className="px-3 py-2 whitespace-nowrap">
                    {header.column.getCanSort() ? (
                      <button type="button" onClick={header.column.getToggleSortingHandler()} className="inline-flex min-h-11 items-center gap-1 font-semibold">
                        <table.FlexRender header={header} />
                        <span aria-hidden="true" className="font-mono text-ink-muted">
                          {sorted === 'asc' ? '▲' : sorted === 'desc' ? '▼' : '↕'}
                        </span>
                      </button>
                    ) : (
                      <table.FlexRender header={header} />
                    )}
                  </th>
                )
              })}
            </tr>
          ))}
        </thead>
        <tbody>
          {table.getRowModel().rows.map((row) => (
            <tr key={row.id} className={`border-b border-rule last:border-b-0 ${row.original.overdue ? 'border-l-4 border-l-danger bg-danger-soft' : ''}`}>
              {row.getAllCells().map((cell) => (
                <td key={cell.id} className={`px-3 py-2 align-top ${NOWRAP.has(cell.column.id) ? 'whitespace-nowrap' : ''}`}>
                  <table.FlexRender cell={cell} />
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  )
}
