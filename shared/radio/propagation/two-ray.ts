/**
 * Two-ray flat-earth model: direct ray plus one ground reflection with coefficient Γ = −1
 * (grazing incidence), isotropic antennas.
 *
 * Sources: Goldsmith, "Wireless Communications" (2005), eq. (2.12), exact form, and the
 * critical distance d_c = 4·h_t·h_r/λ [V-S]; Linnartz, "Wireless Communication Reference",
 * "Two-ray model" [V-S]; Rappaport, "Wireless Communications" 2nd ed. §4.6, eq. (4.52) for the
 * d⁻⁴ asymptote [V-S]. The crossover d_x = 4π·h_t·h_r/λ is where free space and the asymptote
 * meet [D]; the breakpoint form uses free space up to d_x and the asymptote beyond, as the
 * ns-3 TwoRayGroundPropagationLossModel does (dCross = 4π·Ht·Hr/λ) [V-I]. The `Eq. (n)` tags
 * refer to this list:
 *
 *  (1) r1 = √(d² + (h_t − h_r)²),  r2 = √(d² + (h_t + h_r)²)                         [m]
 *  (2) Δφ = 2π·(r2 − r1)/λ,  with r2 − r1 = 4·h_t·h_r/(r1 + r2) (no cancellation)   [rad]
 *  (3) P_r/P_t = (λ/4π)²·|1/r1 − e^(−jΔφ)/r2|²
 *              = (λ/4π)²·[((r2 − r1)/(r1·r2))² + 4·sin²(Δφ/2)/(r1·r2)]          Goldsmith (2.12)
 *  (4) L = 40·log10 d − 20·log10(h_t·h_r)                                            Rappaport (4.52) [dB]
 *  (5) d_c = 4·h_t·h_r/λ   (last maximum of the received power)                      [m]
 *  (6) d_x = 4π·h_t·h_r/λ  (free space = asymptote)                                  [m]
 *  (7) L = L_bf(d) for d ≤ d_x, eq. (4) beyond (continuous at d_x)                     [dB]
 *
 * Naming: "breakpoint" in this library means only the distance at which a ground-reflection
 * model turns to its d⁻⁴ branch; for the two-ray 'breakpoint' form that is the crossover d_x of
 * eq. (6) (TR 38.901's d_BP plays the same role there). The critical distance d_c is not a
 * breakpoint, nor are log-distance's exponent-change distances. Heights: h_t = `txHeightM`,
 * h_r = `rxHeightM`.
 *
 * Beyond the distance where Δφ = π the loss grows monotonically; nearer, it oscillates with
 * deep nulls, so the inverse of the exact form returns the smallest distance with a warning.
 */
import { SPEED_OF_LIGHT_M_PER_S } from '../constants'
import { requireFinite, requirePositive } from '../guards'
import type { MethodRef } from '../types'
import { freeSpaceDistanceM, freeSpaceLossDb } from './free-space-p525'
import type { PathDistanceResult, PathLossResult } from './model'
import { bisectIncreasing, bracketIncreasing } from './numeric'

export type TwoRayForm = 'exact' | 'asymptote' | 'breakpoint'

export interface TwoRayParams {
  freqHz: number
  txHeightM: number
  rxHeightM: number
  /** 'exact' (default), the d⁻⁴ 'asymptote', or 'breakpoint': free space up to d_x, then the asymptote. */
  form?: TwoRayForm
}

export const TWO_RAY_EXACT_METHOD: MethodRef = {
  id: 'two-ray-exact',
  source: 'Two-ray flat earth, Γ = −1: Goldsmith, Wireless Communications (2005) eq. (2.12)',
}
export const TWO_RAY_ASYMPTOTE_METHOD: MethodRef = {
  id: 'two-ray-asymptote',
  source: 'Two-ray flat earth, d⁻⁴ asymptote: Rappaport, Wireless Communications 2nd ed. §4.6 eq. (4.52)',
}
export const TWO_RAY_BREAKPOINT_METHOD: MethodRef = {
  id: 'two-ray-breakpoint',
  source:
    'Two-ray flat earth with a breakpoint: ITU-R P.525-4 free space up to d_x = 4π·h_t·h_r/λ, then the d⁻⁴ asymptote ' +
    '(Rappaport 2nd ed. eq. (4.52)); switch as in ns-3 TwoRayGroundPropagationLossModel',
}

function checked(p: TwoRayParams): { lambdaM: number; ht: number; hr: number } {
  const freqHz = requirePositive('freqHz', p.freqHz)
  return {
    lambdaM: SPEED_OF_LIGHT_M_PER_S / freqHz,
    ht: requirePositive('txHeightM', p.txHeightM),
    hr: requirePositive('rxHeightM', p.rxHeightM),
  }
}

/** Critical distance d_c = 4·h_t·h_r/λ: beyond it the loss tends to d⁻⁴ [m]. */
export function twoRayCriticalDistanceM(opts: { freqHz: number; txHeightM: number; rxHeightM: number }): number {
  const { lambdaM, ht, hr } = checked(opts)
  return (4 * ht * hr) / lambdaM // Eq. (5) [m]
}

/** Crossover distance d_x = 4π·h_t·h_r/λ where free space and the d⁻⁴ asymptote meet: the breakpoint of the 'breakpoint' form [m]. */
export function twoRayCrossoverDistanceM(opts: { freqHz: number; txHeightM: number; rxHeightM: number }): number {
  const { lambdaM, ht, hr } = checked(opts)
  return (4 * Math.PI * ht * hr) / lambdaM // Eq. (6) [m]
}

/** Exact two-ray loss at ground distance d ≥ 0 (unchecked; d = 0 allowed when h_t ≠ h_r) [dB]. */
function exactLossDb(lambdaM: number, ht: number, hr: number, d: number): number {
  const r1 = Math.hypot(d, ht - hr) // Eq. (1) [m]
  const r2 = Math.hypot(d, ht + hr) // Eq. (1) [m]
  const pathDiffM = (4 * ht * hr) / (r1 + r2) // Eq. (2) [m]
  const dPhi = (2 * Math.PI * pathDiffM) / lambdaM // Eq. (2) [rad]
  const g = (pathDiffM / (r1 * r2)) ** 2 + (4 * Math.sin(dPhi / 2) ** 2) / (r1 * r2) // Eq. (3) [1/m²]
  return 20 * Math.log10((4 * Math.PI) / lambdaM) - 10 * Math.log10(g) // Eq. (3) [dB]
}

/** Ground distance at which the path difference r2 − r1 equals pathDiffM (inverse of eq. (2)) [m]. */
function distanceForPathDiffM(ht: number, hr: number, pathDiffM: number): number {
  const sum = (4 * ht * hr) / pathDiffM
  const r1 = (sum - pathDiffM) / 2
  return Math.sqrt(Math.max(0, r1 * r1 - (ht - hr) ** 2))
}

function asymptoteLossDb(ht: number, hr: number, d: number): number {
  return 40 * Math.log10(d) - 20 * Math.log10(ht * hr) // Eq. (4) [dB]
}

function asymptoteWarnings(lambdaM: number, ht: number, hr: number, d: number): string[] {
  const dx = (4 * Math.PI * ht * hr) / lambdaM // Eq. (6) [m]
  return d < dx
    ? [
        `distanceM = ${fmt(d)} m is inside the crossover distance d_x = 4π·h_t·h_r/λ = ${fmt(dx)} m: ` +
          'the d⁻⁴ asymptote is lower than free space there and understates the loss; use the exact form.',
      ]
    : []
}

function oscillationWarning(lambdaM: number, ht: number, hr: number, d: number): string[] {
  const dc = (4 * ht * hr) / lambdaM // Eq. (5) [m]
  return d < dc
    ? [
        `distanceM = ${fmt(d)} m is inside the critical distance d_c = 4·h_t·h_r/λ = ${fmt(dc)} m, where the ` +
          'direct and reflected rays interfere and the loss oscillates with distance (deep nulls).',
      ]
    : []
}

const fmt = (v: number): string => String(+v.toPrecision(5))

/** Breakpoint form, eq. (7): free space up to d_x, the asymptote beyond [dB]. */
function breakpointLoss(freqHz: number, lambdaM: number, ht: number, hr: number, d: number): PathLossResult {
  const dx = (4 * Math.PI * ht * hr) / lambdaM // Eq. (6) [m]
  const lossDb = d <= dx ? freeSpaceLossDb({ freqHz, distanceM: d }).value.lossDb : asymptoteLossDb(ht, hr, d) // Eq. (7) [dB]
  return { value: { lossDb }, warnings: oscillationWarning(lambdaM, ht, hr, d), method: TWO_RAY_BREAKPOINT_METHOD }
}

/** Inverse of the breakpoint form in closed form: the loss grows monotonically with distance [m]. */
function breakpointDistance(freqHz: number, lambdaM: number, ht: number, hr: number, lossDb: number): PathDistanceResult {
  const dx = (4 * Math.PI * ht * hr) / lambdaM // Eq. (6) [m]
  const d =
    lossDb <= asymptoteLossDb(ht, hr, dx)
      ? freeSpaceDistanceM({ freqHz, lossDb }).value.distanceM // Eq. (7) free-space branch inverted [m]
      : 10 ** ((lossDb + 20 * Math.log10(ht * hr)) / 40) // Eq. (7) asymptote branch, eq. (4) inverted [m]
  return { value: { distanceM: d }, warnings: oscillationWarning(lambdaM, ht, hr, d), method: TWO_RAY_BREAKPOINT_METHOD }
}

/** Local slope of the breakpoint form: 20 dB per decade up to d_x, 40 beyond [dB per decade]. */
export function twoRayBreakpointSlopeDbPerDecade(opts: { freqHz: number; txHeightM: number; rxHeightM: number; distanceM: number }): number {
  const { lambdaM, ht, hr } = checked(opts)
  return requirePositive('distanceM', opts.distanceM) <= (4 * Math.PI * ht * hr) / lambdaM ? 20 : 40
}

/** Two-ray flat-earth basic transmission loss at a ground distance [dB]. */
export function twoRayLossDb(opts: TwoRayParams & { distanceM: number }): PathLossResult {
  const { lambdaM, ht, hr } = checked(opts)
  const d = requirePositive('distanceM', opts.distanceM)
  if (opts.form === 'breakpoint') return breakpointLoss(opts.freqHz, lambdaM, ht, hr, d)
  if (opts.form === 'asymptote') {
    return { value: { lossDb: asymptoteLossDb(ht, hr, d) }, warnings: asymptoteWarnings(lambdaM, ht, hr, d), method: TWO_RAY_ASYMPTOTE_METHOD }
  }
  return { value: { lossDb: exactLossDb(lambdaM, ht, hr, d) }, warnings: oscillationWarning(lambdaM, ht, hr, d), method: TWO_RAY_EXACT_METHOD }
}

/** Largest distance considered by the inverse (well beyond any flat-earth use) [m]. */
const MAX_DISTANCE_M = 1e9
/** Phase step of the scan through the oscillating region [rad]. */
const SCAN_STEP_RAD = Math.PI / 16
const MAX_SCAN_SAMPLES = 2_000_000

interface ExactInverse {
  loss: (d: number) => number
  lambdaM: number
  ht: number
  hr: number
  /** r2 − r1 at d = 0 [m]. */
  maxPathDiffM: number
  /** Path difference where Δφ = π [m]. */
  halfWaveM: number
  /** Start of the monotonic branch: where Δφ = π, or 0 when the heights are too low to oscillate [m]. */
  monotonicStartM: number
}

function exactInverse(p: TwoRayParams): ExactInverse {
  const { lambdaM, ht, hr } = checked(p)
  const maxPathDiffM = 2 * Math.min(ht, hr)
  const halfWaveM = lambdaM / 2
  return {
    loss: (d) => exactLossDb(lambdaM, ht, hr, d),
    lambdaM,
    ht,
    hr,
    maxPathDiffM,
    halfWaveM,
    monotonicStartM: maxPathDiffM > halfWaveM ? distanceForPathDiffM(ht, hr, halfWaveM) : 0,
  }
}

/** Root of the exact loss on the monotonic branch, or undefined when the branch never reaches it [m]. */
function monotonicRootM(x: ExactInverse, lossDb: number): number | undefined {
  const start = Math.max(x.monotonicStartM, 1e-9)
  if (x.loss(start) === lossDb) return start
  if (x.loss(start) > lossDb) return undefined
  const br = bracketIncreasing({ fn: x.loss, target: lossDb, startX: start, minX: start, maxX: MAX_DISTANCE_M })
  return br ? bisectIncreasing({ fn: x.loss, target: lossDb, ...br }) : undefined
}

/**
 * Distance at which the two-ray loss equals lossDb [m]. The asymptote inverts in closed form.
 * The exact form returns the smallest distance: it scans the oscillating region in steps of
 * Δφ, then brackets and bisects beyond the last maximum where the loss is monotonic.
 */
export function twoRayDistanceM(opts: TwoRayParams & { lossDb: number }): PathDistanceResult {
  const { lambdaM, ht, hr } = checked(opts)
  const lossDb = requireFinite('lossDb', opts.lossDb)
  if (opts.form === 'breakpoint') return breakpointDistance(opts.freqHz, lambdaM, ht, hr, lossDb)
  if (opts.form === 'asymptote') {
    const d = 10 ** ((lossDb + 20 * Math.log10(ht * hr)) / 40) // Eq. (4) inverted [m]
    return { value: { distanceM: d }, warnings: asymptoteWarnings(lambdaM, ht, hr, d), method: TWO_RAY_ASYMPTOTE_METHOD }
  }
  const x = exactInverse(opts)
  if (x.monotonicStartM > 0) {
    const inside = scanOscillatingRegion(x, lossDb)
    if (inside !== undefined) {
      const beyond = monotonicRootM(x, lossDb)
      const also = beyond !== undefined ? ` The same loss is reached again at ${fmt(beyond)} m on the monotonic branch.` : ''
      return {
        value: { distanceM: inside },
        warnings: [
          `The loss ${fmt(lossDb)} dB is first reached at ${fmt(inside)} m, inside the two-ray interference region ` +
            `(before the last maximum at ${fmt(x.monotonicStartM)} m; d_c = 4·h_t·h_r/λ = ${fmt((4 * ht * hr) / lambdaM)} m) ` +
            'where the loss oscillates with distance; several distances give this loss.' +
            also,
        ],
        method: TWO_RAY_EXACT_METHOD,
      }
    }
  }
  const d = monotonicRootM(x, lossDb)
  if (d === undefined) {
    throw new RangeError(`lossDb = ${lossDb} dB is not reached by the exact two-ray model at any distance up to ${MAX_DISTANCE_M} m.`)
  }
  return { value: { distanceM: d }, warnings: oscillationWarning(lambdaM, ht, hr, d), method: TWO_RAY_EXACT_METHOD }
}

/**
 * Distance on the monotonic branch (beyond the last maximum, Δφ ≤ π) at which the exact
 * two-ray loss equals lossDb [m]: beyond it the loss only grows, which is what a separation
 * distance needs. Throws a RangeError when that branch never reaches lossDb.
 */
export function twoRayMonotonicDistanceM(opts: Omit<TwoRayParams, 'form'> & { lossDb: number }): PathDistanceResult {
  const lossDb = requireFinite('lossDb', opts.lossDb)
  const x = exactInverse(opts)
  const d = monotonicRootM(x, lossDb)
  if (d === undefined) {
    throw new RangeError(
      `lossDb = ${lossDb} dB is below the loss at the start of the monotonic branch (${fmt(x.loss(Math.max(x.monotonicStartM, 1e-9)))} dB at ${fmt(x.monotonicStartM)} m).`,
    )
  }
  return { value: { distanceM: d }, warnings: oscillationWarning(x.lambdaM, x.ht, x.hr, d), method: TWO_RAY_EXACT_METHOD }
}

/**
 * First distance in the oscillating region at which the loss reaches lossDb, if any [m].
 * Samples Δφ on a grid of π/16 aligned to multiples of π, so every null (Δφ = 2πk, a sharp
 * loss maximum) and every lobe peak (Δφ = (2k+1)π) is itself a sample. Where a sampled local
 * extremum stays on the far side of the target, the true extremum between its neighbours is
 * refined by a golden-section search, so a target that only grazes a peak or a dip is found.
 */
function scanOscillatingRegion(x: ExactInverse, lossDb: number): number | undefined {
  const { loss, ht, hr, lambdaM, maxPathDiffM, halfWaveM } = x
  const distanceAtPhase = (phaseRad: number): number => distanceForPathDiffM(ht, hr, (phaseRad * lambdaM) / (2 * Math.PI))
  const maxPhase = (2 * Math.PI * maxPathDiffM) / lambdaM
  const lastIndex = Math.round((2 * Math.PI * halfWaveM) / lambdaM / SCAN_STEP_RAD) // Δφ = π
  const firstIndex = Math.max(lastIndex, Math.min(Math.ceil(maxPhase / SCAN_STEP_RAD) - 1, lastIndex + MAX_SCAN_SAMPLES))
  let before = Number.NaN // distance of the sample before prev
  let beforeLoss = Number.NaN
  let prevD = ht === hr ? 1e-9 : 0
  let prevLoss = loss(prevD)
  if (prevLoss === lossDb) return prevD
  for (let i = firstIndex; i >= lastIndex; i--) {
    const d = distanceAtPhase(i * SCAN_STEP_RAD)
    if (d <= prevD) continue
    const l = loss(d)
    if (l === lossDb) return d
    if (Math.sign(l - lossDb) !== Math.sign(prevLoss - lossDb)) return bisectSignChange(loss, lossDb, prevD, d)
    if (!Number.isNaN(before)) {
      // prev is a sampled local extremum on the far side of the target from its neighbours:
      // the true extremum between them may still reach the target.
      const side = Math.sign(lossDb - l) // +1: samples below the target, look for a higher peak
      const isExtremum = side * (prevLoss - l) > 0 && side * (prevLoss - beforeLoss) > 0
      if (isExtremum) {
        const peak = goldenSectionExtremum((t) => side * loss(t), before, d)
        if (side * (loss(peak) - lossDb) >= -1e-9) {
          return side * (loss(peak) - lossDb) <= 0 ? peak : bisectSignChange(loss, lossDb, before, peak)
        }
      }
    }
    before = prevD
    beforeLoss = prevLoss
    prevD = d
    prevLoss = l
  }
  return undefined
}

/** Location of the maximum of a unimodal function on [a, b] by golden-section search. */
function goldenSectionExtremum(fn: (x: number) => number, a: number, b: number): number {
  const r = (Math.sqrt(5) - 1) / 2
  let lo = a
  let hi = b
  let x1 = hi - r * (hi - lo)
  let x2 = lo + r * (hi - lo)
  let f1 = fn(x1)
  let f2 = fn(x2)
  for (let i = 0; i < 200 && hi - lo > 1e-13 * hi; i++) {
    if (f1 < f2) {
      lo = x1
      x1 = x2
      f1 = f2
      x2 = lo + r * (hi - lo)
      f2 = fn(x2)
    } else {
      hi = x2
      x2 = x1
      f2 = f1
      x1 = hi - r * (hi - lo)
      f1 = fn(x1)
    }
  }
  return (lo + hi) / 2
}

/** Bisection on a bracket whose ends lie on opposite sides of the target. */
function bisectSignChange(fn: (x: number) => number, target: number, a: number, b: number): number {
  let lo = a
  let hi = b
  const loSign = Math.sign(fn(lo) - target)
  for (let i = 0; i < 200 && hi - lo > 1e-13 * hi; i++) {
    const mid = (lo + hi) / 2
    if (Math.sign(fn(mid) - target) === loSign) lo = mid
    else hi = mid
  }
  return (lo + hi) / 2
}
