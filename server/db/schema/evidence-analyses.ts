import { sql } from 'drizzle-orm'
import { check, doublePrecision, jsonb, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core'
import { EVIDENCE_PROCESSING_STATES } from '../../../shared/domain/evidence'
import type { DisplayTraceView, SpectrogramView, SpectrumSummary } from '../../../shared/schemas/spectrum'
import { evidenceFiles } from './evidence'
import { sqlList } from './sql-list'

/**
 * The analysis of a spectrum evidence file (server/modules/evidence/processing): one row per
 * file, written by the processing job as it goes (state, progress), then its results or the
 * reason it failed. A new run replaces the previous one; the library version says which
 * methods produced the numbers.
 */
export const evidenceAnalyses = pgTable(
  'evidence_analyses',
  {
    evidenceId: uuid('evidence_id')
      .primaryKey()
      .references(() => evidenceFiles.id),
    state: text('state', { enum: EVIDENCE_PROCESSING_STATES }).notNull(),
    /** 0 to 1. */
    progress: doublePrecision('progress').$type<number>().notNull().default(0),
    /** Why it failed, in words a person can act on. */
    message: text('message'),
    libraryVersion: text('library_version'),
    summary: jsonb('summary').$type<SpectrumSummary>(),
    displayTrace: jsonb('display_trace').$type<DisplayTraceView>(),
    spectrogram: jsonb('spectrogram').$type<SpectrogramView>(),
    queuedAt: timestamp('queued_at', { withTimezone: true }).notNull().defaultNow(),
    startedAt: timestamp('started_at', { withTimezone: true }),
    finishedAt: timestamp('finished_at', { withTimezone: true }),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    check('evidence_analyses_state_valid', sql`${t.state} in ${sqlList(EVIDENCE_PROCESSING_STATES)}`),
    check('evidence_analyses_progress_range', sql`${t.progress} >= 0 and ${t.progress} <= 1`),
    check('evidence_analyses_failed_has_message', sql`${t.state} <> 'failed' or ${t.message} is not null`),
  ],
)

export type EvidenceAnalysisRow = typeof evidenceAnalyses.$inferSelect
