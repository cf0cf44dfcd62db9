/** POST /api/evidence/:id/remove {reason} — the supervisor takes a file off the case; it stays stored, with the reason, in the custody log. */
import { useMutation, useQueryClient } from '@tanstack/react-query'
import { api } from '@/lib/api-client'
import { caseKeys } from '@/lib/query-keys'

export const removeEvidence = (v: { evidenceId: string; reason: string }) => api.post<unknown>(`/api/evidence/${encodeURIComponent(v.evidenceId)}/remove`, { reason: v.reason })

export function useRemoveEvidence(caseId: string) {
  const queryClient = useQueryClient()
  return useMutation({
    mutationFn: removeEvidence,
    onSuccess: (_a, v) =>
      Promise.all([queryClient.invalidateQueries({ queryKey: caseKeys.evidence(caseId) }), queryClient.invalidateQueries({ queryKey: caseKeys.custody(v.evidenceId) })]),
  })
}
