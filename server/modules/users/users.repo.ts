/** Every query of the users module. No authorization here: the office is an argument. */
import { and, eq, inArray, sql } from 'drizzle-orm'
import type { Role } from '../../../shared/domain/roles'
import { STAFF_ROLES } from '../../../shared/domain/roles'
import type { Db } from '../../db/client'
import { offices, passwordTokens, users } from '../../db/schema'
import type { UserRow } from '../../../shared/schemas/views'

/** The columns of a user that are safe to send to a browser, with the office name. */
export const publicUserColumns = {
  id: users.id,
  email: users.email,
  name: users.name,
  role: users.role,
  officeId: users.officeId,
  officeName: offices.name,
  active: users.active,
  createdAt: users.createdAt,
}

/** A user as the API sends it (`UserRow`), before JSON turns the time into a string. */
export type PublicUser = Omit<UserRow, 'createdAt'> & { createdAt: Date }

export async function findUserById(db: Db, id: string): Promise<PublicUser | undefined> {
  const [u] = await db.select(publicUserColumns).from(users).leftJoin(offices, eq(users.officeId, offices.id)).where(eq(users.id, id))
  return u
}

export async function findUserForSignIn(db: Db, email: string) {
  const [u] = await db.select().from(users).where(eq(users.email, email))
  return u
}

export async function listUsers(db: Db, filter: { officeId?: string; staffOnly?: boolean } = {}): Promise<PublicUser[]> {
  const conds = []
  if (filter.officeId) conds.push(eq(users.officeId, filter.officeId))
  if (filter.staffOnly) conds.push(inArray(users.role, STAFF_ROLES))
  return db
    .select(publicUserColumns)
    .from(users)
    .leftJoin(offices, eq(users.officeId, offices.id))
    .where(conds.length ? and(...conds) : undefined)
    .orderBy(users.role, users.name)
}

/** Active staff of one role in an office (who is e-mailed about its cases). */
export function activeStaffOf(db: Db, officeId: string, role: Role): Promise<{ name: string; email: string }[]> {
  return db
    .select({ name: users.name, email: users.email })
    .from(users)
    .where(and(eq(users.officeId, officeId), eq(users.role, role), eq(users.active, true)))
}

/** A new account without a password; undefined when the address is taken. */
export async function insertUser(db: Db, values: { email: string; name: string; role: Role; officeId: string | null }): Promise<string | undefined> {
  const inserted = await db.insert(users).values(values).onConflictDoNothing({ target: users.email }).returning({ id: users.id })
  return inserted[0]?.id
}

/** Stores the hash of a single-use token that expires after `hours`. */
export async function insertPasswordToken(db: Db, t: { userId: string; tokenHash: string; purpose: 'reset' | 'invite' | 'confirm'; hours: number }): Promise<void> {
  await db.insert(passwordTokens).values({ userId: t.userId, tokenHash: t.tokenHash, purpose: t.purpose, expiresAt: sql`now() + make_interval(hours => ${t.hours})` })
}

/** Sets an account active or not; false when there is no such account. */
export async function setActive(db: Db, userId: string, active: boolean): Promise<boolean> {
  const updated = await db.update(users).set({ active }).where(eq(users.id, userId)).returning({ id: users.id })
  return updated.length > 0
}
