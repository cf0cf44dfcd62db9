/**
 * GET /api/cases/:id/evidence — the case's evidence files, offered as the copy or receipt of a
 * notice or reply (the same cache entry as the evidence list of the case page).
 */
import { queryOptions, useQuery } from '@tanstack/react-query'
import { evidenceListResponseSchema } from '@shared/schemas/evidence'
import { api } from '@/lib/api-client'
import { caseKeys } from '@/lib/query-keys'

export const getEvidenceChoices = (caseId: string, signal?: AbortSignal) =>
  api.read(evidenceListResponseSchema, `/api/cases/${encodeURIComponent(caseId)}/evidence`, signal)

export const evidenceChoicesQueryOptions = (caseId: string) =>
  queryOptions({ queryKey: caseKeys.evidence(caseId), queryFn: ({ signal }) => getEvidenceChoices(caseId, signal) })

export const useEvidenceChoices = (caseId: string) => useQuery(evidenceChoicesQueryOptions(caseId))
