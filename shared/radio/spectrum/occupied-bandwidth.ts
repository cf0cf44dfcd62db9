/**
 * Occupied bandwidth of an emission from a trace: the β/2 method.
 *
 * Document: ITU Radio Regulations, Article 1, No. 1.153 "occupied bandwidth": the width of a
 * band such that below its lower and above its upper limit the mean powers emitted are each
 * equal to a specified percentage β/2 of the total mean power; unless otherwise specified,
 * β/2 = 0.5 % (definition text confirmed in secondary reprints [V-S]). The β/2 measurement
 * method is that of Recommendation ITU-R SM.328 (Annex 1, "β/2 method") [M for revision and section].
 * The `Eq. (n)` tags in this file refer to the list below.
 *
 *  (1) p_i = s_i · 10^(L_i/10) · Δf_i          power in the in-span part of cell i (trace.ts)
 *      [mW·Hz/ENBW; the ENBW factor is common to all cells and cancels]
 *  (2) P = Σ p_i; the power is taken as spread evenly over each cell
 *  (3) f_low: cumulative power from the low edge reaches (β/2)·P;
 *      f_high: cumulative power reaches (1 − β/2)·P (linear within the cell)   [Hz]
 *  (4) OBW = f_high − f_low   [Hz]
 *
 * Everything in the span counts as emission, noise included: a span much wider than the
 * emission, or a low signal-to-noise ratio, reads wide; an emission cut by the span edge reads
 * narrow. Both are screened and reported as warnings. Synthetic checks with known answers [D]:
 * a flat spectrum of width B gives 0.99·B; a Gaussian PSD of standard deviation σ gives
 * 2·z·σ with z = Φ⁻¹(0.995) = 2.5758.
 */
import { requireFinite, requireInRange, requirePositive } from '../guards'
import type { MethodRef, RadioResult } from '../types'
import { percentile } from './noise-floor'
import { cellEdgesHz, cellSharesInBand, requireTrace, type Trace } from './trace'

/** Width of each span edge checked for power that may run past the span, as a fraction of the span. */
const EDGE_FRACTION = 0.02

export const OCCUPIED_BANDWIDTH_METHOD: MethodRef = {
  id: 'occupied-bandwidth-beta2',
  source: 'ITU Radio Regulations No. 1.153 (β/2 = 0.5 %); β/2 method of Recommendation ITU-R SM.328',
}

export interface OccupiedBandwidth {
  occupiedBandwidthHz: number
  lowerEdgeHz: number
  upperEdgeHz: number
  centreHz: number
  /** Percentage outside the band on both sides together (default 1 %, i.e. 0.5 % each side). */
  betaPercent: number
  /** Total power in the span, only when enbwHz is given (channel-power sum over the span) [dBm]. */
  totalPowerDbm?: number
}

export interface OccupiedBandwidthOptions extends Trace {
  /** Span to consider; default the whole trace [Hz]. */
  startHz?: number
  stopHz?: number
  /** β in percent, 0 < β < 100; default 1 (β/2 = 0.5 % each side). */
  betaPercent?: number
  /** Noise bandwidth the trace was read in, used only to warn when it is too wide [Hz]. */
  enbwHz?: number
}

/** Occupied bandwidth of the emission in a trace by the β/2 method. */
export function occupiedBandwidth(opts: OccupiedBandwidthOptions): RadioResult<OccupiedBandwidth> {
  const n = requireTrace(opts)
  if (n < 2) throw new RangeError('trace must have at least two points.')
  const betaPercent = requireInRange('betaPercent', opts.betaPercent ?? 1, 1e-9, 99.999999)
  const edges = cellEdgesHz(opts.freqHz)
  const startHz = requireFinite('startHz', opts.startHz ?? edges.lowHz[0])
  const stopHz = requireFinite('stopHz', opts.stopHz ?? edges.highHz[n - 1])
  if (!(stopHz > startHz)) throw new RangeError(`stopHz must be above startHz (got ${startHz} to ${stopHz}).`)
  const share = cellSharesInBand({ edges, startHz, stopHz })

  const lo = new Float64Array(n)
  const hi = new Float64Array(n)
  const p = new Float64Array(n)
  let total = 0
  let first = -1
  let last = -1
  for (let i = 0; i < n; i++) {
    if (share[i] === 0) continue
    lo[i] = Math.max(edges.lowHz[i], startHz)
    hi[i] = Math.min(edges.highHz[i], stopHz)
    p[i] = share[i] * 10 ** (opts.levelDbm[i] / 10) * (edges.highHz[i] - edges.lowHz[i]) // Eq. (1) [mW·Hz]
    total += p[i] // Eq. (2) [mW·Hz]
    if (first < 0) first = i
    last = i
  }
  if (first < 0) throw new RangeError(`span ${startHz}–${stopHz} Hz holds no trace point.`)
  if (!(total > 0)) throw new RangeError('the trace holds no power in the span.')

  const lowTarget = (betaPercent / 200) * total // Eq. (3) [mW·Hz]
  const highTarget = (1 - betaPercent / 200) * total // Eq. (3) [mW·Hz]
  const lower = crossing(lo, hi, p, first, last, lowTarget)
  const upper = crossing(lo, hi, p, first, last, highTarget)
  const occupiedBandwidthHz = upper.freqHz - lower.freqHz // Eq. (4) [Hz]

  const warnings: string[] = []
  const spanLowHz = lo[first]
  const spanHighHz = hi[last]
  const edgeHz = EDGE_FRACTION * (spanHighHz - spanLowHz)
  const lowEdgeShare = powerBetween(lo, hi, p, first, last, spanLowHz, spanLowHz + edgeHz) / total
  const highEdgeShare = powerBetween(lo, hi, p, first, last, spanHighHz - edgeHz, spanHighHz) / total
  if (Math.max(lowEdgeShare, highEdgeShare) > betaPercent / 200 / 10) {
    warnings.push(
      `The outer ${EDGE_FRACTION * 100} % of the span holds ${(Math.max(lowEdgeShare, highEdgeShare) * 100).toFixed(3)} % of the power: the emission may extend beyond the span, which makes the result read narrow; widen the span (screening rule: more than a tenth of β/2; common practice, no source).`,
    )
  }
  const inSpanLevels: number[] = []
  for (let i = first; i <= last; i++) inSpanLevels.push(opts.levelDbm[i])
  const floorMw = 10 ** (percentile({ values: inSpanLevels, percentile: 10 }) / 10)
  const noiseShare = (floorMw * (hi[last] - lo[first])) / total
  if (noiseShare > betaPercent / 1000) {
    warnings.push(
      `Noise in the span (estimated from the 10th-percentile level) carries about ${(noiseShare * 100).toFixed(2)} % of the total power: the occupied bandwidth reads wide; narrow the span or improve the signal-to-noise ratio.`,
    )
  }
  if (opts.enbwHz !== undefined && occupiedBandwidthHz < 10 * requirePositive('enbwHz', opts.enbwHz)) {
    warnings.push(
      `The occupied bandwidth is less than 10 noise bandwidths (${opts.enbwHz} Hz): the filter shape widens the result; use a narrower RBW (common practice, no source).`,
    )
  }
  return {
    value: {
      occupiedBandwidthHz,
      lowerEdgeHz: lower.freqHz,
      upperEdgeHz: upper.freqHz,
      centreHz: (lower.freqHz + upper.freqHz) / 2,
      betaPercent,
      totalPowerDbm: opts.enbwHz === undefined ? undefined : 10 * Math.log10(total / opts.enbwHz), // channel-power.ts Eq. (2) [dBm]
    },
    warnings,
    method: OCCUPIED_BANDWIDTH_METHOD,
  }
}

/** Power in [fromHz, toHz], each cell's power spread evenly over it. */
function powerBetween(lo: Float64Array, hi: Float64Array, p: Float64Array, first: number, last: number, fromHz: number, toHz: number): number {
  let sum = 0
  for (let i = first; i <= last; i++) {
    const width = hi[i] - lo[i]
    if (width <= 0) continue
    const inside = Math.min(toHz, hi[i]) - Math.max(fromHz, lo[i])
    if (inside > 0) sum += (p[i] * inside) / width
  }
  return sum
}

/** Frequency where the cumulative power first reaches target, linear within the cell. */
function crossing(lo: Float64Array, hi: Float64Array, p: Float64Array, first: number, last: number, target: number) {
  let cumulative = 0
  for (let i = first; i <= last; i++) {
    if (p[i] > 0 && cumulative + p[i] >= target) {
      const fraction = (target - cumulative) / p[i]
      return { freqHz: lo[i] + fraction * (hi[i] - lo[i]) } // Eq. (3) [Hz]
    }
    cumulative += p[i]
  }
  return { freqHz: hi[last] }
}
