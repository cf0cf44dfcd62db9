/** The queries of evidence thumbnails (one row per image file: made, or refused with its reason). */
import { eq, inArray } from 'drizzle-orm'
import type { Db } from '../../../db/client'
import { evidenceThumbnails, type EvidenceThumbnailRow } from '../../../db/schema'

export async function recordThumbnailDone(db: Db, evidenceId: string, t: { objectKey: string; contentType: string; widthPx: number; heightPx: number; sizeBytes: number }): Promise<void> {
  const values = { state: 'done' as const, ...t, message: null }
  await db
    .insert(evidenceThumbnails)
    .values({ evidenceId, ...values })
    .onConflictDoUpdate({ target: evidenceThumbnails.evidenceId, set: { ...values, madeAt: new Date() } })
}

export async function recordThumbnailFailed(db: Db, evidenceId: string, message: string): Promise<void> {
  const values = { state: 'failed' as const, objectKey: null, contentType: null, widthPx: null, heightPx: null, sizeBytes: null, message }
  await db
    .insert(evidenceThumbnails)
    .values({ evidenceId, ...values })
    .onConflictDoUpdate({ target: evidenceThumbnails.evidenceId, set: { ...values, madeAt: new Date() } })
}

export async function findThumbnail(db: Db, evidenceId: string): Promise<EvidenceThumbnailRow | undefined> {
  const [r] = await db.select().from(evidenceThumbnails).where(eq(evidenceThumbnails.evidenceId, evidenceId))
  return r
}

/** The thumbnails made for these files, by evidence id. */
export async function thumbnailsOf(db: Db, evidenceIds: string[]): Promise<Map<string, EvidenceThumbnailRow>> {
  if (evidenceIds.length === 0) return new Map()
  const rows = await db.select().from(evidenceThumbnails).where(inArray(evidenceThumbnails.evidenceId, evidenceIds))
  return new Map(rows.map((r) => [r.evidenceId, r]))
}
