import { and, eq, sql } from 'drizzle-orm'
import type { Db } from '../../db/client'
import { offices, users } from '../../db/schema'

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

export type PublicUser = {
  id: string
  email: string
  name: string
  role: 'complainant' | 'investigator' | 'supervisor' | 'admin'
  officeId: string | null
  officeName: string | null
  active: boolean
  createdAt: Date
}

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
  if (filter.staffOnly) conds.push(sql`${users.role} in ('investigator', 'supervisor')`)
  return db
    .select(publicUserColumns)
    .from(users)
    .leftJoin(offices, eq(users.officeId, offices.id))
    .where(conds.length ? and(...conds) : undefined)
    .orderBy(users.role, users.name)
}
