/**
 * The references a calculation can name and the copy of each that its record keeps. A record is
 * computed from its inputs and these copies alone, so a later edit of a register (a corrected
 * measurement, a re-imported licence register, a new calibration) never changes what it says.
 *
 * The server fills a `ReferenceLookup` from the database before it runs a calculation; pure use
 * (tests, the quick calculator) works with the library's own list and typed values only.
 */
import type { LimitSpec } from '../radio'

/** A band-limit entry as the national register holds it now. */
export interface BandLimitReference {
  key: string
  title: string
  spec: LimitSpec
  citation: string
  verified: boolean
  statusNote: string
  /** The register row's version when copied (absent for the library's own list). */
  version?: number
}

/** The calibration of the antenna or instrument a measurement used, as the register held it. */
export interface EquipmentCopy {
  equipmentId: string
  name: string
  /** e.g. 'antenna', 'analyser', 'cable', 'preamp', 'receiver'. */
  type: string
  /** ISO date (yyyy-mm-dd) or null when the register has none. */
  calibrationDueOn: string | null
  /** The register row's version when copied. */
  version: number
}

/**
 * A measurement as stored on the case, with the values the server derived from the reading
 * (every level already corrected for antenna, cable and preamp). Levels the reading cannot give
 * are absent (a reading in dBm through an antenna of known gain gives all three).
 */
export interface MeasurementReference {
  id: string
  /** ISO time the measurement was taken. */
  takenAt: string
  latitudeDeg: number
  longitudeDeg: number
  /** Height of the receiving antenna above ground. */
  heightM?: number
  freqHz: number
  measurementBandwidthHz?: number
  resolutionBandwidthHz?: number
  detector?: string
  derived: {
    fieldStrengthDbuvPerM?: number
    pfdDbwPerM2?: number
    isotropicReceivedPowerDbm?: number
  }
  /** Direction-finding bearing to the source, degrees clockwise from true north, and its σ. */
  bearingDeg?: number
  bearingSigmaDeg?: number
  /** Copies of the register rows used (antenna, instrument), when taken from the register. */
  equipment: EquipmentCopy[]
  /** Warnings that follow the measurement into every result (expired or missing calibration…). */
  warnings: string[]
  /** The measurement row's version when copied. */
  version: number
}

/** An authorised station (a row of the licence register) as a given register version held it. */
export interface StationReference {
  id: string
  /** The register version the row belongs to (a re-import makes a new one). */
  registerVersion: number
  stationCode: string
  licensee: string
  service: string
  latitudeDeg: number
  longitudeDeg: number
  antennaHeightM?: number
  /** Authorised frequency range. */
  lowFreqHz: number
  highFreqHz: number
  /** The authorised limit, as the licence states it (EIRP, ERP, or conducted power and gain). */
  limit: LimitSpec
  /** With a conducted-power limit: the antenna gain and feeder loss the licence states. */
  antennaGainDbi?: number
  feederLossDb?: number
  /** Authorised EIRP after the library's appliedLimitEirpDbm, for ranking and display. */
  authorisedEirpDbm: number
  validFrom: string | null
  validUntil: string | null
}

/** A stored calculation another one builds on (a verdict on an estimate's EIRP). */
export interface CalculationReference {
  id: string
  kind: string
  /** The EIRP the record gives, and its 95 % interval when it has one. */
  eirpDbm: number
  eirpIntervalDbm?: { lowDbm: number; highDbm: number }
  libraryVersion: string
  at: string
}

/** Where a calculation finds the references its inputs name. */
export interface ReferenceLookup {
  bandLimit(key: string): BandLimitReference | undefined
  measurement?(id: string): MeasurementReference | undefined
  station?(id: string): StationReference | undefined
  /** The stations of the register in force whose authorised range meets [lowFreqHz, highFreqHz], edges included. */
  candidateStations?(q: { lowFreqHz: number; highFreqHz: number }): StationReference[]
  /** The licence register's version in force (null before the first import). */
  stationRegisterVersion?(): number | null
  calculation?(id: string): CalculationReference | undefined
}
