import { describe, expect, it } from 'vitest'
import { Matrix, inverse } from 'ml-matrix'
import { fitEirpAndExponent, fitEirpFixedExponent, MIN_DISTANCE_SPAN_RATIO, type ReadingAtDistance } from '../../../../shared/radio/estimation'
import { createNormalSource, createUniformSource } from '../../../../shared/radio/uncertainty'

const FREQ_HZ = 2400e6
const L0_2400_1M = 40.05 // log-distance model (Rappaport §4.9.1), register 6-1 [D]: free space at 1 m, 2400 MHz

/** Synthetic readings P = EIRP − L(d0) − 10 n log10(d/d0) + noise (the model's own definition). */
function synth(opts: { eirpDbm: number; exponent: number; distancesM: number[]; sigmaDb: number; seed: number; refLossDb?: number }): ReadingAtDistance[] {
  const z = createNormalSource(createUniformSource(opts.seed))
  const l0 = opts.refLossDb ?? L0_2400_1M
  return opts.distancesM.map((distanceM) => ({ distanceM, receivedPowerDbm: opts.eirpDbm - l0 - 10 * opts.exponent * Math.log10(distanceM) + opts.sigmaDb * z() }))
}

function logSpacedDistances(count: number, fromM: number, toM: number, seed: number): number[] {
  const u = createUniformSource(seed)
  return Array.from({ length: count }, () => fromM * (toM / fromM) ** u())
}

describe('fitEirpAndExponent', () => {
  it('uses free space at d0 = 1 m, 2400 MHz as L(d0): 40.05 dB (log-distance model (Rappaport §4.9.1), register 6-1 [D], ±0.01 dB)', () => {
    const r = fitEirpAndExponent({ readings: [{ distanceM: 10, receivedPowerDbm: -50 }, { distanceM: 100, receivedPowerDbm: -80 }, { distanceM: 50, receivedPowerDbm: -71 }], refDistanceM: 1, freqHz: FREQ_HZ })
    expect(Math.abs(r.value.refLossDb - L0_2400_1M)).toBeLessThanOrEqual(0.01)
  })

  it('recovers EIRP and n exactly from noise-free readings built on the log-distance model (Rappaport §4.9.1), register 6-2 (50 m, n = 3 → 91.02 dB)', () => {
    // log-distance model (Rappaport §4.9.1), register 6-2 [D]: at 2400 MHz, d0 = 1 m, the loss at 50 m is 91.02 dB for n = 3; 20 dBm EIRP → −71.02 dBm.
    const readings = [10, 50, 200, 1000].map((d) => ({ distanceM: d, receivedPowerDbm: 20 - L0_2400_1M - 30 * Math.log10(d) }))
    expect(Math.abs(readings[1].receivedPowerDbm - (20 - 91.02))).toBeLessThanOrEqual(0.01)
    const r = fitEirpAndExponent({ readings, refDistanceM: 1, refLossDb: L0_2400_1M })
    expect(r.value.eirpDbm).toBeCloseTo(20, 9)
    expect(r.value.exponent).toBeCloseTo(3, 9)
    expect(r.value.rSquared).toBeCloseTo(1, 12)
    expect(Math.max(...r.value.residualsDb.map(Math.abs))).toBeLessThan(1e-9)
  })

  it('accepts field-strength readings: 60 dBµV/m at 100 MHz is −57.22 dBm (ITU-R P.525-4, register 1-9 [D])', () => {
    const asField = fitEirpAndExponent({ readings: [{ distanceM: 100, fieldStrengthDbuvPerM: 60 }, { distanceM: 1000, fieldStrengthDbuvPerM: 35 }, { distanceM: 300, fieldStrengthDbuvPerM: 47 }], refDistanceM: 1, freqHz: 100e6 })
    const asPower = fitEirpAndExponent({ readings: [{ distanceM: 100, receivedPowerDbm: -57.22 }, { distanceM: 1000, receivedPowerDbm: -82.22 }, { distanceM: 300, receivedPowerDbm: -70.22 }], refDistanceM: 1, freqHz: 100e6 })
    expect(Math.abs(asField.value.eirpDbm - asPower.value.eirpDbm)).toBeLessThan(0.01)
    expect(Math.abs(asField.value.exponent - asPower.value.exponent)).toBeLessThan(1e-3)
  })

  it('matches the normal-equation solution and (XᵀX)⁻¹ standard errors of a general-purpose matrix library (ml-matrix 6.15)', () => {
    const readings = synth({ eirpDbm: 33, exponent: 3.4, distancesM: logSpacedDistances(30, 30, 3000, 1), sigmaDb: 5, seed: 2 })
    const r = fitEirpAndExponent({ readings, refDistanceM: 1, refLossDb: L0_2400_1M })
    const X = new Matrix(readings.map((p) => [1, -10 * Math.log10(p.distanceM)]))
    const y = Matrix.columnVector(readings.map((p) => p.receivedPowerDbm! + L0_2400_1M))
    const xtxInv = inverse(X.transpose().mmul(X))
    const beta = xtxInv.mmul(X.transpose()).mmul(y)
    const resid = y.sub(X.mmul(beta))
    const s2 = resid.transpose().mmul(resid).get(0, 0) / (readings.length - 2)
    expect(r.value.eirpDbm).toBeCloseTo(beta.get(0, 0), 8)
    expect(r.value.exponent).toBeCloseTo(beta.get(1, 0), 8)
    expect(r.value.eirpStandardErrorDb!).toBeCloseTo(Math.sqrt(s2 * xtxInv.get(0, 0)), 8)
    expect(r.value.exponentStandardError!).toBeCloseTo(Math.sqrt(s2 * xtxInv.get(1, 1)), 8)
    expect(r.value.eirpExponentCorrelation!).toBeCloseTo(xtxInv.get(0, 1) / Math.sqrt(xtxInv.get(0, 0) * xtxInv.get(1, 1)), 8)
  })

  it('recovers known parameters within 3 standard errors in ≥ 95 % of 200 seeded trials, and its SE agrees with the empirical spread within 20 %', () => {
    const distancesM = logSpacedDistances(20, 20, 2000, 99)
    const truth = { eirpDbm: 40, exponent: 3.3 }
    const est: { e: number; n: number; se: number; sn: number; inT: boolean }[] = []
    for (let trial = 0; trial < 200; trial++) {
      const r = fitEirpAndExponent({ readings: synth({ ...truth, distancesM, sigmaDb: 6, seed: 1000 + trial }), refDistanceM: 1, freqHz: FREQ_HZ })
      const i = r.value.eirpInterval95Dbm!
      est.push({ e: r.value.eirpDbm, n: r.value.exponent, se: r.value.eirpStandardErrorDb!, sn: r.value.exponentStandardError!, inT: i.lowDbm <= truth.eirpDbm && truth.eirpDbm <= i.highDbm })
    }
    const within = est.filter((x) => Math.abs(x.e - truth.eirpDbm) < 3 * x.se && Math.abs(x.n - truth.exponent) < 3 * x.sn).length
    expect(within / est.length).toBeGreaterThanOrEqual(0.95)
    const sd = (v: number[]) => { const m = v.reduce((a, b) => a + b, 0) / v.length; return Math.sqrt(v.reduce((a, b) => a + (b - m) ** 2, 0) / (v.length - 1)) }
    const mean = (v: number[]) => v.reduce((a, b) => a + b, 0) / v.length
    expect(Math.abs(mean(est.map((x) => x.se)) / sd(est.map((x) => x.e)) - 1)).toBeLessThan(0.2)
    expect(Math.abs(mean(est.map((x) => x.sn)) / sd(est.map((x) => x.n)) - 1)).toBeLessThan(0.2)
    expect(est.filter((x) => x.inT).length / est.length).toBeGreaterThanOrEqual(0.9) // Student-t 95 % interval
  })

  it(`warns when the distances span less than a factor of ${MIN_DISTANCE_SPAN_RATIO}, and when there are fewer than 3 readings`, () => {
    const narrow = fitEirpAndExponent({ readings: synth({ eirpDbm: 30, exponent: 3, distancesM: [100, 150, 200, 250], sigmaDb: 2, seed: 4 }), refDistanceM: 1, freqHz: FREQ_HZ })
    expect(narrow.warnings.join(' ')).toMatch(/factor of 2\.50 \(less than 3\)/)
    const two = fitEirpAndExponent({ readings: [{ distanceM: 10, receivedPowerDbm: -50 }, { distanceM: 100, receivedPowerDbm: -80 }], refDistanceM: 1, freqHz: FREQ_HZ })
    expect(two.warnings.join(' ')).toMatch(/Only 2 reading/)
    expect(two.value.eirpStandardErrorDb).toBeNull()
    expect(two.value.exponent).toBeCloseTo(3, 12)
    expect(two.interval).toBeUndefined()
  })

  it('fits 1,000 readings in well under 10 ms on average', () => {
    const readings = synth({ eirpDbm: 30, exponent: 3, distancesM: logSpacedDistances(1000, 10, 5000, 5), sigmaDb: 6, seed: 6 })
    fitEirpAndExponent({ readings, refDistanceM: 1, freqHz: FREQ_HZ })
    const t0 = performance.now()
    for (let i = 0; i < 20; i++) fitEirpAndExponent({ readings, refDistanceM: 1, freqHz: FREQ_HZ })
    expect((performance.now() - t0) / 20).toBeLessThan(10)
  })

  it('rejects empty input, one reading, NaN, zero distance, all-equal distances and a missing reference loss with a RangeError', () => {
    const base = { refDistanceM: 1, freqHz: FREQ_HZ }
    expect(() => fitEirpAndExponent({ ...base, readings: [] })).toThrow(RangeError)
    expect(() => fitEirpAndExponent({ ...base, readings: [{ distanceM: 10, receivedPowerDbm: -40 }] })).toThrow(RangeError)
    expect(() => fitEirpAndExponent({ ...base, readings: [{ distanceM: 10, receivedPowerDbm: Number.NaN }, { distanceM: 20, receivedPowerDbm: -50 }] })).toThrow(RangeError)
    expect(() => fitEirpAndExponent({ ...base, readings: [{ distanceM: 0, receivedPowerDbm: -40 }, { distanceM: 20, receivedPowerDbm: -50 }] })).toThrow(RangeError)
    expect(() => fitEirpAndExponent({ ...base, readings: [{ distanceM: 20, receivedPowerDbm: -40 }, { distanceM: 20, receivedPowerDbm: -50 }] })).toThrow(RangeError)
    expect(() => fitEirpAndExponent({ refDistanceM: 1, readings: [{ distanceM: 10, receivedPowerDbm: -40 }, { distanceM: 20, receivedPowerDbm: -50 }] })).toThrow(RangeError)
    expect(() => fitEirpAndExponent({ ...base, readings: [{ distanceM: 10, fieldStrengthDbuvPerM: 60 }, { distanceM: 20 }] })).toThrow(RangeError)
  })
})

describe('fitEirpFixedExponent', () => {
  it('recovers the EIRP within 3 SE in ≥ 95 % of 200 seeded trials, with SE = s/√N agreeing with the spread within 20 %', () => {
    const distancesM = logSpacedDistances(15, 50, 500, 7)
    const es: number[] = []
    const ses: number[] = []
    let within = 0
    for (let trial = 0; trial < 200; trial++) {
      const r = fitEirpFixedExponent({ readings: synth({ eirpDbm: 27, exponent: 2.8, distancesM, sigmaDb: 4, seed: 5000 + trial }), refDistanceM: 1, freqHz: FREQ_HZ, exponent: 2.8 })
      es.push(r.value.eirpDbm)
      ses.push(r.value.eirpStandardErrorDb!)
      if (Math.abs(r.value.eirpDbm - 27) < 3 * r.value.eirpStandardErrorDb!) within++
    }
    expect(within / 200).toBeGreaterThanOrEqual(0.95)
    const m = es.reduce((a, b) => a + b, 0) / es.length
    const sd = Math.sqrt(es.reduce((a, b) => a + (b - m) ** 2, 0) / (es.length - 1))
    expect(Math.abs(ses.reduce((a, b) => a + b, 0) / ses.length / sd - 1)).toBeLessThan(0.2)
  })

  it('gives one reading an EIRP without standard error, with a warning; 20 dBm at 50 m with n = 3 reads −71.02 dBm (log-distance model (Rappaport §4.9.1), register 6-2 [D])', () => {
    const r = fitEirpFixedExponent({ readings: [{ distanceM: 50, receivedPowerDbm: 20 - 91.02 }], refDistanceM: 1, freqHz: FREQ_HZ, exponent: 3 })
    expect(Math.abs(r.value.eirpDbm - 20)).toBeLessThanOrEqual(0.01)
    expect(r.value.eirpStandardErrorDb).toBeNull()
    expect(r.warnings.join(' ')).toMatch(/One reading/)
  })

  it('rejects a zero or negative exponent with a RangeError', () => {
    expect(() => fitEirpFixedExponent({ readings: [{ distanceM: 50, receivedPowerDbm: -70 }], refDistanceM: 1, freqHz: FREQ_HZ, exponent: 0 })).toThrow(RangeError)
  })
})
