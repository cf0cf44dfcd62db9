/** GET /api/station-register/stations — a page of the register in force (or of one version), searched. */
import { keepPreviousData, useQuery } from '@tanstack/react-query'
import { stationsPageResponseSchema, type StationView } from '@shared/schemas/stations'
import { api } from '@/lib/api-client'
import { stationRegisterKeys } from '@/lib/query-keys'

export type Station = StationView
export interface StationSearchState {
  q?: string
  /** A frequency as typed, with its unit ("446.1 MHz"); the server reads it strictly. */
  freq?: string
  page?: number
  version?: number
}

export function stationsPath(s: StationSearchState): string {
  const p = new URLSearchParams()
  if (s.q) p.set('q', s.q)
  if (s.freq) p.set('freq', s.freq)
  if (s.page && s.page > 1) p.set('page', String(s.page))
  if (s.version) p.set('version', String(s.version))
  const qs = p.toString()
  return `/api/station-register/stations${qs ? `?${qs}` : ''}`
}

export const useStations = (s: StationSearchState) =>
  useQuery({
    queryKey: stationRegisterKeys.stations(s),
    queryFn: ({ signal }) => api.read(stationsPageResponseSchema, stationsPath(s), signal),
    placeholderData: keepPreviousData,
    staleTime: 60_000,
  })
