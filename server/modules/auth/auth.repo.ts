/**
 * Every query of the auth module that is not about a user's own row (those are in users.repo):
 * sign-in attempts, account mails, single-use password tokens, sessions and the per-address
 * lock. No decisions here: limits, windows and lifetimes are arguments. Functions that must run
 * in a caller's transaction take that transaction's `db` (or `client`).
 */
import type pg from 'pg'
import { and, count, eq, gt, inArray, isNull, or, sql } from 'drizzle-orm'
import type { Db } from '../../db/client'
import { accountMails, passwordTokens, session, signInAttempts, type ACCOUNT_MAIL_KINDS, type PASSWORD_TOKEN_PURPOSES } from '../../db/schema'

export type TokenPurpose = (typeof PASSWORD_TOKEN_PURPOSES)[number]
export type AccountMailKind = (typeof ACCOUNT_MAIL_KINDS)[number]

/** Advisory-lock class of the per-address lock of account requests (any constant unused elsewhere). */
const ACCOUNT_MAIL_LOCK_CLASS = 7207

// ---------------------------------------------------------------- sign-in attempts

/** Writes a sign-in attempt as a failure (it counts before it is checked); returns its id. */
export async function insertFailedSignInAttempt(db: Db, email: string, ip: string): Promise<string> {
  const [attempt] = await db.insert(signInAttempts).values({ email, ip, succeeded: false }).returning({ id: signInAttempts.id })
  return attempt!.id
}

export interface SignInFailureCounts {
  /** Failures on this account from any address. */
  account: number
  /** Failures on this account from this address. */
  accountFromHere: number
  /** Failures on any accounts from this address. */
  fromHere: number
}

/** Failed sign-ins of the last `windowMinutes` on this account or from this address, in one statement. */
export async function countRecentSignInFailures(db: Db, email: string, ip: string, windowMinutes: number): Promise<SignInFailureCounts> {
  const since = sql`now() - make_interval(mins => ${windowMinutes})`
  const recentFailures = and(eq(signInAttempts.succeeded, false), gt(signInAttempts.at, since))
  const [counts] = await db
    .select({
      account: sql<number>`count(*) filter (where ${signInAttempts.email} = ${email})`.mapWith(Number),
      accountFromHere: sql<number>`count(*) filter (where ${signInAttempts.email} = ${email} and ${signInAttempts.ip} = ${ip})`.mapWith(Number),
      fromHere: sql<number>`count(*) filter (where ${signInAttempts.ip} = ${ip})`.mapWith(Number),
    })
    .from(signInAttempts)
    .where(and(recentFailures, or(eq(signInAttempts.email, email), eq(signInAttempts.ip, ip))))
  return counts!
}

export async function deleteSignInAttempt(db: Db, attemptId: string): Promise<void> {
  await db.delete(signInAttempts).where(eq(signInAttempts.id, attemptId))
}

export async function markSignInAttemptSucceeded(db: Db, attemptId: string): Promise<void> {
  await db.update(signInAttempts).set({ succeeded: true }).where(eq(signInAttempts.id, attemptId))
}

/** Removes the failed sign-ins on an account (from every address). */
export async function deleteFailedSignInAttempts(db: Db, email: string): Promise<void> {
  await db.delete(signInAttempts).where(and(eq(signInAttempts.email, email), eq(signInAttempts.succeeded, false)))
}

// ---------------------------------------------------------------- account mails and the address lock

/**
 * Serializes account work for one address (also one that has no account) until the end of the
 * caller's transaction: `client` must be that transaction's client.
 */
export async function lockAccountAddress(client: pg.PoolClient, email: string): Promise<void> {
  await client.query('SELECT pg_advisory_xact_lock($1, hashtext($2))', [ACCOUNT_MAIL_LOCK_CLASS, email])
}

/** Account mails of this kind the address received in the last hour (the caller holds its lock). */
export async function countAccountMailsLastHour(db: Db, email: string, kind: AccountMailKind): Promise<number> {
  const [recent] = await db
    .select({ n: count() })
    .from(accountMails)
    .where(and(eq(accountMails.email, email), eq(accountMails.kind, kind), gt(accountMails.at, sql`now() - interval '1 hour'`)))
  return recent!.n
}

export async function insertAccountMail(db: Db, email: string, kind: AccountMailKind): Promise<void> {
  await db.insert(accountMails).values({ email, kind })
}

// ---------------------------------------------------------------- single-use password tokens

/** Stores the hash of a single-use token that expires after `hours` or `minutes` from now. */
export async function insertPasswordToken(
  db: Db,
  t: { userId: string; tokenHash: string; purpose: TokenPurpose } & ({ hours: number } | { minutes: number }),
): Promise<void> {
  const expiresAt = 'hours' in t ? sql`now() + make_interval(hours => ${t.hours})` : sql`now() + make_interval(mins => ${t.minutes})`
  await db.insert(passwordTokens).values({ userId: t.userId, tokenHash: t.tokenHash, purpose: t.purpose, expiresAt })
}

/**
 * Uses a token: marks it used in the same statement that checks it (right hash, one of these
 * purposes, unused, unexpired), so two concurrent uses cannot both succeed. Returns its user's
 * id, or undefined when the token is not valid.
 */
export async function consumePasswordToken(db: Db, tokenHash: string, purposes: readonly [TokenPurpose, ...TokenPurpose[]]): Promise<string | undefined> {
  const [t] = await db
    .update(passwordTokens)
    .set({ usedAt: sql`now()` })
    .where(and(eq(passwordTokens.tokenHash, tokenHash), inArray(passwordTokens.purpose, [...purposes]), isNull(passwordTokens.usedAt), gt(passwordTokens.expiresAt, sql`now()`)))
    .returning({ userId: passwordTokens.userId })
  return t?.userId
}

/** Marks every unused token of a user used. */
export async function expireUnusedPasswordTokens(db: Db, userId: string): Promise<void> {
  await db.update(passwordTokens).set({ usedAt: sql`now()` }).where(and(eq(passwordTokens.userId, userId), isNull(passwordTokens.usedAt)))
}

// ---------------------------------------------------------------- sessions

/** Ends every stored session signed in as this user. */
export async function deleteSessionsOfUser(db: Db, userId: string): Promise<void> {
  await db.delete(session).where(sql`${session.sess}->'passport'->>'user' = ${userId}`)
}
