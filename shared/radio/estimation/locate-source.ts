/**
 * Locates a transmitter from received levels at known points and/or direction-finding bearings.
 *
 * Unknowns: position (east, north) on a local tangent plane about the centroid of the
 * observation points (azimuthal equidistant via the WGS84 geodesic, see geo/local-tangent-plane.ts),
 * plus EIRP when levels are used, plus the path-loss exponent n when it is not given.
 * Observation equations:
 *  - level  P_i = EIRP − L(d0) − 10·n·log10(d_i/d0)   (log-distance path loss, Rappaport §4.9.1 eq. 4.68 [M])
 *  - bearing β_i = atan2(Δeast, Δnorth) − (rotation of true north on the plane at station i)
 * solved by weighted non-linear least squares (residuals / σ) with Levenberg–Marquardt
 * (levenberg-marquardt.ts). Covariance (JᵀJ)⁻¹ from the stated σ (a-priori); the 95 % confidence
 * ellipse of the position uses χ²(2 dof, 0.95) = −2·ln 0.05 = 5.991 (exact [D]).
 * Starting points: the strongest reading, the level-weighted centroid, the least-squares
 * intersection of the bearing lines; the best converged solution is kept.
 */
import type { GeoPoint } from '../geo/geodesic'
import { requireGeoPoint } from '../geo/geodesic'
import { centroidOf, createLocalTangentPlane, type EnuPoint } from '../geo/local-tangent-plane'
import { requireFinite, requirePositive } from '../guards'
import { freeSpaceLossDb } from '../propagation/free-space-p525'
import type { MethodRef, RadioResult } from '../types'
import { levenbergMarquardt, type LevenbergMarquardtResult, type ResidualsAndJacobian } from './levenberg-marquardt'
import { invertSymmetricPositiveDefinite } from './small-matrix'

export interface LevelObservation extends GeoPoint {
  /** Isotropic received power at the point [dBm]. */
  receivedPowerDbm: number
  /** Standard deviation of the reading about the model (measurement + shadowing) [dB]. */
  sigmaDb: number
}

export interface BearingObservation extends GeoPoint {
  /** Measured bearing to the source, degrees clockwise from true north. */
  bearingDeg: number
  /** Standard deviation of the bearing [deg]. */
  sigmaDeg: number
}

export interface LocateSourceOptions {
  levels?: LevelObservation[]
  bearings?: BearingObservation[]
  /** Needed when levels are given. L(d0) from refLossDb, or free space at d0 from freqHz. */
  pathLoss?: { exponent?: number; refDistanceM?: number; refLossDb?: number; freqHz?: number }
  maxIterations?: number
}

export interface ConfidenceEllipse {
  semiMajorM: number
  semiMinorM: number
  /** Direction of the major axis, degrees clockwise from true north, in [0, 180). */
  orientationDeg: number
  /** χ² quantile used (2 dof). */
  chiSquareQuantile: number
  coverage: number
}

export interface SourceLocation extends GeoPoint {
  /** Position on the local plane about `origin` [m]. */
  eastM: number
  northM: number
  origin: GeoPoint
  eirpDbm?: number
  eirpStandardErrorDb?: number
  exponent?: number
  exponentStandardError?: number
  /** Correlation of the EIRP (at d0) and exponent estimates when n is fitted; near ±1 when d0 is far from the data. */
  eirpExponentCorrelation?: number
  exponentFitted: boolean
  /** Order of the rows/columns of `covariance`: 'eastM', 'northM', ['eirpDbm'], ['exponent']. */
  parameterNames: string[]
  covariance: number[][]
  ellipse95: ConfidenceEllipse
  levelResidualsDb: number[]
  bearingResidualsDeg: number[]
  chiSquare: number
  degreesOfFreedom: number
  /** χ²/dof; near 1 when the stated σ are right. null without redundancy. */
  reducedChiSquare: number | null
  iterations: number
  converged: boolean
  stopReason: LevenbergMarquardtResult['stopReason']
  startedFrom: 'strongest-reading' | 'level-weighted-centroid' | 'bearing-intersection' | 'station-centroid'
}

export const LOCATE_SOURCE_METHOD: MethodRef = {
  id: 'locate-source-lm',
  source: 'weighted non-linear least squares, Levenberg (1944), Marquardt (1963), damping after Madsen–Nielsen–Tingleff (2004) §3.2; log-distance levels (Rappaport §4.9.1); 95 % ellipse χ²₂ = 5.991',
}

/** χ² with 2 degrees of freedom at 95 %: −2·ln(0.05) (exact for 2 dof [D]). */
export const CHI_SQUARE_2DOF_95 = -2 * Math.log(0.05)
/** Distances below this are floored in the level model (log of zero) [m]. */
export const MIN_MODEL_DISTANCE_M = 1
/** Ellipse axis ratio above which the geometry is called poor. Common practice, no source. */
export const POOR_GEOMETRY_AXIS_RATIO = 10

const DEG = Math.PI / 180
const LN10 = Math.LN10

function wrapRad(a: number): number {
  return a - 2 * Math.PI * Math.round(a / (2 * Math.PI)) // into [−π, π]
}

interface Station extends EnuPoint {
  northOffsetRad: number
}

export function locateSource(opts: LocateSourceOptions): RadioResult<SourceLocation> {
  const levels = opts.levels ?? []
  const bearings = opts.bearings ?? []
  if (!Array.isArray(levels) || !Array.isArray(bearings)) throw new RangeError('levels and bearings must be arrays.')
  if (levels.length + bearings.length === 0) throw new RangeError('give at least one level or bearing observation.')
  levels.forEach((o, i) => {
    requireGeoPoint(`levels[${i}]`, o)
    requireFinite(`levels[${i}].receivedPowerDbm`, o.receivedPowerDbm)
    requirePositive(`levels[${i}].sigmaDb`, o.sigmaDb)
  })
  bearings.forEach((o, i) => {
    requireGeoPoint(`bearings[${i}]`, o)
    requireFinite(`bearings[${i}].bearingDeg`, o.bearingDeg)
    requirePositive(`bearings[${i}].sigmaDeg`, o.sigmaDeg)
  })

  const useLevels = levels.length > 0
  const fitExponent = useLevels && opts.pathLoss?.exponent === undefined
  const d0 = requirePositive('pathLoss.refDistanceM', opts.pathLoss?.refDistanceM ?? 1)
  let refLossDb = 0
  if (useLevels) {
    if (opts.pathLoss?.exponent !== undefined) requirePositive('pathLoss.exponent', opts.pathLoss.exponent)
    if (opts.pathLoss?.refLossDb !== undefined) refLossDb = requireFinite('pathLoss.refLossDb', opts.pathLoss.refLossDb)
    else if (opts.pathLoss?.freqHz !== undefined) {
      const freqHz = requirePositive('pathLoss.freqHz', opts.pathLoss.freqHz)
      refLossDb = freeSpaceLossDb({ freqHz, distanceM: d0 }).value.lossDb // L_bf(d0), ITU-R P.525-4 exact form [dB]
    } else throw new RangeError('levels need pathLoss.refLossDb or pathLoss.freqHz for the loss at the reference distance.')
  }
  const parameterNames = ['eastM', 'northM', ...(useLevels ? ['eirpDbm'] : []), ...(fitExponent ? ['exponent'] : [])]
  const p = parameterNames.length
  const m = levels.length + bearings.length
  if (m < p) throw new RangeError(`${m} observation(s) cannot determine ${p} unknowns (${parameterNames.join(', ')}).`)

  const plane = createLocalTangentPlane({ origin: centroidOf([...levels, ...bearings]) })
  const levelSt: Station[] = levels.map((o) => ({ ...plane.toEnu(o), northOffsetRad: 0 }))
  const bearingSt: Station[] = bearings.map((o) => ({ ...plane.toEnu(o), northOffsetRad: plane.northOffsetDeg(o) * DEG }))
  const fixedN = opts.pathLoss?.exponent

  // Internally the level term is referred to dRef (the geometric-mean distance of the readings
  // from their level-weighted centre) instead of d0: A = EIRP − L(d0) − 10 n log10(dRef/d0).
  // This decorrelates A and n (an intercept inside the data), so the iterations converge fast;
  // EIRP and its covariance are mapped back at the end.
  const logRef = useLevels ? referenceLogDistance(levels, levelSt, d0) : 0

  const evaluate = (q: number[]): ResidualsAndJacobian => {
    const residuals: number[] = []
    const jacobian: number[][] = []
    const [x, y] = q
    const a = q[2]
    const n = fitExponent ? q[3] : (fixedN as number)
    levels.forEach((o, i) => {
      const dx = x - levelSt[i].eastM
      const dy = y - levelSt[i].northM
      const dRaw = Math.hypot(dx, dy)
      const d = Math.max(dRaw, MIN_MODEL_DISTANCE_M)
      const logTerm = 10 * Math.log10(d / d0) - logRef // Eq. (4.68) 10 log10(d/dRef)
      const pred = a - n * logTerm // Eq. (4.68) P = EIRP − L(d0) − 10 n log10(d/d0), written as A − 10 n log10(d/dRef) [dBm]
      const w = 1 / o.sigmaDb
      residuals.push((pred - o.receivedPowerDbm) * w)
      const k = dRaw > MIN_MODEL_DISTANCE_M ? (-10 * n) / (LN10 * d * d) : 0 // Eq. (4.68) ∂P/∂d · 1/d
      const row = [k * dx * w, k * dy * w, w]
      if (fitExponent) row.push(-logTerm * w)
      jacobian.push(row)
    })
    bearings.forEach((o, i) => {
      const dx = x - bearingSt[i].eastM
      const dy = y - bearingSt[i].northM
      const d2 = Math.max(dx * dx + dy * dy, MIN_MODEL_DISTANCE_M ** 2)
      const pred = Math.atan2(dx, dy) - bearingSt[i].northOffsetRad // Eq. (bearing) true azimuth [rad]
      const w = 1 / (o.sigmaDeg * DEG)
      residuals.push(wrapRad(pred - o.bearingDeg * DEG) * w)
      const row = [(dy / d2) * w, (-dx / d2) * w] // Eq. (bearing) ∂atan2(dx, dy)/∂(x, y)
      for (let k = 2; k < p; k++) row.push(0)
      jacobian.push(row)
    })
    return { residuals, jacobian }
  }

  // Linear solve for EIRP (and n) at a trial position, to complete a starting point.
  const levelStart = (x: number, y: number): number[] => {
    if (!useLevels) return []
    let sw = 0, sx = 0, sy = 0, sxx = 0, sxy = 0
    levels.forEach((o, i) => {
      const d = Math.max(Math.hypot(x - levelSt[i].eastM, y - levelSt[i].northM), MIN_MODEL_DISTANCE_M)
      const xi = 10 * Math.log10(d / d0) - logRef
      const yi = o.receivedPowerDbm
      const w = 1 / o.sigmaDb ** 2
      sw += w; sx += w * xi; sy += w * yi; sxx += w * xi * xi; sxy += w * xi * yi
    })
    let n = fixedN ?? 2
    if (fitExponent) {
      const det = sw * sxx - sx * sx
      if (det > 1e-9 * sw * sxx) n = Math.min(6, Math.max(1.5, -(sw * sxy - sx * sy) / det))
    }
    const a = (sy + n * sx) / sw // weighted least squares for the intercept A at dRef
    return fitExponent ? [a, n] : [a]
  }

  const starts: { from: SourceLocation['startedFrom']; x: number; y: number }[] = []
  const stationCentroid = meanOf([...levelSt, ...bearingSt])
  if (useLevels) {
    let best = 0
    levels.forEach((o, i) => { if (o.receivedPowerDbm > levels[best].receivedPowerDbm) best = i })
    const maxP = levels[best].receivedPowerDbm
    const weighted = weightedMeanOf(levelSt, levels.map((o) => 10 ** ((o.receivedPowerDbm - maxP) / 10)))
    // A tenth of the way towards the weighted centroid, so the start is not exactly on a reading.
    starts.push({ from: 'strongest-reading', x: levelSt[best].eastM + 0.1 * (weighted.eastM - levelSt[best].eastM), y: levelSt[best].northM + 0.1 * (weighted.northM - levelSt[best].northM) })
    starts.push({ from: 'level-weighted-centroid', ...xy(weighted) })
  }
  if (bearings.length >= 2) {
    const cross = bearingIntersection(bearings, bearingSt)
    if (cross) starts.push({ from: 'bearing-intersection', ...cross })
  }
  if (!starts.length) starts.push({ from: 'station-centroid', ...xy(stationCentroid) })

  let bestRun: { run: LevenbergMarquardtResult; from: SourceLocation['startedFrom'] } | undefined
  for (const s of starts) {
    const run = levenbergMarquardt({ evaluate, initialParameters: [s.x, s.y, ...levelStart(s.x, s.y)], maxIterations: opts.maxIterations ?? 200 })
    const better = !bestRun || (run.converged && !bestRun.run.converged) || (run.converged === bestRun.run.converged && run.sumOfSquares < bestRun.run.sumOfSquares)
    if (better) bestRun = { run, from: s.from }
  }
  const { run, from } = bestRun!
  const warnings: string[] = []
  if (!run.converged) warnings.push(`The solution did not converge (${run.stopReason} after ${run.iterations} iterations): treat the position as indicative only.`)

  const jtj = Array.from({ length: p }, (_, u) => Array.from({ length: p }, (_, v) => run.jacobian.reduce((s, row) => s + row[u] * row[v], 0)))
  const covInternal = invertSymmetricPositiveDefinite(jtj)
  if (!covInternal) throw new RangeError('The observations do not determine the position (singular geometry: e.g. all points on one spot or all bearings parallel).')
  // Back to EIRP: EIRP = A + L(d0) + n·logRef, so Cov = T·C·Tᵀ with T = I except ∂EIRP/∂n = logRef.
  const params = [...run.parameters]
  let cov = covInternal
  if (useLevels) {
    const nHat = fitExponent ? params[3] : (fixedN as number)
    params[2] = params[2] + refLossDb + nHat * logRef // Eq. (4.68) EIRP = A + L(d0) + 10 n log10(dRef/d0) [dBm]
    if (fitExponent) {
      const t = Array.from({ length: p }, (_, u) => Array.from({ length: p }, (_, v) => (u === v ? 1 : u === 2 && v === 3 ? logRef : 0)))
      cov = t.map((row) => covInternal[0].map((_, j) => row.reduce((s, tv, k) => s + tv * t[j].reduce((s2, tw, l) => s2 + covInternal[k][l] * tw, 0), 0)))
    }
  }

  const [x, y] = params
  const position = plane.fromEnu({ eastM: x, northM: y })
  const ellipse = confidenceEllipse({ covariance: cov, northOffsetDeg: plane.northOffsetDeg(position) })
  const dof = m - p
  const chiSquare = run.sumOfSquares
  const reduced = dof > 0 ? chiSquare / dof : null
  if (dof === 0) warnings.push('As many observations as unknowns: the fit has no redundancy and cannot be checked.')
  if (reduced !== null && reduced > 1 + 3 * Math.sqrt(2 / dof)) {
    warnings.push(`The residuals are larger than the stated σ (χ²/dof = ${reduced.toFixed(2)}): the ellipse is probably too small.`)
  }
  if (ellipse.semiMajorM > POOR_GEOMETRY_AXIS_RATIO * ellipse.semiMinorM) {
    warnings.push(`Poor geometry: the 95 % ellipse is ${(ellipse.semiMajorM / ellipse.semiMinorM).toFixed(0)} times longer than wide; add observations from other directions.`)
  }
  const nearestM = Math.min(...[...levelSt, ...bearingSt].map((s) => Math.hypot(x - s.eastM, y - s.northM)))
  if (ellipse.semiMajorM > 0.5 * nearestM) {
    warnings.push('The 95 % ellipse is large compared with the distance to the nearest observation point: the linearised region is approximate.')
  }
  if (useLevels && !bearings.length && levels.length >= 3 && !insideConvexHull({ point: { eastM: x, northM: y }, points: levelSt })) {
    warnings.push('The estimate lies outside the area covered by the level readings: it is an extrapolation.')
  }
  const bearingResidualsDeg = bearings.map((o, i) => (run.residuals[levels.length + i] * o.sigmaDeg))
  if (bearingResidualsDeg.some((r) => Math.abs(r) > 90)) warnings.push('A bearing points away from the estimate by more than 90°: check for a back-bearing or a reflection.')

  const value: SourceLocation = {
    latDeg: position.latDeg,
    lonDeg: position.lonDeg,
    eastM: x,
    northM: y,
    origin: plane.origin,
    exponentFitted: fitExponent,
    parameterNames,
    covariance: cov,
    ellipse95: ellipse,
    levelResidualsDb: levels.map((o, i) => -run.residuals[i] * o.sigmaDb), // observed − predicted
    bearingResidualsDeg: bearingResidualsDeg.map((r) => -r),
    chiSquare,
    degreesOfFreedom: dof,
    reducedChiSquare: reduced,
    iterations: run.iterations,
    converged: run.converged,
    stopReason: run.stopReason,
    startedFrom: from,
  }
  if (useLevels) {
    value.eirpDbm = params[2]
    value.eirpStandardErrorDb = Math.sqrt(cov[2][2])
    value.exponent = fitExponent ? params[3] : fixedN
    if (fitExponent) {
      value.exponentStandardError = Math.sqrt(cov[3][3])
      value.eirpExponentCorrelation = cov[2][3] / Math.sqrt(cov[2][2] * cov[3][3])
    }
  }
  return { value, warnings, method: LOCATE_SOURCE_METHOD }
}

/** 95 % ellipse of the first two parameters; orientation converted from plane north to true north. */
export function confidenceEllipse(opts: { covariance: number[][]; northOffsetDeg?: number }): ConfidenceEllipse {
  const covariance = opts.covariance
  const northOffsetDeg = opts.northOffsetDeg ?? 0
  const a = covariance[0][0]
  const c = covariance[1][1]
  const b = covariance[0][1]
  const mid = (a + c) / 2
  const rad = Math.hypot((a - c) / 2, b)
  const l1 = mid + rad // Eq. (eigen 2×2) λ_max [m²]
  const l2 = Math.max(mid - rad, 0) // Eq. (eigen 2×2) λ_min [m²]
  const phiFromEastDeg = (0.5 * Math.atan2(2 * b, a - c)) / DEG // Eq. (eigen 2×2) major axis from east, anticlockwise
  let orientationDeg = 90 - phiFromEastDeg - northOffsetDeg
  orientationDeg = ((orientationDeg % 180) + 180) % 180
  return {
    semiMajorM: Math.sqrt(CHI_SQUARE_2DOF_95 * l1), // Eq. (χ²₂) semi-axis = √(5.991 λ) [m]
    semiMinorM: Math.sqrt(CHI_SQUARE_2DOF_95 * l2),
    orientationDeg,
    chiSquareQuantile: CHI_SQUARE_2DOF_95,
    coverage: 0.95,
  }
}

/** Least-squares point closest to all bearing lines (weights 1/σ²); undefined when they are parallel. */
function bearingIntersection(bearings: BearingObservation[], st: Station[]): { x: number; y: number } | undefined {
  let a11 = 0, a12 = 0, a22 = 0, b1 = 0, b2 = 0
  bearings.forEach((o, i) => {
    const th = o.bearingDeg * DEG + st[i].northOffsetRad // plane direction of the bearing
    const nx = Math.cos(th)
    const ny = -Math.sin(th) // unit normal to the direction (sin θ, cos θ)
    const w = 1 / o.sigmaDeg ** 2
    const c = nx * st[i].eastM + ny * st[i].northM
    a11 += w * nx * nx; a12 += w * nx * ny; a22 += w * ny * ny
    b1 += w * nx * c; b2 += w * ny * c
  })
  const det = a11 * a22 - a12 * a12
  if (!(det > 1e-6 * (a11 + a22) ** 2)) return undefined
  return { x: (a22 * b1 - a12 * b2) / det, y: (a11 * b2 - a12 * b1) / det }
}

function meanOf(points: EnuPoint[]): EnuPoint {
  return weightedMeanOf(points, points.map(() => 1))
}

function weightedMeanOf(points: EnuPoint[], weights: number[]): EnuPoint {
  let sw = 0, se = 0, sn = 0
  points.forEach((pt, i) => { sw += weights[i]; se += weights[i] * pt.eastM; sn += weights[i] * pt.northM })
  return { eastM: se / sw, northM: sn / sw }
}

const xy = (p: EnuPoint) => ({ x: p.eastM, y: p.northM })

/** 10·log10(dRef/d0), dRef = geometric mean of the reading distances from their level-weighted centre. */
function referenceLogDistance(levels: LevelObservation[], st: EnuPoint[], d0: number): number {
  const maxP = Math.max(...levels.map((o) => o.receivedPowerDbm))
  const c = weightedMeanOf(st, levels.map((o) => 10 ** ((o.receivedPowerDbm - maxP) / 10)))
  const meanLog = st.reduce((s, q) => s + Math.log10(Math.max(Math.hypot(q.eastM - c.eastM, q.northM - c.northM), MIN_MODEL_DISTANCE_M) / d0), 0) / st.length
  return 10 * meanLog
}

/** Whether a point lies inside (or on) the convex hull of a set of points (monotone chain hull). */
export function insideConvexHull(opts: { point: EnuPoint; points: EnuPoint[] }): boolean {
  const { point, points } = opts
  const pts = [...points].sort((a, b) => a.eastM - b.eastM || a.northM - b.northM)
  const cross = (o: EnuPoint, a: EnuPoint, b: EnuPoint) => (a.eastM - o.eastM) * (b.northM - o.northM) - (a.northM - o.northM) * (b.eastM - o.eastM)
  const lower: EnuPoint[] = []
  for (const q of pts) {
    while (lower.length >= 2 && cross(lower[lower.length - 2], lower[lower.length - 1], q) <= 0) lower.pop()
    lower.push(q)
  }
  const upper: EnuPoint[] = []
  for (let i = pts.length - 1; i >= 0; i--) {
    const q = pts[i]
    while (upper.length >= 2 && cross(upper[upper.length - 2], upper[upper.length - 1], q) <= 0) upper.pop()
    upper.push(q)
  }
  const hull = [...lower.slice(0, -1), ...upper.slice(0, -1)]
  if (hull.length < 3) return false
  for (let i = 0; i < hull.length; i++) {
    if (cross(hull[i], hull[(i + 1) % hull.length], point) < 0) return false
  }
  return true
}
