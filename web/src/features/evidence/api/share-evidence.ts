/**
 * POST /api/evidence/:id/share {shared} — staff share an office file with the complainant, or
 * stop sharing it; each change is in the file's custody log.
 */
import { useMutation, useQueryClient } from '@tanstack/react-query'
import type { EvidenceView } from '@shared/schemas/evidence'
import { api } from '@/lib/api-client'
import { caseKeys } from '@/lib/query-keys'

export const shareEvidence = (v: { evidenceId: string; shared: boolean }) =>
  api.post<{ evidence: EvidenceView }>(`/api/evidence/${encodeURIComponent(v.evidenceId)}/share`, { shared: v.shared })

export function useShareEvidence(caseId: string) {
  const queryClient = useQueryClient()
  return useMutation({
    mutationFn: shareEvidence,
    onSuccess: (_a, v) =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: caseKeys.evidence(caseId) }),
        queryClient.invalidateQueries({ queryKey: caseKeys.custody(v.evidenceId) }),
        queryClient.invalidateQueries({ queryKey: caseKeys.detail(caseId) }),
      ]),
  })
}
