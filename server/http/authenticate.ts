import type { Request, RequestHandler } from 'express'
import type { Role } from '../../shared/domain/roles'
import type { SessionUser } from '../../shared/schemas/auth'
import type { Actor } from '../policy/policy'
import { forbidden, unauthenticated } from './errors'

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    /** The signed-in user (the session's shape, declared once in shared/schemas/auth). */
    // eslint-disable-next-line @typescript-eslint/no-empty-object-type -- merges the shared shape into Express's declaration
    interface User extends SessionUser {}
  }
}

/** 401 unless signed in. */
export const requireUser: RequestHandler = (req, _res, next) => {
  next(req.isAuthenticated() ? undefined : unauthenticated())
}

/** 401 unless signed in; 403 unless the role is one of `roles`. */
export function requireRole(...roles: Role[]): RequestHandler {
  return (req, _res, next) => {
    if (!req.isAuthenticated()) return next(unauthenticated())
    next(roles.includes(req.user!.role) ? undefined : forbidden())
  }
}

/** The policy's view of the signed-in user. */
export function actorOf(req: Request): Actor {
  if (!req.user) throw unauthenticated()
  return { id: req.user.id, role: req.user.role, officeId: req.user.officeId }
}
