/**
 * Per-address limits for unauthenticated routes that cost a password hash or an e-mail.
 * Counted in this process's memory (sign-in limits are counted in PostgreSQL instead).
 */
import rateLimit from 'express-rate-limit'
import { HttpError } from './errors'

export function perAddressLimit(opts: { perHour: number; code: string; message: string }) {
  return rateLimit({
    windowMs: 60 * 60 * 1000,
    limit: opts.perHour,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: (_req, _res, next) => next(new HttpError(429, opts.code, opts.message)),
  })
}
