import { sql } from 'drizzle-orm'
import { check, integer, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core'
import { THUMBNAIL_STATES } from '../../../shared/domain/evidence'
import { evidenceFiles } from './evidence'
import { sqlList } from './sql-list'

/**
 * The thumbnail of an image evidence file (server/modules/evidence/thumbnails): made by a job
 * after upload and kept in the object store under a key derived from the evidence object's
 * (`thumbnails/<evidence key>.webp`), never over it. Kept here rather than as a stored_files
 * row: stored_files is the append-only record of what people uploaded (hashed at intake, in
 * the chain of custody), and a thumbnail is a rendition the server can make again at any
 * time, replaced when it is; the `thumbnails/` prefix is outside the evidence orphan sweep.
 * A refusal (a decompression bomb, a broken image) is a row with its reason.
 */
export const evidenceThumbnails = pgTable(
  'evidence_thumbnails',
  {
    evidenceId: uuid('evidence_id')
      .primaryKey()
      .references(() => evidenceFiles.id),
    state: text('state', { enum: THUMBNAIL_STATES }).notNull(),
    objectKey: text('object_key'),
    contentType: text('content_type'),
    widthPx: integer('width_px').$type<number>(),
    heightPx: integer('height_px').$type<number>(),
    sizeBytes: integer('size_bytes').$type<number>(),
    /** Why no thumbnail could be made, in words a person can act on. */
    message: text('message'),
    madeAt: timestamp('made_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    check('evidence_thumbnails_state_valid', sql`${t.state} in ${sqlList(THUMBNAIL_STATES)}`),
    check(
      'evidence_thumbnails_done_complete',
      sql`${t.state} <> 'done' or (${t.objectKey} is not null and ${t.contentType} is not null and ${t.widthPx} > 0 and ${t.heightPx} > 0 and ${t.sizeBytes} > 0)`,
    ),
    check('evidence_thumbnails_failed_has_message', sql`${t.state} <> 'failed' or ${t.message} is not null`),
  ],
)

export type EvidenceThumbnailRow = typeof evidenceThumbnails.$inferSelect
export type NewEvidenceThumbnail = typeof evidenceThumbnails.$inferInsert
