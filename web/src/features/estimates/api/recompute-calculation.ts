/** GET /api/calculations/:id/recompute — a stored record run again with the current library, beside what it stored. */
import { useQuery } from '@tanstack/react-query'
import { recomputeResponseSchema } from '@shared/schemas/views'
import { api } from '@/lib/api-client'
import { caseKeys } from '@/lib/query-keys'

export const recomputeCalculation = (calculationId: string, signal?: AbortSignal) =>
  api.read(recomputeResponseSchema, `/api/calculations/${encodeURIComponent(calculationId)}/recompute`, signal)

/** Asked only when the person asks (enabled), and asked afresh each time. */
export const useRecompute = (calculationId: string, enabled: boolean) =>
  useQuery({ queryKey: caseKeys.recompute(calculationId), queryFn: ({ signal }) => recomputeCalculation(calculationId, signal), enabled, staleTime: 0, gcTime: 0 })
