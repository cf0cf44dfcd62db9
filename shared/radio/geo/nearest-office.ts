/**
 * Routes a report to the office nearest its location by geodesic distance (WGS84).
 * Method: geodesic inverse problem, see geodesic.ts (Karney 2013, geographiclib-geodesic 2.2.0).
 */
import { requireNonEmpty } from '../guards'
import type { MethodRef } from '../types'
import { GEODESIC_METHOD, geodesicInverse, requireGeoPoint, type GeoPoint } from './geodesic'

export interface OfficeLocation extends GeoPoint {
  id: string
}

export interface NearestOfficeResult {
  id: string
  distanceM: number
  method: MethodRef
}

/**
 * The office with the smallest geodesic distance to the point.
 * Ties go to the office listed first, so the answer never depends on floating-point order.
 */
export function nearestOffice(opts: { point: GeoPoint; offices: OfficeLocation[] }): NearestOfficeResult {
  requireGeoPoint('point', opts.point)
  requireNonEmpty('offices', opts.offices)
  let best: NearestOfficeResult | undefined
  opts.offices.forEach((office, i) => {
    if (typeof office.id !== 'string' || office.id === '') throw new RangeError(`offices[${i}].id must be a non-empty string.`)
    const { distanceM } = geodesicInverse({ from: opts.point, to: requireGeoPoint(`offices[${i}]`, office) })
    if (!best || distanceM < best.distanceM) best = { id: office.id, distanceM, method: GEODESIC_METHOD }
  })
  return best as NearestOfficeResult
}
