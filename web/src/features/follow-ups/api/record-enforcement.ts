/**
 * POST /api/cases/:id/responsible-party, /notices, /party-replies — each answers the case's
 * refreshed party record, which replaces the cached one.
 */
import { useMutation, useQueryClient } from '@tanstack/react-query'
import type { NoticeInput, ReplyInput, ResponsiblePartyInput, ResponsiblePartyResponse } from '@shared/schemas/follow-ups'
import { api } from '@/lib/api-client'
import { caseKeys, enforcementKeys } from '@/lib/query-keys'

type Kind = 'responsible-party' | 'notices' | 'party-replies'
type BodyOf<K extends Kind> = K extends 'responsible-party' ? ResponsiblePartyInput : K extends 'notices' ? NoticeInput : ReplyInput

export const recordEnforcement = <K extends Kind>(caseId: string, kind: K, body: BodyOf<K>) =>
  api.post<ResponsiblePartyResponse>(`/api/cases/${encodeURIComponent(caseId)}/${kind}`, body)

export function useRecordEnforcement<K extends Kind>(caseId: string, kind: K) {
  const client = useQueryClient()
  return useMutation({
    mutationFn: (body: BodyOf<K>) => recordEnforcement(caseId, kind, body),
    onSuccess: (answer) => {
      client.setQueryData(enforcementKeys.party(caseId), answer)
      // the timeline gains an entry
      void client.invalidateQueries({ queryKey: caseKeys.detail(caseId) })
    },
  })
}
