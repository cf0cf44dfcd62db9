/**
 * Thumbnails of image evidence (JPEG, PNG, WebP as decided from the content at upload): a job
 * reads the stored image through sharp — its EXIF orientation applied, its metadata (EXIF, GPS,
 * ICC, XMP) not carried over, which is sharp's default — and keeps a WebP of at most
 * THUMBNAIL_LONG_SIDE_PX on the long side in the object store under a key derived from the
 * evidence object's (`thumbnails/<evidence key>.webp`), never over the evidence object.
 * An image whose header declares more than THUMBNAIL_MAX_INPUT_PIXELS (a decompression bomb, or
 * a scan far larger than any photo) is refused by sharp's `limitInputPixels` before it is
 * decoded; that and any broken image is a recorded failure, never a stopped worker.
 */
import type { Readable } from 'node:stream'
import { PutObjectCommand } from '@aws-sdk/client-s3'
import sharp from 'sharp'
import { THUMBNAIL_SOURCE_TYPES } from '../../../../shared/domain/evidence'
import type { Db } from '../../../db/client'
import { HttpError } from '../../../http/errors'
import { log } from '../../../log/logger'
import type { ObjectStore } from '../../../storage/object-store'
import { readStoredObject, requireStore, storageUnavailable } from '../../../storage/stored-files'
import { findEvidence } from '../evidence.repo'
import { recordThumbnailDone, recordThumbnailFailed } from './thumbnails.repo'

export const THUMBNAIL_LONG_SIDE_PX = 320
export const THUMBNAIL_CONTENT_TYPE = 'image/webp'
/** 50 megapixels: above a 48 MP phone photo, far below what a few-kB bomb can declare (common practice, no source). */
export const THUMBNAIL_MAX_INPUT_PIXELS = 50_000_000
/** sharp holds a streamed input whole before it decodes it: larger files get no thumbnail. */
export const THUMBNAIL_MAX_SOURCE_BYTES = 64 * 1024 * 1024

export const thumbnailKeyOf = (evidenceObjectKey: string) => `thumbnails/${evidenceObjectKey}.webp`

class ThumbnailRefused extends Error {}

/** Makes the thumbnail of an image read from `source`: WebP, at most 320 px on its long side. */
export async function makeThumbnail(source: Readable, limitInputPixels = THUMBNAIL_MAX_INPUT_PIXELS): Promise<{ data: Buffer; widthPx: number; heightPx: number }> {
  const image = sharp({ limitInputPixels, failOn: 'error' })
    .rotate()
    .resize(THUMBNAIL_LONG_SIDE_PX, THUMBNAIL_LONG_SIDE_PX, { fit: 'inside', withoutEnlargement: true })
    .webp({ quality: 72 })
  source.on('error', (e) => image.destroy(e))
  source.pipe(image)
  const { data, info } = await image.toBuffer({ resolveWithObject: true })
  return { data, widthPx: info.width, heightPx: info.height }
}

function refusalMessage(err: unknown): string {
  const text = (err as Error)?.message ?? String(err)
  if (err instanceof ThumbnailRefused) return text
  if (/pixel limit/i.test(text)) {
    return `No thumbnail: the image declares more than ${THUMBNAIL_MAX_INPUT_PIXELS / 1e6} megapixels (a decompression bomb or an unusually large scan). The file itself is kept unchanged.`
  }
  if (err instanceof HttpError && err.status === 503) return 'No thumbnail yet: the file store could not be reached.'
  if (err instanceof HttpError && err.code === 'stored_object_missing') return 'No thumbnail: the stored copy of the file is missing from the file store.'
  return `No thumbnail: the image cannot be read (${text}). The file itself is kept unchanged.`
}

/** Makes and stores the thumbnail of one evidence file, recording the outcome; only a failure to record is thrown. */
export async function runEvidenceThumbnail(deps: { db: Db; objectStore?: ObjectStore }, evidenceId: string): Promise<void> {
  const e = await findEvidence(deps.db, evidenceId)
  if (!e || !THUMBNAIL_SOURCE_TYPES.includes(e.file.contentType)) return
  try {
    if (e.file.sizeBytes > THUMBNAIL_MAX_SOURCE_BYTES) throw new ThumbnailRefused(`No thumbnail: the image is larger than ${THUMBNAIL_MAX_SOURCE_BYTES / (1024 * 1024)} MB. The file itself is kept unchanged.`)
    const made = await makeThumbnail(await readStoredObject(deps.objectStore, e.file.objectKey))
    const store = requireStore(deps.objectStore)
    const objectKey = thumbnailKeyOf(e.file.objectKey)
    try {
      await store.client.send(new PutObjectCommand({ Bucket: store.bucket, Key: objectKey, Body: made.data, ContentLength: made.data.length, ContentType: THUMBNAIL_CONTENT_TYPE }))
    } catch (err) {
      log().warn(`object store: storing the thumbnail ${objectKey} failed: ${(err as Error)?.message ?? String(err)}`)
      throw storageUnavailable()
    }
    await recordThumbnailDone(deps.db, e.id, { objectKey, contentType: THUMBNAIL_CONTENT_TYPE, widthPx: made.widthPx, heightPx: made.heightPx, sizeBytes: made.data.length })
  } catch (err) {
    if (err instanceof HttpError && err.code === 'stored_object_missing') log().warn({ evidenceId }, 'evidence thumbnail not made: the stored object is missing')
    else if (!(err instanceof ThumbnailRefused)) log().warn({ err, evidenceId }, 'evidence thumbnail not made')
    await recordThumbnailFailed(deps.db, e.id, refusalMessage(err))
  }
}
