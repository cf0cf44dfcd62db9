/** Reading and writing case rows and timeline events. No authorization here. */
import { and, asc, eq, sql } from 'drizzle-orm'
import type { Db } from '../../db/client'
import { caseEvents, cases, offices, users, type CaseRow } from '../../db/schema'
import type { CaseState } from '../../../shared/domain/case-lifecycle'
import type { Priority } from '../../../shared/domain/services'

export async function findCase(db: Db, id: string): Promise<CaseRow | undefined> {
  const [c] = await db.select().from(cases).where(eq(cases.id, id))
  return c
}

export interface NewEvent {
  caseId: string
  /** When it happened (default: the database's now()). */
  at?: Date
  actorUserId: string | null
  actorLabel: string
  kind: string
  fromState?: CaseState | null
  toState?: CaseState | null
  body?: string | null
  visibility: 'internal' | 'complainant'
  data?: Record<string, unknown>
}

export async function appendEvent(db: Db, e: NewEvent): Promise<void> {
  await db.insert(caseEvents).values({ ...e, data: e.data ? JSON.stringify(e.data) : null })
}

/**
 * Writes changes only if nobody changed the case since `version` was read; bumps the
 * version. Returns undefined when the version is stale (another user acted first).
 */
export async function updateCaseIfVersion(db: Db, id: string, version: number, changes: Partial<typeof cases.$inferInsert>): Promise<CaseRow | undefined> {
  const [row] = await db
    .update(cases)
    .set({ ...changes, version: sql`${cases.version} + 1`, updatedAt: sql`now()` })
    .where(and(eq(cases.id, id), eq(cases.version, version)))
    .returning()
  return row
}

/** The reports merged into a case (closed as its duplicates), oldest first. */
export async function mergedReportsOf(db: Db, caseId: string): Promise<{ id: string; reference: string }[]> {
  return db.select({ id: cases.id, reference: cases.reference }).from(cases).where(eq(cases.mergedIntoCaseId, caseId)).orderBy(asc(cases.receivedAt), asc(cases.id))
}

export async function officeTargetsHours(db: Db, officeId: string): Promise<Record<Priority, number>> {
  const [o] = await db.select().from(offices).where(eq(offices.id, officeId))
  if (!o) throw new Error(`office ${officeId} missing`)
  return { 1: o.targetP1Hours, 2: o.targetP2Hours, 3: o.targetP3Hours, 4: o.targetP4Hours }
}

export async function nextCaseReference(db: Db, now: Date): Promise<string> {
  const r = await db.execute<{ n: string }>(sql`select nextval('case_reference_seq')::text as n`)
  const yy = String(now.getUTCFullYear() % 100).padStart(2, '0')
  return `QB-${yy}-${r.rows[0]!.n.padStart(6, '0')}`
}

export async function userName(db: Db, id: string): Promise<{ name: string; email: string; role: string; officeId: string | null; active: boolean } | undefined> {
  const [u] = await db.select({ name: users.name, email: users.email, role: users.role, officeId: users.officeId, active: users.active }).from(users).where(eq(users.id, id))
  return u
}

/**
 * Reports filed without signing in, with the address of a complainant account whose address is
 * confirmed, belong to that account (the confirmation proves the address is this person's).
 * Run when the address is confirmed; reports filed later find the account at filing.
 */
export async function linkReportsToConfirmedAccount(db: Db, userId: string): Promise<void> {
  await db.execute(
    sql`UPDATE ${cases} SET complainant_user_id = u.id FROM ${users} u
        WHERE u.id = ${userId} AND u.role = 'complainant' AND u.email_confirmed_at IS NOT NULL
          AND ${cases.complainantUserId} IS NULL AND ${cases.complainantEmail} = u.email`,
  )
}

/** The confirmed, active complainant account of an address, if there is one. */
export async function confirmedComplainantOf(db: Db, email: string): Promise<string | null> {
  const [u] = await db
    .select({ id: users.id })
    .from(users)
    .where(and(eq(users.email, email), eq(users.role, 'complainant'), eq(users.active, true), sql`${users.emailConfirmedAt} IS NOT NULL`))
  return u?.id ?? null
}
