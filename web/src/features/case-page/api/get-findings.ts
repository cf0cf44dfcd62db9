/** GET /api/cases/:id/findings — the case's current finding and the earlier proposals, with their linked calculations. */
import { queryOptions, useQuery } from '@tanstack/react-query'
import type { FindingsResponse, FindingView } from '@shared/schemas/findings'
import { api } from '@/lib/api-client'
import { caseKeys } from '@/lib/query-keys'
export type { FindingsResponse, FindingView }

export const getFindings = (caseId: string, signal?: AbortSignal) => api.get<FindingsResponse>(`/api/cases/${encodeURIComponent(caseId)}/findings`, signal)

export const findingsQueryOptions = (caseId: string) => queryOptions({ queryKey: caseKeys.findings(caseId), queryFn: ({ signal }) => getFindings(caseId, signal), staleTime: 10_000 })

export const useFindings = (caseId: string) => useQuery(findingsQueryOptions(caseId))
