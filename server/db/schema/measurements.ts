import { sql } from 'drizzle-orm'
import { bigserial, check, date, doublePrecision, index, integer, jsonb, pgTable, text, timestamp, uniqueIndex, uuid, type AnyPgColumn } from 'drizzle-orm/pg-core'
import { DETECTORS, EQUIPMENT_TYPES, POLARISATIONS, READING_UNITS } from '../../../shared/domain/equipment'
import type { EquipmentCopy } from '../../../shared/calculations/references'
import type { AntennaFactorPoint, DerivedLevels, DerivedMethods, EquipmentContent } from '../../../shared/measurements/types'
import { cases } from './cases'
import { offices } from './offices'
import { sqlList } from './sql-list'
import { users } from './users'

/**
 * An office's antennas and instruments, with their calibration. Every change bumps `version`
 * (optimistic concurrency) and writes an equipment_changes row in the same transaction.
 */
export const equipment = pgTable(
  'equipment',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    officeId: uuid('office_id').notNull().references(() => offices.id),
    name: text('name').notNull(),
    type: text('type', { enum: EQUIPMENT_TYPES }).notNull(),
    manufacturer: text('manufacturer'),
    model: text('model'),
    serial: text('serial'),
    antennaGainDbi: doublePrecision('antenna_gain_dbi'),
    /** Calibrated antenna factors, ascending frequency [Hz → dB/m]. */
    antennaFactorTable: jsonb('antenna_factor_table').$type<AntennaFactorPoint[]>(),
    defaultCableLossDb: doublePrecision('default_cable_loss_db'),
    defaultPreampGainDb: doublePrecision('default_preamp_gain_db'),
    minFreqHz: doublePrecision('min_freq_hz'),
    maxFreqHz: doublePrecision('max_freq_hz'),
    maxInputDbm: doublePrecision('max_input_dbm'),
    calibrationDueOn: date('calibration_due_on'),
    notes: text('notes'),
    version: integer('version').notNull().default(1),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
    updatedBy: uuid('updated_by').references(() => users.id),
  },
  (t) => [
    check('equipment_type_valid', sql`${t.type} in ${sqlList(EQUIPMENT_TYPES)}`),
    check('equipment_antenna_one_description', sql`${t.antennaGainDbi} is null or ${t.antennaFactorTable} is null`),
    check('equipment_af_table_array', sql`${t.antennaFactorTable} is null or (jsonb_typeof(${t.antennaFactorTable}) = 'array' and jsonb_array_length(${t.antennaFactorTable}) >= 2)`),
    check('equipment_losses_positive', sql`(${t.defaultCableLossDb} is null or ${t.defaultCableLossDb} >= 0) and (${t.defaultPreampGainDb} is null or ${t.defaultPreampGainDb} >= 0)`),
    check('equipment_freq_range', sql`(${t.minFreqHz} is null or ${t.minFreqHz} > 0) and (${t.maxFreqHz} is null or ${t.minFreqHz} is null or ${t.maxFreqHz} > ${t.minFreqHz})`),
    check('equipment_version_positive', sql`${t.version} >= 1`),
    index('equipment_office_idx').on(t.officeId, t.name),
  ],
)

/**
 * The history of the register, append-only (make_append_only in the migration): the entry's
 * first content (version 1, `before` empty) and every change, who and when.
 */
export const equipmentChanges = pgTable(
  'equipment_changes',
  {
    id: bigserial('id', { mode: 'number' }).primaryKey(),
    equipmentId: uuid('equipment_id')
      .notNull()
      .references(() => equipment.id),
    changedAt: timestamp('changed_at', { withTimezone: true }).notNull().defaultNow(),
    changedBy: uuid('changed_by')
      .notNull()
      .references(() => users.id),
    reason: text('reason'),
    version: integer('version').notNull(),
    before: jsonb('before').$type<Partial<EquipmentContent>>().notNull(),
    after: jsonb('after').$type<Partial<EquipmentContent>>().notNull(),
  },
  (t) => [index('equipment_changes_item_idx').on(t.equipmentId, t.changedAt)],
)

/**
 * A measurement on a case: the reading and how it was taken, the levels the server derived from
 * it (with the method of each step and the warnings), and copies of the register entries used.
 * Editable (version) until a calculation names it; afterwards a correction is a new row whose
 * `supersedes_id` names it, and the old row stays as it is.
 * `evidence_file_id` names an evidence file (a spectrum capture); evidence uploads come later,
 * so the column has no foreign key yet.
 */
export const measurements = pgTable(
  'measurements',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    caseId: uuid('case_id').notNull().references(() => cases.id),
    officeId: uuid('office_id').notNull().references(() => offices.id),
    authorUserId: uuid('author_user_id').notNull().references(() => users.id),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
    takenAt: timestamp('taken_at', { withTimezone: true }).notNull(),
    latDeg: doublePrecision('lat_deg').notNull(),
    lonDeg: doublePrecision('lon_deg').notNull(),
    heightM: doublePrecision('height_m'),
    freqHz: doublePrecision('freq_hz').notNull(),
    measurementBandwidthHz: doublePrecision('measurement_bandwidth_hz'),
    rbwHz: doublePrecision('rbw_hz'),
    detector: text('detector', { enum: DETECTORS }),
    readingValue: doublePrecision('reading_value').notNull(),
    readingUnit: text('reading_unit', { enum: READING_UNITS }).notNull(),
    antennaId: uuid('antenna_id').references(() => equipment.id),
    antennaGainDbi: doublePrecision('antenna_gain_dbi'),
    antennaFactorDbPerM: doublePrecision('antenna_factor_db_per_m'),
    instrumentId: uuid('instrument_id').references(() => equipment.id),
    cableLossDb: doublePrecision('cable_loss_db'),
    preampGainDb: doublePrecision('preamp_gain_db'),
    polarisation: text('polarisation', { enum: POLARISATIONS }),
    bearingDeg: doublePrecision('bearing_deg'),
    bearingSigmaDeg: doublePrecision('bearing_sigma_deg'),
    notes: text('notes'),
    /** An evidence file (no foreign key until evidence uploads exist). */
    evidenceFileId: uuid('evidence_file_id'),
    derived: jsonb('derived').$type<DerivedLevels>().notNull(),
    methods: jsonb('methods').$type<DerivedMethods>().notNull(),
    warnings: jsonb('warnings').$type<string[]>().notNull(),
    equipmentCopies: jsonb('equipment_copies').$type<EquipmentCopy[]>().notNull(),
    libraryVersion: text('library_version').notNull(),
    version: integer('version').notNull().default(1),
    supersedesId: uuid('supersedes_id').references((): AnyPgColumn => measurements.id),
  },
  (t) => [
    check('measurements_detector_valid', sql`${t.detector} is null or ${t.detector} in ${sqlList(DETECTORS)}`),
    check('measurements_polarisation_valid', sql`${t.polarisation} is null or ${t.polarisation} in ${sqlList(POLARISATIONS)}`),
    check('measurements_reading_unit_valid', sql`${t.readingUnit} in ${sqlList(READING_UNITS)}`),
    check('measurements_position_valid', sql`${t.latDeg} between -90 and 90 and ${t.lonDeg} between -180 and 180 and (${t.heightM} is null or ${t.heightM} >= 0)`),
    check('measurements_freq_positive', sql`${t.freqHz} > 0 and (${t.measurementBandwidthHz} is null or ${t.measurementBandwidthHz} > 0) and (${t.rbwHz} is null or ${t.rbwHz} > 0)`),
    check('measurements_antenna_one_description', sql`num_nonnulls(${t.antennaId}, ${t.antennaGainDbi}, ${t.antennaFactorDbPerM}) <= 1`),
    check('measurements_losses_positive', sql`(${t.cableLossDb} is null or ${t.cableLossDb} >= 0) and (${t.preampGainDb} is null or ${t.preampGainDb} >= 0)`),
    check('measurements_bearing_valid', sql`(${t.bearingDeg} is null or (${t.bearingDeg} >= 0 and ${t.bearingDeg} < 360)) and (${t.bearingSigmaDeg} is null or ${t.bearingSigmaDeg} > 0)`),
    check('measurements_lists', sql`jsonb_typeof(${t.derived}) = 'object' and jsonb_typeof(${t.methods}) = 'object' and jsonb_typeof(${t.warnings}) = 'array' and jsonb_typeof(${t.equipmentCopies}) = 'array'`),
    check('measurements_version_positive', sql`${t.version} >= 1`),
    check('measurements_not_self_superseding', sql`${t.supersedesId} is null or ${t.supersedesId} <> ${t.id}`),
    index('measurements_case_idx').on(t.caseId, t.takenAt),
    // a measurement is corrected once; a correction of the correction supersedes the correction
    uniqueIndex('measurements_supersedes_once').on(t.supersedesId),
  ],
)

export type EquipmentRow = typeof equipment.$inferSelect
export type NewEquipment = typeof equipment.$inferInsert
export type EquipmentChangeRow = typeof equipmentChanges.$inferSelect
export type MeasurementRow = typeof measurements.$inferSelect
export type NewMeasurement = typeof measurements.$inferInsert
