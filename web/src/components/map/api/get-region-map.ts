/** The public region map (GET /api/region): basemap, outline, coast, place names, offices' points and areas. */
import { useQuery } from '@tanstack/react-query'
import type { RegionMap } from '@shared/schemas/region'
import { api } from '@/lib/api-client'
import { regionKeys } from '@/lib/query-keys'

export const getRegionMap = (signal?: AbortSignal): Promise<RegionMap> => api.get<RegionMap>('/api/region', signal)

export function useRegionMap() {
  return useQuery({ queryKey: regionKeys.map(), queryFn: ({ signal }) => getRegionMap(signal), staleTime: 5 * 60_000 })
}
