/**
 * The levels a measurement's reading gives, derived with the radio library: field strength
 * (dBµV/m), power flux density (dBW/m²) and the power an isotropic antenna would receive (dBm),
 * each with the method of the library step, and the warnings that follow the measurement into
 * every result built on it (calibration expired or missing, antenna data missing).
 *
 * Pure and isomorphic: the browser runs it on every keystroke to show the values beside the form
 * (display only), and the server runs it again on what it received and stores that. Problems
 * that make the measurement impossible as typed (a frequency outside the antenna's calibrated
 * table, a reading above what the instrument can take) come back as `problems`, each naming the
 * field it belongs to; nothing is thrown for them.
 */
import type { EquipmentCopy } from '../calculations/references'
import { INPUT_READING_UNITS, INSTRUMENT_TYPES, type ReadingUnit } from '../domain/equipment'
import {
  antennaFactorFromTableDbPerM,
  dbuvToDbm,
  fieldToPfdDbwPerM2,
  MEASUREMENT_CHAIN_METHOD,
  pfdToFieldDbuvPerM,
  pfdToReceivedPowerDbm,
  readingToField,
  type MethodRef,
} from '../radio'
import type { DerivedLevels, DerivedMethods, EquipmentContent } from './types'

/** An item of the register as the derivation needs it. */
export type DeriveEquipment = Pick<
  EquipmentContent,
  'name' | 'type' | 'serial' | 'antennaGainDbi' | 'antennaFactorTable' | 'minFreqHz' | 'maxFreqHz' | 'maxInputDbm' | 'calibrationDueOn'
> & { id: string; version: number }

/** How the antenna is described: an item of the register, a typed gain or factor, or not at all. */
export type DeriveAntenna =
  | { source: 'register'; item: DeriveEquipment }
  | { source: 'gain'; antennaGainDbi: number }
  | { source: 'factor'; antennaFactorDbPerM: number }
  | { source: 'none' }

/** A measurement's inputs, every number in its base unit (as the schemas read them). */
export interface DeriveInputs {
  /** ISO time the measurement was taken (calibration is judged at this time). */
  takenAt: string
  freqHz: number
  reading: { value: number; unit: ReadingUnit }
  antenna: DeriveAntenna
  instrument?: DeriveEquipment
  cableLossDb?: number
  preampGainDb?: number
}

export interface DerivedMeasurement {
  derived: DerivedLevels
  methods: DerivedMethods
  warnings: string[]
  /** Why the measurement cannot be stored as typed, by field (`freqHz`, `reading.value`, `antenna.equipmentId`, `instrumentId`). */
  problems: { path: string; message: string }[]
  /** Copies of the register entries used, as the register held them. */
  equipmentCopies: EquipmentCopy[]
}

/** S = E²/Z0 with Z0 = 120π, the library's units.ts (fieldToPfdDbwPerM2 / pfdToFieldDbuvPerM). */
export const FIELD_PFD_METHOD: MethodRef = {
  id: 'field-pfd-z0',
  source: 'S = E²/Z0 with Z0 = 120π Ω (exact identity); ITU-R P.525-4 §2.1',
}
/** P_r = S·A_e of an isotropic antenna, the library's received-power.ts. */
export const ISOTROPIC_POWER_METHOD: MethodRef = {
  id: 'received-power-p525',
  source: 'ITU-R P.525-4 §3: power available to an isotropic antenna, P_r = S + 10·log10(λ²/4π) + 30 dBm',
}
/** The antenna factor ↔ gain relation at 50 Ω, the library's antenna.ts. */
export const ANTENNA_RELATION_METHOD: MethodRef = {
  id: 'antenna-factor-gain-50ohm',
  source: 'AF = 20·log10 f(MHz) − G − 29.77 at 50 Ω (ITU Handbook on Spectrum Monitoring, 2011, field-strength measurement)',
}

const mhz = (hz: number): string => `${Number((hz / 1e6).toPrecision(6))} MHz`
const utcDay = (iso: string): string => new Date(iso).toISOString().slice(0, 10)

/** The calibration warning for an item used at `takenAt`, or null when it was in date. */
export function calibrationWarning(item: Pick<DeriveEquipment, 'name' | 'calibrationDueOn'>, takenAt: string): string | null {
  if (!item.calibrationDueOn) return `${item.name}: the register has no calibration date, so its calibration at the time of measurement cannot be shown.`
  const day = utcDay(takenAt)
  if (day > item.calibrationDueOn) return `${item.name}: calibration ran out on ${item.calibrationDueOn}, before this measurement (${day}).`
  return null
}

function copyOf(item: DeriveEquipment): EquipmentCopy {
  return { equipmentId: item.id, name: item.name, type: item.type, calibrationDueOn: item.calibrationDueOn, version: item.version }
}

function inRange(item: DeriveEquipment, freqHz: number): boolean {
  return (item.minFreqHz === null || freqHz >= item.minFreqHz) && (item.maxFreqHz === null || freqHz <= item.maxFreqHz)
}

function rangeWords(item: DeriveEquipment): string {
  if (item.minFreqHz !== null && item.maxFreqHz !== null) return `${mhz(item.minFreqHz)} to ${mhz(item.maxFreqHz)}`
  return item.minFreqHz !== null ? `from ${mhz(item.minFreqHz)}` : `up to ${mhz(item.maxFreqHz!)}`
}

/** The antenna as used at the frequency: its factor or gain, the method, or why not. */
function resolveAntenna(
  antenna: DeriveAntenna,
  freqHz: number,
  out: DerivedMeasurement,
): { antennaFactorDbPerM: number } | { antennaGainDbi: number } | null {
  if (antenna.source === 'gain') {
    out.warnings.push('The antenna gain was typed, not taken from the register: no calibration of the antenna is on record.')
    return { antennaGainDbi: antenna.antennaGainDbi }
  }
  if (antenna.source === 'factor') {
    out.warnings.push('The antenna factor was typed, not taken from the register: no calibration of the antenna is on record.')
    return { antennaFactorDbPerM: antenna.antennaFactorDbPerM }
  }
  if (antenna.source === 'none') return null
  const item = antenna.item
  if (item.type !== 'antenna') {
    out.problems.push({ path: 'antenna.equipmentId', message: `${item.name} is not an antenna in the register: choose an antenna, or type its gain or factor.` })
    return null
  }
  if (!inRange(item, freqHz)) out.warnings.push(`${item.name} is specified for ${rangeWords(item)}; ${mhz(freqHz)} is outside that range.`)
  if (item.antennaFactorTable) {
    try {
      const af = antennaFactorFromTableDbPerM({ freqHz, table: item.antennaFactorTable })
      out.methods.antennaFactorDbPerM = af.method
      out.warnings.push(...af.warnings)
      return { antennaFactorDbPerM: af.value }
    } catch (e) {
      if (!(e instanceof RangeError)) throw e
      out.problems.push({ path: 'freqHz', message: `${item.name}: ${e.message}` })
      return null
    }
  }
  if (item.antennaGainDbi !== null) return { antennaGainDbi: item.antennaGainDbi }
  out.warnings.push(`${item.name} has neither a gain nor an antenna-factor table in the register: add one there to derive the field from this reading.`)
  return null
}

/**
 * Derives the levels of a measurement. Inputs are in base units and already checked for their
 * own ranges (the schemas do that); this adds what depends on the equipment.
 */
export function deriveMeasurement(inputs: DeriveInputs): DerivedMeasurement {
  const out: DerivedMeasurement = { derived: {}, methods: {}, warnings: [], problems: [], equipmentCopies: [] }
  const { freqHz, reading } = inputs
  const needsAntenna = INPUT_READING_UNITS.includes(reading.unit)

  for (const item of [inputs.antenna.source === 'register' ? inputs.antenna.item : undefined, inputs.instrument]) {
    if (!item) continue
    out.equipmentCopies.push(copyOf(item))
    const w = calibrationWarning(item, inputs.takenAt)
    if (w) out.warnings.push(w)
  }

  const instrument = inputs.instrument
  if (instrument) {
    if (!INSTRUMENT_TYPES.includes(instrument.type)) {
      out.problems.push({ path: 'instrumentId', message: `${instrument.name} is not an analyser or a receiver in the register.` })
    } else {
      if (!inRange(instrument, freqHz)) {
        out.problems.push({ path: 'freqHz', message: `${instrument.name} measures ${rangeWords(instrument)}; ${mhz(freqHz)} is outside its range.` })
      }
      if (needsAntenna && instrument.maxInputDbm !== null) {
        const readingDbm = reading.unit === 'dBm' ? reading.value : dbuvToDbm({ voltageDbuv: reading.value })
        if (readingDbm > instrument.maxInputDbm) {
          out.problems.push({
            path: 'reading.value',
            message: `The reading (${readingDbm.toFixed(1)} dBm) is above what ${instrument.name} can take (${instrument.maxInputDbm} dBm at its input): check the value, or the attenuation used.`,
          })
        }
      }
    }
  }

  if (!needsAntenna) {
    if ((inputs.cableLossDb ?? 0) !== 0 || (inputs.preampGainDb ?? 0) !== 0) {
      out.warnings.push('A reading in field strength or power flux density already includes the antenna and cable: the cable loss and preamplifier gain typed are not applied.')
    }
    const field = reading.unit === 'dBµV/m' ? reading.value : pfdToFieldDbuvPerM(reading.value)
    const pfd = reading.unit === 'dBW/m²' ? reading.value : fieldToPfdDbwPerM2(reading.value)
    out.derived.fieldStrengthDbuvPerM = field
    out.derived.pfdDbwPerM2 = pfd
    out.derived.isotropicReceivedPowerDbm = pfdToReceivedPowerDbm({ pfdDbwPerM2: pfd, freqHz })
    if (reading.unit === 'dBW/m²') out.methods.fieldStrengthDbuvPerM = FIELD_PFD_METHOD
    else out.methods.pfdDbwPerM2 = FIELD_PFD_METHOD
    out.methods.isotropicReceivedPowerDbm = ISOTROPIC_POWER_METHOD
    return out
  }

  const antenna = resolveAntenna(inputs.antenna, freqHz, out)
  if (!antenna) {
    if (inputs.antenna.source === 'none') {
      out.warnings.push('No antenna given: a reading at the instrument input needs the antenna’s gain or factor before field strength, power flux density or isotropic power can be derived.')
    }
    return out
  }
  if (out.problems.some((p) => p.path === 'reading.value')) return out
  const r = readingToField({
    freqHz,
    antenna,
    cableLossDb: inputs.cableLossDb,
    preampGainDb: inputs.preampGainDb,
    reading: reading.unit === 'dBm' ? { readingDbm: reading.value } : { readingDbuv: reading.value },
  })
  out.warnings.push(...r.warnings)
  out.derived = {
    fieldStrengthDbuvPerM: r.value.fieldStrengthDbuvPerM,
    pfdDbwPerM2: r.value.pfdDbwPerM2,
    isotropicReceivedPowerDbm: r.value.isotropicReceivedPowerDbm,
    antennaFactorDbPerM: r.value.antennaFactorDbPerM,
    antennaGainDbi: r.value.antennaGainDbi,
  }
  out.methods.fieldStrengthDbuvPerM = MEASUREMENT_CHAIN_METHOD
  out.methods.pfdDbwPerM2 = MEASUREMENT_CHAIN_METHOD
  out.methods.isotropicReceivedPowerDbm = MEASUREMENT_CHAIN_METHOD
  if ('antennaGainDbi' in antenna) out.methods.antennaFactorDbPerM = ANTENNA_RELATION_METHOD
  else out.methods.antennaGainDbi = ANTENNA_RELATION_METHOD
  return out
}
