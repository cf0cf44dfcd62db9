import { describe, expect, it } from 'vitest'
import { eirpFromMeasurement } from '../../../../shared/radio/estimation'
import { createPropagationModel } from '../../../../shared/radio/propagation/registry'
import { eirpChangeFromDistanceErrorDb, eirpUncertaintyFromDistanceDb } from '../../../../shared/radio/uncertainty'

// The same checks as with the inline test models, now through the project's model registry.
describe('EIRP back-calculation with the registry models', () => {
  it('gives back 36.00 dBm from 100.77 dBµV/m at 100 m with the exact free-space model (ITU-R P.525-4, register 1-6 [D], ±0.01 dB)', () => {
    const model = createPropagationModel({ kind: 'free-space', freqHz: 2400e6 })
    const r = eirpFromMeasurement({ measurement: { kind: 'field-strength', fieldStrengthDbuvPerM: 100.77, freqHz: 2400e6 }, distanceM: 100, model })
    expect(Math.abs(r.value.eirpDbm - 36)).toBeLessThanOrEqual(0.01)
  })

  it('reads 0.05 dB lower EIRP with the P.525 rounded form (32.4 vs 32.4478, ITU-R P.525-4, register §1: tolerance ±0.05 dB)', () => {
    const model = createPropagationModel({ kind: 'free-space', freqHz: 2400e6, form: 'p525-rounded' })
    const r = eirpFromMeasurement({ measurement: { kind: 'field-strength', fieldStrengthDbuvPerM: 100.77, freqHz: 2400e6 }, distanceM: 100, model })
    expect(Math.abs(r.value.eirpDbm - 36)).toBeLessThanOrEqual(0.06)
  })

  for (const [n, linear, exact] of [[2, 0.43, 0.42], [3, 0.65, 0.64], [3.5, 0.76, 0.74], [4, 0.87, 0.85]]) {
    it(`gives ${linear} dB linearised and ${exact} dB exact for 5 % distance error with the log-distance model, n = ${n} (JCGM 100:2008 §5.1, register 12-2 [D])`, () => {
      const model = createPropagationModel({ kind: 'log-distance', freqHz: 900e6, refDistanceM: 1, exponent: n })
      expect(Math.abs(eirpUncertaintyFromDistanceDb({ model, distanceM: 400, distanceUncertaintyM: 20 }) - linear)).toBeLessThanOrEqual(0.01)
      expect(Math.abs(eirpChangeFromDistanceErrorDb({ model, distanceM: 400, distanceErrorM: 20 }) - exact)).toBeLessThanOrEqual(0.01)
    })
  }

  it('carries the log-distance shadowing σ into the EIRP budget', () => {
    const model = createPropagationModel({ kind: 'log-distance', freqHz: 900e6, refDistanceM: 1, exponent: 3, shadowSigmaDb: 6 })
    const r = eirpFromMeasurement({ measurement: { kind: 'isotropic-power', receivedPowerDbm: -80 }, distanceM: 300, model, measurementContributions: [{ name: 'receiver', distribution: { kind: 'standard', standardUncertainty: 1 } }] })
    expect(r.value.expandedUncertaintyDb!).toBeCloseTo(2 * Math.sqrt(36 + 1), 9)
  })
})
