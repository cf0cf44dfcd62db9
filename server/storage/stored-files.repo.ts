/** The queries of the stored-file rows. */
import { eq } from 'drizzle-orm'
import type { Db } from '../db/client'
import { storedFiles, users, type NewStoredFile, type StoredFileRow } from '../db/schema'

/** A stored file with the name of whoever uploaded it. */
export type StoredFileWithUploader = StoredFileRow & { uploadedByName: string }

export async function insertStoredFile(db: Db, row: NewStoredFile): Promise<StoredFileRow> {
  const [r] = await db.insert(storedFiles).values(row).returning()
  return r!
}

export async function findStoredFile(db: Db, id: string): Promise<StoredFileWithUploader | undefined> {
  const [r] = await db.select({ row: storedFiles, uploadedByName: users.name }).from(storedFiles).innerJoin(users, eq(users.id, storedFiles.uploadedBy)).where(eq(storedFiles.id, id))
  return r && { ...r.row, uploadedByName: r.uploadedByName }
}
