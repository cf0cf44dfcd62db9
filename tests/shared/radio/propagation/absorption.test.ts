import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import {
  absorbingDistanceM,
  absorbingLossDb,
  absorptionLossDb,
  resolveAbsorptionDbPerKm,
  specificAttenuationFromFieldCoefficientDbPerKm,
} from '../../../../shared/radio/propagation/absorption'
import { P676_VALIDATION_ATMOSPHERE, gaseousSpecificAttenuation } from '../../../../shared/radio/propagation/gaseous-p676'
import { createPropagationModel } from '../../../../shared/radio/propagation/registry'
import { ABSORPTION_PATH_ROWS, FIELD_COEFFICIENT_ROWS } from '../../../fixtures/radio/propagation-absorption'

describe('specificAttenuationFromFieldCoefficientDbPerKm', () => {
  for (const row of FIELD_COEFFICIENT_ROWS) {
    it(`matches ${row.id} within ${row.tolerance} dB/km [${row.status}] (${row.source})`, () => {
      expect(Math.abs(specificAttenuationFromFieldCoefficientDbPerKm(row.inputs) - row.expected)).toBeLessThanOrEqual(row.tolerance)
    })
  }

  it('throws a RangeError naming fieldAttenuationPerKm for a negative coefficient', () => {
    expect(() => specificAttenuationFromFieldCoefficientDbPerKm({ fieldAttenuationPerKm: -1 })).toThrow(/fieldAttenuationPerKm/)
  })
})

describe('absorptionLossDb', () => {
  for (const row of ABSORPTION_PATH_ROWS) {
    it(`matches ${row.id} within ${row.tolerance} dB [${row.status}] (${row.source})`, () => {
      const gamma = gaseousSpecificAttenuation({ freqHz: row.inputs.freqHz, ...P676_VALIDATION_ATMOSPHERE }).value.totalDbPerKm
      expect(Math.abs(absorptionLossDb({ absorptionDbPerKm: gamma, distanceM: row.inputs.distanceM }) - row.expected)).toBeLessThanOrEqual(
        row.tolerance,
      )
    })
  }

  it.each([0, -1, Number.NaN])('throws a RangeError naming distanceM for distance %s', (distanceM) => {
    expect(() => absorptionLossDb({ absorptionDbPerKm: 10, distanceM })).toThrow(/distanceM/)
  })
})

describe('resolveAbsorptionDbPerKm', () => {
  it('warns that a field coefficient doubles to a power coefficient (ITU-R P.676-13, register §4 discrepancy)', () => {
    const r = resolveAbsorptionDbPerKm({ fieldAttenuationPerKm: 1.3 })
    expect(Math.abs(r.absorptionDbPerKm - 11.29)).toBeLessThanOrEqual(0.01)
    expect(r.warnings.join(' ')).toMatch(/power coefficient/)
  })

  it('takes a specific attenuation as given, without warning', () => {
    expect(resolveAbsorptionDbPerKm({ absorptionDbPerKm: 14.78 })).toEqual({ absorptionDbPerKm: 14.78, warnings: [] })
  })

  it('throws a RangeError when both or neither are given, or the attenuation is negative', () => {
    expect(() => resolveAbsorptionDbPerKm({})).toThrow(RangeError)
    expect(() => resolveAbsorptionDbPerKm({ absorptionDbPerKm: 1, fieldAttenuationPerKm: 1 })).toThrow(RangeError)
    expect(() => resolveAbsorptionDbPerKm({ absorptionDbPerKm: -2 })).toThrow(/absorptionDbPerKm/)
  })
})

describe('absorbing model (base plus γ·d)', () => {
  const base = createPropagationModel({ kind: 'free-space', freqHz: 60e9 })
  const gamma60 = gaseousSpecificAttenuation({ freqHz: 60e9, ...P676_VALIDATION_ATMOSPHERE }).value.totalDbPerKm

  it('adds 1.48 dB to free space over 100 m at 60 GHz (ITU-R P.676-13, register 4-1 [D] from [V-P] γ)', () => {
    const total = absorbingLossDb({ base, absorptionDbPerKm: gamma60, distanceM: 100 }).value.lossDb
    expect(Math.abs(total - base.lossDb(100).value.lossDb - 1.48)).toBeLessThanOrEqual(0.01)
  })

  it('round-trips with its inverse within 1e-9 relative, over free space and Hata bases', () => {
    const hata = createPropagationModel({ kind: 'hata', freqHz: 900e6, txHeightM: 30, rxHeightM: 1.5, environment: 'suburban' })
    fc.assert(
      fc.property(
        fc.double({ min: 1, max: 5e4, noNaN: true }),
        fc.double({ min: 0, max: 30, noNaN: true }),
        fc.constantFrom(base, hata),
        (distanceM, absorptionDbPerKm, b) => {
          const { value: { lossDb } } = absorbingLossDb({ base: b, absorptionDbPerKm, distanceM })
          const back = absorbingDistanceM({ base: b, absorptionDbPerKm, lossDb }).value.distanceM
          expect(Math.abs(back - distanceM) / distanceM).toBeLessThan(1e-9)
        },
      ),
    )
  })

  it('grows with distance', () => {
    fc.assert(
      fc.property(fc.double({ min: 1, max: 1e4, noNaN: true }), fc.double({ min: 1.001, max: 10, noNaN: true }), (d, k) => {
        const at = (distanceM: number) => absorbingLossDb({ base, absorptionDbPerKm: gamma60, distanceM }).value.lossDb
        expect(at(d * k)).toBeGreaterThan(at(d))
      }),
    )
  })

  it('names a method derived from the base method', () => {
    expect(absorbingLossDb({ base, absorptionDbPerKm: 1, distanceM: 10 }).method.id).toBe('free-space-p525+absorption')
  })
})
