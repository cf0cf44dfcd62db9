/**
 * Every query of the cases module but the list's (case-list.repo.ts): case rows, the timeline,
 * tracking-link hashes. Functions of (db, explicit arguments):
 * the office a query is limited to is an argument the service decides with the policy; no
 * authorization here.
 */
import { and, asc, count, desc, eq, gt, gte, inArray, isNull, lte, ne, sql } from 'drizzle-orm'
import type { CaseState, TimelineVisibility } from '../../../shared/domain/case-lifecycle'
import type { Db } from '../../db/client'
import { caseEvents, cases, caseTrackingTokens, users, type CaseRow } from '../../db/schema'
import { clockRunsSql } from './due'

export async function findCase(db: Db, id: string): Promise<CaseRow | undefined> {
  const [c] = await db.select().from(cases).where(eq(cases.id, id))
  return c
}

/** Locks a case's row until the transaction ends (FOR NO KEY UPDATE) and returns it. */
export async function lockCase(db: Db, id: string): Promise<CaseRow | undefined> {
  const [c] = await db.select().from(cases).where(eq(cases.id, id)).for('no key update')
  return c
}

/** Locks several cases' rows, always in id order (two transactions locking the same pair never deadlock). */
export function lockCasesInIdOrder(db: Db, ids: string[]): Promise<CaseRow[]> {
  return db.select().from(cases).where(inArray(cases.id, ids)).orderBy(asc(cases.id)).for('no key update')
}

export async function findCaseReference(db: Db, id: string): Promise<string | undefined> {
  const [c] = await db.select({ reference: cases.reference }).from(cases).where(eq(cases.id, id))
  return c?.reference
}

export type NewCase = typeof cases.$inferInsert

export async function insertCase(db: Db, values: NewCase): Promise<CaseRow> {
  const [c] = await db.insert(cases).values(values).returning()
  return c!
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
  visibility: TimelineVisibility
  data?: Record<string, unknown>
}

export async function appendEvent(db: Db, e: NewEvent): Promise<void> {
  await db.insert(caseEvents).values({ ...e, data: e.data ?? null })
}

export type CaseEventRow = typeof caseEvents.$inferSelect

/** A case's timeline, oldest first. */
export function timelineOf(db: Db, caseId: string): Promise<CaseEventRow[]> {
  return db.select().from(caseEvents).where(eq(caseEvents.caseId, caseId)).orderBy(asc(caseEvents.id))
}

/** How many events of a kind a case has had since a time. */
export async function countEventsSince(db: Db, caseId: string, kind: string, since: Date): Promise<number> {
  const [r] = await db
    .select({ n: count() })
    .from(caseEvents)
    .where(and(eq(caseEvents.caseId, caseId), eq(caseEvents.kind, kind), gt(caseEvents.at, since)))
  return r!.n
}

/**
 * Writes changes only if nobody changed the case since `version` was read; bumps the
 * version. Returns undefined when the version is stale (another user acted first).
 */
export async function updateCaseIfVersion(db: Db, id: string, version: number, changes: Partial<NewCase>): Promise<CaseRow | undefined> {
  const [row] = await db
    .update(cases)
    .set({ ...changes, version: sql`${cases.version} + 1`, updatedAt: sql`now()` })
    .where(and(eq(cases.id, id), eq(cases.version, version)))
    .returning()
  return row
}

/**
 * Records the case's first response (a first message to the complainant) unless it has one:
 * the first-response clock stops. Not a change of state, so the version stays.
 */
export async function recordFirstResponse(db: Db, id: string, at: Date): Promise<void> {
  await db.update(cases).set({ firstRespondedAt: at }).where(and(eq(cases.id, id), isNull(cases.firstRespondedAt)))
}

/** The reports merged into a case (closed as its duplicates), oldest first. */
export async function mergedReportsOf(db: Db, caseId: string): Promise<{ id: string; reference: string }[]> {
  return db.select({ id: cases.id, reference: cases.reference }).from(cases).where(eq(cases.mergedIntoCaseId, caseId)).orderBy(asc(cases.receivedAt), asc(cases.id))
}

/** Re-points the reports merged into one case to another (they follow it); returns them. */
export function repointMergedReports(db: Db, fromCaseId: string, toCaseId: string) {
  return db
    .update(cases)
    .set({ mergedIntoCaseId: toCaseId, version: sql`${cases.version} + 1`, updatedAt: sql`now()` })
    .where(eq(cases.mergedIntoCaseId, fromCaseId))
    .returning({ id: cases.id, reference: cases.reference, complainantName: cases.complainantName })
}

export async function nextCaseReference(db: Db, now: Date): Promise<string> {
  const r = await db.execute<{ n: string }>(sql`select nextval('case_reference_seq')::text as n`)
  const yy = String(now.getUTCFullYear() % 100).padStart(2, '0')
  return `QB-${yy}-${r.rows[0]!.n.padStart(6, '0')}`
}

/** A complainant account's reports, newest first. */
export function casesOfComplainant(db: Db, userId: string): Promise<CaseRow[]> {
  return db.select().from(cases).where(eq(cases.complainantUserId, userId)).orderBy(desc(cases.receivedAt))
}

/**
 * Open cases of an office, other than one, whose frequency range overlaps [lowHz, highHz]
 * and whose place lies in a latitude/longitude box (at most 200).
 */
export function openCasesNear(
  db: Db,
  q: { officeId: string; exceptCaseId: string; lowHz: number; highHz: number; latDeg: [number, number]; lonDeg: [number, number] },
): Promise<CaseRow[]> {
  return db
    .select()
    .from(cases)
    .where(
      and(
        eq(cases.officeId, q.officeId),
        ne(cases.id, q.exceptCaseId),
        clockRunsSql('resolution'),
        lte(cases.freqLowHz, q.highHz),
        gte(cases.freqHighHz, q.lowHz),
        sql`${cases.latDeg} between ${q.latDeg[0]} and ${q.latDeg[1]}`,
        sql`${cases.lonDeg} between ${q.lonDeg[0]} and ${q.lonDeg[1]}`,
      ),
    )
    .limit(200)
}

/**
 * Open (not closed) cases of an office, other than one, whose place lies in a latitude/longitude
 * box around a centre; `lonDeg` may run past ±180 (wrapped here) or be null (every longitude,
 * near a pole). Ordered by a flat-earth distance from the centre (longitude scaled by the
 * cosine of the centre's latitude), nearest first, at most `limit`: the caller measures the
 * geodesic distance of these and keeps the nearest.
 */
export function openCasesInBox(
  db: Db,
  q: { officeId: string; exceptCaseId: string; centre: { latDeg: number; lonDeg: number }; latDeg: [number, number]; lonDeg: [number, number] | null; limit: number },
): Promise<Pick<CaseRow, 'id' | 'reference' | 'status' | 'latDeg' | 'lonDeg' | 'freqLowHz' | 'freqHighHz'>[]> {
  const wrap = (x: number) => ((((x + 180) % 360) + 360) % 360) - 180
  let lonInBox = sql`true`
  if (q.lonDeg) {
    const [west, east] = [wrap(q.lonDeg[0]), wrap(q.lonDeg[1])]
    lonInBox = west <= east ? sql`${cases.lonDeg} between ${west} and ${east}` : sql`(${cases.lonDeg} >= ${west} or ${cases.lonDeg} <= ${east})`
  }
  const cosLat = Math.cos((q.centre.latDeg * Math.PI) / 180)
  // the longitude difference wrapped into [−180, 180) so a box across the antimeridian orders right
  const dLon = sql`(${cases.lonDeg} - ${q.centre.lonDeg}::float8 + 540 - 360 * floor((${cases.lonDeg} - ${q.centre.lonDeg}::float8 + 540) / 360) - 180)`
  const flatDistance = sql`power(${cases.latDeg} - ${q.centre.latDeg}::float8, 2) + power(${dLon} * ${cosLat}::float8, 2)`
  return db
    .select({ id: cases.id, reference: cases.reference, status: cases.status, latDeg: cases.latDeg, lonDeg: cases.lonDeg, freqLowHz: cases.freqLowHz, freqHighHz: cases.freqHighHz })
    .from(cases)
    .where(
      and(
        eq(cases.officeId, q.officeId),
        ne(cases.id, q.exceptCaseId),
        ne(cases.status, 'closed'),
        sql`${cases.latDeg} between ${q.latDeg[0]} and ${q.latDeg[1]}`,
        lonInBox,
      ),
    )
    .orderBy(flatDistance, asc(cases.id))
    .limit(q.limit)
}

/** Active investigators of an office with how many open cases each holds, lightest first. */
export function investigatorLoads(db: Db, officeId: string): Promise<{ id: string; name: string; openCases: number }[]> {
  return db
    .select({ id: users.id, name: users.name, openCases: count(cases.id) })
    .from(users)
    .leftJoin(cases, and(eq(cases.investigatorId, users.id), clockRunsSql('resolution')))
    .where(and(eq(users.officeId, officeId), eq(users.role, 'investigator'), eq(users.active, true)))
    .groupBy(users.id, users.name)
    .orderBy(asc(count(cases.id)), asc(users.name))
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

export async function insertTrackingToken(db: Db, caseId: string, tokenHash: string): Promise<void> {
  await db.insert(caseTrackingTokens).values({ caseId, tokenHash })
}

/** The case of a tracking token's hash, unless the token was revoked. */
export async function findCaseIdOfTokenHash(db: Db, tokenHash: string): Promise<string | undefined> {
  const [t] = await db
    .select({ caseId: caseTrackingTokens.caseId })
    .from(caseTrackingTokens)
    .where(and(eq(caseTrackingTokens.tokenHash, tokenHash), isNull(caseTrackingTokens.revokedAt)))
  return t?.caseId
}

/** Revokes every tracking token of a case that still works; how many there were. */
export async function revokeTrackingTokensOfCase(db: Db, caseId: string): Promise<number> {
  const revoked = await db
    .update(caseTrackingTokens)
    .set({ revokedAt: sql`now()` })
    .where(and(eq(caseTrackingTokens.caseId, caseId), isNull(caseTrackingTokens.revokedAt)))
    .returning({ id: caseTrackingTokens.id })
  return revoked.length
}
