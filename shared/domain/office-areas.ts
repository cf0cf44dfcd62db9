/**
 * Office areas: reading one from a GeoJSON file, checking its outline, measuring it, and
 * choosing the office a report goes to. Isomorphic: the office editor checks as the
 * administrator draws, the server checks again before saving and routes reports with the same
 * rule. Geometry is GeoJSON (RFC 7946: [longitude, latitude] in degrees, WGS 84).
 */
import { area as turfAreaM2 } from '@turf/area'
import { booleanPointInPolygon } from '@turf/boolean-point-in-polygon'
import { featureCollection, feature } from '@turf/helpers'
import { intersect } from '@turf/intersect'
import { kinks } from '@turf/kinks'
import { areaSchema, type AreaGeometry } from '../schemas/region'
import { nearestOffice, type NearestOfficeResult, type OfficeLocation } from '../radio/geo/nearest-office'

export interface AreaPoint {
  latDeg: number
  lonDeg: number
}

const GEOMETRY_WORDS: Record<string, string> = {
  Point: 'a Point',
  MultiPoint: 'a MultiPoint',
  LineString: 'a LineString',
  MultiLineString: 'a MultiLineString',
  GeometryCollection: 'a GeometryCollection',
}
const notAnArea = (what: string) => `The file holds ${what}; an office area must be a Polygon or MultiPolygon.`

/** The geometry a GeoJSON value holds: a geometry itself, a Feature, or a FeatureCollection of exactly one. */
function geometryOf(value: unknown): { geometry: unknown } | { error: string } {
  if (typeof value !== 'object' || value === null || !('type' in value)) return { error: 'The file is not GeoJSON (no "type" at its top).' }
  const v = value as { type: unknown; geometry?: unknown; features?: unknown }
  if (v.type === 'Feature') return geometryOf(v.geometry)
  if (v.type === 'FeatureCollection') {
    const features = Array.isArray(v.features) ? v.features : []
    if (features.length !== 1) return { error: `The file holds ${features.length} features; give exactly one, the office's area.` }
    return geometryOf(features[0])
  }
  if (v.type === 'Polygon' || v.type === 'MultiPolygon') return { geometry: value }
  return { error: notAnArea(GEOMETRY_WORDS[String(v.type)] ?? `a "${String(v.type)}"`) }
}

/** Reads an uploaded or pasted GeoJSON text into an office area, or says plainly what is wrong. */
export function areaFromGeoJsonText(text: string): { area: AreaGeometry } | { error: string } {
  let value: unknown
  try {
    value = JSON.parse(text)
  } catch {
    return { error: 'The file is not valid JSON, so it cannot be GeoJSON.' }
  }
  const found = geometryOf(value)
  if ('error' in found) return found
  const parsed = areaSchema.safeParse(found.geometry)
  if (!parsed.success) return { error: `The polygon is not valid GeoJSON: ${parsed.error.issues[0]?.message ?? 'check its coordinates'}. Each ring is a closed list of [longitude, latitude] positions (at least four, the last equal to the first).` }
  return { area: parsed.data }
}

/** Points where the outline's edges cross one another (none: the outline is simple). */
export function selfCrossings(area: AreaGeometry): AreaPoint[] {
  return kinks(area).features.map((f) => ({ lonDeg: f.geometry.coordinates[0]!, latDeg: f.geometry.coordinates[1]! }))
}

/** Formats a point as "48.12° N, 31.40° W" for messages. */
export function pointWords(p: AreaPoint): string {
  return `${Math.abs(p.latDeg).toFixed(2)}° ${p.latDeg >= 0 ? 'N' : 'S'}, ${Math.abs(p.lonDeg).toFixed(2)}° ${p.lonDeg >= 0 ? 'E' : 'W'}`
}

export function selfCrossingMessage(crossings: AreaPoint[]): string {
  return `The outline crosses itself near ${pointWords(crossings[0]!)}${crossings.length > 1 ? ` (and ${crossings.length - 1} more place${crossings.length > 2 ? 's' : ''})` : ''}; move the corners so no two edges cross.`
}

/** The area's size [km²] on a sphere of the mean Earth radius (turf's area; within 1 % of the WGS84 ellipsoid). */
export function areaKm2(area: AreaGeometry): number {
  return turfAreaM2(area) / 1e6
}

/** The size [km²] two areas share, 0 when they do not overlap (edges touching is not an overlap). */
export function overlapKm2(a: AreaGeometry, b: AreaGeometry): number {
  const shared = intersect(featureCollection([feature(a), feature(b)]))
  return shared ? turfAreaM2(shared) / 1e6 : 0
}

export const containsPoint = (area: AreaGeometry, p: AreaPoint): boolean => booleanPointInPolygon([p.lonDeg, p.latDeg], area)

/** An outline drawn corner by corner on the map, closed into a Polygon. */
export function areaFromVertices(vertices: AreaPoint[]): AreaGeometry {
  const ring = vertices.map((v) => [v.lonDeg, v.latDeg] as [number, number])
  return { type: 'Polygon', coordinates: [[...ring, ring[0]!]] }
}

/** The corners of a single-ring Polygon, for editing on the map; null for a MultiPolygon or a Polygon with holes. */
export function verticesOfArea(area: AreaGeometry): AreaPoint[] | null {
  if (area.type !== 'Polygon' || area.coordinates.length !== 1) return null
  const ring = area.coordinates[0]!
  return ring.slice(0, -1).map(([lonDeg, latDeg]) => ({ latDeg: latDeg!, lonDeg: lonDeg! }))
}

/**
 * Why a report went to its office:
 * - `inside_area`: the place lies in that office's area alone;
 * - `inside_overlap`: it lies in several offices' areas (they overlap); the nearest of those takes it;
 * - `outside_areas`: it lies in no area although some offices have one; the nearest office takes
 *   it and the case carries a warning;
 * - `no_areas`: no office has an area yet; the nearest office takes it (nothing to warn about).
 */
export type RoutingBasis = 'inside_area' | 'inside_overlap' | 'outside_areas' | 'no_areas'

export interface RoutableOffice extends OfficeLocation {
  area: AreaGeometry | null
}

export interface ReportRouting extends NearestOfficeResult {
  basis: RoutingBasis
  /** Offices whose areas hold the place (several only in an overlap). */
  holderIds: string[]
}

/** The office a report at `point` goes to, and why (the rule above). Distances are geodesic (WGS 84). */
export function routeReport(point: AreaPoint, offices: RoutableOffice[]): ReportRouting {
  const holders = offices.filter((o) => o.area && containsPoint(o.area, point))
  const candidates = holders.length > 0 ? holders : offices
  const nearest = nearestOffice({ point, offices: candidates.map(({ id, latDeg, lonDeg }) => ({ id, latDeg, lonDeg })) })
  const basis: RoutingBasis = holders.length === 1 ? 'inside_area' : holders.length > 1 ? 'inside_overlap' : offices.some((o) => o.area) ? 'outside_areas' : 'no_areas'
  return { ...nearest, basis, holderIds: holders.map((o) => o.id) }
}

export interface AreaNeighbour {
  id: string
  name: string
  area: AreaGeometry | null
}

/** Overlaps smaller than this [km²] are slivers from drawing two borders by hand, not worth a warning (common practice, no source). */
export const OVERLAP_WARNING_MIN_KM2 = 0.01

/**
 * What to warn about before an area is saved (it is saved all the same): overlaps with other
 * offices' areas, saying which report goes where, and an office position outside its own area.
 */
export function areaWarnings(opts: { officeName: string; area: AreaGeometry; position?: AreaPoint; others: AreaNeighbour[] }): AreaWarningDraft[] {
  const warnings: AreaWarningDraft[] = []
  for (const other of opts.others) {
    if (!other.area) continue
    const km2 = overlapKm2(opts.area, other.area)
    if (km2 < OVERLAP_WARNING_MIN_KM2) continue
    warnings.push({
      code: 'area_overlaps',
      otherOfficeId: other.id,
      otherOfficeName: other.name,
      overlapKm2: Math.round(km2 * 100) / 100,
      message: `Overlaps ${other.name}'s area by ${formatKm2(km2)}. A report filed in the overlap goes to whichever of ${opts.officeName} and ${other.name} is nearer to the place; elsewhere each area keeps its own reports.`,
    })
  }
  if (opts.position && !containsPoint(opts.area, opts.position)) {
    warnings.push({
      code: 'position_outside_area',
      message: `The office's position (${pointWords(opts.position)}) lies outside its own area. Reports are routed by the area all the same; check the position if this is a mistake.`,
    })
  }
  return warnings
}

export interface AreaWarningDraft {
  code: 'area_overlaps' | 'position_outside_area'
  message: string
  otherOfficeId?: string
  otherOfficeName?: string
  overlapKm2?: number
}

/** "12.4 km²", "0.35 km²", "1,250 km²". */
export function formatKm2(km2: number): string {
  const digits = km2 < 1 ? 2 : km2 < 100 ? 1 : 0
  return `${km2.toLocaleString('en-GB', { minimumFractionDigits: digits, maximumFractionDigits: digits })} km²`
}
