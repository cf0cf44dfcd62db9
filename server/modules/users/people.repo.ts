/**
 * The queries of moving people between roles and offices: row locks, the change itself, the
 * person's sessions and the open cases they hold. No decisions here: the service decides.
 */
import { and, asc, eq, inArray, sql } from 'drizzle-orm'
import { OPEN_STATES } from '../../../shared/domain/case-lifecycle'
import type { Role } from '../../../shared/domain/roles'
import type { Db } from '../../db/client'
import { cases, session, users, type CaseRow } from '../../db/schema'

/** Locks a user's row until the transaction ends; the role, office and state as they now stand. */
export async function lockUser(db: Db, userId: string): Promise<{ id: string; name: string; role: Role; officeId: string | null; active: boolean } | undefined> {
  const [u] = await db
    .select({ id: users.id, name: users.name, role: users.role, officeId: users.officeId, active: users.active })
    .from(users)
    .where(eq(users.id, userId))
    .for('update')
  return u
}

/**
 * Locks every active administrator's row, in id order (two transactions never deadlock), and
 * returns their ids: while the locks are held nobody else can demote or deactivate one of them.
 */
export async function lockActiveAdmins(db: Db): Promise<string[]> {
  const rows = await db
    .select({ id: users.id })
    .from(users)
    .where(and(eq(users.role, 'admin'), eq(users.active, true)))
    .orderBy(asc(users.id))
    .for('update')
  return rows.map((r) => r.id)
}

/** Writes a user's role, office and whether they may sign in. */
export async function updateUserAccess(db: Db, userId: string, values: { role: Role; officeId: string | null; active: boolean }): Promise<void> {
  await db.update(users).set(values).where(eq(users.id, userId))
}

/** Ends every stored session signed in as this user; how many there were. */
export async function endSessionsOfUser(db: Db, userId: string): Promise<number> {
  const ended = await db
    .delete(session)
    .where(sql`${session.sess}->'passport'->>'user' = ${userId}`)
    .returning({ sid: session.sid })
  return ended.length
}

/** Locks and returns the open cases of an office assigned to an investigator, in id order. */
export function lockOpenCasesAssignedTo(db: Db, officeId: string, investigatorId: string): Promise<CaseRow[]> {
  return db
    .select()
    .from(cases)
    .where(and(eq(cases.officeId, officeId), eq(cases.investigatorId, investigatorId), inArray(cases.status, [...OPEN_STATES])))
    .orderBy(asc(cases.id))
    .for('no key update')
}

/** Records a successful sign-in on the account. */
export async function setLastSignedIn(db: Db, userId: string): Promise<void> {
  await db.update(users).set({ lastSignedInAt: sql`now()` }).where(eq(users.id, userId))
}
