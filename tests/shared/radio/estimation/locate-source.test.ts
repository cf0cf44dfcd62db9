import { describe, expect, it } from 'vitest'
import geographiclib from 'geographiclib-geodesic'
import { levenbergMarquardt as referenceLm } from 'ml-levenberg-marquardt'
import { CHI_SQUARE_2DOF_95, confidenceEllipse, locateSource, type BearingObservation, type LevelObservation, type SourceLocation } from '../../../../shared/radio/estimation'
import { createNormalSource, createUniformSource } from '../../../../shared/radio/uncertainty'

// Synthetic truth is built with GeographicLib directly (geodesic distances and azimuths on WGS84),
// not with the locator's own tangent plane, so the plane approximation is tested too.
const WGS84 = geographiclib.Geodesic.WGS84
const FREQ_HZ = 900e6
const L0 = 20 * Math.log10((4 * Math.PI * 1 * FREQ_HZ) / 299_792_458) // ITU-R P.525-4, register §1 exact free space at d0 = 1 m [D]

interface Scenario { source: { latDeg: number; lonDeg: number }; eirpDbm: number; exponent: number }

function around(src: { latDeg: number; lonDeg: number }, bearingDeg: number, distanceM: number) {
  const r = WGS84.Direct(src.latDeg, src.lonDeg, bearingDeg, distanceM)
  return { latDeg: r.lat2 as number, lonDeg: r.lon2 as number }
}

function levelsFor(s: Scenario, count: number, sigmaDb: number, seed: number): LevelObservation[] {
  const u = createUniformSource(seed)
  const z = createNormalSource(createUniformSource(seed + 7919))
  return Array.from({ length: count }, () => {
    const p = around(s.source, 360 * u(), 200 * 15 ** u()) // 200 m … 3 km, all round the source
    const d = WGS84.Inverse(p.latDeg, p.lonDeg, s.source.latDeg, s.source.lonDeg).s12 as number
    return { ...p, receivedPowerDbm: s.eirpDbm - L0 - 10 * s.exponent * Math.log10(d) + sigmaDb * z(), sigmaDb }
  })
}

function bearingsFor(s: Scenario, count: number, sigmaDeg: number, seed: number): BearingObservation[] {
  const u = createUniformSource(seed)
  const z = createNormalSource(createUniformSource(seed + 104729))
  return Array.from({ length: count }, (_, i) => {
    const p = around(s.source, (360 * i) / count + 40 * u(), 1000 + 4000 * u()) // stations spread round the source
    const az = WGS84.Inverse(p.latDeg, p.lonDeg, s.source.latDeg, s.source.lonDeg).azi1 as number
    return { ...p, bearingDeg: az + sigmaDeg * z(), sigmaDeg }
  })
}

/** Whether the truth lies inside the reported 95 % ellipse, using only its semi-axes and orientation. */
function insideEllipse(r: SourceLocation, truth: { latDeg: number; lonDeg: number }): boolean {
  const inv = WGS84.Inverse(r.latDeg, r.lonDeg, truth.latDeg, truth.lonDeg)
  const s = inv.s12 as number
  const az = ((inv.azi1 as number) * Math.PI) / 180
  const th = (r.ellipse95.orientationDeg * Math.PI) / 180
  const east = s * Math.sin(az)
  const north = s * Math.cos(az)
  const along = east * Math.sin(th) + north * Math.cos(th)
  const across = east * Math.cos(th) - north * Math.sin(th)
  return (along / r.ellipse95.semiMajorM) ** 2 + (across / r.ellipse95.semiMinorM) ** 2 <= 1
}

const SCENARIO: Scenario = { source: { latDeg: 47.2, lonDeg: 8.5 }, eirpDbm: 40, exponent: 2.8 }

describe('locateSource', () => {
  it('finds a noise-free source within 1 m, with its EIRP and exponent, from levels only', () => {
    const levels = levelsFor(SCENARIO, 12, 1e-9, 1).map((o) => ({ ...o, sigmaDb: 1 }))
    const r = locateSource({ levels, pathLoss: { freqHz: FREQ_HZ, refDistanceM: 1 } })
    const miss = WGS84.Inverse(r.value.latDeg, r.value.lonDeg, SCENARIO.source.latDeg, SCENARIO.source.lonDeg).s12 as number
    expect(r.value.converged).toBe(true)
    expect(miss).toBeLessThan(1)
    expect(Math.abs(r.value.eirpDbm! - 40)).toBeLessThan(0.01)
    expect(Math.abs(r.value.exponent! - 2.8)).toBeLessThan(0.001)
    expect(r.value.exponentFitted).toBe(true)
    expect(r.value.parameterNames).toEqual(['eastM', 'northM', 'eirpDbm', 'exponent'])
  })

  it('finds a noise-free source within 1 m from bearings only (true bearings from GeographicLib)', () => {
    const bearings = bearingsFor(SCENARIO, 4, 0, 2).map((o) => ({ ...o, sigmaDeg: 1 }))
    const r = locateSource({ bearings })
    const miss = WGS84.Inverse(r.value.latDeg, r.value.lonDeg, SCENARIO.source.latDeg, SCENARIO.source.lonDeg).s12 as number
    expect(miss).toBeLessThan(1)
    expect(r.value.eirpDbm).toBeUndefined()
    expect(r.value.startedFrom).toBe('bearing-intersection')
  })

  it('agrees with an independent objective (geodesic distances and azimuths) minimised by ml-levenberg-marquardt 5.1, within 1 m and 0.01 dB', () => {
    const levels = levelsFor(SCENARIO, 10, 4, 3)
    const bearings = bearingsFor(SCENARIO, 3, 3, 4)
    const r = locateSource({ levels, bearings, pathLoss: { freqHz: FREQ_HZ, refDistanceM: 1 } })
    const o = r.value.origin
    const obs = [...levels.map((l) => l.receivedPowerDbm / l.sigmaDb), ...bearings.map((b) => b.bearingDeg / b.sigmaDeg)]
    const model = ([e, n, eirp, k]: number[]) => {
      const s = Math.hypot(e, n)
      const src = s === 0 ? o : around(o, (Math.atan2(e, n) * 180) / Math.PI, s)
      return (i: number) => {
        if (i < levels.length) {
          const l = levels[i]
          const d = WGS84.Inverse(l.latDeg, l.lonDeg, src.latDeg, src.lonDeg).s12 as number
          return (eirp - L0 - 10 * k * Math.log10(d)) / l.sigmaDb
        }
        const b = bearings[i - levels.length]
        let az = WGS84.Inverse(b.latDeg, b.lonDeg, src.latDeg, src.lonDeg).azi1 as number
        az += 360 * Math.round((b.bearingDeg - az) / 360) // unwrap near the observation
        return az / b.sigmaDeg
      }
    }
    const ref = referenceLm(
      { x: obs.map((_, i) => i), y: obs },
      model,
      { initialValues: [r.value.eastM + 30, r.value.northM - 20, r.value.eirpDbm! + 1, r.value.exponent! + 0.1], maxIterations: 500, errorTolerance: 1e-12, centralDifference: true, gradientDifference: [0.5, 0.5, 0.001, 0.0001], improvementThreshold: 1e-6 },
    )
    const [e, n, eirp] = ref.parameterValues
    expect(Math.hypot(e - r.value.eastM, n - r.value.northM)).toBeLessThan(1)
    expect(Math.abs(eirp - r.value.eirpDbm!)).toBeLessThan(0.01)
  })

  for (const mode of ['levels only', 'bearings only', 'levels and bearings'] as const) {
    it(`puts the synthetic source inside its 95 % ellipse in at least 90 % of 200 seeded trials (${mode})`, () => {
      let inside = 0
      let converged = 0
      for (let t = 0; t < 200; t++) {
        const levels = mode === 'bearings only' ? undefined : levelsFor(SCENARIO, mode === 'levels only' ? 20 : 12, 4, 10_000 + t)
        const bearings = mode === 'levels only' ? undefined : bearingsFor(SCENARIO, mode === 'bearings only' ? 5 : 3, 3, 20_000 + t)
        const r = locateSource({ levels, bearings, pathLoss: { freqHz: FREQ_HZ, refDistanceM: 1 } })
        if (r.value.converged) converged++
        if (insideEllipse(r.value, SCENARIO.source)) inside++
      }
      expect(converged).toBe(200)
      expect(inside / 200).toBeGreaterThanOrEqual(0.9)
    })
  }

  it('uses a given exponent instead of fitting it', () => {
    const r = locateSource({ levels: levelsFor(SCENARIO, 8, 3, 5), pathLoss: { freqHz: FREQ_HZ, exponent: 2.8 } })
    expect(r.value.exponentFitted).toBe(false)
    expect(r.value.exponent).toBe(2.8)
    expect(r.value.parameterNames).toEqual(['eastM', 'northM', 'eirpDbm'])
  })

  it('warns of poor geometry when all bearings come from nearly one direction', () => {
    const stations = [0, 1, 2].map((i) => around(SCENARIO.source, 180 + i * 2, 3000 + i * 500))
    const bearings = stations.map((p) => ({ ...p, bearingDeg: WGS84.Inverse(p.latDeg, p.lonDeg, SCENARIO.source.latDeg, SCENARIO.source.lonDeg).azi1 as number, sigmaDeg: 2 }))
    const r = locateSource({ bearings })
    expect(r.warnings.join(' ')).toMatch(/Poor geometry/)
  })

  it('warns when there is no redundancy, and when the residuals exceed the stated σ', () => {
    const exact = locateSource({ bearings: bearingsFor(SCENARIO, 2, 0, 6).map((o) => ({ ...o, sigmaDeg: 1 })) })
    expect(exact.warnings.join(' ')).toMatch(/no redundancy/)
    const noisy = bearingsFor(SCENARIO, 8, 10, 7).map((o) => ({ ...o, sigmaDeg: 0.5 })) // σ understated 20×
    expect(locateSource({ bearings: noisy }).warnings.join(' ')).toMatch(/larger than the stated σ/)
  })

  it('rejects fewer observations than unknowns, a latitude out of range, NaN, a zero σ and levels without a reference loss with a RangeError', () => {
    const lv = levelsFor(SCENARIO, 3, 1, 8)
    expect(() => locateSource({ levels: lv, pathLoss: { freqHz: FREQ_HZ } })).toThrow(RangeError) // 3 < 4 unknowns
    expect(() => locateSource({ bearings: bearingsFor(SCENARIO, 1, 1, 9) })).toThrow(RangeError)
    expect(() => locateSource({})).toThrow(RangeError)
    expect(() => locateSource({ levels: [...lv, { ...lv[0], latDeg: 91 }], pathLoss: { freqHz: FREQ_HZ } })).toThrow(RangeError)
    expect(() => locateSource({ levels: [...lv, { ...lv[0], receivedPowerDbm: Number.NaN }], pathLoss: { freqHz: FREQ_HZ } })).toThrow(RangeError)
    expect(() => locateSource({ levels: [...lv, { ...lv[0], sigmaDb: 0 }], pathLoss: { freqHz: FREQ_HZ } })).toThrow(RangeError)
    expect(() => locateSource({ levels: [...lv, lv[0]] })).toThrow(RangeError)
  })

  it('rejects bearings that are all parallel from one spot as singular geometry (RangeError)', () => {
    const p = { latDeg: 47.2, lonDeg: 8.5 }
    expect(() => locateSource({ bearings: [{ ...p, bearingDeg: 10, sigmaDeg: 1 }, { ...p, bearingDeg: 10, sigmaDeg: 1 }] })).toThrow(RangeError)
  })
})

describe('confidenceEllipse', () => {
  it('uses χ²(2 dof, 95 %) = 5.991 (−2 ln 0.05 [D]; NIST e-Handbook §1.3.6.7.4 table)', () => {
    expect(CHI_SQUARE_2DOF_95).toBeCloseTo(5.991, 3)
  })
  it('points the major axis east (90°) for a larger east variance and north (0°) for a larger north variance', () => {
    const east = confidenceEllipse({ covariance: [[9, 0], [0, 4]] })
    expect(east.orientationDeg).toBeCloseTo(90, 9)
    expect(east.semiMajorM).toBeCloseTo(Math.sqrt(5.991464547107979 * 9), 9)
    expect(east.semiMinorM).toBeCloseTo(Math.sqrt(5.991464547107979 * 4), 9)
    expect(confidenceEllipse({ covariance: [[4, 0], [0, 9]] }).orientationDeg).toBeCloseTo(0, 9)
  })
  it('points the major axis north-east (45°) for equal variances and a positive east–north covariance', () => {
    expect(confidenceEllipse({ covariance: [[5, 3], [3, 5]] }).orientationDeg).toBeCloseTo(45, 9)
  })
})
