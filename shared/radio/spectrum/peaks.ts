/**
 * Peaks of a trace: local maxima above the noise floor, with their topographic prominence.
 *
 * Document: none; the definitions are the usual ones of signal processing and topography
 * (common practice, no source), and follow scipy.signal.find_peaks / peak_prominences, which
 * the tests use as the reference implementation. The `Eq. (n)` tags refer to the list below.
 *
 *  (1) a peak is a sample, or the middle of a run of equal samples (rounded down), whose
 *      neighbours on both sides of the run are strictly lower; the ends of a trace are never peaks
 *  (2) from the peak, walk left (right) until a strictly higher sample or the trace end;
 *      the base on that side is the lowest sample walked over
 *  (3) prominence = peak level − max(left base, right base)   [dB]
 *  (4) a peak is reported when level ≥ noise floor + thresholdDb and prominence ≥ minProminenceDb
 */
import { requireFinite, requireNonNegative } from '../guards'
import type { MethodRef, RadioResult } from '../types'
import { noiseFloor } from './noise-floor'
import { requireTrace, type Trace } from './trace'

export const PEAKS_METHOD: MethodRef = {
  id: 'trace-peaks-prominence',
  source: 'Local maxima with topographic prominence (common practice, no source); noise floor per noise-floor-percentile',
}

export interface LocalMaximum {
  index: number
  prominenceDb: number
  leftBaseIndex: number
  rightBaseIndex: number
}

/**
 * Every local maximum of a sequence of levels with its prominence, in index order.
 *
 * The walks of Eq. (2) are done for all samples at once, in O(n): one pass from each side
 * keeps a stack of the samples not yet passed by a higher one, each with the lowest sample of
 * its stretch, so a trace of a million points (a sloping signal skirt holds thousands of small
 * maxima whose walks would each cross the whole skirt) costs two linear passes.
 */
export function localMaximaWithProminence(levelDb: ArrayLike<number>): LocalMaximum[] {
  const n = levelDb.length
  const out: LocalMaximum[] = []
  const left = lowestUntilHigher(levelDb, -1)
  const right = lowestUntilHigher(levelDb, 1)
  let i = 1
  while (i < n - 1) {
    if (levelDb[i - 1] < levelDb[i]) {
      let ahead = i + 1
      while (ahead < n - 1 && levelDb[ahead] === levelDb[i]) ahead++
      if (levelDb[ahead] < levelDb[i]) {
        const index = (i + ahead - 1) >> 1 // Eq. (1) [index]
        out.push({
          index,
          prominenceDb: levelDb[index] - Math.max(left.minDb[index], right.minDb[index]), // Eq. (3) [dB]
          leftBaseIndex: left.minIndex[index],
          rightBaseIndex: right.minIndex[index],
        })
        i = ahead
        continue
      }
    }
    i++
  }
  return out
}

/**
 * Eq. (2) for every sample p: walking from p in `direction` (−1 left, +1 right) while samples
 * are ≤ level[p], the lowest sample met (p itself included) and its index — the one nearest to
 * p when several are equally low, as a step-by-step walk that moves the base only on a strictly
 * lower sample finds it.
 */
function lowestUntilHigher(levelDb: ArrayLike<number>, direction: -1 | 1): { minDb: Float64Array; minIndex: Int32Array } {
  const n = levelDb.length
  const minDb = new Float64Array(n)
  const minIndex = new Int32Array(n)
  // stack entries: a sample not yet passed by a higher one, with the lowest sample of the
  // stretch between it and the entry below it (that stretch's walk result)
  const stackAt = new Int32Array(n)
  const stackMin = new Float64Array(n)
  const stackMinAt = new Int32Array(n)
  let top = 0
  for (let step = 0; step < n; step++) {
    const p = direction === 1 ? n - 1 - step : step
    const v = levelDb[p]
    let lowest = v
    let lowestAt = p
    // entries the walk from p passes over (≤ v), nearest first: their stretches join p's
    while (top > 0 && levelDb[stackAt[top - 1]] <= v) {
      top--
      if (stackMin[top] < lowest) {
        lowest = stackMin[top] // Eq. (2) [dB]
        lowestAt = stackMinAt[top]
      }
    }
    stackAt[top] = p
    stackMin[top] = lowest
    stackMinAt[top] = lowestAt
    top++
    minDb[p] = lowest
    minIndex[p] = lowestAt
  }
  return { minDb, minIndex }
}

export interface TracePeak {
  index: number
  freqHz: number
  levelDbm: number
  prominenceDb: number
  /** Level above the noise floor used [dB]. */
  aboveNoiseDb: number
}

export interface PeakSearch {
  peaks: TracePeak[]
  noiseFloorDbm: number
  /** How the noise floor was obtained, stated with the result. */
  noiseFloorBasis: string
  thresholdDb: number
  minProminenceDb: number
}

/**
 * Peaks above the noise floor by `thresholdDb` (default 10 dB) with at least `minProminenceDb`
 * (default 6 dB) of prominence, strongest first, at most `maxPeaks` (default 10). The noise
 * floor is the given one, or the trace median (noiseFloor, percentile 50). Defaults are
 * common practice, no source.
 */
export function findPeaks(
  opts: Trace & { thresholdDb?: number; minProminenceDb?: number; maxPeaks?: number; noiseFloorDbm?: number },
): RadioResult<PeakSearch> {
  requireTrace(opts)
  const thresholdDb = requireFinite('thresholdDb', opts.thresholdDb ?? 10)
  const minProminenceDb = requireNonNegative('minProminenceDb', opts.minProminenceDb ?? 6)
  const maxPeaks = opts.maxPeaks ?? 10
  if (!Number.isInteger(maxPeaks) || maxPeaks < 1) throw new RangeError(`maxPeaks must be a positive integer (got ${maxPeaks}).`)
  const warnings: string[] = []
  let noiseFloorDbm: number
  let noiseFloorBasis: string
  if (opts.noiseFloorDbm !== undefined) {
    noiseFloorDbm = requireFinite('noiseFloorDbm', opts.noiseFloorDbm)
    noiseFloorBasis = 'given by the caller'
  } else {
    const floor = noiseFloor({ freqHz: opts.freqHz, levelDbm: opts.levelDbm, percentile: 50 })
    noiseFloorDbm = floor.value.noiseFloorDbm
    noiseFloorBasis = 'median (50th percentile) of the trace levels'
    warnings.push(...floor.warnings)
  }
  const candidates = localMaximaWithProminence(opts.levelDbm).filter(
    (m) => opts.levelDbm[m.index] >= noiseFloorDbm + thresholdDb && m.prominenceDb >= minProminenceDb, // Eq. (4)
  )
  candidates.sort((a, b) => opts.levelDbm[b.index] - opts.levelDbm[a.index] || a.index - b.index)
  if (candidates.length > maxPeaks) warnings.push(`${candidates.length} peaks qualified; the ${maxPeaks} strongest are reported.`)
  const peaks = candidates.slice(0, maxPeaks).map((m) => ({
    index: m.index,
    freqHz: opts.freqHz[m.index],
    levelDbm: opts.levelDbm[m.index],
    prominenceDb: m.prominenceDb,
    aboveNoiseDb: opts.levelDbm[m.index] - noiseFloorDbm,
  }))
  return { value: { peaks, noiseFloorDbm, noiseFloorBasis, thresholdDb, minProminenceDb }, warnings, method: PEAKS_METHOD }
}
