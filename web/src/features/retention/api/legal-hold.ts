/** GET /api/cases/:id/legal-hold, POST …/legal-hold (set) and POST …/legal-hold/lift. */
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query'
import { legalHoldResponseSchema, type LegalHoldView, type LiftLegalHoldInput, type SetLegalHoldInput } from '@shared/schemas/retention'
import { api } from '@/lib/api-client'
import { caseKeys, retentionKeys } from '@/lib/query-keys'

const base = (caseId: string) => `/api/cases/${encodeURIComponent(caseId)}/legal-hold`

export const getLegalHold = (caseId: string, signal?: AbortSignal) => api.read(legalHoldResponseSchema, base(caseId), signal).then((r) => r.legalHold)

export const useLegalHold = (caseId: string) => useQuery({ queryKey: retentionKeys.legalHold(caseId), queryFn: ({ signal }) => getLegalHold(caseId, signal) })

function useHoldChange<I>(caseId: string, send: (input: I) => Promise<{ legalHold: LegalHoldView }>) {
  const queryClient = useQueryClient()
  return useMutation({
    mutationFn: send,
    onSuccess: ({ legalHold }) => {
      queryClient.setQueryData(retentionKeys.legalHold(caseId), legalHold)
      // the timeline gains the entry
      return queryClient.invalidateQueries({ queryKey: caseKeys.detail(caseId) })
    },
  })
}

export const useSetLegalHold = (caseId: string) => useHoldChange(caseId, (input: SetLegalHoldInput) => api.post<{ legalHold: LegalHoldView }>(base(caseId), input))
export const useLiftLegalHold = (caseId: string) => useHoldChange(caseId, (input: LiftLegalHoldInput) => api.post<{ legalHold: LegalHoldView }>(`${base(caseId)}/lift`, input))
