import { randomUUID } from 'node:crypto'
import type { RequestHandler } from 'express'

declare module 'express-serve-static-core' {
  interface Request {
    id: string
  }
}

/** Gives every request an id, echoed in the X-Request-Id header and in error bodies. */
export const requestId: RequestHandler = (req, res, next) => {
  req.id = randomUUID()
  res.setHeader('X-Request-Id', req.id)
  next()
}
