import { describe, expect, it } from 'vitest'
import geographiclib from 'geographiclib-geodesic'
import { createLocalTangentPlane, centroidOf, geodesicDirect, geodesicInverse, nearestOffice } from '../../../../shared/radio/geo'

// Check values: the team's check-value register, section 13 (geodesics) (tolerances: distance 1 mm, azimuth 1e-6°).
const INVERSE_ROWS = [
  { id: '13-1', from: { latDeg: -41.32, lonDeg: 174.81 }, to: { latDeg: 40.96, lonDeg: -5.5 }, s12: 19959679.26735382, tolM: 0.001, azi1: 161.06766998616, azi2: 18.82519512325, tolDeg: 1e-6,
    source: 'GeographicLib (Karney 2013), register 13-1 [V-S] GeographicLib JS README/tutorial and geodesic.py docstring (Wellington → Salamanca)' },
  { id: '13-2', from: { latDeg: 40.6, lonDeg: -73.8 }, to: { latDeg: 49.01666667, lonDeg: 2.55 }, s12: 5853226, tolM: 0.5, azi1: 53.47022, azi2: 111.59367, tolDeg: 1e-5,
    source: 'GeographicLib (Karney 2013), register 13-2 [V-S] geographiclib-js test/geodesictest.js "GeodSolve0" (JFK → CDG, 5853226 ± 0.5 m)' },
  { id: '13-4', from: { latDeg: 0, lonDeg: 0 }, to: { latDeg: 0, lonDeg: 0.01 }, s12: 1113.194908, tolM: 0.001, azi1: 90, azi2: 90, tolDeg: 1e-6,
    source: 'WGS84 equator s = a·Δλ, register 13-4 [D] analytic: along the equator s = a·Δλ' },
  { id: '13-5', from: { latDeg: 51.5, lonDeg: -0.12 }, to: { latDeg: 51.505, lonDeg: -0.11 }, s12: 889.721, tolM: 0.001, azi1: 51.29627, azi2: 51.30409, tolDeg: 1e-5,
    source: 'GeographicLib npm 2.2.0, register 13-5: computed with npm 2.2.0, not published (field scale)' },
  { id: '13-6', from: { latDeg: -33.8688, lonDeg: 151.2093 }, to: { latDeg: -33.86, lonDeg: 151.22 }, s12: 1390.335, tolM: 0.001, azi1: 45.41064, azi2: 45.40468, tolDeg: 1e-5,
    source: 'GeographicLib npm 2.2.0, register 13-6: computed with npm 2.2.0, not published (field scale)' },
]

describe('geodesicInverse', () => {
  for (const c of INVERSE_ROWS) {
    it(`matches ${c.source} within ${c.tolM} m and ${c.tolDeg}°`, () => {
      const r = geodesicInverse({ from: c.from, to: c.to })
      expect(Math.abs(r.distanceM - c.s12)).toBeLessThanOrEqual(c.tolM)
      expect(Math.abs(r.initialBearingDeg - c.azi1)).toBeLessThanOrEqual(c.tolDeg)
      expect(Math.abs(r.finalBearingDeg - c.azi2)).toBeLessThanOrEqual(c.tolDeg)
      expect(r.method.id).toBe('geodesic-wgs84')
    })
  }

  it('rejects latitudes outside [−90, 90] and longitudes outside [−180, 180] with a RangeError', () => {
    expect(() => geodesicInverse({ from: { latDeg: 90.5, lonDeg: 0 }, to: { latDeg: 0, lonDeg: 0 } })).toThrow(RangeError)
    expect(() => geodesicInverse({ from: { latDeg: 0, lonDeg: 0 }, to: { latDeg: -91, lonDeg: 0 } })).toThrow(RangeError)
    expect(() => geodesicInverse({ from: { latDeg: 0, lonDeg: 180.01 }, to: { latDeg: 0, lonDeg: 0 } })).toThrow(RangeError)
    expect(() => geodesicInverse({ from: { latDeg: Number.NaN, lonDeg: 0 }, to: { latDeg: 0, lonDeg: 0 } })).toThrow(RangeError)
  })
})

describe('geodesicDirect', () => {
  it('reaches Salamanca from Wellington with the published azimuth and distance (GeographicLib (Karney 2013), register 13-1 [V-S]) within 1e-8°', () => {
    const r = geodesicDirect({ from: { latDeg: -41.32, lonDeg: 174.81 }, bearingDeg: 161.06766998615987, distanceM: 19959679.26735382 })
    expect(Math.abs(r.latDeg - 40.96)).toBeLessThan(1e-8)
    expect(Math.abs(r.lonDeg - -5.5)).toBeLessThan(1e-8)
    expect(Math.abs(r.finalBearingDeg - 18.82519512325)).toBeLessThan(1e-6)
  })

  it('walks 1113.194908 m east along the equator to 0.01° (WGS84 equator s = a·Δλ, register 13-4 [D])', () => {
    const r = geodesicDirect({ from: { latDeg: 0, lonDeg: 0 }, bearingDeg: 90, distanceM: 1113.194908 })
    expect(Math.abs(r.lonDeg - 0.01)).toBeLessThan(1e-9)
    expect(Math.abs(r.latDeg)).toBeLessThan(1e-12)
  })

  it('rejects a negative distance with a RangeError', () => {
    expect(() => geodesicDirect({ from: { latDeg: 0, lonDeg: 0 }, bearingDeg: 0, distanceM: -1 })).toThrow(RangeError)
  })
})

describe('nearestOffice', () => {
  const offices = [
    { id: 'harbour-office', latDeg: 49.01666667, lonDeg: 2.55 },
    { id: 'southern-office', latDeg: -41.32, lonDeg: 174.81 },
  ]

  it('routes a point to the nearer office with the published geodesic distance (GeographicLib (Karney 2013), register 13-2 [V-S], 0.5 m)', () => {
    const r = nearestOffice({ point: { latDeg: 40.6, lonDeg: -73.8 }, offices })
    expect(r.id).toBe('harbour-office')
    expect(Math.abs(r.distanceM - 5853226)).toBeLessThanOrEqual(0.5)
  })

  it('finds the field-scale neighbour at 889.721 m (GeographicLib npm 2.2.0, register 13-5, computed with npm 2.2.0, not published)', () => {
    const r = nearestOffice({
      point: { latDeg: 51.5, lonDeg: -0.12 },
      offices: [{ id: 'far', latDeg: -33.86, lonDeg: 151.22 }, { id: 'near', latDeg: 51.505, lonDeg: -0.11 }],
    })
    expect(r.id).toBe('near')
    expect(Math.abs(r.distanceM - 889.721)).toBeLessThanOrEqual(0.001)
  })

  it('gives a tie to the office listed first', () => {
    const r = nearestOffice({ point: { latDeg: 0, lonDeg: 0 }, offices: [{ id: 'west', latDeg: 0, lonDeg: -0.01 }, { id: 'east', latDeg: 0, lonDeg: 0.01 }] })
    expect(r.id).toBe('west')
    expect(Math.abs(r.distanceM - 1113.194908)).toBeLessThanOrEqual(0.001) // WGS84 equator s = a·Δλ, register 13-4 [D]
  })

  it('rejects an empty office list, a bad office position and a bad point with a RangeError', () => {
    expect(() => nearestOffice({ point: { latDeg: 0, lonDeg: 0 }, offices: [] })).toThrow(RangeError)
    expect(() => nearestOffice({ point: { latDeg: 0, lonDeg: 0 }, offices: [{ id: 'x', latDeg: 95, lonDeg: 0 }] })).toThrow(RangeError)
    expect(() => nearestOffice({ point: { latDeg: 0, lonDeg: -181 }, offices })).toThrow(RangeError)
  })
})

describe('local tangent plane (azimuthal equidistant about an origin)', () => {
  it('puts a field-scale point at the geodesic distance and azimuth from the origin (GeographicLib npm 2.2.0, register 13-5, computed with npm 2.2.0, not published)', () => {
    const plane = createLocalTangentPlane({ origin: { latDeg: 51.5, lonDeg: -0.12 } })
    const p = plane.toEnu({ latDeg: 51.505, lonDeg: -0.11 })
    expect(Math.abs(Math.hypot(p.eastM, p.northM) - 889.721)).toBeLessThan(0.001)
    expect(Math.abs((Math.atan2(p.eastM, p.northM) * 180) / Math.PI - 51.29627)).toBeLessThan(1e-5)
  })

  it('maps 0.01° of equator to 1113.194908 m east (WGS84 equator s = a·Δλ, register 13-4 [D])', () => {
    const p = createLocalTangentPlane({ origin: { latDeg: 0, lonDeg: 0 } }).toEnu({ latDeg: 0, lonDeg: 0.01 })
    expect(Math.abs(p.eastM - 1113.194908)).toBeLessThan(0.001)
    expect(Math.abs(p.northM)).toBeLessThan(1e-6)
  })

  it('returns to the same point after toEnu then fromEnu (round trip within 1e-9°)', () => {
    const plane = createLocalTangentPlane({ origin: { latDeg: -33.8688, lonDeg: 151.2093 } })
    for (const q of [{ latDeg: -33.86, lonDeg: 151.22 }, { latDeg: -33.95, lonDeg: 151.1 }, { latDeg: -33.8688, lonDeg: 151.2093 }]) {
      const back = plane.fromEnu(plane.toEnu(q))
      expect(Math.abs(back.latDeg - q.latDeg)).toBeLessThan(1e-9)
      expect(Math.abs(back.lonDeg - q.lonDeg)).toBeLessThan(1e-9)
    }
  })

  it('keeps distances between off-origin points within 1e-4 of GeographicLib up to 20 km (field-scale validity)', () => {
    const origin = { latDeg: 60, lonDeg: 10 }
    const plane = createLocalTangentPlane({ origin })
    const a = { latDeg: 60.08, lonDeg: 10.2 }
    const b = { latDeg: 59.93, lonDeg: 9.85 }
    const pa = plane.toEnu(a)
    const pb = plane.toEnu(b)
    const reference = geographiclib.Geodesic.WGS84.Inverse(a.latDeg, a.lonDeg, b.latDeg, b.lonDeg).s12 as number
    expect(Math.abs(Math.hypot(pa.eastM - pb.eastM, pa.northM - pb.northM) / reference - 1)).toBeLessThan(1e-4)
  })

  it('converts a plane direction to the true bearing GeographicLib gives, within 0.01°, 10 km from the origin', () => {
    const origin = { latDeg: 60, lonDeg: 10 }
    const plane = createLocalTangentPlane({ origin })
    const station = { latDeg: 60.02, lonDeg: 10.18 }
    const target = { latDeg: 59.95, lonDeg: 10.05 }
    const s = plane.toEnu(station)
    const t = plane.toEnu(target)
    const planeDirDeg = (Math.atan2(t.eastM - s.eastM, t.northM - s.northM) * 180) / Math.PI
    const trueBearingDeg = planeDirDeg - plane.northOffsetDeg(station)
    const reference = geographiclib.Geodesic.WGS84.Inverse(station.latDeg, station.lonDeg, target.latDeg, target.lonDeg).azi1 as number
    expect(Math.abs(trueBearingDeg - reference)).toBeLessThan(0.01)
    expect(Math.abs(plane.northOffsetDeg(station))).toBeGreaterThan(0.1) // the correction matters here
  })

  it('centres points that straddle the ±180° meridian on the meridian', () => {
    const c = centroidOf([{ latDeg: 10, lonDeg: 179.9 }, { latDeg: 10, lonDeg: -179.9 }])
    expect(Math.abs(Math.abs(c.lonDeg) - 180)).toBeLessThan(1e-9)
    expect(() => centroidOf([])).toThrow(RangeError)
  })
})
