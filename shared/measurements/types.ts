/**
 * What the register keeps about an item of equipment and what a measurement keeps about the
 * values the server derived from its reading. Shared by the database's column types, the
 * derivation (derive.ts) and the API's views.
 */
import type { MethodRef } from '../radio/types'

/** One calibrated point of an antenna-factor table. */
export interface AntennaFactorPoint {
  freqHz: number
  antennaFactorDbPerM: number
}

/** What an item of the register says (everything but its identity, office, version and last change). */
export interface EquipmentContent {
  name: string
  type: import('../domain/equipment').EquipmentType
  manufacturer: string | null
  model: string | null
  serial: string | null
  /** Antennas: the gain (dBi) or an antenna-factor table, never both. */
  antennaGainDbi: number | null
  antennaFactorTable: AntennaFactorPoint[] | null
  /** Usual loss of the cable used with it [dB], positive; and a preamplifier's gain [dB]. */
  defaultCableLossDb: number | null
  defaultPreampGainDb: number | null
  /** Frequency range the item is specified for [Hz]. */
  minFreqHz: number | null
  maxFreqHz: number | null
  /** Instruments: the largest input level its readings may show [dBm]. */
  maxInputDbm: number | null
  /** ISO date (yyyy-mm-dd) the calibration runs out; null when the register has none. */
  calibrationDueOn: string | null
  notes: string | null
}

/** The levels derived from a reading (absent when the reading cannot give them). */
export interface DerivedLevels {
  fieldStrengthDbuvPerM?: number
  pfdDbwPerM2?: number
  isotropicReceivedPowerDbm?: number
  /** The antenna as used at the measured frequency (from the register's table or gain, or typed). */
  antennaFactorDbPerM?: number
  antennaGainDbi?: number
}
export type DerivedKey = keyof DerivedLevels
/**
 * The library step behind each derived level; `reading` names how the reading itself was
 * obtained when the server computed it (a band's channel power over an evidence file's trace).
 */
export type DerivedMethods = Partial<Record<DerivedKey | 'reading', MethodRef>>
