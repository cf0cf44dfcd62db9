/**
 * The field map's pure parts: the box it frames, what it reads from the region map, and the
 * geometry it draws on the ground (bearing lines, the 95 % ellipse).
 */
import { describe, expect, it } from 'vitest'
import { geodesicInverse } from '../../shared/radio/geo'
import type { RegionMap } from '../../shared/schemas/region'
import { boxOfGeometries, positionsOf } from '@/components/map/lib/map-box'
import { areaLatLngs, bearingLine, contentBox, densifyRing, EDGE_STEP_DEG, ellipseRing, round4 } from '@/components/map/lib/map-geometry'
import { regionMapData } from '@/components/map/lib/region-data'
import { escapeHtml } from '@/components/map/lib/symbols'
import { legendEntries } from '@/components/map/map-legend'
import { cite } from '../fixtures/radio/check-row'

/** A region outline like the demo's: the parallels 47.2° and 48.6° N, the meridians 32.2° and 29.8° W. */
const OUTLINE = { type: 'Polygon' as const, coordinates: [[[-32.2, 47.2], [-29.8, 47.2], [-29.8, 48.6], [-32.2, 48.6], [-32.2, 47.2]]] as [number, number][][] }
const BOX = { southDeg: 47.2, northDeg: 48.6, westDeg: -32.2, eastDeg: -29.8 }

describe('the map box, computed from GeoJSON', () => {
  it('is the outline’s extent', () => {
    expect(boxOfGeometries([OUTLINE])).toEqual(BOX)
  })

  it('takes every polygon of a MultiPolygon and every point into account', () => {
    const islands = { type: 'MultiPolygon', coordinates: [[[[10, 50], [11, 50], [11, 51], [10, 50]]], [[[12, 49], [13, 49], [13, 49.5], [12, 49]]]] }
    const lighthouse = { type: 'Point', coordinates: [9.5, 51.25] }
    expect(boxOfGeometries([islands, lighthouse])).toEqual({ southDeg: 49, northDeg: 51.25, westDeg: 9.5, eastDeg: 13 })
  })

  it('widens each side by the margin, and gives a single point the least span', () => {
    const box = boxOfGeometries([OUTLINE], { marginFraction: 0.1 })!
    expect(box.southDeg).toBeCloseTo(47.06, 12)
    expect(box.eastDeg).toBeCloseTo(-29.56, 12)
    expect(boxOfGeometries([{ type: 'Point', coordinates: [-30, 48] }], { minSpanDeg: 0.2 })).toEqual({ southDeg: 47.9, northDeg: 48.1, westDeg: -30.1, eastDeg: -29.9 })
  })

  it('is null for geometries without positions', () => {
    expect(boxOfGeometries([])).toBeNull()
    expect(positionsOf([[[]]])).toEqual([])
  })
})

describe('what the map reads from the region map', () => {
  const office = (name: string, lon: number, lat: number) => ({ type: 'Feature' as const, geometry: { type: 'Point' as const, coordinates: [lon, lat] as [number, number] }, properties: { kind: 'office' as const, name } })

  it('has no region without an outline, but keeps the offices and the basemap', () => {
    const data = regionMapData({ type: 'FeatureCollection', features: [office('Harbour', -30.5, 47.6)], basemap: { kind: 'tiles', urlTemplate: 'https://t.example.org/{z}/{x}/{y}.png', attribution: 'Example' } })
    expect(data.region).toBeNull()
    expect(data.offices).toEqual([{ name: 'Harbour', at: { latDeg: 47.6, lonDeg: -30.5 }, area: null }])
    expect(data.basemap.kind).toBe('tiles')
  })

  it('pairs each office’s point with its area, and reads the outline, coast and places', () => {
    const area = { type: 'Polygon' as const, coordinates: [[[-31, 47.5], [-30, 47.5], [-30, 48], [-31, 47.5]]] as [number, number][][] }
    const map: RegionMap = {
      type: 'FeatureCollection',
      features: [
        { type: 'Feature', geometry: OUTLINE, properties: { kind: 'region', name: 'Test Reach' } },
        { type: 'Feature', geometry: area, properties: { kind: 'office_area', name: 'Harbour' } },
        office('Harbour', -30.5, 47.6),
        office('Upland', -31.5, 48.2),
        { type: 'Feature', geometry: { type: 'Point', coordinates: [-31.7, 47.62] }, properties: { kind: 'place', name: 'Grey Sound', placeKind: 'sea' } },
      ],
      basemap: { kind: 'offline' },
    }
    const data = regionMapData(map)
    expect(data.region?.name).toBe('Test Reach')
    expect(data.region?.outline).toEqual(OUTLINE)
    expect(data.offices).toEqual([
      { name: 'Harbour', at: { latDeg: 47.6, lonDeg: -30.5 }, area },
      { name: 'Upland', at: { latDeg: 48.2, lonDeg: -31.5 }, area: null },
    ])
    expect(data.region?.places).toEqual([{ name: 'Grey Sound', kind: 'sea', at: { latDeg: 47.62, lonDeg: -31.7 } }])
  })

  it('draws the offline basemap for an answer without a basemap member', () => {
    const old = { type: 'FeatureCollection', features: [] } as unknown as RegionMap
    expect(regionMapData(old).basemap).toEqual({ kind: 'offline' })
  })
})

describe('bearing lines on the ground', () => {
  // GeographicLib's documented example, Wellington (−41.32, 174.81) to Salamanca (40.96, −5.50):
  // azimuth 161.06766998616°, 19 959 679.267 m [V-S]. The line's far end is the direct problem's answer.
  it(`ends where the geodesic along the bearing ends (${cite('GeographicLib documentation example, Wellington to Salamanca', '13-1')}) within 1e-6°`, () => {
    const line = bearingLine({ from: { latDeg: -41.32, lonDeg: 174.81 }, bearingDeg: 161.06766998616, lengthM: 19_959_679.267 })
    expect(line).toHaveLength(17)
    expect(line[0]).toEqual({ latDeg: -41.32, lonDeg: 174.81 })
    expect(Math.abs(line.at(-1)!.latDeg - 40.96)).toBeLessThan(1e-6)
    expect(Math.abs(line.at(-1)!.lonDeg - -5.5)).toBeLessThan(1e-6)
  })

  it('puts its vertices at even steps along the bearing', () => {
    const from = { latDeg: 48.1, lonDeg: -31.4 }
    const line = bearingLine({ from, bearingDeg: 60, lengthM: 8000, segments: 8 })
    line.slice(1).forEach((p, i) => {
      const r = geodesicInverse({ from, to: p })
      expect(r.distanceM).toBeCloseTo(1000 * (i + 1), 3)
      expect(r.initialBearingDeg).toBeCloseTo(60, 9)
    })
    expect(() => bearingLine({ from, bearingDeg: 60, lengthM: -1 })).toThrow(RangeError)
  })
})

describe('the 95 % ellipse on the ground', () => {
  const centre = { latDeg: 48.1, lonDeg: -31.4 }
  const ellipse = { semiMajorM: 900, semiMinorM: 300, orientationDeg: 30 }
  const ring = ellipseRing({ centre, ellipse, vertices: 72 })
  const polar = ring.map((p) => geodesicInverse({ from: centre, to: p }))

  it('starts on the major axis (θ clockwise from north) and reaches the minor axis a quarter turn on', () => {
    expect(polar[0]!.distanceM).toBeCloseTo(900, 6)
    expect(polar[0]!.initialBearingDeg).toBeCloseTo(30, 9)
    expect(polar[18]!.distanceM).toBeCloseTo(300, 6)
    expect(polar[18]!.initialBearingDeg).toBeCloseTo(120, 9)
    expect(polar[36]!.initialBearingDeg).toBeCloseTo(-150, 9)
  })

  // Distances and azimuths from the plane's origin are true on the ground (azimuthal equidistant),
  // so each vertex at distance r and azimuth α satisfies (r cos(α − θ)/a)² + (r sin(α − θ)/b)² = 1 [D].
  it('puts every vertex on the ellipse (r cos(α − θ)/a)² + (r sin(α − θ)/b)² = 1 within 1e-9', () => {
    for (const { distanceM: r, initialBearingDeg: az } of polar) {
      const d = ((az - 30) * Math.PI) / 180
      expect((r * Math.cos(d)) ** 2 / 900 ** 2 + (r * Math.sin(d)) ** 2 / 300 ** 2).toBeCloseTo(1, 9)
    }
  })

  it('refuses a negative semi-axis', () => {
    expect(() => ellipseRing({ centre, ellipse: { ...ellipse, semiMinorM: -1 } })).toThrow(RangeError)
  })
})

describe('what the map frames', () => {
  it('holds every layer: the bearing line’s far end and the ellipse’s edge included, with a 10 % margin', () => {
    const from = { latDeg: 48, lonDeg: -31 }
    const box = contentBox({ measurements: [{ id: 'm1', at: from, label: 'M1' }], bearings: [{ id: 'b1', from, bearingDeg: 0, lengthM: 11_120 }] })!
    // 11.12 km due north ≈ 0.1° of latitude at 48° N; the least span (0.01°) widens the longitudes
    expect(box.northDeg - box.southDeg).toBeCloseTo(0.1 * 1.2, 2)
    expect(box.eastDeg - box.westDeg).toBeCloseTo(0.012, 6)
    const withEllipse = contentBox({ estimatedSource: { at: from, ellipse: { semiMajorM: 5560, semiMinorM: 100, orientationDeg: 0 } } })!
    expect(withEllipse.northDeg - from.latDeg).toBeCloseTo(0.05 * 1.2, 2)
  })

  it('is null with nothing to show, and the region outline can be added', () => {
    expect(contentBox({})).toBeNull()
    expect(contentBox({}, [OUTLINE])!.southDeg).toBeCloseTo(47.2 - 0.14, 9)
  })

  it('rounds a picked position to four decimals (≈ 11 m)', () => {
    expect(round4(48.123456)).toBe(48.1235)
    expect(round4(-31.00004)).toBe(-31)
  })
})

describe('the map key', () => {
  it('names only the layers that hold something, counting points', () => {
    const entries = legendEntries({
      victim: { at: { latDeg: 48, lonDeg: -31 } },
      measurements: [
        { id: 'a', at: { latDeg: 48, lonDeg: -31 }, label: 'M1' },
        { id: 'b', at: { latDeg: 48, lonDeg: -31 }, label: 'M2' },
      ],
      bearings: [],
      estimatedSource: { at: { latDeg: 48, lonDeg: -31 }, ellipse: { semiMajorM: 1, semiMinorM: 1, orientationDeg: 0 } },
      officeCount: 1,
      officeAreas: false,
      region: true,
    })
    expect(entries.map((e) => e.label)).toEqual(['Region boundary and land', '1 field office', 'Complainant’s position', '2 measurement sites', 'Estimated source', '95 % confidence ellipse'])
  })

  it('writes a tile server’s credit as text, never as markup', () => {
    expect(escapeHtml('© <b>Tiles</b> & "Co"')).toBe('© &lt;b&gt;Tiles&lt;/b&gt; &amp; &quot;Co&quot;')
  })
})

describe('areas drawn as the routing reads them', () => {
  it('split a long edge into steps of at most 0.02°, on the straight line in latitude and longitude, keeping every corner', () => {
    // the demo's diagonal border: 1.4° of latitude and 1.834° of longitude
    const ring: [number, number][] = [[47.2, -31.853], [48.6, -30.019], [48.6, -32.2], [47.2, -31.853]]
    const dense = densifyRing(ring)
    for (const corner of ring) expect(dense).toContainEqual(corner)
    for (let i = 1; i < dense.length; i++) {
      const [a, b] = [dense[i - 1]!, dense[i]!]
      expect(Math.max(Math.abs(b[0] - a[0]), Math.abs(b[1] - a[1]))).toBeLessThanOrEqual(EDGE_STEP_DEG + 1e-12)
    }
    // a point of the first edge lies on the line from its first corner to its second (plain linear interpolation)
    const mid = dense[Math.ceil(1.834 / EDGE_STEP_DEG / 2)]!
    const t = (mid[1] - -31.853) / (-30.019 - -31.853)
    expect(mid[0]).toBeCloseTo(47.2 + 1.4 * t, 9)
  })

  it('leave short edges as they are', () => {
    const ring: [number, number][] = [[48, -31], [48.01, -31], [48.01, -30.99], [48, -31]]
    expect(densifyRing(ring)).toEqual(ring)
    expect(areaLatLngs({ type: 'Polygon', coordinates: [ring.map(([lat, lon]) => [lon, lat])] })).toEqual([[ring]])
  })
})
