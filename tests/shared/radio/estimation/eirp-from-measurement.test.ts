import { describe, expect, it } from 'vitest'
import { fieldToReceivedPowerDbm, pfdToReceivedPowerDbm, receivedPowerToFieldDbuvPerM } from '../../../../shared/radio/chain'
import { eirpFromMeasurement, predictMeasurementFromEirp } from '../../../../shared/radio/estimation'
import { inlineFreeSpace, inlinePowerLaw } from './inline-models'

describe('isotropic received power from a field', () => {
  it('gives −57.22 dBm for 60 dBµV/m at 100 MHz, 0 dBi (ITU-R P.525-4, register 1-9 [D], ±0.01 dB)', () => {
    expect(Math.abs(fieldToReceivedPowerDbm({ fieldStrengthDbuvPerM: 60, freqHz: 100e6 }) - -57.22)).toBeLessThanOrEqual(0.01)
  })
  it('gives −58.82 dBm with 6 dBi for 80 dBµV/m at 2400 MHz, i.e. −64.82 dBm isotropic (ITU-R P.525-4, register 1-10 [D], ±0.01 dB)', () => {
    expect(Math.abs(fieldToReceivedPowerDbm({ fieldStrengthDbuvPerM: 80, freqHz: 2400e6 }) + 6 - -58.82)).toBeLessThanOrEqual(0.01)
  })
  it('gives the same power from the pfd −85.76 dBW/m² that 60 dBµV/m carries (ITU-R P.525-4, register 1-8 and 1-9 [D], ±0.01 dB)', () => {
    expect(Math.abs(pfdToReceivedPowerDbm({ pfdDbwPerM2: -85.76, freqHz: 100e6 }) - -57.22)).toBeLessThanOrEqual(0.01)
  })
  it('returns the field from the power (round trip, ITU-R P.525-4, register 1-9)', () => {
    expect(receivedPowerToFieldDbuvPerM({ receivedPowerDbm: -57.22, freqHz: 100e6 })).toBeCloseTo(60, 2)
  })
})

describe('eirpFromMeasurement', () => {
  for (const freqHz of [100e6, 2400e6]) {
    it(`gives back 36.00 dBm from 100.77 dBµV/m at 100 m in free space at ${freqHz / 1e6} MHz (ITU-R P.525-4, register 1-6 [D], ±0.01 dB)`, () => {
      const r = eirpFromMeasurement({ measurement: { kind: 'field-strength', fieldStrengthDbuvPerM: 100.77, freqHz }, distanceM: 100, model: inlineFreeSpace(freqHz) })
      expect(Math.abs(r.value.eirpDbm - 36)).toBeLessThanOrEqual(0.01)
    })
    it(`gives back 36.00 dBm from −44.99 dBW/m² at 100 m in free space at ${freqHz / 1e6} MHz (ITU-R P.525-4, register 1-6 [D], ±0.01 dB)`, () => {
      const r = eirpFromMeasurement({ measurement: { kind: 'pfd', pfdDbwPerM2: -44.99, freqHz }, distanceM: 100, model: inlineFreeSpace(freqHz) })
      expect(Math.abs(r.value.eirpDbm - 36)).toBeLessThanOrEqual(0.01)
    })
  }

  it('adds the free-space loss 72.45 dB at 1 km, 100 MHz (ITU-R P.525-4, register 1-1) to −57.22 dBm (ITU-R P.525-4, register 1-9): EIRP 15.23 dBm ±0.02 dB', () => {
    const r = eirpFromMeasurement({ measurement: { kind: 'field-strength', fieldStrengthDbuvPerM: 60, freqHz: 100e6 }, distanceM: 1000, model: inlineFreeSpace(100e6) })
    expect(Math.abs(r.value.pathLossDb - 72.45)).toBeLessThanOrEqual(0.01)
    expect(Math.abs(r.value.eirpDbm - 15.23)).toBeLessThanOrEqual(0.02)
  })

  it('gives EIRP 20 dBm (100 mW) and ERP 17.85 dBm (60.95 mW) from 84.77 dBµV/m at 100 m (ITU-R P.525-4, register 11-6 and 3-2 [D], ±0.01 dB)', () => {
    const r = eirpFromMeasurement({ measurement: { kind: 'field-strength', fieldStrengthDbuvPerM: 84.77, freqHz: 2400e6 }, distanceM: 100, model: inlineFreeSpace(2400e6) })
    expect(Math.abs(r.value.eirpDbm - 20)).toBeLessThanOrEqual(0.01)
    expect(Math.abs(r.value.eirpW - 0.1)).toBeLessThan(0.0003)
    expect(Math.abs(r.value.erpDbm - 17.85)).toBeLessThanOrEqual(0.01)
    expect(Math.abs(r.value.erpW * 1000 - 60.95)).toBeLessThan(0.15)
    expect(r.method.id).toBe('eirp-back-calculation')
    expect(r.value.modelMethod.id).toBe('test-free-space')
  })

  it('takes an isotropic received power directly: EIRP = P_r + L (ITU-R P.525-4, register §1 "EIRP from received power" [D])', () => {
    const r = eirpFromMeasurement({ measurement: { kind: 'isotropic-power', receivedPowerDbm: -44.05 }, distanceM: 100, model: inlineFreeSpace(2400e6) })
    expect(Math.abs(r.value.eirpDbm - (-44.05 + 80.05))).toBeLessThanOrEqual(0.01) // ITU-R P.525-4, register 1-3: 80.05 dB at 2400 MHz, 100 m
  })

  it('takes the power of an antenna of known gain: −58.82 dBm with 6 dBi (ITU-R P.525-4, register 1-10) plus 80.05 dB (ITU-R P.525-4, register 1-3) gives 15.23 dBm ±0.02 dB', () => {
    const r = eirpFromMeasurement({ measurement: { kind: 'received-power', receivedPowerDbm: -58.82, antennaGainDbi: 6 }, distanceM: 100, model: inlineFreeSpace(2400e6) })
    expect(Math.abs(r.value.isotropicReceivedPowerDbm - -64.82)).toBeLessThanOrEqual(0.01)
    expect(Math.abs(r.value.eirpDbm - 15.23)).toBeLessThanOrEqual(0.02)
    const viaField = eirpFromMeasurement({ measurement: { kind: 'field-strength', fieldStrengthDbuvPerM: 80, freqHz: 2400e6 }, distanceM: 100, model: inlineFreeSpace(2400e6) })
    expect(Math.abs(r.value.eirpDbm - viaField.value.eirpDbm)).toBeLessThanOrEqual(0.01)
    expect(() => eirpFromMeasurement({ measurement: { kind: 'received-power', receivedPowerDbm: -60, antennaGainDbi: Number.NaN }, distanceM: 100, model: inlineFreeSpace(2400e6) })).toThrow(/antennaGainDbi/)
  })

  it('puts a 5 % distance uncertainty into the budget as 0.43 dB (JCGM 100:2008 §5.1, register 12-2 [D]) and combines by root sum of squares', () => {
    const r = eirpFromMeasurement({
      measurement: { kind: 'field-strength', fieldStrengthDbuvPerM: 100.77, freqHz: 100e6 },
      distanceM: 100,
      model: inlineFreeSpace(100e6),
      measurementContributions: [
        { name: 'antenna factor', distribution: { kind: 'normal', expandedUncertainty: 1.0, coverageFactor: 2 } },
        { name: 'mismatch', distribution: { kind: 'u-shaped', halfWidth: 0.3 } },
      ],
      distanceUncertainty: { kind: 'standard', standardUncertainty: 5 },
    })
    const rows = r.value.budget!.rows
    expect(Math.abs(rows.find((x) => x.name === 'distance')!.contribution - 0.43)).toBeLessThanOrEqual(0.01)
    const expectedUc = Math.sqrt(0.5 ** 2 + (0.3 / Math.SQRT2) ** 2 + (20 / (100 * Math.LN10) * 5) ** 2) // GUM eq. (10) by hand [D]
    expect(r.value.expandedUncertaintyDb!).toBeCloseTo(2 * expectedUc, 10)
    expect(r.interval!.quantity).toBe('eirpDbm')
    expect(r.interval!.low).toBeCloseTo(r.value.eirpDbm - 2 * expectedUc, 10)
    expect(r.interval!.high).toBeCloseTo(r.value.eirpDbm + 2 * expectedUc, 10)
    expect(r.value.eirpIntervalDbm).toEqual({ lowDbm: r.interval!.low, highDbm: r.interval!.high })
  })

  it('adds the model shadowing σ as a normal contribution (8 dB → U ≥ 16 dB at k = 2)', () => {
    const r = eirpFromMeasurement({
      measurement: { kind: 'isotropic-power', receivedPowerDbm: -70 },
      distanceM: 500,
      model: inlinePowerLaw({ freqHz: 900e6, exponent: 3.5, shadowSigmaDb: 8 }),
      measurementContributions: [{ name: 'receiver', distribution: { kind: 'standard', standardUncertainty: 1 } }],
    })
    const row = r.value.budget!.rows.find((x) => x.name.startsWith('model'))!
    expect(row.distribution).toBe('normal')
    expect(row.standardUncertainty).toBe(8)
    expect(r.value.expandedUncertaintyDb!).toBeCloseTo(2 * Math.sqrt(64 + 1), 10)
    expect(r.warnings.some((w) => w.includes('No measurement uncertainty'))).toBe(false)
  })

  it('warns and gives no interval when no uncertainty is stated', () => {
    const r = eirpFromMeasurement({ measurement: { kind: 'isotropic-power', receivedPowerDbm: -60 }, distanceM: 100, model: inlineFreeSpace(100e6) })
    expect(r.interval).toBeUndefined()
    expect(r.value.budget).toBeUndefined()
    expect(r.warnings.join(' ')).toMatch(/No uncertainty/)
  })

  it('warns when the measurement frequency differs from the model frequency and when the distance is under 10 wavelengths', () => {
    const r = eirpFromMeasurement({ measurement: { kind: 'field-strength', fieldStrengthDbuvPerM: 90, freqHz: 150e6 }, distanceM: 5, model: inlineFreeSpace(100e6) })
    expect(r.warnings.join(' ')).toMatch(/differs from the model/)
    expect(r.warnings.join(' ')).toMatch(/distanceInWavelengths/)
  })

  it('rejects zero distance, NaN field, zero frequency and a missing model with a RangeError', () => {
    const model = inlineFreeSpace(100e6)
    expect(() => eirpFromMeasurement({ measurement: { kind: 'isotropic-power', receivedPowerDbm: -60 }, distanceM: 0, model })).toThrow(RangeError)
    expect(() => eirpFromMeasurement({ measurement: { kind: 'field-strength', fieldStrengthDbuvPerM: Number.NaN, freqHz: 100e6 }, distanceM: 10, model })).toThrow(RangeError)
    expect(() => eirpFromMeasurement({ measurement: { kind: 'field-strength', fieldStrengthDbuvPerM: 60, freqHz: 0 }, distanceM: 10, model })).toThrow(RangeError)
    expect(() => eirpFromMeasurement({ measurement: { kind: 'isotropic-power', receivedPowerDbm: -60 }, distanceM: 10, model: undefined as never })).toThrow(RangeError)
  })
})

describe('predictMeasurementFromEirp (forward direction)', () => {
  it('gives 100.77 dBµV/m and −44.99 dBW/m² for 36 dBm EIRP at 100 m in free space (ITU-R P.525-4, register 1-6 [D], ±0.01 dB)', () => {
    const r = predictMeasurementFromEirp({ eirpDbm: 36, distanceM: 100, model: inlineFreeSpace(2400e6), freqHz: 2400e6 })
    expect(Math.abs(r.value.fieldStrengthDbuvPerM! - 100.77)).toBeLessThanOrEqual(0.01)
    expect(Math.abs(r.value.pfdDbwPerM2! - -44.99)).toBeLessThanOrEqual(0.01)
  })
  it('gives 74.77 dBµV/m for 1 W EIRP at 1 km (ITU-R P.525-4, register 1-5 [D], ±0.01 dB)', () => {
    const r = predictMeasurementFromEirp({ eirpDbm: 30, distanceM: 1000, model: inlineFreeSpace(900e6), freqHz: 900e6 })
    expect(Math.abs(r.value.fieldStrengthDbuvPerM! - 74.77)).toBeLessThanOrEqual(0.01)
  })
  it('round-trips with eirpFromMeasurement through any model', () => {
    const model = inlinePowerLaw({ freqHz: 900e6, exponent: 3.2 })
    const fwd = predictMeasurementFromEirp({ eirpDbm: 41.3, distanceM: 750, model, freqHz: 900e6 })
    const back = eirpFromMeasurement({ measurement: { kind: 'field-strength', fieldStrengthDbuvPerM: fwd.value.fieldStrengthDbuvPerM!, freqHz: 900e6 }, distanceM: 750, model })
    expect(back.value.eirpDbm).toBeCloseTo(41.3, 9)
  })
})
