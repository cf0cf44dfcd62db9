/**
 * The case list with its state in the URL: filters, table, paging and the CSV download of
 * the same query. Used by /cases; the page supplies the office and staff choices. The filters
 * sit in a drawer that opens under the toolbar, so the results come first; the active filters
 * are listed in words above them. Under 640 px the rows become cards.
 */
import { useId, useState } from 'react'
import { Link, useSearchParams } from 'react-router-dom'
import { buttonClass } from '@/components/ui/button'
import { Loading } from '@/components/ui/loading'
import { useTableWidth } from '@/lib/use-media-query'
import { QueryError } from '@/components/ui/query-error'
import { formatCaseTotal } from '@shared/domain/case-list'
import { casesCsvHref, useCases } from '../api/get-cases'
import { parseListState } from '@/lib/case-list-query'
import { hasFilters, listStateToSearchParams, type CaseListState } from '@/lib/case-list-state'
import { CaseFilters } from './case-filters'
import { FigureFilters, figureFiltersOf } from './figure-filters'
import { CaseCards } from './case-cards'
import { SavedViews } from './saved-views'
import { activeFilters } from '../lib/filter-summary'
import { CaseTable } from './case-table'
import { Pagination } from './pagination'

export function CaseListView({ offices, investigators }: { offices: { id: string; name: string }[]; investigators: { id: string; name: string }[] }) {
  const [params, setParams] = useSearchParams()
  const state = parseListState(params)
  const cases = useCases(state)
  const wide = useTableWidth()
  const [drawerOpen, setDrawerOpen] = useState(false)
  const drawerId = useId()
  const go = (next: CaseListState) => setParams(listStateToSearchParams(next))
  // the dashboard's figure filters show as removable tags of their own, not in the words
  const figureFilters = figureFiltersOf(state)
  const formFilters = figureFilters.reduce<CaseListState>((s, f) => ({ ...s, ...f.without }), state)
  const active = activeFilters(formFilters, { offices, investigators })

  return (
    <div className="flex flex-col gap-3">
      <div className="flex flex-wrap items-center gap-x-4 gap-y-2">
        <button type="button" aria-expanded={drawerOpen} aria-controls={drawerId} onClick={() => setDrawerOpen((o) => !o)} className={buttonClass('secondary')}>
          {drawerOpen ? 'Hide filters' : 'Filters'}
          {active.length + figureFilters.length > 0 && <span className="rounded-full bg-signal px-2 text-sm text-surface">{active.length + figureFilters.length}</span>}
        </button>
        <p aria-live="polite" className="text-lg font-semibold">
          {cases.data ? `${formatCaseTotal(cases.data.total, cases.data.totalCapped)} ${cases.data.total === 1 && !cases.data.totalCapped ? 'case' : 'cases'}${hasFilters(state) ? (cases.data.total === 1 && !cases.data.totalCapped ? ' matches these filters' : ' match these filters') : ''}` : ''}
          {cases.isFetching && cases.data ? <span className="ml-2 text-sm font-normal text-ink-muted">Updating…</span> : null}
        </p>
        <a href={casesCsvHref(state)} download className="ml-auto font-semibold">
          Download CSV
        </a>
      </div>
      {active.length > 0 && (
        <p className="text-sm">
          <span className="font-semibold">Showing: </span>
          {active.join(' · ')}{' '}
          <Link to={{ search: '' }} className="ml-2">
            Clear all
          </Link>
        </p>
      )}
      <FigureFilters state={state} onApply={go} />
      <div id={drawerId} hidden={!drawerOpen} className="flex flex-col gap-3">
        {drawerOpen && (
          <CaseFilters
            key={params.toString()}
            state={state}
            onApply={(next) => {
              if (!wide) setDrawerOpen(false) // on a phone the results would sit below the form
              go(next)
            }}
            offices={offices}
            investigators={investigators}
          />
        )}
        {drawerOpen && <SavedViews listQuery={listStateToSearchParams({ ...state, page: 1 }).toString()} />}
      </div>
      {cases.isPending && <Loading label="Loading cases…" />}
      {cases.isError && <QueryError error={cases.error} what="the cases" onRetry={() => void cases.refetch()} />}
      {cases.data && cases.data.items.length === 0 && <p className="rounded-panel border border-rule bg-surface p-5">No case matches these filters.</p>}
      {cases.data && cases.data.items.length > 0 && (
        <>
          {wide ? (
            <CaseTable
              items={cases.data.items}
              sort={state.sort}
              dir={state.dir}
              onSort={(sort, dir) => go({ ...state, sort, dir, page: 1 })}
              showOffice={offices.length > 1}
              caption="Cases"
            />
          ) : (
            <CaseCards items={cases.data.items} showOffice={offices.length > 1} caption="Cases" />
          )}
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
