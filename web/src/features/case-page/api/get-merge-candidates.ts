/** GET /api/cases/:id/merge-candidates — nearby open cases on an overlapping frequency, nearest first. */
import { queryOptions, useQuery } from '@tanstack/react-query'
import { api } from '@/lib/api-client'
import { caseKeys } from '@/lib/query-keys'
import type { MergeCandidate } from '@shared/schemas/views'
export type { MergeCandidate }

export const getMergeCandidates = (caseId: string, signal?: AbortSignal) =>
  api.get<{ candidates: MergeCandidate[] }>(`/api/cases/${encodeURIComponent(caseId)}/merge-candidates`, signal).then((r) => r.candidates)

export const mergeCandidatesQueryOptions = (caseId: string) =>
  queryOptions({ queryKey: caseKeys.mergeCandidates(caseId), queryFn: ({ signal }) => getMergeCandidates(caseId, signal), staleTime: 0 })

export const useMergeCandidates = (caseId: string) => useQuery(mergeCandidatesQueryOptions(caseId))
