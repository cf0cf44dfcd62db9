/** Every query of the saved-views module; the owner is always an argument. */
import { and, asc, count, eq } from 'drizzle-orm'
import type { Db } from '../../db/client'
import { savedViews, type SavedView } from '../../db/schema'

export function listSavedViews(db: Db, userId: string): Promise<SavedView[]> {
  return db.select().from(savedViews).where(eq(savedViews.userId, userId)).orderBy(asc(savedViews.name))
}

export async function countSavedViews(db: Db, userId: string): Promise<number> {
  const [row] = await db.select({ n: count() }).from(savedViews).where(eq(savedViews.userId, userId))
  return row?.n ?? 0
}

/** Inserts a view; a name the person already uses → undefined (the unique constraint decides). */
export async function insertSavedView(db: Db, row: { userId: string; name: string; listQuery: string }): Promise<SavedView | undefined> {
  const [v] = await db.insert(savedViews).values(row).onConflictDoNothing({ target: [savedViews.userId, savedViews.name] }).returning()
  return v
}

/** Deletes one of the person's views; another person's id deletes nothing. */
export async function deleteSavedView(db: Db, userId: string, id: string): Promise<boolean> {
  const gone = await db.delete(savedViews).where(and(eq(savedViews.id, id), eq(savedViews.userId, userId))).returning({ id: savedViews.id })
  return gone.length > 0
}
