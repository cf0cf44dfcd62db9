/**
 * The fixed lists of the staff start page, read through GET /api/cases: the office's new
 * reports (most urgent first, oldest first within a priority), findings waiting for review,
 * and an investigator's open cases (earliest due first).
 */
import { useQuery } from '@tanstack/react-query'
import { casesQueryOptions } from '@/lib/case-list-query'
import { DEFAULT_LIST_STATE, type CaseListState } from '@/lib/case-list-state'

export const NEW_REPORTS: CaseListState = { ...DEFAULT_LIST_STATE, status: ['received', 'triaged'], sort: 'priority', dir: 'asc', pageSize: 100 }
export const AWAITING_REVIEW: CaseListState = { ...DEFAULT_LIST_STATE, status: ['finding_proposed'], sort: 'dueAt', dir: 'asc', pageSize: 100 }
export const MY_OPEN_CASES: CaseListState = { ...DEFAULT_LIST_STATE, investigatorId: 'me', open: true, sort: 'dueAt', dir: 'asc', pageSize: 100 }

export const useQueue = (which: CaseListState) => useQuery({ ...casesQueryOptions(which), refetchInterval: 60_000 })
