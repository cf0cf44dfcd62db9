/** GET /api/evidence/:id/analysis — a processed spectrum file's summary, display trace and spectrogram. */
import { useQuery } from '@tanstack/react-query'
import { evidenceAnalysisResponseSchema, type EvidenceAnalysisView } from '@shared/schemas/spectrum'
import { api } from '@/lib/api-client'
import { caseKeys } from '@/lib/query-keys'

export type Analysis = EvidenceAnalysisView

export const analysisPath = (evidenceId: string) => `/api/evidence/${encodeURIComponent(evidenceId)}/analysis`

export const getAnalysis = (evidenceId: string, signal?: AbortSignal) => api.read(evidenceAnalysisResponseSchema, analysisPath(evidenceId), signal)

/** A file's analysis; `evidenceId` null reads nothing (no second file picked). */
export const useAnalysis = (evidenceId: string | null) =>
  useQuery({
    queryKey: caseKeys.analysis(evidenceId ?? ''),
    queryFn: ({ signal }) => getAnalysis(evidenceId!, signal),
    enabled: evidenceId !== null,
    // an analysis that is done does not change
    staleTime: Infinity,
  })
