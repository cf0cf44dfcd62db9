/**
 * The frame every data table shares (scrolls sideways on narrow screens, a caption for screen
 * readers, a strong rule under the head), and a column header that sorts when clicked.
 */
import type { ReactNode } from 'react'

export function TableFrame({ caption, head, children }: { caption: string; head: ReactNode; children: ReactNode }) {
  return (
    <div className="overflow-x-auto rounded-panel border border-rule bg-surface">
      <table className="w-full border-collapse text-left">
        <caption className="sr-only">{caption}</caption>
        <thead className="border-b-2 border-ink text-sm">{head}</thead>
        <tbody>{children}</tbody>
      </table>
    </div>
  )
}

/** What SortableTh needs of a TanStack Table column (kept structural, so this file needs no table types). */
export interface SortableColumn {
  getIsSorted: () => false | 'asc' | 'desc'
  getCanSort: () => boolean
  getToggleSortingHandler: () => undefined | ((event: unknown) => void)
}

/** A column header; a sortable column's is a button, and aria-sort tells the current order. */
export function SortableTh({ column, className, children }: { column: SortableColumn; className: string; children: ReactNode }) {
  const sorted = column.getIsSorted()
  return (
    <th scope="col" aria-sort={sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : undefined} className={className}>
      {column.getCanSort() ? (
        <button type="button" onClick={column.getToggleSortingHandler()} className="inline-flex min-h-11 items-center gap-1 font-semibold">
          {children}
          <span aria-hidden="true" className="font-mono text-ink-muted">
            {sorted === 'asc' ? '▲' : sorted === 'desc' ? '▼' : '↕'}
          </span>
        </button>
      ) : (
        children
      )}
    </th>
  )
}
