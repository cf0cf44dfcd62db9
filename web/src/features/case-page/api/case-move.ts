/**
 * The shape every case move shares: POST /api/cases/:id/<move> with the case's version,
 * answered with the case as it now stands. The answer replaces the cached case, and the
 * lists are refreshed. One file per move builds on this.
 */
import { useMutation, useQueryClient } from '@tanstack/react-query'
import { api } from '@/lib/api-client'
import { caseKeys } from '@/lib/query-keys'
import type { CaseDetail } from './get-case'

export const postCaseAction = <B>(caseId: string, path: string, body: B) =>
  api.post<{ case: CaseDetail }>(`/api/cases/${encodeURIComponent(caseId)}/${path}`, body).then((r) => r.case)

export function useCaseAction<B>(caseId: string, path: string) {
  const queryClient = useQueryClient()
  return useMutation({
    mutationFn: (body: B) => postCaseAction(caseId, path, body),
    onSuccess: (updated) => {
      queryClient.setQueryData(caseKeys.detail(caseId), updated)
      void queryClient.invalidateQueries({ queryKey: caseKeys.lists() })
    },
  })
}
