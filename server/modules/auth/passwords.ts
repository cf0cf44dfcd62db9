import { createHash, randomBytes } from 'node:crypto'
import { hash, verify } from '@node-rs/argon2'

/** argon2id with the library's defaults (m = 19 MiB, t = 2, p = 1). */
export const hashPassword = (password: string): Promise<string> => hash(password)
export const verifyPassword = (storedHash: string, password: string): Promise<boolean> =>
  verify(storedHash, password).catch(() => false)

/** A hash to verify against when the account does not exist, so timing does not reveal it. */
let decoyHash: Promise<string> | undefined
export const decoyPasswordHash = (): Promise<string> => (decoyHash ??= hash(randomBytes(16).toString('hex')))

/** An unguessable single-use token (256 bits, base64url) and the SHA-256 hash that is stored. */
export function newToken(): { token: string; tokenHash: string } {
  const token = randomBytes(32).toString('base64url')
  return { token, tokenHash: hashToken(token) }
}
export const hashToken = (token: string): string => createHash('sha256').update(token).digest('hex')
