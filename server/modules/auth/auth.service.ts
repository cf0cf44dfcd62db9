/**
 * Sign-in, complainant registration and passwords. Messages never reveal whether an
 * account exists. Limits are counted in PostgreSQL so they hold across app processes.
 */
import { and, count, eq, gt, isNull, sql } from 'drizzle-orm'
import type { Db } from '../../db/client'
import { withTransaction } from '../../db/client'
import { passwordTokens, session, signInAttempts, users } from '../../db/schema'
import { conflict, badRequest, tooManyRequests } from '../../http/errors'
import { queueMail } from '../../jobs/boss'
import { passwordResetMail } from '../../mail/templates'
import type { ServiceContext } from '../../context'
import type { RegisterInput } from '../../../shared/schemas/auth'
import type { SessionUser } from '../../../shared/schemas/auth'
import { findUserById } from '../users/users.repo'
import { decoyPasswordHash, hashPassword, hashToken, newToken, verifyPassword } from './passwords'

export const SIGN_IN_WINDOW_MINUTES = 15
export const MAX_FAILURES_PER_ACCOUNT = 5
export const MAX_FAILURES_PER_ADDRESS = 20
export const RESET_TOKEN_MINUTES = 30
/** Reset e-mails one account receives per hour at most, so nobody can flood a mailbox (common practice, no source). */
export const MAX_RESET_MAILS_PER_HOUR = 3

export function toSessionUser(u: { id: string; email: string; name: string; role: SessionUser['role']; officeId: string | null; officeName: string | null }): SessionUser {
  return { id: u.id, email: u.email, name: u.name, role: u.role, officeId: u.officeId, officeName: u.officeName }
}

/** The user for these credentials, or null. Inactive accounts and unset passwords fail alike. */
export async function checkCredentials(db: Db, emailRaw: string, password: string): Promise<SessionUser | null> {
  const email = emailRaw.trim().toLowerCase()
  const [u] = await db.select().from(users).where(eq(users.email, email))
  if (!u || !u.passwordHash || !u.active) {
    await verifyPassword(await decoyPasswordHash(), password) // same work as a real check
    return null
  }
  if (!(await verifyPassword(u.passwordHash, password))) return null
  const full = await findUserById(db, u.id)
  return full ? toSessionUser(full) : null
}

/**
 * Opens a sign-in attempt and refuses with 429 when the account or the address has failed too
 * often recently. The attempt is written (as a failure) before the limits are counted, so
 * concurrent guesses count each other and a burst of parallel requests cannot slip past the
 * limit between a check and a write. A refused attempt is taken back again: knocking on a
 * locked account does not prolong its lock. Returns the attempt's id for `markSignInSucceeded`.
 */
export async function openSignInAttempt(db: Db, emailRaw: string, ip: string): Promise<string> {
  const email = emailRaw.trim().toLowerCase().slice(0, 254)
  const [attempt] = await db.insert(signInAttempts).values({ email, ip, succeeded: false }).returning({ id: signInAttempts.id })
  const since = sql`now() - make_interval(mins => ${SIGN_IN_WINDOW_MINUTES})`
  const [byAccount] = await db
    .select({ n: count() })
    .from(signInAttempts)
    .where(and(eq(signInAttempts.email, email), eq(signInAttempts.succeeded, false), gt(signInAttempts.at, since)))
  const [byAddress] = await db
    .select({ n: count() })
    .from(signInAttempts)
    .where(and(eq(signInAttempts.ip, ip), eq(signInAttempts.succeeded, false), gt(signInAttempts.at, since)))
  // the counts include this attempt
  if (byAccount!.n > MAX_FAILURES_PER_ACCOUNT || byAddress!.n > MAX_FAILURES_PER_ADDRESS) {
    await db.delete(signInAttempts).where(eq(signInAttempts.id, attempt!.id))
    throw tooManyRequests('Too many sign-in attempts. Wait a few minutes and try again.')
  }
  return attempt!.id
}

/** The password was right: the attempt no longer counts as a failure. */
export async function markSignInSucceeded(db: Db, attemptId: string): Promise<void> {
  await db.update(signInAttempts).set({ succeeded: true }).where(eq(signInAttempts.id, attemptId))
}

/** Creates a complainant account (reports never require one). */
export async function registerComplainant(ctx: ServiceContext, input: RegisterInput): Promise<SessionUser> {
  const passwordHash = await hashPassword(input.password)
  const inserted = await ctx.db
    .insert(users)
    .values({ email: input.email, name: input.name, role: 'complainant', passwordHash })
    .onConflictDoNothing({ target: users.email })
    .returning({ id: users.id })
  if (inserted.length === 0) throw conflict('email_taken', 'An account with this e-mail address already exists. Sign in, or reset your password.')
  return toSessionUser((await findUserById(ctx.db, inserted[0]!.id))!)
}

/**
 * E-mails a single-use reset link when an active account exists and has not had
 * MAX_RESET_MAILS_PER_HOUR of them in the last hour; the caller's answer is the same either way.
 */
export async function requestPasswordReset(ctx: ServiceContext, email: string): Promise<void> {
  const [u] = await ctx.db.select().from(users).where(eq(users.email, email))
  if (!u || !u.active) return
  await withTransaction(ctx.pool, async ({ db, client }) => {
    // one request per account at a time, so concurrent requests cannot all pass the count
    await db.select({ id: users.id }).from(users).where(eq(users.id, u.id)).for('no key update')
    const [recent] = await db
      .select({ n: count() })
      .from(passwordTokens)
      .where(and(eq(passwordTokens.userId, u.id), eq(passwordTokens.purpose, 'reset'), gt(passwordTokens.createdAt, sql`now() - interval '1 hour'`)))
    if (recent!.n >= MAX_RESET_MAILS_PER_HOUR) return
    const { token, tokenHash } = newToken()
    await db.insert(passwordTokens).values({
      userId: u.id,
      tokenHash,
      purpose: 'reset',
      expiresAt: sql`now() + make_interval(mins => ${RESET_TOKEN_MINUTES})`,
    })
    const link = `${ctx.publicUrl}/set-password?token=${encodeURIComponent(token)}`
    await queueMail(ctx.boss, client, passwordResetMail({ to: u.email, name: u.name, link, expiresMinutes: RESET_TOKEN_MINUTES }), ctx.mailQueue)
  })
}

/**
 * Sets a password from a reset or invitation token. The token is used once: it is marked
 * used in the same statement that checks it, so two concurrent uses cannot both succeed.
 * Every other outstanding token and every existing session of the account end with it.
 */
export async function setPasswordWithToken(ctx: ServiceContext, token: string, password: string): Promise<SessionUser> {
  const passwordHash = await hashPassword(password)
  const userId = await withTransaction(ctx.pool, async ({ db }) => {
    const [t] = await db
      .update(passwordTokens)
      .set({ usedAt: sql`now()` })
      .where(and(eq(passwordTokens.tokenHash, hashToken(token)), isNull(passwordTokens.usedAt), gt(passwordTokens.expiresAt, sql`now()`)))
      .returning({ userId: passwordTokens.userId })
    if (!t) throw badRequest('invalid_token', 'This link is not valid any more. Ask for a new one.')
    const [u] = await db.update(users).set({ passwordHash }).where(and(eq(users.id, t.userId), eq(users.active, true))).returning({ id: users.id })
    if (!u) throw badRequest('invalid_token', 'This link is not valid any more. Ask for a new one.')
    // other outstanding links of this user stop working too
    await db.update(passwordTokens).set({ usedAt: sql`now()` }).where(and(eq(passwordTokens.userId, t.userId), isNull(passwordTokens.usedAt)))
    // and so do the sessions signed in before: whoever held one (or knew the old password) is out
    await db.delete(session).where(sql`${session.sess}->'passport'->>'user' = ${t.userId}`)
    return u.id
  })
  return toSessionUser((await findUserById(ctx.db, userId))!)
}
