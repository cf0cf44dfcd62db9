import { Router } from 'express'
import { buildApiDocument } from './document'

/** How long browsers and proxies may keep the API document [s]: public, the same for everyone, changed only by a release. */
export const API_DOCUMENT_MAX_AGE_S = 300

/** GET /api/openapi.json — public: it describes routes, never data. Built on first request, then kept. */
export function openApiRoutes(): Router {
  const r = Router()
  r.get('/openapi.json', (_req, res) => {
    res.setHeader('Cache-Control', `public, max-age=${API_DOCUMENT_MAX_AGE_S}`)
    res.json(buildApiDocument())
  })
  return r
}
