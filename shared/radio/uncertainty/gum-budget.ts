/**
 * Uncertainty budget after the GUM: JCGM 100:2008, Evaluation of measurement data — Guide to
 * the expression of uncertainty in measurement. Type B standard uncertainties from stated
 * distributions (§4.3), combined for uncorrelated inputs (§5.1.2, law of propagation of
 * uncertainty) and expanded with a coverage factor (§6.2, §6.3: k = 2 gives about 95 % for a
 * near-normal output). The U-shaped (arcsine) divisor is that of JCGM 101:2008 §6.4.6 and of
 * mismatch budgets in RF metrology. Clause numbers recalled [M]; the arithmetic is exact [D].
 *
 * Inputs are uncorrelated; correlated inputs are outside this method (JCGM 100 §5.2).
 */
import { requireFinite, requireNonNegative, requirePositive } from '../guards'
import type { MethodRef } from '../types'

export const GUM_METHOD: MethodRef = {
  id: 'gum-combined-uncertainty',
  source: 'JCGM 100:2008 (GUM) §4.3 type B evaluation, §5.1.2 eq. (10) combined uncertainty, §6.2–6.3 expanded uncertainty; JCGM 101:2008 §6.4.6 arcsine',
}

/** Coverage factor for about 95 % coverage of a near-normal output (JCGM 100:2008 §6.3.3). */
export const COVERAGE_FACTOR_95 = 2

/** How the caller states an input's uncertainty. Values are in the input's own unit. */
export type UncertaintyDistribution =
  /** A stated expanded uncertainty U at coverage factor k (e.g. a calibration certificate). */
  | { kind: 'normal'; expandedUncertainty: number; coverageFactor: number }
  /** Equally likely anywhere within ±a (e.g. a specification limit). */
  | { kind: 'rectangular'; halfWidth: number }
  /** Arcsine within ±a: most likely near the limits (e.g. mismatch with unknown phase). */
  | { kind: 'u-shaped'; halfWidth: number }
  /** A standard uncertainty u given directly (e.g. a type A standard deviation of the mean). */
  | { kind: 'standard'; standardUncertainty: number }

export interface UncertaintyContribution {
  name: string
  /** Estimate of the input quantity, in `unit` (informational in the budget; centre for Monte Carlo). */
  value?: number
  /** Unit of the input quantity and of its distribution, e.g. 'dB', 'm'. */
  unit?: string
  distribution: UncertaintyDistribution
  /** Sensitivity coefficient c_i = ∂y/∂x_i [output unit per input unit]; default 1. */
  sensitivity?: number
}

export interface BudgetRow {
  name: string
  value?: number
  unit?: string
  distribution: UncertaintyDistribution['kind']
  /** Divisor applied to the stated figure: k, √3, √2 or 1. */
  divisor: number
  /** u(x_i) in the input's unit. */
  standardUncertainty: number
  sensitivity: number
  /** |c_i|·u(x_i) in the output's unit. */
  contribution: number
  /** Share of u_c² (0–1). */
  varianceShare: number
}

export interface UncertaintyBudget {
  rows: BudgetRow[]
  /** u_c(y), output unit. */
  combinedStandardUncertainty: number
  coverageFactor: number
  /** U = k·u_c, output unit. */
  expandedUncertainty: number
  method: MethodRef
}

/** The divisor that turns the stated figure into a standard uncertainty. */
export function distributionDivisor(distribution: UncertaintyDistribution): number {
  switch (distribution.kind) {
    case 'normal':
      return requirePositive('coverageFactor', distribution.coverageFactor) // u = U/k [input unit]
    case 'rectangular':
      return Math.sqrt(3) // Eq. (GUM 4.3.7) u = a/√3 [input unit]
    case 'u-shaped':
      return Math.SQRT2 // Eq. (JCGM 101 6.4.6) u = a/√2 [input unit]
    case 'standard':
      return 1
    default:
      throw new RangeError(`unknown distribution kind '${(distribution as { kind: string }).kind}'.`)
  }
}

/** The stated figure of a distribution (U, a or u). */
function statedFigure(distribution: UncertaintyDistribution): number {
  switch (distribution.kind) {
    case 'normal':
      return requireNonNegative('expandedUncertainty', distribution.expandedUncertainty)
    case 'rectangular':
    case 'u-shaped':
      return requireNonNegative('halfWidth', distribution.halfWidth)
    case 'standard':
      return requireNonNegative('standardUncertainty', distribution.standardUncertainty)
    default:
      throw new RangeError(`unknown distribution kind '${(distribution as { kind: string }).kind}'.`)
  }
}

/** Standard uncertainty u(x_i) of one input, in the input's unit. */
export function standardUncertainty(distribution: UncertaintyDistribution): number {
  if (!distribution || typeof distribution !== 'object') throw new RangeError('distribution must be given.')
  return statedFigure(distribution) / distributionDivisor(distribution) // Eq. (GUM 4.3) [input unit]
}

/** Inverse of standardUncertainty for a normal input: the expanded U at coverage factor k. */
export function expandedFromStandard(opts: { standardUncertainty: number; coverageFactor?: number }): number {
  const k = requirePositive('coverageFactor', opts.coverageFactor ?? COVERAGE_FACTOR_95)
  return k * requireNonNegative('standardUncertainty', opts.standardUncertainty) // Eq. (GUM 18) U = k·u [unit]
}

/**
 * Combines uncorrelated contributions: u_c = √Σ(c_i u_i)², U = k u_c.
 * Returns the budget as data (one row per input) so it can be stored and shown.
 */
export function combineUncertainty(opts: { contributions: UncertaintyContribution[]; coverageFactor?: number }): UncertaintyBudget {
  if (!Array.isArray(opts.contributions)) throw new RangeError('contributions must be an array.')
  const k = requirePositive('coverageFactor', opts.coverageFactor ?? COVERAGE_FACTOR_95)
  const partial = opts.contributions.map((c, i) => {
    if (!c || typeof c.name !== 'string') throw new RangeError(`contributions[${i}] must have a name.`)
    if (c.value !== undefined) requireFinite(`${c.name}.value`, c.value)
    const u = standardUncertainty(c.distribution)
    const ci = requireFinite(`${c.name}.sensitivity`, c.sensitivity ?? 1)
    return { c, u, ci, contribution: Math.abs(ci * u) } // Eq. (GUM 10) term |c_i u(x_i)| [output unit]
  })
  const variance = partial.reduce((s, p) => s + p.contribution ** 2, 0) // Eq. (GUM 10) u_c² = Σ (c_i u_i)² [output unit²]
  const uc = Math.sqrt(variance)
  const rows: BudgetRow[] = partial.map(({ c, u, ci, contribution }) => ({
    name: c.name,
    ...(c.value !== undefined ? { value: c.value } : {}),
    ...(c.unit !== undefined ? { unit: c.unit } : {}),
    distribution: c.distribution.kind,
    divisor: distributionDivisor(c.distribution),
    standardUncertainty: u,
    sensitivity: ci,
    contribution,
    varianceShare: variance > 0 ? contribution ** 2 / variance : 0,
  }))
  return {
    rows,
    combinedStandardUncertainty: uc,
    coverageFactor: k,
    expandedUncertainty: k * uc, // Eq. (GUM 18) U = k·u_c [output unit]
    method: GUM_METHOD,
  }
}
