import type { RequestHandler } from 'express'
import { HttpError } from './errors'

const SAFE = new Set(['GET', 'HEAD', 'OPTIONS'])

/**
 * CSRF protection by origin checking, for every state-changing request.
 * Browsers send Origin on cross-origin and same-origin POST/PUT/PATCH/DELETE; a request
 * whose Origin is not one of the configured origins (PUBLIC_URL) is refused. The Host
 * header is never trusted for this: whoever sends the request chooses it. Without Origin,
 * a Sec-Fetch-Site that says another site is refused too. Requests without either header
 * come from non-browser clients, which carry no victim's cookies by accident. Session
 * cookies are also SameSite=Lax.
 */
export function sameOrigin(allowedOrigins: string[]): RequestHandler {
  const allowed = new Set(allowedOrigins.map((o) => new URL(o).origin))
  return (req, _res, next) => {
    if (SAFE.has(req.method)) return next()
    const origin = req.get('origin')
    if (origin) {
      if (allowed.has(origin)) return next()
      return next(new HttpError(403, 'cross_site_request', 'This request came from another site and was refused.'))
    }
    const site = req.get('sec-fetch-site')
    if (site && site !== 'same-origin' && site !== 'none') {
      return next(new HttpError(403, 'cross_site_request', 'This request came from another site and was refused.'))
    }
    next()
  }
}
