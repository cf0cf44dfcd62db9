/**
 * The evidence bundle: two files uploaded through the API come back in one ZIP whose
 * manifest's SHA-256 values equal node:crypto's hash of the original bytes, each file marked as
 * matching; a file altered in the store is bundled but marked as not matching, one missing from
 * the store is listed as unreadable while the others are bundled; a removed file is left out; each bundled file gains a 'bundled' custody entry; another office gets 404.
 */
import crypto from 'node:crypto'
import fs from 'node:fs'
import os from 'node:os'
import path from 'node:path'
import { DeleteObjectCommand, PutObjectCommand } from '@aws-sdk/client-s3'
import request from 'supertest'
import type { Response } from 'superagent'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { startS3Fake, type S3Fake } from '../../ops/local/s3-fake'
import { createObjectStore, type ObjectStore } from '../../server/storage/object-store'
import { evidenceUploadResponseSchema } from '../../shared/schemas/evidence'
import { bundleManifestSchema, type BundleManifest } from '../../shared/schemas/evidence-bundle'
import { createTestContext, type TestContext } from '../support/harness'
import { makeCase, makeOffice, makeUser, signIn, type Agent, type TestCase } from '../support/factories'
import { readZip, type ZipEntry } from '../support/zip-reader'

let fake: S3Fake
let store: ObjectStore
let t: TestContext
let worked: TestCase
let investigator: Agent
let supervisor: Agent
let stranger: Agent
const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'qb-bundle-s3-'))

const sha256 = (b: Buffer) => crypto.createHash('sha256').update(b).digest('hex')

// a spectrum trace (CSV) and a 1×1 PNG (a real signature, so the content check takes it as a photo)
const TRACE = Buffer.from(['freqHz,levelDbm', ...Array.from({ length: 400 }, (_, i) => `${433_000_000 + i * 5000},${(-95 + Math.sin(i / 7) * 3).toFixed(2)}`)].join('\n') + '\n')
const PNG = Buffer.from(
  '89504e470d0a1a0a0000000d4948445200000001000000010806000000' + '1f15c4890000000d49444154789c6360f8cfc0f01f0005000201e2' + '21bc330000000049454e44ae426082',
  'hex',
)

beforeAll(async () => {
  process.env.AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED = 'true'
  fake = await startS3Fake({ directory: dir, bucket: 'bundle-test' })
  store = createObjectStore({ ...fake, region: 'us-east-1', forcePathStyle: true, maxUploadBytes: 1024 * 1024 })
  t = await createTestContext({ objectStore: store })
  const office = await makeOffice(t)
  worked = await makeCase(t, { office, state: 'field_work' })
  investigator = await signIn(t, worked.investigator!)
  supervisor = await signIn(t, worked.supervisor!)
  stranger = await signIn(t, await makeUser(t, { role: 'investigator', office: await makeOffice(t) }))
})
afterAll(async () => {
  await t?.close()
  await fake?.close()
  fs.rmSync(dir, { recursive: true, force: true })
})

const upload = async (agent: Agent, bytes: Buffer, filename: string, kind: string, contentType: string) => {
  const r = await agent.post(`/api/cases/${worked.id}/evidence`).field('kind', kind).attach('file', bytes, { filename, contentType })
  expect(r.status, JSON.stringify(r.body)).toBe(201)
  return evidenceUploadResponseSchema.parse(r.body).evidence
}

/** supertest collects a binary answer into a Buffer with this parser. */
const binary = (res: Response, cb: (err: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = []
  res.on('data', (c: Buffer) => chunks.push(c))
  res.on('end', () => cb(null, Buffer.concat(chunks)))
}

async function downloadBundle(agent: Agent): Promise<{ entries: ZipEntry[]; manifest: BundleManifest; text: string }> {
  const r = await agent.get(`/api/cases/${worked.id}/evidence-bundle`).buffer(true).parse(binary)
  expect(r.status).toBe(200)
  expect(r.headers['content-type']).toBe('application/zip')
  expect(r.headers['content-disposition']).toContain(`${worked.reference}-evidence.zip`)
  const entries = readZip(r.body as Buffer)
  // the manifest's shape is the shared schema's
  const manifest = bundleManifestSchema.parse(JSON.parse(entries.find((e) => e.name === 'manifest.json')!.data.toString('utf8')))
  const text = entries.find((e) => e.name === 'manifest.txt')!.data.toString('utf8')
  return { entries, manifest, text }
}

describe('GET /api/cases/:id/evidence-bundle', () => {
  let traceId: string
  let photoId: string

  it('bundles the uploaded files with a manifest whose hashes are those of the original bytes', async () => {
    traceId = (await upload(investigator, TRACE, 'trace 433 MHz.csv', 'spectrum_capture', 'text/csv')).id
    photoId = (await upload(investigator, PNG, 'mast.png', 'photo', 'image/png')).id

    const { entries, manifest, text } = await downloadBundle(investigator)
    expect(manifest.case.reference).toBe(worked.reference)
    expect(manifest.files.map((f) => f.evidenceId).sort()).toEqual([traceId, photoId].sort())
    for (const [id, original, name, kind] of [
      [traceId, TRACE, 'trace 433 MHz.csv', 'spectrum_capture'],
      [photoId, PNG, 'mast.png', 'photo'],
    ] as const) {
      const f = manifest.files.find((x) => x.evidenceId === id)!
      // the hash recorded at intake, the one recomputed while bundling, and the bytes in the ZIP all equal node:crypto's
      expect(f.sha256).toBe(sha256(original))
      expect(f.check).toEqual({ outcome: 'match', computedSha256: sha256(original), bytesRead: original.length })
      expect(f.name).toBe(name)
      expect(f.kind).toBe(kind)
      expect(f.sizeBytes).toBe(original.length)
      expect(f.uploadedBy.role).toBe('staff')
      expect(f.custody.map((c) => c.action)).toContain('uploaded')
      const entry = entries.find((e) => e.name === f.path)!
      expect(sha256(entry.data)).toBe(sha256(original))
      expect(text).toContain(sha256(original))
    }
    expect(entries.map((e) => e.name).sort()).toEqual([...manifest.files.map((f) => f.path!), 'manifest.json', 'manifest.txt'].sort())
  })

  it("writes a 'bundled' custody entry per file", async () => {
    const { rows } = await t.pool.query<{ evidence_id: string; detail: string }>(
      "SELECT evidence_id, detail FROM evidence_custody WHERE action = 'bundled' AND evidence_id = ANY($1::uuid[])",
      [[traceId, photoId]],
    )
    expect(rows.map((r) => r.evidence_id).sort()).toEqual([traceId, photoId].sort())
    expect(rows.every((r) => r.detail.includes('matched'))).toBe(true)
  })

  it('marks a file whose stored bytes no longer match its intake hash', async () => {
    const { rows } = await t.pool.query<{ object_key: string }>(
      'SELECT s.object_key FROM evidence_files e JOIN stored_files s ON s.id = e.stored_file_id WHERE e.id = $1',
      [traceId],
    )
    const altered = Buffer.from(TRACE.toString('utf8').replace('-95.00', '-45.00'))
    expect(altered.equals(TRACE)).toBe(false)
    await store.client.send(new PutObjectCommand({ Bucket: store.bucket, Key: rows[0]!.object_key, Body: altered, ContentLength: altered.length }))

    const { manifest, text } = await downloadBundle(supervisor)
    const f = manifest.files.find((x) => x.evidenceId === traceId)!
    expect(f.sha256).toBe(sha256(TRACE))
    expect(f.check.outcome).toBe('mismatch')
    expect(f.check.computedSha256).toBe(sha256(altered))
    expect(text).toContain('DOES NOT MATCH')
    expect(manifest.files.find((x) => x.evidenceId === photoId)!.check.outcome).toBe('match')
  })

  it('still bundles the others when one file cannot be read from the store, and says so in the manifest', async () => {
    const { rows } = await t.pool.query<{ object_key: string }>(
      'SELECT s.object_key FROM evidence_files e JOIN stored_files s ON s.id = e.stored_file_id WHERE e.id = $1',
      [photoId],
    )
    await store.client.send(new DeleteObjectCommand({ Bucket: store.bucket, Key: rows[0]!.object_key }))
    const { manifest, entries, text } = await downloadBundle(investigator)
    const photo = manifest.files.find((x) => x.evidenceId === photoId)!
    expect(photo.check).toEqual({ outcome: 'unreadable', computedSha256: null, bytesRead: 0 })
    expect(photo.path).toBeNull()
    expect(entries.some((e) => e.data.equals(PNG))).toBe(false)
    expect(text).toContain('could not be read from the file store')
    expect(manifest.files.find((x) => x.evidenceId === traceId)!.path).not.toBeNull()
  })

  it('leaves a removed file out', async () => {
    const r = await supervisor.post(`/api/evidence/${photoId}/remove`).send({ reason: 'Photo of the wrong mast.' })
    expect(r.status, JSON.stringify(r.body)).toBeLessThan(300)
    const { manifest, entries } = await downloadBundle(investigator)
    expect(manifest.files.map((f) => f.evidenceId)).toEqual([traceId])
    expect(entries.some((e) => e.data.equals(PNG))).toBe(false)
  })

  it("answers 404 to another office's staff and 401 without a session", async () => {
    const r = await stranger.get(`/api/cases/${worked.id}/evidence-bundle`)
    expect(r.status).toBe(404)
    expect(r.body.error.code).toBe('case_not_found')
    const anon = await request(t.app).get(`/api/cases/${worked.id}/evidence-bundle`)
    expect(anon.status).toBe(401)
  })
})
