/**
 * Levenberg–Marquardt non-linear least squares for a handful of unknowns.
 *
 * Minimises F(p) = ½ Σ r_i(p)², r_i = (model_i − observed_i)/σ_i, with the Jacobian J = ∂r/∂p
 * supplied by the caller. K. Levenberg, Q. Appl. Math. 2 (1944) 164–168; D. W. Marquardt,
 * J. SIAM 11 (1963) 431–441. Damping control after K. Madsen, H. B. Nielsen, O. Tingleff,
 * Methods for Non-linear Least Squares Problems, 2nd ed., IMM DTU (2004) §3.2, Algorithm 3.16 [M].
 *
 * - Step: (JᵀJ + μ·D) δ = −Jᵀr with D = diag(JᵀJ) (Marquardt's scaling, so metres and dB mix).
 * - Damping: start μ = 1e-3. Gain ratio ρ = actual / predicted decrease of F. Accept when ρ > 0 and
 *   set μ ← μ·max(1/3, 1 − (2ρ − 1)³), ν ← 2; otherwise reject, μ ← μ·ν, ν ← 2ν.
 * - Stop (converged): ‖Jᵀr‖∞ ≤ gradientTolerance; or ‖δ‖ ≤ stepTolerance·(‖p‖ + stepTolerance);
 *   or an accepted step lowers Σr² by less than 1e-15·Σr²; or the Gauss–Newton decrement
 *   gᵀ(JᵀJ)⁻¹g (the decrease of Σr² still to be had if F were quadratic, ×½) is below
 *   decrementTolerance·Σr² — with σ-weighted residuals that puts every parameter within about
 *   1e-6 of its own standard error of the minimum, whatever its unit.
 * - Stop (not converged): maxIterations reached, or μ > 1e15 (no descent direction found).
 */
import { choleskyLower, choleskySolve } from './small-matrix'

export interface ResidualsAndJacobian {
  residuals: number[]
  /** m × p, row i = ∂r_i/∂p. */
  jacobian: number[][]
}

export interface LevenbergMarquardtOptions {
  evaluate: (parameters: number[]) => ResidualsAndJacobian
  initialParameters: number[]
  maxIterations?: number
  gradientTolerance?: number
  stepTolerance?: number
  /** Relative Gauss–Newton decrement below which the fit is converged; default 1e-12. */
  decrementTolerance?: number
}

export interface LevenbergMarquardtResult {
  parameters: number[]
  /** Σ r_i² at the solution (χ² when residuals are weighted by σ). */
  sumOfSquares: number
  residuals: number[]
  jacobian: number[][]
  iterations: number
  converged: boolean
  stopReason: 'gradient' | 'step' | 'no-improvement' | 'decrement' | 'max-iterations' | 'damping-limit'
}

const sumSquares = (r: number[]): number => r.reduce((s, x) => s + x * x, 0)

function normalEquations(j: number[][], r: number[], p: number): { a: number[][]; g: number[] } {
  const a = Array.from({ length: p }, () => new Array<number>(p).fill(0))
  const g = new Array<number>(p).fill(0)
  for (let i = 0; i < j.length; i++) {
    const row = j[i]
    for (let u = 0; u < p; u++) {
      g[u] += row[u] * r[i] // Eq. (LM) g = Jᵀr
      for (let v = 0; v <= u; v++) a[u][v] += row[u] * row[v] // Eq. (LM) A = JᵀJ
    }
  }
  for (let u = 0; u < p; u++) for (let v = 0; v < u; v++) a[v][u] = a[u][v]
  return { a, g }
}

export function levenbergMarquardt(opts: LevenbergMarquardtOptions): LevenbergMarquardtResult {
  const maxIterations = opts.maxIterations ?? 200
  const gradTol = opts.gradientTolerance ?? 1e-10
  const stepTol = opts.stepTolerance ?? 1e-10
  const decTol = opts.decrementTolerance ?? 1e-12
  let p = [...opts.initialParameters]
  const n = p.length
  let current = opts.evaluate(p)
  let f = sumSquares(current.residuals)
  let { a, g } = normalEquations(current.jacobian, current.residuals, n)
  let mu = 1e-3
  let nu = 2
  let iterations = 0
  let stopReason: LevenbergMarquardtResult['stopReason'] = 'max-iterations'
  const gradientSmall = () => Math.max(...g.map(Math.abs)) <= gradTol
  const decrementSmall = () => {
    const l = choleskyLower(a)
    if (!l) return false
    const x = choleskySolve(l, g)
    return x.reduce((s, xi, u) => s + xi * g[u], 0) <= decTol * f // Eq. (LM) gᵀ(JᵀJ)⁻¹g
  }
  if (gradientSmall()) stopReason = 'gradient'
  else {
    while (iterations < maxIterations) {
      iterations++
      const damped = a.map((row, u) => row.map((x, v) => (u === v ? x + mu * Math.max(a[u][u], 1e-12) : x))) // Eq. (LM) JᵀJ + μD
      const l = choleskyLower(damped)
      if (!l) {
        mu *= nu
        nu *= 2
        if (mu > 1e15) {
          stopReason = 'damping-limit'
          break
        }
        continue
      }
      const delta = choleskySolve(l, g.map((x) => -x)) // Eq. (LM) δ = −(JᵀJ + μD)⁻¹ Jᵀr
      const stepNorm = Math.hypot(...delta)
      if (stepNorm <= stepTol * (Math.hypot(...p) + stepTol)) {
        stopReason = 'step'
        break
      }
      const trial = p.map((x, u) => x + delta[u])
      const next = opts.evaluate(trial)
      const fTrial = sumSquares(next.residuals)
      // Predicted decrease of ½Σr²: ½ δᵀ(μDδ − g) (Madsen et al. eq. 3.14 [M]); use Σr² scale (×2).
      let predicted = 0
      for (let u = 0; u < n; u++) predicted += delta[u] * (mu * Math.max(a[u][u], 1e-12) * delta[u] - g[u])
      const rho = predicted > 0 ? (f - fTrial) / predicted : -1 // Eq. (LM) gain ratio
      if (rho > 0 && Number.isFinite(fTrial)) {
        const decrease = f - fTrial
        p = trial
        current = next
        f = fTrial
        ;({ a, g } = normalEquations(current.jacobian, current.residuals, n))
        mu *= Math.max(1 / 3, 1 - (2 * rho - 1) ** 3) // Eq. (LM) damping decrease
        nu = 2
        if (gradientSmall()) {
          stopReason = 'gradient'
          break
        }
        if (decrease <= 1e-15 * f) {
          stopReason = 'no-improvement'
          break
        }
        if (decrementSmall()) {
          stopReason = 'decrement'
          break
        }
      } else {
        mu *= nu // Eq. (LM) damping increase
        nu *= 2
        if (mu > 1e15) {
          stopReason = 'damping-limit'
          break
        }
      }
    }
  }
  return {
    parameters: p,
    sumOfSquares: f,
    residuals: current.residuals,
    jacobian: current.jacobian,
    iterations,
    converged: stopReason === 'gradient' || stopReason === 'step' || stopReason === 'no-improvement' || stopReason === 'decrement',
    stopReason,
  }
}
