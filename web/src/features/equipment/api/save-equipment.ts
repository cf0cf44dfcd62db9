/**
 * POST /api/offices/:id/equipment — a new item; PATCH /api/equipment/:id — an item as it should
 * become, on the version the editor saw (409 stale_version otherwise).
 */
import { useMutation, useQueryClient } from '@tanstack/react-query'
import type { EquipmentContentInput, EquipmentView } from '@shared/schemas/measurements'
import { api } from '@/lib/api-client'
import { equipmentKeys } from '@/lib/query-keys'

export type SaveEquipment =
  | { kind: 'add'; officeId: string; item: EquipmentContentInput }
  | { kind: 'revise'; equipmentId: string; version: number; item: EquipmentContentInput; reason?: string }

export const saveEquipment = (s: SaveEquipment) =>
  s.kind === 'add'
    ? api.post<{ item: EquipmentView }>(`/api/offices/${encodeURIComponent(s.officeId)}/equipment`, { item: s.item })
    : api.patch<{ item: EquipmentView }>(`/api/equipment/${encodeURIComponent(s.equipmentId)}`, { item: s.item, version: s.version, reason: s.reason })

export function useSaveEquipment() {
  const queryClient = useQueryClient()
  return useMutation({
    mutationFn: saveEquipment,
    // the list and the item's history both change
    onSuccess: () => queryClient.invalidateQueries({ queryKey: equipmentKeys.all }),
  })
}
