import { sql } from 'drizzle-orm'
import {
  bigserial,
  check,
  date,
  doublePrecision,
  index,
  integer,
  jsonb,
  pgSequence,
  pgTable,
  text,
  timestamp,
  uuid,
  type AnyPgColumn,
} from 'drizzle-orm/pg-core'
import { CASE_STATES, RESOLUTIONS, TIMELINE_VISIBILITIES } from '../../../shared/domain/case-lifecycle'
import { CASE_CLOCKS } from '../../../shared/domain/case-clocks'
import { AFFECTED_SERVICES, EXPERIENCES, OCCURRENCE_PATTERNS, PRIORITIES, type Priority } from '../../../shared/domain/services'
import { offices } from './offices'
import { sqlList } from './sql-list'
import { users } from './users'

/** Yearly-looking but global sequence behind case references (QB-26-000123). */
export const caseReferenceSeq = pgSequence('case_reference_seq', { startWith: 1 })

/**
 * A case: born as a complainant's report ('received'), worked by an office, closed with a
 * resolution. States and moves live in shared/domain/case-lifecycle.ts; every change of
 * state bumps `version` (optimistic concurrency) and writes a case_events row.
 */
export const cases = pgTable(
  'cases',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    reference: text('reference').notNull().unique(),
    officeId: uuid('office_id').notNull().references(() => offices.id),
    status: text('status', { enum: CASE_STATES }).notNull().default('received'),
    /** Priority set (or confirmed) at triage; the suggested one until then. */
    priority: integer('priority').$type<Priority>().notNull(),
    suggestedPriority: integer('suggested_priority').$type<Priority>().notNull(),
    service: text('service', { enum: AFFECTED_SERVICES }).notNull(),
    licenceRef: text('licence_ref'),
    freqLowHz: doublePrecision('freq_low_hz').notNull(),
    freqHighHz: doublePrecision('freq_high_hz').notNull(),
    address: text('address').notNull(),
    latDeg: doublePrecision('lat_deg').notNull(),
    lonDeg: doublePrecision('lon_deg').notNull(),
    sinceDate: date('since_date').notNull(),
    pattern: text('pattern', { enum: OCCURRENCE_PATTERNS }).notNull(),
    patternDetail: text('pattern_detail'),
    experience: text('experience', { enum: EXPERIENCES }).notNull(),
    description: text('description').notNull(),
    complainantName: text('complainant_name').notNull(),
    complainantEmail: text('complainant_email').notNull(),
    complainantPhone: text('complainant_phone'),
    complainantOrganisation: text('complainant_organisation'),
    complainantUserId: uuid('complainant_user_id').references(() => users.id, { onDelete: 'set null' }),
    investigatorId: uuid('investigator_id').references(() => users.id),
    mergedIntoCaseId: uuid('merged_into_case_id').references((): AnyPgColumn => cases.id),
    resolution: text('resolution', { enum: RESOLUTIONS }),
    closingSummary: text('closing_summary'),
    receivedAt: timestamp('received_at', { withTimezone: true }).notNull().defaultNow(),
    /** Resolution target: received_at + the office's target hours for the priority. */
    dueAt: timestamp('due_at', { withTimezone: true }).notNull(),
    /** First-response target: received_at + the office's first-response hours for the priority. */
    firstResponseDueAt: timestamp('first_response_due_at', { withTimezone: true }).notNull(),
    /** The first response: the priority set at triage or a first message to the complainant, whichever came first. */
    firstRespondedAt: timestamp('first_responded_at', { withTimezone: true }),
    closedAt: timestamp('closed_at', { withTimezone: true }),
    /** When the retention run erased the complainant's personal data (modules/retention). */
    personalDataErasedAt: timestamp('personal_data_erased_at', { withTimezone: true }),
    version: integer('version').notNull().default(1),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
    searchText: text('search_text').generatedAlwaysAs(
      sql`lower(reference || ' ' || address || ' ' || complainant_name || ' ' || coalesce(complainant_organisation, '') || ' ' || coalesce(licence_ref, '') || ' ' || description)`,
    ),
  },
  (t) => [
    // the CHECKs list the same arrays as the column types (shared/domain)
    check('cases_status_valid', sql`${t.status} in ${sqlList(CASE_STATES)}`),
    check('cases_priority_valid', sql`${t.priority} in ${sqlList(PRIORITIES)} and ${t.suggestedPriority} in ${sqlList(PRIORITIES)}`),
    check('cases_service_valid', sql`${t.service} in ${sqlList(AFFECTED_SERVICES)}`),
    check('cases_pattern_valid', sql`${t.pattern} in ${sqlList(OCCURRENCE_PATTERNS)}`),
    check('cases_experience_valid', sql`${t.experience} in ${sqlList(EXPERIENCES)}`),
    check('cases_freq_valid', sql`${t.freqLowHz} > 0 and ${t.freqHighHz} >= ${t.freqLowHz}`),
    check('cases_lat_valid', sql`${t.latDeg} between -90 and 90 and ${t.lonDeg} between -180 and 180`),
    check(
      'cases_resolution_valid',
      sql`${t.resolution} is null or ${t.resolution} in ${sqlList(RESOLUTIONS)}`,
    ),
    check('cases_closed_has_resolution', sql`(${t.status} = 'closed') = (${t.resolution} is not null and ${t.closedAt} is not null)`),
    index('cases_office_status_idx').on(t.officeId, t.status),
    index('cases_office_received_idx').on(t.officeId, t.receivedAt),
    index('cases_office_due_idx').on(t.officeId, t.dueAt),
    index('cases_office_priority_received_idx').on(t.officeId, t.priority, t.receivedAt),
    index('cases_investigator_idx').on(t.investigatorId, t.status),
    // overdue (server/modules/cases/due.ts): the resolution clock runs and its due time has
    // passed; with the office, a supervisor's overdue count is an index-only scan too
    index('cases_due_open_idx').on(t.dueAt, t.officeId).where(sql`${t.status} not in ${sqlList(CASE_CLOCKS.resolution.stopsIn)}`),
    // first response overdue: its clock runs (not closed, no first response yet) and its due time has passed
    index('cases_first_response_open_idx').on(t.firstResponseDueAt, t.officeId).where(sql`${t.status} not in ${sqlList(CASE_CLOCKS.firstResponse.stopsIn)} and ${t.firstRespondedAt} is null`),
    // the dashboard's performance windows (closed / first answered in the last days), time first
    // so one office's window and every office's are both a range scan
    index('cases_closed_window_idx').on(t.closedAt, t.officeId).where(sql`${t.closedAt} is not null`),
    index('cases_responded_window_idx').on(t.firstRespondedAt, t.officeId).where(sql`${t.firstRespondedAt} is not null`),
    index('cases_complainant_user_idx').on(t.complainantUserId),
    index('cases_complainant_email_idx').on(t.complainantEmail),
    // the reports merged into a case (checked before closing it at triage and when it is merged)
    index('cases_merged_into_idx').on(t.mergedIntoCaseId).where(sql`${t.mergedIntoCaseId} is not null`),
    index('cases_search_trgm_idx').using('gin', sql`${t.searchText} gin_trgm_ops`),
    // The case list's sorts, each in its full order (with the id tie-breaker) and with the
    // office last: a supervisor's page and an admin's page are both index-only scans, so a
    // deep page (OFFSET 50,000) costs milliseconds and counts by service or "not overdue"
    // need no heap. Measured in ops/bench/RESULTS.md (100,000 cases).
    index('cases_list_reference_idx').on(t.reference, t.id, t.officeId),
    index('cases_list_received_idx').on(t.receivedAt, t.id, t.officeId),
    index('cases_list_priority_idx').on(t.priority, t.receivedAt, t.id, t.officeId),
    index('cases_list_due_idx').on(t.dueAt, t.id, t.status, t.officeId),
    index('cases_list_status_idx').on(t.status, t.receivedAt, t.id, t.officeId),
    index('cases_list_service_idx').on(t.service, t.receivedAt, t.id, t.officeId),
    index('cases_list_freq_idx').on(t.freqLowHz, t.freqHighHz, t.id, t.officeId),
  ],
)

export type CaseRow = typeof cases.$inferSelect

/**
 * The timeline: every move, note and message, append-only. A trigger created by the
 * migration refuses UPDATE and DELETE, so the record stands as evidence.
 */
export const caseEvents = pgTable(
  'case_events',
  {
    id: bigserial('id', { mode: 'number' }).primaryKey(),
    caseId: uuid('case_id').notNull().references(() => cases.id),
    at: timestamp('at', { withTimezone: true }).notNull().defaultNow(),
    actorUserId: uuid('actor_user_id').references(() => users.id),
    /** Who acted, as shown: a staff name, 'Complainant', or 'Quietband' for automatic steps. */
    actorLabel: text('actor_label').notNull(),
    kind: text('kind').notNull(),
    fromState: text('from_state', { enum: CASE_STATES }),
    toState: text('to_state', { enum: CASE_STATES }),
    /** Reason, note or message text. */
    body: text('body'),
    /** 'internal' (staff only) or 'complainant' (shown on the tracking page). */
    visibility: text('visibility', { enum: TIMELINE_VISIBILITIES }).notNull(),
    /** Structured details of the event (priority, investigator, office, merged case…). */
    data: jsonb('data').$type<Record<string, unknown>>(),
    /** When the retention run replaced `body` by a redacted copy (the one change this table allows). */
    redactedAt: timestamp('redacted_at', { withTimezone: true }),
  },
  (t) => [
    check('case_events_visibility_valid', sql`${t.visibility} in ${sqlList(TIMELINE_VISIBILITIES)}`),
    check('case_events_states_valid', sql`(${t.fromState} is null or ${t.fromState} in ${sqlList(CASE_STATES)}) and (${t.toState} is null or ${t.toState} in ${sqlList(CASE_STATES)})`),
    index('case_events_case_idx').on(t.caseId, t.id),
  ],
)

/** Private tracking links: only the SHA-256 hash of the token is stored. */
export const caseTrackingTokens = pgTable(
  'case_tracking_tokens',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    caseId: uuid('case_id').notNull().references(() => cases.id),
    tokenHash: text('token_hash').notNull().unique(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    revokedAt: timestamp('revoked_at', { withTimezone: true }),
  },
  (t) => [index('case_tracking_tokens_case_idx').on(t.caseId)],
)
