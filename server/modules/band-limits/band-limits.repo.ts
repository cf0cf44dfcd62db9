/** Every query of the band-limit list. No authorization here: services ask the policy first. */
import { and, asc, desc, eq, sql } from 'drizzle-orm'
import type { Db } from '../../db/client'
import { bandLimitChanges, bandLimits, users, type BandLimitChangeRow, type BandLimitRow, type NewBandLimit } from '../../db/schema'
import type { BandLimitContent } from '../../../shared/schemas/band-limits'

/** A band limit with the name of whoever changed it last (null while as seeded). */
export type BandLimitWithEditor = BandLimitRow & { updatedByName: string | null }
/** A history entry with its author's name. */
export type BandLimitChangeWithAuthor = BandLimitChangeRow & { changedByName: string }

const withEditor = { row: bandLimits, updatedByName: users.name }

/** The whole list, by key (which groups the entries by regulation). */
export async function listBandLimitRows(db: Db): Promise<BandLimitWithEditor[]> {
  const rows = await db.select(withEditor).from(bandLimits).leftJoin(users, eq(users.id, bandLimits.updatedBy)).orderBy(asc(bandLimits.key))
  return rows.map((r) => ({ ...r.row, updatedByName: r.updatedByName }))
}

export async function findBandLimit(db: Db, id: string): Promise<BandLimitWithEditor | undefined> {
  const [r] = await db.select(withEditor).from(bandLimits).leftJoin(users, eq(users.id, bandLimits.updatedBy)).where(eq(bandLimits.id, id))
  return r && { ...r.row, updatedByName: r.updatedByName }
}

/** The register's entry with this library key (the key findings cite), as it is now. */
export async function findBandLimitByKey(db: Db, key: string): Promise<BandLimitRow | undefined> {
  const [r] = await db.select().from(bandLimits).where(eq(bandLimits.key, key))
  return r
}

/** Applies changes when the row is still at `version`; undefined when it has moved on (or is gone). */
export async function updateBandLimitIfVersion(db: Db, id: string, version: number, changes: Partial<BandLimitContent>, byUserId: string): Promise<BandLimitRow | undefined> {
  const [row] = await db
    .update(bandLimits)
    .set({ ...changes, updatedBy: byUserId, version: sql`${bandLimits.version} + 1`, updatedAt: sql`now()` })
    .where(and(eq(bandLimits.id, id), eq(bandLimits.version, version)))
    .returning()
  return row
}

export async function insertBandLimitChange(
  db: Db,
  change: { bandLimitId: string; changedBy: string; reason: string; version: number; before: Partial<BandLimitContent>; after: Partial<BandLimitContent> },
): Promise<void> {
  await db.insert(bandLimitChanges).values(change)
}

/** An entry's changes, newest first. */
export async function listBandLimitChanges(db: Db, bandLimitId: string): Promise<BandLimitChangeWithAuthor[]> {
  const rows = await db
    .select({ change: bandLimitChanges, changedByName: users.name })
    .from(bandLimitChanges)
    .innerJoin(users, eq(users.id, bandLimitChanges.changedBy))
    .where(eq(bandLimitChanges.bandLimitId, bandLimitId))
    .orderBy(desc(bandLimitChanges.changedAt), desc(bandLimitChanges.id))
  return rows.map((r) => ({ ...r.change, changedByName: r.changedByName }))
}

/** Inserts the entries whose key is not in the list yet (edited rows are left as they are); returns how many. */
export async function insertMissingBandLimits(db: Db, rows: NewBandLimit[]): Promise<number> {
  if (rows.length === 0) return 0
  const inserted = await db.insert(bandLimits).values(rows).onConflictDoNothing({ target: bandLimits.key }).returning({ id: bandLimits.id })
  return inserted.length
}
