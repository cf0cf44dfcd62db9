/**
 * Dense linear algebra for the few unknowns of a fit (2–4): Cholesky factorisation of a
 * symmetric positive-definite matrix, solve and inverse (G. H. Golub & C. F. Van Loan,
 * Matrix Computations, 4th ed. (2013) §4.2, Algorithm 4.2.1 [M]). Row-major number[][].
 */

/** Lower-triangular L with A = L·Lᵀ, or undefined when A is not positive definite. */
export function choleskyLower(a: number[][]): number[][] | undefined {
  const n = a.length
  const l = a.map(() => new Array<number>(n).fill(0))
  for (let j = 0; j < n; j++) {
    let d = a[j][j]
    for (let k = 0; k < j; k++) d -= l[j][k] * l[j][k]
    // A pivot below 1e-13 of its own diagonal means the column is (numerically) dependent on
    // the others; relative to its own diagonal so that unknowns of different units can mix.
    if (!(d > 1e-13 * Math.abs(a[j][j])) || !(a[j][j] > 0)) return undefined
    l[j][j] = Math.sqrt(d) // Eq. (GVL 4.2.1) l_jj = √(a_jj − Σ l_jk²)
    for (let i = j + 1; i < n; i++) {
      let s = a[i][j]
      for (let k = 0; k < j; k++) s -= l[i][k] * l[j][k]
      l[i][j] = s / l[j][j] // Eq. (GVL 4.2.1) l_ij = (a_ij − Σ l_ik l_jk)/l_jj
    }
  }
  return l
}

/** Solves L·Lᵀ·x = b given the Cholesky factor L. */
export function choleskySolve(l: number[][], b: number[]): number[] {
  const n = l.length
  const y = new Array<number>(n)
  for (let i = 0; i < n; i++) {
    let s = b[i]
    for (let k = 0; k < i; k++) s -= l[i][k] * y[k]
    y[i] = s / l[i][i]
  }
  const x = new Array<number>(n)
  for (let i = n - 1; i >= 0; i--) {
    let s = y[i]
    for (let k = i + 1; k < n; k++) s -= l[k][i] * x[k]
    x[i] = s / l[i][i]
  }
  return x
}

/** Inverse of a symmetric positive-definite matrix, or undefined when it is singular. */
export function invertSymmetricPositiveDefinite(a: number[][]): number[][] | undefined {
  const l = choleskyLower(a)
  if (!l) return undefined
  const n = a.length
  const inv = a.map(() => new Array<number>(n).fill(0))
  for (let j = 0; j < n; j++) {
    const e = new Array<number>(n).fill(0)
    e[j] = 1
    const col = choleskySolve(l, e)
    for (let i = 0; i < n; i++) inv[i][j] = col[i]
  }
  // Symmetrise away rounding so that variances and ellipses are computed from one matrix.
  for (let i = 0; i < n; i++) for (let j = 0; j < i; j++) inv[i][j] = inv[j][i] = 0.5 * (inv[i][j] + inv[j][i])
  return inv
}
