/** The queries of evidence analyses (the processing job's state and results). */
import { eq, sql } from 'drizzle-orm'
import type { DisplayTraceView, SpectrogramView, SpectrumSummary } from '../../../../shared/schemas/spectrum'
import type { Db } from '../../../db/client'
import { evidenceAnalyses, evidenceFiles, type EvidenceAnalysisRow } from '../../../db/schema'

/** Mirrors the state onto the file's own row (`evidence_files.processing`), which the file lists show. */
async function mirror(db: Db, evidenceId: string, state: EvidenceAnalysisRow['state'], progress: number, message?: string): Promise<void> {
  await db
    .update(evidenceFiles)
    .set({ processing: message === undefined ? { state, progress } : { state, progress, message } })
    .where(eq(evidenceFiles.id, evidenceId))
}

/** Starts (or restarts) the analysis of a file: queued, no results. */
export async function markAnalysisQueued(db: Db, evidenceId: string): Promise<void> {
  const fresh = { state: 'queued' as const, progress: 0, message: null, summary: null, displayTrace: null, spectrogram: null, libraryVersion: null, startedAt: null, finishedAt: null }
  await db
    .insert(evidenceAnalyses)
    .values({ evidenceId, ...fresh })
    .onConflictDoUpdate({ target: evidenceAnalyses.evidenceId, set: { ...fresh, queuedAt: sql`now()`, updatedAt: sql`now()` } })
  await mirror(db, evidenceId, 'queued', 0)
}

export async function markAnalysisRunning(db: Db, evidenceId: string): Promise<void> {
  await db
    .insert(evidenceAnalyses)
    .values({ evidenceId, state: 'running', progress: 0, startedAt: sql`now()` })
    .onConflictDoUpdate({ target: evidenceAnalyses.evidenceId, set: { state: 'running', progress: 0, message: null, startedAt: sql`now()`, updatedAt: sql`now()` } })
  await mirror(db, evidenceId, 'running', 0)
}

export async function recordAnalysisProgress(db: Db, evidenceId: string, progress: number): Promise<void> {
  await db.update(evidenceAnalyses).set({ progress, updatedAt: sql`now()` }).where(eq(evidenceAnalyses.evidenceId, evidenceId))
  await mirror(db, evidenceId, 'running', progress)
}

export async function recordAnalysisDone(
  db: Db,
  evidenceId: string,
  r: { summary: SpectrumSummary; displayTrace: DisplayTraceView; spectrogram: SpectrogramView | null; libraryVersion: string },
): Promise<void> {
  await db
    .update(evidenceAnalyses)
    .set({ state: 'done', progress: 1, message: null, ...r, finishedAt: sql`now()`, updatedAt: sql`now()` })
    .where(eq(evidenceAnalyses.evidenceId, evidenceId))
  await mirror(db, evidenceId, 'done', 1)
}

export async function recordAnalysisFailed(db: Db, evidenceId: string, message: string, libraryVersion: string): Promise<void> {
  await db
    .update(evidenceAnalyses)
    .set({ state: 'failed', message, libraryVersion, summary: null, displayTrace: null, spectrogram: null, finishedAt: sql`now()`, updatedAt: sql`now()` })
    .where(eq(evidenceAnalyses.evidenceId, evidenceId))
  const [row] = await db.select({ progress: evidenceAnalyses.progress }).from(evidenceAnalyses).where(eq(evidenceAnalyses.evidenceId, evidenceId))
  await mirror(db, evidenceId, 'failed', row?.progress ?? 0, message)
}

export async function findAnalysis(db: Db, evidenceId: string): Promise<EvidenceAnalysisRow | undefined> {
  const [row] = await db.select().from(evidenceAnalyses).where(eq(evidenceAnalyses.evidenceId, evidenceId))
  return row
}
