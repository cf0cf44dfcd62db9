/**
 * The case list with its state in the URL: filters, table, paging and the CSV download of
 * the same query. Used by /cases; the page supplies the office and staff choices.
 */
import { useSearchParams } from 'react-router-dom'
import { Loading } from '@/components/ui/loading'
import { QueryError } from '@/components/ui/query-error'
import { formatCaseTotal } from '@shared/domain/case-list'
import { casesCsvHref, useCases } from '../api/get-cases'
import { parseListState } from '@/lib/case-list-query'
import { hasFilters, listStateToSearchParams, type CaseListState } from '@/lib/case-list-state'
import { CaseFilters } from './case-filters'
import { CaseTable } from './case-table'
import { Pagination } from './pagination'

export function CaseListView({ offices, investigators }: { offices: { id: string; name: string }[]; investigators: { id: string; name: string }[] }) {
  const [params, setParams] = useSearchParams()
  const state = parseListState(params)
  const cases = useCases(state)
  const go = (next: CaseListState) => setParams(listStateToSearchParams(next))

  return (
    <div className="flex flex-col gap-5">
      <CaseFilters key={params.toString()} state={state} onApply={go} offices={offices} investigators={investigators} />
      <div className="flex flex-wrap items-center gap-4">
        <p aria-live="polite" className="text-lg font-semibold">
          {cases.data ? `${formatCaseTotal(cases.data.total, cases.data.totalCapped)} ${cases.data.total === 1 && !cases.data.totalCapped ? 'case' : 'cases'}${hasFilters(state) ? ' match these filters' : ''}` : ''}
          {cases.isFetching && cases.data ? <span className="ml-2 text-sm font-normal text-ink-muted">Updating…</span> : null}
        </p>
        <a href={casesCsvHref(state)} download className="ml-auto font-semibold">
          Download CSV
        </a>
      </div>
      {cases.isPending && <Loading label="Loading cases…" />}
      {cases.isError && <QueryError error={cases.error} what="the cases" onRetry={() => void cases.refetch()} />}
      {cases.data && cases.data.items.length === 0 && <p className="rounded-panel border border-rule bg-surface p-5">No case matches these filters.</p>}
      {cases.data && cases.data.items.length > 0 && (
        <>
          <CaseTable
            items={cases.data.items}
            sort={state.sort}
            dir={state.dir}
            onSort={(sort, dir) => go({ ...state, sort, dir, page: 1 })}
            showOffice={offices.length > 1}
            caption="Cases"
          />
          <Pagination
            page={state.page}
            pageSize={state.pageSize}
            total={cases.data.total}
            totalCapped={cases.data.totalCapped}
            shown={cases.data.items.length}
            onPage={(page) => go({ ...state, page })}
            onPageSize={(pageSize) => go({ ...state, pageSize, page: 1 })}
          />
        </>
      )}
    </div>
  )
}
