/** GET /api/cases/:id/investigators — the office's active investigators with their open cases, lightest first. */
import { queryOptions, useQuery } from '@tanstack/react-query'
import { api } from '@/lib/api-client'
import { caseKeys } from '@/lib/query-keys'
import type { InvestigatorLoad } from '@shared/schemas/views'
export type { InvestigatorLoad }

export const getInvestigators = (caseId: string, signal?: AbortSignal) =>
  api.get<{ investigators: InvestigatorLoad[] }>(`/api/cases/${encodeURIComponent(caseId)}/investigators`, signal).then((r) => r.investigators)

export const investigatorsQueryOptions = (caseId: string) =>
  queryOptions({ queryKey: caseKeys.investigators(caseId), queryFn: ({ signal }) => getInvestigators(caseId, signal), staleTime: 0 })

export const useInvestigators = (caseId: string) => useQuery(investigatorsQueryOptions(caseId))
