/**
 * A spectrum trace: levels read at ascending frequencies, each in a resolution (noise)
 * bandwidth, and the frequency cell each point stands for.
 *
 * Document: none beyond arithmetic [D]. The `Eq. (n)` tags in this file refer to the list below.
 *
 *  (1) cell i = [ (f[i−1] + f[i])/2 , (f[i] + f[i+1])/2 ]; the end cells are symmetric,
 *      so on a uniform grid every cell is one bin spacing wide   [Hz]
 *  (2) share of cell i inside a band = |cell i ∩ [startHz, stopHz]| / |cell i|   [1]
 */
import { requireFinite } from '../guards'

/** A trace as read from an analyser or made from a power spectrum. */
export interface Trace {
  /** Strictly ascending frequencies [Hz]. */
  freqHz: ArrayLike<number>
  /** Level of each point, read in the trace's noise bandwidth [dBm] (or dBFS for an uncalibrated capture). */
  levelDbm: ArrayLike<number>
}

/** Checks a trace: same lengths, not empty, finite, frequencies strictly ascending. */
export function requireTrace(trace: Trace): number {
  if (!trace || !trace.freqHz || !trace.levelDbm) throw new RangeError('trace must have freqHz and levelDbm arrays.')
  const n = trace.freqHz.length
  if (n === 0) throw new RangeError('trace freqHz must not be empty.')
  if (trace.levelDbm.length !== n) {
    throw new RangeError(`trace freqHz and levelDbm must have the same length (got ${n} and ${trace.levelDbm.length}).`)
  }
  for (let i = 0; i < n; i++) {
    requireFinite(`freqHz[${i}]`, trace.freqHz[i])
    requireFinite(`levelDbm[${i}]`, trace.levelDbm[i])
    if (i > 0 && !(trace.freqHz[i] > trace.freqHz[i - 1])) {
      throw new RangeError(`trace freqHz must be strictly ascending (freqHz[${i}] = ${trace.freqHz[i]} follows ${trace.freqHz[i - 1]}).`)
    }
  }
  return n
}

/** Lower and upper edge of every point's cell [Hz]; a single point gets a zero-width cell. */
export function cellEdgesHz(freqHz: ArrayLike<number>): { lowHz: Float64Array; highHz: Float64Array } {
  const n = freqHz.length
  const lowHz = new Float64Array(n)
  const highHz = new Float64Array(n)
  for (let i = 0; i < n; i++) {
    const up = i + 1 < n ? (freqHz[i] + freqHz[i + 1]) / 2 : NaN // Eq. (1) [Hz]
    const down = i > 0 ? (freqHz[i - 1] + freqHz[i]) / 2 : NaN // Eq. (1) [Hz]
    lowHz[i] = i > 0 ? down : n > 1 ? freqHz[0] - (up - freqHz[0]) : freqHz[0]
    highHz[i] = i + 1 < n ? up : n > 1 ? freqHz[i] + (freqHz[i] - down) : freqHz[i]
  }
  return { lowHz, highHz }
}

/** Fraction of each cell that lies inside [startHz, stopHz] [1]. */
export function cellSharesInBand(opts: { edges: { lowHz: Float64Array; highHz: Float64Array }; startHz: number; stopHz: number }): Float64Array {
  const { edges, startHz, stopHz } = opts
  const n = edges.lowHz.length
  const share = new Float64Array(n)
  for (let i = 0; i < n; i++) {
    const width = edges.highHz[i] - edges.lowHz[i]
    const inside = Math.min(stopHz, edges.highHz[i]) - Math.max(startHz, edges.lowHz[i])
    share[i] = width > 0 ? Math.max(0, inside) / width : 0 // Eq. (2) [1]
  }
  return share
}

/** Largest relative departure of the point spacing from its mean (0 for a uniform grid) [1]. */
export function spacingIrregularity(freqHz: ArrayLike<number>): number {
  const n = freqHz.length
  if (n < 3) return 0
  const mean = (freqHz[n - 1] - freqHz[0]) / (n - 1)
  let worst = 0
  for (let i = 1; i < n; i++) worst = Math.max(worst, Math.abs(freqHz[i] - freqHz[i - 1] - mean) / mean)
  return worst
}

