import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { CONTINUITY_ROWS, POWER_DENSITY_ROWS, REFERENCE_LEVEL_ROWS } from '../../../fixtures/radio/exposure-checks'
import {
  exposureComplianceDistanceM,
  GROUND_REFLECTION_FACTOR,
  ICNIRP_2020_REFERENCE_LEVELS,
  icnirp2020ReferenceLevel,
  screenExposure,
  type ExposureAveraging,
  type ExposurePopulation,
} from '../../../../shared/radio/exposure'

type Pop = ExposurePopulation
type Avg = ExposureAveraging

describe('icnirp2020ReferenceLevel', () => {
  for (const row of REFERENCE_LEVEL_ROWS) {
    it(`${row.id}: gives ${row.expected} W/m² at ${row.inputs.freqHz} Hz (${row.source}, ${row.status})`, () => {
      const r = icnirp2020ReferenceLevel(row.inputs)
      expect(Math.abs(r.powerDensityWPerM2 / row.expected - 1)).toBeLessThanOrEqual(row.tolerance)
      expect(r.row.status).toBe(`[${row.status}]`)
    })
  }
  for (const row of CONTINUITY_ROWS) {
    it(`${row.id}: adjacent rows meet at the band edge within ${row.tolerance * 100} % (${row.source})`, () => {
      const { belowHz, aboveHz, population, averaging } = row.inputs
      const a = icnirp2020ReferenceLevel({ freqHz: belowHz, population, averaging })
      const b = icnirp2020ReferenceLevel({ freqHz: aboveHz, population, averaging })
      expect(a.row).not.toBe(b.row)
      expect(Math.abs(a.powerDensityWPerM2 / b.powerDensityWPerM2 - row.expected)).toBeLessThanOrEqual(row.tolerance)
    })
  }
  it('keeps the occupational level at five times the general-public level wherever both are power densities', () => {
    for (const freqHz of [50e6, 900e6, 1800e6, 2.4e9, 28e9]) {
      for (const averaging of ['whole-body-30min', 'local-6min'] as const) {
        const gp = icnirp2020ReferenceLevel({ freqHz, population: 'general-public', averaging })
        const oc = icnirp2020ReferenceLevel({ freqHz, population: 'occupational', averaging })
        expect(oc.powerDensityWPerM2 / gp.powerDensityWPerM2).toBeCloseTo(5, 1)
      }
    }
  })
  it('uses the plane-wave equivalent of the E level below 30 MHz and says so', () => {
    const r = icnirp2020ReferenceLevel({ freqHz: 10e6, population: 'general-public' })
    expect(r.basis).toBe('Einc plane-wave equivalent')
    expect(r.fieldStrengthVPerM).toBeCloseTo(300 / 10 ** 0.7, 9)
    expect(r.powerDensityWPerM2).toBeCloseTo(r.fieldStrengthVPerM! ** 2 / (120 * Math.PI), 12)
  })
  it('marks every whole-body row [M] except the two general-public rows confirmed in a secondary source', () => {
    const verified = ICNIRP_2020_REFERENCE_LEVELS.filter((r) => r.averaging === 'whole-body-30min' && r.status === '[V-S]')
    expect(verified.map((r) => r.formula)).toEqual(['Sinc = fM/200 W/m²', 'Sinc = 10 W/m²'])
    expect(verified.every((r) => r.population === 'general-public')).toBe(true)
  })
  it('throws a RangeError naming freqHz outside 100 kHz–300 GHz', () => {
    expect(() => icnirp2020ReferenceLevel({ freqHz: 50e3, population: 'general-public' })).toThrow(/freqHz/)
    expect(() => icnirp2020ReferenceLevel({ freqHz: 301e9, population: 'occupational' })).toThrow(/freqHz/)
  })
  it('throws a RangeError for an unknown population', () => {
    const population = 'visitors' as unknown as Pop
    expect(() => icnirp2020ReferenceLevel({ freqHz: 1e9, population })).toThrow(/population/)
  })
})

describe('screenExposure', () => {
  for (const row of POWER_DENSITY_ROWS) {
    it(`${row.id}: matches ${row.source} (${row.status})`, () => {
      const r = screenExposure(row.inputs).value
      const e = row.expected
      const tol = row.tolerance
      if (e.powerDensityWPerM2 !== undefined) expect(Math.abs(r.powerDensityWPerM2 - e.powerDensityWPerM2)).toBeLessThanOrEqual(tol.powerDensityWPerM2!)
      if (e.fractionOfLevel !== undefined) expect(Math.abs(r.fractionOfLevel - e.fractionOfLevel)).toBeLessThanOrEqual(tol.fractionOfLevel!)
      if (e.powerDensityDbwPerM2 !== undefined) expect(Math.abs(10 * Math.log10(r.powerDensityWPerM2) - e.powerDensityDbwPerM2)).toBeLessThanOrEqual(tol.powerDensityDbwPerM2!)
    })
  }
  it('multiplies the power density by 2.56 and the compliance distance by 1.6 with a ground reflection', () => {
    const base = { eirpW: 1000, distanceM: 10, freqHz: 900e6, population: 'general-public' as const }
    const a = screenExposure(base).value
    const b = screenExposure({ ...base, groundReflection: true })
    expect(b.value.powerDensityWPerM2 / a.powerDensityWPerM2).toBeCloseTo(GROUND_REFLECTION_FACTOR, 12)
    expect(b.value.complianceDistanceM / a.complianceDistanceM).toBeCloseTo(1.6, 12)
    expect(b.warnings.some((w) => /2\.56/.test(w))).toBe(true)
  })
  it('gives 1 kW EIRP at 900 MHz a general-public compliance distance of 4.21 m (√(P/(4π·4.5)), [D])', () => {
    const d = exposureComplianceDistanceM({ eirpW: 1000, freqHz: 900e6, population: 'general-public' }).value.complianceDistanceM
    expect(Math.abs(d - 4.21)).toBeLessThanOrEqual(0.005)
  })
  it('puts the power density exactly at the reference level at the compliance distance', () => {
    fc.assert(
      fc.property(
        fc.double({ min: -10, max: 90, noNaN: true }),
        fc.double({ min: 100e3, max: 300e9, noNaN: true }),
        fc.constantFrom<Pop>('general-public', 'occupational'),
        fc.constantFrom<Avg>('whole-body-30min', 'local-6min'),
        fc.boolean(),
        fc.double({ min: 0.01, max: 1, noNaN: true }),
        (eirpDbm, freqHz, population, averaging, groundReflection, dutyCycle) => {
          const src = { eirpDbm, freqHz, population, averaging, groundReflection, dutyCycle }
          const d = exposureComplianceDistanceM(src).value.complianceDistanceM
          expect(screenExposure({ ...src, distanceM: d }).value.fractionOfLevel).toBeCloseTo(1, 9)
        },
      ),
    )
  })
  it('scales the power density by the duty cycle', () => {
    const base = { eirpW: 100, distanceM: 5, freqHz: 2.4e9, population: 'general-public' as const }
    expect(screenExposure({ ...base, dutyCycle: 0.25 }).value.powerDensityWPerM2 / screenExposure(base).value.powerDensityWPerM2).toBeCloseTo(0.25, 12)
  })
  it('gives no caution at 19 % of the level, "approaching" above 20 % and a stronger caution above 100 %', () => {
    const sRef = 10 // W/m², general public at 2.4 GHz
    const at = (fraction: number) =>
      screenExposure({ eirpW: fraction * sRef * 4 * Math.PI, distanceM: 1, freqHz: 2.4e9, population: 'general-public' }).value
    expect(at(0.19).caution).toBe('none')
    expect(at(0.19).cautionText).toBeNull()
    const near = at(0.21)
    expect(near.caution).toBe('approaching')
    expect(near.cautionText).toMatch(/screening values/)
    expect(near.cautionText).toMatch(/local codes and licensed practice govern/)
    const over = at(1.01)
    expect(over.caution).toBe('above')
    expect(over.cautionText).toMatch(/Above the reference level/)
    expect(over.cautionText).toMatch(/local codes and licensed practice govern/)
  })
  it('always carries the screening notice in the result and its warnings', () => {
    const r = screenExposure({ eirpDbm: 20, distanceM: 3, freqHz: 2.4e9, population: 'general-public' })
    expect(r.value.notice).toMatch(/Screening values only/)
    expect(r.warnings).toContain(r.value.notice)
  })
  it('warns that the reference level is [M] where it is', () => {
    const r = screenExposure({ eirpDbm: 50, distanceM: 10, freqHz: 100e6, population: 'occupational' })
    expect(r.warnings.some((w) => /\[M\]/.test(w))).toBe(true)
  })
  it('warns about the near field and about E and H below 30 MHz', () => {
    const r = screenExposure({ eirpDbm: 50, distanceM: 10, freqHz: 7e6, population: 'general-public' })
    expect(r.warnings.some((w) => /wavelength/.test(w))).toBe(true)
    expect(r.warnings.some((w) => /E and H/.test(w))).toBe(true)
  })
  it('throws a RangeError naming distanceM for a zero distance', () => {
    expect(() => screenExposure({ eirpDbm: 30, distanceM: 0, freqHz: 1e9, population: 'general-public' })).toThrow(/distanceM/)
  })
  it('throws a RangeError naming dutyCycle above 1', () => {
    expect(() => screenExposure({ eirpDbm: 30, distanceM: 1, freqHz: 1e9, population: 'general-public', dutyCycle: 1.5 })).toThrow(/dutyCycle/)
  })
  it('throws a RangeError when both eirpDbm and eirpW are given', () => {
    expect(() => screenExposure({ eirpDbm: 30, eirpW: 1, distanceM: 1, freqHz: 1e9, population: 'general-public' })).toThrow(/eirp/)
  })
})
