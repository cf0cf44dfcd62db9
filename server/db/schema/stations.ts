import { sql } from 'drizzle-orm'
import { check, date, doublePrecision, index, integer, jsonb, pgTable, text, timestamp, unique, uuid } from 'drizzle-orm/pg-core'
import { CSV_DELIMITERS } from '../../../shared/domain/station-register'
import type { LimitSpec } from '../../../shared/radio/compliance/limit-spec'
import type { ColumnMappingFields, RowProblems } from '../../../shared/schemas/stations'
import { sqlList } from './sql-list'
import { storedFiles } from './stored-files'
import { users } from './users'

/**
 * The licence register, one for the whole regulator, versioned: each import of a register CSV
 * is a new version (the newest is in force) with the file it came from, the mapping used and
 * its report. Append-only (make_append_only in the migration).
 */
export const stationRegisterVersions = pgTable(
  'station_register_versions',
  {
    version: integer('version').primaryKey(),
    importedAt: timestamp('imported_at', { withTimezone: true }).notNull().defaultNow(),
    importedBy: uuid('imported_by')
      .notNull()
      .references(() => users.id),
    storedFileId: uuid('stored_file_id')
      .notNull()
      .references(() => storedFiles.id),
    fileName: text('file_name').notNull(),
    sha256: text('sha256').notNull(),
    delimiter: text('delimiter', { enum: CSV_DELIMITERS }).notNull(),
    acceptedCount: integer('accepted_count').notNull(),
    rejectedCount: integer('rejected_count').notNull(),
    /** The column mapping the import used (fields → column and unit). */
    columnMapping: jsonb('column_mapping').$type<{ fields: ColumnMappingFields }>().notNull(),
    /** The rejected rows by line with every problem (at most MAX_REPORTED_ROWS of them). */
    rejectedRows: jsonb('rejected_rows').$type<RowProblems[]>().notNull(),
  },
  (t) => [
    check('station_register_versions_positive', sql`${t.version} >= 1`),
    check('station_register_versions_counts', sql`${t.acceptedCount} >= 1 and ${t.rejectedCount} >= 0`),
    check('station_register_versions_delimiter_valid', sql`${t.delimiter} in ${sqlList(CSV_DELIMITERS)}`),
    check('station_register_versions_rejected_array', sql`jsonb_typeof(${t.rejectedRows}) = 'array'`),
  ],
)

/**
 * An authorised station as one register version holds it. Never updated: a re-import makes
 * new rows under a new version, and calculations keep their own copies.
 */
export const authorisedStations = pgTable(
  'authorised_stations',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    registerVersion: integer('register_version')
      .notNull()
      .references(() => stationRegisterVersions.version),
    /** The row's line in the imported file. */
    line: integer('line').notNull(),
    stationCode: text('station_code').notNull(),
    licensee: text('licensee').notNull(),
    service: text('service').notNull(),
    latitudeDeg: doublePrecision('latitude_deg').notNull(),
    longitudeDeg: doublePrecision('longitude_deg').notNull(),
    antennaHeightM: doublePrecision('antenna_height_m'),
    lowFreqHz: doublePrecision('low_freq_hz').notNull(),
    highFreqHz: doublePrecision('high_freq_hz').notNull(),
    /** The authorised limit as the licence states it. */
    limit: jsonb('limit').$type<LimitSpec>().notNull(),
    /** With a conducted-power limit: the antenna gain and feeder loss the licence states (else null). */
    antennaGainDbi: doublePrecision('antenna_gain_dbi'),
    feederLossDb: doublePrecision('feeder_loss_db'),
    /** The limit as an EIRP (the library's appliedLimitEirpDbm), for ranking and display. */
    authorisedEirpDbm: doublePrecision('authorised_eirp_dbm').notNull(),
    validFrom: date('valid_from', { mode: 'string' }),
    validUntil: date('valid_until', { mode: 'string' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    unique('authorised_stations_code_per_version').on(t.registerVersion, t.stationCode),
    check('authorised_stations_frequencies', sql`${t.lowFreqHz} > 0 and ${t.highFreqHz} > ${t.lowFreqHz}`),
    check('authorised_stations_position', sql`${t.latitudeDeg} between -90 and 90 and ${t.longitudeDeg} between -180 and 180`),
    check('authorised_stations_height', sql`${t.antennaHeightM} is null or ${t.antennaHeightM} >= 0`),
    check('authorised_stations_limit_kind', sql`jsonb_typeof(${t.limit}) = 'object' and ${t.limit} ? 'kind'`),
    check('authorised_stations_feeder_loss', sql`${t.feederLossDb} is null or ${t.feederLossDb} >= 0`),
    check('authorised_stations_validity', sql`${t.validFrom} is null or ${t.validUntil} is null or ${t.validUntil} >= ${t.validFrom}`),
    // the candidate ranking and the search by frequency: authorised ranges meeting a range (GiST on the
    // range; the version is checked on the rows found). The queries write the very same expression.
    index('authorised_stations_freq_range_idx').using('gist', sql`numrange(${t.lowFreqHz}::numeric, ${t.highFreqHz}::numeric, '[]')`),
    index('authorised_stations_version_licensee_idx').on(t.registerVersion, t.licensee),
  ],
)

export type StationRegisterVersionRow = typeof stationRegisterVersions.$inferSelect
export type NewStationRegisterVersion = typeof stationRegisterVersions.$inferInsert
export type AuthorisedStationRow = typeof authorisedStations.$inferSelect
export type NewAuthorisedStation = typeof authorisedStations.$inferInsert
