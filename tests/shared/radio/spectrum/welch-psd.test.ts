import { describe, expect, it } from 'vitest'
import { welchPsd, type WindowKind } from '../../../../shared/radio/spectrum'
import { WELCH_SCIPY_ROWS } from '../../../fixtures/radio/spectrum-scipy'
import { complexNoise, complexTone } from './seeded-random'

const log10 = Math.log10
const sumLinear = (levelDb: ArrayLike<number>) => {
  let s = 0
  for (let j = 0; j < levelDb.length; j++) s += 10 ** (levelDb[j] / 10)
  return s
}
const argmax = (a: ArrayLike<number>) => {
  let best = 0
  for (let j = 1; j < a.length; j++) if (a[j] > a[best]) best = j
  return best
}

describe('welchPsd with a complex tone of known power', () => {
  const fs = 1.024e6
  const n = 1024
  const centerFreqHz = 433.92e6
  const amplitudeFs = 0.3 // power 0.09 = −10.4576 dBFS [D]
  const toneDbfs = 10 * log10(amplitudeFs ** 2)

  for (const bin of [37, -50]) {
    it(`puts a bin-centred tone at offset ${bin} bins in that bin at its power within 0.1 dB ('spectrum', hann) [D]`, () => {
      const iq = complexTone({ sampleCount: 16 * n, amplitudeFs, cyclesPerSample: bin / n })
      const r = welchPsd({ iq, sampleRateHz: fs, centerFreqHz, segmentLength: n, scaling: 'spectrum' })
      const j = argmax(r.value.levelDb)
      expect(r.value.freqHz[j]).toBeCloseTo(centerFreqHz + (bin * fs) / n, 6)
      expect(Math.abs(r.value.levelDb[j] - toneDbfs)).toBeLessThan(0.1)
      expect(r.value.levelUnit).toBe('dBFS')
      expect(r.value.reference.kind).toBe('dBFS')
    })
  }

  it('applies the calibration: full scale = −20 dBm puts the tone at −30.46 dBm within 0.1 dB [D]', () => {
    const iq = complexTone({ sampleCount: 16 * n, amplitudeFs, cyclesPerSample: 100 / n })
    const r = welchPsd({ iq, sampleRateHz: fs, segmentLength: n, scaling: 'spectrum', fullScaleDbm: -20 })
    const j = argmax(r.value.levelDb)
    expect(Math.abs(r.value.levelDb[j] - (toneDbfs - 20))).toBeLessThan(0.1)
    expect(r.value.levelUnit).toBe('dBm')
    expect(r.warnings.join(' ')).not.toMatch(/No calibration/)
  })

  for (const window of ['hann', 'blackman-harris', 'flattop', 'rectangular'] as WindowKind[]) {
    it(`gives a 'density' peak that times the ${window} window's ENBW equals the tone power within 0.1 dB [D]`, () => {
      const iq = complexTone({ sampleCount: 16 * n, amplitudeFs, cyclesPerSample: 200 / n })
      const r = welchPsd({ iq, sampleRateHz: fs, segmentLength: n, window, scaling: 'density' })
      const peak = r.value.levelDb[argmax(r.value.levelDb)]
      expect(Math.abs(peak + 10 * log10(r.value.enbwHz) - toneDbfs)).toBeLessThan(0.1)
      expect(r.value.levelUnit).toBe('dBFS/Hz')
    })
  }

  it('reports the Hann ENBW as 1.5 bins = 1.5 kHz at 1 kHz bin spacing (Harris 1978 Table I [M], eq. 2 [D])', () => {
    const r = welchPsd({ iq: complexTone({ sampleCount: 4 * n, amplitudeFs, cyclesPerSample: 0.1 }), sampleRateHz: fs, segmentLength: n })
    expect(r.value.binSpacingHz).toBe(1000)
    expect(r.value.enbwBins).toBeCloseTo(1.5, 12)
    expect(r.value.enbwHz).toBeCloseTo(1500, 9)
  })
})

describe('welchPsd with white complex Gaussian noise (seeded)', () => {
  const fs = 2e6
  const powerFs = 0.01 // E|x|² → density 0.01/2e6 = −83.01 dBFS/Hz [D]
  const iq = complexNoise({ sampleCount: 1 << 16, powerFs, seed: 12345 })

  it('gives the expected density σ²/fs within 0.2 dB averaged over bins [D]', () => {
    const r = welchPsd({ iq, sampleRateHz: fs, segmentLength: 256 })
    const meanDensity = sumLinear(r.value.levelDb) / r.value.levelDb.length
    expect(Math.abs(10 * log10(meanDensity) - 10 * log10(powerFs / fs))).toBeLessThan(0.2)
  })

  it('gives the calibrated density in dBm/Hz: full scale −10 dBm → −93.01 dBm/Hz within 0.2 dB [D]', () => {
    const r = welchPsd({ iq, sampleRateHz: fs, segmentLength: 256, fullScaleDbm: -10, window: 'blackman-harris' })
    const meanDensity = sumLinear(r.value.levelDb) / r.value.levelDb.length
    expect(Math.abs(10 * log10(meanDensity) - (10 * log10(powerFs / fs) - 10))).toBeLessThan(0.2)
    expect(r.value.levelUnit).toBe('dBm/Hz')
  })

  it('satisfies Parseval: the integral of the density equals mean |x|² within 1 % (hann, 50 % overlap) [D]', () => {
    const r = welchPsd({ iq, sampleRateHz: fs, segmentLength: 256 })
    let meanPower = 0
    for (let k = 0; k < iq.length; k++) meanPower += iq[k] * iq[k]
    meanPower /= iq.length / 2
    const integral = sumLinear(r.value.levelDb) * r.value.binSpacingHz
    expect(Math.abs(integral / meanPower - 1)).toBeLessThan(0.01)
  })

  it('satisfies Parseval exactly (1e-9) with a rectangular window and no overlap [D]', () => {
    const r = welchPsd({ iq, sampleRateHz: fs, segmentLength: 512, window: 'rectangular', overlapFraction: 0 })
    let meanPower = 0
    for (let k = 0; k < iq.length; k++) meanPower += iq[k] * iq[k]
    meanPower /= iq.length / 2
    expect(r.value.samplesUsed).toBe(1 << 16)
    expect(Math.abs((sumLinear(r.value.levelDb) * r.value.binSpacingHz) / meanPower - 1)).toBeLessThan(1e-9)
  })

  it('accepts separate I and Q arrays with the same result as interleaved samples [D]', () => {
    const m = 4096
    const i = new Float64Array(m)
    const q = new Float64Array(m)
    for (let k = 0; k < m; k++) {
      i[k] = iq[2 * k]
      q[k] = iq[2 * k + 1]
    }
    const a = welchPsd({ iq: iq.subarray(0, 2 * m), sampleRateHz: fs, segmentLength: 128, detrend: 'mean' })
    const b = welchPsd({ iq: { i, q }, sampleRateHz: fs, segmentLength: 128, detrend: 'mean' })
    for (let j = 0; j < 128; j++) expect(b.value.levelDb[j]).toBeCloseTo(a.value.levelDb[j], 10)
  })
})

describe('welchPsd against scipy.signal.welch (stored fixture)', () => {
  const centerFreqHz = 162.025e6
  for (const row of WELCH_SCIPY_ROWS) {
    const c = { ...row.inputs, ...row.expected }
    const tol = row.tolerance
    // Bins more than 120 dB below the peak are numerical zeros (e.g. DC after mean removal with a
    // rectangular window); they are compared in linear power against the peak instead of in dB.
    it(`${row.id}: matches ${c.call} within ${tol} dB and ${tol} Hz (${row.source})`, () => {
      const r = welchPsd({
        iq: Float64Array.from(c.iqInterleaved),
        sampleRateHz: c.sampleRateHz,
        centerFreqHz,
        segmentLength: c.segmentLength,
        overlapFraction: c.overlapFraction,
        window: c.window,
        detrend: c.detrend,
        scaling: c.scaling,
      })
      expect(r.value.levelDb.length).toBe(c.psdLinearShifted.length)
      const peak = Math.max(...c.psdLinearShifted)
      let comparedInDb = 0
      for (let j = 0; j < c.psdLinearShifted.length; j++) {
        expect(Math.abs(r.value.freqHz[j] - centerFreqHz - c.freqHzShifted[j])).toBeLessThan(tol)
        if (c.psdLinearShifted[j] > peak * 1e-12) {
          expect(Math.abs(r.value.levelDb[j] - 10 * log10(c.psdLinearShifted[j]))).toBeLessThan(tol)
          comparedInDb++
        } else {
          expect(Math.abs(10 ** (r.value.levelDb[j] / 10) - c.psdLinearShifted[j])).toBeLessThan(peak * 1e-12)
        }
      }
      expect(comparedInDb).toBeGreaterThanOrEqual(c.psdLinearShifted.length - 1)
    })
  }
})

describe('welchPsd input checks', () => {
  const ok = complexTone({ sampleCount: 256, amplitudeFs: 0.5, cyclesPerSample: 0.1 })
  it('throws RangeError for empty samples', () => {
    expect(() => welchPsd({ iq: new Float32Array(0), sampleRateHz: 1e6, segmentLength: 64 })).toThrow(RangeError)
    expect(() => welchPsd({ iq: { i: [], q: [] }, sampleRateHz: 1e6, segmentLength: 64 })).toThrow(RangeError)
  })
  it('throws RangeError for I and Q arrays of different lengths, or an odd interleaved length', () => {
    expect(() => welchPsd({ iq: { i: new Float64Array(128), q: new Float64Array(127) }, sampleRateHz: 1e6, segmentLength: 64 })).toThrow(/same length/)
    expect(() => welchPsd({ iq: new Float32Array(129), sampleRateHz: 1e6, segmentLength: 64 })).toThrow(/even length/)
  })
  it('throws RangeError naming the sample when a sample is NaN or infinite', () => {
    const bad = Float64Array.from(ok)
    bad[2 * 77 + 1] = NaN
    expect(() => welchPsd({ iq: bad, sampleRateHz: 1e6, segmentLength: 64 })).toThrow(/complex sample 77/)
    const inf = Float64Array.from(ok)
    inf[2 * 255] = Infinity
    expect(() => welchPsd({ iq: inf, sampleRateHz: 1e6, segmentLength: 64, overlapFraction: 0 })).toThrow(RangeError)
  })
  it('throws RangeError when the segment length is not a power of two or exceeds the recording', () => {
    expect(() => welchPsd({ iq: ok, sampleRateHz: 1e6, segmentLength: 100 })).toThrow(/power of two/)
    expect(() => welchPsd({ iq: ok, sampleRateHz: 1e6, segmentLength: 1 })).toThrow(RangeError)
    expect(() => welchPsd({ iq: ok, sampleRateHz: 1e6, segmentLength: 512 })).toThrow(/longer than the recording/)
  })
  it('throws RangeError for a zero, negative or NaN sample rate', () => {
    for (const sampleRateHz of [0, -1e6, NaN]) {
      expect(() => welchPsd({ iq: ok, sampleRateHz, segmentLength: 64 })).toThrow(RangeError)
    }
  })
  it('throws RangeError for an overlap of 1 or more, or a non-finite calibration', () => {
    expect(() => welchPsd({ iq: ok, sampleRateHz: 1e6, segmentLength: 64, overlapFraction: 1 })).toThrow(RangeError)
    expect(() => welchPsd({ iq: ok, sampleRateHz: 1e6, segmentLength: 64, fullScaleDbm: NaN })).toThrow(RangeError)
  })
  it('warns when few segments are averaged and states the dBFS reference', () => {
    const r = welchPsd({ iq: ok, sampleRateHz: 1e6, segmentLength: 128 })
    expect(r.value.segmentCount).toBe(3)
    expect(r.warnings.join(' ')).toMatch(/Only 3 segment/)
    expect(r.warnings.join(' ')).toMatch(/dBFS/)
    expect(r.method.id).toBe('welch-psd')
  })
})
