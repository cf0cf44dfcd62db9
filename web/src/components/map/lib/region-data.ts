/**
 * What the map draws from the public region map (GET /api/region, a GeoJSON FeatureCollection):
 * its basemap setting, and — for the offline basemap — the outline, the land, place names and
 * the offices with their areas. `region` is null when none is set up. Pure.
 */
import type { AreaGeometry, Basemap, PlaceKind, RegionMap } from '@shared/schemas/region'
import type { MapOffice, MapPoint } from '../map-types'

export interface MapPlace {
  name: string
  kind: PlaceKind
  at: MapPoint
}

export interface RegionMapData {
  basemap: Basemap
  /** The region, or null when none is set up (the answer then holds only offices). */
  region: { name: string; outline: AreaGeometry; coast: AreaGeometry[]; places: MapPlace[] } | null
  offices: MapOffice[]
}

const pointOf = ([lonDeg, latDeg]: number[]): MapPoint => ({ latDeg: latDeg!, lonDeg: lonDeg! })

export function regionMapData(map: RegionMap): RegionMapData {
  let outline: { name: string; geometry: AreaGeometry } | null = null
  const coast: AreaGeometry[] = []
  const places: MapPlace[] = []
  const offices = new Map<string, { name: string; at: MapPoint | null; area: AreaGeometry | null }>()
  const officeOf = (name: string) => {
    const o = offices.get(name) ?? { name, at: null, area: null }
    offices.set(name, o)
    return o
  }
  for (const f of map.features) {
    const p = f.properties
    if (p.kind === 'region') outline = { name: p.name, geometry: f.geometry as AreaGeometry }
    else if (p.kind === 'coast') coast.push(f.geometry as AreaGeometry)
    else if (p.kind === 'place' && f.geometry.type === 'Point') places.push({ name: p.name, kind: p.placeKind, at: pointOf(f.geometry.coordinates) })
    else if (p.kind === 'office' && f.geometry.type === 'Point') officeOf(p.name).at = pointOf(f.geometry.coordinates)
    else if (p.kind === 'office_area') officeOf(p.name).area = f.geometry as AreaGeometry
  }
  return {
    // an answer from before the basemap was part of it draws the offline map
    basemap: map.basemap ?? { kind: 'offline' },
    region: outline ? { name: outline.name, outline: outline.geometry, coast, places } : null,
    offices: [...offices.values()].flatMap((o) => (o.at ? [{ name: o.name, at: o.at, area: o.area }] : [])),
  }
}
