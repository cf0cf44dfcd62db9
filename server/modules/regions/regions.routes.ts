import { Router } from 'express'
import type { ServiceContext } from '../../context'
import type { Basemap } from '../../../shared/schemas/region'
import { getRegionMap } from './regions.service'

/**
 * How long browsers and proxies may keep the region map [s]. It is public and the same for
 * everyone, and changes only when an administrator edits the region or an office's area; the
 * map is a picture for choosing a place (reports are routed on the server, from the database),
 * so a map up to five minutes old misleads no one. The ETag makes the next check cheap.
 */
export const REGION_MAP_MAX_AGE_S = 300

/** `basemap`: the tile server from the configuration (MAP_TILE_URL), or the offline basemap. */
export function regionRoutes(ctx: ServiceContext, opts: { basemap?: Basemap } = {}): Router {
  const r = Router()
  // public: the report form needs it before anyone signs in
  r.get('/region', async (_req, res) => {
    const map = await getRegionMap(ctx, opts.basemap)
    res.setHeader('Cache-Control', `public, max-age=${REGION_MAP_MAX_AGE_S}`)
    res.type('application/geo+json').send(JSON.stringify(map))
  })
  return r
}
