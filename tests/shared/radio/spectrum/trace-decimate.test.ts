import { describe, expect, it } from 'vitest'
import { decimateTrace, DISPLAY_TRACE_MAX_POINTS } from '../../../../shared/radio/spectrum'
import { complexNoise } from './seeded-random'

describe('decimateTrace (min/max display reduction)', () => {
  const n = 100_003
  const freqHz = Float64Array.from({ length: n }, (_, i) => 400e6 + i * 100)
  const noise = complexNoise({ sampleCount: n, powerFs: 1, seed: 11 })
  const levelDbm = Float64Array.from({ length: n }, (_, i) => -100 + 2 * noise[2 * i])
  // narrow one-point spikes and one deep notch
  const spikes = [17, 25_000, 25_001, 61_234, n - 1]
  spikes.forEach((i, k) => (levelDbm[i] = -40 + k))
  levelDbm[77_777] = -160

  const d = decimateTrace({ freqHz, levelDbm })

  it('gives at most 4,096 points, ascending in frequency', () => {
    expect(DISPLAY_TRACE_MAX_POINTS).toBe(4096)
    expect(d.decimated).toBe(true)
    expect(d.sourcePointCount).toBe(n)
    expect(d.freqHz.length).toBeLessThanOrEqual(4096)
    expect(d.freqHz.length).toBeGreaterThan(4000)
    for (let k = 1; k < d.freqHz.length; k++) expect(d.freqHz[k]).toBeGreaterThan(d.freqHz[k - 1])
  })

  it('keeps every spike and the notch at their own frequency and level', () => {
    const kept = new Map<number, number>()
    d.freqHz.forEach((f, k) => kept.set(f, d.levelDbm[k]))
    for (const i of [17, 25_001, 61_234, n - 1, 77_777]) expect(kept.get(freqHz[i])).toBe(levelDbm[i])
    // two spikes closer than one bucket (~49 points) show as the higher of them only
    expect(kept.has(freqHz[25_000])).toBe(false)
    expect(Math.max(...d.levelDbm)).toBe(Math.max(...levelDbm))
    expect(Math.min(...d.levelDbm)).toBe(Math.min(...levelDbm))
  })

  it('keeps the maximum of every stretch of the source the width of one bucket', () => {
    const buckets = 2048
    for (let b = 0; b < buckets; b += 97) {
      const from = Math.floor((b * n) / buckets)
      const to = Math.floor(((b + 1) * n) / buckets)
      let max = -Infinity
      for (let i = from; i < to; i++) max = Math.max(max, levelDbm[i])
      let keptMax = -Infinity
      d.freqHz.forEach((f, k) => {
        if (f >= freqHz[from] && f <= freqHz[to - 1]) keptMax = Math.max(keptMax, d.levelDbm[k])
      })
      expect(keptMax).toBe(max)
    }
  })

  it('passes a short trace through unchanged and refuses a bad maxPoints', () => {
    const short = decimateTrace({ freqHz: [1, 2, 3], levelDbm: [-1, -2, -3] })
    expect(short.decimated).toBe(false)
    expect(Array.from(short.levelDbm)).toEqual([-1, -2, -3])
    expect(() => decimateTrace({ freqHz, levelDbm, maxPoints: 1 })).toThrow(/maxPoints/)
  })
})
