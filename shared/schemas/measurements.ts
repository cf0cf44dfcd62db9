/**
 * The contracts of the office's equipment register and of a case's measurements: what a client
 * sends (every number through the strict parser with its unit, normalised to the base unit named
 * in its key) and what the API answers. Requests are strict objects: a client that sends the
 * derived levels (or any key not listed) is refused — the server derives them itself.
 */
import { z } from 'zod'
import { DETECTORS, EQUIPMENT_TYPES, POLARISATIONS, READING_UNITS, type ReadingUnit } from '../domain/equipment'
import { quantity, readQuantity, type QuantityKind } from './quantities'
import { storableString } from './text'

const id = z.uuid({ message: 'Not a valid id.' })
const instant = z.iso.datetime()

/** Highest frequency anyone measures here: 3 THz, the top of the radio spectrum. */
export const MAX_MEASURED_FREQUENCY_HZ = 3e12
/** A clock a little ahead of the server's is not the future (a phone's clock, say). */
export const TAKEN_AT_SKEW_MS = 2 * 60_000

const optionalText = (what: string, max: number) =>
  storableString()
    .trim()
    .max(max, { message: `Keep ${what} to ${max} characters.` })
    .nullable()
    .optional()
    .transform((s) => (s === '' || s === undefined ? null : s))

const frequencyHz = (label: string) =>
  quantity('frequency', { label, min: 0, minExclusive: true, max: MAX_MEASURED_FREQUENCY_HZ, example: '433.92 MHz', minExclusiveMessage: `Enter ${label} above 0 Hz.` })
const optionalFrequencyHz = (label: string) =>
  quantity('frequency', { label, optional: true, min: 0, minExclusive: true, max: MAX_MEASURED_FREQUENCY_HZ, example: '433.92 MHz', minExclusiveMessage: `Enter ${label} above 0 Hz.` })
const optionalBandwidthHz = (label: string) =>
  quantity('bandwidth', { label, optional: true, min: 0, minExclusive: true, max: 1e11, example: '120 kHz', minExclusiveMessage: `Enter ${label} above 0 Hz.` })
const lossDb = (label: string) => quantity('loss', { label, optional: true, min: 0, max: 100, example: '2.5' })

// ————————————————————————————————————————— equipment register

/** One calibrated point of an antenna-factor table as typed. */
const antennaFactorPointSchema = z.strictObject({
  freqHz: frequencyHz('the table’s frequency'),
  antennaFactorDbPerM: quantity('antennaFactor', { label: 'the antenna factor', min: -60, max: 100, example: '18.5' }),
})

/** An item of the register as a supervisor or an administrator writes it (whole, on create and on edit). */
export const equipmentContentSchema = z
  .strictObject({
    name: storableString().trim().min(1, { message: 'Enter a name.' }).max(200, { message: 'Keep the name to 200 characters.' }),
    type: z.enum(EQUIPMENT_TYPES, { message: 'Choose what kind of item this is.' }),
    manufacturer: optionalText('the manufacturer', 200),
    model: optionalText('the model', 200),
    serial: optionalText('the serial number', 200),
    antennaGainDbi: quantity('gain', { label: 'the antenna gain', optional: true, min: -40, max: 60, example: '6 dBi' }).transform((v) => v ?? null),
    antennaFactorTable: z
      .array(antennaFactorPointSchema)
      .max(400, { message: 'Keep the table to 400 points.' })
      .nullable()
      .optional()
      .transform((t) => (t === undefined || t === null || t.length === 0 ? null : t)),
    defaultCableLossDb: lossDb('the cable loss').transform((v) => v ?? null),
    defaultPreampGainDb: lossDb('the preamplifier gain').transform((v) => v ?? null),
    minFreqHz: optionalFrequencyHz('the lowest frequency').transform((v) => v ?? null),
    maxFreqHz: optionalFrequencyHz('the highest frequency').transform((v) => v ?? null),
    maxInputDbm: quantity('power', { label: 'the largest input level', optional: true, min: -100, max: 60, example: '30 dBm' }).transform((v) => v ?? null),
    calibrationDueOn: z.iso.date({ message: 'Enter the date as yyyy-mm-dd.' }).nullable().optional().transform((d) => d ?? null),
    notes: optionalText('the notes', 2000),
  })
  .superRefine((e, ctx) => {
    if (e.type !== 'antenna' && (e.antennaGainDbi !== null || e.antennaFactorTable !== null)) {
      ctx.addIssue({ code: 'custom', path: ['type'], message: 'Only an antenna has a gain or an antenna-factor table.' })
    }
    if (e.antennaGainDbi !== null && e.antennaFactorTable !== null) {
      ctx.addIssue({ code: 'custom', path: ['antennaGainDbi'], message: 'Give the gain or the antenna-factor table, not both.' })
    }
    const t = e.antennaFactorTable
    if (t) {
      if (t.length < 2) ctx.addIssue({ code: 'custom', path: ['antennaFactorTable'], message: 'An antenna-factor table needs at least two points.' })
      t.forEach((p, i) => {
        if (i > 0 && !(p.freqHz > t[i - 1]!.freqHz)) {
          ctx.addIssue({ code: 'custom', path: ['antennaFactorTable', i, 'freqHz'], message: 'List the frequencies from lowest to highest, each once.' })
        }
      })
    }
    if (e.minFreqHz !== null && e.maxFreqHz !== null && !(e.maxFreqHz > e.minFreqHz)) {
      ctx.addIssue({ code: 'custom', path: ['maxFreqHz'], message: 'The highest frequency must be above the lowest.' })
    }
  })
export type EquipmentContentInput = z.input<typeof equipmentContentSchema>
export type EquipmentContentParsed = z.output<typeof equipmentContentSchema>

/** POST /api/offices/:id/equipment */
export const newEquipmentSchema = z.strictObject({ item: equipmentContentSchema })
/** PATCH /api/equipment/:id: the whole item as it should become, the version it was made on, and why (optional). */
export const equipmentPatchSchema = z.strictObject({
  item: equipmentContentSchema,
  version: z.number({ message: 'Send the version you edited.' }).int().min(1),
  reason: optionalText('the reason', 1000),
})

// ————————————————————————————————————————— measurements

/** The quantity each reading unit is typed as (its base unit is the reading unit). */
export const READING_QUANTITY: Record<ReadingUnit, QuantityKind> = { dBm: 'power', 'dBµV': 'voltage', 'dBµV/m': 'fieldStrength', 'dBW/m²': 'pfd' }

const readingSchema = z
  .strictObject({ unit: z.enum(READING_UNITS, { message: 'Choose what the reading is.' }), value: z.unknown() })
  .transform((r, ctx) => {
    const read = readQuantity(r.value, READING_QUANTITY[r.unit], { label: 'the reading', min: -300, max: 300, example: '-62.5' })
    if (!read.ok) {
      ctx.addIssue({ code: 'custom', path: ['value'], message: read.message })
      return z.NEVER
    }
    return { unit: r.unit, value: read.value }
  })

const antennaSchema = z.discriminatedUnion(
  'source',
  [
    z.strictObject({ source: z.literal('none') }),
    z.strictObject({ source: z.literal('register'), equipmentId: id }),
    z.strictObject({ source: z.literal('gain'), antennaGainDbi: quantity('gain', { label: 'the antenna gain', min: -40, max: 60, example: '6 dBi' }) }),
    z.strictObject({ source: z.literal('factor'), antennaFactorDbPerM: quantity('antennaFactor', { label: 'the antenna factor', min: -60, max: 100, example: '18.5' }) }),
  ],
  { message: 'Say how the antenna is described: from the register, by its gain, by its factor, or none.' },
)

/** A measurement as an investigator types it (POST, and the content of an edit or a correction). */
export const measurementContentSchema = z
  .strictObject({
    takenAt: z.iso
      .datetime({ offset: true, message: 'Enter the date and time the measurement was taken.' })
      .refine((at) => Date.parse(at) <= Date.now() + TAKEN_AT_SKEW_MS, { message: 'The measurement time is in the future: check the date, time and time zone.' }),
    latDeg: quantity('angle', { label: 'the latitude', min: -90, max: 90, example: '51.5072' }),
    lonDeg: quantity('angle', { label: 'the longitude', min: -180, max: 180, example: '-0.1276' }),
    heightM: quantity('height', { label: 'the antenna height', optional: true, min: 0, max: 2000, example: '1.5' }),
    freqHz: frequencyHz('the centre frequency'),
    measurementBandwidthHz: optionalBandwidthHz('the measurement bandwidth'),
    rbwHz: optionalBandwidthHz('the resolution bandwidth'),
    detector: z.enum(DETECTORS, { message: 'Choose a detector.' }).optional(),
    reading: readingSchema,
    antenna: antennaSchema.optional().transform((a) => a ?? { source: 'none' as const }),
    instrumentId: id.optional(),
    cableLossDb: lossDb('the cable loss'),
    preampGainDb: lossDb('the preamplifier gain'),
    polarisation: z.enum(POLARISATIONS, { message: 'Choose a polarisation.' }).optional(),
    bearingDeg: quantity('angle', { label: 'the bearing', optional: true, min: 0, max: 360, example: '48' }).refine((b) => b === undefined || b < 360, {
      message: 'Enter the bearing from 0° up to (not including) 360°.',
    }),
    bearingSigmaDeg: quantity('angle', { label: 'the bearing’s σ', optional: true, min: 0, minExclusive: true, max: 180, example: '5', minExclusiveMessage: 'Enter the bearing’s σ above 0°.' }),
    notes: optionalText('the notes', 4000),
    /** The case's evidence file the reading comes from: the server checks it is a file of the same case, not removed. */
    evidenceFileId: id.optional(),
  })
  .superRefine((m, ctx) => {
    if (m.bearingSigmaDeg !== undefined && m.bearingDeg === undefined) {
      ctx.addIssue({ code: 'custom', path: ['bearingSigmaDeg'], message: 'Give the bearing with its σ.' })
    }
  })
export type MeasurementContentInput = z.input<typeof measurementContentSchema>
export type MeasurementContent = z.output<typeof measurementContentSchema>

/** POST /api/cases/:id/measurements and POST /api/measurements/:id/corrections */
export const newMeasurementSchema = z.strictObject({ measurement: measurementContentSchema })
/** PATCH /api/measurements/:id: the measurement as it should become and the version it was made on. */
export const measurementPatchSchema = z.strictObject({
  measurement: measurementContentSchema,
  version: z.number({ message: 'Send the version you edited.' }).int().min(1),
})

// ————————————————————————————————————————— views

const methodRefSchema = z.object({ id: z.string(), source: z.string() })
const derivedLevelsSchema = z.object({
  fieldStrengthDbuvPerM: z.number().optional(),
  pfdDbwPerM2: z.number().optional(),
  isotropicReceivedPowerDbm: z.number().optional(),
  antennaFactorDbPerM: z.number().optional(),
  antennaGainDbi: z.number().optional(),
})
const equipmentCopySchema = z.object({
  equipmentId: id,
  name: z.string(),
  type: z.string(),
  calibrationDueOn: z.iso.date().nullable(),
  version: z.number().int().min(1),
})

export const equipmentViewSchema = z.object({
  id,
  officeId: id,
  name: z.string(),
  type: z.enum(EQUIPMENT_TYPES),
  manufacturer: z.string().nullable(),
  model: z.string().nullable(),
  serial: z.string().nullable(),
  antennaGainDbi: z.number().nullable(),
  antennaFactorTable: z.array(z.object({ freqHz: z.number(), antennaFactorDbPerM: z.number() })).nullable(),
  defaultCableLossDb: z.number().nullable(),
  defaultPreampGainDb: z.number().nullable(),
  minFreqHz: z.number().nullable(),
  maxFreqHz: z.number().nullable(),
  maxInputDbm: z.number().nullable(),
  calibrationDueOn: z.iso.date().nullable(),
  /** 'ok', 'expired' (due date passed, at the server's today) or 'missing' (no date in the register). */
  calibrationState: z.enum(['ok', 'expired', 'missing']),
  notes: z.string().nullable(),
  version: z.number().int().min(1),
  updatedAt: instant,
  updatedBy: z.string().nullable(),
})
export type EquipmentView = z.infer<typeof equipmentViewSchema>

export const equipmentChangeViewSchema = z.object({
  id: z.number().int(),
  at: instant,
  by: z.string(),
  reason: z.string().nullable(),
  version: z.number().int().min(1),
  before: z.record(z.string(), z.unknown()),
  after: z.record(z.string(), z.unknown()),
})
export type EquipmentChangeView = z.infer<typeof equipmentChangeViewSchema>

export const equipmentListResponseSchema = z.object({
  items: z.array(equipmentViewSchema),
  /** Whether the viewer may add and edit items of this office's register. */
  abilities: z.object({ manage: z.boolean() }),
})
export const equipmentResponseSchema = z.object({ item: equipmentViewSchema })
export const equipmentHistoryResponseSchema = z.object({ changes: z.array(equipmentChangeViewSchema) })

export const measurementViewSchema = z.object({
  id,
  caseId: id,
  officeId: id,
  author: z.string(),
  createdAt: instant,
  updatedAt: instant,
  takenAt: instant,
  latDeg: z.number(),
  lonDeg: z.number(),
  heightM: z.number().nullable(),
  freqHz: z.number(),
  measurementBandwidthHz: z.number().nullable(),
  rbwHz: z.number().nullable(),
  detector: z.enum(DETECTORS).nullable(),
  reading: z.object({ value: z.number(), unit: z.enum(READING_UNITS) }),
  antenna: z.discriminatedUnion('source', [
    z.object({ source: z.literal('none') }),
    z.object({ source: z.literal('register'), equipmentId: id }),
    z.object({ source: z.literal('gain'), antennaGainDbi: z.number() }),
    z.object({ source: z.literal('factor'), antennaFactorDbPerM: z.number() }),
  ]),
  instrumentId: id.nullable(),
  cableLossDb: z.number().nullable(),
  preampGainDb: z.number().nullable(),
  polarisation: z.enum(POLARISATIONS).nullable(),
  bearingDeg: z.number().nullable(),
  bearingSigmaDeg: z.number().nullable(),
  notes: z.string().nullable(),
  evidenceFileId: id.nullable(),
  derived: derivedLevelsSchema,
  methods: z.record(z.string(), methodRefSchema),
  warnings: z.array(z.string()),
  equipment: z.array(equipmentCopySchema),
  libraryVersion: z.string(),
  version: z.number().int().min(1),
  supersedesId: id.nullable(),
  supersededById: id.nullable(),
  /** How many calculation records name it (once any does, it is corrected, not edited). */
  usedByCalculations: z.number().int().min(0),
  abilities: z.object({ edit: z.boolean(), correct: z.boolean() }),
})
export type MeasurementView = z.infer<typeof measurementViewSchema>

export const measurementsResponseSchema = z.object({
  measurements: z.array(measurementViewSchema),
  /** Whether the viewer may record measurements on this case now. */
  abilities: z.object({ record: z.boolean() }),
})
export const measurementResponseSchema = z.object({ measurement: measurementViewSchema })
