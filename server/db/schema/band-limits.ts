import { sql } from 'drizzle-orm'
import { bigserial, boolean, check, index, integer, jsonb, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core'
import type { BandLimitContent, FrequencyBandHz } from '../../../shared/schemas/band-limits'
import type { LimitSpec } from '../../../shared/radio/compliance/limit-spec'
import { users } from './users'

/**
 * The national band-limit list: one row per limit, seeded from the radio library's
 * BAND_LIMITS (its `id` is `key` here, stable because findings cite it) and edited by
 * supervisors and administrators. Every edit bumps `version` (optimistic concurrency) and
 * writes a band_limit_changes row in the same transaction.
 */
export const bandLimits = pgTable(
  'band_limits',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    /** The library entry's stable id (e.g. `en300328-2g4-eirp`): never renamed. */
    key: text('key').notNull().unique(),
    title: text('title').notNull(),
    /** Frequency ranges the limit covers, inclusive edges [Hz]. */
    bandsHz: jsonb('bands_hz').$type<FrequencyBandHz[]>().notNull(),
    /** The limit as written (the library's LimitSpec: EIRP, ERP, densities, conducted with a gain rule, lesser-of). */
    spec: jsonb('spec').$type<LimitSpec>().notNull(),
    citation: text('citation').notNull(),
    /** False for values recalled but not checked against the regulation's text (the library's [M]). */
    verified: boolean('verified').notNull(),
    /** What exactly is verified and what is not. */
    statusNote: text('status_note').notNull(),
    /** Conditions that go with the limit (duty cycle, TPC, indoor use…). */
    conditions: text('conditions'),
    version: integer('version').notNull().default(1),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
    /** Who made the last change; null while the row is as seeded. */
    updatedBy: uuid('updated_by').references(() => users.id),
  },
  (t) => [
    check('band_limits_bands_listed', sql`jsonb_typeof(${t.bandsHz}) = 'array' and jsonb_array_length(${t.bandsHz}) > 0`),
    check('band_limits_spec_kind', sql`jsonb_typeof(${t.spec}) = 'object' and ${t.spec} ? 'kind'`),
    check('band_limits_version_positive', sql`${t.version} >= 1`),
  ],
)

/**
 * The history of band-limit edits, append-only (make_append_only in the migration): who, when,
 * why, and the changed fields before and after. `version` is the row's version the change made.
 */
export const bandLimitChanges = pgTable(
  'band_limit_changes',
  {
    id: bigserial('id', { mode: 'number' }).primaryKey(),
    bandLimitId: uuid('band_limit_id')
      .notNull()
      .references(() => bandLimits.id),
    changedAt: timestamp('changed_at', { withTimezone: true }).notNull().defaultNow(),
    changedBy: uuid('changed_by')
      .notNull()
      .references(() => users.id),
    reason: text('reason').notNull(),
    version: integer('version').notNull(),
    /** The changed fields as they were. */
    before: jsonb('before').$type<Partial<BandLimitContent>>().notNull(),
    /** The changed fields as they became. */
    after: jsonb('after').$type<Partial<BandLimitContent>>().notNull(),
  },
  (t) => [index('band_limit_changes_limit_idx').on(t.bandLimitId, t.changedAt)],
)

export type BandLimitRow = typeof bandLimits.$inferSelect
export type NewBandLimit = typeof bandLimits.$inferInsert
export type BandLimitChangeRow = typeof bandLimitChanges.$inferSelect
