/**
 * Every query of the calculations module. Records are only inserted and read (the table is
 * append-only in the database); no authorization here.
 */
import { and, asc, eq, gt, inArray } from 'drizzle-orm'
import type { Db } from '../../db/client'
import { calculations, users, type CalculationRow } from '../../db/schema'

export type NewCalculationRow = Omit<typeof calculations.$inferInsert, 'id' | 'at'>

/** Stores a record; `at` is set by the database. */
export async function insertCalculation(db: Db, values: NewCalculationRow): Promise<CalculationRow> {
  const [row] = await db.insert(calculations).values(values).returning()
  return row!
}

export type CalculationWithAuthor = CalculationRow & { authorName: string }

const withAuthor = { row: calculations, authorName: users.name }

export async function findCalculation(db: Db, id: string): Promise<CalculationWithAuthor | undefined> {
  const [r] = await db.select(withAuthor).from(calculations).innerJoin(users, eq(users.id, calculations.authorUserId)).where(eq(calculations.id, id))
  return r && { ...r.row, authorName: r.authorName }
}

/** A case's calculations, oldest first. */
export async function calculationsOfCase(db: Db, caseId: string): Promise<CalculationWithAuthor[]> {
  const rows = await db
    .select(withAuthor)
    .from(calculations)
    .innerJoin(users, eq(users.id, calculations.authorUserId))
    .where(eq(calculations.caseId, caseId))
    .orderBy(asc(calculations.at), asc(calculations.id))
  return rows.map((r) => ({ ...r.row, authorName: r.authorName }))
}

/**
 * One page of every record (or one case's), in id order after the given id: the recompute
 * check walks the whole table this way without holding it in memory.
 */
export function calculationsPage(db: Db, q: { afterId?: string; caseId?: string; limit: number }): Promise<CalculationRow[]> {
  return db
    .select()
    .from(calculations)
    .where(and(q.afterId ? gt(calculations.id, q.afterId) : undefined, q.caseId ? eq(calculations.caseId, q.caseId) : undefined))
    .orderBy(asc(calculations.id))
    .limit(q.limit)
}

/** The records of one case with these ids (records of other cases are not returned). */
export async function calculationsOfCaseByIds(db: Db, caseId: string, ids: readonly string[]): Promise<CalculationRow[]> {
  if (ids.length === 0) return []
  return db
    .select()
    .from(calculations)
    .where(and(eq(calculations.caseId, caseId), inArray(calculations.id, [...ids])))
}
