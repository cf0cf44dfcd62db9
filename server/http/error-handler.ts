import type { ErrorRequestHandler, RequestHandler } from 'express'
import { ZodError } from 'zod'
import type { ApiErrorBody } from '../../shared/schemas/errors'
import { HttpError } from './errors'
import { isDatabaseUnavailable } from '../db/client'

/** Seconds a client is asked to wait when the database is away (Retry-After). */
export const DATABASE_RETRY_AFTER_SECONDS = 5

function body(req: { id: string }, code: string, message: string, details?: ApiErrorBody['error']['details']): ApiErrorBody {
  return { error: { code, message, ...(details ? { details } : {}), requestId: req.id } }
}

/** What the request log records for an outage: the driver's code and words, no stack. */
class DatabaseUnavailable extends Error {
  constructor(message: string) {
    super(message)
    this.stack = undefined
  }
}

/** Unknown /api routes answer 404 JSON (the web app answers other paths). */
export const apiNotFound: RequestHandler = (req, res) => {
  res.status(404).json(body(req, 'route_not_found', `No API route ${req.method} ${req.path}.`))
}

/** The one error shape; unknown errors become a logged 500 with a generic message. */
export const errorHandler: ErrorRequestHandler = (err, req, res, _next) => {
  if (res.headersSent) return
  if (err instanceof HttpError) {
    res.status(err.status).json(body(req, err.code, err.message, err.details))
    return
  }
  if (err instanceof ZodError) {
    res.status(400).json(body(req, 'validation_failed', 'Some fields need attention.', zodDetails(err)))
    return
  }
  // body-parser: malformed JSON, oversize payloads
  const e = err as { type?: string; status?: number; code?: string }
  if (e.type === 'entity.parse.failed') {
    res.status(400).json(body(req, 'malformed_json', 'The request body is not valid JSON.'))
    return
  }
  if (e.type === 'entity.too.large' || e.code === 'LIMIT_FILE_SIZE') {
    res.status(413).json(body(req, 'payload_too_large', 'The request is too large.'))
    return
  }
  if (typeof e.status === 'number' && e.status >= 400 && e.status < 500) {
    res.status(e.status).json(body(req, 'bad_request', 'The request could not be processed.'))
    return
  }
  // the database is restarting or unreachable: a plain 503 the client may retry, and one log line
  if (isDatabaseUnavailable(err)) {
    let e = err as { code?: string; message?: string; cause?: unknown }
    for (let i = 0; i < 5 && e.cause && typeof e.cause === 'object'; i++) e = e.cause as typeof e // drizzle wraps the driver's error
    // the request's own log line carries this (pino-http reads res.err); no stack for an expected outage
    res.err = new DatabaseUnavailable([e.code, e.message].filter(Boolean).join(' '))
    res.setHeader('Retry-After', String(DATABASE_RETRY_AFTER_SECONDS))
    res.status(503).json(body(req, 'database_unavailable', 'The service is briefly unavailable. Please try again in a moment.'))
    return
  }
  res.err = err instanceof Error ? err : new Error(String(err)) // logged with its stack on the request's line
  res.status(500).json(body(req, 'internal_error', 'Something went wrong on our side. Quote the request id if you report it.'))
}

export function zodDetails(err: ZodError): { path: string; message: string }[] {
  return err.issues.map((i) => ({ path: i.path.join('.'), message: i.message }))
}
