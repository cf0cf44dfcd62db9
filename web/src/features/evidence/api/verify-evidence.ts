/** POST /api/evidence/:id/verify — the server reads the stored file again and compares its SHA-256 with the one taken at intake. */
import { useMutation, useQueryClient } from '@tanstack/react-query'
import type { z } from 'zod'
import type { verifyEvidenceResponseSchema } from '@shared/schemas/evidence'
import { api } from '@/lib/api-client'
import { caseKeys } from '@/lib/query-keys'

export type VerifyAnswer = z.infer<typeof verifyEvidenceResponseSchema>

export const verifyEvidence = (evidenceId: string) => api.post<VerifyAnswer>(`/api/evidence/${encodeURIComponent(evidenceId)}/verify`)

export function useVerifyEvidence(caseId: string) {
  const queryClient = useQueryClient()
  return useMutation({
    mutationFn: verifyEvidence,
    onSuccess: (_a, evidenceId) =>
      Promise.all([queryClient.invalidateQueries({ queryKey: caseKeys.evidence(caseId) }), queryClient.invalidateQueries({ queryKey: caseKeys.custody(evidenceId) })]),
  })
}
