/** POST /api/cases/:id/tracking-links/revoke — every private tracking link of the case stops working. */
import { useMutation, useQueryClient } from '@tanstack/react-query'
import type { RevokeTrackingLinksInput, TrackingLinksRevokedResponse } from '@shared/schemas/people'
import { api } from '@/lib/api-client'
import { caseKeys } from '@/lib/query-keys'

export const revokeTrackingLinks = (caseId: string, input: RevokeTrackingLinksInput) =>
  api.post<TrackingLinksRevokedResponse>(`/api/cases/${encodeURIComponent(caseId)}/tracking-links/revoke`, input)

export function useRevokeTrackingLinks(caseId: string) {
  const queryClient = useQueryClient()
  return useMutation({
    mutationFn: (input: RevokeTrackingLinksInput) => revokeTrackingLinks(caseId, input),
    // the timeline gains the entry
    onSuccess: () => queryClient.invalidateQueries({ queryKey: caseKeys.detail(caseId) }),
  })
}
