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

/**
 * p-th percentile of values by linear interpolation between order statistics. Eq. (1) needs
 * only x(⌊h⌋) and x(⌊h⌋+1), so they are selected (quickselect, O(n)) rather than sorting all
 * values; the result is the same as from the sorted values (which are used when the values hold
 * NaN, or a zero is selected, where the sort's order of NaN and −0 matters).
 */
export function percentile(opts: { values: ArrayLike<number>; percentile: number }): number {
  const { values } = opts
  if (!values || values.length === 0) throw new RangeError('values must not be empty.')
  const p = requireInRange('percentile', opts.percentile, 0, 100)
  const a = new Float64Array(values.length)
  let hasNaN = false
  for (let i = 0; i < a.length; i++) {
    a[i] = values[i]
    if (a[i] !== a[i]) hasNaN = true
  }
  const n = a.length
  const h = (n - 1) * (p / 100)
  const lo = Math.floor(h)
  if (!hasNaN) {
    selectInPlace(a, lo)
    const xLo = a[lo]
    let xHi = xLo
    if (lo + 1 < n) {
      xHi = a[lo + 1]
      for (let i = lo + 2; i < n; i++) if (a[i] < xHi) xHi = a[i] // the least value above position lo
    }
    if (xLo !== 0 && xHi !== 0) return xLo + (h - lo) * (xHi - xLo) // Eq. (1) [dB], as percentileOfSorted computes it
  }
  return percentileOfSorted({ sortedValues: Float64Array.from(values).sort(), probability: p / 100 }) // Eq. (1) [dB]
}

/** Reorders a so that a[k] is the value a sort would put there, smaller or equal ones before it and larger or equal ones after (Hoare's selection). */
function selectInPlace(a: Float64Array, k: number): void {
  let left = 0
  let right = a.length - 1
  while (right > left) {
    // median of three as the pivot keeps sorted and reversed input linear
    const mid = (left + right) >> 1
    if (a[mid] < a[left]) swap(a, mid, left)
    if (a[right] < a[left]) swap(a, right, left)
    if (a[right] < a[mid]) swap(a, right, mid)
    const pivot = a[mid]
    let i = left
    let j = right
    while (i <= j) {
      while (a[i] < pivot) i++
      while (a[j] > pivot) j--
      if (i <= j) {
        swap(a, i, j)
        i++
        j--
      }
    }
    if (k <= j) right = j
    else if (k >= i) left = i
    else return
  }
}

function swap(a: Float64Array, i: number, j: number): void {
  const t = a[i]
  a[i] = a[j]
  a[j] = t
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
