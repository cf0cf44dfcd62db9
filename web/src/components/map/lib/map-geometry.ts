/**
 * The map's geometry, computed on the WGS84 ellipsoid with the radio library (shared/radio/geo),
 * then handed to Leaflet as latitude/longitude vertices. Pure: no DOM, no Leaflet.
 */
import { createLocalTangentPlane, geodesicDirect } from '@shared/radio/geo'
import type { AreaGeometry } from '@shared/schemas/region'
import type { FieldMapProps, MapEllipse, MapPoint } from '../map-types'
import { boxOfGeometries, type GeoBox } from './map-box'

/** Four decimals of a degree ≈ 11 m: finer than a click can aim. */
export function round4(x: number): number {
  return Math.round(x * 1e4) / 1e4
}

/**
 * A bearing line as vertices along the geodesic from `from` (true bearing, degrees clockwise
 * from north) for `lengthM`: `segments` + 1 points, each reached by the direct geodesic
 * problem, so the drawn line follows the geodesic on the Mercator map within the segment length.
 */
export function bearingLine(options: { from: MapPoint; bearingDeg: number; lengthM: number; segments?: number }): MapPoint[] {
  const { from, bearingDeg, lengthM, segments = 16 } = options
  if (!(lengthM >= 0)) throw new RangeError('lengthM must be zero or more.')
  const out: MapPoint[] = [{ latDeg: from.latDeg, lonDeg: from.lonDeg }]
  for (let i = 1; i <= segments; i++) {
    const p = geodesicDirect({ from, bearingDeg, distanceM: (lengthM * i) / segments })
    out.push({ latDeg: p.latDeg, lonDeg: p.lonDeg })
  }
  return out
}

/**
 * The 95 % ellipse as a closed ring of `vertices` points on the ground: on the local tangent
 * plane about the centre (azimuthal equidistant, where true north is the plane's north axis at
 * the origin), P(t) = a·cos t·u + b·sin t·v with u = (sin θ, cos θ) along the major axis
 * (θ = orientationDeg clockwise from north) and v = (cos θ, −sin θ) square to it [D], each
 * point carried back to latitude/longitude. The first point (t = 0) lies on the major axis.
 */
export function ellipseRing(options: { centre: MapPoint; ellipse: MapEllipse; vertices?: number }): MapPoint[] {
  const { centre, ellipse, vertices = 72 } = options
  const { semiMajorM: a, semiMinorM: b, orientationDeg } = ellipse
  if (!(a >= 0 && b >= 0) || !Number.isFinite(orientationDeg)) throw new RangeError('The ellipse needs semi-axes ≥ 0 m and a finite orientation.')
  const plane = createLocalTangentPlane({ origin: centre })
  const th = (orientationDeg * Math.PI) / 180
  const u = { e: Math.sin(th), n: Math.cos(th) }
  const v = { e: Math.cos(th), n: -Math.sin(th) }
  const ring: MapPoint[] = []
  for (let i = 0; i < vertices; i++) {
    const t = (2 * Math.PI * i) / vertices
    const ca = a * Math.cos(t)
    const sb = b * Math.sin(t)
    const p = plane.fromEnu({ eastM: ca * u.e + sb * v.e, northM: ca * u.n + sb * v.n })
    ring.push({ latDeg: p.latDeg, lonDeg: p.lonDeg })
  }
  return ring
}

/** Longest step [°] of a drawn edge: finer than a map pixel at the zooms the areas are read at. */
export const EDGE_STEP_DEG = 0.02

/**
 * A ring's edges as the routing reads them — straight in longitude and latitude — split into
 * steps of at most EDGE_STEP_DEG, so that Leaflet (which draws straight in Web Mercator) shows
 * the same border: on a long diagonal edge the two differ by a few hundred metres at 48° N.
 */
export function densifyRing(ring: [number, number][]): [number, number][] {
  const out: [number, number][] = []
  ring.forEach(([lat, lon], i) => {
    const next = ring[i + 1]
    out.push([lat, lon])
    if (!next) return
    const steps = Math.ceil(Math.max(Math.abs(next[0] - lat), Math.abs(next[1] - lon)) / EDGE_STEP_DEG)
    for (let k = 1; k < steps; k++) out.push([lat + ((next[0] - lat) * k) / steps, lon + ((next[1] - lon) * k) / steps])
  })
  return out
}

/** A Polygon or MultiPolygon as Leaflet's nesting: polygons → rings → [lat, lon], edges densified (densifyRing). */
export function areaLatLngs(area: AreaGeometry): [number, number][][][] {
  const polygons = area.type === 'Polygon' ? [area.coordinates] : area.coordinates
  return polygons.map((rings) => rings.map((ring) => densifyRing(ring.map(([lonDeg, latDeg]) => [latDeg!, lonDeg!] as [number, number]))))
}

type Layers = Pick<FieldMapProps, 'victim' | 'measurements' | 'bearings' | 'estimatedSource' | 'candidateStations' | 'nearbyCases'> & {
  offices?: { at: MapPoint; area?: AreaGeometry | null }[]
}

const asPoint = (p: MapPoint) => ({ type: 'Point', coordinates: [p.lonDeg, p.latDeg] })

/**
 * The box the map fits on first show: every drawn layer (bearing lines to their far ends, the
 * ellipse to its edge, offices' areas), widened by 10 % and to at least 0.01° (≈ 1 km), or
 * null when no layer holds a position. `extra` adds geometries (the region's outline).
 */
export function contentBox(layers: Layers, extra: { type: string; coordinates: unknown }[] = []): GeoBox | null {
  const g: { type: string; coordinates: unknown }[] = [...extra]
  if (layers.victim) g.push(asPoint(layers.victim.at))
  for (const m of layers.measurements ?? []) g.push(asPoint(m.at))
  for (const b of layers.bearings ?? []) g.push(...bearingLine({ ...b, segments: 4 }).map(asPoint))
  if (layers.estimatedSource) {
    g.push(asPoint(layers.estimatedSource.at))
    const e = layers.estimatedSource.ellipse
    if (e) g.push(...ellipseRing({ centre: layers.estimatedSource.at, ellipse: e, vertices: 16 }).map(asPoint))
  }
  for (const s of layers.candidateStations ?? []) g.push(asPoint(s.at))
  for (const c of layers.nearbyCases ?? []) g.push(asPoint(c.at))
  for (const o of layers.offices ?? []) g.push(o.area ?? asPoint(o.at))
  return boxOfGeometries(g, { marginFraction: 0.1, minSpanDeg: 0.01 })
}
