/** GET /api/offices — staff see their own office; an administrator sees all. */
import { queryOptions, useQuery } from '@tanstack/react-query'
import { api } from '../../../lib/api-client'

export interface Office {
  id: string
  name: string
  regionName: string
  centreLatDeg: number
  centreLonDeg: number
  /** Response target per priority, in hours. */
  responseTargetsHours: { p1: number; p2: number; p3: number; p4: number }
  /** What the viewer may do with this office, decided by the server. */
  abilities: { setResponseTargets: boolean }
}

export const getOffices = (signal?: AbortSignal) => api.get<{ offices: Office[] }>('/api/offices', signal)

export const officesQueryOptions = () =>
  queryOptions({ queryKey: ['offices'], queryFn: ({ signal }) => getOffices(signal), staleTime: 5 * 60_000 })

export const useOffices = () => useQuery(officesQueryOptions())
