/**
 * POST /api/cases/:id/propose-finding — Proposes a structured finding for the supervisor's
 * review (assigned investigator). Answered with the case as it now stands; the case's
 * findings are refreshed.
 */
import { useMutation, useQueryClient } from '@tanstack/react-query'
import type { ProposeFindingInput } from '@shared/schemas/findings'
import { caseKeys } from '@/lib/query-keys'
import { postCaseAction } from './case-move'

export type ProposeFindingBody = ProposeFindingInput

export const proposeFinding = (caseId: string, body: ProposeFindingBody) => postCaseAction(caseId, 'propose-finding', body)

export function useProposeFinding(caseId: string) {
  const queryClient = useQueryClient()
  return useMutation({
    mutationFn: (body: ProposeFindingBody) => proposeFinding(caseId, body),
    onSuccess: (updated) => {
      queryClient.setQueryData(caseKeys.detail(caseId), updated)
      void queryClient.invalidateQueries({ queryKey: caseKeys.lists() })
      void queryClient.invalidateQueries({ queryKey: caseKeys.findings(caseId) })
    },
  })
}
