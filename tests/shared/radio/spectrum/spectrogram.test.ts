import { describe, expect, it } from 'vitest'
import { createSpectrogramAccumulator, welchPsd } from '../../../../shared/radio/spectrum'
import { complexNoise, complexTone } from './seeded-random'

const argmaxRow = (levels: Float32Array, row: number, cols: number) => {
  let best = 0
  for (let j = 1; j < cols; j++) if (levels[row * cols + j] > levels[row * cols + best]) best = j
  return best
}

describe('createSpectrogramAccumulator', () => {
  // A tone at +64 bins for the first half of the recording, then at −96 bins: 64 segments of
  // N = 256 without overlap, at most 8 rows → 8 segments per row, rows 0–3 first tone, 4–7 second.
  const fs = 2.048e6
  const n = 256
  const centerFreqHz = 462.5e6
  const half = 32 * n
  const amplitudeFs = 0.25 // power 0.0625 = −12.041 dBFS [D]
  const first = complexTone({ sampleCount: half, amplitudeFs, cyclesPerSample: 64 / n })
  const second = complexTone({ sampleCount: half, amplitudeFs, cyclesPerSample: -96 / n })
  const noise = complexNoise({ sampleCount: 2 * half, powerFs: 1e-6, seed: 3 })
  const iq = new Float64Array(4 * half)
  iq.set(first, 0)
  iq.set(second, 2 * half)
  for (let k = 0; k < iq.length; k++) iq[k] += noise[k]

  const acc = createSpectrogramAccumulator({ sampleRateHz: fs, centerFreqHz, segmentLength: n, maxRows: 8 })
  for (let at = 0; at < iq.length; at += 2 * 1000) acc.push(iq.subarray(at, Math.min(iq.length, at + 2 * 1000)))
  const s = acc.result()

  it('keeps at most maxRows rows by averaging segments: 64 segments → 8 rows of 8', () => {
    expect(s.rowCount).toBe(8)
    expect(s.columnCount).toBe(n)
    expect(s.segmentsPerRow).toBe(8)
    expect(Array.from(s.rowSegmentCount)).toEqual([8, 8, 8, 8, 8, 8, 8, 8])
    expect(Array.from(s.rowStartS)).toEqual([0, 1, 2, 3, 4, 5, 6, 7].map((r) => (r * 8 * n) / fs))
    expect(s.levelDb.length).toBe(8 * n)
  })

  it('puts the energy in the right cells: rows 0–3 at +64 bins, rows 4–7 at −96 bins', () => {
    for (let r = 0; r < 8; r++) {
      const j = argmaxRow(s.levelDb, r, n)
      expect(s.freqHz[j]).toBe(centerFreqHz + ((r < 4 ? 64 : -96) * fs) / n)
    }
  })

  it('reads the tone power in its cell: density × ENBW (hann, 1.5 bins) = −12.04 dBFS within 0.05 dB [D]', () => {
    const enbwHz = (1.5 * fs) / n
    for (let r = 0; r < 8; r++) {
      const peak = s.levelDb[r * n + argmaxRow(s.levelDb, r, n)]
      expect(Math.abs(peak + 10 * Math.log10(enbwHz) - 10 * Math.log10(amplitudeFs ** 2))).toBeLessThan(0.05)
    }
  })

  it("equals welchPsd over each row's own samples (same segments, no overlap)", () => {
    for (const r of [0, 5]) {
      const rowSamples = iq.subarray(2 * r * 8 * n, 2 * (r + 1) * 8 * n)
      const w = welchPsd({ iq: rowSamples, sampleRateHz: fs, centerFreqHz, segmentLength: n, overlapFraction: 0 }).value
      for (let j = 0; j < n; j++) expect(Math.abs(s.levelDb[r * n + j] - w.levelDb[j])).toBeLessThan(1e-4) // Float32 storage
    }
  })

  it('keeps a short recording in one row per segment, and a partial last row after merging', () => {
    const small = createSpectrogramAccumulator({ sampleRateHz: fs, segmentLength: n, maxRows: 4 })
    small.push(iq.subarray(0, 2 * 3 * n))
    expect(small.result().rowCount).toBe(3)
    small.push(iq.subarray(2 * 3 * n, 2 * 9 * n)) // 9 segments, 4 rows max → rows of 4: 4 + 4 + 1
    const r = small.result()
    expect(r.segmentsPerRow).toBe(4)
    expect(Array.from(r.rowSegmentCount)).toEqual([4, 4, 1])
  })

  it('satisfies Parseval per row with a rectangular window: Σ P·fs/N = mean |x|² of the row [D]', () => {
    const rect = createSpectrogramAccumulator({ sampleRateHz: fs, segmentLength: n, maxRows: 8, window: 'rectangular' })
    rect.push(iq)
    const r = rect.result()
    for (let row = 0; row < r.rowCount; row++) {
      let sum = 0
      for (let j = 0; j < n; j++) sum += 10 ** (r.levelDb[row * n + j] / 10)
      let power = 0
      const from = 2 * row * 8 * n
      for (let k = from; k < from + 2 * 8 * n; k++) power += iq[k] * iq[k]
      expect(Math.abs((sum * fs) / n / (power / (8 * n)) - 1)).toBeLessThan(1e-5)
    }
  })

  it('refuses an odd maxRows and a result before one segment', () => {
    expect(() => createSpectrogramAccumulator({ sampleRateHz: fs, segmentLength: n, maxRows: 5 })).toThrow(/even integer/)
    const empty = createSpectrogramAccumulator({ sampleRateHz: fs, segmentLength: n })
    empty.push(new Float32Array(20))
    expect(() => empty.result()).toThrow(/longer than the recording/)
  })
})
