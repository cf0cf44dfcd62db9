/**
 * The case list's whole state lives in the URL, so a filtered, sorted page can be shared or
 * bookmarked. This module reads it from search params (tolerating junk), writes it back
 * (omitting defaults, so links stay short) and turns it into the API's query.
 */
import { CASE_STATES, type CaseState } from '../../../../../shared/domain/case-lifecycle'
import { AFFECTED_SERVICES, type AffectedService } from '../../../../../shared/domain/services'
import { CASE_SORTS, type CaseSort } from '../../../../../shared/schemas/cases'
import { FREQUENCY_UNIT_OPTIONS, frequencyToHz, type FrequencyUnit } from '../../../lib/frequency'

export const PAGE_SIZES = [25, 50, 100] as const

export interface CaseListState {
  page: number
  pageSize: number
  sort: CaseSort
  dir: 'asc' | 'desc'
  status: CaseState[]
  priority: number[]
  service: AffectedService[]
  officeId: string | null
  /** A staff id, "me" or "none" (unassigned). */
  investigatorId: string | null
  overdue: boolean | null
  open: boolean | null
  /** Frequency filter in `freqUnit` (as typed); the API gets Hz. */
  freqFrom: number | null
  freqTo: number | null
  freqUnit: FrequencyUnit
  q: string
}

export const DEFAULT_LIST_STATE: CaseListState = {
  page: 1,
  pageSize: 25,
  sort: 'receivedAt',
  dir: 'desc',
  status: [],
  priority: [],
  service: [],
  officeId: null,
  investigatorId: null,
  overdue: null,
  open: null,
  freqFrom: null,
  freqTo: null,
  freqUnit: 'MHz',
  q: '',
}

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
    freqFrom: nonNegative(params.get('freqFrom')),
    freqTo: nonNegative(params.get('freqTo')),
    freqUnit: oneOf(params.get('freqUnit'), FREQUENCY_UNIT_OPTIONS) ?? d.freqUnit,
    q: (params.get('q') ?? '').trim().slice(0, 100),
  }
}

/** The filters the page URL and the API spell alike (status, priority, service, office, investigator, overdue, open). */
function setChoiceFilters(p: URLSearchParams, state: CaseListState): void {
  if (state.status.length) p.set('status', state.status.join(','))
  if (state.priority.length) p.set('priority', state.priority.join(','))
  if (state.service.length) p.set('service', state.service.join(','))
  if (state.officeId) p.set('officeId', state.officeId)
  if (state.investigatorId) p.set('investigatorId', state.investigatorId)
  if (state.overdue !== null) p.set('overdue', String(state.overdue))
  if (state.open !== null) p.set('open', String(state.open))
}

/** Writes the state as search params, leaving out whatever equals the default. */
export function listStateToSearchParams(state: CaseListState): URLSearchParams {
  const d = DEFAULT_LIST_STATE
  const p = new URLSearchParams()
  if (state.q) p.set('q', state.q)
  setChoiceFilters(p, state)
  if (state.freqFrom !== null) p.set('freqFrom', String(state.freqFrom))
  if (state.freqTo !== null) p.set('freqTo', String(state.freqTo))
  if ((state.freqFrom !== null || state.freqTo !== null) && state.freqUnit !== d.freqUnit) p.set('freqUnit', state.freqUnit)
  if (state.sort !== d.sort) p.set('sort', state.sort)
  if (state.dir !== d.dir) p.set('dir', state.dir)
  if (state.page !== d.page) p.set('page', String(state.page))
  if (state.pageSize !== d.pageSize) p.set('pageSize', String(state.pageSize))
  return p
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

/** Whether any filter (not sort or paging) differs from the default. */
export function hasFilters(state: CaseListState): boolean {
  return (
    state.q !== '' ||
    state.status.length > 0 ||
    state.priority.length > 0 ||
    state.service.length > 0 ||
    state.officeId !== null ||
    state.investigatorId !== null ||
    state.overdue !== null ||
    state.open !== null ||
    state.freqFrom !== null ||
    state.freqTo !== null
  )
}
