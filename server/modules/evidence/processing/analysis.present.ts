import type { EvidenceAnalysisView } from '../../../../shared/schemas/spectrum'
import type { EvidenceAnalysisRow } from '../../../db/schema'

/** A file's analysis as the API answers it; a file never queued answers state 'none'. */
export function presentAnalysis(evidenceId: string, row: EvidenceAnalysisRow | undefined): EvidenceAnalysisView {
  if (!row) return { evidenceId, state: 'none', progress: 0, message: null, libraryVersion: null, summary: null, displayTrace: null, spectrogram: null, updatedAt: null }
  return {
    evidenceId,
    state: row.state,
    progress: row.progress,
    message: row.message,
    libraryVersion: row.libraryVersion,
    summary: row.summary,
    displayTrace: row.displayTrace,
    spectrogram: row.spectrogram,
    updatedAt: row.updatedAt.toISOString(),
  }
}
