/** POST /api/follow-ups/:id/{confirm,escalate,reopen} — one move of a follow-up. */
import { useMutation, useQueryClient } from '@tanstack/react-query'
import type { FollowUpMoveName } from '@shared/domain/follow-ups'
import type { FollowUpMoveInput, FollowUpView } from '@shared/schemas/follow-ups'
import { api } from '@/lib/api-client'
import { caseKeys, enforcementKeys } from '@/lib/query-keys'

export const moveFollowUp = (followUpId: string, move: FollowUpMoveName, body: FollowUpMoveInput) =>
  api.post<{ followUp: FollowUpView }>(`/api/follow-ups/${encodeURIComponent(followUpId)}/${move}`, body)

export function useMoveFollowUp(caseId: string) {
  const client = useQueryClient()
  return useMutation({
    mutationFn: (v: { id: string; move: FollowUpMoveName; body: FollowUpMoveInput }) => moveFollowUp(v.id, v.move, v.body),
    onSettled: () => {
      // a refusal (stale version) also shows the latest state
      void client.invalidateQueries({ queryKey: enforcementKeys.followUps(caseId) })
      void client.invalidateQueries({ queryKey: enforcementKeys.due() })
      void client.invalidateQueries({ queryKey: caseKeys.detail(caseId) })
    },
  })
}
