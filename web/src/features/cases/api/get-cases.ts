/** GET /api/cases — one page of the case list, filtered and sorted on the server. */
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query'
import type { CaseState } from '../../../../../shared/domain/case-lifecycle'
import { api } from '../../../lib/api-client'
import { apiQueryFromListState, type CaseListState } from '../lib/list-state'

export interface CaseListItem {
  id: string
  reference: string
  status: CaseState
  statusLabel: string
  priority: 1 | 2 | 3 | 4
  service: string
  freqLowHz: number
  freqHighHz: number
  address: string
  officeId: string
  officeName: string
  investigatorId: string | null
  investigatorName: string | null
  complainantName: string
  receivedAt: string
  dueAt: string
  closedAt: string | null
  overdue: boolean
}

export interface CasePage {
  items: CaseListItem[]
  total: number
  page: number
  pageSize: number
}

export const getCases = (state: CaseListState, signal?: AbortSignal) => api.get<CasePage>(`/api/cases?${apiQueryFromListState(state)}`, signal)

export const casesQueryOptions = (state: CaseListState) =>
  queryOptions({
    queryKey: ['cases', 'list', apiQueryFromListState(state).toString()],
    queryFn: ({ signal }) => getCases(state, signal),
    placeholderData: keepPreviousData,
    staleTime: 10_000,
  })

export const useCases = (state: CaseListState) => useQuery(casesQueryOptions(state))

/** The CSV download of the same filtered, sorted list (all pages). */
export const casesCsvHref = (state: CaseListState) => `/api/cases/export.csv?${apiQueryFromListState(state, { paging: false })}`
