import { describe, expect, it } from 'vitest'
import { WINDOW_KINDS, windowEnbwBins, windowEnbwBinsClosedForm, windowSamples, type WindowKind } from '../../../../shared/radio/spectrum'

import { WINDOW_SCIPY_ROWS } from '../../../fixtures/radio/spectrum-scipy'

describe('window ENBW computed from the window samples', () => {
  // Values stated in the brief and in Harris (1978) Table I; 2.0044 is the closed form of the
  // 4-term coefficients (Harris's table prints 2.00 [M]).
  const expected: [WindowKind, number, string][] = [
    ['hann', 1.5, 'Harris 1978 Table I: 1.50 bins [M]; closed form 1.5 [D]'],
    ['rectangular', 1.0, 'Harris 1978 Table I: 1.00 bins [M]; closed form 1 [D]'],
    ['blackman-harris', 2.0044, 'Harris 1978 4-term −92 dB: closed form 2.0044 bins [D], Table I rounds to 2.00 [M]'],
  ]
  for (const [kind, enbwBins, source] of expected) {
    it(`gives ${enbwBins} bins for ${kind} at N = 4096 within 1e-3 (${source})`, () => {
      expect(Math.abs(windowEnbwBins(windowSamples({ kind, length: 4096 })) - enbwBins)).toBeLessThan(1e-3)
    })
  }

  it('agrees with the 4-term Blackman-Harris value Harris tabulates (2.00 at two decimals) [M]', () => {
    expect(windowEnbwBins(windowSamples({ kind: 'blackman-harris', length: 4096 })).toFixed(2)).toBe('2.00')
  })

  for (const kind of WINDOW_KINDS) {
    it(`matches the closed form (a0² + ½Σa_k²)/a0² for ${kind} at N = 64 within 1e-12 [D]`, () => {
      expect(windowEnbwBins(windowSamples({ kind, length: 64 }))).toBeCloseTo(windowEnbwBinsClosedForm(kind), 12)
    })
  }
})

describe('window samples against scipy.signal.get_window (periodic)', () => {
  for (const row of WINDOW_SCIPY_ROWS) {
    const { window } = row.inputs
    it(`${row.id}: matches ${row.inputs.call}, N = 16, within ${row.tolerance} (${row.source})`, () => {
      const ours = windowSamples({ kind: window, length: 16 })
      expect(ours.length).toBe(16)
      for (let i = 0; i < 16; i++) expect(Math.abs(ours[i] - row.expected.samples16[i])).toBeLessThan(row.tolerance)
    })
    it(`${row.id}: matches the ENBW of scipy's ${window} window at N = 4096 within ${row.tolerance} (${row.source})`, () => {
      expect(Math.abs(windowEnbwBins(windowSamples({ kind: window, length: 4096 })) - row.expected.enbwBins4096)).toBeLessThan(row.tolerance)
    })
  }
})

describe('window input checks', () => {
  it('throws RangeError for an unknown window or a bad length', () => {
    expect(() => windowSamples({ kind: 'kaiser' as WindowKind, length: 8 })).toThrow(RangeError)
    expect(() => windowSamples({ kind: 'hann', length: 0 })).toThrow(RangeError)
    expect(() => windowSamples({ kind: 'hann', length: 2.5 })).toThrow(RangeError)
    expect(() => windowEnbwBins([])).toThrow(RangeError)
  })
})
