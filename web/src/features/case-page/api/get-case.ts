/** GET /api/cases/:id — the case page: details, timeline and what the viewer may do (`abilities`). */
import { queryOptions, useQuery } from '@tanstack/react-query'
import { api } from '@/lib/api-client'
import { caseKeys } from '@/lib/query-keys'
import type { TimelineEvent, CaseDetail } from '@shared/schemas/views'
export type { TimelineEvent, CaseDetail }

export const getCase = (id: string, signal?: AbortSignal) =>
  api.get<{ case: CaseDetail }>(`/api/cases/${encodeURIComponent(id)}`, signal).then((r) => r.case)

export const caseQueryOptions = (id: string) => queryOptions({ queryKey: caseKeys.detail(id), queryFn: ({ signal }) => getCase(id, signal), staleTime: 10_000 })

export const useCase = (id: string) => useQuery(caseQueryOptions(id))
