import { sql } from 'drizzle-orm'
import { bigserial, check, date, index, jsonb, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core'
import { DISPOSAL_ACTIONS, DISPOSAL_STAGES, LEGAL_HOLD_ACTIONS, RETENTION_ACTIONS, type ErasedCaseField, type RetentionActionDetails } from '../../../shared/domain/retention'
import { cases } from './cases'
import { evidenceFiles } from './evidence'
import { sqlList } from './sql-list'
import { users } from './users'

/**
 * A case's legal holds: each set and lift, who did it, why and (when set) until which day.
 * The hold in force is the case's latest row when that is a 'set' whose day has not passed.
 * Append-only (make_append_only in the migration).
 */
export const legalHoldEvents = pgTable(
  'legal_hold_events',
  {
    id: bigserial('id', { mode: 'number' }).primaryKey(),
    caseId: uuid('case_id').notNull().references(() => cases.id),
    at: timestamp('at', { withTimezone: true }).notNull().defaultNow(),
    action: text('action', { enum: LEGAL_HOLD_ACTIONS }).notNull(),
    actorUserId: uuid('actor_user_id').notNull().references(() => users.id),
    reason: text('reason').notNull(),
    /** The hold's last day (inclusive); none: until lifted. Only on 'set'. */
    untilDate: date('until_date'),
  },
  (t) => [
    check('legal_hold_events_action_valid', sql`${t.action} in ${sqlList(LEGAL_HOLD_ACTIONS)}`),
    check('legal_hold_events_until_on_set', sql`${t.action} = 'set' or ${t.untilDate} is null`),
    index('legal_hold_events_case_idx').on(t.caseId, t.id),
  ],
)
export type LegalHoldEventRow = typeof legalHoldEvents.$inferSelect

/**
 * What the retention run erased or disposed of: one row per case erased, per kind of related
 * erasure (merge entries, position, file names, queued e-mails, account) and per object deleted
 * from the store (its key, and for an evidence file its SHA-256, kept as the record of what
 * went). An object's deletion is recorded twice: 'pending' in the transaction that decides it,
 * 'done' after the store has deleted it (rows from before stages existed have none: they were
 * written after the deletion). Append-only.
 */
export const retentionActions = pgTable(
  'retention_actions',
  {
    id: bigserial('id', { mode: 'number' }).primaryKey(),
    at: timestamp('at', { withTimezone: true }).notNull().defaultNow(),
    caseId: uuid('case_id').notNull().references(() => cases.id),
    action: text('action', { enum: RETENTION_ACTIONS }).notNull(),
    /** The case fields erased (personal_data_erased). */
    fields: jsonb('fields').$type<ErasedCaseField[]>(),
    /** Timeline entries whose text was replaced by a redacted copy (personal_data_erased). */
    redactedEventIds: jsonb('redacted_event_ids').$type<number[]>(),
    evidenceId: uuid('evidence_id').references(() => evidenceFiles.id),
    objectKey: text('object_key'),
    sha256: text('sha256'),
    /** An object's deletion: 'pending' (decided and committed) or 'done' (gone from the store). */
    stage: text('stage', { enum: DISPOSAL_STAGES }),
    /** What the other kinds erased (see RetentionActionDetails). */
    details: jsonb('details').$type<RetentionActionDetails>(),
  },
  (t) => [
    check('retention_actions_action_valid', sql`${t.action} in ${sqlList(RETENTION_ACTIONS)}`),
    check(
      'retention_actions_complete',
      sql`(${t.action} = 'personal_data_erased' and ${t.fields} is not null and ${t.evidenceId} is null)
        or (${t.action} = 'evidence_disposed' and ${t.evidenceId} is not null and ${t.objectKey} is not null and ${t.sha256} ~ '^[0-9a-f]{64}$')
        or (${t.action} = 'thumbnail_disposed' and ${t.evidenceId} is not null and ${t.objectKey} is not null and ${t.stage} is not null)
        or (${t.action} = 'merge_entries_redacted' and ${t.redactedEventIds} is not null)
        or (${t.action} in ('location_coarsened', 'file_names_erased', 'queued_mail_cancelled', 'account_deactivated') and ${t.details} is not null)`,
    ),
    check('retention_actions_stage_valid', sql`${t.stage} is null or (${t.stage} in ${sqlList(DISPOSAL_STAGES)} and ${t.action} in ${sqlList(DISPOSAL_ACTIONS)})`),
    index('retention_actions_case_idx').on(t.caseId, t.id),
    index('retention_actions_object_idx').on(t.objectKey),
  ],
)
export type RetentionActionRow = typeof retentionActions.$inferSelect
