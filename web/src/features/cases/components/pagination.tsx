/** Page through a server-paged list: previous / next, where we are, rows per page. */
import { Button } from '../../../components/ui/button'
import { PAGE_SIZES } from '../lib/list-state'

export function Pagination({ page, pageSize, total, onPage, onPageSize }: { page: number; pageSize: number; total: number; onPage: (page: number) => void; onPageSize: (size: number) => void }) {
  const pages = Math.max(1, Math.ceil(total / pageSize))
  const first = total === 0 ? 0 : (page - 1) * pageSize + 1
  const last = Math.min(total, page * pageSize)
  return (
    <nav aria-label="Pages of the case list" className="flex flex-wrap items-center gap-3">
      <Button variant="secondary" disabled={page <= 1} onClick={() => onPage(page - 1)}>
        Previous page
      </Button>
      <p aria-live="polite">
        Page {Math.min(page, pages)} of {pages} · cases {first}–{last} of {total}
      </p>
      <Button variant="secondary" disabled={page >= pages} onClick={() => onPage(page + 1)}>
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
