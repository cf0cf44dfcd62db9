/**
 * The region map: the region's outline, coast and place names, and each office's point and
 * area, as one public GeoJSON FeatureCollection. Only what anyone may see leaves here: an
 * office's name, point and area (never its staff, targets or id).
 */
import type { Db } from '../../db/client'
import type { ServiceContext } from '../../context'
import { OFFLINE_BASEMAP, areaSchema, regionSchema, type AreaGeometry, type Basemap, type RegionFeature, type RegionInput, type RegionMap } from '../../../shared/schemas/region'
import { findRegion, listOfficesForMap, setOfficeArea, upsertRegion } from './regions.repo'

export interface PublicOffice {
  name: string
  centreLatDeg: number
  centreLonDeg: number
  area: AreaGeometry | null
}

/**
 * The FeatureCollection for a region (or none configured) and its offices, with the basemap
 * the server is configured with (the offline one unless a tile server is set). Pure.
 */
export function presentRegionMap(r: RegionInput | null, officeRows: PublicOffice[], basemap: Basemap = OFFLINE_BASEMAP): RegionMap {
  const features: RegionFeature[] = []
  if (r) {
    features.push({ type: 'Feature', geometry: r.outline, properties: { kind: 'region', name: r.name } })
    features.push({ type: 'Feature', geometry: r.coast, properties: { kind: 'coast' } })
    for (const p of r.places) features.push({ type: 'Feature', geometry: p.point, properties: { kind: 'place', name: p.name, placeKind: p.kind } })
  }
  for (const o of officeRows) {
    if (o.area) features.push({ type: 'Feature', geometry: o.area, properties: { kind: 'office_area', name: o.name } })
  }
  for (const o of officeRows) {
    features.push({ type: 'Feature', geometry: { type: 'Point', coordinates: [o.centreLonDeg, o.centreLatDeg] }, properties: { kind: 'office', name: o.name } })
  }
  return { type: 'FeatureCollection', features, basemap }
}

/** GET /api/region: public, the same for everyone. */
export async function getRegionMap(ctx: ServiceContext, basemap: Basemap = OFFLINE_BASEMAP): Promise<RegionMap> {
  const r = await findRegion(ctx.db)
  const officeRows = await listOfficesForMap(ctx.db)
  return presentRegionMap(r ?? null, officeRows, basemap)
}

/** Sets the region (there is one); the input is checked with the shared schema first. */
export async function saveRegion(db: Db, input: RegionInput): Promise<void> {
  const r = regionSchema.parse(input)
  await upsertRegion(db, r)
}

/** Sets one office's area (null: none); the geometry is checked with the shared schema first. */
export async function saveOfficeArea(db: Db, officeId: string, area: AreaGeometry | null): Promise<void> {
  await setOfficeArea(db, officeId, area === null ? null : areaSchema.parse(area))
}
