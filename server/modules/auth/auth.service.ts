/**
 * Sign-in, complainant registration, address confirmation and passwords. Answers never reveal
 * whether an account exists (only the right password learns that an address is unconfirmed);
 * registration and reset do the same work either way, and the e-mail tells the owner the rest.
 * Limits are counted in PostgreSQL so they hold across app processes.
 */
import type pg from 'pg'
import { and, count, eq, gt, inArray, isNull, or, sql } from 'drizzle-orm'
import type { Db } from '../../db/client'
import { withTransaction } from '../../db/client'
import { accountMails, passwordTokens, session, signInAttempts, users } from '../../db/schema'
import { badRequest, HttpError } from '../../http/errors'
import { queueMail } from '../../jobs/boss'
import { alreadyRegisteredMail, confirmAddressMail, noAccountResetMail, passwordResetMail } from '../../mail/templates'
import type { ServiceContext } from '../../context'
import type { RegisterInput, SessionUser } from '../../../shared/schemas/auth'
import { findUserById } from '../users/users.repo'
import { linkReportsToConfirmedAccount } from '../cases/cases.repo'
import { decoyPasswordHash, hashPassword, hashToken, newToken, verifyPassword } from './passwords'

export const SIGN_IN_WINDOW_MINUTES = 15
/** Failures on one account from one address before that address is refused for it (not the owner elsewhere). */
export const MAX_FAILURES_PER_ACCOUNT = 5
/** Failures on any accounts from one address before the address is refused. */
export const MAX_FAILURES_PER_ADDRESS = 20
export const RESET_TOKEN_MINUTES = 30
export const CONFIRM_TOKEN_HOURS = 48
/** Reset e-mails one address receives per hour at most, so nobody can flood a mailbox (common practice, no source). */
export const MAX_RESET_MAILS_PER_HOUR = 3
/** "Someone tried to register" e-mails one address receives per hour at most (same reason). */
export const MAX_ACCOUNT_MAILS_PER_HOUR = 3
/** Advisory-lock class of the per-address lock of account requests (any constant unused elsewhere). */
const ACCOUNT_MAIL_LOCK_CLASS = 7207

/** The session's part of a user record (any record with at least these fields). */
export function toSessionUser({ id, email, name, role, officeId, officeName }: SessionUser): SessionUser {
  return { id, email, name, role, officeId, officeName }
}

/** What a password check found. `unconfirmed`: the password is right but the address is not confirmed yet. */
export type CredentialCheck = { user: SessionUser } | { unconfirmed: true } | null

/** The user for these credentials, or null. Inactive accounts and unset passwords fail alike. */
export async function checkCredentials(db: Db, emailRaw: string, password: string): Promise<CredentialCheck> {
  const email = emailRaw.trim().toLowerCase()
  const [u] = await db.select().from(users).where(eq(users.email, email))
  if (!u || !u.passwordHash || !u.active) {
    await verifyPassword(await decoyPasswordHash(), password) // same work as a real check
    return null
  }
  if (!(await verifyPassword(u.passwordHash, password))) return null
  if (!u.emailConfirmedAt) return { unconfirmed: true }
  const full = await findUserById(db, u.id)
  return full ? { user: toSessionUser(full) } : null
}

export interface SignInAttempt {
  id: string
  /** Failed sign-ins on this account in the window, from any address, before this one. */
  accountFailures: number
}

/**
 * Opens a sign-in attempt. Refuses with 429 only the address that has been guessing: too many
 * failures on this account from this address, or on any accounts from this address. Failures
 * from elsewhere never refuse the owner; they only slow the answer down (`signInDelayMs`).
 * The attempt is written (as a failure) before the limits are counted, so concurrent guesses
 * count each other and a burst of parallel requests cannot slip past a limit between a check
 * and a write. A refused attempt is taken back again: knocking on after a refusal does not
 * prolong it. Pass the id to `markSignInSucceeded` when the password was right.
 */
export async function openSignInAttempt(db: Db, emailRaw: string, ip: string): Promise<SignInAttempt> {
  const email = emailRaw.trim().toLowerCase().slice(0, 254)
  const [attempt] = await db.insert(signInAttempts).values({ email, ip, succeeded: false }).returning({ id: signInAttempts.id })
  const since = sql`now() - make_interval(mins => ${SIGN_IN_WINDOW_MINUTES})`
  const recentFailures = and(eq(signInAttempts.succeeded, false), gt(signInAttempts.at, since))
  const [counts] = await db
    .select({
      account: sql<number>`count(*) filter (where ${signInAttempts.email} = ${email})`.mapWith(Number),
      accountFromHere: sql<number>`count(*) filter (where ${signInAttempts.email} = ${email} and ${signInAttempts.ip} = ${ip})`.mapWith(Number),
      fromHere: sql<number>`count(*) filter (where ${signInAttempts.ip} = ${ip})`.mapWith(Number),
    })
    .from(signInAttempts)
    .where(and(recentFailures, or(eq(signInAttempts.email, email), eq(signInAttempts.ip, ip))))
  // the counts include this attempt
  if (counts!.accountFromHere > MAX_FAILURES_PER_ACCOUNT || counts!.fromHere > MAX_FAILURES_PER_ADDRESS) {
    await db.delete(signInAttempts).where(eq(signInAttempts.id, attempt!.id))
    throw new HttpError(
      429,
      'too_many_attempts',
      counts!.accountFromHere > MAX_FAILURES_PER_ACCOUNT
        ? `Too many wrong passwords for this account from your connection. Wait ${SIGN_IN_WINDOW_MINUTES} minutes, or ask for a link by e-mail to choose a new password: that signs you in at once.`
        : `Too many wrong passwords from your connection. Wait ${SIGN_IN_WINDOW_MINUTES} minutes and try again.`,
    )
  }
  return { id: attempt!.id, accountFailures: counts!.account - 1 }
}

/** The password was right: the attempt no longer counts as a failure. */
export async function markSignInSucceeded(db: Db, attemptId: string): Promise<void> {
  await db.update(signInAttempts).set({ succeeded: true }).where(eq(signInAttempts.id, attemptId))
}

/** Serializes account work for one address (also one that has no account), inside a transaction. */
async function lockAddress(client: pg.PoolClient, email: string): Promise<void> {
  await client.query('SELECT pg_advisory_xact_lock($1, hashtext($2))', [ACCOUNT_MAIL_LOCK_CLASS, email])
}

/** Account mails of this kind the address received in the last hour (the caller holds its lock). */
async function recentAccountMails(db: Db, email: string, kind: 'register' | 'reset'): Promise<number> {
  const [recent] = await db
    .select({ n: count() })
    .from(accountMails)
    .where(and(eq(accountMails.email, email), eq(accountMails.kind, kind), gt(accountMails.at, sql`now() - interval '1 hour'`)))
  return recent!.n
}

/**
 * Registers a complainant account (reports never require one). The answer is the same whether
 * or not the address already has an account, and so is the work: the password is always
 * hashed, and one transaction locks the address, tries the insert and queues one e-mail —
 * a confirmation link for a new account, a "someone tried to register" note for an existing
 * one. The new account works once the address is confirmed.
 */
export async function registerComplainant(ctx: ServiceContext, input: RegisterInput): Promise<void> {
  const passwordHash = await hashPassword(input.password)
  await withTransaction(ctx.pool, async ({ db, client }) => {
    await lockAddress(client, input.email)
    const sentRecently = await recentAccountMails(db, input.email, 'register')
    const inserted = await db
      .insert(users)
      .values({ email: input.email, name: input.name, role: 'complainant', passwordHash, emailConfirmedAt: null })
      .onConflictDoNothing({ target: users.email })
      .returning({ id: users.id })
    if (inserted.length > 0) {
      const { token, tokenHash } = newToken()
      await db.insert(passwordTokens).values({ userId: inserted[0]!.id, tokenHash, purpose: 'confirm', expiresAt: sql`now() + make_interval(hours => ${CONFIRM_TOKEN_HOURS})` })
      const link = `${ctx.publicUrl}/confirm-email?token=${encodeURIComponent(token)}`
      await queueMail(ctx.boss, client, confirmAddressMail({ to: input.email, name: input.name, link, expiresHours: CONFIRM_TOKEN_HOURS }), ctx.mailQueue)
    } else {
      if (sentRecently >= MAX_ACCOUNT_MAILS_PER_HOUR) return
      const [existing] = await db.select({ name: users.name }).from(users).where(eq(users.email, input.email))
      const mail = alreadyRegisteredMail({ to: input.email, name: existing!.name, signInLink: `${ctx.publicUrl}/sign-in`, resetLink: `${ctx.publicUrl}/forgot-password` })
      await queueMail(ctx.boss, client, mail, ctx.mailQueue)
    }
    await db.insert(accountMails).values({ email: input.email, kind: 'register' })
  })
}

/**
 * Confirms the address of a new account from its e-mailed link (single use) and returns the
 * user, to be signed in. From now on the account also lists the reports filed with the
 * address without signing in.
 */
export async function confirmEmailWithToken(ctx: ServiceContext, token: string): Promise<SessionUser> {
  const userId = await withTransaction(ctx.pool, async ({ db }) => {
    const [t] = await db
      .update(passwordTokens)
      .set({ usedAt: sql`now()` })
      .where(and(eq(passwordTokens.tokenHash, hashToken(token)), eq(passwordTokens.purpose, 'confirm'), isNull(passwordTokens.usedAt), gt(passwordTokens.expiresAt, sql`now()`)))
      .returning({ userId: passwordTokens.userId })
    if (!t) throw badRequest('invalid_token', 'This confirmation link is not valid any more. Ask for a password link instead: choosing a password also confirms your address.')
    const [u] = await db
      .update(users)
      .set({ emailConfirmedAt: sql`coalesce(${users.emailConfirmedAt}, now())` })
      .where(and(eq(users.id, t.userId), eq(users.active, true)))
      .returning({ id: users.id })
    if (!u) throw badRequest('invalid_token', 'This confirmation link is not valid any more.')
    await linkReportsToConfirmedAccount(db, u.id)
    return u.id
  })
  return toSessionUser((await findUserById(ctx.db, userId))!)
}

/**
 * Answers a password-reset request the same way, with the same work, whether or not an
 * active account exists: one transaction locks the address, counts its recent mails and
 * queues one e-mail — a single-use reset link to an account, or a note that there is no
 * account. At most MAX_ACCOUNT_MAILS_PER_HOUR such mails reach one address in an hour.
 */
export async function requestPasswordReset(ctx: ServiceContext, email: string): Promise<void> {
  await withTransaction(ctx.pool, async ({ db, client }) => {
    // one request per address at a time, so concurrent requests cannot all pass the count
    await lockAddress(client, email)
    const [u] = await db.select().from(users).where(eq(users.email, email))
    if ((await recentAccountMails(db, email, 'reset')) >= MAX_RESET_MAILS_PER_HOUR) return
    if (u && u.active) {
      const { token, tokenHash } = newToken()
      await db.insert(passwordTokens).values({
        userId: u.id,
        tokenHash,
        purpose: 'reset',
        expiresAt: sql`now() + make_interval(mins => ${RESET_TOKEN_MINUTES})`,
      })
      const link = `${ctx.publicUrl}/set-password?token=${encodeURIComponent(token)}`
      await queueMail(ctx.boss, client, passwordResetMail({ to: u.email, name: u.name, link, expiresMinutes: RESET_TOKEN_MINUTES }), ctx.mailQueue)
    } else {
      await queueMail(ctx.boss, client, noAccountResetMail({ to: email, registerLink: `${ctx.publicUrl}/register` }), ctx.mailQueue)
    }
    await db.insert(accountMails).values({ email, kind: 'reset' })
  })
}

/**
 * Sets a password from a reset or invitation token. The token is used once: it is marked
 * used in the same statement that checks it, so two concurrent uses cannot both succeed.
 * Every other outstanding token and every existing session of the account end with it.
 * Following the e-mailed link also proves the address (it confirms it) and clears the
 * account's recent sign-in failures, so nobody stays slowed down or refused after a reset.
 */
export async function setPasswordWithToken(ctx: ServiceContext, token: string, password: string): Promise<SessionUser> {
  const passwordHash = await hashPassword(password)
  const userId = await withTransaction(ctx.pool, async ({ db }) => {
    const [t] = await db
      .update(passwordTokens)
      .set({ usedAt: sql`now()` })
      .where(
        and(
          eq(passwordTokens.tokenHash, hashToken(token)),
          inArray(passwordTokens.purpose, ['reset', 'invite']),
          isNull(passwordTokens.usedAt),
          gt(passwordTokens.expiresAt, sql`now()`),
        ),
      )
      .returning({ userId: passwordTokens.userId })
    if (!t) throw badRequest('invalid_token', 'This link is not valid any more. Ask for a new one.')
    const [u] = await db
      .update(users)
      .set({ passwordHash, emailConfirmedAt: sql`coalesce(${users.emailConfirmedAt}, now())` })
      .where(and(eq(users.id, t.userId), eq(users.active, true)))
      .returning({ id: users.id, email: users.email })
    if (!u) throw badRequest('invalid_token', 'This link is not valid any more. Ask for a new one.')
    await linkReportsToConfirmedAccount(db, u.id)
    // other outstanding links of this user stop working too
    await db.update(passwordTokens).set({ usedAt: sql`now()` }).where(and(eq(passwordTokens.userId, t.userId), isNull(passwordTokens.usedAt)))
    // and so do the sessions signed in before: whoever held one (or knew the old password) is out
    await db.delete(session).where(sql`${session.sess}->'passport'->>'user' = ${t.userId}`)
    // the account's failed sign-ins no longer slow it down or refuse anyone on it
    await db.delete(signInAttempts).where(and(eq(signInAttempts.email, u.email), eq(signInAttempts.succeeded, false)))
    return u.id
  })
  return toSessionUser((await findUserById(ctx.db, userId))!)
}
