/** GET /api/cases/:id/evidence — a case's evidence files; polled while one is being processed. */
import { queryOptions, useQuery } from '@tanstack/react-query'
import { evidenceListResponseSchema, type EvidenceView } from '@shared/schemas/evidence'
import { api } from '@/lib/api-client'
import { caseKeys } from '@/lib/query-keys'

export type Evidence = EvidenceView

export const evidencePath = (caseId: string) => `/api/cases/${encodeURIComponent(caseId)}/evidence`

export const getEvidence = (caseId: string, signal?: AbortSignal) => api.read(evidenceListResponseSchema, evidencePath(caseId), signal)

/** True while a file waits for or is in its processing job, or a photo waits for its thumbnail. */
export const anyProcessing = (list: Evidence[] | undefined) =>
  (list ?? []).some((e) => e.processing.state === 'queued' || e.processing.state === 'running' || e.thumbnail?.state === 'pending')

/** How often the list is read again while something is processing [ms]. */
export const PROCESSING_POLL_MS = 2000

export const evidenceQueryOptions = (caseId: string) =>
  queryOptions({
    queryKey: caseKeys.evidence(caseId),
    queryFn: ({ signal }) => getEvidence(caseId, signal),
    refetchInterval: (query) => (anyProcessing(query.state.data?.evidence) ? PROCESSING_POLL_MS : false),
  })

export const useEvidence = (caseId: string) => useQuery(evidenceQueryOptions(caseId))
