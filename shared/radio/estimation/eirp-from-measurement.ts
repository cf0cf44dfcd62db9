/**
 * EIRP back-calculated from one measurement at a known distance, with a GUM interval.
 *
 * EIRP = P_r + L(d): the isotropic received power at the measuring point plus the basic
 * transmission loss of the chosen propagation model (any PropagationModel). Field strength, power
 * flux-density and the power received by an antenna of known gain are first turned into P_r
 * (ITU-R P.525-4 §3 [M]; see chain/received-power.ts).
 * ERP = EIRP − 2.15 dB (ITU Radio Regulations Nos. 1.161, 1.162).
 * Interval: JCGM 100:2008 budget of the caller's measurement contributions, the distance
 * (through c_d = S/(d ln 10), JCGM 100:2008 §5.1; register 12-2) and the model's shadowing σ when it states one.
 */
import { FAR_FIELD_VALIDITY } from '../chain/far-field'
import { DIPOLE_GAIN_DBI } from '../constants'
import { requireFinite, requirePositive } from '../guards'
import type { PropagationModel, PropagationModelSpec } from '../propagation/model'
import { checkValidity, type CoverageInterval, type MethodRef, type RadioResult, type ValidityRange } from '../types'
import { dbmToWatts, wavelengthM } from '../units'
import { distanceContribution } from '../uncertainty/distance-sensitivity'
import { combineUncertainty, COVERAGE_FACTOR_95, type UncertaintyBudget, type UncertaintyContribution, type UncertaintyDistribution } from '../uncertainty/gum-budget'
import { fieldToReceivedPowerDbm, pfdToReceivedPowerDbm, receivedPowerToFieldDbuvPerM, receivedPowerToPfdDbwPerM2 } from '../chain/received-power'

/** One measurement, already corrected for the measuring chain (antenna, cables, RBW). */
export type PointMeasurement =
  | { kind: 'field-strength'; fieldStrengthDbuvPerM: number; freqHz: number }
  | { kind: 'pfd'; pfdDbwPerM2: number; freqHz: number }
  /** Power an isotropic (0 dBi) antenna would receive at the point. */
  | { kind: 'isotropic-power'; receivedPowerDbm: number }
  /** Power delivered by a receiving antenna of known gain toward the source (feeder losses already removed). */
  | { kind: 'received-power'; receivedPowerDbm: number; antennaGainDbi: number }

export interface EirpFromMeasurementOptions {
  measurement: PointMeasurement
  distanceM: number
  model: PropagationModel
  /** Measurement-side contributions in dB (sensitivity 1 unless stated): calibration, mismatch, repeatability… */
  measurementContributions?: UncertaintyContribution[]
  /** Uncertainty of the distance itself [m], e.g. { kind: 'rectangular', halfWidth: 5 }. */
  distanceUncertainty?: UncertaintyDistribution
  coverageFactor?: number
}

/** Powers in dBm (the library's one convention for powers in dB), and in W. */
export interface EirpEstimate {
  eirpDbm: number
  eirpW: number
  erpDbm: number
  erpW: number
  /** P_r at the point for an isotropic antenna [dBm]. */
  isotropicReceivedPowerDbm: number
  pathLossDb: number
  distanceM: number
  /** U = k·u_c [dB]; absent when no contribution was given. */
  expandedUncertaintyDb?: number
  /** 95 % interval of the EIRP (k = 2 unless stated) [dBm]. */
  eirpIntervalDbm?: { lowDbm: number; highDbm: number }
  budget?: UncertaintyBudget
  /** The propagation model's own method, for the record. */
  modelMethod: MethodRef
}

export const EIRP_FROM_MEASUREMENT_METHOD: MethodRef = {
  id: 'eirp-back-calculation',
  source: 'EIRP = P_r + L_b(d); P_r from E or S after ITU-R P.525-4 §3 (A_e = λ²/4π); ERP = EIRP − 2.15 dB (ITU RR Nos. 1.161–1.162); interval after JCGM 100:2008',
}

/** Far-field assumption of the E ↔ S ↔ P_r conversion, as data (chain/far-field.ts). */
export const EIRP_FROM_MEASUREMENT_VALIDITY: ValidityRange[] = FAR_FIELD_VALIDITY

/** Relative frequency difference between measurement and model above which a warning is given. */
const FREQ_MISMATCH_TOLERANCE = 0.01

/** Frequency the model was built for, when its spec states one. */
export function modelFreqHz(opts: { spec: PropagationModelSpec }): number | undefined {
  const { spec } = opts
  if (spec.kind === 'absorbing') return spec.base.freqHz
  return spec.freqHz
}

function isotropicPowerDbm(m: PointMeasurement): number {
  switch (m.kind) {
    case 'field-strength':
      return fieldToReceivedPowerDbm({ fieldStrengthDbuvPerM: m.fieldStrengthDbuvPerM, freqHz: m.freqHz })
    case 'pfd':
      return pfdToReceivedPowerDbm({ pfdDbwPerM2: m.pfdDbwPerM2, freqHz: m.freqHz })
    case 'isotropic-power':
      return requireFinite('receivedPowerDbm', m.receivedPowerDbm)
    case 'received-power':
      return requireFinite('receivedPowerDbm', m.receivedPowerDbm) - requireFinite('antennaGainDbi', m.antennaGainDbi) // Eq. (P_iso = P_r − G_r) [dBm]
    default:
      throw new RangeError(`unknown measurement kind '${(m as { kind: string }).kind}'.`)
  }
}

/** Back-calculates EIRP (and ERP) from one measurement at a known distance. */
export function eirpFromMeasurement(opts: EirpFromMeasurementOptions): RadioResult<EirpEstimate> {
  const distanceM = requirePositive('distanceM', opts.distanceM)
  if (!opts.model || typeof opts.model.lossDb !== 'function') throw new RangeError('model must be a PropagationModel.')
  const m = opts.measurement
  if (!m || typeof m !== 'object') throw new RangeError('measurement must be given.')
  const warnings: string[] = []
  const prDbm = isotropicPowerDbm(m)
  const loss = opts.model.lossDb(distanceM)
  warnings.push(...loss.warnings)
  const eirpDbm = prDbm + loss.value.lossDb // Eq. (EIRP = P_r + L_b) [dBm]

  const freqModelHz = modelFreqHz({ spec: opts.model.spec })
  if (m.kind === 'field-strength' || m.kind === 'pfd') {
    requirePositive('freqHz', m.freqHz)
    if (freqModelHz !== undefined && Math.abs(m.freqHz - freqModelHz) > FREQ_MISMATCH_TOLERANCE * freqModelHz) {
      warnings.push(`The measurement frequency (${m.freqHz} Hz) differs from the model's (${freqModelHz} Hz) by more than 1 %.`)
    }
  }
  const freqForCheckHz = m.kind === 'field-strength' || m.kind === 'pfd' ? m.freqHz : freqModelHz
  if (freqForCheckHz !== undefined) {
    warnings.push(...checkValidity(EIRP_FROM_MEASUREMENT_VALIDITY, { distanceInWavelengths: distanceM / wavelengthM(freqForCheckHz) }))
  }

  const contributions: UncertaintyContribution[] = [...(opts.measurementContributions ?? []).map((c) => ({ unit: 'dB', ...c }))]
  if (opts.distanceUncertainty) contributions.push(distanceContribution({ model: opts.model, distanceM, distance: opts.distanceUncertainty }))
  if (loss.value.shadowSigmaDb !== undefined && loss.value.shadowSigmaDb > 0) {
    contributions.push({ name: 'model (shadowing σ)', unit: 'dB', distribution: { kind: 'normal', expandedUncertainty: loss.value.shadowSigmaDb, coverageFactor: 1 } })
  }
  if (!opts.measurementContributions?.length) {
    warnings.push(contributions.length
      ? 'No measurement uncertainty was given: the interval covers only the distance and the model.'
      : 'No uncertainty was given: the EIRP has no interval.')
  }

  const erpDbm = eirpDbm - DIPOLE_GAIN_DBI // Eq. (RR 1.162) ERP = EIRP − 2.15 [dBm]
  const value: EirpEstimate = {
    eirpDbm,
    eirpW: dbmToWatts(eirpDbm),
    erpDbm,
    erpW: dbmToWatts(erpDbm),
    isotropicReceivedPowerDbm: prDbm,
    pathLossDb: loss.value.lossDb,
    distanceM,
    modelMethod: opts.model.method,
  }
  let interval: CoverageInterval | undefined
  if (contributions.length) {
    const budget = combineUncertainty({ contributions, coverageFactor: opts.coverageFactor ?? COVERAGE_FACTOR_95 })
    value.budget = budget
    value.expandedUncertaintyDb = budget.expandedUncertainty
    value.eirpIntervalDbm = { lowDbm: eirpDbm - budget.expandedUncertainty, highDbm: eirpDbm + budget.expandedUncertainty }
    const k = budget.coverageFactor
    interval = {
      quantity: 'eirpDbm',
      low: value.eirpIntervalDbm.lowDbm,
      high: value.eirpIntervalDbm.highDbm,
      basis: `JCGM 100:2008 U = k·u_c, k = ${k}${k === COVERAGE_FACTOR_95 ? ' (about 95 %)' : ''}`,
    }
  }
  return { value, ...(interval ? { interval } : {}), warnings, method: EIRP_FROM_MEASUREMENT_METHOD }
}

export interface PredictedMeasurement {
  isotropicReceivedPowerDbm: number
  fieldStrengthDbuvPerM?: number
  pfdDbwPerM2?: number
  pathLossDb: number
}

/**
 * Forward direction (inverse of eirpFromMeasurement): what a measurement at distance d would read
 * for a given EIRP. Field strength and pfd need the frequency.
 */
export function predictMeasurementFromEirp(opts: { eirpDbm: number; distanceM: number; model: PropagationModel; freqHz?: number }): RadioResult<PredictedMeasurement> {
  const eirpDbm = requireFinite('eirpDbm', opts.eirpDbm)
  const loss = opts.model.lossDb(requirePositive('distanceM', opts.distanceM))
  const prDbm = eirpDbm - loss.value.lossDb // Eq. (P_r = EIRP − L_b) [dBm]
  const value: PredictedMeasurement = { isotropicReceivedPowerDbm: prDbm, pathLossDb: loss.value.lossDb }
  if (opts.freqHz !== undefined) {
    requirePositive('freqHz', opts.freqHz)
    value.fieldStrengthDbuvPerM = receivedPowerToFieldDbuvPerM({ receivedPowerDbm: prDbm, freqHz: opts.freqHz })
    value.pfdDbwPerM2 = receivedPowerToPfdDbwPerM2({ receivedPowerDbm: prDbm, freqHz: opts.freqHz })
  }
  return { value, warnings: [...loss.warnings], method: EIRP_FROM_MEASUREMENT_METHOD }
}
