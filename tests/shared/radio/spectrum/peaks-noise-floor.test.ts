import { describe, expect, it } from 'vitest'
import { findPeaks, localMaximaWithProminence, noiseFloor, percentile } from '../../../../shared/radio/spectrum'
import { PEAKS_SCIPY_ROW, PERCENTILE_ROWS, SCIPY_VERSIONS } from '../../../fixtures/radio/spectrum-scipy'

const fx = {
  provenance: { scipy: SCIPY_VERSIONS.traceScipy, numpy: SCIPY_VERSIONS.traceNumpy },
  ...PEAKS_SCIPY_ROW.inputs,
  ...PEAKS_SCIPY_ROW.expected,
  percentiles: Object.fromEntries(PERCENTILE_ROWS.map((r) => [String(r.inputs.percentile), r.expected])),
}
const trace = { freqHz: fx.freqHz, levelDbm: fx.levelDbm }

describe('localMaximaWithProminence against scipy.signal.find_peaks and peak_prominences', () => {
  const maxima = localMaximaWithProminence(fx.levelDbm)
  it(`finds the same ${fx.peakIndices.length} local maxima, plateau rule included (scipy ${fx.provenance.scipy})`, () => {
    expect(maxima.map((m) => m.index)).toEqual(fx.peakIndices)
    expect(fx.peakIndices).toContain(701) // middle of the 700–702 plateau
  })
  it(`gives the same prominences within ${PEAKS_SCIPY_ROW.tolerance} dB and the same bases (${PEAKS_SCIPY_ROW.source})`, () => {
    maxima.forEach((m, k) => {
      expect(Math.abs(m.prominenceDb - fx.prominencesDb[k])).toBeLessThanOrEqual(PEAKS_SCIPY_ROW.tolerance)
      expect(m.leftBaseIndex).toBe(fx.leftBases[k])
      expect(m.rightBaseIndex).toBe(fx.rightBases[k])
    })
  })
  it('finds no peak at the ends or in a monotonic run [D]', () => {
    expect(localMaximaWithProminence([5, 4, 3, 2, 1])).toEqual([])
    expect(localMaximaWithProminence([1, 2, 2, 2])).toEqual([])
    expect(localMaximaWithProminence([1, 3, 1])[0]).toMatchObject({ index: 1, prominenceDb: 2 })
  })
})

describe('noiseFloor as a percentile of trace levels', () => {
  for (const row of PERCENTILE_ROWS) {
    it(`${row.id}: matches numpy.percentile(levels, ${row.inputs.percentile}) within ${row.tolerance} dB (${row.source})`, () => {
      expect(Math.abs(percentile({ values: row.inputs.levelDbm, percentile: row.inputs.percentile }) - row.expected)).toBeLessThanOrEqual(row.tolerance)
    })
  }
  it('defaults to the median and states the percentile used', () => {
    const r = noiseFloor(trace)
    expect(r.value.percentile).toBe(50)
    expect(r.value.noiseFloorDbm).toBeCloseTo(fx.percentiles['50'], 9)
  })
  it('interpolates linearly between order statistics: median of [1, 2, 3, 10] is 2.5 [D]', () => {
    expect(percentile({ values: [10, 1, 3, 2], percentile: 50 })).toBe(2.5)
    expect(percentile({ values: [10, 1, 3, 2], percentile: 0 })).toBe(1)
    expect(percentile({ values: [10, 1, 3, 2], percentile: 100 })).toBe(10)
  })
})

describe('findPeaks above the noise floor', () => {
  it(`reports the scipy maxima that clear median + 10 dB with ≥ 6 dB prominence, strongest first (scipy ${fx.provenance.scipy})`, () => {
    const floor = fx.percentiles['50']
    const expected = fx.peakIndices
      .map((index, k) => ({ index, prominence: fx.prominencesDb[k], level: fx.levelDbm[index] }))
      .filter((p) => p.level >= floor + 10 && p.prominence >= 6)
      .sort((a, b) => b.level - a.level)
    const r = findPeaks(trace)
    expect(r.value.peaks.map((p) => p.index)).toEqual(expected.map((p) => p.index))
    // Two emissions and the plateau; the shoulder at 113 MHz rises only 1.43 dB out of its neighbour's skirt.
    expect(r.value.peaks.map((p) => p.index)).toEqual([200, 500, 701])
    expect(r.value.peaks[0].freqHz).toBe(105e6)
    expect(r.value.noiseFloorBasis).toMatch(/median/)
    expect(r.value.peaks[0].aboveNoiseDb).toBeCloseTo(fx.levelDbm[200] - floor, 12)
  })
  it('reports the 113 MHz shoulder once the prominence limit drops below its 1.43 dB (scipy prominence)', () => {
    const r = findPeaks({ ...trace, minProminenceDb: 1 })
    expect(r.value.peaks.map((p) => p.index)).toEqual([200, 500, 520, 701])
    expect(r.value.peaks[2].prominenceDb).toBeCloseTo(fx.prominencesDb[fx.peakIndices.indexOf(520)], 9)
  })
  it('keeps only the strongest maxPeaks and says so', () => {
    const r = findPeaks({ ...trace, maxPeaks: 2 })
    expect(r.value.peaks.map((p) => p.index)).toEqual([200, 500])
    expect(r.warnings.join(' ')).toMatch(/2 strongest/)
  })
  it('uses a given noise floor instead of the median', () => {
    const r = findPeaks({ ...trace, noiseFloorDbm: -65, thresholdDb: 0 })
    expect(r.value.peaks.map((p) => p.index)).toEqual([200, 500])
    expect(r.value.noiseFloorBasis).toBe('given by the caller')
  })
  it('throws RangeError for empty, mismatched or non-finite traces', () => {
    expect(() => findPeaks({ freqHz: [], levelDbm: [] })).toThrow(RangeError)
    expect(() => findPeaks({ freqHz: [1, 2, 3], levelDbm: [1, 2] })).toThrow(/same length/)
    expect(() => findPeaks({ freqHz: [1, 2, 3], levelDbm: [1, NaN, 2] })).toThrow(RangeError)
    expect(() => findPeaks({ freqHz: [1, 3, 2], levelDbm: [1, 2, 3] })).toThrow(/ascending/)
    expect(() => noiseFloor({ freqHz: [1, 2], levelDbm: [1, 2], percentile: 101 })).toThrow(RangeError)
  })
})
