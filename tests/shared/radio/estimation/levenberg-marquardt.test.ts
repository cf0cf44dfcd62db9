import { describe, expect, it } from 'vitest'
import { Matrix, inverse } from 'ml-matrix'
import { levenbergMarquardt } from '../../../../shared/radio/estimation'
import { choleskyLower, invertSymmetricPositiveDefinite } from '../../../../shared/radio/estimation/small-matrix'
import { createUniformSource } from '../../../../shared/radio/uncertainty'

// NIST Statistical Reference Datasets, nonlinear regression "Misra1a" (lower difficulty):
// y = b1·(1 − exp(−b2·x)), 14 observations; certified b1 = 2.3894212918E+02 (SE 2.7070075241E+00),
// b2 = 5.5015643181E-04 (SE 7.2668688436E-06), residual sum of squares 1.2455138894E-01;
// starts (500, 1e-4) and (250, 5e-4). [V-S] NIST StRD, copies of Misra1a.dat in public test suites; register ES-M.
const MISRA_Y = [10.07, 14.73, 17.94, 23.93, 29.61, 35.18, 40.02, 44.82, 50.76, 55.05, 61.01, 66.4, 75.47, 81.78]
const MISRA_X = [77.6, 114.9, 141.1, 190.8, 239.9, 289.0, 332.8, 378.4, 434.8, 477.3, 536.8, 593.1, 689.1, 760.0]
const CERTIFIED = { b1: 2.3894212918e2, b2: 5.5015643181e-4, se1: 2.7070075241, se2: 7.2668688436e-6, rss: 1.2455138894e-1 }

const misra = ([b1, b2]: number[]) => ({
  residuals: MISRA_X.map((x, i) => b1 * (1 - Math.exp(-b2 * x)) - MISRA_Y[i]),
  jacobian: MISRA_X.map((x) => [1 - Math.exp(-b2 * x), b1 * x * Math.exp(-b2 * x)]),
})

describe('levenbergMarquardt', () => {
  for (const start of [[500, 1e-4], [250, 5e-4]]) {
    it(`reaches the NIST StRD Misra1a certified values from start (${start.join(', ')}) to 1e-6 relative`, () => {
      const r = levenbergMarquardt({ evaluate: misra, initialParameters: start })
      expect(r.converged).toBe(true)
      expect(Math.abs(r.parameters[0] / CERTIFIED.b1 - 1)).toBeLessThan(1e-6)
      expect(Math.abs(r.parameters[1] / CERTIFIED.b2 - 1)).toBeLessThan(1e-6)
      expect(Math.abs(r.sumOfSquares / CERTIFIED.rss - 1)).toBeLessThan(1e-6)
      // Certified standard errors: s²(JᵀJ)⁻¹ with s² = RSS/(N − p).
      const jtj = [0, 1].map((u) => [0, 1].map((v) => r.jacobian.reduce((s, row) => s + row[u] * row[v], 0)))
      const cov = invertSymmetricPositiveDefinite(jtj)!
      const s2 = r.sumOfSquares / (MISRA_X.length - 2)
      expect(Math.abs(Math.sqrt(s2 * cov[0][0]) / CERTIFIED.se1 - 1)).toBeLessThan(1e-4)
      expect(Math.abs(Math.sqrt(s2 * cov[1][1]) / CERTIFIED.se2 - 1)).toBeLessThan(1e-4)
    })
  }

  it('stops at maxIterations and says it did not converge', () => {
    const r = levenbergMarquardt({ evaluate: misra, initialParameters: [500, 1e-4], maxIterations: 2 })
    expect(r.converged).toBe(false)
    expect(r.stopReason).toBe('max-iterations')
    expect(r.iterations).toBe(2)
  })
})

describe('small symmetric positive-definite matrices', () => {
  it('inverts like a general-purpose matrix library (ml-matrix 6.15 inverse) to 1e-10 relative', () => {
    const u = createUniformSource(21)
    for (let trial = 0; trial < 20; trial++) {
      const n = 2 + (trial % 3)
      const b = Array.from({ length: n + 3 }, () => Array.from({ length: n }, () => u() * 10 - 5))
      const a = Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => b.reduce((s, row) => s + row[i] * row[j], 0)))
      const mine = invertSymmetricPositiveDefinite(a)!
      const ref = inverse(new Matrix(a)).to2DArray()
      const scale = Math.max(...ref.flat().map(Math.abs))
      for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) expect(Math.abs(mine[i][j] - ref[i][j]) / scale).toBeLessThan(1e-10)
    }
  })

  it('reports a singular matrix instead of dividing by zero', () => {
    expect(choleskyLower([[1, 2], [2, 4]])).toBeUndefined()
    expect(invertSymmetricPositiveDefinite([[0, 0], [0, 1]])).toBeUndefined()
  })
})
