/**
 * One page of cases (TanStack Table v9). Sorting and paging happen on the server: the table
 * only renders the rows it is given and reports header clicks as a new sort for the URL.
 * Overdue rows carry a red edge and the word "Overdue" with a sign.
 */
import { useTable, type SortingState, type Updater } from '@tanstack/react-table'
import { useMemo } from 'react'
import type { CaseSort } from '@shared/schemas/cases'
import { SortableTh, TableFrame } from '@/components/ui/table'
import type { CaseListItem } from '../api/get-cases'
import { CASE_COLUMNS, CASE_COLUMNS_WITH_OFFICE, NOWRAP_COLUMNS, caseTableFeatures } from './case-table-columns'

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
    features: caseTableFeatures,
    columns: showOffice ? CASE_COLUMNS_WITH_OFFICE : CASE_COLUMNS,
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

  const head = table.getHeaderGroups().map((group) => (
    <tr key={group.id}>
      {group.headers.map((header) => (
        <SortableTh key={header.id} column={header.column} className="px-3 py-1.5 whitespace-nowrap">
          <table.FlexRender header={header} />
        </SortableTh>
      ))}
    </tr>
  ))

  return (
    <TableFrame caption={`${caption}. Column headers with a button sort the list.`} head={head}>
      {table.getRowModel().rows.map((row) => (
        <tr key={row.id} className={`border-b border-rule last:border-b-0 ${row.original.overdue ? 'border-l-4 border-l-danger bg-danger-soft' : ''}`}>
          {row.getAllCells().map((cell) => (
            <td key={cell.id} className={`px-3 py-1.5 align-top text-sm ${NOWRAP_COLUMNS.has(cell.column.id) ? 'whitespace-nowrap' : ''}`}>
              <table.FlexRender cell={cell} />
            </td>
          ))}
        </tr>
      ))}
    </TableFrame>
  )
}
