/**
 * The field offices to plot on the map. GET /api/offices answers staff and administrators
 * only, so the public (and complainants) never ask; nothing about offices is built in.
 */
import { useQuery } from '@tanstack/react-query'
import type { Role } from '../../../../../shared/domain/roles'
import { api } from '../../../lib/api-client'
import type { MapOffice } from '../components/region-map'

interface OfficeRow {
  id: string
  name: string
  centreLatDeg: number
  centreLonDeg: number
}

export const getMapOffices = async (signal?: AbortSignal): Promise<MapOffice[]> => {
  const { offices } = await api.get<{ offices: OfficeRow[] }>('/api/offices', signal)
  return offices.map((o) => ({ id: o.id, name: o.name, latDeg: o.centreLatDeg, lonDeg: o.centreLonDeg }))
}

const NO_OFFICES: MapOffice[] = []

export function useOfficesForMap(role: Role | null): MapOffice[] {
  const canList = role === 'investigator' || role === 'supervisor' || role === 'admin'
  const q = useQuery({ queryKey: ['offices', 'map'], queryFn: ({ signal }) => getMapOffices(signal), enabled: canList, staleTime: 5 * 60_000 })
  return q.data ?? NO_OFFICES
}
