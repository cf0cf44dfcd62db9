import { sql } from 'drizzle-orm'
import { check, date, index, integer, pgTable, primaryKey, text, timestamp, unique, uuid } from 'drizzle-orm/pg-core'
import { FOLLOW_UP_SOURCES, FOLLOW_UP_STATES, NOTICE_METHODS } from '../../../shared/domain/follow-ups'
import { cases } from './cases'
import { evidenceFiles } from './evidence'
import { findings } from './findings'
import { offices } from './offices'
import { sqlList } from './sql-list'
import { users } from './users'

/**
 * The party responsible for the source on a case, as versioned records: each edit is a new row
 * with the next version (append-only, make_append_only in the migration), so every earlier
 * name and contact stays readable; the current party is the highest version.
 */
export const responsibleParties = pgTable(
  'responsible_parties',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    caseId: uuid('case_id').notNull().references(() => cases.id),
    version: integer('version').notNull(),
    name: text('name').notNull(),
    address: text('address'),
    email: text('email'),
    phone: text('phone'),
    recordedAt: timestamp('recorded_at', { withTimezone: true }).notNull().defaultNow(),
    recordedBy: uuid('recorded_by').notNull().references(() => users.id),
  },
  (t) => [unique('responsible_parties_case_version').on(t.caseId, t.version), check('responsible_parties_version_positive', sql`${t.version} > 0`)],
)
export type ResponsiblePartyRow = typeof responsibleParties.$inferSelect

/** Notices served on the responsible party: proof of notice (append-only). */
export const partyNotices = pgTable(
  'party_notices',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    caseId: uuid('case_id').notNull().references(() => cases.id),
    /** The day the notice was served (as the person who served it reports it). */
    servedOn: date('served_on').notNull(),
    method: text('method', { enum: NOTICE_METHODS }).notNull(),
    /** What "other" was; required for it, absent otherwise. */
    methodOther: text('method_other'),
    /** Who served it, as named (an officer of the office, a courier…). */
    servedBy: text('served_by').notNull(),
    reference: text('reference'),
    summary: text('summary').notNull(),
    /** A copy or receipt among the same case's evidence files. */
    evidenceId: uuid('evidence_id').references(() => evidenceFiles.id),
    recordedAt: timestamp('recorded_at', { withTimezone: true }).notNull().defaultNow(),
    recordedBy: uuid('recorded_by').notNull().references(() => users.id),
  },
  (t) => [
    check('party_notices_method_valid', sql`${t.method} in ${sqlList(NOTICE_METHODS)}`),
    check('party_notices_other_described', sql`(${t.method} = 'other') = (${t.methodOther} is not null)`),
    index('party_notices_case_idx').on(t.caseId, t.recordedAt),
  ],
)
export type PartyNoticeRow = typeof partyNotices.$inferSelect

/** The responsible party's replies (append-only). */
export const partyReplies = pgTable(
  'party_replies',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    caseId: uuid('case_id').notNull().references(() => cases.id),
    noticeId: uuid('notice_id').references(() => partyNotices.id),
    receivedOn: date('received_on').notNull(),
    summary: text('summary').notNull(),
    evidenceId: uuid('evidence_id').references(() => evidenceFiles.id),
    recordedAt: timestamp('recorded_at', { withTimezone: true }).notNull().defaultNow(),
    recordedBy: uuid('recorded_by').notNull().references(() => users.id),
  },
  (t) => [index('party_replies_case_idx').on(t.caseId, t.recordedAt)],
)
export type PartyReplyRow = typeof partyReplies.$inferSelect

/**
 * Follow-ups: what the responsible party must do by a day of the office's calendar. Its state
 * changes only through the follow-up moves (confirm, escalate, reopen), each with a timeline
 * entry in the same transaction and an optimistic version check.
 */
export const followUps = pgTable(
  'follow_ups',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    caseId: uuid('case_id').notNull().references(() => cases.id),
    dueOn: date('due_on').notNull(),
    expected: text('expected').notNull(),
    source: text('source', { enum: FOLLOW_UP_SOURCES }).notNull(),
    findingId: uuid('finding_id').references(() => findings.id),
    state: text('state', { enum: FOLLOW_UP_STATES }).notNull().default('open'),
    version: integer('version').notNull().default(1),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    createdBy: uuid('created_by').references(() => users.id),
    /** The last move's note and time (the full history is on the case's timeline). */
    lastNote: text('last_note'),
    changedAt: timestamp('changed_at', { withTimezone: true }),
  },
  (t) => [
    check('follow_ups_state_valid', sql`${t.state} in ${sqlList(FOLLOW_UP_STATES)}`),
    check('follow_ups_source_valid', sql`${t.source} in ${sqlList(FOLLOW_UP_SOURCES)}`),
    check('follow_ups_finding_source', sql`(${t.source} = 'finding') = (${t.findingId} is not null)`),
    // one follow-up per approved finding, whoever approves it twice
    unique('follow_ups_finding_once').on(t.findingId),
    index('follow_ups_open_due_idx').on(t.dueOn).where(sql`${t.state} = 'open'`),
    index('follow_ups_case_idx').on(t.caseId),
  ],
)
export type FollowUpRow = typeof followUps.$inferSelect

/**
 * The office digest sent for a local day: written in the transaction that queues the e-mails,
 * so a second run (another process, a restart) finds the row and sends nothing (append-only).
 * A day with nothing late or due is recorded with no recipients (0) and no e-mail.
 */
export const digestSends = pgTable(
  'digest_sends',
  {
    officeId: uuid('office_id').notNull().references(() => offices.id),
    localDay: date('local_day').notNull(),
    recipients: integer('recipients').notNull(),
    sentAt: timestamp('sent_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [primaryKey({ columns: [t.officeId, t.localDay] })],
)
