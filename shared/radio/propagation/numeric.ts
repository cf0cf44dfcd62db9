/**
 * Numerical helpers (standard numerical analysis; no published radio method) shared by the propagation models: a bracketing bisection for inverses
 * of increasing loss functions, and a central-difference slope in log distance.
 *
 * Bisection is used rather than Newton's method because several models are piecewise
 * (breakpoints, max of two branches) and their derivative jumps; bisection on a bracket
 * that is known to contain the root cannot diverge.
 */

/** Relative width at which a distance bisection stops. Far below any measurement uncertainty. */
export const DISTANCE_RELATIVE_TOLERANCE = 1e-12

/**
 * Finds x in [lowX, highX] with fn(x) = target for a continuous fn that is non-decreasing on
 * the bracket and satisfies fn(lowX) ≤ target ≤ fn(highX). Bisects geometrically because
 * distances span decades. Returns the smallest such x to within the tolerance.
 */
export function bisectIncreasing(opts: {
  fn: (x: number) => number
  target: number
  lowX: number
  highX: number
  relativeTolerance?: number
}): number {
  let lo = opts.lowX
  let hi = opts.highX
  const tol = opts.relativeTolerance ?? DISTANCE_RELATIVE_TOLERANCE
  for (let i = 0; i < 400 && hi - lo > tol * hi; i++) {
    const mid = lo > 0 ? Math.sqrt(lo * hi) : (lo + hi) / 2
    const m = mid > lo && mid < hi ? mid : (lo + hi) / 2
    if (opts.fn(m) < opts.target) lo = m
    else hi = m
  }
  return (lo + hi) / 2
}

/**
 * Widens [lowX, highX] geometrically until fn(lowX) < target ≤ fn(highX) for an increasing fn.
 * Returns undefined when the target cannot be bracketed between minX and maxX.
 */
export function bracketIncreasing(opts: {
  fn: (x: number) => number
  target: number
  startX: number
  minX: number
  maxX: number
}): { lowX: number; highX: number } | undefined {
  let lo = opts.startX
  let hi = opts.startX
  while (opts.fn(lo) >= opts.target) {
    if (lo <= opts.minX) return undefined
    lo = Math.max(lo / 2, opts.minX)
  }
  while (opts.fn(hi) < opts.target) {
    if (hi >= opts.maxX) return undefined
    hi = Math.min(hi * 2, opts.maxX)
  }
  return { lowX: lo, highX: hi }
}

/** Step of the central difference, in decades of distance. */
const SLOPE_STEP_DECADES = 1e-4

/**
 * Local slope dL/d(log10 d) [dB per decade] by a central difference in log distance,
 * for models whose derivative has no simple closed form.
 */
export function centralSlopeDbPerDecade(lossDbAt: (distanceM: number) => number, distanceM: number): number {
  const up = distanceM * 10 ** SLOPE_STEP_DECADES
  const down = distanceM * 10 ** -SLOPE_STEP_DECADES
  return (lossDbAt(up) - lossDbAt(down)) / (2 * SLOPE_STEP_DECADES)
}
