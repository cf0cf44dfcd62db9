/** GET /api/cases/:id/nearby-cases — the office's other open cases within 10 km of the case, nearest first (for the case map). */
import { queryOptions, useQuery } from '@tanstack/react-query'
import { nearbyCasesResponseSchema } from '@shared/schemas/nearby-cases'
import { api } from '@/lib/api-client'
import { caseKeys } from '@/lib/query-keys'

export const getNearbyCases = (caseId: string, signal?: AbortSignal) =>
  api.read(nearbyCasesResponseSchema, `/api/cases/${encodeURIComponent(caseId)}/nearby-cases`, signal)

export const nearbyCasesQueryOptions = (caseId: string) =>
  queryOptions({ queryKey: caseKeys.nearbyCases(caseId), queryFn: ({ signal }) => getNearbyCases(caseId, signal) })

/** Asks only while `enabled` (the map is open), so a folded map costs no request. */
export const useNearbyCases = (caseId: string, { enabled }: { enabled: boolean }) => useQuery({ ...nearbyCasesQueryOptions(caseId), enabled })
