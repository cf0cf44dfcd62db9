/** The case list's page of cases (GET /api/cases) and the CSV download of the same query. */
import { keepPreviousData, useQuery } from '@tanstack/react-query'
import { apiQueryFromListState, casesQueryOptions } from '@/lib/case-list-query'
import type { CaseListState } from '@/lib/case-list-state'
export type { CaseListItem, CasePage } from '@/lib/case-list-query'

/** Keeps the previous page on screen while the next one loads. */
export const useCases = (state: CaseListState) => useQuery({ ...casesQueryOptions(state), placeholderData: keepPreviousData })

/** The CSV download of the same filtered, sorted list (all pages). */
export const casesCsvHref = (state: CaseListState) => `/api/cases/export.csv?${apiQueryFromListState(state, { paging: false })}`
