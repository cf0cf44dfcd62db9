/**
 * GET /api/cases/:id/calculations — the case's stored calculation records. The cache entry
 * (`caseKeys.calculations`) holds the list itself, as the case page's finding form reads it too.
 */
import { queryOptions, useQuery } from '@tanstack/react-query'
import { calculationsResponseSchema } from '@shared/schemas/views'
import { api } from '@/lib/api-client'
import { caseKeys } from '@/lib/query-keys'

export const getCalculations = (caseId: string, signal?: AbortSignal) =>
  api.read(calculationsResponseSchema, `/api/cases/${encodeURIComponent(caseId)}/calculations`, signal).then((r) => r.calculations)

export const calculationsQueryOptions = (caseId: string) =>
  queryOptions({ queryKey: caseKeys.calculations(caseId), queryFn: ({ signal }) => getCalculations(caseId, signal) })

export const useCalculations = (caseId: string) => useQuery(calculationsQueryOptions(caseId))
