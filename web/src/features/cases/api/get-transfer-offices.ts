/** GET /api/cases/:id/transfer-offices — the other offices, nearest to the report's location first. */
import { useQuery } from '@tanstack/react-query'
import { api } from '../../../lib/api-client'

export interface OfficeChoice {
  id: string
  name: string
  /** Geodesic distance from the report's location to the office [m]. */
  distanceM: number
}

export const getTransferOffices = (caseId: string, signal?: AbortSignal) =>
  api.get<{ offices: OfficeChoice[] }>(`/api/cases/${caseId}/transfer-offices`, signal).then((r) => r.offices)

/** Offices the case may go to; fetched only when the transfer move is possible. */
export function useTransferOffices(caseId: string, enabled: boolean) {
  const q = useQuery({ queryKey: ['cases', caseId, 'transfer-offices'], queryFn: ({ signal }) => getTransferOffices(caseId, signal), enabled, staleTime: 5 * 60_000 })
  return { ...q, destinations: q.data ?? [] }
}
