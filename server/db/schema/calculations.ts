import { sql } from 'drizzle-orm'
import { check, index, jsonb, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core'
import { CALCULATION_KINDS, type CalculationRun, type Json } from '../../../shared/calculations/kinds'
import type { MethodRef } from '../../../shared/radio/types'
import { cases } from './cases'
import { sqlList } from './sql-list'
import { users } from './users'

/**
 * Calculations kept as records: each run of a calculation kind (shared/calculations) on a
 * case, with its inputs as read (base units, named in their keys), the outputs the server
 * computed, warnings, the method of every step, the library version, and copies of every
 * reference it used. Append-only (make_append_only in the migration): re-running adds a record;
 * `at` is the database's time and the author comes from the session.
 */
export const calculations = pgTable(
  'calculations',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    caseId: uuid('case_id').notNull().references(() => cases.id),
    kind: text('kind', { enum: CALCULATION_KINDS }).notNull(),
    inputs: jsonb('inputs').$type<Record<string, Json>>().notNull(),
    outputs: jsonb('outputs').$type<CalculationRun['outputs']>().notNull(),
    warnings: jsonb('warnings').$type<string[]>().notNull(),
    methods: jsonb('methods').$type<MethodRef[]>().notNull(),
    libraryVersion: text('library_version').notNull(),
    authorUserId: uuid('author_user_id').notNull().references(() => users.id),
    at: timestamp('at', { withTimezone: true }).notNull().defaultNow(),
    /** Copies of every reference used (a band-limit entry, later a licence row or a calibration). */
    referenceCopies: jsonb('reference_copies').$type<Record<string, Json>>().notNull().default(sql`'{}'::jsonb`),
    /** Measurements and evidence the calculation used (for the records that come later). */
    measurementIds: jsonb('measurement_ids').$type<string[]>().notNull().default(sql`'[]'::jsonb`),
    evidenceIds: jsonb('evidence_ids').$type<string[]>().notNull().default(sql`'[]'::jsonb`),
  },
  (t) => [
    check('calculations_kind_valid', sql`${t.kind} in ${sqlList(CALCULATION_KINDS)}`),
    check('calculations_inputs_object', sql`jsonb_typeof(${t.inputs}) = 'object' and jsonb_typeof(${t.outputs}) = 'object' and jsonb_typeof(${t.referenceCopies}) = 'object'`),
    check(
      'calculations_lists_arrays',
      sql`jsonb_typeof(${t.warnings}) = 'array' and jsonb_typeof(${t.methods}) = 'array' and jsonb_typeof(${t.measurementIds}) = 'array' and jsonb_typeof(${t.evidenceIds}) = 'array'`,
    ),
    check('calculations_library_version_semver', sql`${t.libraryVersion} ~ '^[0-9]+\\.[0-9]+\\.[0-9]+$'`),
    index('calculations_case_idx').on(t.caseId, t.at),
  ],
)

export type CalculationRow = typeof calculations.$inferSelect
