/**
 * The offline map's projection: equirectangular (equidistant cylindrical) with the standard
 * parallel at the middle of the region, so distances along it are true to scale.
 * Snyder, Map Projections — A Working Manual, USGS Professional Paper 1395 (1987), ch. 12,
 * "Equidistant Cylindrical Projection": x = R (λ − λ0) cos φ1, y = R φ. [M: chapter recalled]
 * Pure: no DOM, no I/O.
 */

/** The demo region's bounding box, in degrees (west is negative). */
export const REGION_BOX = { southDeg: 47.2, northDeg: 48.6, westDeg: -32.2, eastDeg: -29.8 } as const

/** Standard parallel φ1: the middle latitude of the box. */
export const STANDARD_PARALLEL_DEG = (REGION_BOX.southDeg + REGION_BOX.northDeg) / 2

const COS_PHI1 = Math.cos((STANDARD_PARALLEL_DEG * Math.PI) / 180)
const LON_SPAN_DEG = REGION_BOX.eastDeg - REGION_BOX.westDeg
const LAT_SPAN_DEG = REGION_BOX.northDeg - REGION_BOX.southDeg

/** Drawing units of the SVG: 1000 wide; the height keeps the projection's aspect. */
export const MAP_WIDTH = 1000
/** Map units per degree of latitude (and per degree of longitude × cos φ1). */
const UNITS_PER_DEG = MAP_WIDTH / (LON_SPAN_DEG * COS_PHI1)
export const MAP_HEIGHT = LAT_SPAN_DEG * UNITS_PER_DEG

export interface LatLonDeg {
  latDeg: number
  lonDeg: number
}

/** Geographic position → map units (x to the east, y downwards from the north edge). */
export function projectToMap(p: LatLonDeg): { x: number; y: number } {
  return {
    x: (p.lonDeg - REGION_BOX.westDeg) * COS_PHI1 * UNITS_PER_DEG, // x = R (λ − λ0) cos φ1
    y: (REGION_BOX.northDeg - p.latDeg) * UNITS_PER_DEG, // y = R (φ_north − φ), downwards
  }
}

/** Map units → geographic position (inverse of projectToMap). */
export function mapToLatLon(p: { x: number; y: number }): LatLonDeg {
  return {
    latDeg: REGION_BOX.northDeg - p.y / UNITS_PER_DEG,
    lonDeg: REGION_BOX.westDeg + p.x / (COS_PHI1 * UNITS_PER_DEG),
  }
}

export function isInsideRegion(p: LatLonDeg): boolean {
  return p.latDeg >= REGION_BOX.southDeg && p.latDeg <= REGION_BOX.northDeg && p.lonDeg >= REGION_BOX.westDeg && p.lonDeg <= REGION_BOX.eastDeg
}

/** Keeps a position inside the box (for the keyboard marker, which must stay visible). */
export function clampToRegion(p: LatLonDeg): LatLonDeg {
  return {
    latDeg: Math.min(REGION_BOX.northDeg, Math.max(REGION_BOX.southDeg, p.latDeg)),
    lonDeg: Math.min(REGION_BOX.eastDeg, Math.max(REGION_BOX.westDeg, p.lonDeg)),
  }
}

export type Direction = 'north' | 'south' | 'east' | 'west'

/** One keyboard step: moves the marker by stepDeg, rounded to 4 decimals, kept in the box. */
export function nudge(options: { from: LatLonDeg; direction: Direction; stepDeg: number }): LatLonDeg {
  const { from, direction, stepDeg } = options
  const dLat = direction === 'north' ? stepDeg : direction === 'south' ? -stepDeg : 0
  const dLon = direction === 'east' ? stepDeg : direction === 'west' ? -stepDeg : 0
  const moved = clampToRegion({ latDeg: from.latDeg + dLat, lonDeg: from.lonDeg + dLon })
  return { latDeg: round4(moved.latDeg), lonDeg: round4(moved.lonDeg) }
}

export const REGION_CENTRE: LatLonDeg = {
  latDeg: (REGION_BOX.southDeg + REGION_BOX.northDeg) / 2,
  lonDeg: (REGION_BOX.westDeg + REGION_BOX.eastDeg) / 2,
}

/** Four decimals of a degree ≈ 11 m: finer than a click can aim. */
export function round4(x: number): number {
  return Math.round(x * 1e4) / 1e4
}
