import { describe, expect, it } from 'vitest'
import type { RegionMap } from '../../shared/schemas/region'
import { boxOfGeometries, positionsOf } from '@/features/map/lib/map-box'
import { MAP_WIDTH, createProjection, graticule, nudge } from '@/features/map/lib/projection'
import { regionMapData } from '@/features/map/lib/region-data'

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

  it('widens each side by the margin, as a fraction of the span', () => {
    const box = boxOfGeometries([OUTLINE], { marginFraction: 0.1 })!
    expect(box.southDeg).toBeCloseTo(47.06, 12)
    expect(box.northDeg).toBeCloseTo(48.74, 12)
    expect(box.westDeg).toBeCloseTo(-32.44, 12)
    expect(box.eastDeg).toBeCloseTo(-29.56, 12)
  })

  it('gives a single point a box of the least span around it', () => {
    expect(boxOfGeometries([{ type: 'Point', coordinates: [-30, 48] }], { minSpanDeg: 0.2 })).toEqual({ southDeg: 47.9, northDeg: 48.1, westDeg: -30.1, eastDeg: -29.9 })
  })

  it('keeps the box within the poles', () => {
    expect(boxOfGeometries([{ type: 'Point', coordinates: [0, 89.99] }], { minSpanDeg: 1 })!.northDeg).toBe(90)
  })

  it('is null for geometries without positions', () => {
    expect(boxOfGeometries([])).toBeNull()
    expect(boxOfGeometries([{ type: 'Polygon', coordinates: [] }])).toBeNull()
    expect(positionsOf([[[]]])).toEqual([])
  })
})

describe('offline map projection (equirectangular), on a box from the data', () => {
  const projection = createProjection(BOX)

  it('puts the north-west corner at the origin and the south-east corner at the far corner', () => {
    expect(projection.project({ latDeg: BOX.northDeg, lonDeg: BOX.westDeg })).toEqual({ x: 0, y: 0 })
    const se = projection.project({ latDeg: BOX.southDeg, lonDeg: BOX.eastDeg })
    expect(se.x).toBeCloseTo(MAP_WIDTH, 9)
    expect(se.y).toBeCloseTo(projection.height, 9)
  })

  // x = R (λ − λ0) cos φ1, y = R φ — Snyder, USGS Professional Paper 1395 (1987), equidistant
  // cylindrical projection [M: chapter recalled]. Checked independently: a degree of longitude
  // spans cos φ1 of a degree of latitude on the map.
  it('scales a degree of longitude by cos φ1 against a degree of latitude (Snyder 1987, equidistant cylindrical)', () => {
    const origin = projection.project({ latDeg: 48, lonDeg: -31 })
    const east = projection.project({ latDeg: 48, lonDeg: -30 })
    const south = projection.project({ latDeg: 47, lonDeg: -31 })
    expect((east.x - origin.x) / (south.y - origin.y)).toBeCloseTo(Math.cos((projection.standardParallelDeg * Math.PI) / 180), 12)
    expect(projection.standardParallelDeg).toBeCloseTo(47.9, 12)
  })

  it('follows the box: a region twice as tall (same width) draws twice as tall', () => {
    const tall = createProjection({ ...BOX, southDeg: 45.8 })
    const ratio = (tall.height / projection.height) * (Math.cos((tall.standardParallelDeg * Math.PI) / 180) / Math.cos((projection.standardParallelDeg * Math.PI) / 180))
    expect(ratio).toBeCloseTo(2, 12)
  })

  it('turns a click back into the position it shows (round trip)', () => {
    for (const p of [{ latDeg: 48.1, lonDeg: -31.35 }, { latDeg: 47.62, lonDeg: -30.55 }, { latDeg: 47.2, lonDeg: -32.2 }]) {
      const back = projection.unproject(projection.project(p))
      expect(back.latDeg).toBeCloseTo(p.latDeg, 10)
      expect(back.lonDeg).toBeCloseTo(p.lonDeg, 10)
    }
  })

  it('moves the marker one step per arrow key and keeps it inside the box', () => {
    expect(nudge({ projection, from: { latDeg: 48.1, lonDeg: -31.35 }, direction: 'north', stepDeg: 0.01 })).toEqual({ latDeg: 48.11, lonDeg: -31.35 })
    expect(nudge({ projection, from: { latDeg: 48.1, lonDeg: -31.35 }, direction: 'west', stepDeg: 0.1 })).toEqual({ latDeg: 48.1, lonDeg: -31.45 })
    expect(nudge({ projection, from: { latDeg: 48.599, lonDeg: -29.805 }, direction: 'north', stepDeg: 0.1 })).toEqual({ latDeg: 48.6, lonDeg: -29.805 })
    expect(projection.clamp({ latDeg: 10, lonDeg: 10 })).toEqual({ latDeg: 47.2, lonDeg: -29.8 })
    expect(projection.clamp({ latDeg: 60, lonDeg: -40 })).toEqual({ latDeg: 48.6, lonDeg: -32.2 })
  })

  it('knows a typed position outside the box (which the form still accepts)', () => {
    expect(projection.contains({ latDeg: 48.1, lonDeg: -31.35 })).toBe(true)
    expect(projection.contains({ latDeg: 51.5, lonDeg: -0.1 })).toBe(false)
  })

  it('draws graticule lines at round steps strictly inside the box', () => {
    expect(graticule(BOX)).toEqual({ stepDeg: 0.5, latsDeg: [47.5, 48, 48.5], lonsDeg: [-32, -31.5, -31, -30.5, -30] })
    expect(graticule({ southDeg: -0.05, northDeg: 0.05, westDeg: 100, eastDeg: 100.1 }).stepDeg).toBe(0.02)
  })
})

describe('the region map data the web draws', () => {
  const office = (name: string, lon: number, lat: number) => ({ type: 'Feature' as const, geometry: { type: 'Point' as const, coordinates: [lon, lat] as [number, number] }, properties: { kind: 'office' as const, name } })

  it('is none without a region outline, even when offices exist', () => {
    expect(regionMapData({ type: 'FeatureCollection', features: [office('Harbour', -30.5, 47.6)] })).toBeNull()
  })

  it('frames the outline and pairs each office’s point with its area', () => {
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
    }
    const data = regionMapData(map)!
    expect(data.name).toBe('Test Reach')
    expect(data.box).toEqual(BOX)
    expect(data.offices).toEqual([
      { name: 'Harbour', at: { latDeg: 47.6, lonDeg: -30.5 }, area },
      { name: 'Upland', at: { latDeg: 48.2, lonDeg: -31.5 }, area: null },
    ])
    expect(data.places).toEqual([{ name: 'Grey Sound', kind: 'sea', at: { latDeg: 47.62, lonDeg: -31.7 } }])
    expect(data.coast).toEqual([])
  })
})
