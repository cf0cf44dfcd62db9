/**
 * Thumbnails of photo evidence, against the S3 fake and the processing worker: a JPEG made here
 * with sharp (landscape pixels, EXIF orientation 6, GPS-bearing metadata) gets a WebP thumbnail
 * of at most 320 px on its long side, turned upright and without metadata, under a key of its
 * own (the evidence object unchanged); the list offers it and GET /api/evidence/:id/thumbnail
 * serves it to staff of the office without a custody entry, and answers 404 to another office,
 * another complainant and a file without one. A decompression bomb (a PNG whose header declares
 * 30 000 × 30 000 pixels) is refused by sharp's pixel limit and recorded, and the worker goes on.
 * The processing sweep queues again a thumbnail whose job was lost.
 */
import fs from 'node:fs'
import os from 'node:os'
import path from 'node:path'
import zlib from 'node:zlib'
import { HeadObjectCommand } from '@aws-sdk/client-s3'
import sharp from 'sharp'
import request from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { startS3Fake, type S3Fake } from '../../ops/local/s3-fake'
import { createObjectStore, type ObjectStore } from '../../server/storage/object-store'
import { startEvidenceProcessingWorker, type EvidenceProcessingWorker } from '../../server/modules/evidence/processing-queue'
import { findThumbnail } from '../../server/modules/evidence/thumbnails/thumbnails.repo'
import { requeueStrandedProcessing } from '../../server/modules/evidence/processing-sweep'
import { THUMBNAIL_LONG_SIDE_PX } from '../../server/modules/evidence/thumbnails/make-thumbnail'
import { custodyListResponseSchema, evidenceListResponseSchema, evidenceUploadResponseSchema } from '../../shared/schemas/evidence'
import { createTestContext, type TestContext } from '../support/harness'
import { makeCase, makeOffice, makeUser, signIn, type Agent, type TestCase } from '../support/factories'

let fake: S3Fake
let store: ObjectStore
let t: TestContext
let worker: EvidenceProcessingWorker
let worked: TestCase
let staff: Agent
const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'qb-evidence-thumbs-s3-'))

beforeAll(async () => {
  process.env.AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED = 'true'
  fake = await startS3Fake({ directory: dir, bucket: 'thumbs-test' })
  store = createObjectStore({ ...fake, region: 'us-east-1', forcePathStyle: true, maxUploadBytes: 64 * 1024 * 1024 })
  t = await createTestContext({ objectStore: store })
  worker = await startEvidenceProcessingWorker({ boss: t.boss, db: t.services.db, objectStore: store }, { pollingIntervalSeconds: 0.5 })
  worked = await makeCase(t, { office: await makeOffice(t), state: 'field_work' })
  staff = await signIn(t, worked.investigator!)
}, 120_000)
afterAll(async () => {
  await worker?.stop()
  await t?.close()
  await fake?.close()
  fs.rmSync(dir, { recursive: true, force: true })
})

/** A 1200 × 600 JPEG (left half red, right half blue) stored sideways: EXIF orientation 6 says "turn 90° clockwise to view". */
async function sidewaysJpeg(): Promise<Buffer> {
  const red = await sharp({ create: { width: 600, height: 600, channels: 3, background: '#d02020' } }).png().toBuffer()
  return sharp({ create: { width: 1200, height: 600, channels: 3, background: '#2040d0' } })
    .composite([{ input: red, left: 0, top: 0 }])
    .jpeg({ quality: 85 })
    .withMetadata({ orientation: 6, exif: { IFD0: { Copyright: 'Field office test', Artist: 'Thumbnail test' } } })
    .toBuffer()
}

const crcTable = Array.from({ length: 256 }, (_, n) => {
  let c = n
  for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1
  return c >>> 0
})
function pngChunk(type: string, data: Buffer): Buffer {
  const body = Buffer.concat([Buffer.from(type, 'ascii'), data])
  let c = 0xffffffff
  for (const x of body) c = crcTable[(c ^ x) & 0xff]! ^ (c >>> 8)
  const len = Buffer.alloc(4)
  len.writeUInt32BE(data.length)
  const crc = Buffer.alloc(4)
  crc.writeUInt32BE((c ^ 0xffffffff) >>> 0)
  return Buffer.concat([len, body, crc])
}

/** A few-kB PNG whose header declares 30 000 × 30 000 RGB pixels (900 megapixels, 2.7 GB decoded). */
function pngBomb(): Buffer {
  const ihdr = Buffer.alloc(13)
  ihdr.writeUInt32BE(30_000, 0)
  ihdr.writeUInt32BE(30_000, 4)
  ihdr.writeUInt8(8, 8) // bit depth
  ihdr.writeUInt8(2, 9) // truecolour
  const rows = zlib.deflateSync(Buffer.alloc(4 * (1 + 3 * 30_000)))
  return Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]), pngChunk('IHDR', ihdr), pngChunk('IDAT', rows), pngChunk('IEND', Buffer.alloc(0))])
}

async function upload(agent: Agent, url: string, kind: string, body: Buffer, name: string) {
  const res = await agent.post(url).field('kind', kind).attach('file', body, name)
  expect(res.status).toBe(201)
  return evidenceUploadResponseSchema.parse(res.body).evidence
}

async function thumbnailSettled(id: string) {
  const deadline = Date.now() + 20_000
  while (Date.now() < deadline && !(await findThumbnail(t.services.db, id))) await new Promise((r) => setTimeout(r, 200))
  return (await findThumbnail(t.services.db, id))!
}

const binary = (res: request.Response, cb: (err: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = []
  res.on('data', (c: Buffer) => chunks.push(c))
  res.on('end', () => cb(null, Buffer.concat(chunks)))
}

describe('a photo’s thumbnail', () => {
  let photoId: string
  let objectKey: string
  beforeAll(async () => {
    const photo = await upload(staff, `/api/cases/${worked.id}/evidence`, 'photo', await sidewaysJpeg(), 'mast.jpg')
    photoId = photo.id
    expect(photo.contentType).toBe('image/jpeg')
    // made by a job after the upload
    expect(photo.thumbnail).toEqual({ state: 'pending' })
    objectKey = (await t.pool.query('SELECT sf.object_key FROM evidence_files e JOIN stored_files sf ON sf.id = e.stored_file_id WHERE e.id = $1', [photoId])).rows[0].object_key
  })

  it('is made upright, at most 320 px on its long side, as WebP without metadata, under a key of its own', async () => {
    const th = await thumbnailSettled(photoId)
    expect(th.message).toBeNull()
    expect(th.state).toBe('done')
    // 1200 × 600 stored, orientation 6: viewed 600 × 1200, so the thumbnail is 160 × 320
    expect([th.widthPx, th.heightPx]).toEqual([160, THUMBNAIL_LONG_SIDE_PX])
    expect(th.objectKey).toBe(`thumbnails/${objectKey}.webp`)
    expect(th.objectKey).not.toBe(objectKey)
    const head = await store.client.send(new HeadObjectCommand({ Bucket: store.bucket, Key: th.objectKey! }))
    expect(head.ContentLength).toBe(th.sizeBytes)
  })

  it('is offered on the list (view schema, nothing undeclared) and served to staff of the office, with no custody entry', async () => {
    const list = await staff.get(`/api/cases/${worked.id}/evidence`).expect(200)
    expect(evidenceListResponseSchema.parse(list.body)).toEqual(list.body)
    expect(list.body.evidence.find((e: { id: string }) => e.id === photoId).thumbnail).toEqual({ state: 'done', widthPx: 160, heightPx: 320 })
    const custodyBefore = custodyListResponseSchema.parse((await staff.get(`/api/evidence/${photoId}/custody`).expect(200)).body).custody

    const res = await staff.get(`/api/evidence/${photoId}/thumbnail`).buffer(true).parse(binary)
    expect(res.status).toBe(200)
    expect(res.headers['content-type']).toBe('image/webp')
    const meta = await sharp(res.body as Buffer).metadata()
    expect(meta.format).toBe('webp')
    expect(Math.max(meta.width!, meta.height!)).toBeLessThanOrEqual(320)
    expect([meta.width, meta.height]).toEqual([160, 320])
    expect(meta.exif).toBeUndefined()
    expect(meta.orientation).toBeUndefined()
    // upright: the red half of the stored image (its left) is now on top
    const { data } = await sharp(res.body as Buffer).raw().toBuffer({ resolveWithObject: true })
    const pixel = (x: number, y: number) => Array.from(data.subarray((y * 160 + x) * 3, (y * 160 + x) * 3 + 3))
    expect(pixel(80, 40)[0]).toBeGreaterThan(150) // red on top
    expect(pixel(80, 280)[2]).toBeGreaterThan(150) // blue below

    const custodyAfter = custodyListResponseSchema.parse((await staff.get(`/api/evidence/${photoId}/custody`).expect(200)).body).custody
    expect(custodyAfter).toEqual(custodyBefore)
    // the evidence object itself is untouched
    expect((await staff.post(`/api/evidence/${photoId}/verify`).send({}).expect(200)).body.outcome).toBe('verified')
  })

  it('answers 404 to another office, to another complainant, and 401 to nobody', async () => {
    const other = await signIn(t, await makeUser(t, { role: 'supervisor', office: await makeOffice(t) }))
    const far = await other.get(`/api/evidence/${photoId}/thumbnail`)
    expect(far.status).toBe(404)
    expect(far.body.error.code).toBe('evidence_not_found')
    const stranger = await signIn(t, await makeUser(t, { role: 'complainant' }))
    expect((await stranger.get(`/api/evidence/${photoId}/thumbnail`)).status).toBe(404)
    expect((await request(t.app).get(`/api/evidence/${photoId}/thumbnail`)).status).toBe(401)
  })

  it('answers 404 thumbnail_not_found for a file that is not a photo', async () => {
    const csv = await upload(staff, `/api/cases/${worked.id}/evidence`, 'document', Buffer.from('a,b\n1,2\n3,4\n'), 'notes.csv')
    expect(csv.thumbnail).toBeNull()
    const res = await staff.get(`/api/evidence/${csv.id}/thumbnail`)
    expect(res.status).toBe(404)
    expect(res.body.error.code).toBe('thumbnail_not_found')
    expect(await findThumbnail(t.services.db, csv.id)).toBeUndefined()
  })
})

describe('a decompression bomb', () => {
  it('is refused by the pixel limit and recorded as a failure; the worker goes on to the next image', async () => {
    const bomb = pngBomb()
    expect(bomb.length).toBeLessThan(200_000)
    const refused = await upload(staff, `/api/cases/${worked.id}/evidence`, 'photo', bomb, 'huge.png')
    expect(refused.contentType).toBe('image/png')
    const th = await thumbnailSettled(refused.id)
    expect(th.state).toBe('failed')
    expect(th.message).toMatch(/declares more than 50 megapixels/)
    expect(th.objectKey).toBeNull()
    expect((await staff.get(`/api/evidence/${refused.id}/thumbnail`)).status).toBe(404)
    const list = await staff.get(`/api/cases/${worked.id}/evidence`).expect(200)
    expect(evidenceListResponseSchema.parse(list.body).evidence.find((e) => e.id === refused.id)!.thumbnail).toEqual({ state: 'failed', message: th.message })

    const next = await upload(staff, `/api/cases/${worked.id}/evidence`, 'photo', await sharp({ create: { width: 400, height: 300, channels: 3, background: '#208020' } }).png().toBuffer(), 'next.png')
    const made = await thumbnailSettled(next.id)
    expect(made.state).toBe('done')
    expect([made.widthPx, made.heightPx]).toEqual([320, 240])
  })
})

describe('the processing sweep', () => {
  it('queues again the thumbnail of an image that has none (its job lost in a crash), and it is made', async () => {
    const photo = await upload(staff, `/api/cases/${worked.id}/evidence`, 'photo', await sharp({ create: { width: 640, height: 480, channels: 3, background: '#808020' } }).jpeg().toBuffer(), 'lost.jpg')
    await thumbnailSettled(photo.id)
    // as if the job had never run: no row, no job
    await t.pool.query('DELETE FROM evidence_thumbnails WHERE evidence_id = $1', [photo.id])
    const young = await requeueStrandedProcessing({ db: t.services.db, boss: t.boss })
    expect(young.thumbnails).not.toContain(photo.id)
    const swept = await requeueStrandedProcessing({ db: t.services.db, boss: t.boss, now: new Date(Date.now() + 11 * 60 * 1000) })
    expect(swept.thumbnails).toContain(photo.id)
    const made = await thumbnailSettled(photo.id)
    expect(made.state).toBe('done')
    expect([made.widthPx, made.heightPx]).toEqual([320, 240])
    // a photo is not analysed: the sweep does not queue it for that
    expect(swept.analyses).not.toContain(photo.id)
  })
})
