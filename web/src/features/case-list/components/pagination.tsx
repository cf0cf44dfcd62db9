/** Page through a server-paged list: previous / next, where we are, rows per page. */
import { formatCaseTotal } from '@shared/domain/case-list'
import { Button } from '@/components/ui/button'
import { PAGE_SIZES } from '@/lib/case-list-state'

/**
 * `totalCapped`: more cases match than `total` says (the server stops counting at 10,000); the
 * page count is then unknown, and "Next page" stays on while the page shown is full.
 */
export function Pagination({
  page,
  pageSize,
  total,
  totalCapped = false,
  shown,
  onPage,
  onPageSize,
}: {
  page: number
  pageSize: number
  total: number
  totalCapped?: boolean
  /** Rows on the page shown (needed when the total is capped). */
  shown?: number
  onPage: (page: number) => void
  onPageSize: (size: number) => void
}) {
  const pages = Math.max(1, Math.ceil(total / pageSize))
  const first = total === 0 && !totalCapped ? 0 : (page - 1) * pageSize + 1
  const last = totalCapped ? (page - 1) * pageSize + (shown ?? pageSize) : Math.min(total, page * pageSize)
  const hasNext = totalCapped ? (shown ?? pageSize) >= pageSize : page < pages
  return (
    <nav aria-label="Pages of the case list" className="flex flex-wrap items-center gap-3">
      <Button variant="secondary" disabled={page <= 1} onClick={() => onPage(page - 1)}>
        Previous page
      </Button>
      <p aria-live="polite">
        {totalCapped ? `Page ${page} of many` : `Page ${Math.min(page, pages)} of ${pages}`} · cases {first}–{last} of {formatCaseTotal(total, totalCapped)}
      </p>
      <Button variant="secondary" disabled={!hasNext} onClick={() => onPage(page + 1)}>
        Next page
      </Button>
      <label className="ml-auto flex items-center gap-2">
        <span>Rows per page</span>
        <select value={pageSize} onChange={(e) => onPageSize(Number(e.target.value))} className="min-h-11 rounded-control border border-field bg-surface px-2">
          {PAGE_SIZES.map((s) => (
            <option key={s} value={s}>
              {s}
            </option>
          ))}
        </select>
      </label>
    </nav>
  )
}
