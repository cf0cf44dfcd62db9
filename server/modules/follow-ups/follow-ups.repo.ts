/**
 * Every query of the follow-ups module, the office digest included. "Today" is the office's
 * calendar day at the service's clock (`now`, a parameter), in its IANA time zone, computed by
 * PostgreSQL from the same zone data: an open follow-up is due on its day and overdue after it
 * (the rule of shared/domain/follow-ups.ts, followUpStanding). No authorization here.
 */
import { and, asc, eq, inArray, lte, sql, type SQL } from 'drizzle-orm'
import type { Db } from '../../db/client'
import { cases, digestSends, followUps, offices, users, type FollowUpRow } from '../../db/schema'
import { overdueSql } from '../cases/due'

export type NewFollowUp = Omit<typeof followUps.$inferInsert, 'id' | 'createdAt' | 'state' | 'version' | 'lastNote' | 'changedAt'>

/** Stores a follow-up; one per finding (a second insert for the same finding is skipped: undefined). */
export async function insertFollowUp(db: Db, v: NewFollowUp): Promise<FollowUpRow | undefined> {
  const [row] = await db.insert(followUps).values(v).onConflictDoNothing({ target: followUps.findingId }).returning()
  return row
}

/** A case's follow-ups, by deadline. */
export function followUpsOfCase(db: Db, caseId: string): Promise<FollowUpRow[]> {
  return db.select().from(followUps).where(eq(followUps.caseId, caseId)).orderBy(asc(followUps.dueOn), asc(followUps.createdAt))
}

export async function findFollowUp(db: Db, id: string): Promise<FollowUpRow | undefined> {
  const [row] = await db.select().from(followUps).where(eq(followUps.id, id))
  return row
}

/** Writes a move only if nobody changed the follow-up since `version` was read; bumps the version. */
export async function updateFollowUpIfVersion(
  db: Db,
  id: string,
  version: number,
  changes: Pick<FollowUpRow, 'state' | 'lastNote' | 'changedAt'> & { dueOn?: string },
): Promise<FollowUpRow | undefined> {
  const [row] = await db
    .update(followUps)
    .set({ ...changes, version: sql`${followUps.version} + 1` })
    .where(and(eq(followUps.id, id), eq(followUps.version, version)))
    .returning()
  return row
}

/** The office's calendar day at `now`, in its time zone (SQL, per office row). */
const officeToday = (now: Date): SQL<string> => sql<string>`(${now.toISOString()}::timestamptz at time zone ${offices.timeZone})::date`

export interface DueFollowUpRow {
  id: string
  caseId: string
  caseReference: string
  officeId: string
  dueOn: string
  expected: string
  investigatorId: string | null
  investigatorName: string | null
  overdue: boolean
}

/**
 * Open follow-ups due today or overdue on their office's calendar at `now`, oldest deadline
 * first: of the given offices, or only of cases assigned to an investigator.
 */
export async function dueFollowUps(db: Db, scope: { officeIds: readonly string[]; investigatorId?: string }, now: Date): Promise<DueFollowUpRow[]> {
  if (scope.officeIds.length === 0) return []
  const today = officeToday(now)
  return db
    .select({
      id: followUps.id,
      caseId: cases.id,
      caseReference: cases.reference,
      officeId: cases.officeId,
      dueOn: followUps.dueOn,
      expected: followUps.expected,
      investigatorId: cases.investigatorId,
      investigatorName: users.name,
      overdue: sql<boolean>`${followUps.dueOn} < ${today}`,
    })
    .from(followUps)
    .innerJoin(cases, eq(cases.id, followUps.caseId))
    .innerJoin(offices, eq(offices.id, cases.officeId))
    .leftJoin(users, eq(users.id, cases.investigatorId))
    .where(
      and(
        eq(followUps.state, 'open'),
        lte(followUps.dueOn, today),
        inArray(cases.officeId, [...scope.officeIds]),
        scope.investigatorId ? eq(cases.investigatorId, scope.investigatorId) : undefined,
      ),
    )
    .orderBy(asc(followUps.dueOn), asc(cases.reference))
}

export interface FollowUpFigures {
  officeId: string
  /** Open, due on the office's today. */
  due: number
  /** Open, deadline before the office's today. */
  overdue: number
  dueItems: DueFollowUpRow[]
  overdueItems: DueFollowUpRow[]
}

/**
 * Due and overdue follow-up counts and lists per office at `now` (each office's own today).
 * For the office dashboard: every office asked for gets an entry, zero when it has none.
 */
export async function followUpFigures(db: Db, officeIds: readonly string[], now: Date): Promise<FollowUpFigures[]> {
  const rows = await dueFollowUps(db, { officeIds }, now)
  return officeIds.map((officeId) => {
    const mine = rows.filter((r) => r.officeId === officeId)
    const overdueItems = mine.filter((r) => r.overdue)
    const dueItems = mine.filter((r) => !r.overdue)
    return { officeId, due: dueItems.length, overdue: overdueItems.length, dueItems, overdueItems }
  })
}

/** The time zone of an office (for the web's "today"). */
export async function officeTimeZone(db: Db, officeId: string): Promise<string | undefined> {
  const [row] = await db.select({ timeZone: offices.timeZone }).from(offices).where(eq(offices.id, officeId))
  return row?.timeZone
}

/** Every office with its time zone (the digest walks them). */
export function officesForDigest(db: Db): Promise<{ id: string; name: string; timeZone: string }[]> {
  return db.select({ id: offices.id, name: offices.name, timeZone: offices.timeZone }).from(offices).orderBy(asc(offices.name))
}

/** The office's cases overdue at `now` on the resolution clock (the one rule, server/modules/cases/due.ts), oldest due first. */
export function overdueCasesOf(db: Db, officeId: string, now: Date): Promise<{ id: string; reference: string; dueAt: Date; investigatorName: string | null }[]> {
  return db
    .select({ id: cases.id, reference: cases.reference, dueAt: cases.dueAt, investigatorName: users.name })
    .from(cases)
    .leftJoin(users, eq(users.id, cases.investigatorId))
    .where(and(eq(cases.officeId, officeId), overdueSql('resolution', now)))
    .orderBy(asc(cases.dueAt))
}

/** Whether the office's digest day is already recorded (sent, or settled with nothing to report). */
export async function digestRecorded(db: Db, officeId: string, localDay: string): Promise<boolean> {
  const rows = await db.select({ officeId: digestSends.officeId }).from(digestSends).where(and(eq(digestSends.officeId, officeId), eq(digestSends.localDay, localDay)))
  return rows.length > 0
}

/**
 * Claims the office's digest for a local day: true when this call wrote the record (and its
 * transaction then queues the e-mails, none when `recipients` is 0: nothing to report), false
 * when the day had been recorded already.
 */
export async function claimDigest(db: Db, officeId: string, localDay: string, recipients: number): Promise<boolean> {
  const rows = await db.insert(digestSends).values({ officeId, localDay, recipients }).onConflictDoNothing().returning({ officeId: digestSends.officeId })
  return rows.length > 0
}
