/**
 * Sign-in, complainant registration and passwords. Messages never reveal whether an
 * account exists. Limits are counted in PostgreSQL so they hold across app processes.
 */
import { and, count, eq, gt, isNull, sql } from 'drizzle-orm'
import type { Db } from '../../db/client'
import { withTransaction } from '../../db/client'
import { passwordTokens, signInAttempts, users } from '../../db/schema'
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

/** Refuses with 429 when an account or an address has failed too often recently. */
export async function assertSignInAllowed(db: Db, emailRaw: string, ip: string): Promise<void> {
  const email = emailRaw.trim().toLowerCase()
  const since = sql`now() - make_interval(mins => ${SIGN_IN_WINDOW_MINUTES})`
  const [byAccount] = await db
    .select({ n: count() })
    .from(signInAttempts)
    .where(and(eq(signInAttempts.email, email), eq(signInAttempts.succeeded, false), gt(signInAttempts.at, since)))
  const [byAddress] = await db
    .select({ n: count() })
    .from(signInAttempts)
    .where(and(eq(signInAttempts.ip, ip), eq(signInAttempts.succeeded, false), gt(signInAttempts.at, since)))
  if (byAccount!.n >= MAX_FAILURES_PER_ACCOUNT || byAddress!.n >= MAX_FAILURES_PER_ADDRESS) {
    throw tooManyRequests('Too many sign-in attempts. Wait a few minutes and try again.')
  }
}

export async function recordSignInAttempt(db: Db, emailRaw: string, ip: string, succeeded: boolean): Promise<void> {
  await db.insert(signInAttempts).values({ email: emailRaw.trim().toLowerCase().slice(0, 254), ip, succeeded })
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

/** E-mails a single-use reset link when an active account exists; answers the same either way. */
export async function requestPasswordReset(ctx: ServiceContext, email: string): Promise<void> {
  const [u] = await ctx.db.select().from(users).where(eq(users.email, email))
  if (!u || !u.active) return
  await withTransaction(ctx.pool, async ({ db, client }) => {
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
    return u.id
  })
  return toSessionUser((await findUserById(ctx.db, userId))!)
}
