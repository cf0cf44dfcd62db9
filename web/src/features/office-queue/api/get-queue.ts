/**
 * The fixed lists of the staff start page, read through GET /api/cases. The office queue in the
 * order the work goes: new reports not yet triaged (most urgent first, oldest first within a
 * class), triaged cases waiting for an investigator, cases in progress and findings to review
 * (earliest due first), and the overdue ones whatever their state; an investigator's open cases
 * (earliest due first).
 */
import { useQuery } from '@tanstack/react-query'
import { casesQueryOptions } from '@/lib/case-list-query'
import { DEFAULT_LIST_STATE, type CaseListState } from '@/lib/case-list-state'

export const NEW_REPORTS: CaseListState = { ...DEFAULT_LIST_STATE, status: ['received'], sort: 'priority', dir: 'asc', pageSize: 100 }
export const WAITING_FOR_INVESTIGATOR: CaseListState = { ...DEFAULT_LIST_STATE, status: ['triaged'], sort: 'priority', dir: 'asc', pageSize: 100 }
export const IN_PROGRESS: CaseListState = { ...DEFAULT_LIST_STATE, status: ['assigned', 'field_work', 'returned'], sort: 'dueAt', dir: 'asc', pageSize: 100 }
export const AWAITING_REVIEW: CaseListState = { ...DEFAULT_LIST_STATE, status: ['finding_proposed'], sort: 'dueAt', dir: 'asc', pageSize: 100 }
export const OVERDUE: CaseListState = { ...DEFAULT_LIST_STATE, overdue: true, sort: 'dueAt', dir: 'asc', pageSize: 100 }
export const MY_OPEN_CASES: CaseListState = { ...DEFAULT_LIST_STATE, investigatorId: 'me', open: true, sort: 'dueAt', dir: 'asc', pageSize: 100 }

export const useQueue = (which: CaseListState) => useQuery({ ...casesQueryOptions(which), refetchInterval: 60_000 })
