/**
 * The judging kinds (compliance_verdict, coexistence, exposure_screening) checked against the
 * project's check-value register (shared/radio/CHECK-VALUES.md; fixtures in tests/fixtures/radio
 * name each row's published source) and against margins computed by hand.
 */
import { describe, expect, it } from 'vitest'
import { coexistenceOutputSchema, complianceVerdictOutputSchema, exposureScreeningOutputSchema } from '../../../shared/calculations/kinds'
import type { CalculationReference, StationReference } from '../../../shared/calculations/references'
import { SCREENING_NOTICE } from '../../../shared/radio'
import { LINK_BUDGET_ROWS } from '../../fixtures/radio/coexistence-checks'
import { POWER_DENSITY_ROWS } from '../../fixtures/radio/exposure-checks'
import { distanceBetweenM, lookupOf, measurementRef, pointFrom, refusals, run, testId } from './support'

const estimate = (eirpDbm: number, interval?: { lowDbm: number; highDbm: number }): CalculationReference => ({
  id: testId(),
  kind: 'eirp_fit',
  eirpDbm,
  ...(interval ? { eirpIntervalDbm: interval } : {}),
  libraryVersion: '2.0.0',
  at: '2026-12-01T09:00:00.000Z',
})

const station = (limit: StationReference['limit']): StationReference => ({
  id: testId(),
  registerVersion: 4,
  stationCode: 'NRV-0117',
  licensee: 'Harrowfield Taxi Cooperative',
  service: 'land mobile',
  latitudeDeg: 46.8,
  longitudeDeg: 7.1,
  lowFreqHz: 160e6,
  highFreqHz: 160.1e6,
  limit,
  authorisedEirpDbm: 32.15,
  validFrom: '2025-01-01',
  validUntil: null,
})

describe('compliance_verdict', () => {
  it('judges a stored estimate’s EIRP and interval against a stated limit: 30 dBm (28–32) against 27 dBm gives margin 3 dB (1 to 5 dB), exceeds (hand computation: margin = EIRP − limit)', () => {
    const c = estimate(30, { lowDbm: 28, highDbm: 32 })
    const r = run('compliance_verdict', { eirpCalculationId: c.id, limit: { source: 'stated', spec: { kind: 'eirp', eirpDbm: '0.5 W' }, citation: 'Licence condition 4' } }, lookupOf({ calculations: [c] }))
    const v = complianceVerdictOutputSchema.parse(r.outputs.value)
    // 0.5 W is 26.99 dBm (dBm re 1 mW: 10·log10(500), definition of the unit)
    expect(v.appliedLimitEirpDbm).toBeCloseTo(10 * Math.log10(500), 9)
    expect(v.marginDb).toBeCloseTo(30 - 10 * Math.log10(500), 9)
    expect(v.marginIntervalDb!.lowDb).toBeCloseTo(28 - 10 * Math.log10(500), 9)
    expect(v).toMatchObject({ verdict: 'exceeds', eirpFrom: 'calculation', eirpDbm: 30, eirpIntervalDbm: { lowDbm: 28, highDbm: 32 } })
    expect(r.references.eirpCalculation).toMatchObject({ id: c.id, eirpDbm: 30 })
  })

  it('judges against a station’s licence: ERP 30 dBm is EIRP 32.15 dBm (ITU RR Nos. 1.161–1.162, register 3-1), so 33 dBm exceeds by 0.85 dB; the record keeps the station and its register version', () => {
    const st = station({ kind: 'erp', erpDbm: 30 })
    const r = run('compliance_verdict', { eirpDbm: '33 dBm', limit: { source: 'station', stationId: st.id } }, lookupOf({ stations: [st] }))
    const v = complianceVerdictOutputSchema.parse(r.outputs.value)
    expect(v.appliedLimitEirpDbm).toBeCloseTo(32.15, 9)
    expect(v.marginDb).toBeCloseTo(0.85, 9)
    expect(v).toMatchObject({ verdict: 'exceeds', limitFrom: 'station-licence' })
    expect(v.citation).toContain('licence register version 4')
    expect(r.references.station).toMatchObject({ id: st.id, registerVersion: 4, stationCode: 'NRV-0117' })
  })

  it('refuses both a typed EIRP and a stored one, an interval typed beside a stored one, and a station that is not in the lookup', () => {
    const c = estimate(30)
    expect(refusals('compliance_verdict', { eirpDbm: 20, eirpCalculationId: c.id, limit: { source: 'band-limit', bandLimitId: 'x' } })).toContain('Give either the EIRP or a stored calculation that gives it, not both.')
    expect(refusals('compliance_verdict', { eirpCalculationId: c.id, eirpIntervalDbm: { lowDbm: 1, highDbm: 2 }, limit: { source: 'band-limit', bandLimitId: 'x' } })).toContain('The interval comes with the stored calculation; do not type one.')
    const id = testId()
    expect(() => run('compliance_verdict', { eirpDbm: 20, limit: { source: 'station', stationId: id } }, lookupOf({}))).toThrow(`There is no authorised station "${id}" in the licence register.`)
  })
})

const CX1 = LINK_BUDGET_ROWS.find((r) => r.id === 'CX-1')!
const CX2 = LINK_BUDGET_ROWS.find((r) => r.id === 'CX-2')!

describe('coexistence', () => {
  const base = (extra: object) => ({
    model: { kind: 'free-space', freqHz: '2400 MHz' },
    victimAntennaGainDbi: `${CX1.inputs.victimAntennaGainDbi} dBi`,
    victimFeederLossDb: `${CX1.inputs.victimFeederLossDb} dB`,
    victimNoise: { kind: 'noise-figure', bandwidthHz: '20 MHz', noiseFigureDb: `${CX1.inputs.noiseFigureDb} dB` },
    criterion: { kind: 'named', id: 'i-n-minus-6' },
    ...extra,
  })

  it(`gives register CX-1 (${CX1.source}): I/N, desensitisation, reduction and separation`, () => {
    const r = run('coexistence', base({ interfererEirpDbm: '1 W', distanceM: '1 km' }))
    const v = coexistenceOutputSchema.parse(r.outputs.value)
    const tol = CX1.tolerance.db
    expect(Math.abs(v.interferenceDbm - CX1.expected.interferenceDbm)).toBeLessThanOrEqual(tol)
    expect(Math.abs(v.noiseDbm - CX1.expected.noiseDbm!)).toBeLessThanOrEqual(tol)
    expect(Math.abs(v.inrDb - CX1.expected.inrDb)).toBeLessThanOrEqual(tol)
    expect(Math.abs(v.desensitisationDb - CX1.expected.desensitisationDb!)).toBeLessThanOrEqual(tol)
    expect(Math.abs(v.eirpReductionDb - CX1.expected.marginDbAgainstMinus6!)).toBeLessThanOrEqual(tol)
    expect(Math.abs(v.requiredPathLossDb - CX1.expected.requiredPathLossDb!)).toBeLessThanOrEqual(tol)
    expect(Math.abs(v.separationDistanceM / CX1.expected.separationDistanceM! - 1)).toBeLessThanOrEqual(CX1.tolerance.distanceRelative!)
    expect(v.meetsCriterion).toBe(false)
  })

  it(`gives register CX-2 (${CX2.source}) with the interferer’s EIRP from a stored estimate and the distance from both positions (GeographicLib)`, () => {
    const victim = { latDeg: 46.9, lonDeg: 7.3 }
    const source = pointFrom(victim, 135, 1000)
    const c = estimate(30)
    const r = run(
      'coexistence',
      base({ eirpCalculationId: c.id, victimPosition: victim, sourcePosition: source, bandwidthOverlap: { kind: 'bandwidths', overlapBandwidthHz: '20 MHz', interfererBandwidthHz: '40 MHz' }, frequencyDependentRejectionDb: '10 dB' }),
      lookupOf({ calculations: [c] }),
    )
    const v = coexistenceOutputSchema.parse(r.outputs.value)
    expect(Math.abs(v.distanceM - distanceBetweenM(victim, source))).toBeLessThan(0.001)
    expect(Math.abs(v.interferenceDbm - CX2.expected.interferenceDbm)).toBeLessThanOrEqual(CX2.tolerance.db)
    expect(Math.abs(v.inrDb - CX2.expected.inrDb)).toBeLessThanOrEqual(CX2.tolerance.db)
    expect(v).toMatchObject({ distanceFrom: 'positions', eirpFrom: 'calculation' })
  })

  it('takes an I/N value as the criterion: margin = I/N − criterion (hand computation)', () => {
    const v = coexistenceOutputSchema.parse(run('coexistence', base({ interfererEirpDbm: 30, distanceM: 1000, criterion: { kind: 'inr', inrDb: '-10 dB' } })).outputs.value)
    expect(v.marginDb).toBeCloseTo(v.inrDb + 10, 9)
    expect(v.criterionInrDb).toBe(-10)
  })

  it('refuses one position only, both distance and positions, and an unknown criterion', () => {
    expect(refusals('coexistence', base({ interfererEirpDbm: 30, victimPosition: { latDeg: 1, lonDeg: 1 } }))).toContain('Give both positions, the victim’s and the interferer’s.')
    expect(refusals('coexistence', base({ interfererEirpDbm: 30, distanceM: 5, victimPosition: { latDeg: 1, lonDeg: 1 }, sourcePosition: { latDeg: 1, lonDeg: 2 } }))).toContain('Give either the distance or both positions, not both.')
    expect(refusals('coexistence', base({ interfererEirpDbm: 30, distanceM: 5, criterion: { kind: 'named', id: 'i-n-minus-3' } })).length).toBeGreaterThan(0)
  })
})

const EX_S_1 = POWER_DENSITY_ROWS.find((r) => r.id === 'EX-S-1')!

describe('exposure_screening', () => {
  it(`gives register EX-S-1 (${EX_S_1.source}) at a typed distance, the EIRP typed in mW`, () => {
    const r = run('exposure_screening', { eirpDbm: '100 mW', freqHz: '2.4 GHz', population: 'general-public', groundReflection: false, points: { source: 'typed', distancesM: ['1 m'] } })
    const v = exposureScreeningOutputSchema.parse(r.outputs.value)
    expect(Math.abs(v.points[0]!.powerDensityWPerM2 - EX_S_1.expected.powerDensityWPerM2!)).toBeLessThanOrEqual(EX_S_1.tolerance.powerDensityWPerM2!)
    expect(Math.abs(v.points[0]!.fractionOfLevel - EX_S_1.expected.fractionOfLevel!)).toBeLessThanOrEqual(EX_S_1.tolerance.fractionOfLevel!)
    expect(v.points[0]!.caution).toBe('none')
    expect(v.notice).toBe(SCREENING_NOTICE)
  })

  it('gives register EX-D: 1 kW EIRP at 900 MHz, general public, reaches the level at 4.21 m (ICNIRP 2020 Table 5, S = EIRP/(4πd²)); cautions at each measurement position', () => {
    const antenna = { latDeg: 46.8, lonDeg: 7.1 }
    const ms = [2, 8, 40].map((d, i) => measurementRef({ ...pointFrom(antenna, 120 * i, d), derived: {}, warnings: i === 0 ? ['No calibration on record for the antenna.'] : [] }))
    const r = run('exposure_screening', { eirpDbm: '1000 W', freqHz: '900 MHz', population: 'general-public', groundReflection: false, points: { source: 'measurements', measurementIds: ms.map((m) => m.id), sourcePosition: antenna } }, lookupOf({ measurements: ms }))
    const v = exposureScreeningOutputSchema.parse(r.outputs.value)
    expect(Math.abs(v.complianceDistanceM - 4.21)).toBeLessThanOrEqual(0.005)
    // fraction = (P/(4πd²)) / 4.5 W/m² by hand: 2 m → 4.42 (above); 8 m → 0.276 (approaching, > 0.2); 40 m → 0.011 (none)
    expect(v.points.map((p) => p.caution)).toEqual(['above', 'approaching', 'none'])
    expect(v.points[0]!.fractionOfLevel).toBeCloseTo(1000 / (4 * Math.PI * 4) / 4.5, 3)
    expect(v.worstCaution).toBe('above')
    expect(r.warnings.some((w) => w.includes('No calibration on record'))).toBe(true)
  })

  it('multiplies the power density by 2.56 with ground reflection and by the duty cycle (common practice, FCC OET Bulletin 65 [M] as the library states)', () => {
    const at = (extra: object) => exposureScreeningOutputSchema.parse(run('exposure_screening', { eirpDbm: 40, freqHz: 9e8, population: 'occupational', groundReflection: false, points: { source: 'typed', distancesM: [10] }, ...extra }).outputs.value).points[0]!.powerDensityWPerM2
    expect(at({ groundReflection: true, dutyCycle: 0.5 }) / at({})).toBeCloseTo(1.28, 9)
  })

  it('refuses a duty cycle of 0 and no points, each with a message', () => {
    expect(refusals('exposure_screening', { eirpDbm: 40, freqHz: 9e8, population: 'general-public', groundReflection: false, dutyCycle: 0, points: { source: 'typed', distancesM: [10] } })).toContain('The duty cycle must be above 0.')
    expect(refusals('exposure_screening', { eirpDbm: 40, freqHz: 9e8, population: 'general-public', groundReflection: false, points: { source: 'typed', distancesM: [] } })).toContain('Enter at least one distance.')
  })
})
