import { sql } from 'drizzle-orm'
import { check, date, doublePrecision, index, jsonb, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core'
import { RECOMMENDED_ACTIONS } from '../../../shared/domain/findings'
import { cases } from './cases'
import { sqlList } from './sql-list'
import { users } from './users'

/**
 * Findings as records: each proposal by the investigator is a new row (append-only,
 * make_append_only in the migration); the case's current finding is its latest row. `at` is
 * the database's time and the author comes from the session. The authorised station is a
 * free id for now (no foreign key); the calculations are checked to be the same case's by the
 * service that writes the row.
 */
export const findings = pgTable(
  'findings',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    caseId: uuid('case_id').notNull().references(() => cases.id),
    authorUserId: uuid('author_user_id').notNull().references(() => users.id),
    at: timestamp('at', { withTimezone: true }).notNull().defaultNow(),
    sourceDescription: text('source_description').notNull(),
    sourceLatDeg: doublePrecision('source_lat_deg'),
    sourceLonDeg: doublePrecision('source_lon_deg'),
    /** The operator or licensee of the source, when known. */
    operator: text('operator'),
    authorisedStationId: uuid('authorised_station_id'),
    calculationIds: jsonb('calculation_ids').$type<string[]>().notNull(),
    evidenceIds: jsonb('evidence_ids').$type<string[]>().notNull().default(sql`'[]'::jsonb`),
    recommendedAction: text('recommended_action', { enum: RECOMMENDED_ACTIONS }).notNull(),
    complianceDeadline: date('compliance_deadline'),
    summary: text('summary').notNull(),
  },
  (t) => [
    check('findings_recommended_action_valid', sql`${t.recommendedAction} in ${sqlList(RECOMMENDED_ACTIONS)}`),
    check(
      'findings_source_position',
      sql`(${t.sourceLatDeg} is null and ${t.sourceLonDeg} is null) or (${t.sourceLatDeg} between -90 and 90 and ${t.sourceLonDeg} between -180 and 180)`,
    ),
    check('findings_lists_arrays', sql`jsonb_typeof(${t.calculationIds}) = 'array' and jsonb_typeof(${t.evidenceIds}) = 'array'`),
    index('findings_case_idx').on(t.caseId, t.at),
  ],
)

export type FindingRow = typeof findings.$inferSelect
