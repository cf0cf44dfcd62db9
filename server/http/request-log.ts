/**
 * One structured line per request: method, path (secrets taken out), status, duration,
 * request id and the signed-in user's id. Bodies, headers and cookies are never logged.
 */
import type { IncomingMessage, ServerResponse } from 'node:http'
import type { Request, RequestHandler } from 'express'
import { pinoHttp } from 'pino-http'
import type { Logger } from '../log/logger'

/** Path segments that follow these words are secrets (tracking links, e-mailed tokens). */
const SECRET_AFTER = new Set(['track', 'confirm', 'confirm-email', 'reset', 'set-password', 'token', 'tokens', 'invitation'])
/** Query keys whose values are never logged: secrets, and free text that may name a person. */
const SECRET_QUERY_KEY = /token|password|secret|key|code|sig|email|^q$|name|phone/i
const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i
/** A long random-looking segment that is not a record id: treat as a secret wherever it is. */
const TOKEN_LIKE = /^[A-Za-z0-9_-]{20,}$/

export const REDACTED = '[redacted]'

/** The URL as it may be logged: secret path segments and sensitive query values replaced. */
export function loggablePath(url: string): string {
  const [pathPart = '', query] = url.split('?', 2)
  const segments = pathPart.split('/')
  const safe = segments.map((seg, i) => {
    if (i > 0 && SECRET_AFTER.has(segments[i - 1]!.toLowerCase()) && seg !== '') return REDACTED
    if (TOKEN_LIKE.test(seg) && !UUID.test(seg)) return REDACTED
    return seg
  })
  let out = safe.join('/')
  if (query !== undefined) {
    const params = new URLSearchParams(query)
    const kept = [...params.keys()].map((k) => (SECRET_QUERY_KEY.test(k) ? `${k}=${REDACTED}` : `${k}=${params.get(k)}`))
    if (kept.length) out += `?${kept.join('&')}`
  }
  return out
}

type Req = IncomingMessage & Partial<Pick<Request, 'originalUrl' | 'user' | 'id'>> & { [LOGGED_PATH]?: string }

const LOGGED_PATH = Symbol('loggedPath')
/** The request's loggable path, worked out once (the line's fields and its message both use it). */
const pathOf = (req: Req): string => (req[LOGGED_PATH] ??= loggablePath(req.originalUrl ?? req.url ?? ''))

export function requestLog(logger: Logger): RequestHandler {
  const middleware = pinoHttp<Req, ServerResponse>({
    logger,
    genReqId: (req) => (req as Req).id ?? '',
    quietReqLogger: true,
    wrapSerializers: false,
    customAttributeKeys: { reqId: 'requestId', responseTime: 'durationMs' },
    serializers: {
      req: (req: Req) => ({ method: req.method, path: pathOf(req) }),
      res: (res: ServerResponse) => ({ status: res.statusCode }),
    },
    // the user is known only after the session middleware ran, i.e. when the answer is logged
    customProps: (req) => (req.user ? { userId: req.user.id } : {}),
    customLogLevel: (_req, res, err) => (err || res.statusCode >= 500 ? 'error' : res.statusCode >= 400 ? 'warn' : 'info'),
    customSuccessMessage: (req, res, ms) => `${req.method} ${pathOf(req)} ${res.statusCode} ${ms} ms`,
    customErrorMessage: (req, res) => `${req.method} ${pathOf(req)} ${res.statusCode}`,
  })
  return middleware as unknown as RequestHandler
}
