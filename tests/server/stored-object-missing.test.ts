/**
 * A stored object that vanished from the store (its row and checksum remain) is an integrity
 * problem, told apart from a store that cannot be reached: a download answers 404
 * stored_object_missing, the analysis fails once with words saying so, and the evidence bundle
 * still goes out with the file marked unreadable. A store that is down stays 503.
 */
import fs from 'node:fs'
import os from 'node:os'
import path from 'node:path'
import { Readable } from 'node:stream'
import { DeleteObjectCommand } from '@aws-sdk/client-s3'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { startS3Fake, type S3Fake } from '../../ops/local/s3-fake'
import { createObjectStore, type ObjectStore } from '../../server/storage/object-store'
import { storeStream } from '../../server/storage/stored-files'
import { evidenceFiles } from '../../server/db/schema'
import { runEvidenceProcessing } from '../../server/modules/evidence/processing/process-evidence'
import { bundleManifestSchema } from '../../shared/schemas/evidence-bundle'
import { createTestContext, type TestContext } from '../support/harness'
import { readZip } from '../support/zip-reader'
import { makeCase, makeOffice, makeUser, signIn, type Agent, type TestUser } from '../support/factories'

let fake: S3Fake
let fakeClosed = false
let store: ObjectStore
let t: TestContext
let staff: TestUser
let agent: Agent
let caseId: string
const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'qb-missing-object-s3-'))

/** A JSON trace stored as evidence of the case, then deleted from the store behind the app's back. */
async function evidenceWithoutObject(name: string): Promise<string> {
  const body = Buffer.from(JSON.stringify({ freqHz: [1e8, 1.0001e8], levelDbm: [-90, -80], enbwHz: 1e4 }))
  const file = await storeStream({ db: t.services.db, store }, Readable.from([body]), { originalName: name, contentType: 'application/json', purpose: 'evidence', uploadedBy: staff.id })
  const [e] = await t.services.db
    .insert(evidenceFiles)
    .values({ caseId, storedFileId: file.id, kind: 'spectrum_capture', uploaderRole: 'staff', uploaderUserId: staff.id, displayName: name, submittedNameJson: JSON.stringify(name) })
    .returning({ id: evidenceFiles.id })
  await store.client.send(new DeleteObjectCommand({ Bucket: store.bucket, Key: file.objectKey }))
  return e!.id
}

beforeAll(async () => {
  process.env.AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED = 'true'
  fake = await startS3Fake({ directory: dir, bucket: 'missing-test' })
  store = createObjectStore({ ...fake, region: 'us-east-1', forcePathStyle: true, maxUploadBytes: 8 * 1024 * 1024 })
  t = await createTestContext({ objectStore: store })
  const office = await makeOffice(t)
  caseId = (await makeCase(t, { office, state: 'field_work' })).id
  staff = await makeUser(t, { role: 'investigator', office })
  agent = await signIn(t, await makeUser(t, { role: 'supervisor', office }))
})
afterAll(async () => {
  await t?.close()
  if (!fakeClosed) await fake?.close()
  fs.rmSync(dir, { recursive: true, force: true })
})

describe('a stored object missing from the store', () => {
  it('is a 404 stored_object_missing on download, not an outage', async () => {
    const id = await evidenceWithoutObject('gone-before-download.json')
    const res = await agent.get(`/api/evidence/${id}/download`).expect(404)
    expect(res.body.error.code).toBe('stored_object_missing')
    expect(res.body.error.message).toMatch(/missing from the file store/)
  })

  it('fails its analysis once, saying the copy is missing', async () => {
    const id = await evidenceWithoutObject('gone-before-analysis.json')
    await runEvidenceProcessing({ db: t.services.db, objectStore: store }, id)
    const { rows } = await t.pool.query(`SELECT state, message FROM evidence_analyses WHERE evidence_id = $1`, [id])
    expect(rows).toEqual([{ state: 'failed', message: expect.stringMatching(/^The stored copy of the file is missing from the file store/) }])
  })

  it('leaves the evidence bundle whole, every file of it (the first included) marked unreadable', async () => {
    const res = await agent.get(`/api/cases/${caseId}/evidence-bundle`).buffer(true).parse((r, cb) => {
      const chunks: Buffer[] = []
      r.on('data', (c: Buffer) => chunks.push(c))
      r.on('end', () => cb(null, Buffer.concat(chunks)))
    })
    expect(res.status).toBe(200)
    const manifest = bundleManifestSchema.parse(JSON.parse(readZip(res.body as Buffer).find((e) => e.name === 'manifest.json')!.data.toString('utf8')))
    expect(manifest.files.length).toBeGreaterThanOrEqual(2)
    for (const f of manifest.files) expect(f.check.outcome).toBe('unreadable')
  })
})

describe('a store that cannot be reached', () => {
  it('is still a 503 storage_unavailable', async () => {
    const id = await evidenceWithoutObject('store-down.json')
    await fake.close()
    fakeClosed = true
    const res = await agent.get(`/api/evidence/${id}/download`).expect(503)
    expect(res.body.error.code).toBe('storage_unavailable')
  })
})
