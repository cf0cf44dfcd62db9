/**
 * The filters a dashboard figure adds to the list (they have no field in the filter form): shown
 * as a line of tags, each with a button that removes it, so the list never filters unseen.
 */
import { DUE_SOON_HOURS } from '@shared/domain/case-clocks'
import type { CaseListState } from '@/lib/case-list-state'

interface FigureFilter {
  label: string
  without: Partial<CaseListState>
}

export function figureFiltersOf(state: CaseListState): FigureFilter[] {
  const out: FigureFilter[] = []
  if (state.dueSoon) out.push({ label: `Due within ${DUE_SOON_HOURS} hours`, without: { dueSoon: false } })
  if (state.firstResponseOverdue !== null) out.push({ label: state.firstResponseOverdue ? 'First response overdue' : 'First response not overdue', without: { firstResponseOverdue: null } })
  if (state.receivedToday) out.push({ label: 'Received today (office time)', without: { receivedToday: false } })
  if (state.closedInLastDays !== null) out.push({ label: `Closed in the last ${state.closedInLastDays} days`, without: { closedInLastDays: null } })
  if (state.respondedInLastDays !== null) out.push({ label: `First answered in the last ${state.respondedInLastDays} days`, without: { respondedInLastDays: null } })
  return out
}

export function FigureFilters({ state, onApply }: { state: CaseListState; onApply: (next: CaseListState) => void }) {
  const filters = figureFiltersOf(state)
  if (!filters.length) return null
  return (
    <ul aria-label="Also filtered by" className="flex flex-wrap gap-2">
      {filters.map((f) => (
        <li key={f.label} className="flex items-center gap-2 rounded-panel border border-rule bg-surface px-3 py-1 text-sm">
          <span>{f.label}</span>
          <button type="button" className="font-semibold underline" aria-label={`Remove filter: ${f.label}`} onClick={() => onApply({ ...state, ...f.without, page: 1 })}>
            Remove
          </button>
        </li>
      ))}
    </ul>
  )
}
