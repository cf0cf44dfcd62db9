/** GET /api/band-limits/:id/history — an entry's changes, newest first. */
import { queryOptions, useQuery } from '@tanstack/react-query'
import { bandLimitHistoryResponseSchema } from '@shared/schemas/views'
import { api } from '@/lib/api-client'
import { bandLimitKeys } from '@/lib/query-keys'

export const getBandLimitHistory = (bandLimitId: string, signal?: AbortSignal) =>
  api.read(bandLimitHistoryResponseSchema, `/api/band-limits/${encodeURIComponent(bandLimitId)}/history`, signal)

export const bandLimitHistoryQueryOptions = (bandLimitId: string) =>
  queryOptions({ queryKey: bandLimitKeys.history(bandLimitId), queryFn: ({ signal }) => getBandLimitHistory(bandLimitId, signal) })

/** Loaded only once the history is opened (`enabled`). */
export const useBandLimitHistory = (bandLimitId: string, enabled: boolean) => useQuery({ ...bandLimitHistoryQueryOptions(bandLimitId), enabled })
