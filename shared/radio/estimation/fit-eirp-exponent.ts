/**
 * EIRP and path-loss exponent from several measurements at known distances.
 *
 * Model (log-distance path loss, T. S. Rappaport, Wireless Communications, 2nd ed. (2002)
 * §4.9.1 eq. (4.68) [M]): P_r(d) = EIRP − L(d0) − 10·n·log10(d/d0).
 * With x = 10·log10(d/d0) and y = P_r + L(d0) this is the straight line y = EIRP − n·x, fitted by
 * ordinary least squares (NIST/SEMATECH e-Handbook of Statistical Methods §4.4.3.1 [M]):
 * standard errors from s² = RSS/(N − p) and (XᵀX)⁻¹; 95 % intervals with Student's t (N − p dof).
 * Each point has equal weight (equal shadowing at every distance).
 *
 * The fixed-exponent variant estimates EIRP only: the mean of y + n·x.
 */
import { fieldToReceivedPowerDbm } from '../chain/received-power'
import { requireFinite, requireNonEmpty, requirePositive } from '../guards'
import { freeSpaceLossDb } from '../propagation/free-space-p525'
import type { CoverageInterval, MethodRef, RadioResult } from '../types'
import { studentTQuantile } from '../uncertainty/student-t'

/** One reading at a known distance: the isotropic received power, or a field strength (needs freqHz). */
export interface ReadingAtDistance {
  distanceM: number
  receivedPowerDbm?: number
  fieldStrengthDbuvPerM?: number
}

export interface FitOptions {
  readings: ReadingAtDistance[]
  /** Reference distance d0 [m]: EIRP is referred to the loss at d0. */
  refDistanceM: number
  /** L(d0) [dB]; default free space at d0 (needs freqHz). */
  refLossDb?: number
  /** Needed for field-strength readings and for the default L(d0). */
  freqHz?: number
}

export interface EirpFit {
  eirpDbm: number
  exponent: number
  /** Standard errors; null when there are no residual degrees of freedom. */
  eirpStandardErrorDb: number | null
  exponentStandardError: number | null
  /** Correlation of the EIRP and exponent estimates (free fit only). */
  eirpExponentCorrelation: number | null
  /** 95 % interval of the EIRP from Student's t [dBm]; null without residual degrees of freedom. */
  eirpInterval95Dbm: { lowDbm: number; highDbm: number } | null
  /** Observed − fitted P_r at each reading [dB], in input order. */
  residualsDb: number[]
  /** √(RSS/(N − p)) [dB]: the scatter about the line (shadowing plus measurement). */
  residualStandardDeviationDb: number | null
  /** 1 − RSS/TSS about the mean level; may be negative for a poor fixed-exponent fit. */
  rSquared: number | null
  degreesOfFreedom: number
  pointCount: number
  /** d_max / d_min. */
  distanceSpanRatio: number
  refDistanceM: number
  refLossDb: number
  exponentFixed: boolean
}

export const FIT_EIRP_EXPONENT_METHOD: MethodRef = {
  id: 'fit-eirp-exponent-ols',
  source: 'log-distance path loss (Rappaport, Wireless Communications 2nd ed. §4.9.1 eq. 4.68); ordinary least squares with (XᵀX)⁻¹ standard errors (NIST/SEMATECH e-Handbook §4.4.3.1)',
}
export const FIT_EIRP_FIXED_EXPONENT_METHOD: MethodRef = {
  id: 'fit-eirp-fixed-exponent',
  source: 'log-distance path loss with a given exponent (Rappaport §4.9.1 eq. 4.68); least-squares mean with s/√N standard error',
}

/**
 * Below this ratio d_max/d_min (about half a decade) EIRP and n are so correlated that the
 * fitted exponent is poorly determined. Common practice, no source.
 */
export const MIN_DISTANCE_SPAN_RATIO = 3
/** Fewer readings than this leave too little redundancy to judge the fit. Common practice, no source. */
export const MIN_RECOMMENDED_READINGS = 3

interface Prepared {
  x: Float64Array
  y: Float64Array
  refLossDb: number
  spanRatio: number
  warnings: string[]
}

function prepare(opts: FitOptions, minimumPoints: number): Prepared {
  requireNonEmpty('readings', opts.readings)
  if (opts.readings.length < minimumPoints) {
    throw new RangeError(`at least ${minimumPoints} readings are needed for this fit (got ${opts.readings.length}).`)
  }
  const d0 = requirePositive('refDistanceM', opts.refDistanceM)
  let refLossDb: number
  if (opts.refLossDb !== undefined) refLossDb = requireFinite('refLossDb', opts.refLossDb)
  else if (opts.freqHz !== undefined) {
    refLossDb = freeSpaceLossDb({ freqHz: opts.freqHz, distanceM: d0 }).value.lossDb // L_bf(d0), ITU-R P.525-4 exact form [dB]
  } else throw new RangeError('give refLossDb or freqHz (for free-space loss at the reference distance).')
  const n = opts.readings.length
  const x = new Float64Array(n)
  const y = new Float64Array(n)
  let dMin = Infinity
  let dMax = 0
  for (let i = 0; i < n; i++) {
    const r = opts.readings[i]
    const d = requirePositive(`readings[${i}].distanceM`, r?.distanceM)
    let pr: number
    if (r.receivedPowerDbm !== undefined) pr = requireFinite(`readings[${i}].receivedPowerDbm`, r.receivedPowerDbm)
    else if (r.fieldStrengthDbuvPerM !== undefined) {
      if (opts.freqHz === undefined) throw new RangeError('freqHz is needed to use field-strength readings.')
      pr = fieldToReceivedPowerDbm({ fieldStrengthDbuvPerM: r.fieldStrengthDbuvPerM, freqHz: opts.freqHz })
    } else throw new RangeError(`readings[${i}] needs receivedPowerDbm or fieldStrengthDbuvPerM.`)
    x[i] = 10 * Math.log10(d / d0) // Eq. (4.68) x = 10 log10(d/d0) [dB per unit n]
    y[i] = pr + refLossDb // Eq. (4.68) y = P_r + L(d0) [dBm]
    dMin = Math.min(dMin, d)
    dMax = Math.max(dMax, d)
  }
  const warnings: string[] = []
  const spanRatio = dMax / dMin
  if (n < MIN_RECOMMENDED_READINGS) warnings.push(`Only ${n} reading(s): at least ${MIN_RECOMMENDED_READINGS} are recommended.`)
  return { x, y, refLossDb, spanRatio, warnings }
}

function tInterval(centre: number, se: number | null, dof: number): { lowDbm: number; highDbm: number } | null {
  if (se === null || dof < 1) return null
  const t = studentTQuantile({ probability: 0.975, degreesOfFreedom: dof })
  return { lowDbm: centre - t * se, highDbm: centre + t * se }
}

/** Least-squares fit of EIRP and the path-loss exponent n. */
export function fitEirpAndExponent(opts: FitOptions): RadioResult<EirpFit> {
  const { x, y, refLossDb, spanRatio, warnings } = prepare(opts, 2)
  const n = x.length
  let xm = 0
  let ym = 0
  for (let i = 0; i < n; i++) {
    xm += x[i]
    ym += y[i]
  }
  xm /= n
  ym /= n
  let sxx = 0
  let sxy = 0
  let syy = 0
  for (let i = 0; i < n; i++) {
    const dx = x[i] - xm
    const dy = y[i] - ym
    sxx += dx * dx // Eq. (OLS) Sxx
    sxy += dx * dy // Eq. (OLS) Sxy
    syy += dy * dy // Eq. (OLS) Syy
  }
  if (!(sxx > 1e-12 * n)) throw new RangeError('the readings must be at more than one distance to fit an exponent.')
  const slope = sxy / sxx // Eq. (OLS) b = Sxy/Sxx [dB per unit x]
  const eirpDbm = ym - slope * xm // Eq. (OLS) a = ȳ − b·x̄ [dBm]
  const exponent = -slope // Eq. (4.68) n = −b
  const residualsDb = Array.from(x, (xi, i) => y[i] - (eirpDbm + slope * xi))
  const rss = residualsDb.reduce((s, r) => s + r * r, 0)
  const dof = n - 2
  if (spanRatio < MIN_DISTANCE_SPAN_RATIO) {
    warnings.push(`The distances span only a factor of ${spanRatio.toFixed(2)} (less than ${MIN_DISTANCE_SPAN_RATIO}): EIRP and exponent are poorly separated.`)
  }
  let seEirp: number | null = null
  let seN: number | null = null
  let corr: number | null = null
  let sRes: number | null = null
  if (dof > 0) {
    const s2 = rss / dof // Eq. (OLS) s² = RSS/(N − 2) [dB²]
    sRes = Math.sqrt(s2)
    seN = Math.sqrt(s2 / sxx) // Eq. (OLS) Var(b) = s²/Sxx, from (XᵀX)⁻¹
    seEirp = Math.sqrt(s2 * (1 / n + (xm * xm) / sxx)) // Eq. (OLS) Var(a) = s²(1/N + x̄²/Sxx)
    corr = seN > 0 && seEirp > 0 ? (xm * s2) / sxx / (seEirp * seN) : null // Eq. (OLS) Cov(a, n) = +x̄ s²/Sxx (n = −b)
  } else {
    warnings.push('Two readings fit the line exactly: no standard errors can be given.')
  }
  const rSquared = syy > 0 ? 1 - rss / syy : null // Eq. (OLS) R² = 1 − RSS/TSS
  return {
    value: {
      eirpDbm,
      exponent,
      eirpStandardErrorDb: seEirp,
      exponentStandardError: seN,
      eirpExponentCorrelation: corr,
      eirpInterval95Dbm: tInterval(eirpDbm, seEirp, dof),
      residualsDb,
      residualStandardDeviationDb: sRes,
      rSquared,
      degreesOfFreedom: dof,
      pointCount: n,
      distanceSpanRatio: spanRatio,
      refDistanceM: opts.refDistanceM,
      refLossDb,
      exponentFixed: false,
    },
    ...intervalOf(eirpDbm, seEirp, dof),
    warnings,
    method: FIT_EIRP_EXPONENT_METHOD,
  }
}

/** EIRP only, with the path-loss exponent n given. */
export function fitEirpFixedExponent(opts: FitOptions & { exponent: number }): RadioResult<EirpFit> {
  const exponent = requirePositive('exponent', opts.exponent)
  const { x, y, refLossDb, spanRatio, warnings } = prepare(opts, 1)
  const n = x.length
  let eirpDbm = 0
  for (let i = 0; i < n; i++) eirpDbm += y[i] + exponent * x[i]
  eirpDbm /= n // Eq. (OLS, one parameter) EIRP = mean(y + n·x) [dBm]
  const ym = y.reduce((s, v) => s + v, 0) / n
  const residualsDb = Array.from(x, (xi, i) => y[i] - (eirpDbm - exponent * xi))
  const rss = residualsDb.reduce((s, r) => s + r * r, 0)
  let tss = 0
  for (let i = 0; i < n; i++) tss += (y[i] - ym) ** 2
  const dof = n - 1
  let seEirp: number | null = null
  let sRes: number | null = null
  if (dof > 0) {
    sRes = Math.sqrt(rss / dof) // Eq. (OLS) s² = RSS/(N − 1) [dB²]
    seEirp = sRes / Math.sqrt(n) // Eq. (OLS) SE = s/√N [dB]
  } else warnings.push('One reading: the EIRP has no standard error.')
  return {
    value: {
      eirpDbm,
      exponent,
      eirpStandardErrorDb: seEirp,
      exponentStandardError: null,
      eirpExponentCorrelation: null,
      eirpInterval95Dbm: tInterval(eirpDbm, seEirp, dof),
      residualsDb,
      residualStandardDeviationDb: sRes,
      rSquared: tss > 0 ? 1 - rss / tss : null,
      degreesOfFreedom: dof,
      pointCount: n,
      distanceSpanRatio: spanRatio,
      refDistanceM: opts.refDistanceM,
      refLossDb,
      exponentFixed: true,
    },
    ...intervalOf(eirpDbm, seEirp, dof),
    warnings,
    method: FIT_EIRP_FIXED_EXPONENT_METHOD,
  }
}

function intervalOf(eirpDbm: number, se: number | null, dof: number): { interval?: CoverageInterval } {
  const i = tInterval(eirpDbm, se, dof)
  return i
    ? { interval: { quantity: 'eirpDbm', low: i.lowDbm, high: i.highDbm, basis: `Student t(0.975, ν = ${dof}) × standard error (95 %)` } }
    : {}
}
