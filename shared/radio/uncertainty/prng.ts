/**
 * Seeded pseudo-random numbers, so every Monte Carlo result can be reproduced exactly.
 *
 * Uniform: mulberry32 (a public-domain 32-bit generator by T. Ettinger; period 2³²; ample for
 * the 10⁴–10⁶ draws an uncertainty evaluation needs, not for cryptography).
 * Normal: Box–Muller transform, G. E. P. Box and M. E. Muller, "A note on the generation of
 * random normal deviates", Ann. Math. Statist. 29 (1958) 610–611, eq. (1).
 */
import { requireFinite } from '../guards'

export type UniformSource = () => number

/** Uniform numbers in [0, 1) from a 32-bit seed. */
export function createUniformSource(seed: number): UniformSource {
  requireFinite('seed', seed)
  let state = seed >>> 0
  return () => {
    state = (state + 0x6d2b79f5) >>> 0
    let t = state
    t = Math.imul(t ^ (t >>> 15), t | 1)
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61)
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296
  }
}

/** Standard normal numbers (mean 0, sd 1) drawn from a uniform source, two per pair of draws. */
export function createNormalSource(uniform: UniformSource): () => number {
  let spare: number | undefined
  return () => {
    if (spare !== undefined) {
      const s = spare
      spare = undefined
      return s
    }
    const u1 = 1 - uniform() // (0, 1], so the logarithm is finite
    const u2 = uniform()
    const r = Math.sqrt(-2 * Math.log(u1)) // Eq. (Box–Muller 1) radius
    spare = r * Math.sin(2 * Math.PI * u2) // Eq. (Box–Muller 1) second deviate
    return r * Math.cos(2 * Math.PI * u2) // Eq. (Box–Muller 1) first deviate
  }
}
