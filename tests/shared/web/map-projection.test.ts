import { describe, expect, it } from 'vitest'
import { MAP_HEIGHT, MAP_WIDTH, REGION_BOX, STANDARD_PARALLEL_DEG, clampToRegion, isInsideRegion, mapToLatLon, nudge, projectToMap } from '../../../web/src/features/map/lib/projection'
import { ISLANDS, MAINLAND, PLACES } from '../../../web/src/features/map/lib/vellmark-coast'

describe('offline map projection (equirectangular)', () => {
  it('puts the north-west corner at the origin and the south-east corner at the far corner', () => {
    expect(projectToMap({ latDeg: REGION_BOX.northDeg, lonDeg: REGION_BOX.westDeg })).toEqual({ x: 0, y: 0 })
    const se = projectToMap({ latDeg: REGION_BOX.southDeg, lonDeg: REGION_BOX.eastDeg })
    expect(se.x).toBeCloseTo(MAP_WIDTH, 9)
    expect(se.y).toBeCloseTo(MAP_HEIGHT, 9)
  })

  // x = R (λ − λ0) cos φ1, y = R φ — Snyder, USGS Professional Paper 1395 (1987), equidistant
  // cylindrical projection [M: chapter recalled]. Checked independently: a degree of longitude
  // spans cos φ1 of a degree of latitude on the map.
  it('scales a degree of longitude by cos φ1 against a degree of latitude (Snyder 1987, equidistant cylindrical)', () => {
    const origin = projectToMap({ latDeg: 48, lonDeg: -31 })
    const east = projectToMap({ latDeg: 48, lonDeg: -30 })
    const south = projectToMap({ latDeg: 47, lonDeg: -31 })
    const ratio = (east.x - origin.x) / (south.y - origin.y)
    expect(ratio).toBeCloseTo(Math.cos((STANDARD_PARALLEL_DEG * Math.PI) / 180), 12)
    expect(STANDARD_PARALLEL_DEG).toBeCloseTo(47.9, 12)
  })

  it('turns a click back into the position it shows (round trip)', () => {
    for (const p of [{ latDeg: 48.1, lonDeg: -31.35 }, { latDeg: 47.62, lonDeg: -30.55 }, { latDeg: 47.2, lonDeg: -32.2 }]) {
      const back = mapToLatLon(projectToMap(p))
      expect(back.latDeg).toBeCloseTo(p.latDeg, 10)
      expect(back.lonDeg).toBeCloseTo(p.lonDeg, 10)
    }
  })

  it('moves the marker one step per arrow key and keeps it inside the box', () => {
    expect(nudge({ from: { latDeg: 48.1, lonDeg: -31.35 }, direction: 'north', stepDeg: 0.01 })).toEqual({ latDeg: 48.11, lonDeg: -31.35 })
    expect(nudge({ from: { latDeg: 48.1, lonDeg: -31.35 }, direction: 'west', stepDeg: 0.1 })).toEqual({ latDeg: 48.1, lonDeg: -31.45 })
    expect(nudge({ from: { latDeg: 48.599, lonDeg: -29.805 }, direction: 'north', stepDeg: 0.1 })).toEqual({ latDeg: 48.6, lonDeg: -29.805 })
    expect(clampToRegion({ latDeg: 10, lonDeg: 10 })).toEqual({ latDeg: 47.2, lonDeg: -29.8 })
    expect(clampToRegion({ latDeg: 60, lonDeg: -40 })).toEqual({ latDeg: 48.6, lonDeg: -32.2 })
  })

  it('knows a typed position outside the box (which the form still accepts)', () => {
    expect(isInsideRegion({ latDeg: 48.1, lonDeg: -31.35 })).toBe(true)
    expect(isInsideRegion({ latDeg: 51.5, lonDeg: -0.1 })).toBe(false)
  })

  it('draws every coastline point and place label inside the box', () => {
    for (const p of [...MAINLAND, ...ISLANDS.flatMap((i) => i.outline), ...PLACES.map((l) => l.at)]) expect(isInsideRegion(p)).toBe(true)
  })
})
