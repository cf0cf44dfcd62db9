/** Every query of the users module. No authorization here: the office is an argument. */
import { and, eq, inArray, sql } from 'drizzle-orm'
import type { Role } from '../../../shared/domain/roles'
import { STAFF_ROLES } from '../../../shared/domain/roles'
import type { Db } from '../../db/client'
import { offices, users, type User } from '../../db/schema'
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
  lastSignedInAt: users.lastSignedInAt,
}

/** A user as the API sends it (`UserRow`), before JSON turns the time into a string. */
export type PublicUser = Omit<UserRow, 'createdAt' | 'lastSignedInAt'> & { createdAt: Date; lastSignedInAt: Date | null }

export async function findUserById(db: Db, id: string): Promise<PublicUser | undefined> {
  const [u] = await db.select(publicUserColumns).from(users).leftJoin(offices, eq(users.officeId, offices.id)).where(eq(users.id, id))
  return u
}

/** The whole account row with this address (password hash included: for the auth module only). */
export async function findUserForSignIn(db: Db, email: string): Promise<User | undefined> {
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

/** A complainant account awaiting confirmation of its address; undefined when the address is taken. */
export async function insertUnconfirmedComplainant(db: Db, values: { email: string; name: string; passwordHash: string }): Promise<string | undefined> {
  const inserted = await db
    .insert(users)
    .values({ ...values, role: 'complainant', emailConfirmedAt: null })
    .onConflictDoNothing({ target: users.email })
    .returning({ id: users.id })
  return inserted[0]?.id
}

/** The name on the account with this address, if there is one. */
export async function findUserNameByEmail(db: Db, email: string): Promise<string | undefined> {
  const [u] = await db.select({ name: users.name }).from(users).where(eq(users.email, email))
  return u?.name
}

/** Confirms an active account's address (keeping an earlier confirmation time); undefined when there is no active account. */
export async function confirmActiveUserEmail(db: Db, userId: string): Promise<string | undefined> {
  const [u] = await db
    .update(users)
    .set({ emailConfirmedAt: sql`coalesce(${users.emailConfirmedAt}, now())` })
    .where(and(eq(users.id, userId), eq(users.active, true)))
    .returning({ id: users.id })
  return u?.id
}

/** Sets an active account's password and confirms its address (as `confirmActiveUserEmail`); undefined when there is no active account. */
export async function setActiveUserPassword(db: Db, userId: string, passwordHash: string): Promise<{ id: string; email: string } | undefined> {
  const [u] = await db
    .update(users)
    .set({ passwordHash, emailConfirmedAt: sql`coalesce(${users.emailConfirmedAt}, now())` })
    .where(and(eq(users.id, userId), eq(users.active, true)))
    .returning({ id: users.id, email: users.email })
  return u
}
