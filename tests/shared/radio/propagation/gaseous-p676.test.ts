import { describe, expect, it } from 'vitest'
import { P676_VALIDATION_ATMOSPHERE, gaseousSpecificAttenuation } from '../../../../shared/radio/propagation/gaseous-p676'
import { OXYGEN_LINES, WATER_VAPOUR_LINES } from '../../../../shared/radio/propagation/p676-lines'
import { P676_GAMMA_ROWS } from '../../../fixtures/radio/propagation-p676'

describe('gaseousSpecificAttenuation', () => {
  it('reads the validation atmosphere as 1013.25 hPa, 288.15 K and 7.5 g/m³ (ITU-R P.676-13, register §4)', () => {
    expect(P676_VALIDATION_ATMOSPHERE).toEqual({ dryPressureHpa: 1013.25, temperatureK: 288.15, waterVapourDensityGPerM3: 7.5 })
  })

  for (const row of P676_GAMMA_ROWS) {
    it(`matches ${row.id} within ${row.tolerance} dB/km [${row.status}] (${row.source})`, () => {
      const r = gaseousSpecificAttenuation({ freqHz: row.inputs.freqGhz * 1e9, ...P676_VALIDATION_ATMOSPHERE })
      const value =
        row.inputs.part === 'oxygen' ? r.value.oxygenDbPerKm : row.inputs.part === 'waterVapour' ? r.value.waterVapourDbPerKm : r.value.totalDbPerKm
      expect(Math.abs(value - row.expected)).toBeLessThanOrEqual(row.tolerance)
      expect(r.warnings).toEqual([])
      expect(r.method.id).toBe('gaseous-p676-13')
    })
  }

  it('peaks at 61 GHz on the 1-GHz grid from 57 to 64 GHz (ITU-R P.676-13, register §4)', () => {
    const totals = [57, 58, 59, 60, 61, 62, 63, 64].map(
      (g) => gaseousSpecificAttenuation({ freqHz: g * 1e9, ...P676_VALIDATION_ATMOSPHERE }).value.totalDbPerKm,
    )
    expect(totals.indexOf(Math.max(...totals))).toBe(4)
  })

  it('holds the 44 oxygen and 35 water-vapour lines of P.676-13 Tables 1 and 2 (ITU-Rpy v13 files)', () => {
    expect(OXYGEN_LINES).toHaveLength(44)
    expect(WATER_VAPOUR_LINES).toHaveLength(35)
  })

  it('gives no water-vapour attenuation in dry air', () => {
    const r = gaseousSpecificAttenuation({ freqHz: 60e9, dryPressureHpa: 1013.25, temperatureK: 288.15, waterVapourDensityGPerM3: 0 })
    expect(r.value.waterVapourDbPerKm).toBe(0)
  })

  it.each([0.5e9, 1200e9])('warns outside 1–1000 GHz (%s Hz)', (freqHz) => {
    const r = gaseousSpecificAttenuation({ freqHz, ...P676_VALIDATION_ATMOSPHERE })
    expect(r.warnings.join(' ')).toMatch(/freqGhz .* outside the validity range 1–1000 GHz/)
  })

  it.each([
    ['freqHz', { freqHz: 0 }],
    ['freqHz', { freqHz: Number.NaN }],
    ['dryPressureHpa', { dryPressureHpa: -1 }],
    ['temperatureK', { temperatureK: 0 }],
    ['waterVapourDensityGPerM3', { waterVapourDensityGPerM3: -0.1 }],
  ])('throws a RangeError naming %s', (name, patch) => {
    const call = () => gaseousSpecificAttenuation({ freqHz: 60e9, ...P676_VALIDATION_ATMOSPHERE, ...patch })
    expect(call).toThrow(RangeError)
    expect(call).toThrow(new RegExp(name))
  })
})
