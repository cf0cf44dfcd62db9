/**
 * Storing files: a stream goes straight into the object store (lib-storage multipart Upload,
 * never held in memory whole) while its SHA-256 and size are computed; the `stored_files` row
 * is written only once the object is stored, and the object is removed again when that write
 * fails, so there is never a row without its object nor an object without its row. Object keys
 * are `<purpose>/<uuid>`: never reused.
 *
 * `storeUpload` takes a multipart form's one file (multer with a streaming storage engine);
 * `storeStream` takes any stream (the demo seeder's CSV). `readStoredObject` streams a file back.
 *
 * Content type: the one the uploader declared (the multipart part's header) is kept, marked
 * `declared`, unless the caller passes `inspect`: it sees the first bytes before anything
 * else goes on, decides the type from the content (kept as `sniffed`) or refuses the file.
 */
import crypto from 'node:crypto'
import { Transform, type Readable, type TransformCallback } from 'node:stream'
import { DeleteObjectCommand, GetObjectCommand, ListObjectsV2Command } from '@aws-sdk/client-s3'
import { Upload } from '@aws-sdk/lib-storage'
import type { Request, Response } from 'express'
import multer, { MulterError, type StorageEngine } from 'multer'
import type { StoredFilePurpose } from '../../shared/domain/stored-files'
import type { Db } from '../db/client'
import type { NewStoredFile, StoredFileRow } from '../db/schema'
import { badRequest, HttpError } from '../http/errors'
import { log } from '../log/logger'
import type { ObjectStore } from './object-store'
import { insertStoredFile } from './stored-files.repo'

export const storageUnavailable = (detail?: string) =>
  new HttpError(503, 'storage_unavailable', `The file store cannot be reached, so nothing was stored. Please try again in a moment.${detail ? ` (${detail})` : ''}`)
/** The store answers, but holds no object under the key: an integrity problem, not an outage (nothing to retry). */
export const storedObjectMissing = () =>
  new HttpError(404, 'stored_object_missing', 'The stored copy of this file is missing from the file store. Its checksum is on record; ask an administrator to check the store.')
const isMissingObject = (e: unknown) => (e as Error)?.name === 'NoSuchKey' || (e as { $metadata?: { httpStatusCode?: number } })?.$metadata?.httpStatusCode === 404
export const fileTooLarge = (maxBytes: number) => new HttpError(413, 'file_too_large', `The file is larger than the ${formatBytes(maxBytes)} an upload may hold.`)

function formatBytes(n: number): string {
  if (n >= 1024 * 1024) return `${+(n / (1024 * 1024)).toFixed(1)} MB`
  if (n >= 1024) return `${+(n / 1024).toFixed(1)} kB`
  return `${n} bytes`
}

/** The store itself, or a 503 when the app runs without one. */
export function requireStore(store: ObjectStore | undefined): ObjectStore {
  if (!store) throw storageUnavailable('no file store is configured')
  return store
}

/**
 * Counts and hashes the bytes passing through; fails once more than `maxBytes` have passed.
 * (The count must not be called `size`: lib-storage reads a body's `size` as its length.)
 */
class Digest extends Transform {
  readonly hash = crypto.createHash('sha256')
  byteCount = 0
  tooLarge = false
  constructor(private readonly maxBytes: number) {
    super()
  }
  override _transform(chunk: Buffer, _enc: BufferEncoding, cb: TransformCallback) {
    this.byteCount += chunk.length
    if (this.byteCount > this.maxBytes) {
      this.tooLarge = true
      return cb(new Error('file too large'))
    }
    this.hash.update(chunk)
    cb(null, chunk)
  }
}

/** Holds back the first bytes until `inspect` has judged them; refuses the stream when it throws. */
class HeadCheck extends Transform {
  private held: Buffer[] = []
  private heldBytes = 0
  private decided = false
  refused?: unknown
  contentType?: string
  constructor(
    private readonly headBytes: number,
    private readonly inspect: (head: Buffer) => Promise<string>,
  ) {
    super()
  }
  override _transform(chunk: Buffer, _enc: BufferEncoding, cb: TransformCallback) {
    if (this.decided) return cb(null, chunk)
    this.held.push(chunk)
    this.heldBytes += chunk.length
    if (this.heldBytes < this.headBytes) return cb()
    this.decide(cb)
  }
  override _flush(cb: TransformCallback) {
    if (this.decided) return cb()
    this.decide(cb)
  }
  private decide(cb: TransformCallback) {
    this.decided = true
    const head = Buffer.concat(this.held)
    this.held = []
    this.inspect(head).then(
      (type) => {
        this.contentType = type
        cb(null, head)
      },
      (e: unknown) => {
        this.refused = e
        cb(e instanceof Error ? e : new Error(String(e)))
      },
    )
  }
}

/** Looks at a file's first bytes: the content type it holds, or a thrown HttpError refusing it. */
export type InspectHead = (head: Buffer) => Promise<string>

/** How many first bytes `inspect` sees (file-type reads at most 4100). */
export const INSPECTED_HEAD_BYTES = 4100

export interface PutResult {
  objectKey: string
  sizeBytes: number
  sha256: string
  /** The type `inspect` decided from the content. */
  sniffedType?: string
}

const newObjectKey = (purpose: StoredFilePurpose) => `${purpose}/${crypto.randomUUID()}`

/** Streams `body` into the store under a new key; the key, size and SHA-256 of what was stored. */
async function putStream(store: ObjectStore, body: Readable, purpose: StoredFilePurpose, contentType: string, inspect?: InspectHead): Promise<PutResult> {
  const objectKey = newObjectKey(purpose)
  const digest = new Digest(store.maxUploadBytes)
  const check = inspect ? new HeadCheck(INSPECTED_HEAD_BYTES, inspect) : undefined
  const source = check ? body.pipe(check).pipe(digest) : body.pipe(digest)
  body.on('error', (e) => (check ?? digest).destroy(e))
  check?.on('error', (e) => digest.destroy(e))
  const upload = new Upload({
    client: store.client,
    params: { Bucket: store.bucket, Key: objectKey, Body: source, ContentType: contentType },
    // 3 parts in flight (lib-storage defaults to 4): an upload through the app keeps up with
    // one straight to the store (ops/bench/evidence-upload.bench.ts) and holds at most about
    // (3 + 1) × 5 MiB of the file in memory
    partSize: 5 * 1024 * 1024,
    queueSize: 3,
    leavePartsOnError: false,
  })
  // a failure of the source (too large, a broken request) ends the upload too
  digest.on('error', () => void upload.abort().catch(() => {}))
  try {
    await upload.done()
  } catch (e) {
    if (digest.tooLarge) throw fileTooLarge(store.maxUploadBytes)
    if (check?.refused) throw check.refused
    if (e instanceof HttpError) throw e
    log().warn(`object store: upload of ${objectKey} failed: ${(e as Error)?.name ?? ''} ${(e as Error)?.message ?? String(e)}`)
    throw storageUnavailable()
  }
  if (digest.tooLarge) {
    await removeObject(store, objectKey)
    throw fileTooLarge(store.maxUploadBytes)
  }
  return { objectKey, sizeBytes: digest.byteCount, sha256: digest.hash.digest('hex'), sniffedType: check?.contentType }
}

/** Removes an object (a file whose row could not be written); a failure is logged, never thrown. */
export async function removeObject(store: ObjectStore, objectKey: string): Promise<void> {
  try {
    await store.client.send(new DeleteObjectCommand({ Bucket: store.bucket, Key: objectKey }))
  } catch (e) {
    log().error(`object store: could not remove ${objectKey} (left without a row): ${(e as Error)?.message ?? String(e)}`)
  }
}

export interface StoreFileMeta {
  originalName: string
  contentType: string
  purpose: StoredFilePurpose
  /** From the session (or the seeder's account), never from the request; null for a complainant using a tracking link. */
  uploadedBy: string | null
}

/** The stored_files row of a stored object (the type `inspect` sniffed wins over the declared one). */
export function storedFileValues(put: PutResult, meta: StoreFileMeta): NewStoredFile {
  return {
    objectKey: put.objectKey,
    originalName: meta.originalName.slice(0, 255) || 'unnamed',
    sizeBytes: put.sizeBytes,
    sha256: put.sha256,
    contentType: put.sniffedType ?? (meta.contentType || 'application/octet-stream'),
    contentTypeSource: put.sniffedType ? 'sniffed' : 'declared',
    purpose: meta.purpose,
    uploadedBy: meta.uploadedBy,
  }
}

/** Writes the row of a stored object; removes the object when the row cannot be written. */
async function recordStored(db: Db, store: ObjectStore, put: PutResult, meta: StoreFileMeta): Promise<StoredFileRow> {
  try {
    return await insertStoredFile(db, storedFileValues(put, meta))
  } catch (e) {
    await removeObject(store, put.objectKey)
    throw e
  }
}

/** Stores a stream as a file: the object first, then its row. */
export async function storeStream(deps: { db: Db; store: ObjectStore | undefined }, body: Readable, meta: StoreFileMeta): Promise<StoredFileRow> {
  const store = requireStore(deps.store)
  const put = await putStream(store, body, meta.purpose, meta.contentType)
  return recordStored(deps.db, store, put, meta)
}

type StreamedFile = Express.Multer.File & PutResult

/** A multer storage engine that streams the part into the object store. */
function objectStoreEngine(store: ObjectStore, purpose: StoredFilePurpose, inspect?: InspectHead): StorageEngine {
  return {
    _handleFile(_req, file, cb) {
      putStream(store, file.stream, purpose, file.mimetype, inspect).then(
        (put) => cb(null, { ...put, size: put.sizeBytes } as Partial<Express.Multer.File>),
        (e: unknown) => {
          // drain the rest of the part so busboy can finish (multer reports the error)
          file.stream.resume()
          cb(e as Error)
        },
      )
    },
    _removeFile(_req, file, cb) {
      const key = (file as Partial<StreamedFile>).objectKey
      if (!key) return cb(null)
      removeObject(store, key).then(() => cb(null), cb)
    },
  }
}

export interface StoredUpload {
  file: StoredFileRow
  /** The form's other fields (text only). */
  fields: Record<string, string>
}

/**
 * Stores the one file of a multipart form (field `fieldName`): 413 file_too_large beyond the
 * configured size, 503 storage_unavailable when the store cannot take it (no row then), 400
 * when the request holds no file or is not a multipart form.
 */
export async function storeUpload(
  deps: { db: Db; store: ObjectStore | undefined },
  req: Request,
  res: Response,
  opts: { fieldName?: string; purpose: StoredFilePurpose; uploadedBy: string },
): Promise<StoredUpload> {
  const received = await receiveUpload(deps.store, req, res, opts)
  const store = requireStore(deps.store)
  const row = await recordStored(deps.db, store, received.put, { originalName: received.originalName, contentType: received.declaredType, purpose: opts.purpose, uploadedBy: opts.uploadedBy })
  return { file: row, fields: received.fields }
}

export interface ReceivedUpload {
  /** The stored object (no row yet: the caller writes it, and removes the object if it cannot). */
  put: PutResult
  /** The name and type the uploader's computer sent (not to be trusted). */
  originalName: string
  declaredType: string
  fields: Record<string, string>
}

/**
 * Streams the one file of a multipart form into the store without writing its row, for a
 * caller that writes the row together with its own (in one transaction). Same refusals as
 * `storeUpload`; `store.maxUploadBytes` is the limit; `inspect` may refuse the content.
 */
export async function receiveUpload(
  storeOrNone: ObjectStore | undefined,
  req: Request,
  res: Response,
  opts: { fieldName?: string; purpose: StoredFilePurpose; inspect?: InspectHead },
): Promise<ReceivedUpload> {
  const fieldName = opts.fieldName ?? 'file'
  if (!req.is('multipart/form-data')) throw badRequest('not_multipart', `Send the file as a multipart form with the field "${fieldName}".`)
  const store = requireStore(storeOrNone)
  const handler = multer({
    storage: objectStoreEngine(store, opts.purpose, opts.inspect),
    limits: { fileSize: store.maxUploadBytes, files: 1, fields: 20, fieldSize: 10_000, parts: 25 },
  }).single(fieldName)
  try {
    await new Promise<void>((resolve, reject) => handler(req, res, (err?: unknown) => (err ? reject(err) : resolve())))
  } catch (e) {
    if (e instanceof MulterError) {
      if (e.code === 'LIMIT_FILE_SIZE') throw fileTooLarge(store.maxUploadBytes)
      if (e.code === 'LIMIT_UNEXPECTED_FILE') throw badRequest('unexpected_file', `Send one file, in the field "${fieldName}".`)
      throw badRequest('bad_upload', `The form could not be read: ${e.message}.`)
    }
    if (e instanceof HttpError) throw e
    // busboy: a malformed multipart body
    if (e instanceof Error && /multipart|boundary|unexpected end of form|malformed/i.test(e.message)) throw badRequest('bad_upload', `The form could not be read: ${e.message}.`)
    throw e
  }
  const file = req.file as StreamedFile | undefined
  if (!file) throw badRequest('file_missing', `Choose a file to upload (the field "${fieldName}").`)
  const fields: Record<string, string> = {}
  for (const [k, v] of Object.entries((req.body ?? {}) as Record<string, unknown>)) if (typeof v === 'string') fields[k] = v
  return { put: file, originalName: file.originalname, declaredType: file.mimetype, fields }
}

/** Streams a stored object back (404 stored_object_missing when the store has no such key, 503 storage_unavailable when it cannot be reached). */
export async function readStoredObject(store: ObjectStore | undefined, objectKey: string): Promise<Readable> {
  const s = requireStore(store)
  try {
    const r = await s.client.send(new GetObjectCommand({ Bucket: s.bucket, Key: objectKey }))
    if (!r.Body) throw new Error('no body')
    return r.Body as Readable
  } catch (e) {
    log().warn(`object store: reading ${objectKey} failed: ${(e as Error)?.name ?? ''} ${(e as Error)?.message ?? String(e)}`)
    throw isMissingObject(e) ? storedObjectMissing() : storageUnavailable()
  }
}

/**
 * Reads a stored object through again and hashes it (an integrity check): its SHA-256 and
 * size, or 'missing' when the store has no such object (503 when the store cannot be read).
 */
export async function hashStoredObject(store: ObjectStore | undefined, objectKey: string): Promise<{ sha256: string; sizeBytes: number } | 'missing'> {
  const s = requireStore(store)
  try {
    const r = await s.client.send(new GetObjectCommand({ Bucket: s.bucket, Key: objectKey }))
    if (!r.Body) throw new Error('no body')
    const hash = crypto.createHash('sha256')
    let sizeBytes = 0
    for await (const chunk of r.Body as Readable) {
      const b = chunk as Buffer
      sizeBytes += b.length
      hash.update(b)
    }
    return { sha256: hash.digest('hex'), sizeBytes }
  } catch (e) {
    if (isMissingObject(e)) return 'missing'
    log().warn(`object store: reading ${objectKey} for a check failed: ${(e as Error)?.name ?? ''} ${(e as Error)?.message ?? String(e)}`)
    throw storageUnavailable()
  }
}

/** Every object under a key prefix, with when it was last written (503 when the store cannot be listed). */
export async function listStoredObjects(store: ObjectStore | undefined, prefix: string): Promise<{ key: string; lastModified: Date }[]> {
  const s = requireStore(store)
  const out: { key: string; lastModified: Date }[] = []
  let token: string | undefined
  try {
    do {
      const r = await s.client.send(new ListObjectsV2Command({ Bucket: s.bucket, Prefix: prefix, ContinuationToken: token }))
      for (const o of r.Contents ?? []) if (o.Key) out.push({ key: o.Key, lastModified: o.LastModified ?? new Date(0) })
      token = r.IsTruncated ? r.NextContinuationToken : undefined
    } while (token)
  } catch (e) {
    log().warn(`object store: listing ${prefix} failed: ${(e as Error)?.name ?? ''} ${(e as Error)?.message ?? String(e)}`)
    throw storageUnavailable()
  }
  return out
}
