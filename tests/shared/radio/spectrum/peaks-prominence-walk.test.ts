import { describe, expect, it } from 'vitest'
import { localMaximaWithProminence } from '../../../../shared/radio/spectrum'
import { createUniformSource } from '../../../../shared/radio/uncertainty/prng'

/**
 * The definition of Eq. (1)–(3) in peaks.ts walked step by step for each peak (as
 * scipy.signal.peak_prominences describes it), to check the linear-time passes against.
 */
function walkedProminences(levelDb: number[]) {
  const n = levelDb.length
  const out: { index: number; prominenceDb: number; leftBaseIndex: number; rightBaseIndex: number }[] = []
  let i = 1
  while (i < n - 1) {
    if (levelDb[i - 1] < levelDb[i]) {
      let ahead = i + 1
      while (ahead < n - 1 && levelDb[ahead] === levelDb[i]) ahead++
      if (levelDb[ahead] < levelDb[i]) {
        const peak = (i + ahead - 1) >> 1
        const top = levelDb[peak]
        let leftBaseIndex = peak
        let leftMin = top
        for (let j = peak - 1; j >= 0 && levelDb[j] <= top; j--) {
          if (levelDb[j] < leftMin) {
            leftMin = levelDb[j]
            leftBaseIndex = j
          }
        }
        let rightBaseIndex = peak
        let rightMin = top
        for (let j = peak + 1; j < n && levelDb[j] <= top; j++) {
          if (levelDb[j] < rightMin) {
            rightMin = levelDb[j]
            rightBaseIndex = j
          }
        }
        out.push({ index: peak, prominenceDb: top - Math.max(leftMin, rightMin), leftBaseIndex, rightBaseIndex })
        i = ahead
        continue
      }
    }
    i++
  }
  return out
}

describe('localMaximaWithProminence (linear passes) against the step-by-step walk', () => {
  const uniform = createUniformSource(20261205)
  const traces: { name: string; levels: number[] }[] = []
  // coarse levels (whole dB from a small set) give plateaus and equally low bases on both sides
  for (let t = 0; t < 40; t++) traces.push({ name: `coarse ${t}`, levels: Array.from({ length: 50 + t * 7 }, () => Math.floor(uniform() * 6)) })
  // a sloping skirt with noise: many small maxima whose walks cross the slope
  traces.push({ name: 'skirt', levels: Array.from({ length: 5000 }, (_, k) => -40 - 0.01 * k + 1.5 * (uniform() - 0.5)) })
  traces.push({ name: 'monotone up', levels: Array.from({ length: 100 }, (_, k) => k) })
  traces.push({ name: 'constant', levels: Array.from({ length: 100 }, () => -90) })
  traces.push({ name: 'plateau at the end', levels: [0, 1, 2, 2, 2] })
  traces.push({ name: 'two points', levels: [1, 2] })
  for (const { name, levels } of traces) {
    it(`gives the same peaks, prominences and bases (${name})`, () => {
      expect(localMaximaWithProminence(levels)).toEqual(walkedProminences(levels))
    })
  }
  it('finds at least one peak in the coarse traces (the comparison is not vacuous)', () => {
    expect(traces.slice(0, 40).every((t) => walkedProminences(t.levels).length > 0)).toBe(true)
  })
})
