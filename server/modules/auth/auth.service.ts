/**
 * Sign-in, complainant registration, address confirmation and passwords. Answers never reveal
 * whether an account exists (only the right password learns that an address is unconfirmed);
 * registration and reset do the same work either way, and the e-mail tells the owner the rest.
 * Limits are counted in PostgreSQL so they hold across app processes.
 */
import type { Db } from '../../db/client'
import { withTransaction } from '../../db/client'
import { badRequest, HttpError } from '../../http/errors'
import { queueMail } from '../../jobs/boss'
import { alreadyRegisteredMail, confirmAddressMail, noAccountResetMail, passwordResetMail } from '../../mail/templates'
import type { ServiceContext } from '../../context'
import type { RegisterInput, SessionUser } from '../../../shared/schemas/auth'
import { confirmActiveUserEmail, findUserById, findUserForSignIn, findUserNameByEmail, insertUnconfirmedComplainant, setActiveUserPassword } from '../users/users.repo'
import { linkReportsToConfirmedAccount } from '../cases/cases.repo'
import {
  consumePasswordToken,
  countAccountMailsLastHour,
  countRecentSignInFailures,
  deleteFailedSignInAttempts,
  deleteSessionsOfUser,
  deleteSignInAttempt,
  expireUnusedPasswordTokens,
  insertAccountMail,
  insertFailedSignInAttempt,
  insertPasswordToken,
  lockAccountAddress,
  markSignInAttemptSucceeded,
} from './auth.repo'
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

/** The session's part of a user record (any record with at least these fields). */
export function toSessionUser({ id, email, name, role, officeId, officeName }: SessionUser): SessionUser {
  return { id, email, name, role, officeId, officeName }
}

/** What a password check found. `unconfirmed`: the password is right but the address is not confirmed yet. */
export type CredentialCheck = { user: SessionUser } | { unconfirmed: true } | null

/** The user for these credentials, or null. Inactive accounts and unset passwords fail alike. */
export async function checkCredentials(db: Db, emailRaw: string, password: string): Promise<CredentialCheck> {
  const email = emailRaw.trim().toLowerCase()
  const u = await findUserForSignIn(db, email)
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
  const attemptId = await insertFailedSignInAttempt(db, email, ip)
  const counts = await countRecentSignInFailures(db, email, ip, SIGN_IN_WINDOW_MINUTES)
  // the counts include this attempt
  if (counts.accountFromHere > MAX_FAILURES_PER_ACCOUNT || counts.fromHere > MAX_FAILURES_PER_ADDRESS) {
    await deleteSignInAttempt(db, attemptId)
    throw new HttpError(
      429,
      'too_many_attempts',
      counts.accountFromHere > MAX_FAILURES_PER_ACCOUNT
        ? `Too many wrong passwords for this account from your connection. Wait ${SIGN_IN_WINDOW_MINUTES} minutes, or ask for a link by e-mail to choose a new password: that signs you in at once.`
        : `Too many wrong passwords from your connection. Wait ${SIGN_IN_WINDOW_MINUTES} minutes and try again.`,
    )
  }
  return { id: attemptId, accountFailures: counts.account - 1 }
}

/** The password was right: the attempt no longer counts as a failure. */
export async function markSignInSucceeded(db: Db, attemptId: string): Promise<void> {
  await markSignInAttemptSucceeded(db, attemptId)
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
    await lockAccountAddress(client, input.email)
    const sentRecently = await countAccountMailsLastHour(db, input.email, 'register')
    const newUserId = await insertUnconfirmedComplainant(db, { email: input.email, name: input.name, passwordHash })
    if (newUserId) {
      const { token, tokenHash } = newToken()
      await insertPasswordToken(db, { userId: newUserId, tokenHash, purpose: 'confirm', hours: CONFIRM_TOKEN_HOURS })
      const link = `${ctx.publicUrl}/confirm-email?token=${encodeURIComponent(token)}`
      await queueMail(ctx.boss, client, confirmAddressMail({ to: input.email, name: input.name, link, expiresHours: CONFIRM_TOKEN_HOURS }), ctx.mailQueue)
    } else {
      if (sentRecently >= MAX_ACCOUNT_MAILS_PER_HOUR) return
      const existingName = await findUserNameByEmail(db, input.email)
      const mail = alreadyRegisteredMail({ to: input.email, name: existingName!, signInLink: `${ctx.publicUrl}/sign-in`, resetLink: `${ctx.publicUrl}/forgot-password` })
      await queueMail(ctx.boss, client, mail, ctx.mailQueue)
    }
    await insertAccountMail(db, input.email, 'register')
  })
}

/**
 * Confirms the address of a new account from its e-mailed link (single use) and returns the
 * user, to be signed in. From now on the account also lists the reports filed with the
 * address without signing in.
 */
export async function confirmEmailWithToken(ctx: ServiceContext, token: string): Promise<SessionUser> {
  const userId = await withTransaction(ctx.pool, async ({ db }) => {
    // marked used in the statement that checks it: a link works once
    const tokenUserId = await consumePasswordToken(db, hashToken(token), ['confirm'])
    if (!tokenUserId) throw badRequest('invalid_token', 'This confirmation link is not valid any more. Ask for a password link instead: choosing a password also confirms your address.')
    const confirmedId = await confirmActiveUserEmail(db, tokenUserId)
    if (!confirmedId) throw badRequest('invalid_token', 'This confirmation link is not valid any more.')
    await linkReportsToConfirmedAccount(db, confirmedId)
    return confirmedId
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
    await lockAccountAddress(client, email)
    const u = await findUserForSignIn(db, email)
    if ((await countAccountMailsLastHour(db, email, 'reset')) >= MAX_RESET_MAILS_PER_HOUR) return
    if (u && u.active) {
      const { token, tokenHash } = newToken()
      await insertPasswordToken(db, { userId: u.id, tokenHash, purpose: 'reset', minutes: RESET_TOKEN_MINUTES })
      const link = `${ctx.publicUrl}/set-password?token=${encodeURIComponent(token)}`
      await queueMail(ctx.boss, client, passwordResetMail({ to: u.email, name: u.name, link, expiresMinutes: RESET_TOKEN_MINUTES }), ctx.mailQueue)
    } else {
      await queueMail(ctx.boss, client, noAccountResetMail({ to: email, registerLink: `${ctx.publicUrl}/register` }), ctx.mailQueue)
    }
    await insertAccountMail(db, email, 'reset')
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
    const tokenUserId = await consumePasswordToken(db, hashToken(token), ['reset', 'invite'])
    if (!tokenUserId) throw badRequest('invalid_token', 'This link is not valid any more. Ask for a new one.')
    const u = await setActiveUserPassword(db, tokenUserId, passwordHash)
    if (!u) throw badRequest('invalid_token', 'This link is not valid any more. Ask for a new one.')
    await linkReportsToConfirmedAccount(db, u.id)
    // other outstanding links of this user stop working too
    await expireUnusedPasswordTokens(db, tokenUserId)
    // and so do the sessions signed in before: whoever held one (or knew the old password) is out
    await deleteSessionsOfUser(db, tokenUserId)
    // the account's failed sign-ins no longer slow it down or refuse anyone on it
    await deleteFailedSignInAttempts(db, u.email)
    return u.id
  })
  return toSessionUser((await findUserById(ctx.db, userId))!)
}
