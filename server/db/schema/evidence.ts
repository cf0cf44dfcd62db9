import { sql } from 'drizzle-orm'
import { bigserial, boolean, check, index, jsonb, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core'
import { CUSTODY_ACTIONS, EVIDENCE_KINDS, EVIDENCE_UPLOADER_ROLES, VERIFICATION_OUTCOMES, type EvidenceProcessing } from '../../../shared/domain/evidence'
import { cases } from './cases'
import { sqlList } from './sql-list'
import { storedFiles } from './stored-files'
import { users } from './users'

/**
 * Evidence files on a case: each row points at one stored file (server/storage) and says what
 * it is, who put it there, and whether it was removed (a soft delete: the object and the row
 * stay; removal, verification and processing are the only changes a row sees).
 */
export const evidenceFiles = pgTable(
  'evidence_files',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    caseId: uuid('case_id').notNull().references(() => cases.id),
    storedFileId: uuid('stored_file_id').notNull().unique().references(() => storedFiles.id),
    kind: text('kind', { enum: EVIDENCE_KINDS }).notNull(),
    uploaderRole: text('uploader_role', { enum: EVIDENCE_UPLOADER_ROLES }).notNull(),
    /** The staff member or signed-in complainant; null for a complainant using the tracking link. */
    uploaderUserId: uuid('uploader_user_id').references(() => users.id),
    /** The name shown and offered on download: cleaned of path separators and control characters, at most 255 characters. */
    displayName: text('display_name').notNull(),
    /** The name exactly as the uploader's computer sent it, JSON-escaped (control characters and broken characters kept visible, never interpreted). */
    submittedNameJson: text('submitted_name_json').notNull(),
    /** Whether the complainant sees the file (their own uploads). */
    sharedWithComplainant: boolean('shared_with_complainant').notNull().default(false),
    uploadedAt: timestamp('uploaded_at', { withTimezone: true }).notNull().defaultNow(),
    removedAt: timestamp('removed_at', { withTimezone: true }),
    removedBy: uuid('removed_by').references(() => users.id),
    removedReason: text('removed_reason'),
    /** When the retention run deleted the file's object from the store (the row stays). */
    disposedAt: timestamp('disposed_at', { withTimezone: true }),
    verifiedAt: timestamp('verified_at', { withTimezone: true }),
    verifiedBy: uuid('verified_by').references(() => users.id),
    verificationOutcome: text('verification_outcome', { enum: VERIFICATION_OUTCOMES }),
    /** Background processing (the processing job updates it). */
    processing: jsonb('processing').$type<EvidenceProcessing>().notNull().default(sql`'{"state":"none","progress":0}'::jsonb`),
  },
  (t) => [
    check('evidence_files_kind_valid', sql`${t.kind} in ${sqlList(EVIDENCE_KINDS)}`),
    check('evidence_files_uploader_role_valid', sql`${t.uploaderRole} in ${sqlList(EVIDENCE_UPLOADER_ROLES)}`),
    check('evidence_files_staff_has_user', sql`${t.uploaderRole} = 'complainant' or ${t.uploaderUserId} is not null`),
    check('evidence_files_removed_complete', sql`(${t.removedAt} is null) = (${t.removedBy} is null) and (${t.removedAt} is null) = (${t.removedReason} is null)`),
    check(
      'evidence_files_verification_complete',
      sql`(${t.verifiedAt} is null) = (${t.verificationOutcome} is null) and (${t.verificationOutcome} is null or ${t.verificationOutcome} in ${sqlList(VERIFICATION_OUTCOMES)})`,
    ),
    check('evidence_files_processing_object', sql`jsonb_typeof(${t.processing}) = 'object'`),
    index('evidence_files_case_idx').on(t.caseId, t.uploadedAt),
  ],
)

export type EvidenceFileRow = typeof evidenceFiles.$inferSelect
export type NewEvidenceFile = typeof evidenceFiles.$inferInsert

/**
 * The chain of custody of each evidence file: who uploaded, downloaded, verified, removed or
 * bundled it, when (the database's time) and from which address. Append-only
 * (make_append_only in the migration).
 */
export const evidenceCustody = pgTable(
  'evidence_custody',
  {
    id: bigserial('id', { mode: 'number' }).primaryKey(),
    evidenceId: uuid('evidence_id').notNull().references(() => evidenceFiles.id),
    at: timestamp('at', { withTimezone: true }).notNull().defaultNow(),
    actorUserId: uuid('actor_user_id').references(() => users.id),
    /** A staff name, 'Complainant', or 'Quietband' for automatic steps. */
    actorLabel: text('actor_label').notNull(),
    action: text('action', { enum: CUSTODY_ACTIONS }).notNull(),
    /** The client's address as the server saw it. */
    clientAddress: text('client_address'),
    detail: text('detail'),
  },
  (t) => [check('evidence_custody_action_valid', sql`${t.action} in ${sqlList(CUSTODY_ACTIONS)}`), index('evidence_custody_evidence_idx').on(t.evidenceId, t.at)],
)

export type EvidenceCustodyRow = typeof evidenceCustody.$inferSelect
export type NewEvidenceCustody = typeof evidenceCustody.$inferInsert
