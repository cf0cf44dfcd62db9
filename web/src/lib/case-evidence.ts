/**
 * GET /api/cases/:id/evidence read where a case's files are offered for linking (the finding
 * form, the measurement form), outside the evidence feature. The same cache entry as the
 * evidence section's list (one key), so an upload or a removal shows in every picker.
 */
import { queryOptions, useQuery } from '@tanstack/react-query'
import { evidenceListResponseSchema, type EvidenceView } from '@shared/schemas/evidence'
import { api } from '@/lib/api-client'
import { caseKeys } from '@/lib/query-keys'

export type CaseEvidenceFile = EvidenceView

export const caseEvidenceQueryOptions = (caseId: string) =>
  queryOptions({
    queryKey: caseKeys.evidence(caseId),
    queryFn: ({ signal }) => api.read(evidenceListResponseSchema, `/api/cases/${encodeURIComponent(caseId)}/evidence`, signal),
  })

export const useCaseEvidence = (caseId: string) => useQuery(caseEvidenceQueryOptions(caseId))

/** The files a record may link: those not removed from the case. */
export const linkableEvidence = (files: readonly CaseEvidenceFile[] | undefined) => (files ?? []).filter((f) => f.removed === null)

/** The first 12 hexadecimal digits of a SHA-256, as files are told apart on screen. */
export const shortHash = (sha256: string) => sha256.slice(0, 12)
