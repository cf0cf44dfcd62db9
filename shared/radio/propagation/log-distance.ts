/**
 * Log-distance path loss with optional exponent changes (piecewise exponents).
 *
 * Source: the log-distance model PL(d) = PL(d0) + 10·n·log10(d/d0) (+ X_σ), as given in
 * OpenStax/cnx module m15526 eqs. (2)–(4) [V-S] and Rappaport, "Wireless Communications",
 * 2nd ed., §4.9.1 eqs. (4.67)–(4.69) [M]. PL(d0) is free space (ITU-R P.525-4) unless given.
 * The multi-segment form keeps the loss continuous at each exponent-change distance: every
 * segment starts from the loss reached at the end of the previous one [D].
 *
 * Naming: the distances where the exponent changes are "exponent-change distances"
 * (`exponentChanges[i].fromDistanceM`). In this library "breakpoint" means only the distance
 * at which a ground-reflection model turns to its d⁻⁴ branch (two-ray, TR 38.901 d_BP).
 *
 *  (1) PL(d) = PL(d0) + Σ_i 10·n_i·log10(min(d, d_{i+1}) / d_i)   over segments with d_i < d   [dB]
 *  (2) d = d_k · 10^((PL − PL(d_k)) / (10·n_k))                    inverse inside segment k      [m]
 *
 * Below d0 the first exponent is extrapolated, with a warning. Frequency is needed only when
 * PL(d0) is not given (free space at d0).
 */
import { requireFinite, requirePositive } from '../guards'
import type { MethodRef } from '../types'
import { freeSpaceLossDb } from './free-space-p525'
import type { PathDistanceResult, PathLossResult } from './model'

/** A later exponent and the distance from which it applies. */
export interface LogDistanceExponentChange {
  /** Exponent-change distance: this exponent applies from here on [m] (> d0). */
  fromDistanceM: number
  /** Path-loss exponent n (2 in free space). */
  exponent: number
}

export interface LogDistanceParams {
  /** Frequency [Hz]; needed only when refLossDb is omitted (free space at d0). */
  freqHz?: number
  /** Reference distance d0 [m]. */
  refDistanceM: number
  /** Loss at d0 [dB]; free space at freqHz when omitted. */
  refLossDb?: number
  /** Path-loss exponent n from d0 (2 in free space). */
  exponent: number
  /** Later exponents in increasing fromDistanceM, each beyond d0. */
  exponentChanges?: LogDistanceExponentChange[]
  /** Shadow-fading standard deviation σ [dB], passed through to results when given. */
  shadowSigmaDb?: number
}

export const LOG_DISTANCE_METHOD: MethodRef = {
  id: 'log-distance',
  source: 'Log-distance path loss PL(d0) + 10·n·log10(d/d0), Rappaport 2nd ed. §4.9.1 eq. (4.68); PL(d0) per ITU-R P.525-4 when not given',
}

interface Segment {
  startM: number
  exponent: number
}

interface Prepared {
  segments: Segment[]
  /** Loss at the start of each segment [dB]. */
  startLossDb: number[]
  shadowSigmaDb?: number
  refDistanceM: number
}

function prepare(p: LogDistanceParams): Prepared {
  const refDistanceM = requirePositive('refDistanceM', p.refDistanceM)
  let refLossDb: number
  if (p.refLossDb !== undefined) refLossDb = requireFinite('refLossDb', p.refLossDb)
  else if (p.freqHz !== undefined) {
    const freqHz = requirePositive('freqHz', p.freqHz)
    refLossDb = freeSpaceLossDb({ freqHz, distanceM: refDistanceM }).value.lossDb // PL(d0) per ITU-R P.525 [dB]
  } else throw new RangeError('Give refLossDb, or freqHz for free-space loss at the reference distance refDistanceM.')
  if (p.shadowSigmaDb !== undefined && (!Number.isFinite(p.shadowSigmaDb) || p.shadowSigmaDb < 0)) {
    throw new RangeError(`shadowSigmaDb must be a finite number ≥ 0 (got ${p.shadowSigmaDb}).`)
  }
  const segments: Segment[] = [{ startM: refDistanceM, exponent: requirePositive('exponent', p.exponent) }]
  ;(p.exponentChanges ?? []).forEach((c, i) => {
    const startM = requirePositive(`exponentChanges[${i}].fromDistanceM`, c.fromDistanceM)
    const exponent = requirePositive(`exponentChanges[${i}].exponent`, c.exponent)
    const prevM = segments[segments.length - 1].startM
    if (startM <= prevM) {
      throw new RangeError(
        `exponentChanges[${i}].fromDistanceM must be greater than ${i === 0 ? `refDistanceM (${prevM} m)` : `exponentChanges[${i - 1}].fromDistanceM`} (got ${startM}).`,
      )
    }
    segments.push({ startM, exponent })
  })
  const startLossDb = [refLossDb]
  for (let i = 1; i < segments.length; i++) {
    const prev = segments[i - 1]
    startLossDb.push(startLossDb[i - 1] + 10 * prev.exponent * Math.log10(segments[i].startM / prev.startM)) // Eq. (1) [dB]
  }
  return { segments, startLossDb, shadowSigmaDb: p.shadowSigmaDb, refDistanceM }
}

function belowRefWarning(distanceM: number, refDistanceM: number): string[] {
  return distanceM < refDistanceM
    ? [`distanceM = ${+distanceM.toPrecision(4)} m is below the reference distance d0 = ${refDistanceM} m; the first exponent is extrapolated.`]
    : []
}

function segmentIndexAt(prep: Prepared, distanceM: number): number {
  let k = 0
  while (k + 1 < prep.segments.length && distanceM >= prep.segments[k + 1].startM) k++
  return k
}

/** Log-distance loss at a distance [dB]. */
export function logDistanceLossDb(opts: LogDistanceParams & { distanceM: number }): PathLossResult {
  const distanceM = requirePositive('distanceM', opts.distanceM)
  const prep = prepare(opts)
  const k = segmentIndexAt(prep, distanceM)
  const seg = prep.segments[k]
  const lossDb = prep.startLossDb[k] + 10 * seg.exponent * Math.log10(distanceM / seg.startM) // Eq. (1) [dB]
  return {
    value: { lossDb, ...(prep.shadowSigmaDb !== undefined ? { shadowSigmaDb: prep.shadowSigmaDb } : {}) },
    warnings: belowRefWarning(distanceM, prep.refDistanceM),
    method: LOG_DISTANCE_METHOD,
  }
}

/** Distance at which the log-distance loss equals lossDb [m] (closed form, loss is increasing). */
export function logDistanceDistanceM(opts: LogDistanceParams & { lossDb: number }): PathDistanceResult {
  const lossDb = requireFinite('lossDb', opts.lossDb)
  const prep = prepare(opts)
  let k = 0
  while (k + 1 < prep.segments.length && lossDb >= prep.startLossDb[k + 1]) k++
  const seg = prep.segments[k]
  const distanceM = seg.startM * 10 ** ((lossDb - prep.startLossDb[k]) / (10 * seg.exponent)) // Eq. (2) [m]
  return { value: { distanceM }, warnings: belowRefWarning(distanceM, prep.refDistanceM), method: LOG_DISTANCE_METHOD }
}

/** Local slope [dB per decade] = 10·n of the segment that holds the distance. */
export function logDistanceSlopeDbPerDecade(opts: LogDistanceParams & { distanceM: number }): number {
  const distanceM = requirePositive('distanceM', opts.distanceM)
  const prep = prepare(opts)
  return 10 * prep.segments[segmentIndexAt(prep, distanceM)].exponent
}
