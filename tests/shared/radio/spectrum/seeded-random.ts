/** Test signals for the spectrum tests, from the library's seeded generators: the same stream every run. */
import { createNormalSource, createUniformSource } from '../../../../shared/radio/uncertainty/prng'

/** Complex white Gaussian noise with E|x|² = powerFs, interleaved I,Q. */
export function complexNoise(opts: { sampleCount: number; powerFs: number; seed: number }): Float64Array {
  const g = createNormalSource(createUniformSource(opts.seed))
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
