import { hashToken, newToken } from '../auth/passwords'
import type { Db } from '../../db/client'
import { findCaseIdOfTokenHash, insertTrackingToken } from './cases.repo'

/**
 * Issues a private tracking link for a case. Only the token's SHA-256 hash is stored, so each
 * e-mail to the complainant carries a fresh token; all of a case's tokens work until revoked.
 */
export async function issueTrackingLink(db: Db, publicUrl: string, caseId: string): Promise<string> {
  const { token, tokenHash } = newToken()
  await insertTrackingToken(db, caseId, tokenHash)
  return `${publicUrl}/track/${token}`
}

/** The case a tracking token opens, or undefined for an unknown or revoked token. */
export async function caseIdForToken(db: Db, token: string): Promise<string | undefined> {
  if (!/^[A-Za-z0-9_-]{20,100}$/.test(token)) return undefined
  return findCaseIdOfTokenHash(db, hashToken(token))
}
