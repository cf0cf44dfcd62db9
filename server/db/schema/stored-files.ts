import { sql } from 'drizzle-orm'
import { bigint, check, index, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core'
import { CONTENT_TYPE_SOURCES, STORED_FILE_PURPOSES } from '../../../shared/domain/stored-files'
import { sqlList } from './sql-list'
import { users } from './users'

/**
 * Files kept in the object store (server/storage/stored-files.ts). A row is written only after
 * its object is stored; an object key is never used twice. Append-only (make_append_only in
 * the migration): what was stored, by whom and when is a record. One exception, for retention:
 * the retention run replaces an evidence file's original name (which can name a person) by
 * `erased-<sha256 prefix>.<ext>`, once, through the SECURITY DEFINER function
 * quietband_erase_stored_file_name (its migration); the app role still has no UPDATE.
 */
export const storedFiles = pgTable(
  'stored_files',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    /** The object's key in the bucket (uuid-based, never reused). */
    objectKey: text('object_key').notNull().unique(),
    /** The file's name as the uploader's computer gave it. */
    originalName: text('original_name').notNull(),
    sizeBytes: bigint('size_bytes', { mode: 'number' }).notNull(),
    /** Lowercase hex SHA-256 of the stored bytes, computed while they streamed in. */
    sha256: text('sha256').notNull(),
    contentType: text('content_type').notNull(),
    contentTypeSource: text('content_type_source', { enum: CONTENT_TYPE_SOURCES }).notNull(),
    purpose: text('purpose', { enum: STORED_FILE_PURPOSES }).notNull(),
    /** The staff member or signed-in person; null for a complainant using a case's tracking link. */
    uploadedBy: uuid('uploaded_by').references(() => users.id),
    uploadedAt: timestamp('uploaded_at', { withTimezone: true }).notNull().defaultNow(),
    /** When the retention run replaced original_name by a marker (modules/retention). */
    nameErasedAt: timestamp('name_erased_at', { withTimezone: true }),
  },
  (t) => [
    check('stored_files_sha256_hex', sql`${t.sha256} ~ '^[0-9a-f]{64}$'`),
    check('stored_files_size_nonnegative', sql`${t.sizeBytes} >= 0`),
    check('stored_files_purpose_valid', sql`${t.purpose} in ${sqlList(STORED_FILE_PURPOSES)}`),
    check('stored_files_content_type_source_valid', sql`${t.contentTypeSource} in ${sqlList(CONTENT_TYPE_SOURCES)}`),
    index('stored_files_purpose_idx').on(t.purpose, t.uploadedAt),
  ],
)

export type StoredFileRow = typeof storedFiles.$inferSelect
export type NewStoredFile = typeof storedFiles.$inferInsert
