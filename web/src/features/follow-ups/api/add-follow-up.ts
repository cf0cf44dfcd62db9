/** POST /api/cases/:id/follow-ups — staff add a follow-up (a deadline not before the office's today). */
import { useMutation, useQueryClient } from '@tanstack/react-query'
import type { FollowUpInput, FollowUpView } from '@shared/schemas/follow-ups'
import { api } from '@/lib/api-client'
import { caseKeys, enforcementKeys } from '@/lib/query-keys'

export const addFollowUp = (caseId: string, body: FollowUpInput) => api.post<{ followUp: FollowUpView }>(`/api/cases/${encodeURIComponent(caseId)}/follow-ups`, body)

export function useAddFollowUp(caseId: string) {
  const client = useQueryClient()
  return useMutation({
    mutationFn: (body: FollowUpInput) => addFollowUp(caseId, body),
    onSuccess: () => {
      void client.invalidateQueries({ queryKey: enforcementKeys.followUps(caseId) })
      void client.invalidateQueries({ queryKey: enforcementKeys.due() })
      void client.invalidateQueries({ queryKey: caseKeys.detail(caseId) })
    },
  })
}
