/**
 * The registry of calculation kinds and the typed inputs they share: one definition per kind,
 * units through the typed quantities (normalised to the base unit in the key, stored values read
 * again to the same number), and every model of the library offered, checked against the
 * register's published values through a calculation.
 */
import { describe, expect, it } from 'vitest'
import { CALCULATION_KIND_DEFS, CALCULATION_KIND_LABELS, CALCULATION_KINDS, eirpSinglePointOutputSchema, newCalculationSchema } from '../../../shared/calculations'
import { propagationModelSpec } from '../../../shared/calculations/inputs'
import { PROPAGATION_MODEL_DESCRIPTORS } from '../../../shared/radio'
import { ABSORPTION_PATH_ROWS } from '../../fixtures/radio/propagation-absorption'
import { COST231_ROWS } from '../../fixtures/radio/propagation-hata'
import { TR38901_WORKED_ROWS } from '../../fixtures/radio/propagation-tr38901'
import { refusals, run } from './support'

describe('the calculation-kind registry', () => {
  it('has one definition, one label and one request schema for every kind', () => {
    expect(Object.keys(CALCULATION_KIND_DEFS).sort()).toEqual([...CALCULATION_KINDS].sort())
    for (const k of CALCULATION_KINDS) {
      expect(CALCULATION_KIND_DEFS[k].kind).toBe(k)
      expect(CALCULATION_KIND_LABELS[k].length).toBeGreaterThan(5)
      expect(newCalculationSchema.safeParse({ kind: k, inputs: {} }).success).toBe(false)
    }
  })

  it('refuses outputs or any other key sent beside the inputs', () => {
    const r = newCalculationSchema.safeParse({ kind: 'coexistence', inputs: {}, outputs: { value: 1 } })
    expect(r.success).toBe(false)
  })
})

describe('typed inputs', () => {
  const single = (model: unknown, extra: object = {}) => ({ measurement: { kind: 'isotropic-power', receivedPowerDbm: '-60 dBm' }, distanceM: '10 m', model, ...extra })

  it('reads powers in W, mW and dBW as dBm (dBm re 1 mW, dBW re 1 W: definitions of the units), and stores base-unit numbers that read again the same', () => {
    const parse = (p: string) => newCalculationSchema.parse({ kind: 'compliance_verdict', inputs: { eirpDbm: p, limit: { source: 'stated', spec: { kind: 'eirp', eirpDbm: 30 }, citation: 'x' } } })
    const w = parse('2 W').inputs as { eirpDbm: number }
    expect(w.eirpDbm).toBeCloseTo(33.0103, 4) // 10·log10(2000 mW)
    expect((parse('500 mW').inputs as { eirpDbm: number }).eirpDbm).toBeCloseTo(26.9897, 4)
    expect((parse('3 dBW').inputs as { eirpDbm: number }).eirpDbm).toBe(33)
    // the stored number reads again to itself (a bare number is in the base unit of its key)
    expect((parse(String(w.eirpDbm)).inputs as { eirpDbm: number }).eirpDbm).toBe(w.eirpDbm)
  })

  it('reads frequencies from Hz to GHz, distances in km and fields in V/m (1 V/m = 120 dBµV/m by definition)', () => {
    const i = newCalculationSchema.parse({ kind: 'eirp_single_point', inputs: { measurement: { kind: 'field-strength', fieldStrengthDbuvPerM: '1 V/m', freqHz: '0.4 GHz' }, distanceM: '1.2 km', model: { kind: 'free-space', freqHz: '400000 kHz' } } }).inputs as {
      measurement: { fieldStrengthDbuvPerM: number; freqHz: number }
      distanceM: number
      model: { freqHz: number }
    }
    expect(i.measurement).toEqual({ kind: 'field-strength', fieldStrengthDbuvPerM: 120, freqHz: 4e8 })
    expect(i.distanceM).toBe(1200)
    expect(i.model.freqHz).toBe(4e8)
  })

  it('refuses a unit of the wrong quantity and a negative power in W, each with a message', () => {
    expect(refusals('compliance_verdict', { eirpDbm: '3 MHz', limit: { source: 'stated', spec: { kind: 'eirp', eirpDbm: 30 }, citation: 'x' } })[0]).toMatch(/Use one of these units for the estimated EIRP: dBm, dBW, W, mW/)
    expect(refusals('compliance_verdict', { eirpDbm: '-2 W', limit: { source: 'stated', spec: { kind: 'eirp', eirpDbm: 30 }, citation: 'x' } })[0]).toMatch(/above zero/)
  })

  it('offers every model the library describes', () => {
    const offered = propagationModelSpec.options.map((o) => o.shape.kind.value).sort()
    expect(offered).toEqual(PROPAGATION_MODEL_DESCRIPTORS.map((d) => d.kind).sort())
  })

  const row74 = COST231_ROWS.find((r) => r.id === '7-4 C_m 3')!
  it(`takes COST-231 Hata with a numeric C_m: ${row74.id} ${row74.expected} dB (${row74.source})`, () => {
    const { txHeightM, rxHeightM, distanceM, freqHz } = row74.inputs
    const v = eirpSinglePointOutputSchema.parse(run('eirp_single_point', single({ kind: 'cost231-hata', freqHz, txHeightM, rxHeightM, cityCorrectionDb: '3 dB' }, { distanceM })).outputs.value)
    expect(Math.abs(v.pathLossDb - row74.expected)).toBeLessThanOrEqual(row74.tolerance)
  })

  const inh = TR38901_WORKED_ROWS.find((r) => r.id === '8-4 InH NLOS d3D 50 m')!
  it(`takes TR 38.901 InH on the 3D distance: ${inh.id} ${inh.expected} dB (${inh.source})`, () => {
    const { distanceM, ...m } = inh.inputs
    const v = eirpSinglePointOutputSchema.parse(run('eirp_single_point', single({ kind: 'tr38901', ...m }, { distanceM })).outputs.value)
    expect(Math.abs(v.pathLossDb - inh.expected)).toBeLessThanOrEqual(inh.tolerance)
  })

  const abs = ABSORPTION_PATH_ROWS[0]!
  it(`takes an absorbing model: free space plus 14.78 dB/km over 100 m adds ${abs.expected} dB (${abs.source})`, () => {
    const base = { kind: 'free-space', freqHz: abs.inputs.freqHz }
    const plain = eirpSinglePointOutputSchema.parse(run('eirp_single_point', single(base, { distanceM: abs.inputs.distanceM })).outputs.value)
    const absorbing = eirpSinglePointOutputSchema.parse(run('eirp_single_point', single({ kind: 'absorbing', base, absorptionDbPerKm: '14.78 dB/km' }, { distanceM: abs.inputs.distanceM })).outputs.value)
    expect(Math.abs(absorbing.pathLossDb - plain.pathLossDb - abs.expected)).toBeLessThanOrEqual(abs.tolerance)
  })

  it('refuses an absorbing model with neither attenuation, in the library’s words', () => {
    expect(() => run('eirp_single_point', single({ kind: 'absorbing', base: { kind: 'free-space', freqHz: 6e10 } }))).toThrow(/absorptionDbPerKm|fieldAttenuationPerKm/)
  })
})

describe('alternative inputs', () => {
  it('asks for one of two alternatives when neither is given, naming both', () => {
    expect(refusals('compliance_verdict', { limit: { source: 'stated', spec: { kind: 'eirp', eirpDbm: 30 }, citation: 'x' } })).toContain('Give the EIRP or a stored calculation that gives it.')
    expect(refusals('eirp_single_point', { measurement: { kind: 'isotropic-power', receivedPowerDbm: -50 }, model: { kind: 'free-space', freqHz: 1e8 } })).toContain('Give the distance or the source position.')
  })
})
