import { describe, expect, it } from 'vitest'
import { combineUncertainty, expandedFromStandard, standardUncertainty } from '../../../../shared/radio/uncertainty'

describe('standardUncertainty', () => {
  // A published RF power-meter user manual, §5.7.1 "Uncertainty Contributions", lists the
  // multipliers that turn a stated figure into a standard uncertainty: normal 0.500 (k = 2),
  // rectangular 0.577, U-shaped 0.707 [V-S] (register 12-P). The identities a/√3, a/√2, U/k are [D].
  it('turns a k = 2 figure into u with multiplier 0.500 (power-meter manual §5.7.1 [V-S])', () => {
    expect(standardUncertainty({ kind: 'normal', expandedUncertainty: 1, coverageFactor: 2 })).toBeCloseTo(0.5, 3)
  })
  it('divides a rectangular half-width by √3 (multiplier 0.577, power-meter manual §5.7.1 [V-S]; GUM 4.3.7 [D])', () => {
    expect(Math.abs(standardUncertainty({ kind: 'rectangular', halfWidth: 1 }) - 0.577)).toBeLessThan(0.0005)
  })
  it('divides a U-shaped half-width by √2 (multiplier 0.707, power-meter manual §5.7.1 [V-S]; arcsine variance a²/2 [D])', () => {
    expect(Math.abs(standardUncertainty({ kind: 'u-shaped', halfWidth: 1 }) - 0.707)).toBeLessThan(0.0005)
  })
  it('matches the mismatch term of a power-reference uncertainty analysis: VSWR 1.05 both sides, ρ² = 0.0244² → u = 0.00042 (power-meter service guide, App. "Power Reference Level Test" [V-S], register 12-V)', () => {
    const rho = (1.05 - 1) / (1.05 + 1)
    expect(Math.abs(standardUncertainty({ kind: 'u-shaped', halfWidth: rho * rho }) - 0.00042)).toBeLessThan(0.000005)
  })
  it('passes a standard uncertainty through unchanged', () => {
    expect(standardUncertainty({ kind: 'standard', standardUncertainty: 0.37 })).toBe(0.37)
  })
  it('rejects a negative half-width, a zero coverage factor and an unknown kind with a RangeError', () => {
    expect(() => standardUncertainty({ kind: 'rectangular', halfWidth: -1 })).toThrow(RangeError)
    expect(() => standardUncertainty({ kind: 'normal', expandedUncertainty: 1, coverageFactor: 0 })).toThrow(RangeError)
    expect(() => standardUncertainty({ kind: 'gaussian' } as never)).toThrow(RangeError)
    expect(() => standardUncertainty({ kind: 'standard', standardUncertainty: Number.NaN })).toThrow(RangeError)
  })
})

describe('combineUncertainty', () => {
  // EA-4/02 M:2013 example S2, "Calibration of a weight of nominal value 10 kg", as tabulated with
  // its inputs in a published reproduction (metrodata.de/examples/s02_en.html) [V-S]:
  // standard: U = 45 mg (k = 2) → 22.5 mg; drift ±15 mg rectangular → 8.66 mg; comparator
  // (type A) 14.2 mg; eccentricity ±10 mg rectangular → 5.77 mg; buoyancy ±10 mg rectangular → 5.77 mg;
  // u(m_X) = 0.0291 g (29.1465 mg in the published file), U = 0.058 g at k = 2. Register 12-E.
  const s2 = combineUncertainty({
    contributions: [
      { name: 'reference standard m_S', value: 10000.005, unit: 'g', distribution: { kind: 'normal', expandedUncertainty: 0.045, coverageFactor: 2 } },
      { name: 'drift δm_D', value: 0, unit: 'g', distribution: { kind: 'rectangular', halfWidth: 0.015 } },
      { name: 'comparator δm', value: 0.02, unit: 'g', distribution: { kind: 'standard', standardUncertainty: 0.0142 } },
      { name: 'eccentricity δm_C', value: 0, unit: 'g', distribution: { kind: 'rectangular', halfWidth: 0.01 } },
      { name: 'air buoyancy δB', value: 0, unit: 'g', distribution: { kind: 'rectangular', halfWidth: 0.01 } },
    ],
  })

  it('reproduces the EA-4/02 S2 standard uncertainties 22.5, 8.66, 14.2, 5.77, 5.77 mg [V-S]', () => {
    const mg = s2.rows.map((r) => r.standardUncertainty * 1000)
    ;[22.5, 8.66, 14.2, 5.77, 5.77].forEach((expected, i) => expect(Math.abs(mg[i] - expected)).toBeLessThan(0.005))
  })
  it('reproduces the EA-4/02 S2 combined standard uncertainty 29.1465 mg within 0.01 mg [V-S]', () => {
    expect(Math.abs(s2.combinedStandardUncertainty * 1000 - 29.1465)).toBeLessThan(0.01)
  })
  it('reproduces the EA-4/02 S2 expanded uncertainty 0.058 g at k = 2 (rounded as published) [V-S]', () => {
    expect(s2.coverageFactor).toBe(2)
    expect(Math.abs(s2.expandedUncertainty - 0.058)).toBeLessThan(0.0005)
  })
  it('reports each input share of u_c² in the proportions of the published budget index (59.6 %, 8.8 %, 23.7 %, 3.9 %, 3.9 %) within 0.2 % [V-S]', () => {
    ;[0.596, 0.088, 0.237, 0.039, 0.039].forEach((share, i) => expect(Math.abs(s2.rows[i].varianceShare - share)).toBeLessThan(0.002))
    expect(s2.rows.reduce((s, r) => s + r.varianceShare, 0)).toBeCloseTo(1, 12)
  })
  it('uses k = 2 by default for about 95 % coverage (NIST/SEMATECH e-Handbook §2.5.7 [V-S])', () => {
    const b = combineUncertainty({ contributions: [{ name: 'x', distribution: { kind: 'standard', standardUncertainty: 0.3 } }] })
    expect(b.expandedUncertainty).toBeCloseTo(0.6, 12)
  })
  it('multiplies each standard uncertainty by its sensitivity coefficient before the root sum of squares (GUM eq. 10 [D])', () => {
    const b = combineUncertainty({
      contributions: [
        { name: 'a', distribution: { kind: 'standard', standardUncertainty: 3 }, sensitivity: -1 },
        { name: 'b', distribution: { kind: 'standard', standardUncertainty: 2 }, sensitivity: 2 },
      ],
      coverageFactor: 1,
    })
    expect(b.combinedStandardUncertainty).toBeCloseTo(5, 12) // √(9 + 16)
    expect(b.rows[1].contribution).toBeCloseTo(4, 12)
  })
  it('gives zero for an empty budget and rejects a nameless contribution with a RangeError', () => {
    expect(combineUncertainty({ contributions: [] }).combinedStandardUncertainty).toBe(0)
    expect(() => combineUncertainty({ contributions: [{ distribution: { kind: 'standard', standardUncertainty: 1 } } as never] })).toThrow(RangeError)
  })
})

describe('expandedFromStandard', () => {
  it('is the inverse of the normal divisor: U = k·u (GUM §6.2 [D])', () => {
    const u = standardUncertainty({ kind: 'normal', expandedUncertainty: 1.7, coverageFactor: 2 })
    expect(expandedFromStandard({ standardUncertainty: u })).toBeCloseTo(1.7, 12)
  })
})
