/**
 * The offline map's projection: equirectangular (equidistant cylindrical) with the standard
 * parallel at the middle of the box, so distances along it are true to scale.
 * Snyder, Map Projections — A Working Manual, USGS Professional Paper 1395 (1987), ch. 12,
 * "Equidistant Cylindrical Projection": x = R (λ − λ0) cos φ1, y = R φ. [M: chapter recalled]
 * The box comes from the region's data (map-box.ts). Pure: no DOM, no I/O.
 */
import type { GeoBox } from './map-box'

export interface LatLonDeg {
  latDeg: number
  lonDeg: number
}

/** Drawing units of the SVG: 1000 wide; the height keeps the projection's aspect. */
export const MAP_WIDTH = 1000

export interface Projection {
  box: GeoBox
  /** Standard parallel φ1: the middle latitude of the box. */
  standardParallelDeg: number
  width: number
  height: number
  /** Map units per degree of latitude (and per degree of longitude × cos φ1). */
  unitsPerDeg: number
  centre: LatLonDeg
  /** Geographic position → map units (x to the east, y downwards from the north edge). */
  project(p: LatLonDeg): { x: number; y: number }
  /** Map units → geographic position (inverse of project). */
  unproject(p: { x: number; y: number }): LatLonDeg
  contains(p: LatLonDeg): boolean
  /** Keeps a position inside the box (for the keyboard marker, which must stay visible). */
  clamp(p: LatLonDeg): LatLonDeg
}

export function createProjection(box: GeoBox): Projection {
  const standardParallelDeg = (box.southDeg + box.northDeg) / 2
  const cosPhi1 = Math.cos((standardParallelDeg * Math.PI) / 180)
  const unitsPerDeg = MAP_WIDTH / ((box.eastDeg - box.westDeg) * cosPhi1)
  const height = (box.northDeg - box.southDeg) * unitsPerDeg
  const clampTo = (x: number, lo: number, hi: number) => Math.min(hi, Math.max(lo, x))
  return {
    box,
    standardParallelDeg,
    width: MAP_WIDTH,
    height,
    unitsPerDeg,
    centre: { latDeg: standardParallelDeg, lonDeg: (box.westDeg + box.eastDeg) / 2 },
    project: (p) => ({
      x: (p.lonDeg - box.westDeg) * cosPhi1 * unitsPerDeg, // x = R (λ − λ0) cos φ1
      y: (box.northDeg - p.latDeg) * unitsPerDeg, // y = R (φ_north − φ), downwards
    }),
    unproject: (p) => ({ latDeg: box.northDeg - p.y / unitsPerDeg, lonDeg: box.westDeg + p.x / (cosPhi1 * unitsPerDeg) }),
    contains: (p) => p.latDeg >= box.southDeg && p.latDeg <= box.northDeg && p.lonDeg >= box.westDeg && p.lonDeg <= box.eastDeg,
    clamp: (p) => ({ latDeg: clampTo(p.latDeg, box.southDeg, box.northDeg), lonDeg: clampTo(p.lonDeg, box.westDeg, box.eastDeg) }),
  }
}

export type Direction = 'north' | 'south' | 'east' | 'west'

/** One keyboard step: moves the marker by stepDeg, rounded to 4 decimals, kept in the box. */
export function nudge(options: { projection: Projection; from: LatLonDeg; direction: Direction; stepDeg: number }): LatLonDeg {
  const { projection, from, direction, stepDeg } = options
  const dLat = direction === 'north' ? stepDeg : direction === 'south' ? -stepDeg : 0
  const dLon = direction === 'east' ? stepDeg : direction === 'west' ? -stepDeg : 0
  const moved = projection.clamp({ latDeg: from.latDeg + dLat, lonDeg: from.lonDeg + dLon })
  return { latDeg: round4(moved.latDeg), lonDeg: round4(moved.lonDeg) }
}

/** Four decimals of a degree ≈ 11 m: finer than a click can aim. */
export function round4(x: number): number {
  return Math.round(x * 1e4) / 1e4
}

/**
 * Graticule lines inside the box: a round step (1, 2 or 5 × a power of ten degrees) giving
 * about `target` lines across the larger span, at whole multiples of that step.
 */
export function graticule(box: GeoBox, target = 6): { latsDeg: number[]; lonsDeg: number[]; stepDeg: number } {
  const span = Math.max(box.northDeg - box.southDeg, box.eastDeg - box.westDeg)
  const raw = span / target
  const power = 10 ** Math.floor(Math.log10(raw))
  const stepDeg = [1, 2, 5, 10].map((m) => m * power).find((s) => s >= raw) ?? 10 * power
  const lines = (lo: number, hi: number) => {
    const out: number[] = []
    for (let k = Math.ceil(lo / stepDeg - 1e-9); k * stepDeg <= hi + 1e-9; k++) {
      const v = Number((k * stepDeg).toFixed(6))
      // a line on the frame's edge draws nothing useful
      if (v > lo + 1e-9 && v < hi - 1e-9) out.push(v)
    }
    return out
  }
  return { latsDeg: lines(box.southDeg, box.northDeg), lonsDeg: lines(box.westDeg, box.eastDeg), stepDeg }
}
