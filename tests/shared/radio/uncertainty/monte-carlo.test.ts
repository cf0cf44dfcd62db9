import { describe, expect, it } from 'vitest'
import {
  combineUncertainty,
  createNormalSource,
  createUniformSource,
  percentileOfSorted,
  propagateMonteCarlo,
  type UncertaintyContribution,
} from '../../../../shared/radio/uncertainty'

// Normal 97.5 % quantile 1.960: NIST/SEMATECH e-Handbook §1.3.6.7.2, t table row ∞ [V-S]; register 12-Z.
const Z975 = 1.96

describe('seeded random sources', () => {
  it('repeats the same sequence for the same seed and differs for another seed', () => {
    const a = createUniformSource(42)
    const b = createUniformSource(42)
    const c = createUniformSource(43)
    const sa = Array.from({ length: 5 }, a)
    expect(Array.from({ length: 5 }, b)).toEqual(sa)
    expect(Array.from({ length: 5 }, c)).not.toEqual(sa)
  })

  it('draws uniforms with mean 1/2 and variance 1/12 within 4 standard errors ([D] moments of U(0, 1))', () => {
    const u = createUniformSource(7)
    const n = 200_000
    let s = 0
    let s2 = 0
    let outOfRange = 0
    for (let i = 0; i < n; i++) {
      const x = u()
      if (!(x >= 0 && x < 1)) outOfRange++
      s += x
      s2 += x * x
    }
    const mean = s / n
    const variance = s2 / n - mean * mean
    expect(outOfRange).toBe(0)
    expect(Math.abs(mean - 0.5)).toBeLessThan(4 * Math.sqrt(1 / 12 / n))
    expect(Math.abs(variance - 1 / 12)).toBeLessThan(4 * Math.sqrt(1 / 180 / n)) // Var((x − μ)²) of U(0, 1) = 1/80 − 1/144 = 1/180
  })

  it('draws normals with mean 0, sd 1 and 95 % inside ±1.96 (NIST e-Handbook §1.3.6.7.2 [V-S])', () => {
    const z = createNormalSource(createUniformSource(11))
    const n = 200_000
    let s = 0
    let s2 = 0
    let inside = 0
    for (let i = 0; i < n; i++) {
      const x = z()
      s += x
      s2 += x * x
      if (Math.abs(x) < Z975) inside++
    }
    expect(Math.abs(s / n)).toBeLessThan(4 / Math.sqrt(n))
    expect(Math.abs(Math.sqrt(s2 / n) - 1)).toBeLessThan(4 * Math.sqrt(0.5 / n))
    expect(Math.abs(inside / n - 0.95)).toBeLessThan(4 * Math.sqrt((0.95 * 0.05) / n))
  })
})

describe('propagateMonteCarlo', () => {
  const inputs: UncertaintyContribution[] = [
    { name: 'calibration', value: 1, distribution: { kind: 'normal', expandedUncertainty: 1.0, coverageFactor: 2 } },
    { name: 'specification', value: 2, distribution: { kind: 'rectangular', halfWidth: 0.6 } },
    { name: 'mismatch', value: 0, distribution: { kind: 'u-shaped', halfWidth: 0.4 } },
  ]
  const coefficients = [1, 2, -1]
  const linear = (x: number[]) => x.reduce((s, xi, i) => s + coefficients[i] * xi, 0)

  it('agrees with the linear GUM result for a linear model within sampling error (JCGM 101 §8 validation idea [M])', () => {
    const trials = 200_000
    const mc = propagateMonteCarlo({ inputs, measurementFunction: linear, trials, seed: 3 })
    const gum = combineUncertainty({ contributions: inputs.map((c, i) => ({ ...c, sensitivity: coefficients[i] })), coverageFactor: 1 })
    const expectedMean = 1 + 2 * 2 - 0
    expect(Math.abs(mc.mean - expectedMean)).toBeLessThan(4 * gum.combinedStandardUncertainty / Math.sqrt(trials))
    // Relative standard error of a sample sd ≈ 1/√(2N) for near-normal output; allow 4 of them.
    expect(Math.abs(mc.standardDeviation / gum.combinedStandardUncertainty - 1)).toBeLessThan(4 / Math.sqrt(2 * trials))
    expect(mc.trials).toBe(trials)
    expect(mc.seed).toBe(3)
  })

  it('gives the normal 95 % interval ±1.96 σ for a normal input (NIST e-Handbook §1.3.6.7.2 [V-S]) within 0.02 σ', () => {
    const mc = propagateMonteCarlo({ inputs: [{ name: 'x', value: 10, distribution: { kind: 'standard', standardUncertainty: 2 } }], measurementFunction: (x) => x[0], trials: 200_000 })
    expect(Math.abs((mc.high95 - 10) / 2 - Z975)).toBeLessThan(0.02)
    expect(Math.abs((10 - mc.low95) / 2 - Z975)).toBeLessThan(0.02)
  })

  it('gives ±0.95·a for a rectangular input ([D] quantiles of a uniform) and ±a·sin(0.475π) = ±0.9969·a for a U-shaped one ([D] arcsine quantile)', () => {
    const rect = propagateMonteCarlo({ inputs: [{ name: 'r', distribution: { kind: 'rectangular', halfWidth: 1 } }], measurementFunction: (x) => x[0], trials: 100_000 })
    expect(Math.abs(rect.high95 - 0.95)).toBeLessThan(0.005)
    expect(Math.abs(rect.low95 + 0.95)).toBeLessThan(0.005)
    expect(Math.abs(rect.standardDeviation - 1 / Math.sqrt(3))).toBeLessThan(0.005)
    const arc = propagateMonteCarlo({ inputs: [{ name: 'u', distribution: { kind: 'u-shaped', halfWidth: 1 } }], measurementFunction: (x) => x[0], trials: 100_000 })
    expect(Math.abs(arc.high95 - Math.sin(0.475 * Math.PI))).toBeLessThan(0.002)
    expect(Math.abs(arc.standardDeviation - 1 / Math.SQRT2)).toBeLessThan(0.005)
  })

  it('shows the asymmetry of the exact distance term: 20 log10(d/100 m), d ~ N(100, 5) m → interval [20 log10(1 − 1.96·0.05), 20 log10(1 + 1.96·0.05)] = [−0.896, +0.812] dB (monotone map of the NIST 1.96 quantile; sd ≈ 0.43 dB, JCGM 100:2008 §5.1, register 12-2)', () => {
    const mc = propagateMonteCarlo({
      inputs: [{ name: 'distance', value: 100, unit: 'm', distribution: { kind: 'standard', standardUncertainty: 5 } }],
      measurementFunction: ([d]) => 20 * Math.log10(d / 100),
      trials: 200_000,
      seed: 5,
    })
    expect(Math.abs(mc.low95 - 20 * Math.log10(1 - Z975 * 0.05))).toBeLessThan(0.01)
    expect(Math.abs(mc.high95 - 20 * Math.log10(1 + Z975 * 0.05))).toBeLessThan(0.01)
    expect(Math.abs(mc.standardDeviation - 0.43)).toBeLessThan(0.01)
  })

  it('is reproducible: the same seed gives the same result', () => {
    const a = propagateMonteCarlo({ inputs, measurementFunction: linear, trials: 1000, seed: 9 })
    const b = propagateMonteCarlo({ inputs, measurementFunction: linear, trials: 1000, seed: 9 })
    expect(b).toEqual(a)
  })

  it('rejects no inputs, too few trials and a non-finite output with a RangeError', () => {
    expect(() => propagateMonteCarlo({ inputs: [], measurementFunction: () => 0 })).toThrow(RangeError)
    expect(() => propagateMonteCarlo({ inputs, measurementFunction: linear, trials: 10 })).toThrow(RangeError)
    expect(() => propagateMonteCarlo({ inputs, measurementFunction: () => Number.NaN, trials: 100 })).toThrow(RangeError)
  })
})

describe('percentileOfSorted', () => {
  it('interpolates between order statistics like R type 7 (Hyndman & Fan 1996): median of 1..4 is 2.5, 25th percentile 1.75', () => {
    expect(percentileOfSorted({ sortedValues: [1, 2, 3, 4], probability: 0.5 })).toBe(2.5)
    expect(percentileOfSorted({ sortedValues: [1, 2, 3, 4], probability: 0.25 })).toBe(1.75)
    expect(() => percentileOfSorted({ sortedValues: [], probability: 0.5 })).toThrow(RangeError)
    expect(() => percentileOfSorted({ sortedValues: [1], probability: 1.5 })).toThrow(RangeError)
  })
})
