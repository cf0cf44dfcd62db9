/** GET /api/equipment/:id/history — an item's changes, newest first. */
import { queryOptions, useQuery } from '@tanstack/react-query'
import { equipmentHistoryResponseSchema } from '@shared/schemas/measurements'
import { api } from '@/lib/api-client'
import { equipmentKeys } from '@/lib/query-keys'

export const getEquipmentHistory = (equipmentId: string, signal?: AbortSignal) =>
  api.read(equipmentHistoryResponseSchema, `/api/equipment/${encodeURIComponent(equipmentId)}/history`, signal)

export const equipmentHistoryQueryOptions = (equipmentId: string) =>
  queryOptions({ queryKey: equipmentKeys.history(equipmentId), queryFn: ({ signal }) => getEquipmentHistory(equipmentId, signal) })

/** Loaded only once the history is opened. */
export const useEquipmentHistory = (equipmentId: string, enabled: boolean) => useQuery({ ...equipmentHistoryQueryOptions(equipmentId), enabled })
