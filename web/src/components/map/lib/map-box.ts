/**
 * The box a map frames, computed from GeoJSON geometries (never from constants): the smallest
 * latitude/longitude box holding every position, widened by a margin and to a least span so a
 * single point or a thin strip still makes a usable map. Pure.
 * Boxes across the 180° meridian are not handled (positions there would frame the whole globe).
 */

export interface GeoBox {
  southDeg: number
  northDeg: number
  westDeg: number
  eastDeg: number
}

interface Geometry {
  type: string
  coordinates: unknown
}

/** Every [longitude, latitude] position of a GeoJSON geometry, whatever its nesting. */
export function positionsOf(coordinates: unknown): [number, number][] {
  if (!Array.isArray(coordinates)) return []
  if (typeof coordinates[0] === 'number') return coordinates.length >= 2 ? [[coordinates[0] as number, coordinates[1] as number]] : []
  return coordinates.flatMap(positionsOf)
}

/**
 * The box around the geometries, or null when they hold no position.
 * marginFraction widens each side by that fraction of the span; minSpanDeg is the least
 * height and width (centred on the positions). The result stays within ±90° latitude.
 */
export function boxOfGeometries(geometries: Geometry[], options: { marginFraction?: number; minSpanDeg?: number } = {}): GeoBox | null {
  const { marginFraction = 0, minSpanDeg = 0.01 } = options
  const positions = geometries.flatMap((g) => positionsOf(g.coordinates))
  if (positions.length === 0) return null
  let south = Infinity
  let north = -Infinity
  let west = Infinity
  let east = -Infinity
  for (const [lon, lat] of positions) {
    south = Math.min(south, lat)
    north = Math.max(north, lat)
    west = Math.min(west, lon)
    east = Math.max(east, lon)
  }
  const widen = (lo: number, hi: number): [number, number] => {
    if (hi - lo < minSpanDeg) {
      const mid = (lo + hi) / 2
      ;[lo, hi] = [mid - minSpanDeg / 2, mid + minSpanDeg / 2]
    }
    const margin = (hi - lo) * marginFraction
    return [lo - margin, hi + margin]
  }
  const [s, n] = widen(south, north)
  const [w, e] = widen(west, east)
  return { southDeg: Math.max(-90, s), northDeg: Math.min(90, n), westDeg: w, eastDeg: e }
}
