import { describe, expect, it } from 'vitest'
import geographiclib from 'geographiclib-geodesic'
import {
  areaFromGeoJsonText,
  areaFromVertices,
  areaKm2,
  areaWarnings,
  overlapKm2,
  routeReport,
  selfCrossingMessage,
  selfCrossings,
  verticesOfArea,
  type AreaPoint,
} from '../../../shared/domain/office-areas'
import { MAX_AREA_CORNERS, officeAreaSchema, officeInputSchema } from '../../../shared/schemas/offices'
import type { AreaGeometry } from '../../../shared/schemas/region'

/** A lat/lon box as a Polygon (corners counter-clockwise, as RFC 7946 asks of outer rings). */
const box = (south: number, west: number, north: number, east: number): AreaGeometry => ({
  type: 'Polygon',
  coordinates: [[[west, south], [east, south], [east, north], [west, north], [west, south]]],
})
const bowtie: AreaGeometry = { type: 'Polygon', coordinates: [[[10, 60], [11, 61], [11, 60], [10, 61], [10, 60]]] }

describe('reading an office area from a GeoJSON file', () => {
  it('takes a Polygon, a Feature holding one, or a FeatureCollection of exactly one', () => {
    const polygon = box(60, 10, 61, 11)
    expect(areaFromGeoJsonText(JSON.stringify(polygon))).toEqual({ area: polygon })
    expect(areaFromGeoJsonText(JSON.stringify({ type: 'Feature', properties: {}, geometry: polygon }))).toEqual({ area: polygon })
    expect(areaFromGeoJsonText(JSON.stringify({ type: 'FeatureCollection', features: [{ type: 'Feature', properties: { name: 'North' }, geometry: polygon }] }))).toEqual({ area: polygon })
    const multi = { type: 'MultiPolygon', coordinates: [polygon.coordinates] }
    expect(areaFromGeoJsonText(JSON.stringify(multi))).toEqual({ area: multi })
  })

  it('refuses what is not a polygon, saying what the file holds', () => {
    expect(areaFromGeoJsonText(JSON.stringify({ type: 'LineString', coordinates: [[10, 60], [11, 61]] }))).toEqual({ error: 'The file holds a LineString; an office area must be a Polygon or MultiPolygon.' })
    expect(areaFromGeoJsonText(JSON.stringify({ type: 'Feature', properties: {}, geometry: { type: 'Point', coordinates: [10, 60] } }))).toEqual({ error: 'The file holds a Point; an office area must be a Polygon or MultiPolygon.' })
    expect(areaFromGeoJsonText(JSON.stringify({ type: 'FeatureCollection', features: [] }))).toEqual({ error: "The file holds 0 features; give exactly one, the office's area." })
    expect(areaFromGeoJsonText('{ not json')).toEqual({ error: 'The file is not valid JSON, so it cannot be GeoJSON.' })
    expect(areaFromGeoJsonText('[1, 2]')).toEqual({ error: 'The file is not GeoJSON (no "type" at its top).' })
  })

  it('refuses a ring that is not closed', () => {
    const open = { type: 'Polygon', coordinates: [[[10, 60], [11, 60], [11, 61], [10, 61]]] }
    const r = areaFromGeoJsonText(JSON.stringify(open))
    expect('error' in r && r.error).toMatch(/^The polygon is not valid GeoJSON: /)
  })
})

describe('an outline that crosses itself', () => {
  it('is found where its edges cross, and refused by the office schema with that place in words', () => {
    // the bow tie's two diagonals cross at its centre (common practice, no source: plain geometry)
    const crossings = selfCrossings(bowtie)
    expect(crossings).toHaveLength(1)
    expect(crossings[0]!.latDeg).toBeCloseTo(60.5, 6)
    expect(crossings[0]!.lonDeg).toBeCloseTo(10.5, 6)
    expect(selfCrossingMessage(crossings)).toBe('The outline crosses itself near 60.50° N, 10.50° E; move the corners so no two edges cross.')
    const parsed = officeAreaSchema.safeParse(bowtie)
    expect(parsed.success).toBe(false)
    expect(parsed.error?.issues[0]?.message).toMatch(/^The outline crosses itself near 60.50° N/)
  })

  it('is not confused with a simple outline', () => {
    expect(selfCrossings(box(60, 10, 61, 11))).toEqual([])
    expect(officeAreaSchema.safeParse(box(60, 10, 61, 11)).success).toBe(true)
  })
})

describe('the size of an area', () => {
  const cells: [string, AreaGeometry][] = [
    ['a 1° cell on the equator', box(0, 10, 1, 11)],
    ['a 1° cell at 60° N', box(60, 10, 61, 11)],
    ['a 0.1° cell in the demo region', box(48, -31.5, 48.1, -31.4)],
  ]
  // Reference 1: the area of a latitude–longitude cell on a sphere, A = R²·Δλ·(sin φ2 − sin φ1),
  // with the mean Earth radius R = 6 371 008.8 m (IUGG R1) — standard spherical geometry,
  // recalled from memory.
  const sphereKm2 = (a: AreaGeometry) => {
    const [[w, s], [e], [, n]] = a.coordinates[0] as number[][]
    const rad = Math.PI / 180
    return (6371008.8 ** 2 * (e! - w!) * rad * (Math.sin(n! * rad) - Math.sin(s! * rad))) / 1e6
  }
  it.each(cells)('%s agrees with the spherical cell formula within 0.05 %%', (_label, area) => {
    expect(Math.abs(areaKm2(area) - sphereKm2(area)) / sphereKm2(area)).toBeLessThan(0.0005)
  })

  // Reference 2: GeographicLib's geodesic polygon area on the WGS84 ellipsoid (Karney 2013,
  // npm geographiclib-geodesic 2.2.0, Geodesic.WGS84.Polygon). A sphere of the mean radius is
  // within 1 % of the ellipsoid at any latitude (0.3–0.6 % for these cells).
  const ellipsoidKm2 = (ring: number[][]) => {
    const p = geographiclib.Geodesic.WGS84.Polygon(false)
    for (const [lon, lat] of ring.slice(0, -1)) p.AddPoint(lat!, lon!)
    return Math.abs(p.Compute(false, true).area!) / 1e6
  }
  it.each(cells)('%s agrees with the ellipsoidal area within 1 %%', (_label, area) => {
    const reference = ellipsoidKm2(area.coordinates[0] as number[][])
    expect(Math.abs(areaKm2(area) - reference) / reference).toBeLessThan(0.01)
  })

  it('of an overlap is the shared part only, and zero for areas that merely touch', () => {
    // two 1° × 1° cells sharing half of one: the overlap is the 0.5° × 1° half
    const a = box(60, 10, 61, 11)
    const b = box(60, 10.5, 61, 11.5)
    expect(overlapKm2(a, b) / areaKm2(box(60, 10.5, 61, 11))).toBeCloseTo(1, 3)
    expect(overlapKm2(a, box(60, 11, 61, 12))).toBe(0)
  })
})

describe('routing a report by the offices’ areas', () => {
  const north = { id: 'north', latDeg: 60.9, lonDeg: 10.5, area: box(60, 10, 61, 11) }
  const south = { id: 'south', latDeg: 59.1, lonDeg: 10.5, area: box(59, 10, 60, 11) }
  const loose = { id: 'loose', latDeg: 60.2, lonDeg: 12, area: null }

  it('sends a report inside an area to that office, even when another office is nearer', () => {
    const place: AreaPoint = { latDeg: 60.2, lonDeg: 10.9 } // nearer to "loose" (about 60 km) than to "north" (about 80 km)
    const r = routeReport(place, [north, south, loose])
    expect(r).toMatchObject({ id: 'north', basis: 'inside_area', holderIds: ['north'] })
  })

  it('sends a report outside every area to the nearest office and says so', () => {
    const r = routeReport({ latDeg: 60.5, lonDeg: 13 }, [north, south, loose])
    expect(r).toMatchObject({ id: 'loose', basis: 'outside_areas', holderIds: [] })
  })

  it('sends a report in an overlap to the nearer of the offices whose areas hold it', () => {
    const wide = { id: 'wide', latDeg: 60.45, lonDeg: 10.5, area: box(59.5, 10, 60.5, 11) }
    const r = routeReport({ latDeg: 60.4, lonDeg: 10.5 }, [north, wide, loose])
    expect(r).toMatchObject({ id: 'wide', basis: 'inside_overlap' })
    expect(r.holderIds.sort()).toEqual(['north', 'wide'])
  })

  it('routes to the nearest office, with no warning, while no office has an area', () => {
    const r = routeReport({ latDeg: 60.5, lonDeg: 10.5 }, [{ ...north, area: null }, loose])
    expect(r).toMatchObject({ id: 'north', basis: 'no_areas' })
  })
})

describe('warnings before an area is saved', () => {
  it('names the office an area overlaps, by how much, and which report goes where', () => {
    const warnings = areaWarnings({ officeName: 'Fenwold', area: box(60, 10, 61, 11), position: { latDeg: 60.5, lonDeg: 10.5 }, others: [{ id: 'o2', name: 'Brackley', area: box(60.5, 10, 61.5, 11) }, { id: 'o3', name: 'Nowhere', area: null }] })
    expect(warnings).toHaveLength(1)
    expect(warnings[0]).toMatchObject({ code: 'area_overlaps', otherOfficeId: 'o2', otherOfficeName: 'Brackley' })
    expect(warnings[0]!.overlapKm2).toBeCloseTo(overlapKm2(box(60, 10, 61, 11), box(60.5, 10, 61.5, 11)), 1)
    expect(warnings[0]!.message).toMatch(/^Overlaps Brackley's area by [\d,.]+ km². A report filed in the overlap goes to whichever of Fenwold and Brackley is nearer to the place/)
  })

  it('warns when the office stands outside its own area', () => {
    const warnings = areaWarnings({ officeName: 'Fenwold', area: box(60, 10, 61, 11), position: { latDeg: 62, lonDeg: 10.5 }, others: [] })
    expect(warnings.map((w) => w.code)).toEqual(['position_outside_area'])
    expect(warnings[0]!.message).toContain('62.00° N, 10.50° E')
  })
})

describe('drawing an area corner by corner', () => {
  it('closes the ring, and gives the corners back for editing', () => {
    const corners = [{ latDeg: 60, lonDeg: 10 }, { latDeg: 60, lonDeg: 11 }, { latDeg: 61, lonDeg: 11 }]
    const area = areaFromVertices(corners)
    expect(area).toEqual({ type: 'Polygon', coordinates: [[[10, 60], [11, 60], [11, 61], [10, 60]]] })
    expect(verticesOfArea(area)).toEqual(corners)
    expect(verticesOfArea({ type: 'MultiPolygon', coordinates: [area.coordinates as never] })).toBeNull()
  })
})

describe('an office’s details', () => {
  const valid = { name: 'Fenwold Field Office', latDeg: 60.5, lonDeg: 10.5, timeZone: 'Europe/Oslo', area: box(60, 10, 61, 11) }

  it('are accepted with the time zone in its canonical spelling and empty optional words', () => {
    expect(officeInputSchema.parse({ ...valid, timeZone: 'europe/oslo' })).toEqual({ ...valid, regionName: '', address: '' })
  })

  it('refuse an unknown time zone, a position off the globe and a non-polygon area, each at its field', () => {
    const r = officeInputSchema.safeParse({ ...valid, timeZone: 'Mars/Olympus_Mons', latDeg: 91, area: { type: 'LineString', coordinates: [[10, 60], [11, 61]] } })
    expect(r.success).toBe(false)
    const byPath = Object.fromEntries(r.error!.issues.map((i) => [i.path.join('.'), i.message]))
    expect(byPath).toEqual({
      timeZone: 'Choose a time zone from the list (a name such as Atlantic/Azores).',
      latDeg: 'Latitude is between −90 and 90°.',
      'area.type': 'An area is a GeoJSON Polygon or MultiPolygon.',
    })
  })
})

describe('a very detailed outline', () => {
  it('is refused above the corner limit before its edges are checked', () => {
    const ring = Array.from({ length: MAX_AREA_CORNERS + 1 }, (_, i) => [10 + Math.cos((2 * Math.PI * i) / (MAX_AREA_CORNERS + 1)), 60 + Math.sin((2 * Math.PI * i) / (MAX_AREA_CORNERS + 1))])
    const r = officeAreaSchema.safeParse({ type: 'Polygon', coordinates: [[...ring, ring[0]]] })
    expect(r.success).toBe(false)
    expect(r.error!.issues[0]!.message).toBe('An office area has at most 2,000 corners; simplify the outline (e.g. to about 100 m) and try again.')
  })
})
