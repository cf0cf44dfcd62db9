/**
 * The invented Vellmark Coast as map data: the region's outline, its coast (mainland and two
 * islands, sea to the west), place names, and the two demo offices' areas. Nothing here is a
 * real place. Positions are written (latitude, longitude) for reading and stored as GeoJSON
 * ([longitude, latitude], rings closed, outer rings counter-clockwise).
 *
 * Data only: it imports no server code, so tools that need just the region's extent (the case
 * generator's --help, say) stay light. seed-demo-region.ts writes it to a database.
 */
import type { AreaGeometry, Place, RegionInput } from '../../shared/schemas/region'

type LatLon = [latDeg: number, lonDeg: number]

/** A closed GeoJSON ring, counter-clockwise (RFC 7946 §3.1.6), from (latitude, longitude) pairs. */
export function ring(points: LatLon[]): [number, number][] {
  const positions = points.map(([lat, lon]): [number, number] => [lon, lat])
  // shoelace: positive signed area is counter-clockwise with x = longitude, y = latitude
  let twiceArea = 0
  for (let i = 0; i < positions.length; i++) {
    const [x1, y1] = positions[i]!
    const [x2, y2] = positions[(i + 1) % positions.length]!
    twiceArea += x1 * y2 - x2 * y1
  }
  if (twiceArea < 0) positions.reverse()
  return [...positions, positions[0]!]
}

const polygon = (points: LatLon[]): AreaGeometry => ({ type: 'Polygon', coordinates: [ring(points)] })

/** The region's boundary: the parallels 47.2° N and 48.6° N and the meridians 32.2° W and 29.8° W. */
const OUTLINE: LatLon[] = [
  [47.2, -32.2],
  [47.2, -29.8],
  [48.6, -29.8],
  [48.6, -32.2],
]

/** The outline's extent: every demo and generated location lies inside it. */
export const DEMO_REGION_BOX = {
  latMinDeg: Math.min(...OUTLINE.map(([lat]) => lat)),
  latMaxDeg: Math.max(...OUTLINE.map(([lat]) => lat)),
  lonMinDeg: Math.min(...OUTLINE.map(([, lon]) => lon)),
  lonMaxDeg: Math.max(...OUTLINE.map(([, lon]) => lon)),
}

/** The mainland, from the north-east corner; its west edge is the coastline. */
const MAINLAND: LatLon[] = [
  [48.6, -29.8],
  [47.2, -29.8],
  [47.2, -30.46],
  [47.25, -30.5],
  [47.32, -30.58],
  [47.4, -30.66],
  [47.47, -30.74],
  [47.53, -30.84],
  [47.57, -30.86],
  [47.6, -30.78],
  [47.63, -30.74],
  [47.66, -30.78],
  [47.68, -30.86],
  [47.71, -30.92],
  [47.75, -30.98],
  [47.8, -31.06],
  [47.86, -31.18],
  [47.92, -31.3],
  [47.98, -31.42],
  [48.04, -31.52],
  [48.08, -31.6],
  [48.12, -31.62],
  [48.16, -31.58],
  [48.22, -31.6],
  [48.3, -31.66],
  [48.38, -31.7],
  [48.45, -31.78],
  [48.52, -31.74],
  [48.6, -31.8],
]

const SELLA_ISLE: LatLon[] = [
  [47.99, -31.8],
  [47.975, -31.7],
  [47.935, -31.68],
  [47.91, -31.76],
  [47.94, -31.83],
]

const THE_BRANNOCKS: LatLon[] = [
  [47.47, -31.13],
  [47.46, -31.08],
  [47.43, -31.09],
  [47.44, -31.14],
]

const place = (name: string, kind: Place['kind'], [lat, lon]: LatLon): Place => ({ name, kind, point: { type: 'Point', coordinates: [lon, lat] } })

export const DEMO_REGION_MAP: RegionInput = {
  name: 'Vellmark Coast',
  outline: polygon(OUTLINE),
  coast: { type: 'MultiPolygon', coordinates: [[ring(MAINLAND)], [ring(SELLA_ISLE)], [ring(THE_BRANNOCKS)]] },
  places: [
    place('Corran Point', 'town', [48.47, -31.6]),
    place('Wyndle', 'town', [48.34, -30.75]),
    place('Ostby Fells', 'land', [47.98, -30.35]),
    place('Lantry', 'town', [47.33, -30.25]),
    place('Sella Isle', 'land', [48.02, -31.9]),
    place('Marrow Sound', 'sea', [47.62, -31.7]),
  ],
}

/**
 * The offices' areas split the region along the line of points equally far from both offices'
 * points (on the map's scale at 47.9° N), so an area holds exactly the places nearest its office.
 */
const SPLIT_NORTH: LatLon = [48.6, -30.019]
const SPLIT_SOUTH: LatLon = [47.2, -31.853]

export const DEMO_OFFICE_AREAS: Record<string, AreaGeometry> = {
  Harrowmere: polygon([[47.2, -32.2], SPLIT_SOUTH, SPLIT_NORTH, [48.6, -32.2]]),
  'Kestrel Bay': polygon([SPLIT_SOUTH, [47.2, -29.8], [48.6, -29.8], SPLIT_NORTH]),
}
