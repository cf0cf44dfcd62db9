/**
 * The case list's query, both ways: read from the page's search params (tolerating junk, each
 * value checked against the shared lists), and sent as GET /api/cases — one page of cases,
 * filtered and sorted on the server, read by the case list and by the staff start page's work
 * lists, each through its own hook.
 */
import { queryOptions } from '@tanstack/react-query'
import { CASE_STATES, type CaseState } from '@shared/domain/case-lifecycle'
import { AFFECTED_SERVICES, type AffectedService } from '@shared/domain/services'
import { CASE_SORTS } from '@shared/schemas/cases'
import type { CaseListItem, CasePage } from '@shared/schemas/views'
import { api } from './api-client'
import { DEFAULT_LIST_STATE, setChoiceFilters, type CaseListState } from './case-list-state'
import { FREQUENCY_UNIT_OPTIONS, frequencyToHz } from './frequency'
import { caseKeys } from './query-keys'
export type { CaseListItem, CasePage }

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i

const list = (params: URLSearchParams, key: string) =>
  (params.get(key) ?? '')
    .split(',')
    .map((s) => s.trim())
    .filter(Boolean)

const oneOf = <T extends string>(value: string | null, allowed: readonly T[]): T | null =>
  value !== null && (allowed as readonly string[]).includes(value) ? (value as T) : null

const bool = (value: string | null): boolean | null => (value === 'true' ? true : value === 'false' ? false : null)

const nonNegative = (value: string | null): number | null => {
  if (value === null || value.trim() === '') return null
  const n = Number(value)
  return Number.isFinite(n) && n >= 0 ? n : null
}

const positiveInt = (value: string | null, fallback: number, max: number): number => {
  const n = Number(value)
  return Number.isInteger(n) && n >= 1 && n <= max ? n : fallback
}

const days = (value: string | null): number | null => (value === null ? null : positiveInt(value, 0, 366) || null)

/** Reads the list state from the page's search params; anything invalid falls back to the default. */
export function parseListState(params: URLSearchParams): CaseListState {
  const d = DEFAULT_LIST_STATE
  const investigator = params.get('investigatorId')
  const officeId = params.get('officeId')
  return {
    page: positiveInt(params.get('page'), d.page, 100_000),
    pageSize: positiveInt(params.get('pageSize'), d.pageSize, 200),
    sort: oneOf(params.get('sort'), CASE_SORTS) ?? d.sort,
    dir: oneOf(params.get('dir'), ['asc', 'desc'] as const) ?? d.dir,
    status: list(params, 'status').filter((s): s is CaseState => (CASE_STATES as readonly string[]).includes(s)),
    priority: list(params, 'priority')
      .map(Number)
      .filter((p) => [1, 2, 3, 4].includes(p)),
    service: list(params, 'service').filter((s): s is AffectedService => (AFFECTED_SERVICES as readonly string[]).includes(s)),
    officeId: officeId && UUID.test(officeId) ? officeId : null,
    investigatorId: investigator && (investigator === 'me' || investigator === 'none' || UUID.test(investigator)) ? investigator : null,
    overdue: bool(params.get('overdue')),
    open: bool(params.get('open')),
    dueSoon: params.get('dueSoon') === 'true',
    firstResponseOverdue: bool(params.get('firstResponseOverdue')),
    receivedToday: params.get('receivedToday') === 'true',
    closedInLastDays: days(params.get('closedInLastDays')),
    respondedInLastDays: days(params.get('respondedInLastDays')),
    freqFrom: nonNegative(params.get('freqFrom')),
    freqTo: nonNegative(params.get('freqTo')),
    freqUnit: oneOf(params.get('freqUnit'), FREQUENCY_UNIT_OPTIONS) ?? d.freqUnit,
    q: (params.get('q') ?? '').trim().slice(0, 100),
  }
}

/**
 * The query of GET /api/cases (and of the CSV export, which takes the same filters and sort).
 * Frequencies go out in Hz.
 */
export function apiQueryFromListState(state: CaseListState, options: { paging: boolean } = { paging: true }): URLSearchParams {
  const p = new URLSearchParams()
  if (options.paging) {
    p.set('page', String(state.page))
    p.set('pageSize', String(state.pageSize))
  }
  p.set('sort', state.sort)
  p.set('dir', state.dir)
  setChoiceFilters(p, state)
  if (state.freqFrom !== null) p.set('freqFromHz', String(frequencyToHz({ value: state.freqFrom, unit: state.freqUnit })))
  if (state.freqTo !== null) p.set('freqToHz', String(frequencyToHz({ value: state.freqTo, unit: state.freqUnit })))
  if (state.q) p.set('q', state.q)
  return p
}

export const getCases = (state: CaseListState, signal?: AbortSignal) => api.get<CasePage>(`/api/cases?${apiQueryFromListState(state)}`, signal)

export const casesQueryOptions = (state: CaseListState) =>
  queryOptions({ queryKey: caseKeys.list(state), queryFn: ({ signal }) => getCases(state, signal), staleTime: 10_000 })
