/**
 * The case list's whole state lives in the URL, so a filtered, sorted page can be shared or
 * bookmarked. This module holds the state, its defaults and how it is written to a URL
 * (omitting defaults, so links stay short); reading it back and the API's query are in
 * case-list-query.ts. Only types are imported here: lib/paths.ts builds case-list links with
 * it, and it keeps the schemas out of the entry chunk every visitor downloads.
 */
import type { CaseState } from '@shared/domain/case-lifecycle'
import type { AffectedService } from '@shared/domain/services'
import type { CaseSort } from '@shared/schemas/cases'
import type { FrequencyUnit } from './frequency'

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
  /** The dashboard's figures: due within 24 h, first response overdue, received today (office time), windows in days. */
  dueSoon: boolean
  firstResponseOverdue: boolean | null
  receivedToday: boolean
  closedInLastDays: number | null
  respondedInLastDays: number | null
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
  dueSoon: false,
  firstResponseOverdue: null,
  receivedToday: false,
  closedInLastDays: null,
  respondedInLastDays: null,
  freqFrom: null,
  freqTo: null,
  freqUnit: 'MHz',
  q: '',
}

/** The filters the page URL and the API spell alike (status, priority, service, office, investigator, overdue, open, the dashboard's). */
export function setChoiceFilters(p: URLSearchParams, state: CaseListState): void {
  if (state.status.length) p.set('status', state.status.join(','))
  if (state.priority.length) p.set('priority', state.priority.join(','))
  if (state.service.length) p.set('service', state.service.join(','))
  if (state.officeId) p.set('officeId', state.officeId)
  if (state.investigatorId) p.set('investigatorId', state.investigatorId)
  if (state.overdue !== null) p.set('overdue', String(state.overdue))
  if (state.open !== null) p.set('open', String(state.open))
  if (state.dueSoon) p.set('dueSoon', 'true')
  if (state.firstResponseOverdue !== null) p.set('firstResponseOverdue', String(state.firstResponseOverdue))
  if (state.receivedToday) p.set('receivedToday', 'true')
  if (state.closedInLastDays !== null) p.set('closedInLastDays', String(state.closedInLastDays))
  if (state.respondedInLastDays !== null) p.set('respondedInLastDays', String(state.respondedInLastDays))
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
    state.dueSoon ||
    state.firstResponseOverdue !== null ||
    state.receivedToday ||
    state.closedInLastDays !== null ||
    state.respondedInLastDays !== null ||
    state.freqFrom !== null ||
    state.freqTo !== null
  )
}
