import { Readable } from 'node:stream'
import { afterAll, describe, expect, it } from 'vitest'
import {
  createSigmfBlockDecoder,
  createWelchAccumulator,
  decimateTrace,
  parseSigmfMetadata,
  psdAsTrace,
  type WindowKind,
} from '../../shared/radio/spectrum'
import { analyseSpectrumFile, PARALLEL_WELCH_MIN_SAMPLES } from '../../server/modules/evidence/processing/analyse-spectrum'
import { closeParallelWelchWorkers, createParallelWelchAccumulator } from '../../server/modules/evidence/processing/parallel-welch'
import { complexNoise, complexTone } from '../shared/radio/spectrum/seeded-random'

// The workers are real worker threads running the TypeScript worker file through tsx (the
// same start-up as under `node --import tsx server/index.ts`).
afterAll(() => closeParallelWelchWorkers())

const argmax = (a: ArrayLike<number>) => {
  let best = 0
  for (let j = 1; j < a.length; j++) if (a[j] > a[best]) best = j
  return best
}

/** Pushes `iq` in blocks of the given complex-sample lengths (cycled). */
function pushInBlocks(push: (b: Float32Array | Float64Array) => void, iq: Float32Array | Float64Array, blockSamples: number[]) {
  let at = 0
  let b = 0
  while (at < iq.length) {
    const len = 2 * blockSamples[b++ % blockSamples.length]
    push(iq.subarray(at, Math.min(iq.length, at + len)))
    at += len
  }
}

/**
 * Largest |a − e|/e over the bins, in linear power. A bin whose expected power is rounding
 * noise (below 1e-12 of the strongest bin: the DC bin after mean removal with a rectangular
 * window) is compared relative to that floor instead.
 */
function worstRelative(actualDb: Float64Array, expectedDb: Float64Array): number {
  let peak = 0
  for (const v of expectedDb) peak = Math.max(peak, 10 ** (v / 10))
  let worst = 0
  for (let j = 0; j < expectedDb.length; j++) {
    const a = 10 ** (actualDb[j] / 10)
    const e = 10 ** (expectedDb[j] / 10)
    worst = Math.max(worst, Math.abs(a - e) / Math.max(e, 1e-12 * peak))
  }
  return worst
}

describe('createParallelWelchAccumulator against the single-threaded accumulator on the same samples', () => {
  const fs = 2.4e6
  const sampleCount = 200_003
  const iq = new Float64Array(complexNoise({ sampleCount, powerFs: 1e-3, seed: 11 }))
  const tone = complexTone({ sampleCount, amplitudeFs: 0.2, cyclesPerSample: 0.123 })
  for (let k = 0; k < iq.length; k++) iq[k] += tone[k]
  const iq32 = Float32Array.from(iq)

  // chunkSamples: the size of the ranges dealt to the workers (small here, so that every case has many)
  const cases: { window: WindowKind; n: number; overlap: number; detrend: 'none' | 'mean'; scaling: 'density' | 'spectrum'; workers: number; chunkSamples: number; blocks: number[]; f32: boolean }[] = [
    { window: 'hann', n: 1024, overlap: 0.5, detrend: 'none', scaling: 'density', workers: 2, chunkSamples: 9_000, blocks: [65_536], f32: true },
    { window: 'hann', n: 4096, overlap: 0.5, detrend: 'none', scaling: 'density', workers: 3, chunkSamples: 20_000, blocks: [777, 3, 40_960, 1000], f32: false },
    { window: 'blackman-harris', n: 512, overlap: 0.75, detrend: 'mean', scaling: 'spectrum', workers: 4, chunkSamples: 3_000, blocks: [511, 513], f32: true },
    { window: 'flattop', n: 256, overlap: 0, detrend: 'none', scaling: 'spectrum', workers: 2, chunkSamples: 50_000, blocks: [200_003], f32: false },
    { window: 'rectangular', n: 2048, overlap: 0.3, detrend: 'mean', scaling: 'density', workers: 5, chunkSamples: 7_777, blocks: [9_973], f32: true },
  ]
  for (const c of cases) {
    it(`${c.window}, N ${c.n}, overlap ${c.overlap}, ${c.detrend}, ${c.scaling}, ${c.workers} workers, ranges of ~${c.chunkSamples} samples, ${c.f32 ? 'float32' : 'float64'}: equal bin by bin to 1e-12 relative`, async () => {
      const samples = c.f32 ? iq32 : iq
      const opts = { sampleRateHz: fs, centerFreqHz: 433.92e6, segmentLength: c.n, overlapFraction: c.overlap, window: c.window, detrend: c.detrend, scaling: c.scaling }
      const single = createWelchAccumulator(opts)
      single.push(samples)
      const expected = single.result()
      const parallel = createParallelWelchAccumulator({ ...opts, sampleCount, workers: c.workers, chunkSamples: c.chunkSamples })
      expect(parallel.workerCount).toBe(c.workers)
      pushInBlocks((b) => parallel.push(b), samples, c.blocks)
      const r = await parallel.result()
      expect(r.value.segmentCount).toBe(expected.value.segmentCount)
      expect(r.value.samplesUsed).toBe(expected.value.samplesUsed)
      expect(Array.from(r.value.freqHz)).toEqual(Array.from(expected.value.freqHz))
      expect(r.value.enbwHz).toBe(expected.value.enbwHz)
      expect(r.value.levelUnit).toBe(expected.value.levelUnit)
      expect(r.warnings).toEqual(expected.warnings)
      expect(worstRelative(r.value.levelDb, expected.value.levelDb)).toBeLessThanOrEqual(1e-12)
      expect(argmax(r.value.levelDb)).toBe(argmax(expected.value.levelDb))
    })
  }

  it('uses no more workers than there are ranges', async () => {
    const p = createParallelWelchAccumulator({ sampleRateHz: fs, segmentLength: 1024, overlapFraction: 0, sampleCount: 3000, workers: 8, chunkSamples: 1024 })
    expect(p.workerCount).toBe(2)
    p.push(iq.subarray(0, 6000))
    expect((await p.result()).value.segmentCount).toBe(2)
  })
})

describe('a generated tone in noise through the parallel estimate [D]', () => {
  // The arithmetic of the single-threaded accumulator's test (register row SP-TN):
  //  tone A = 0.1 FS → −20.000 dBFS; noise 1e-4 FS² over fs = 1 MHz → −100.000 dBFS/Hz;
  //  Hann, N = 1024: ENBW = 1.5 bins (Harris 1978 §IV) = 1464.84 Hz → density peak −51.657 dBFS/Hz
  const fs = 1e6
  const n = 1024
  const centerFreqHz = 868e6
  const bin = 100
  const sampleCount = 256 * n
  const iq = new Float64Array(complexNoise({ sampleCount, powerFs: 1e-4, seed: 42 }))
  const tone = complexTone({ sampleCount, amplitudeFs: 0.1, cyclesPerSample: bin / n })
  for (let k = 0; k < iq.length; k++) iq[k] += tone[k]

  it('puts the peak at the centre + 100 bins and reads −20.00 dBFS within 0.05 dB, noise −100 dBFS/Hz within 0.2 dB', async () => {
    const p = createParallelWelchAccumulator({ sampleRateHz: fs, centerFreqHz, segmentLength: n, sampleCount, workers: 2, chunkSamples: 20_000 })
    // pushed as the processing job does: each block, then ready()
    for (let at = 0; at < iq.length; at += 2 * 5_000) {
      p.push(iq.subarray(at, at + 2 * 5_000))
      await p.ready()
    }
    const r = (await p.result()).value
    const peakAt = argmax(r.levelDb)
    expect(r.freqHz[peakAt]).toBe(centerFreqHz + (bin * fs) / n)
    expect(r.levelDb[peakAt]).toBeCloseTo(-51.657, 1)
    expect(Math.abs(r.levelDb[peakAt] + 10 * Math.log10(r.enbwHz) - -20)).toBeLessThan(0.05)
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

describe('createParallelWelchAccumulator refusals', () => {
  const fs = 1e6
  const sampleCount = 100_000

  it('names the first non-finite sample by its index in the whole recording, as the single-threaded accumulator does', async () => {
    // ranges of 19 segments × 512 = 9,728 samples, dealt in turn: sample 90,000 is in range 9
    // (second worker), 99,000 in range 10 (first worker), which may fail first
    const iq = new Float32Array(complexNoise({ sampleCount, powerFs: 1e-3, seed: 3 }))
    iq[2 * 90_000 + 1] = NaN
    iq[2 * 99_000] = Infinity
    const single = createWelchAccumulator({ sampleRateHz: fs, segmentLength: 1024 })
    expect(() => single.push(iq)).toThrow(/first at complex sample 90000\)/)
    const p = createParallelWelchAccumulator({ sampleRateHz: fs, segmentLength: 1024, sampleCount, workers: 2, chunkSamples: 10_000 })
    pushInBlocks((b) => p.push(b), iq, [10_000])
    await expect(p.result()).rejects.toThrow(/NaN or Infinity \(first at complex sample 90000\)/)
  })

  it('finds a non-finite sample after the last whole segment (sent to the last worker)', async () => {
    const iq = new Float32Array(complexNoise({ sampleCount, powerFs: 1e-3, seed: 4 }))
    iq[2 * (sampleCount - 1)] = NaN // 100,000 samples = 194 segments of 1024 at 512 steps + 224 left over
    const p = createParallelWelchAccumulator({ sampleRateHz: fs, segmentLength: 1024, sampleCount, workers: 2, chunkSamples: 10_000 })
    p.push(iq)
    await expect(p.result()).rejects.toThrow(/first at complex sample 99999\)/)
  })

  it('refuses more samples than declared, odd blocks, a short recording and a recording that ends early', async () => {
    const p = createParallelWelchAccumulator({ sampleRateHz: fs, segmentLength: 1024, sampleCount: 4096, workers: 2 })
    expect(() => p.push(new Float32Array(3))).toThrow(/even length/)
    expect(() => p.push(new Float32Array(2 * 4097))).toThrow(/more samples pushed than the 4096 declared/)
    p.push(new Float32Array(2 * 2048))
    await expect(p.result()).rejects.toThrow(/ended early: 2048 of the 4096/)
    expect(() => createParallelWelchAccumulator({ sampleRateHz: fs, segmentLength: 1024, sampleCount: 1000 })).toThrow(/longer than the recording/)
    expect(() => createParallelWelchAccumulator({ sampleRateHz: fs, segmentLength: 1000, sampleCount: 4096 })).toThrow(/power of two/)
  })
})

describe('the processing job on a recording above the parallel threshold', () => {
  /** One ustar header block (POSIX.1-2008 ustar layout). */
  function tarHeader(name: string, size: number): Buffer {
    const h = Buffer.alloc(512)
    h.write(name, 0, 'ascii')
    h.write('0000644\0', 100, 'ascii')
    h.write(size.toString(8).padStart(11, '0') + '\0', 124, 'ascii')
    h.write('        ', 148, 'ascii')
    h.write('0', 156, 'ascii')
    h.write('ustar\0', 257, 'ascii')
    h.write('00', 263, 'ascii')
    let sum = 0
    for (const b of h) sum += b
    h.write(sum.toString(8).padStart(6, '0') + '\0 ', 148, 'ascii')
    return h
  }
  const pad = (n: number) => Buffer.alloc((512 - (n % 512)) % 512)

  it('gives the display trace and peaks of the single-threaded accumulator on the same cu8 samples', async () => {
    const sampleCount = PARALLEL_WELCH_MIN_SAMPLES
    const fs = 2.048e6
    const centerHz = 162.025e6
    // cu8: a tone of amplitude 60 counts at +0.2·fs about mid-scale 127.5, with a little noise
    const noise = complexNoise({ sampleCount, powerFs: 1, seed: 5 })
    const data = Buffer.alloc(2 * sampleCount)
    for (let k = 0; k < sampleCount; k++) {
      const ph = 2 * Math.PI * 0.2 * k
      data[2 * k] = Math.max(0, Math.min(255, Math.round(127.5 + 60 * Math.cos(ph) + 3 * noise[2 * k])))
      data[2 * k + 1] = Math.max(0, Math.min(255, Math.round(127.5 + 60 * Math.sin(ph) + 3 * noise[2 * k + 1])))
    }
    const meta = Buffer.from(
      JSON.stringify({
        global: { 'core:datatype': 'cu8', 'core:version': '1.2.6', 'core:sample_rate': fs },
        captures: [{ 'core:sample_start': 0, 'core:frequency': centerHz }],
        annotations: [],
      }),
    )
    const archive = Buffer.concat([tarHeader('r.sigmf-meta', meta.length), meta, pad(meta.length), tarHeader('r.sigmf-data', data.length), data, pad(data.length), Buffer.alloc(1024)])
    const chunks = () => Readable.from((function* () {
      for (let at = 0; at < archive.length; at += 1 << 20) yield archive.subarray(at, at + (1 << 20))
    })())
    const analysis = await analyseSpectrumFile({ open: async () => chunks(), originalName: 'r.sigmf', contentType: 'application/x-tar' })

    // the same samples through the single-threaded accumulator, as the job did before
    const metadata = parseSigmfMetadata(meta.toString('utf8'))
    const decoder = createSigmfBlockDecoder({ metadata })
    const single = createWelchAccumulator({ sampleRateHz: fs, centerFreqHz: centerHz, segmentLength: 4096, overlapFraction: 0.5, window: 'hann' })
    for (let at = 0; at < data.length; at += 1 << 20) single.push(decoder.decode(data.subarray(at, at + (1 << 20))))
    const expected = decimateTrace(psdAsTrace(single.result().value))

    expect(analysis.summary.recording?.sampleCount).toBe(sampleCount)
    expect(analysis.summary.recording?.segmentCount).toBe(2047)
    expect(analysis.displayTrace.freqHz).toEqual(Array.from(expected.freqHz))
    let worst = 0
    for (let j = 0; j < expected.levelDbm.length; j++) worst = Math.max(worst, Math.abs(analysis.displayTrace.levelDbm[j] - expected.levelDbm[j]))
    expect(worst).toBeLessThan(1e-9)
    // the strongest peak is the tone at centre + 0.2·fs = 162.4346 MHz (bin-centred: 819.2 bins, so within one bin)
    expect(Math.abs(analysis.summary.peaks[0].freqHz - (centerHz + 0.2 * fs))).toBeLessThanOrEqual(fs / 4096)
  })
})
