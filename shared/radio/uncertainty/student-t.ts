/**
 * Student's t quantiles, for coverage intervals of fitted quantities with few degrees of
 * freedom (JCGM 100:2008 Annex G.3 [M]: k = t_p(ν) instead of 2 when ν is small).
 *
 * CDF via the regularised incomplete beta function, F(t) = 1 − ½·I_{ν/(ν+t²)}(ν/2, ½) for t ≥ 0
 * (Abramowitz & Stegun, Handbook of Mathematical Functions (1964) 26.7.1 and 26.5.27 [M]),
 * evaluated by the continued fraction A&S 26.5.8 with Lentz's method; ln Γ by the Lanczos
 * series (g = 7, n = 9). Quantile by bisection to 1e-12.
 */
import { requireInRange, requirePositive } from '../guards'

const LANCZOS = [
  0.99999999999980993, 676.5203681218851, -1259.1392167224028, 771.32342877765313, -176.61502916214059,
  12.507343278686905, -0.13857109526572012, 9.9843695780195716e-6, 1.5056327351493116e-7,
]

/** ln Γ(x) for x > 0 (Lanczos approximation, relative error ~1e-15). */
function lnGamma(x: number): number {
  requirePositive('x', x)
  if (x < 0.5) return Math.log(Math.PI / Math.sin(Math.PI * x)) - lnGamma(1 - x) // reflection formula
  const z = x - 1
  let a = LANCZOS[0]
  const t = z + 7.5
  for (let i = 1; i < 9; i++) a += LANCZOS[i] / (z + i)
  return 0.5 * Math.log(2 * Math.PI) + (z + 0.5) * Math.log(t) - t + Math.log(a) // Eq. (Lanczos) ln Γ
}

/** Regularised incomplete beta I_x(a, b). */
function regularizedIncompleteBeta(x: number, a: number, b: number): number {
  requireInRange('x', x, 0, 1)
  requirePositive('a', a)
  requirePositive('b', b)
  if (x === 0 || x === 1) return x
  const lnFront = lnGamma(a + b) - lnGamma(a) - lnGamma(b) + a * Math.log(x) + b * Math.log(1 - x)
  // The continued fraction converges fast for x < (a+1)/(a+b+2); use the symmetry otherwise.
  if (x < (a + 1) / (a + b + 2)) return (Math.exp(lnFront) * betaContinuedFraction(x, a, b)) / a
  return 1 - (Math.exp(lnFront) * betaContinuedFraction(1 - x, b, a)) / b
}

function betaContinuedFraction(x: number, a: number, b: number): number {
  const tiny = 1e-300
  let c = 1
  let d = 1 - ((a + b) * x) / (a + 1)
  if (Math.abs(d) < tiny) d = tiny
  d = 1 / d
  let h = d
  for (let m = 1; m <= 300; m++) {
    const m2 = 2 * m
    let aa = (m * (b - m) * x) / ((a + m2 - 1) * (a + m2)) // Eq. (A&S 26.5.8) even term
    d = 1 + aa * d
    if (Math.abs(d) < tiny) d = tiny
    c = 1 + aa / c
    if (Math.abs(c) < tiny) c = tiny
    d = 1 / d
    h *= d * c
    aa = (-(a + m) * (a + b + m) * x) / ((a + m2) * (a + m2 + 1)) // Eq. (A&S 26.5.8) odd term
    d = 1 + aa * d
    if (Math.abs(d) < tiny) d = tiny
    c = 1 + aa / c
    if (Math.abs(c) < tiny) c = tiny
    d = 1 / d
    const del = d * c
    h *= del
    if (Math.abs(del - 1) < 1e-15) break
  }
  return h
}

/** P(T ≤ t) for Student's t with ν degrees of freedom. */
export function studentTCdf(opts: { t: number; degreesOfFreedom: number }): number {
  const nu = requirePositive('degreesOfFreedom', opts.degreesOfFreedom)
  const t = opts.t
  if (Number.isNaN(t)) throw new RangeError('t must be a number.')
  if (t === Infinity) return 1
  if (t === -Infinity) return 0
  const tail = 0.5 * regularizedIncompleteBeta(nu / (nu + t * t), nu / 2, 0.5) // Eq. (A&S 26.7.1) one tail
  return t >= 0 ? 1 - tail : tail
}

/** t such that P(T ≤ t) = probability (two-sided 95 % uses probability 0.975). */
export function studentTQuantile(opts: { probability: number; degreesOfFreedom: number }): number {
  const p = requireInRange('probability', opts.probability, 0, 1)
  const nu = requirePositive('degreesOfFreedom', opts.degreesOfFreedom)
  if (p === 0.5) return 0
  if (p === 0 || p === 1) return p === 0 ? -Infinity : Infinity
  if (p < 0.5) return -studentTQuantile({ probability: 1 - p, degreesOfFreedom: nu })
  let lo = 0
  let hi = 1
  while (studentTCdf({ t: hi, degreesOfFreedom: nu }) < p) hi *= 2
  for (let i = 0; i < 200 && hi - lo > 1e-12 * Math.max(1, hi); i++) {
    const mid = 0.5 * (lo + hi)
    if (studentTCdf({ t: mid, degreesOfFreedom: nu }) < p) lo = mid
    else hi = mid
  }
  return 0.5 * (lo + hi)
}
