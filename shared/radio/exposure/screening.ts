/**
 * RF exposure screening: worst-case far-field power density at a distance from an EIRP,
 * compared with an ICNIRP (2020) reference level; and the distance at which the level is reached.
 *
 * Document: far-field power density S = EIRP/(4πd²) (ITU-R P.525-4 §2, exact [D]); optional
 * ground-reflection factor 2.56 = 1.6² (field reflection 1.6), common practice in exposure
 * screening as in FCC OET Bulletin 65 (1997) [M for the equation number]; reference levels in
 * icnirp-2020-reference-levels.ts. Screening only: a fraction near or above 1 calls for a proper
 * assessment under the local code.
 *
 * Equations:
 *   (1) S = F·δ·EIRP/(4π d²)                 [W/m²]  F = 2.56 with ground reflection, else 1; δ = duty cycle
 *   (2) d = √(F·δ·EIRP/(4π S_ref))           [m]     compliance distance (inverse)
 */
import { requireFinite, requirePositive } from '../guards'
import type { MethodRef, RadioResult } from '../types'
import { dbmToWatts } from '../units'
import { farFieldWarnings } from '../chain/far-field'
import {
  icnirp2020ReferenceLevel,
  type ExposureAveraging,
  type ExposurePopulation,
  type ReferenceLevel,
} from './icnirp-2020-reference-levels'

/** Power-density factor for a ground reflection adding in phase: 1.6² (common practice; FCC OET Bulletin 65 [M]). */
export const GROUND_REFLECTION_FACTOR = 2.56
/** Fraction of a level above which the result cautions that the level is being approached. */
export const APPROACHING_FRACTION = 0.2

export const EXPOSURE_SCREENING_METHOD: MethodRef = {
  id: 'rf-exposure-screening-icnirp-2020',
  source:
    'S = EIRP/(4πd²) far field [D]; ground-reflection factor 2.56 (common practice, FCC OET Bulletin 65 [M]); ' +
    'ICNIRP (2020) Health Physics 118(5):483–524 Tables 5–6 reference levels (row status in the data) — register EX-S-1…EX-S-3, EX-D, EX-T5, EX-T6',
}

export const SCREENING_NOTICE =
  'Screening values only: worst-case far-field estimate against ICNIRP (2020) reference levels. Local codes and licensed practice govern RF exposure.'

export type ExposureCaution = 'none' | 'approaching' | 'above'

export interface ExposureSource {
  /** Time-averaged EIRP toward the point [dBm], or give eirpW. */
  eirpDbm?: number
  eirpW?: number
  freqHz: number
  population: ExposurePopulation
  averaging?: ExposureAveraging
  /** Multiply the power density by 2.56 for a ground reflection (default false). */
  groundReflection?: boolean
  /** Fraction of the averaging time the transmitter is on, 0 < δ ≤ 1 (default 1: continuous). */
  dutyCycle?: number
}

export interface ExposureScreening {
  powerDensityWPerM2: number
  referenceLevelWPerM2: number
  fractionOfLevel: number
  caution: ExposureCaution
  cautionText: string | null
  notice: string
  referenceLevel: ReferenceLevel
  /** Distance at which the reference level is reached under the same assumptions [m]. */
  complianceDistanceM: number
}

interface Resolved {
  effectiveEirpW: number
  level: ReferenceLevel
  warnings: string[]
}

function resolveSource(opts: ExposureSource): Resolved {
  if ((opts.eirpDbm === undefined) === (opts.eirpW === undefined)) throw new RangeError('Give exactly one of eirpDbm or eirpW.')
  const eirpW = opts.eirpW !== undefined ? requirePositive('eirpW', opts.eirpW) : dbmToWatts(requireFinite('eirpDbm', opts.eirpDbm as number))
  const duty = opts.dutyCycle === undefined ? 1 : requirePositive('dutyCycle', opts.dutyCycle)
  if (duty > 1) throw new RangeError(`dutyCycle must be at most 1 (got ${duty}).`)
  const factor = opts.groundReflection ? GROUND_REFLECTION_FACTOR : 1
  const level = icnirp2020ReferenceLevel({ freqHz: opts.freqHz, population: opts.population, averaging: opts.averaging })
  const warnings: string[] = []
  if (level.row.status === '[M]') {
    warnings.push(`Reference level ${level.row.formula} is marked [M]: recalled, not verified in the ICNIRP text.`)
  }
  if (level.basis !== 'Sinc') {
    warnings.push(
      'Below 30 MHz the reference levels are E and H fields, both to be met whatever the distance; this screening compares only the plane-wave equivalent of the E level.',
    )
  }
  if (opts.groundReflection) warnings.push('Ground reflection included: power density × 2.56 (field × 1.6), common practice for screening.')
  return { effectiveEirpW: factor * duty * eirpW, level, warnings }
}

function cautionFor(fraction: number): { caution: ExposureCaution; text: string | null } {
  const pct = `${+(fraction * 100).toPrecision(3)} %`
  if (fraction > 1) {
    return {
      caution: 'above',
      text: `Above the reference level (${pct} of it) on this screening estimate. Keep people out of this zone and arrange a proper exposure assessment; these are screening values, and local codes and licensed practice govern.`,
    }
  }
  if (fraction > APPROACHING_FRACTION) {
    return {
      caution: 'approaching',
      text: `Approaching the reference level (${pct} of it) on this screening estimate. Limit time near the antenna and check before staying; these are screening values, and local codes and licensed practice govern.`,
    }
  }
  return { caution: 'none', text: null }
}

/** Distance at which the power density equals the reference level [m] (inverse of the screening). */
export function exposureComplianceDistanceM(opts: ExposureSource): RadioResult<{ complianceDistanceM: number; referenceLevelWPerM2: number }> {
  const r = resolveSource(opts)
  const s = r.level.powerDensityWPerM2
  return {
    value: { complianceDistanceM: Math.sqrt(r.effectiveEirpW / (4 * Math.PI * s)), referenceLevelWPerM2: s }, // Eq. (2) [m]
    warnings: [...r.warnings, SCREENING_NOTICE],
    method: EXPOSURE_SCREENING_METHOD,
  }
}

/** Power density at a distance and its fraction of the reference level, with cautions. */
export function screenExposure(opts: ExposureSource & { distanceM: number; antennaSizeM?: number }): RadioResult<ExposureScreening> {
  const d = requirePositive('distanceM', opts.distanceM)
  const r = resolveSource(opts)
  const s = r.effectiveEirpW / (4 * Math.PI * d ** 2) // Eq. (1) [W/m²]
  const sRef = r.level.powerDensityWPerM2
  const fraction = s / sRef
  const c = cautionFor(fraction)
  const near = farFieldWarnings({ freqHz: opts.freqHz, distanceM: d, antennaSizeM: opts.antennaSizeM })
  return {
    value: {
      powerDensityWPerM2: s,
      referenceLevelWPerM2: sRef,
      fractionOfLevel: fraction,
      caution: c.caution,
      cautionText: c.text,
      notice: SCREENING_NOTICE,
      referenceLevel: r.level,
      complianceDistanceM: Math.sqrt(r.effectiveEirpW / (4 * Math.PI * sRef)), // Eq. (2) [m]
    },
    warnings: [...r.warnings, ...near, SCREENING_NOTICE],
    method: EXPOSURE_SCREENING_METHOD,
  }
}
