import { describe, expect, it } from 'vitest'
import { distanceContribution, eirpChangeFromDistanceErrorDb, eirpDistanceSensitivityDbPerM, eirpUncertaintyFromDistanceDb } from '../../../../shared/radio/uncertainty'
import { inlineFreeSpace, inlinePowerLaw } from '../estimation/inline-models'

// JCGM 100:2008 §5.1, register 12-2 [D]: u_d/d = 5 %, n = 2 / 3 / 3.5 / 4 → linearised 0.43 / 0.65 / 0.76 / 0.87 dB;
// exact 10·n·log10(1.05) = 0.42 / 0.64 / 0.74 / 0.85 dB; tolerance ±0.01 dB.
const ROWS = [
  { n: 2, linear: 0.43, exact: 0.42 },
  { n: 3, linear: 0.65, exact: 0.64 },
  { n: 3.5, linear: 0.76, exact: 0.74 },
  { n: 4, linear: 0.87, exact: 0.85 },
]

describe('EIRP sensitivity to distance', () => {
  for (const row of ROWS) {
    it(`gives ${row.linear} dB linearised and ${row.exact} dB exact for a 5 % distance error at n = ${row.n} (JCGM 100:2008 §5.1, register 12-2 [D], ±0.01 dB)`, () => {
      const model = inlinePowerLaw({ freqHz: 900e6, exponent: row.n })
      const distanceM = 250
      expect(Math.abs(eirpUncertaintyFromDistanceDb({ model, distanceM, distanceUncertaintyM: 0.05 * distanceM }) - row.linear)).toBeLessThanOrEqual(0.01)
      expect(Math.abs(eirpChangeFromDistanceErrorDb({ model, distanceM, distanceErrorM: 0.05 * distanceM }) - row.exact)).toBeLessThanOrEqual(0.01)
    })
  }

  it('is 8.686/d dB per m for free space (JCGM 100:2008 §5.1, register §12: 20/(d ln 10) [D])', () => {
    expect(eirpDistanceSensitivityDbPerM({ model: inlineFreeSpace(100e6), distanceM: 100 })).toBeCloseTo(0.08686, 5)
  })

  it('builds a budget row with the distance in metres and c_d in dB per metre', () => {
    const row = distanceContribution({ model: inlineFreeSpace(100e6), distanceM: 100, distance: { kind: 'standard', standardUncertainty: 5 } })
    expect(row.unit).toBe('m')
    expect(row.sensitivity! * 5).toBeCloseTo(0.4343, 4) // JCGM 100:2008 §5.1, register 12-2 linearised 0.43 dB at n = 2
  })

  it('rejects zero distance, a negative distance uncertainty and a step to a negative distance with a RangeError', () => {
    const model = inlineFreeSpace(100e6)
    expect(() => eirpDistanceSensitivityDbPerM({ model, distanceM: 0 })).toThrow(RangeError)
    expect(() => eirpUncertaintyFromDistanceDb({ model, distanceM: 10, distanceUncertaintyM: -1 })).toThrow(RangeError)
    expect(() => eirpChangeFromDistanceErrorDb({ model, distanceM: 10, distanceErrorM: -20 })).toThrow(RangeError)
  })
})
