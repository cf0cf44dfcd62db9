/**
 * POST /api/admin/offices (a new office) and PUT /api/admin/offices/:id (an office's details and
 * area, with the version read; 409 stale_version when someone saved since). Both answer the
 * office and the area's warnings (overlaps, a position outside the area): it is saved all the same.
 */
import { useMutation, useQueryClient } from '@tanstack/react-query'
import type { z } from 'zod'
import type { OfficeInput, OfficeUpdate, officeSavedResponseSchema } from '@shared/schemas/offices'
import { api } from '@/lib/api-client'
import { officeKeys, regionKeys } from '@/lib/query-keys'
import { getRegionMap } from '@/components/map/api/get-region-map'

export type OfficeSaved = z.infer<typeof officeSavedResponseSchema>

export const createOffice = (input: OfficeInput) => api.post<OfficeSaved>('/api/admin/offices', input)

export const updateOffice = (options: { officeId: string; update: OfficeUpdate }) =>
  api.put<OfficeSaved>(`/api/admin/offices/${encodeURIComponent(options.officeId)}`, options.update)

/** Saves a new office (no `officeId`) or an edit; the office list and the region map (which draws areas) refresh. */
export function useSaveOffice() {
  const queryClient = useQueryClient()
  return useMutation({
    mutationFn: (options: { officeId: string; update: OfficeUpdate } | { officeId: null; input: OfficeInput }) =>
      options.officeId === null ? createOffice(options.input) : updateOffice(options),
    // the region map may sit in the browser's HTTP cache: fetch it past that, so the new area shows at once
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: officeKeys.all }),
        queryClient.fetchQuery({ queryKey: regionKeys.map(), queryFn: ({ signal }) => getRegionMap(signal, { fresh: true }), staleTime: 0 }),
      ]),
  })
}
