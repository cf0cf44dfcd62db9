/** The public region map (GET /api/region): basemap, outline, coast, place names, offices' points and areas. */
import { useQuery } from '@tanstack/react-query'
import type { RegionMap } from '@shared/schemas/region'
import { apiRequest } from '@/lib/api-client'
import { regionKeys } from '@/lib/query-keys'

/**
 * The answer may be kept by the browser for five minutes (server: REGION_MAP_MAX_AGE_S); `fresh`
 * asks the server again (a cheap ETag check), as after an administrator changed an area.
 */
export const getRegionMap = (signal?: AbortSignal, opts: { fresh?: boolean } = {}): Promise<RegionMap> =>
  apiRequest<RegionMap>({ path: '/api/region', signal, ...(opts.fresh ? { cache: 'no-cache' as const } : {}) })

export function useRegionMap() {
  return useQuery({ queryKey: regionKeys.map(), queryFn: ({ signal }) => getRegionMap(signal), staleTime: 5 * 60_000 })
}
