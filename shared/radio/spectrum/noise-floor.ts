/**
 * Noise floor of a trace as a robust percentile of its levels.
 *
 * Document: the percentile is the linear-interpolation estimate of R. J. Hyndman and
 * Y. Fan, "Sample quantiles in statistical packages", Am. Stat. 50(4):361–365, 1996,
 * definition 7 (citation confirmed in secondary references [V-S]) — numpy.percentile's default, which the tests use as
 * the reference. The `Eq. (n)` tags in this file refer to the list below.
 *
 *  (1) h = (n − 1)·p/100;  Q = x(⌊h⌋) + (h − ⌊h⌋)·(x(⌊h⌋+1) − x(⌊h⌋))   x sorted ascending   [dB]
 *
 * Why a percentile: signals occupy part of the span, so the median (or the 10th percentile
 * when signals fill more than half of it) stays on the noise while a mean would be pulled up
 * (common practice, no source). It is a statistic of the displayed levels, not a mean noise
 * power: a trace averaged in log units already reads noise about 2.51 dB low (Keysight AN 150 ch. 5; register 14-4).
 */
import { requireInRange } from '../guards'
import type { MethodRef, RadioResult } from '../types'
import { percentileOfSorted } from '../uncertainty/monte-carlo'
import { requireTrace, type Trace } from './trace'

export const NOISE_FLOOR_METHOD: MethodRef = {
  id: 'noise-floor-percentile',
  source: 'Percentile of trace levels, Hyndman & Fan (1996) definition 7 (linear interpolation)',
}

/** p-th percentile of values by linear interpolation between order statistics. */
export function percentile(opts: { values: ArrayLike<number>; percentile: number }): number {
  const { values } = opts
  if (!values || values.length === 0) throw new RangeError('values must not be empty.')
  const p = requireInRange('percentile', opts.percentile, 0, 100)
  return percentileOfSorted({ sortedValues: Float64Array.from(values).sort(), probability: p / 100 }) // Eq. (1) [dB]
}

export interface NoiseFloor {
  noiseFloorDbm: number
  /** The percentile used, stated with the result. */
  percentile: number
  pointCount: number
}

/** Noise floor of a trace: a percentile of its levels (default the median, 50). */
export function noiseFloor(opts: Trace & { percentile?: number }): RadioResult<NoiseFloor> {
  const n = requireTrace(opts)
  const p = opts.percentile ?? 50
  const warnings: string[] = []
  if (n < 20) warnings.push(`Only ${n} trace points: the noise-floor percentile is coarse (fewer than 20 points; common practice, no source).`)
  return {
    value: { noiseFloorDbm: percentile({ values: opts.levelDbm, percentile: p }), percentile: p, pointCount: n },
    warnings,
    method: NOISE_FLOOR_METHOD,
  }
}
