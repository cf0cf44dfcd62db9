import { Router, type Request } from 'express'
import type passport from 'passport'
import { registerSchema, resetRequestSchema, setPasswordSchema, signInSchema, type SessionUser } from '../../../shared/schemas/auth'
import type { ServiceContext } from '../../context'
import { HttpError } from '../../http/errors'
import { requireUser } from '../../http/authenticate'
import { parseWith } from '../../http/validate'
import { perAddressLimit } from '../../http/rate-limit'
import {
  markSignInSucceeded,
  openSignInAttempt,
  registerComplainant,
  requestPasswordReset,
  setPasswordWithToken,
} from './auth.service'

/** Registrations, reset requests and password settings per address per hour (common practice, no source). */
export const ACCOUNT_REQUESTS_PER_HOUR_PER_ADDRESS = 30

const invalidCredentials = () => new HttpError(401, 'invalid_credentials', 'E-mail or password is not correct.')

/** passport.login regenerates the session id (no session fixation). */
function logIn(req: Request, user: SessionUser): Promise<void> {
  return new Promise((resolve, reject) => req.login(user, (err) => (err ? reject(err) : resolve())))
}

function authenticateLocal(p: passport.PassportStatic, req: Request): Promise<SessionUser | false> {
  return new Promise((resolve, reject) => {
    p.authenticate('local', { session: false }, (err: unknown, user: SessionUser | false) => (err ? reject(err) : resolve(user)))(req, {} as never, reject)
  })
}

export function authRoutes(ctx: ServiceContext, p: passport.PassportStatic): Router {
  const r = Router()

  r.post('/auth/sign-in', async (req, res) => {
    const input = parseWith(signInSchema, req.body)
    const ip = req.ip ?? 'unknown'
    const attemptId = await openSignInAttempt(ctx.db, input.email, ip)
    req.body = input
    const user = await authenticateLocal(p, req)
    if (!user) throw invalidCredentials()
    await markSignInSucceeded(ctx.db, attemptId)
    await logIn(req, user)
    res.json({ user })
  })

  r.post('/auth/sign-out', (req, res, next) => {
    req.logout((err) => {
      if (err) return next(err)
      req.session.destroy(() => res.status(204).end())
    })
  })

  r.get('/me', requireUser, (req, res) => {
    res.json({ user: req.user })
  })

  // account work without a session: each costs a password hash or an e-mail
  const accountWork = perAddressLimit({ perHour: ACCOUNT_REQUESTS_PER_HOUR_PER_ADDRESS, code: 'too_many_attempts', message: 'Too many requests from this address. Wait a while and try again.' })

  r.post('/auth/register', accountWork, async (req, res) => {
    const input = parseWith(registerSchema, req.body)
    const user = await registerComplainant(ctx, input)
    await logIn(req, user)
    res.status(201).json({ user })
  })

  r.post('/auth/password-reset', accountWork, async (req, res) => {
    const { email } = parseWith(resetRequestSchema, req.body)
    await requestPasswordReset(ctx, email)
    res.status(202).json({ ok: true })
  })

  r.post('/auth/set-password', accountWork, async (req, res) => {
    const input = parseWith(setPasswordSchema, req.body)
    const user = await setPasswordWithToken(ctx, input.token, input.password)
    await logIn(req, user)
    res.json({ user })
  })

  return r
}
