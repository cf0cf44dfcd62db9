/** GET /api/evidence/:id/custody — one file's chain of custody, read when its log is opened. */
import { queryOptions, useQuery } from '@tanstack/react-query'
import { custodyListResponseSchema } from '@shared/schemas/evidence'
import { api } from '@/lib/api-client'
import { caseKeys } from '@/lib/query-keys'

export const getCustody = (evidenceId: string, signal?: AbortSignal) =>
  api.read(custodyListResponseSchema, `/api/evidence/${encodeURIComponent(evidenceId)}/custody`, signal)

export const custodyQueryOptions = (evidenceId: string) => queryOptions({ queryKey: caseKeys.custody(evidenceId), queryFn: ({ signal }) => getCustody(evidenceId, signal) })

export const useCustody = (evidenceId: string, enabled: boolean) => useQuery({ ...custodyQueryOptions(evidenceId), enabled })
