/** POST /api/cases/:id/calculations — the server computes the estimate and stores the record. */
import { useMutation, useQueryClient } from '@tanstack/react-query'
import { calculationResponseSchema, type CalculationView } from '@shared/schemas/views'
import { api } from '@/lib/api-client'
import { caseKeys } from '@/lib/query-keys'
import type { EstimateRequest } from '../lib/run-estimate'

export async function storeCalculation(options: { caseId: string; request: EstimateRequest }): Promise<CalculationView> {
  const body = await api.post<unknown>(`/api/cases/${encodeURIComponent(options.caseId)}/calculations`, options.request)
  return calculationResponseSchema.parse(body).calculation
}

export function useStoreCalculation(caseId: string) {
  const queryClient = useQueryClient()
  return useMutation({
    mutationFn: (request: EstimateRequest) => storeCalculation({ caseId, request }),
    // the list shows the new record; the timeline has its entry
    onSuccess: () => Promise.all([queryClient.invalidateQueries({ queryKey: caseKeys.calculations(caseId) }), queryClient.invalidateQueries({ queryKey: caseKeys.detail(caseId) })]),
  })
}
