/**
 * Log-distance path loss with optional breakpoints (piecewise exponents).
 *
 * Source: the log-distance model PL(d) = PL(d0) + 10·n·log10(d/d0) (+ X_σ), as given in
 * OpenStax/cnx module m15526 eqs. (2)–(4) [V-S] and Rappaport, "Wireless Communications",
 * 2nd ed., §4.9.1 eqs. (4.67)–(4.69) [M]. PL(d0) is free space (ITU-R P.525-4) unless given.
 * The multi-segment form keeps the loss continuous at each breakpoint: every segment starts
 * from the loss reached at the end of the previous one [D].
 *
 *  (1) PL(d) = PL(d0) + Σ_i 10·n_i·log10(min(d, d_{i+1}) / d_i)   over segments with d_i < d   [dB]
 *  (2) d = d_k · 10^((PL − PL(d_k)) / (10·n_k))                    inverse inside segment k      [m]
 *
 * Below d0 the first exponent is extrapolated, with a warning.
 */
import { requireFinite, requireNonEmpty, requirePositive } from '../guards'
import type { MethodRef } from '../types'
import { freeSpaceLossDb } from './free-space-p525'
import type { PathDistance, PathLoss } from './model'

export interface LogDistanceSegment {
  /** Distance at which this exponent starts to apply [m]. */
  startM: number
  /** Path-loss exponent n (2 in free space). */
  exponent: number
}

export interface LogDistanceParams {
  freqHz: number
  /** Reference distance d0 [m]. */
  refDistanceM: number
  /** Loss at d0 [dB]; free space at freqHz when omitted. */
  refLossDb?: number
  /** Segments in increasing startM; the first starts at refDistanceM. */
  segments: LogDistanceSegment[]
  /** Shadow-fading standard deviation σ [dB], passed through to results when given. */
  shadowSigmaDb?: number
}

export const LOG_DISTANCE_METHOD: MethodRef = {
  id: 'log-distance',
  source: 'Log-distance path loss PL(d0) + 10·n·log10(d/d0), Rappaport 2nd ed. §4.9.1 eq. (4.68); PL(d0) per ITU-R P.525-4 when not given',
}

interface Prepared {
  segments: LogDistanceSegment[]
  /** Loss at the start of each segment [dB]. */
  startLossDb: number[]
  shadowSigmaDb?: number
  refDistanceM: number
}

function prepare(p: LogDistanceParams): Prepared {
  const freqHz = requirePositive('freqHz', p.freqHz)
  const refDistanceM = requirePositive('refDistanceM', p.refDistanceM)
  requireNonEmpty('segments', p.segments)
  const refLossDb =
    p.refLossDb === undefined
      ? freeSpaceLossDb({ freqHz, distanceM: refDistanceM }).lossDb // PL(d0) per ITU-R P.525 [dB]
      : requireFinite('refLossDb', p.refLossDb)
  if (p.shadowSigmaDb !== undefined && (!Number.isFinite(p.shadowSigmaDb) || p.shadowSigmaDb < 0)) {
    throw new RangeError(`shadowSigmaDb must be a finite number ≥ 0 (got ${p.shadowSigmaDb}).`)
  }
  p.segments.forEach((s, i) => {
    requirePositive(`segments[${i}].startM`, s.startM)
    requirePositive(`segments[${i}].exponent`, s.exponent)
    if (i > 0 && s.startM <= p.segments[i - 1].startM) {
      throw new RangeError(`segments[${i}].startM must be greater than segments[${i - 1}].startM (got ${s.startM}).`)
    }
  })
  if (p.segments[0].startM !== refDistanceM) {
    throw new RangeError(`segments[0].startM must equal refDistanceM (${refDistanceM} m), got ${p.segments[0].startM}.`)
  }
  const startLossDb = [refLossDb]
  for (let i = 1; i < p.segments.length; i++) {
    const prev = p.segments[i - 1]
    startLossDb.push(startLossDb[i - 1] + 10 * prev.exponent * Math.log10(p.segments[i].startM / prev.startM)) // Eq. (1) [dB]
  }
  return { segments: p.segments, startLossDb, shadowSigmaDb: p.shadowSigmaDb, refDistanceM }
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
export function logDistanceLossDb(opts: LogDistanceParams & { distanceM: number }): PathLoss {
  const distanceM = requirePositive('distanceM', opts.distanceM)
  const prep = prepare(opts)
  const k = segmentIndexAt(prep, distanceM)
  const seg = prep.segments[k]
  const lossDb = prep.startLossDb[k] + 10 * seg.exponent * Math.log10(distanceM / seg.startM) // Eq. (1) [dB]
  return {
    lossDb,
    warnings: belowRefWarning(distanceM, prep.refDistanceM),
    method: LOG_DISTANCE_METHOD,
    ...(prep.shadowSigmaDb !== undefined ? { shadowSigmaDb: prep.shadowSigmaDb } : {}),
  }
}

/** Distance at which the log-distance loss equals lossDb [m] (closed form, loss is increasing). */
export function logDistanceDistanceM(opts: LogDistanceParams & { lossDb: number }): PathDistance {
  const lossDb = requireFinite('lossDb', opts.lossDb)
  const prep = prepare(opts)
  let k = 0
  while (k + 1 < prep.segments.length && lossDb >= prep.startLossDb[k + 1]) k++
  const seg = prep.segments[k]
  const distanceM = seg.startM * 10 ** ((lossDb - prep.startLossDb[k]) / (10 * seg.exponent)) // Eq. (2) [m]
  return { distanceM, warnings: belowRefWarning(distanceM, prep.refDistanceM), method: LOG_DISTANCE_METHOD }
}

/** Local slope [dB per decade] = 10·n of the segment that holds the distance. */
export function logDistanceSlopeDbPerDecade(opts: LogDistanceParams & { distanceM: number }): number {
  const distanceM = requirePositive('distanceM', opts.distanceM)
  const prep = prepare(opts)
  return 10 * prep.segments[segmentIndexAt(prep, distanceM)].exponent
}
