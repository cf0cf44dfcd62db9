/**
 * Propagation of distributions by a seeded Monte Carlo method, after JCGM 101:2008
 * (GUM Supplement 1): draw every input from its distribution, evaluate the measurement
 * function, and summarise the output by its mean, standard deviation and the
 * probabilistically symmetric 95 % coverage interval (2.5 and 97.5 percentiles, §7.7 [M]).
 * Use it to check the linear GUM budget where the model is not linear (e.g. the exact
 * distance term 10 n log10(d)).
 *
 * Sampling: normal = value + (U/k)·z; 'standard' is taken as normal with sd u; rectangular
 * = value + a(2r − 1); U-shaped (arcsine) = value + a·sin(2πr) (JCGM 101 §6.4.6 [M]).
 * Clause numbers of JCGM 101 are recalled [M]; the sampling identities are exact [D].
 * Percentiles use linear interpolation between order statistics (R type 7; Hyndman & Fan,
 * Am. Statist. 50 (1996) 361–365).
 */
import { requireNonEmpty, requirePositive } from '../guards'
import type { MethodRef } from '../types'
import { standardUncertainty, type UncertaintyContribution } from './gum-budget'
import { createNormalSource, createUniformSource } from './prng'

export const MONTE_CARLO_METHOD: MethodRef = {
  id: 'gum-monte-carlo',
  source: 'JCGM 101:2008 (GUM Supplement 1) §7 propagation of distributions; Box & Muller (1958)',
}

export interface MonteCarloResult {
  mean: number
  standardDeviation: number
  /** 2.5 % and 97.5 % percentiles of the output: the 95 % coverage interval. */
  low95: number
  high95: number
  trials: number
  seed: number
  method: MethodRef
}

export const DEFAULT_MONTE_CARLO_TRIALS = 20_000
export const DEFAULT_MONTE_CARLO_SEED = 1

/**
 * Draws `trials` sets of inputs (in the order given) and evaluates `measurementFunction` on each.
 * Inputs without a value are centred on 0 (an error term).
 */
export function propagateMonteCarlo(opts: {
  inputs: UncertaintyContribution[]
  measurementFunction: (inputValues: number[]) => number
  trials?: number
  seed?: number
}): MonteCarloResult {
  requireNonEmpty('inputs', opts.inputs)
  const trials = Math.floor(requirePositive('trials', opts.trials ?? DEFAULT_MONTE_CARLO_TRIALS))
  if (trials < 100) throw new RangeError(`trials must be at least 100 for a 95 % interval (got ${trials}).`)
  const seed = opts.seed ?? DEFAULT_MONTE_CARLO_SEED
  const uniform = createUniformSource(seed)
  const normal = createNormalSource(uniform)
  const samplers = opts.inputs.map((input) => {
    const centre = input.value ?? 0
    const d = input.distribution
    const u = standardUncertainty(d) // validates the distribution
    switch (d.kind) {
      case 'normal':
      case 'standard':
        return () => centre + u * normal() // Eq. (JCGM 101 6.4.7) x = μ + u·z [input unit]
      case 'rectangular':
        return () => centre + d.halfWidth * (2 * uniform() - 1) // Eq. (JCGM 101 6.4.2) uniform on ±a [input unit]
      case 'u-shaped':
        return () => centre + d.halfWidth * Math.sin(2 * Math.PI * uniform()) // Eq. (JCGM 101 6.4.6) arcsine on ±a [input unit]
    }
  })
  const outputs = new Float64Array(trials)
  const x = new Array<number>(samplers.length)
  let sum = 0
  for (let t = 0; t < trials; t++) {
    for (let i = 0; i < samplers.length; i++) x[i] = samplers[i]()
    const y = opts.measurementFunction(x)
    if (!Number.isFinite(y)) throw new RangeError(`measurementFunction returned ${y} at trial ${t}.`)
    outputs[t] = y
    sum += y
  }
  const mean = sum / trials
  let ss = 0
  for (let t = 0; t < trials; t++) ss += (outputs[t] - mean) ** 2 // Eq. (JCGM 101 7.6) sample variance [output unit²]
  outputs.sort()
  return {
    mean,
    standardDeviation: Math.sqrt(ss / (trials - 1)),
    low95: percentileOfSorted({ sortedValues: outputs, probability: 0.025 }),
    high95: percentileOfSorted({ sortedValues: outputs, probability: 0.975 }),
    trials,
    seed,
    method: MONTE_CARLO_METHOD,
  }
}

/** Percentile p ∈ [0, 1] of sorted data, linear interpolation between order statistics (type 7). */
export function percentileOfSorted(opts: { sortedValues: ArrayLike<number>; probability: number }): number {
  const sorted = opts.sortedValues
  const p = opts.probability
  requireNonEmpty('sortedValues', sorted)
  if (!(p >= 0 && p <= 1)) throw new RangeError(`probability must be between 0 and 1 (got ${p}).`)
  const h = (sorted.length - 1) * p // Eq. (Hyndman–Fan type 7) h = (n − 1)p
  const lo = Math.floor(h)
  const hi = Math.min(lo + 1, sorted.length - 1)
  return sorted[lo] + (h - lo) * (sorted[hi] - sorted[lo])
}
