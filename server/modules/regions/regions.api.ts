/** The document's entry for the region map (regions.routes.ts). */
import { regionMapSchema } from '../../../shared/schemas/region'
import { EVERYONE, type ApiOperation } from '../../openapi/operation'

export const regionsApi: ApiOperation[] = [
  {
    method: 'get',
    path: '/api/region',
    summary: "The region map: outline, coast, places, offices' points and areas, and the basemap",
    tag: 'Region',
    callers: EVERYONE,
    responses: { 200: { contentType: 'application/geo+json', schema: regionMapSchema } },
    description: 'A GeoJSON FeatureCollection (RFC 7946); public, and cacheable for a few minutes.',
  },
]
