/** GET /api/cases/:id/follow-ups — the case's follow-ups with where each stands on the office's today. */
import { queryOptions, useQuery } from '@tanstack/react-query'
import { caseFollowUpsResponseSchema, type CaseFollowUpsResponse, type FollowUpView } from '@shared/schemas/follow-ups'
import { api } from '@/lib/api-client'
import { enforcementKeys } from '@/lib/query-keys'
export type { CaseFollowUpsResponse, FollowUpView }

export const getCaseFollowUps = (caseId: string, signal?: AbortSignal) =>
  api.read(caseFollowUpsResponseSchema, `/api/cases/${encodeURIComponent(caseId)}/follow-ups`, signal)

export const caseFollowUpsQueryOptions = (caseId: string) =>
  queryOptions({ queryKey: enforcementKeys.followUps(caseId), queryFn: ({ signal }) => getCaseFollowUps(caseId, signal) })

export const useCaseFollowUps = (caseId: string) => useQuery(caseFollowUpsQueryOptions(caseId))
