/**
 * What the map draws, read from the public region map (GET /api/region, a GeoJSON
 * FeatureCollection): null when no region is set up, so the form falls back to typed figures.
 * Pure.
 */
import type { AreaGeometry, PlaceKind, RegionMap } from '@shared/schemas/region'
import { boxOfGeometries, type GeoBox } from './map-box'
import type { LatLonDeg } from './projection'

export interface MapPlace {
  name: string
  kind: PlaceKind
  at: LatLonDeg
}

export interface MapOffice {
  name: string
  at: LatLonDeg
  area: AreaGeometry | null
}

export interface RegionMapData {
  name: string
  box: GeoBox
  outline: AreaGeometry
  coast: AreaGeometry[]
  places: MapPlace[]
  offices: MapOffice[]
}

const latLon = ([lonDeg, latDeg]: number[]): LatLonDeg => ({ latDeg: latDeg!, lonDeg: lonDeg! })

export function regionMapData(map: RegionMap): RegionMapData | null {
  let outline: { name: string; geometry: AreaGeometry } | null = null
  const coast: AreaGeometry[] = []
  const places: MapPlace[] = []
  const offices = new Map<string, MapOffice>()
  const officeOf = (name: string) => {
    const o = offices.get(name) ?? { name, at: { latDeg: Number.NaN, lonDeg: Number.NaN }, area: null }
    offices.set(name, o)
    return o
  }
  for (const f of map.features) {
    const p = f.properties
    if (p.kind === 'region') outline = { name: p.name, geometry: f.geometry as AreaGeometry }
    else if (p.kind === 'coast') coast.push(f.geometry as AreaGeometry)
    else if (p.kind === 'place' && f.geometry.type === 'Point') places.push({ name: p.name, kind: p.placeKind, at: latLon(f.geometry.coordinates) })
    else if (p.kind === 'office' && f.geometry.type === 'Point') officeOf(p.name).at = latLon(f.geometry.coordinates)
    else if (p.kind === 'office_area') officeOf(p.name).area = f.geometry as AreaGeometry
  }
  if (!outline) return null
  const box = boxOfGeometries([outline.geometry])
  if (!box) return null
  return {
    name: outline.name,
    box,
    outline: outline.geometry,
    coast,
    places,
    offices: [...offices.values()].filter((o) => Number.isFinite(o.at.latDeg)),
  }
}
