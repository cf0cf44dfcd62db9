/** GET /api/offices/:id/equipment — an office's antennas and instruments (its staff; administrators). */
import { queryOptions, useQuery } from '@tanstack/react-query'
import { equipmentListResponseSchema } from '@shared/schemas/measurements'
import { api } from '@/lib/api-client'
import { equipmentKeys } from '@/lib/query-keys'

export const getEquipment = (officeId: string, signal?: AbortSignal) =>
  api.read(equipmentListResponseSchema, `/api/offices/${encodeURIComponent(officeId)}/equipment`, signal)

export const equipmentQueryOptions = (officeId: string) =>
  queryOptions({ queryKey: equipmentKeys.list(officeId), queryFn: ({ signal }) => getEquipment(officeId, signal), staleTime: 60_000 })

export const useEquipment = (officeId: string | null) => useQuery({ ...equipmentQueryOptions(officeId ?? ''), enabled: officeId !== null })
