import { describe, expect, it } from 'vitest'
import { studentTCdf, studentTQuantile } from '../../../../shared/radio/uncertainty'

// Upper critical values of Student's t, NIST/SEMATECH e-Handbook of Statistical Methods
// §1.3.6.7.2 (table, α = 0.025 and 0.05 columns), three decimals [V-S]; register 12-T.
const TABLE_0975 = [
  [1, 12.706], [2, 4.303], [3, 3.182], [4, 2.776], [5, 2.571], [10, 2.228], [20, 2.086], [30, 2.042], [60, 2.0], [100, 1.984],
]
const TABLE_095 = [[1, 6.314], [10, 1.812], [30, 1.697]]

describe('studentTQuantile', () => {
  for (const [nu, t] of TABLE_0975) {
    it(`gives t(0.975, ${nu}) = ${t} (NIST e-Handbook §1.3.6.7.2 [V-S], register 12-T) within 0.0005`, () => {
      expect(Math.abs(studentTQuantile({ probability: 0.975, degreesOfFreedom: nu }) - t)).toBeLessThan(0.0005)
    })
  }
  for (const [nu, t] of TABLE_095) {
    it(`gives t(0.95, ${nu}) = ${t} (NIST e-Handbook §1.3.6.7.2 [V-S], register 12-T) within 0.0005`, () => {
      expect(Math.abs(studentTQuantile({ probability: 0.95, degreesOfFreedom: nu }) - t)).toBeLessThan(0.0005)
    })
  }
  it('is symmetric and inverts the CDF', () => {
    const t = studentTQuantile({ probability: 0.975, degreesOfFreedom: 7 })
    expect(studentTQuantile({ probability: 0.025, degreesOfFreedom: 7 })).toBeCloseTo(-t, 10)
    expect(studentTCdf({ t, degreesOfFreedom: 7 })).toBeCloseTo(0.975, 10)
  })
  it('rejects a probability outside [0, 1] or zero degrees of freedom with a RangeError', () => {
    expect(() => studentTQuantile({ probability: 1.2, degreesOfFreedom: 3 })).toThrow(RangeError)
    expect(() => studentTQuantile({ probability: 0.9, degreesOfFreedom: 0 })).toThrow(RangeError)
  })
})
