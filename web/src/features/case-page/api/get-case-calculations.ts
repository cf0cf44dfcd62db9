/** GET /api/cases/:id/calculations — the case's stored calculation records (to link to a finding). */
import { queryOptions, useQuery } from '@tanstack/react-query'
import type { CalculationView } from '@shared/schemas/views'
import { api } from '@/lib/api-client'
import { caseKeys } from '@/lib/query-keys'
export type { CalculationView }

export const getCaseCalculations = (caseId: string, signal?: AbortSignal) =>
  api.get<{ calculations: CalculationView[] }>(`/api/cases/${encodeURIComponent(caseId)}/calculations`, signal).then((r) => r.calculations)

export const caseCalculationsQueryOptions = (caseId: string) =>
  queryOptions({ queryKey: caseKeys.calculations(caseId), queryFn: ({ signal }) => getCaseCalculations(caseId, signal), staleTime: 10_000 })

export const useCaseCalculations = (caseId: string) => useQuery(caseCalculationsQueryOptions(caseId))
