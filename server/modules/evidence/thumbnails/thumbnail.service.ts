/**
 * Serving an image's thumbnail to whoever may see the file (staff of its office; the
 * complainant for their own uploads). Looking at a thumbnail is not a download of the evidence:
 * it is a small rendition made by the server, not the bytes that were hashed at intake, so it
 * writes no custody entry (a download of the file itself still does).
 */
import type { Readable } from 'node:stream'
import type { ServiceContext } from '../../../context'
import { notFound } from '../../../http/errors'
import type { CaseActor } from '../../../policy/case-policy'
import { readStoredObject } from '../../../storage/stored-files'
import { loadVisibleEvidence } from '../evidence.service'
import { findThumbnail } from './thumbnails.repo'

export const thumbnailNotFound = () => notFound('thumbnail_not_found', 'This file has no thumbnail (it is not a photo, or the thumbnail is not made yet or could not be made).')

export interface ThumbnailStream {
  body: Readable
  contentType: string
  sizeBytes: number
}

/** Opens the thumbnail of a file the actor may see; 404 for a file they may not see or one without a thumbnail. */
export async function openEvidenceThumbnail(ctx: ServiceContext, actor: CaseActor, evidenceId: string): Promise<ThumbnailStream> {
  const { e } = await loadVisibleEvidence(ctx.db, actor, evidenceId)
  const thumb = await findThumbnail(ctx.db, e.id)
  if (!thumb || thumb.state !== 'done' || !thumb.objectKey || !thumb.contentType || !thumb.sizeBytes) throw thumbnailNotFound()
  return { body: await readStoredObject(ctx.objectStore, thumb.objectKey), contentType: thumb.contentType, sizeBytes: thumb.sizeBytes }
}
