/**
 * The charts' data preparation, apart from uPlot so it can be tested without a canvas: sorting
 * by distance, the span of a logarithmic distance axis, log-spaced samples of the model curve
 * and its band, and the budget's bars. Pure.
 */
import type { BudgetBarRow, DistanceMark, LevelBand, LevelCurve, LevelPoint, LevelQuantity, ResidualPoint } from '../chart-types'

/** The y axis's title for each quantity, unit in brackets. */
export const QUANTITY_AXIS: Record<LevelQuantity, string> = {
  levelDbm: 'Received level (dBm)',
  fieldStrengthDbuvPerM: 'Field strength (dBµV/m)',
  pathLossDb: 'Path loss (dB)',
}

/** A distance tick: "31.6 m", "3.16 km" (three significant figures, whole numbers from 100). */
export function formatDistanceTick(distanceM: number): string {
  const km = distanceM >= 1000
  const v = km ? distanceM / 1000 : distanceM
  const text = v >= 100 ? v.toFixed(0) : Number(v.toPrecision(3)).toString()
  return `${text} ${km ? 'km' : 'm'}`
}

/**
 * Ticks for a log distance axis between `minM` and `maxM`: 1, 2 and 5 × 10^k inside the range
 * (only the decades when that would crowd the axis with more than `maxTicks`).
 */
export function logDistanceSplits(minM: number, maxM: number, maxTicks = 9): number[] {
  if (!(minM > 0) || !(maxM > minM)) return []
  const within = (steps: number[]) => {
    const out: number[] = []
    for (let k = Math.floor(Math.log10(minM)); k <= Math.ceil(Math.log10(maxM)); k++) {
      for (const m of steps) {
        const v = Number(`${m}e${k}`)
        if (v >= minM * (1 - 1e-9) && v <= maxM * (1 + 1e-9)) out.push(v)
      }
    }
    return out
  }
  const fine = within([1, 2, 5])
  return fine.length <= maxTicks ? fine : within([1])
}

/** Usable on a log distance axis: a finite distance above 0 m. */
const onLogAxis = (distanceM: number) => Number.isFinite(distanceM) && distanceM > 0

/** The items sorted by distance (a copy), without those a log axis cannot show, and how many those were. */
export function sortByDistance<T extends { distanceM: number }>(items: readonly T[]): { sorted: T[]; dropped: number } {
  const kept = items.filter((p) => onLogAxis(p.distanceM))
  return { sorted: [...kept].sort((a, b) => a.distanceM - b.distanceM), dropped: items.length - kept.length }
}

/**
 * The span of the distance axis: the given one, else from the distances, widened outwards to
 * half decades (1, 3.16, 10, 31.6… m) so the ends fall on readable places; one distance gets a
 * half decade each side. Null when there is no usable distance.
 */
export function distanceSpanM(distancesM: readonly number[], given?: { minM: number; maxM: number }): { minM: number; maxM: number } | null {
  if (given && onLogAxis(given.minM) && given.maxM > given.minM) return { ...given }
  const ds = distancesM.filter(onLogAxis)
  if (ds.length === 0) return null
  const lo = Math.log10(Math.min(...ds))
  const hi = Math.log10(Math.max(...ds))
  let minExp = Math.floor(lo * 2 + 1e-9) / 2
  let maxExp = Math.ceil(hi * 2 - 1e-9) / 2
  if (maxExp <= minExp) {
    minExp -= 0.5
    maxExp += 0.5
  }
  return { minM: 10 ** minExp, maxM: 10 ** maxExp }
}

/** `count` distances from minM to maxM (both included), evenly spaced in log d. */
export function logSpacedM(minM: number, maxM: number, count: number): number[] {
  if (!(onLogAxis(minM) && maxM > minM) || count < 2) throw new RangeError('logSpacedM needs 0 < minM < maxM and at least 2 samples.')
  const a = Math.log10(minM)
  const step = (Math.log10(maxM) - a) / (count - 1)
  return Array.from({ length: count }, (_, i) => (i === count - 1 ? maxM : 10 ** (a + i * step)))
}

export interface LevelChartData {
  /** Distances [m], ascending: the measured points' and the curve's samples together. */
  x: number[]
  /** Measured values at x (null where x is a curve sample). */
  measured: (number | null)[]
  /** Model values at x (null without a curve, or where the model gives no finite value). */
  model: (number | null)[]
  lower: (number | null)[]
  upper: (number | null)[]
  /** Labels of the measured points, by index of x. */
  labels: (string | null)[]
  span: { minM: number; maxM: number } | null
  /** Points a log axis cannot show (distance 0 m or less, or not a number). */
  dropped: number
  marks: DistanceMark[]
}

const finiteOrNull = (v: number) => (Number.isFinite(v) ? v : null)

/**
 * uPlot's aligned arrays for a level–distance chart: the measured points and `samples` log-spaced
 * curve (and band) samples over the axis span, merged in distance order. Marks outside the span
 * are left out.
 */
export function levelChartData(options: { points: readonly LevelPoint[]; curve?: LevelCurve | null; band?: LevelBand | null; marks?: readonly DistanceMark[]; distanceRangeM?: { minM: number; maxM: number }; samples?: number }): LevelChartData {
  const { curve, band, samples = 64 } = options
  const { sorted, dropped } = sortByDistance(options.points.filter((p) => Number.isFinite(p.value)))
  const marks = sortByDistance(options.marks ?? []).sorted
  const span = distanceSpanM([...sorted.map((p) => p.distanceM), ...marks.map((m) => m.distanceM)], options.distanceRangeM)
  const rows: { x: number; measured: number | null; label: string | null }[] = sorted.map((p) => ({ x: p.distanceM, measured: p.value, label: p.label ?? null }))
  if (span && (curve || band)) for (const x of logSpacedM(span.minM, span.maxM, samples)) rows.push({ x, measured: null, label: null })
  rows.sort((a, b) => a.x - b.x)
  const bounds = rows.map((r) => (band ? band.boundsAt(r.x) : null))
  return {
    x: rows.map((r) => r.x),
    measured: rows.map((r) => r.measured),
    model: rows.map((r) => (curve ? finiteOrNull(curve.valueAt(r.x)) : null)),
    lower: bounds.map((b) => (b ? finiteOrNull(b.lower) : null)),
    upper: bounds.map((b) => (b ? finiteOrNull(b.upper) : null)),
    labels: rows.map((r) => r.label),
    span,
    dropped: dropped + (options.points.length - options.points.filter((p) => Number.isFinite(p.value)).length),
    marks: span ? marks.filter((m) => m.distanceM >= span.minM && m.distanceM <= span.maxM) : [],
  }
}

export interface ResidualChartData {
  x: number[]
  residual: number[]
  labels: (string | null)[]
  span: { minM: number; maxM: number } | null
  /** The y axis's half height [dB]: the largest |residual| plus 0.5 dB of headroom, rounded up to whole dB (at least 1 dB), so zero sits in the middle. */
  halfRangeDb: number
  dropped: number
}

export function residualChartData(residuals: readonly ResidualPoint[], distanceRangeM?: { minM: number; maxM: number }): ResidualChartData {
  const { sorted, dropped } = sortByDistance(residuals.filter((r) => Number.isFinite(r.residualDb)))
  return {
    x: sorted.map((r) => r.distanceM),
    residual: sorted.map((r) => r.residualDb),
    labels: sorted.map((r) => r.label ?? null),
    span: distanceSpanM(sorted.map((r) => r.distanceM), distanceRangeM),
    halfRangeDb: Math.max(1, Math.ceil(Math.max(0, ...sorted.map((r) => Math.abs(r.residualDb))) + 0.5)),
    dropped: dropped + (residuals.length - residuals.filter((r) => Number.isFinite(r.residualDb)).length),
  }
}

/** The budget's bars, largest share first; `percent` is the share of u_c² in % (one decimal). */
export function budgetBars(rows: readonly BudgetBarRow[]): (BudgetBarRow & { percent: number })[] {
  return [...rows]
    .filter((r) => Number.isFinite(r.varianceShare) && r.varianceShare >= 0)
    .sort((a, b) => b.varianceShare - a.varianceShare)
    .map((r) => ({ ...r, percent: Math.round(r.varianceShare * 1000) / 10 }))
}
