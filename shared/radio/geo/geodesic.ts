/**
 * Geodesic distance and bearing on the WGS84 ellipsoid.
 *
 * Method: C. F. F. Karney, "Algorithms for geodesics", J. Geodesy 87 (2013) 43–55, through the
 * npm package geographiclib-geodesic 2.2.0 (Geodesic.WGS84.Inverse / Direct), accurate to
 * about 15 nm. Ellipsoid: WGS84, a = 6 378 137 m, f = 1/298.257223563 (NIMA TR8350.2 §3).
 * Bearings are degrees clockwise from true north.
 */
import geographiclib from 'geographiclib-geodesic'
import { requireFinite, requireInRange, requireNonNegative } from '../guards'
import type { MethodRef } from '../types'

export const GEODESIC_METHOD: MethodRef = {
  id: 'geodesic-wgs84',
  source: 'C. F. F. Karney, Algorithms for geodesics, J. Geodesy 87 (2013) 43–55; WGS84 (NIMA TR8350.2 §3); npm geographiclib-geodesic 2.2.0',
}

const WGS84 = geographiclib.Geodesic.WGS84
const DISTANCE_AND_AZIMUTHS = geographiclib.Geodesic.STANDARD
const LONG_UNROLL = geographiclib.Geodesic.LONG_UNROLL

/** A point on the ellipsoid in degrees. */
export interface GeoPoint {
  latDeg: number
  lonDeg: number
}

/** Throws RangeError unless lat ∈ [−90, 90] and lon ∈ [−180, 180]. */
export function requireGeoPoint(name: string, point: GeoPoint): GeoPoint {
  if (!point || typeof point !== 'object') throw new RangeError(`${name} must be a point {latDeg, lonDeg}.`)
  requireInRange(`${name}.latDeg`, point.latDeg, -90, 90, '°')
  requireInRange(`${name}.lonDeg`, point.lonDeg, -180, 180, '°')
  return point
}

export interface GeodesicInverseResult {
  distanceM: number
  /** Azimuth of the geodesic at the start, degrees clockwise from north, (−180, 180]. */
  initialBearingDeg: number
  /** Azimuth of the geodesic at the end (direction of travel), degrees clockwise from north. */
  finalBearingDeg: number
  method: MethodRef
}

/** Inverse problem: distance and bearings between two points. */
export function geodesicInverse(opts: { from: GeoPoint; to: GeoPoint }): GeodesicInverseResult {
  requireGeoPoint('from', opts.from)
  requireGeoPoint('to', opts.to)
  const r = WGS84.Inverse(opts.from.latDeg, opts.from.lonDeg, opts.to.latDeg, opts.to.lonDeg, DISTANCE_AND_AZIMUTHS)
  return {
    distanceM: r.s12 as number,
    initialBearingDeg: r.azi1 as number,
    finalBearingDeg: r.azi2 as number,
    method: GEODESIC_METHOD,
  }
}

export interface GeodesicDirectResult extends GeoPoint {
  finalBearingDeg: number
  method: MethodRef
}

/** Direct problem: the point reached from a start along a bearing for a distance. */
export function geodesicDirect(opts: { from: GeoPoint; bearingDeg: number; distanceM: number }): GeodesicDirectResult {
  requireGeoPoint('from', opts.from)
  requireFinite('bearingDeg', opts.bearingDeg)
  requireNonNegative('distanceM', opts.distanceM)
  const r = WGS84.Direct(opts.from.latDeg, opts.from.lonDeg, opts.bearingDeg, opts.distanceM, DISTANCE_AND_AZIMUTHS | LONG_UNROLL)
  return {
    latDeg: r.lat2 as number,
    lonDeg: normalizeLonDeg(r.lon2 as number),
    finalBearingDeg: r.azi2 as number,
    method: GEODESIC_METHOD,
  }
}

/** Wraps a longitude into [−180, 180). */
export function normalizeLonDeg(lonDeg: number): number {
  const x = ((((lonDeg + 180) % 360) + 360) % 360) - 180
  return x
}
