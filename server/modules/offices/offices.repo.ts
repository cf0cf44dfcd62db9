/** Every query of the offices module. No authorization here: the scope is an argument. */
import { and, asc, eq, ne, sql } from 'drizzle-orm'
import type { TargetsHours } from '../../../shared/domain/case-clocks'
import type { Db } from '../../db/client'
import { cases, offices, type Office } from '../../db/schema'
import { clockRunsSql, dueAtSql } from '../cases/due'

export async function findOffice(db: Db, id: string): Promise<Office | undefined> {
  const [o] = await db.select().from(offices).where(eq(offices.id, id))
  return o
}

/** Offices by name: one (`{ officeId }`) or all. */
export function listOffices(db: Db, scope: { officeId: string } | { all: true }): Promise<Office[]> {
  return db
    .select()
    .from(offices)
    .where('officeId' in scope ? eq(offices.id, scope.officeId) : undefined)
    .orderBy(asc(offices.name))
}

/** Every office except one (where a case may be transferred). */
export function otherOffices(db: Db, exceptOfficeId: string): Promise<Office[]> {
  return db.select().from(offices).where(ne(offices.id, exceptOfficeId))
}

/**
 * Sets an office's resolution targets and moves the due times of its open cases to match
 * (received time plus the new target for each case's priority).
 */
export async function setOfficeTargets(db: Db, officeId: string, t: TargetsHours): Promise<Office | undefined> {
  const [o] = await db.update(offices).set({ targetP1Hours: t[1], targetP2Hours: t[2], targetP3Hours: t[3], targetP4Hours: t[4] }).where(eq(offices.id, officeId)).returning()
  await db
    .update(cases)
    .set({ dueAt: dueAtSql(t) })
    .where(and(eq(cases.officeId, officeId), clockRunsSql('resolution')))
  return o
}

/**
 * Sets an office's first-response targets and moves the first-response due times of its cases
 * whose first-response clock still runs.
 */
export async function setOfficeFirstResponseTargets(db: Db, officeId: string, t: TargetsHours): Promise<Office | undefined> {
  const [o] = await db
    .update(offices)
    .set({ firstResponseP1Hours: t[1], firstResponseP2Hours: t[2], firstResponseP3Hours: t[3], firstResponseP4Hours: t[4] })
    .where(eq(offices.id, officeId))
    .returning()
  await db
    .update(cases)
    .set({ firstResponseDueAt: dueAtSql(t) })
    .where(and(eq(cases.officeId, officeId), clockRunsSql('firstResponse')))
  return o
}

/** Sets an office's time zone (a canonical IANA name, checked by the service's schema). */
export async function setOfficeTimeZone(db: Db, officeId: string, timeZone: string): Promise<Office | undefined> {
  const [o] = await db.update(offices).set({ timeZone }).where(eq(offices.id, officeId)).returning()
  return o
}

/** Every office (report routing). */
export function allOffices(db: Db): Promise<Office[]> {
  return db.select().from(offices)
}

/** The columns an administrator sets for an office (its details and area). */
export type OfficeDetails = Pick<typeof offices.$inferInsert, 'name' | 'regionName' | 'address' | 'centreLatDeg' | 'centreLonDeg' | 'timeZone' | 'area'>

/** A new office, or undefined when the name is taken. */
export async function insertOffice(db: Db, details: OfficeDetails): Promise<Office | undefined> {
  const [o] = await db.insert(offices).values(details).onConflictDoNothing({ target: offices.name }).returning()
  return o
}

/** The office, locked for an edit (FOR UPDATE). */
export async function lockOffice(db: Db, id: string): Promise<Office | undefined> {
  const [o] = await db.select().from(offices).where(eq(offices.id, id)).for('update')
  return o
}

/** Replaces the details and bumps the version. A name another office has is PostgreSQL's unique violation of offices_name_unique. */
export async function updateOfficeDetails(db: Db, id: string, details: OfficeDetails, at: Date): Promise<Office | undefined> {
  const [o] = await db
    .update(offices)
    .set({ ...details, version: sql`${offices.version} + 1`, updatedAt: at })
    .where(eq(offices.id, id))
    .returning()
  return o
}

/** Every office's name and area (overlap checks). */
export function officeAreas(db: Db): Promise<{ id: string; name: string; area: Office['area'] }[]> {
  return db.select({ id: offices.id, name: offices.name, area: offices.area }).from(offices)
}
