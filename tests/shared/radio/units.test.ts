import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { DBM_TO_DBUV_ROWS, DBUV_TO_DBM_ROWS, DENSITY_TO_POWER_ROWS, FIELD_TO_PFD_ROWS } from '../../fixtures/radio/units-checks'
import {
  dbmToDbuv,
  dbmToWatts,
  dbuvPerMToVPerM,
  dbuvToDbm,
  densityToPowerDbm,
  eirpToErpDb,
  erpToEirpDb,
  fieldToPfdDbwPerM2,
  pfdToFieldDbuvPerM,
  powerToDensityDbmPerHz,
  sumPowersDbm,
  vPerMToDbuvPerM,
  vPerMToWPerM2,
  wattsToDbm,
  wPerM2ToVPerM,
} from '../../../shared/radio/units'

const level = fc.double({ min: -250, max: 250, noNaN: true })

describe('units: published check values', () => {
  for (const row of DBM_TO_DBUV_ROWS) {
    it(`${row.id}: ${row.inputs.powerDbm} dBm is ${row.expected.voltageDbuv} dBµV at 50 Ω within ${row.tolerance} dB (${row.source}, ${row.status})`, () => {
      expect(Math.abs(dbmToDbuv({ powerDbm: row.inputs.powerDbm }) - row.expected.voltageDbuv)).toBeLessThanOrEqual(row.tolerance)
    })
  }
  for (const row of DBUV_TO_DBM_ROWS) {
    it(`${row.id}: ${row.inputs.voltageDbuv} dBµV is ${row.expected.powerDbm} dBm at 50 Ω within ${row.tolerance} dB (${row.source}, ${row.status})`, () => {
      expect(Math.abs(dbuvToDbm({ voltageDbuv: row.inputs.voltageDbuv }) - row.expected.powerDbm)).toBeLessThanOrEqual(row.tolerance)
    })
  }
  for (const row of FIELD_TO_PFD_ROWS) {
    it(`${row.id}: ${row.inputs.fieldStrengthDbuvPerM} dBµV/m is ${row.expected.pfdDbwPerM2} dBW/m² within ${row.tolerance} dB (${row.source}, ${row.status})`, () => {
      expect(Math.abs(fieldToPfdDbwPerM2(row.inputs.fieldStrengthDbuvPerM) - row.expected.pfdDbwPerM2)).toBeLessThanOrEqual(row.tolerance)
    })
  }
  for (const row of DENSITY_TO_POWER_ROWS) {
    it(`${row.id}: ${row.inputs.densityDbmPerHz} dBm/Hz over ${row.inputs.bandwidthHz} Hz is ${row.expected.powerDbm} dBm (${row.source}, ${row.status})`, () => {
      expect(Math.abs(densityToPowerDbm(row.inputs) - row.expected.powerDbm)).toBeLessThanOrEqual(row.tolerance)
    })
  }
})

describe('units: round trips', () => {
  it('dBm → dBµV → dBm returns the level for any impedance', () => {
    fc.assert(
      fc.property(level, fc.double({ min: 1, max: 1000, noNaN: true }), (powerDbm, impedanceOhm) => {
        const back = dbuvToDbm({ voltageDbuv: dbmToDbuv({ powerDbm, impedanceOhm }), impedanceOhm })
        expect(back).toBeCloseTo(powerDbm, 9)
      }),
    )
  })
  it('field → pfd → field returns the field', () => {
    fc.assert(
      fc.property(level, (e) => {
        expect(pfdToFieldDbuvPerM(fieldToPfdDbwPerM2(e))).toBeCloseTo(e, 9)
      }),
    )
  })
  it('V/m → dBµV/m → V/m returns the field', () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-9, max: 1e4, noNaN: true }), (v) => {
        expect(dbuvPerMToVPerM(vPerMToDbuvPerM(v)) / v).toBeCloseTo(1, 12)
      }),
    )
  })
  it('V/m → W/m² → V/m returns the field, and agrees with the dB form of S = E²/Z0', () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-6, max: 1e4, noNaN: true }), (v) => {
        expect(wPerM2ToVPerM(vPerMToWPerM2(v)) / v).toBeCloseTo(1, 12)
        expect(10 * Math.log10(vPerMToWPerM2(v))).toBeCloseTo(fieldToPfdDbwPerM2(vPerMToDbuvPerM(v)), 9)
      }),
    )
  })
  it('W → dBm → W returns the power', () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-15, max: 1e9, noNaN: true }), (w) => {
        expect(dbmToWatts(wattsToDbm(w)) / w).toBeCloseTo(1, 12)
      }),
    )
  })
  it('ERP → EIRP → ERP returns the level', () => {
    fc.assert(
      fc.property(level, (erp) => {
        expect(eirpToErpDb(erpToEirpDb(erp))).toBeCloseTo(erp, 12)
      }),
    )
  })
  it('density → power → density returns the density', () => {
    fc.assert(
      fc.property(level, fc.double({ min: 1, max: 1e10, noNaN: true }), (d, b) => {
        expect(powerToDensityDbmPerHz({ powerDbm: densityToPowerDbm({ densityDbmPerHz: d, bandwidthHz: b }), bandwidthHz: b })).toBeCloseTo(d, 9)
      }),
    )
  })
})

describe('units: power sums and bad input', () => {
  it('adds two equal powers to 3.01 dB more (10 log 2, exact identity)', () => {
    expect(sumPowersDbm([-50, -50])).toBeCloseTo(-50 + 10 * Math.log10(2), 12)
  })
  it('throws a RangeError naming levelsDbm for an empty list', () => {
    expect(() => sumPowersDbm([])).toThrow(/levelsDbm/)
  })
  it('throws a RangeError naming impedanceOhm for a zero impedance', () => {
    expect(() => dbmToDbuv({ powerDbm: 0, impedanceOhm: 0 })).toThrow(RangeError)
    expect(() => dbmToDbuv({ powerDbm: 0, impedanceOhm: 0 })).toThrow(/impedanceOhm/)
  })
  it('throws a RangeError naming fieldStrengthDbuvPerM for NaN', () => {
    expect(() => fieldToPfdDbwPerM2(Number.NaN)).toThrow(/fieldStrengthDbuvPerM/)
  })
})
