/** GET /api/cases — one page of the case list, filtered and sorted on the server. */
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query'
import { api } from '../../../lib/api-client'
import { apiQueryFromListState, type CaseListState } from '../lib/list-state'
import type { CaseListItem, CasePage } from '../../../../../shared/schemas/views'
export type { CaseListItem, CasePage }

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
