/** PATCH /api/band-limits/:id — changes, a reason and the version they were made on. */
import { useMutation, useQueryClient } from '@tanstack/react-query'
import type { BandLimitPatch } from '@shared/schemas/band-limits'
import { api } from '@/lib/api-client'
import { bandLimitKeys } from '@/lib/query-keys'
import type { BandLimit } from './get-band-limits'

export const reviseBandLimit = (options: { bandLimitId: string; patch: BandLimitPatch }) =>
  api.patch<{ bandLimit: BandLimit }>(`/api/band-limits/${encodeURIComponent(options.bandLimitId)}`, options.patch)

export function useReviseBandLimit() {
  const queryClient = useQueryClient()
  return useMutation({
    mutationFn: reviseBandLimit,
    // the list and the entry's history both change
    onSuccess: () => queryClient.invalidateQueries({ queryKey: bandLimitKeys.all }),
  })
}
