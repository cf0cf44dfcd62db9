import { Router, type Request, type RequestHandler } from 'express'
import type passport from 'passport'
import {
  confirmEmailSchema,
  registerSchema,
  resetRequestSchema,
  setPasswordSchema,
  signInSchema,
  type AccountRequestResponse,
  type MeResponse,
  type SessionUser,
  type SignedIn,
} from '../../../shared/schemas/auth'
import { accountAbilities } from '../../policy/account-policy'
import type { ServiceContext } from '../../context'
import { HttpError } from '../../http/errors'
import { parseWith } from '../../http/validate'
import { perAddressLimit } from '../../http/rate-limit'
import {
  confirmEmailWithToken,
  markSignInSucceeded,
  openSignInAttempt,
  registerComplainant,
  requestPasswordReset,
  setPasswordWithToken,
} from './auth.service'
import { recordSignIn } from '../users/people.service'
import { FREE_FAILURES_PER_ACCOUNT, signInDelayMs, wait, type SignInDelay } from './sign-in-delay'

/** Registrations, reset requests and password settings per address per hour (common practice, no source). */
export const ACCOUNT_REQUESTS_PER_HOUR_PER_ADDRESS = 30

/**
 * The same words whether or not the account exists. Past a few failures (counted for the
 * e-mail address typed, whether or not it has an account) they also say why answers slow down.
 */
const invalidCredentials = (accountFailures: number) =>
  new HttpError(
    401,
    'invalid_credentials',
    accountFailures + 1 > FREE_FAILURES_PER_ACCOUNT
      ? 'E-mail or password is not correct. After several wrong passwords, each try on this account is answered more slowly, for a while.'
      : 'E-mail or password is not correct.',
  )
const unconfirmedEmail = () =>
  new HttpError(
    403,
    'email_not_confirmed',
    'Confirm your e-mail address first: open the link we sent when you created the account. If it has expired, ask for a password link instead — choosing a password also confirms the address.',
  )

/** Starts the session (passport regenerates the session id: no session fixation). */
function logIn(ctx: ServiceContext, req: Request, user: SessionUser): Promise<void> {
  return new Promise<void>((resolve, reject) => req.login(user, (err) => (err ? reject(err) : resolve()))).then(() => recordSignIn(ctx.db, user.id))
}

/** The answer of every call that signs someone in: the user and what the account may do. */
export const signedIn = (user: SessionUser): SignedIn => ({ user, abilities: accountAbilities(user) })

/** What the local strategy found, kept for the next handler of the sign-in route. */
type LocalResult = { user: SessionUser } | { user: false; unconfirmed: boolean }
interface SignInLocals {
  attempt: { id: string; accountFailures: number }
  local: LocalResult
}

/** Runs the local strategy as ordinary middleware; its verdict goes to `res.locals.local`. */
function checkPassword(p: passport.PassportStatic): RequestHandler {
  return (req, res, next) => {
    p.authenticate('local', { session: false }, (err: unknown, user: SessionUser | false, info?: { message?: string }) => {
      if (err) return next(err)
      const locals = res.locals as SignInLocals
      locals.local = user ? { user } : { user: false, unconfirmed: info?.message === 'unconfirmed' }
      next()
    })(req, res, next)
  }
}

export interface AuthRouteOptions {
  /** Wait before answering a sign-in, from the account's recent failures (tests inject a tiny one). */
  signInDelay?: SignInDelay
}

export function authRoutes(ctx: ServiceContext, p: passport.PassportStatic, opts: AuthRouteOptions = {}): Router {
  const r = Router()
  const signInDelay = opts.signInDelay ?? signInDelayMs

  const openAttempt: RequestHandler = async (req, res, next) => {
    const input = parseWith(signInSchema, req.body)
    const attempt = await openSignInAttempt(ctx.db, input.email, req.ip ?? 'unknown')
    const locals = res.locals as SignInLocals
    locals.attempt = attempt
    // the account's failures from elsewhere slow the answer down; they never refuse the right password
    await wait(signInDelay(attempt.accountFailures))
    req.body = input
    next()
  }

  r.post('/auth/sign-in', openAttempt, checkPassword(p), async (req, res) => {
    const { attempt, local: result } = res.locals as SignInLocals
    if (!result.user) {
      if (!result.unconfirmed) throw invalidCredentials(attempt.accountFailures)
      await markSignInSucceeded(ctx.db, attempt.id) // the password was right: not a guess
      throw unconfirmedEmail()
    }
    await markSignInSucceeded(ctx.db, attempt.id)
    await logIn(ctx, req, result.user)
    res.json(signedIn(result.user))
  })

  r.post('/auth/sign-out', (req, res, next) => {
    req.logout((err) => {
      if (err) return next(err)
      req.session.destroy(() => res.status(204).end())
    })
  })

  // an anonymous visitor is an ordinary answer (no user), not an error
  r.get('/me', (req, res) => {
    const body: MeResponse = req.isAuthenticated() ? signedIn(req.user!) : { user: null }
    res.json(body)
  })

  // account work without a session: each costs a password hash or an e-mail
  const accountWork = perAddressLimit({ perHour: ACCOUNT_REQUESTS_PER_HOUR_PER_ADDRESS, code: 'too_many_attempts', message: 'Too many requests from this address. Wait a while and try again.' })

  // the same answer whether or not the address has an account: the e-mail tells the rest
  const accepted: AccountRequestResponse = { ok: true }

  r.post('/auth/register', accountWork, async (req, res) => {
    const input = parseWith(registerSchema, req.body)
    await registerComplainant(ctx, input)
    res.status(202).json(accepted)
  })

  r.post('/auth/confirm-email', accountWork, async (req, res) => {
    const { token } = parseWith(confirmEmailSchema, req.body)
    const user = await confirmEmailWithToken(ctx, token)
    await logIn(ctx, req, user)
    res.json(signedIn(user))
  })

  r.post('/auth/password-reset', accountWork, async (req, res) => {
    const { email } = parseWith(resetRequestSchema, req.body)
    await requestPasswordReset(ctx, email)
    res.status(202).json(accepted)
  })

  r.post('/auth/set-password', accountWork, async (req, res) => {
    const input = parseWith(setPasswordSchema, req.body)
    const user = await setPasswordWithToken(ctx, input.token, input.password)
    await logIn(ctx, req, user)
    res.json(signedIn(user))
  })

  return r
}
