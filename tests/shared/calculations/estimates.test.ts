/**
 * The estimating kinds (eirp_single_point, eirp_fit, source_locate) checked against outside
 * values: the project's check-value register (shared/radio/CHECK-VALUES.md, rows named), a
 * general-purpose matrix library (ml-matrix) for least squares, and GeographicLib (Karney 2013)
 * for the geometry of synthetic data. Synthetic data are generated from the stated formula with
 * the stated noise.
 */
import { Matrix, inverse } from 'ml-matrix'
import { describe, expect, it } from 'vitest'
import { eirpFitOutputSchema, eirpSinglePointOutputSchema, sourceLocateOutputSchema, CalculationRefused } from '../../../shared/calculations/kinds'
import { createNormalSource, createUniformSource, GEODESIC_METHOD } from '../../../shared/radio'
import { FREE_SPACE_FIELD_ROWS } from '../../fixtures/radio/propagation-free-space'
import { azimuthDeg, distanceBetweenM, lookupOf, measurementRef, pointFrom, refusals, run } from './support'

const SOURCE = { latDeg: 46.8, lonDeg: 7.1 }
/** ITU-R P.525-4 §2.1: 30 dBm EIRP gives 74.77 dBµV/m at 1 km (register 1-5). */
const ROW_1_5 = FREE_SPACE_FIELD_ROWS.find((r) => r.id === '1-5')!
/** Free space at d0 = 1 m, 2400 MHz: 40.05 dB (ITU-R P.525-4, register 6-1 [D]). */
const L0_2400_1M = 40.05

describe('eirp_single_point', () => {
  it('takes the level from a stored measurement and the geodesic distance to the source: 74.77 dBµV/m at 1 km gives 30 dBm EIRP, 27.85 dBm ERP (ITU-R P.525-4 §2.1, register 1-5; ERP = EIRP − 2.15 dB, register 3-1)', () => {
    const at = pointFrom(SOURCE, 60, 1000) // 1 km by GeographicLib
    const m = measurementRef({ ...at, freqHz: 100e6, derived: { fieldStrengthDbuvPerM: ROW_1_5.expected }, warnings: ['The antenna calibration expired on 2026-01-01.'] })
    const r = run('eirp_single_point', { measurementId: m.id, sourcePosition: SOURCE, model: { kind: 'free-space', freqHz: '100 MHz' } }, lookupOf({ measurements: [m] }))
    const v = eirpSinglePointOutputSchema.parse(r.outputs.value)
    expect(Math.abs(v.distanceM - 1000)).toBeLessThan(0.001)
    expect(Math.abs(v.eirpDbm - 30)).toBeLessThanOrEqual(0.01)
    expect(Math.abs(v.erpDbm - 27.85)).toBeLessThanOrEqual(0.01)
    expect(v).toMatchObject({ distanceFrom: 'positions', measurementId: m.id, measurementLevel: 'field-strength' })
    expect(r.warnings.some((w) => w.includes('calibration expired'))).toBe(true)
    expect(r.methods.map((x) => x.id)).toContain(GEODESIC_METHOD.id)
    expect((r.references.measurements as { id: string }[])[0]!.id).toBe(m.id)
  })

  it('carries the budget into the outputs: 1.5 dB at k = 2 and ±20 m rectangular at 1 km, n = 2 (hand computation after JCGM 100:2008 eq. 10 and §4.3.7; sensitivity 20/(d ln 10) dB/m, register 12-2)', () => {
    const r = run('eirp_single_point', {
      measurement: { kind: 'field-strength', fieldStrengthDbuvPerM: `${ROW_1_5.expected} dBµV/m`, freqHz: '100 MHz' },
      distanceM: '1 km',
      model: { kind: 'free-space', freqHz: '100 MHz' },
      measurementContributions: [{ name: 'antenna calibration', distribution: { kind: 'normal', expandedUncertainty: '1.5 dB', coverageFactor: 2 } }],
      distanceUncertainty: { kind: 'rectangular', halfWidth: '20 m' },
    })
    const v = eirpSinglePointOutputSchema.parse(r.outputs.value)
    const uCal = 0.75 // 1.5 / 2
    const uDist = (20 / Math.sqrt(3)) * (20 / (1000 * Math.LN10)) // a/√3 × c_d = 0.1003 dB
    const uc = Math.hypot(uCal, uDist)
    expect(v.budget!.rows.map((x) => x.name)).toHaveLength(2)
    expect(v.budget!.rows[0]!.contribution).toBeCloseTo(uCal, 6)
    expect(v.budget!.rows[1]!.contribution).toBeCloseTo(uDist, 4)
    expect(v.budget!.rows[0]!.varianceShare).toBeCloseTo(uCal ** 2 / uc ** 2, 4)
    expect(v.budget!.combinedStandardUncertainty).toBeCloseTo(uc, 4)
    expect(v.eirpIntervalDbm!.highDbm - v.eirpDbm).toBeCloseTo(2 * uc, 4)
    expect(v.erpIntervalDbm!.lowDbm).toBeCloseTo(v.eirpIntervalDbm!.lowDbm - 2.15, 9)
  })

  it('refuses a typed level and a measurement together, and a source position without a measurement, each with a message', () => {
    const id = measurementRef({ ...SOURCE, derived: { fieldStrengthDbuvPerM: 60 } }).id
    expect(refusals('eirp_single_point', { measurement: { kind: 'isotropic-power', receivedPowerDbm: -50 }, measurementId: id, distanceM: 10, model: { kind: 'free-space', freqHz: 1e8 } })).toContain('Give either a typed level or a stored measurement, not both.')
    expect(refusals('eirp_single_point', { measurement: { kind: 'isotropic-power', receivedPowerDbm: -50 }, sourcePosition: SOURCE, model: { kind: 'free-space', freqHz: 1e8 } })).toContain('A source position needs a stored measurement (its position); type the distance instead.')
  })

  it('refuses a measurement the lookup does not have, naming it', () => {
    const id = measurementRef({ ...SOURCE, derived: {} }).id
    expect(() => run('eirp_single_point', { measurementId: id, distanceM: 100, model: { kind: 'free-space', freqHz: 1e8 } }, lookupOf({}))).toThrow(new CalculationRefused(`There is no measurement "${id}" on this case.`))
  })
})

/** Readings P = EIRP − L(d0) − 10 n log10(d/d0) + σ·z (the log-distance model's definition), seeded. */
function synthetic(opts: { eirpDbm: number; exponent: number; count: number; sigmaDb: number; seed: number }) {
  const u = createUniformSource(opts.seed)
  const z = createNormalSource(createUniformSource(opts.seed + 1))
  return Array.from({ length: opts.count }, () => {
    const d = 30 * 100 ** u() // 30 m … 3 km, log-uniform
    return { distanceM: d, receivedPowerDbm: opts.eirpDbm - L0_2400_1M - 10 * opts.exponent * Math.log10(d) + opts.sigmaDb * z() }
  })
}

describe('eirp_fit', () => {
  it('recovers EIRP 20 dBm and n = 3 exactly from noise-free readings built on the log-distance model (register 6-1 L(d0) = 40.05 dB; register 6-2: −71.02 dBm at 50 m)', () => {
    const points = [10, 50, 200, 1000].map((d) => ({ distanceM: `${d} m`, receivedPowerDbm: `${20 - L0_2400_1M - 30 * Math.log10(d)} dBm` }))
    const r = run('eirp_fit', { readings: { source: 'typed', points }, exponent: { kind: 'free' }, refDistanceM: '1 m', refLossDb: L0_2400_1M })
    const v = eirpFitOutputSchema.parse(r.outputs.value)
    expect(v.points[1]!.receivedPowerDbm).toBeCloseTo(-71.02, 2)
    expect(v.eirpDbm).toBeCloseTo(20, 9)
    expect(v.erpDbm).toBeCloseTo(17.85, 9)
    expect(v.exponent).toBeCloseTo(3, 9)
    expect(v.rSquared).toBeCloseTo(1, 12)
    expect(v.points.map((p) => p.distanceM)).toEqual([10, 50, 200, 1000])
    expect(v.curve).toMatchObject({ refDistanceM: 1, refLossDb: L0_2400_1M })
  })

  it('matches the normal equations and (XᵀX)⁻¹ standard errors of ml-matrix 6.15 on 50 synthetic readings (n = 3.4, EIRP 33 dBm, σ = 5 dB normal noise, seeded), with every point’s residual', () => {
    const pts = synthetic({ eirpDbm: 33, exponent: 3.4, count: 50, sigmaDb: 5, seed: 11 })
    const r = run('eirp_fit', { readings: { source: 'typed', points: pts }, exponent: { kind: 'free' }, refDistanceM: 1, refLossDb: L0_2400_1M })
    const v = eirpFitOutputSchema.parse(r.outputs.value)
    const X = new Matrix(pts.map((p) => [1, -10 * Math.log10(p.distanceM)]))
    const y = Matrix.columnVector(pts.map((p) => p.receivedPowerDbm + L0_2400_1M))
    const xtxInv = inverse(X.transpose().mmul(X))
    const beta = xtxInv.mmul(X.transpose()).mmul(y)
    const resid = y.sub(X.mmul(beta))
    const s2 = resid.transpose().mmul(resid).get(0, 0) / (pts.length - 2)
    expect(v.eirpDbm).toBeCloseTo(beta.get(0, 0), 8)
    expect(v.exponent).toBeCloseTo(beta.get(1, 0), 8)
    expect(v.eirpStandardErrorDb!).toBeCloseTo(Math.sqrt(s2 * xtxInv.get(0, 0)), 8)
    expect(v.exponentStandardError!).toBeCloseTo(Math.sqrt(s2 * xtxInv.get(1, 1)), 8)
    v.points.forEach((p, i) => expect(p.residualDb).toBeCloseTo(resid.get(i, 0), 8))
    // the recovered values are within 3 standard errors of the truth the data were built from
    expect(Math.abs(v.eirpDbm - 33)).toBeLessThan(3 * v.eirpStandardErrorDb!)
    expect(Math.abs(v.exponent - 3.4)).toBeLessThan(3 * v.exponentStandardError!)
    // Student t(0.975, 48) = 2.011 (NIST/SEMATECH e-Handbook §1.3.6.7.2 table, ν = 48 between 40 and 50: 2.021 … 2.009)
    const t = (v.exponentInterval95!.high - v.exponent) / v.exponentStandardError!
    expect(t).toBeGreaterThan(2.009)
    expect(t).toBeLessThan(2.021)
    expect(r.outputs.interval!.quantity).toBe('eirpDbm')
  })

  it('fits stored measurements at their geodesic distances from the source position (GeographicLib), with a fixed exponent: EIRP = mean(P + L(d0) + 10 n log d) by hand', () => {
    const ds = [100, 300, 1000, 3000]
    const offsets = [0.4, -0.3, 0.2, -0.3]
    const ms = ds.map((d, i) => measurementRef({ ...pointFrom(SOURCE, 90 * i, d), freqHz: 2400e6, derived: { isotropicReceivedPowerDbm: 25 - L0_2400_1M - 25 * Math.log10(d) + offsets[i]! } }))
    const r = run('eirp_fit', { readings: { source: 'measurements', measurementIds: ms.map((m) => m.id), sourcePosition: SOURCE }, exponent: { kind: 'fixed', exponent: 2.5 }, refDistanceM: 1, refLossDb: L0_2400_1M }, lookupOf({ measurements: ms }))
    const v = eirpFitOutputSchema.parse(r.outputs.value)
    const byHand = offsets.reduce((s, o) => s + 25 + o, 0) / ds.length // the offsets average to 0
    expect(v.eirpDbm).toBeCloseTo(byHand, 6)
    v.points.forEach((p, i) => {
      expect(Math.abs(p.distanceM - distanceBetweenM(SOURCE, pointFrom(SOURCE, 90 * i, ds[i]!)))).toBeLessThan(0.001)
      expect(p.measurementId).toBe(ms[i]!.id)
    })
    expect(v.exponentFixed).toBe(true)
    expect(v.exponentInterval95).toBeNull()
  })

  it('refuses one reading for a free fit and readings all at one distance, in the library’s words', () => {
    expect(() => run('eirp_fit', { readings: { source: 'typed', points: [{ distanceM: 100, receivedPowerDbm: -60 }] }, exponent: { kind: 'free' }, refDistanceM: 1, refLossDb: 40 })).toThrow(/at least 2 readings are needed for this fit \(got 1\)/)
    expect(() =>
      run('eirp_fit', { readings: { source: 'typed', points: [{ distanceM: 100, receivedPowerDbm: -60 }, { distanceM: 100, receivedPowerDbm: -62 }, { distanceM: 100, receivedPowerDbm: -61 }] }, exponent: { kind: 'free' }, refDistanceM: 1, refLossDb: 40 }),
    ).toThrow(/more than one distance/)
  })

  it('refuses a field strength without a frequency, a reading with two levels, and a measurement named twice, each with a message', () => {
    expect(refusals('eirp_fit', { readings: { source: 'typed', points: [{ distanceM: 100, fieldStrengthDbuvPerM: 60 }, { distanceM: 300, fieldStrengthDbuvPerM: 50 }] }, exponent: { kind: 'free' }, refDistanceM: 1 })).toContain(
      'Enter the frequency: field strengths and the free-space loss at the reference distance need it.',
    )
    expect(refusals('eirp_fit', { readings: { source: 'typed', points: [{ distanceM: 100, fieldStrengthDbuvPerM: 60, receivedPowerDbm: -50 }] }, exponent: { kind: 'free' }, refDistanceM: 1, freqHz: 1e8 })).toContain('Give each reading either a received power or a field strength.')
    const id = measurementRef({ ...SOURCE, derived: {} }).id
    expect(refusals('eirp_fit', { readings: { source: 'measurements', measurementIds: [id, id], sourcePosition: SOURCE }, exponent: { kind: 'free' }, refDistanceM: 1 })).toContain('A measurement is named twice: each reading counts once in the fit.')
  })
})

describe('source_locate', () => {
  const FREQ = 900e6
  const L0 = 20 * Math.log10((4 * Math.PI * FREQ) / 299_792_458) // free space at 1 m, ITU-R P.525-4 exact form [D]

  it('finds a noise-free source within 1 m with EIRP 40 dBm and n = 2.8 from 12 stored levels placed by GeographicLib (synthetic, log-distance model)', () => {
    const u = createUniformSource(5)
    const ms = Array.from({ length: 12 }, () => {
      const d = 200 * 15 ** u()
      const p = pointFrom(SOURCE, 360 * u(), d)
      return measurementRef({ ...p, freqHz: FREQ, derived: { isotropicReceivedPowerDbm: 40 - L0 - 28 * Math.log10(distanceBetweenM(p, SOURCE)) } })
    })
    const r = run('source_locate', { observations: { source: 'measurements', measurementIds: ms.map((m) => m.id), use: 'levels' }, levelSigmaDb: '1 dB', pathLoss: { refDistanceM: '1 m' } }, lookupOf({ measurements: ms }))
    const v = sourceLocateOutputSchema.parse(r.outputs.value)
    expect(distanceBetweenM(v, SOURCE)).toBeLessThan(1)
    expect(Math.abs(v.eirpDbm! - 40)).toBeLessThan(0.01)
    expect(Math.abs(v.exponent! - 2.8)).toBeLessThan(0.001)
    expect(v.levelResiduals.map((x) => x.measurementId)).toEqual(ms.map((m) => m.id))
    expect(r.outputs.interval!.quantity).toBe('eirpDbm')
  })

  it('finds the source within 1 m from four stored bearings (true azimuths from GeographicLib), each keeping its own σ', () => {
    const ms = [20, 110, 200, 290].map((b, i) => {
      const p = pointFrom(SOURCE, b, 1500 + 500 * i)
      return measurementRef({ ...p, derived: {}, bearingDeg: azimuthDeg(p, SOURCE), bearingSigmaDeg: 2 })
    })
    const r = run('source_locate', { observations: { source: 'measurements', measurementIds: ms.map((m) => m.id), use: 'bearings' } }, lookupOf({ measurements: ms }))
    const v = sourceLocateOutputSchema.parse(r.outputs.value)
    expect(distanceBetweenM(v, SOURCE)).toBeLessThan(1)
    expect(v.eirpDbm).toBeNull()
    // a measurement without a bearing among them is left out, with a warning
    const plain = measurementRef({ ...SOURCE, derived: { isotropicReceivedPowerDbm: -60 } })
    const mixed = run('source_locate', { observations: { source: 'measurements', measurementIds: [...ms, plain].map((m) => m.id), use: 'bearings' } }, lookupOf({ measurements: [...ms, plain] }))
    expect(mixed.warnings).toContain('1 of the 5 measurements have no bearing: they are not used.')
    expect(JSON.stringify(sourceLocateOutputSchema.parse(mixed.outputs.value).latDeg)).toBe(JSON.stringify(v.latDeg))
    expect(v.ellipse95.semiMajorM).toBeGreaterThan(0)
    expect(Math.max(...v.bearingResiduals.map((x) => Math.abs(x.residualDeg)))).toBeLessThan(0.01)
  })

  it('refuses parallel bearings from one spot (singular geometry) and a bearing measurement that has none, with clear messages', () => {
    const bearings = [0, 1, 2].map(() => ({ latDeg: 46.8, lonDeg: 7.1, bearingDeg: 45 }))
    expect(() => run('source_locate', { observations: { source: 'typed', bearings }, bearingSigmaDeg: 2 })).toThrow(/singular geometry/)
    const m = measurementRef({ ...SOURCE, derived: { isotropicReceivedPowerDbm: -60 } })
    expect(() => run('source_locate', { observations: { source: 'measurements', measurementIds: [m.id], use: 'bearings' }, bearingSigmaDeg: 2 }, lookupOf({ measurements: [m] }))).toThrow('None of the measurements has a bearing: locate from their levels, or choose measurements with bearings.')
  })

  it('refuses levels without their σ or path loss, and typed bearings without σ', () => {
    const msgs = refusals('source_locate', { observations: { source: 'typed', levels: [{ latDeg: 1, lonDeg: 1, receivedPowerDbm: -50 }], bearings: [{ latDeg: 1, lonDeg: 1, bearingDeg: 10 }] } })
    expect(msgs).toEqual(expect.arrayContaining(['Enter the standard deviation of a level (e.g. 6 dB).', 'Levels need the path loss: a reference distance, and the loss there or the frequency.', 'Enter the standard deviation of a bearing (e.g. 5°).']))
  })
})
