/** Seeded random numbers for the spectrum tests (mulberry32 + Box–Muller): same stream every run. */
export function seededRandom(seed: number): () => number {
  let a = seed >>> 0
  return () => {
    a = (a + 0x6d2b79f5) >>> 0
    let t = a
    t = Math.imul(t ^ (t >>> 15), t | 1)
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61)
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296
  }
}

/** Standard normal deviates from a seeded uniform stream. */
export function seededGaussian(seed: number): () => number {
  const uniform = seededRandom(seed)
  let spare: number | undefined
  return () => {
    if (spare !== undefined) {
      const s = spare
      spare = undefined
      return s
    }
    let u = 0
    while (u === 0) u = uniform()
    const v = uniform()
    const r = Math.sqrt(-2 * Math.log(u))
    spare = r * Math.sin(2 * Math.PI * v)
    return r * Math.cos(2 * Math.PI * v)
  }
}

/** Complex white Gaussian noise with E|x|² = powerFs, interleaved I,Q. */
export function complexNoise(opts: { sampleCount: number; powerFs: number; seed: number }): Float64Array {
  const g = seededGaussian(opts.seed)
  const sd = Math.sqrt(opts.powerFs / 2)
  const x = new Float64Array(2 * opts.sampleCount)
  for (let k = 0; k < x.length; k++) x[k] = sd * g()
  return x
}

/** A complex tone A·exp(j2π·cycles·n/N) of the given length, interleaved I,Q. */
export function complexTone(opts: { sampleCount: number; amplitudeFs: number; cyclesPerSample: number; phaseRad?: number }): Float64Array {
  const x = new Float64Array(2 * opts.sampleCount)
  for (let n = 0; n < opts.sampleCount; n++) {
    const ph = 2 * Math.PI * opts.cyclesPerSample * n + (opts.phaseRad ?? 0)
    x[2 * n] = opts.amplitudeFs * Math.cos(ph)
    x[2 * n + 1] = opts.amplitudeFs * Math.sin(ph)
  }
  return x
}
