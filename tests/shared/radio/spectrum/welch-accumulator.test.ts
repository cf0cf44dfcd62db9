import { describe, expect, it } from 'vitest'
import { createWelchAccumulator, welchPsd, type WindowKind } from '../../../../shared/radio/spectrum'
import { WELCH_SCIPY_ROWS } from '../../../fixtures/radio/spectrum-scipy'
import { complexNoise, complexTone } from './seeded-random'

const argmax = (a: ArrayLike<number>) => {
  let best = 0
  for (let j = 1; j < a.length; j++) if (a[j] > a[best]) best = j
  return best
}

/** Pushes `iq` in blocks of the given complex-sample lengths (cycled) and returns the result. */
function pushInBlocks(acc: ReturnType<typeof createWelchAccumulator>, iq: Float64Array | Float32Array, blockSamples: number[]) {
  let at = 0
  let b = 0
  while (at < iq.length) {
    const len = 2 * blockSamples[b++ % blockSamples.length]
    acc.push(iq.subarray(at, Math.min(iq.length, at + len)))
    at += len
  }
  return acc.result()
}

function expectRelativelyEqual(actualDb: Float64Array, expectedDb: Float64Array, rel: number) {
  expect(actualDb.length).toBe(expectedDb.length)
  let worst = 0
  for (let j = 0; j < expectedDb.length; j++) {
    // compared in linear power, relative to each bin's own power
    const a = 10 ** (actualDb[j] / 10)
    const e = 10 ** (expectedDb[j] / 10)
    worst = Math.max(worst, Math.abs(a - e) / e)
  }
  expect(worst).toBeLessThanOrEqual(rel)
}

describe('createWelchAccumulator against the one-shot welchPsd on the same samples', () => {
  const fs = 2.4e6
  const sampleCount = 20_000
  const iq = new Float64Array(complexNoise({ sampleCount, powerFs: 1e-3, seed: 7 }))
  const tone = complexTone({ sampleCount, amplitudeFs: 0.2, cyclesPerSample: 0.123 })
  for (let k = 0; k < iq.length; k++) iq[k] += tone[k]

  const cases: { window: WindowKind; n: number; overlap: number; detrend: 'none' | 'mean'; scaling: 'density' | 'spectrum'; blocks: number[] }[] = [
    { window: 'hann', n: 1024, overlap: 0.5, detrend: 'none', scaling: 'density', blocks: [1] },
    { window: 'hann', n: 1024, overlap: 0.5, detrend: 'none', scaling: 'density', blocks: [777, 3, 4096, 1000] },
    { window: 'blackman-harris', n: 512, overlap: 0.75, detrend: 'mean', scaling: 'spectrum', blocks: [511, 513] },
    { window: 'flattop', n: 256, overlap: 0, detrend: 'none', scaling: 'spectrum', blocks: [20_000] },
    { window: 'rectangular', n: 2048, overlap: 0.3, detrend: 'mean', scaling: 'density', blocks: [97] },
  ]
  for (const c of cases) {
    it(`${c.window}, N ${c.n}, overlap ${c.overlap}, ${c.detrend}, ${c.scaling}, blocks ${c.blocks.join('/')}: equal to 1e-12 relative`, () => {
      const opts = { sampleRateHz: fs, centerFreqHz: 145e6, segmentLength: c.n, overlapFraction: c.overlap, window: c.window, detrend: c.detrend, scaling: c.scaling }
      const oneShot = welchPsd({ ...opts, iq }).value
      const acc = createWelchAccumulator(opts)
      const r = pushInBlocks(acc, iq, c.blocks).value
      expect(r.segmentCount).toBe(oneShot.segmentCount)
      expect(r.samplesUsed).toBe(oneShot.samplesUsed)
      expect(Array.from(r.freqHz)).toEqual(Array.from(oneShot.freqHz))
      expect(r.enbwHz).toBe(oneShot.enbwHz)
      expect(r.levelUnit).toBe(oneShot.levelUnit)
      expectRelativelyEqual(r.levelDb, oneShot.levelDb, 1e-12)
      expect(acc.samplesPushed).toBe(sampleCount)
    })
  }

  it('takes Float32 blocks as the one-shot takes the same Float32 samples', () => {
    const iq32 = Float32Array.from(iq)
    const opts = { sampleRateHz: fs, segmentLength: 1024 }
    const oneShot = welchPsd({ ...opts, iq: iq32 }).value
    const r = pushInBlocks(createWelchAccumulator(opts), iq32, [333]).value
    expectRelativelyEqual(r.levelDb, oneShot.levelDb, 1e-12)
  })

  for (const row of WELCH_SCIPY_ROWS) {
    it(`${row.id}: pushed in blocks of 37 samples, matches ${row.inputs.call} within ${row.tolerance} dB (${row.source})`, () => {
      const c = row.inputs
      const acc = createWelchAccumulator({ sampleRateHz: c.sampleRateHz, segmentLength: c.segmentLength, overlapFraction: c.overlapFraction, window: c.window, scaling: c.scaling, detrend: c.detrend })
      const r = pushInBlocks(acc, Float64Array.from(c.iqInterleaved), [37]).value
      const exp = row.expected.psdLinearShifted
      const peak = Math.max(...exp)
      for (let j = 0; j < exp.length; j++) {
        const got = 10 ** (r.levelDb[j] / 10)
        if (exp[j] < peak * 1e-12) expect(Math.abs(got - exp[j]) / peak).toBeLessThan(1e-9)
        else expect(Math.abs(r.levelDb[j] - 10 * Math.log10(exp[j]))).toBeLessThan(row.tolerance)
        expect(Math.abs(r.freqHz[j] - row.expected.freqHzShifted[j])).toBeLessThan(row.tolerance)
      }
    })
  }

  it('refuses a result before one whole segment, non-finite samples and odd blocks, with their reasons', () => {
    const acc = createWelchAccumulator({ sampleRateHz: fs, segmentLength: 64 })
    expect(() => acc.result()).toThrow(/must not be empty/)
    acc.push(new Float32Array(2 * 63))
    expect(() => acc.result()).toThrow(/segmentLength 64 is longer than the recording \(63 complex samples\)/)
    const bad = new Float32Array(10)
    bad[7] = NaN
    expect(() => acc.push(bad)).toThrow(/NaN or Infinity \(first at complex sample 66\)/)
    expect(() => acc.push(new Float32Array(3))).toThrow(/even length/)
    expect(() => createWelchAccumulator({ sampleRateHz: fs, segmentLength: 1000 })).toThrow(/power of two/)
  })
})

describe('a generated tone in noise through the accumulator [D]', () => {
  // Arithmetic (derived, D):
  //  tone A = 0.1 FS → power A² = 0.01 = −20.000 dBFS
  //  noise E|x|² = 1e-4 FS² spread over fs = 1 MHz → density 1e-10 /Hz = −100.000 dBFS/Hz
  //  Hann window, N = 1024: ENBW = 1.5 bins (Harris 1978 §IV) = 1.5 · 1e6/1024 = 1464.84 Hz
  //  → a bin-centred tone's density peak = P_tone/ENBW_Hz = −20 − 31.657 = −51.657 dBFS/Hz,
  //    plus the noise in that bin (1.46e-7 FS², 1.5e-5 of the tone: +0.0001 dB)
  const fs = 1e6
  const n = 1024
  const centerFreqHz = 868e6
  const bin = 100
  const sampleCount = 64 * n
  const iq = new Float64Array(complexNoise({ sampleCount, powerFs: 1e-4, seed: 42 }))
  const tone = complexTone({ sampleCount, amplitudeFs: 0.1, cyclesPerSample: bin / n })
  for (let k = 0; k < iq.length; k++) iq[k] += tone[k]
  const r = pushInBlocks(createWelchAccumulator({ sampleRateHz: fs, centerFreqHz, segmentLength: n }), iq, [4096]).value

  it('puts the peak at the centre + 100 bins = 868.097656 MHz', () => {
    expect(r.freqHz[argmax(r.levelDb)]).toBe(centerFreqHz + (bin * fs) / n)
  })
  it('reads the tone power −20.00 dBFS (density peak + 10·log10 ENBW_Hz) within 0.05 dB', () => {
    expect(r.enbwHz).toBeCloseTo(1464.84375, 5)
    const peak = r.levelDb[argmax(r.levelDb)]
    expect(peak).toBeCloseTo(-51.657, 1)
    expect(Math.abs(peak + 10 * Math.log10(r.enbwHz) - -20)).toBeLessThan(0.05)
  })
  it('reads the noise density −100 dBFS/Hz (mean of bins away from the tone) within 0.2 dB', () => {
    let s = 0
    let count = 0
    for (let j = 0; j < n; j++) {
      if (Math.abs(j - (n / 2 + bin)) > 4) {
        s += 10 ** (r.levelDb[j] / 10)
        count++
      }
    }
    expect(Math.abs(10 * Math.log10(s / count) - -100)).toBeLessThan(0.2)
  })
})
