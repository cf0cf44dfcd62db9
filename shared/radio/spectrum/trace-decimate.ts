/**
 * A trace reduced for display to at most `maxPoints` points without losing its extremes:
 * the points are split into maxPoints/2 consecutive buckets of (nearly) equal count and each
 * bucket keeps its lowest and its highest point, in frequency order. Every peak (a bucket's
 * maximum) and every notch survives with its own frequency and level; only the points between
 * them are dropped. For display only: analysis (peaks, channel power) runs on the full trace.
 *
 * Document: none beyond arithmetic; min/max decimation is common practice for drawing traces
 * (common practice, no source).
 *
 *  (1) bucket b holds points [⌊b·n/B⌋, ⌊(b+1)·n/B⌋), B = ⌊maxPoints/2⌋
 *  (2) kept: argmin and argmax of the levels in each bucket, ascending by index (one when equal)
 */
import { requireTrace, type Trace } from './trace'

export const DISPLAY_TRACE_MAX_POINTS = 4096

export interface DecimatedTrace {
  freqHz: Float64Array
  levelDbm: Float64Array
  /** True when points were dropped. */
  decimated: boolean
  /** Points of the input. */
  sourcePointCount: number
}

/** A min/max-preserving reduction of a trace to at most maxPoints (default 4,096) points. */
export function decimateTrace(opts: Trace & { maxPoints?: number }): DecimatedTrace {
  const n = requireTrace(opts)
  const maxPoints = opts.maxPoints ?? DISPLAY_TRACE_MAX_POINTS
  if (!Number.isInteger(maxPoints) || maxPoints < 2) throw new RangeError(`maxPoints must be an integer ≥ 2 (got ${maxPoints}).`)
  if (n <= maxPoints) {
    return { freqHz: Float64Array.from(opts.freqHz), levelDbm: Float64Array.from(opts.levelDbm), decimated: false, sourcePointCount: n }
  }
  const buckets = Math.floor(maxPoints / 2)
  const keep: number[] = []
  for (let b = 0; b < buckets; b++) {
    const from = Math.floor((b * n) / buckets) // Eq. (1)
    const to = Math.floor(((b + 1) * n) / buckets)
    let lo = from
    let hi = from
    for (let i = from + 1; i < to; i++) {
      const v = opts.levelDbm[i]
      if (v < opts.levelDbm[lo]) lo = i
      if (v > opts.levelDbm[hi]) hi = i
    }
    // Eq. (2): both extremes, in frequency order
    if (lo === hi) keep.push(lo)
    else if (lo < hi) keep.push(lo, hi)
    else keep.push(hi, lo)
  }
  const freqHz = new Float64Array(keep.length)
  const levelDbm = new Float64Array(keep.length)
  keep.forEach((i, k) => {
    freqHz[k] = opts.freqHz[i]
    levelDbm[k] = opts.levelDbm[i]
  })
  return { freqHz, levelDbm, decimated: true, sourcePointCount: n }
}
