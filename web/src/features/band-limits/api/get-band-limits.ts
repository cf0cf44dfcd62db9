/** GET /api/band-limits — the national band-limit list (every member of staff). */
import { queryOptions, useQuery } from '@tanstack/react-query'
import { bandLimitsResponseSchema, type BandLimitView } from '@shared/schemas/views'
import { api } from '@/lib/api-client'
import { bandLimitKeys } from '@/lib/query-keys'

export type BandLimit = BandLimitView

export const getBandLimits = (signal?: AbortSignal) => api.read(bandLimitsResponseSchema, '/api/band-limits', signal)

export const bandLimitsQueryOptions = () => queryOptions({ queryKey: bandLimitKeys.list(), queryFn: ({ signal }) => getBandLimits(signal), staleTime: 60_000 })

export const useBandLimits = () => useQuery(bandLimitsQueryOptions())
