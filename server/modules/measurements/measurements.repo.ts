/**
 * Every query of the measurements module. A measurement row is updated only while no
 * calculation names it (the service checks, and the update itself re-checks in SQL); no
 * authorization here.
 */
import { and, asc, eq, inArray, sql } from 'drizzle-orm'
import type { Db } from '../../db/client'
import { calculations, measurements, users, type MeasurementRow, type NewMeasurement } from '../../db/schema'

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i

export type NewMeasurementRow = Omit<NewMeasurement, 'id' | 'createdAt' | 'updatedAt' | 'version'>
export type MeasurementWithAuthor = MeasurementRow & { authorName: string; supersededById: string | null; usedByCalculations: number }

/** Calculations whose measurement_ids contain the row's id. */
const usedBy = sql<number>`(select count(*)::int from ${calculations} c where c.measurement_ids @> jsonb_build_array(${measurements.id}::text))`
const successor = sql<string | null>`(select s.id from ${measurements} s where s.supersedes_id = ${measurements.id})`
const withAuthor = { row: measurements, authorName: users.name, supersededById: successor, usedByCalculations: usedBy }

function flat(r: { row: MeasurementRow; authorName: string; supersededById: string | null; usedByCalculations: number }): MeasurementWithAuthor {
  return { ...r.row, authorName: r.authorName, supersededById: r.supersededById, usedByCalculations: Number(r.usedByCalculations) }
}

export async function insertMeasurement(db: Db, values: NewMeasurementRow): Promise<MeasurementRow> {
  const [row] = await db.insert(measurements).values(values).returning()
  return row!
}

export async function findMeasurement(db: Db, id: string): Promise<MeasurementWithAuthor | undefined> {
  const [r] = await db.select(withAuthor).from(measurements).innerJoin(users, eq(users.id, measurements.authorUserId)).where(eq(measurements.id, id))
  return r && flat(r)
}

/** A case's measurements, by the time they were taken. */
export async function measurementsOfCase(db: Db, caseId: string): Promise<MeasurementWithAuthor[]> {
  const rows = await db
    .select(withAuthor)
    .from(measurements)
    .innerJoin(users, eq(users.id, measurements.authorUserId))
    .where(eq(measurements.caseId, caseId))
    .orderBy(asc(measurements.takenAt), asc(measurements.createdAt), asc(measurements.id))
  return rows.map(flat)
}

/** The named measurements of one case (rows of other cases are left out). */
export async function measurementRowsOfCase(db: Db, caseId: string, ids: readonly string[]): Promise<MeasurementRow[]> {
  // an id that is not a uuid names no row (and must not reach the uuid comparison)
  const uuids = ids.filter((id) => UUID.test(id))
  if (uuids.length === 0) return []
  return db.select().from(measurements).where(and(eq(measurements.caseId, caseId), inArray(measurements.id, uuids)))
}

/** How many calculations name the measurement (0: it may still be edited). */
export async function calculationsUsingMeasurement(db: Db, id: string): Promise<number> {
  const [r] = await db.select({ n: sql<number>`count(*)::int` }).from(calculations).where(sql`${calculations.measurementIds} @> jsonb_build_array(${id}::text)`)
  return Number(r?.n ?? 0)
}

/**
 * Applies an edit when the row is still at `version` and no calculation names it yet;
 * undefined otherwise (the service tells which).
 */
export async function updateMeasurementIfVersion(db: Db, id: string, version: number, changes: Partial<NewMeasurementRow>): Promise<MeasurementRow | undefined> {
  const [row] = await db
    .update(measurements)
    .set({ ...changes, version: sql`${measurements.version} + 1`, updatedAt: sql`now()` })
    .where(
      and(
        eq(measurements.id, id),
        eq(measurements.version, version),
        sql`not exists (select 1 from ${calculations} c where c.measurement_ids @> jsonb_build_array(${measurements.id}::text))`,
      ),
    )
    .returning()
  return row
}
