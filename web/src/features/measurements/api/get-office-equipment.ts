/** GET /api/offices/:id/equipment — the office's register, to choose the antenna and instrument from. */
import { queryOptions, useQuery } from '@tanstack/react-query'
import { equipmentListResponseSchema } from '@shared/schemas/measurements'
import { api } from '@/lib/api-client'
import { equipmentKeys } from '@/lib/query-keys'

export const officeEquipmentQueryOptions = (officeId: string) =>
  queryOptions({
    queryKey: equipmentKeys.list(officeId),
    queryFn: ({ signal }) => api.read(equipmentListResponseSchema, `/api/offices/${encodeURIComponent(officeId)}/equipment`, signal),
    staleTime: 60_000,
  })

/** Loaded once the form opens (`enabled`). */
export const useOfficeEquipment = (officeId: string, enabled: boolean) => useQuery({ ...officeEquipmentQueryOptions(officeId), enabled })
