/**
 * The case list's active filters in words, for the line above the results ("Open only ·
 * Safety of life · Overdue"), read from the same search params the URL carries, so a filter
 * added to the list state shows here without a change (as "name: value" until it gets words).
 */
import { CASE_STATE_LABELS, type CaseState } from '@shared/domain/case-lifecycle'
import { PRIORITY_LABELS, type Priority } from '@shared/domain/services'
import { listStateToSearchParams, type CaseListState } from '@/lib/case-list-state'
import { serviceShortLabel } from '@/lib/service-label'

/** Params that order or page the list rather than filter it. */
const NOT_FILTERS = new Set(['sort', 'dir', 'page', 'pageSize', 'freqUnit'])

interface Names {
  offices: { id: string; name: string }[]
  investigators: { id: string; name: string }[]
}

function words(key: string, value: string, state: CaseListState, names: Names): string {
  const list = value.split(',')
  switch (key) {
    case 'q':
      return `“${value}”`
    case 'status':
      return list.map((s) => CASE_STATE_LABELS[s as CaseState] ?? s).join(' or ')
    case 'priority':
      return list.map((p) => PRIORITY_LABELS[Number(p) as Priority]?.short ?? `class ${p}`).join(' or ')
    case 'service':
      return list.map((s) => serviceShortLabel(s)).join(' or ')
    case 'officeId':
      return `${names.offices.find((o) => o.id === value)?.name ?? 'one'} office`
    case 'investigatorId':
      return value === 'me' ? 'Assigned to me' : value === 'none' ? 'Unassigned' : `Assigned to ${names.investigators.find((i) => i.id === value)?.name ?? 'one investigator'}`
    case 'overdue':
      return value === 'true' ? 'Overdue' : 'Not overdue'
    case 'open':
      return value === 'true' ? 'Open only' : 'Closed only'
    case 'freqFrom':
      return `from ${value} ${state.freqUnit}`
    case 'freqTo':
      return `up to ${value} ${state.freqUnit}`
    default:
      return `${key}: ${value}`
  }
}

export function activeFilters(state: CaseListState, names: Names): string[] {
  const out: string[] = []
  for (const [key, value] of listStateToSearchParams(state)) if (!NOT_FILTERS.has(key)) out.push(words(key, value, state, names))
  return out
}
