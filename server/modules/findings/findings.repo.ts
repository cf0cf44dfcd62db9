/**
 * Every query of the findings module. Findings are only inserted and read (the table is
 * append-only in the database); no authorization here.
 */
import { and, asc, desc, eq, inArray } from 'drizzle-orm'
import type { Db } from '../../db/client'
import { calculations, findings, users, type FindingRow } from '../../db/schema'

export type NewFindingRow = Omit<typeof findings.$inferInsert, 'id' | 'at'>

/** Stores a proposal; `at` is set by the database. */
export async function insertFinding(db: Db, values: NewFindingRow): Promise<FindingRow> {
  const [row] = await db.insert(findings).values(values).returning()
  return row!
}

export type FindingWithAuthor = FindingRow & { authorName: string }

/** A case's findings, newest first (the first is the current one). */
export async function findingsOfCase(db: Db, caseId: string): Promise<FindingWithAuthor[]> {
  const rows = await db
    .select({ row: findings, authorName: users.name })
    .from(findings)
    .innerJoin(users, eq(users.id, findings.authorUserId))
    .where(eq(findings.caseId, caseId))
    .orderBy(desc(findings.at), desc(findings.id))
  return rows.map((r) => ({ ...r.row, authorName: r.authorName }))
}

/** Which of the ids are calculation records of the case (in no particular order). */
export async function calculationIdsOfCase(db: Db, caseId: string, ids: readonly string[]): Promise<string[]> {
  if (ids.length === 0) return []
  const rows = await db
    .select({ id: calculations.id })
    .from(calculations)
    .where(and(eq(calculations.caseId, caseId), inArray(calculations.id, [...ids])))
    .orderBy(asc(calculations.id))
  return rows.map((r) => r.id)
}
