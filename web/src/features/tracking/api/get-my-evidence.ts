/**
 * GET /api/track/:token/evidence or /api/my/reports/:id/evidence — the files the complainant
 * put on their report (POST to the same path adds one, through the shared uploader) and the
 * files the office shared with them (GET …/evidence/:evidenceId/download).
 */
import { queryOptions, useQuery } from '@tanstack/react-query'
import { evidenceListResponseSchema } from '@shared/schemas/evidence'
import { api } from '@/lib/api-client'
import { trackingKeys } from '@/lib/query-keys'
import { reportBasePath, type ReportSource } from './get-complainant-report'

export const myEvidencePath = (source: ReportSource) => `${reportBasePath(source)}/evidence`

/** A file the office shared with the complainant, streamed through the server (each download is in its custody log). */
export const sharedEvidenceDownloadPath = (source: ReportSource, evidenceId: string) => `${myEvidencePath(source)}/${encodeURIComponent(evidenceId)}/download`

export const myEvidenceKey = (source: ReportSource) => trackingKeys.evidence(source.kind, source.kind === 'token' ? source.token : source.id)

export const myEvidenceQueryOptions = (source: ReportSource) =>
  queryOptions({ queryKey: myEvidenceKey(source), queryFn: ({ signal }) => api.read(evidenceListResponseSchema, myEvidencePath(source), signal) })

export const useMyEvidence = (source: ReportSource) => useQuery(myEvidenceQueryOptions(source))
