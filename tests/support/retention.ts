/**
 * The set-up the retention tests share: an app on the throwaway database with its file store on
 * a local S3 fake of the test file's own (started before its tests, removed after), and the
 * helpers they build cases and look at the store with.
 */
import crypto from 'node:crypto'
import fs from 'node:fs'
import os from 'node:os'
import path from 'node:path'
import { HeadObjectCommand, PutObjectCommand } from '@aws-sdk/client-s3'
import { afterAll, beforeAll, expect } from 'vitest'
import { startS3Fake, type S3Fake } from '../../ops/local/s3-fake'
import { closeCase, proposeFinding } from '../../server/modules/cases/case-moves.service'
import { addComplainantInformation } from '../../server/modules/cases/case-notes.service'
import type { Office } from '../../server/db/schema'
import { createObjectStore, type ObjectStore } from '../../server/storage/object-store'
import { createTestContext, uniqueAddress, type TestContext } from './harness'
import { makeCase, signIn, type TestCase } from './factories'

/** SHA-256 of the bytes, hex (node:crypto: the reference the run's recorded digests are checked against). */
export const sha256 = (b: Buffer) => crypto.createHash('sha256').update(b).digest('hex')

type Report = Parameters<typeof makeCase>[1]['report']

/** A closed case with one uploaded file, as closedCaseWithFile answers it. */
export type ClosedCaseWithFile = TestCase & { evidenceId: string; objectKey: string; storedFileId: string; bytes: Buffer }

/**
 * Registers the file's beforeAll/afterAll for the shared set-up (call it once, at the top of the
 * test file, before the file's own hooks) and answers the context and the helpers. `name` names
 * the fake's bucket and folder.
 */
export function useRetentionTestContext(name: string) {
  let fake: S3Fake | undefined
  let store: ObjectStore | undefined
  let t: TestContext | undefined
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), `qb-${name}-s3-`))

  beforeAll(async () => {
    process.env.AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED = 'true'
    fake = await startS3Fake({ directory: dir, bucket: `${name}-test` })
    store = createObjectStore({ ...fake, region: 'us-east-1', forcePathStyle: true, maxUploadBytes: 1024 * 1024 })
    t = await createTestContext({ objectStore: store })
  }, 120_000)
  afterAll(async () => {
    await t?.close()
    await fake?.close()
    fs.rmSync(dir, { recursive: true, force: true })
  })

  const ready = () => {
    if (!t || !store) throw new Error('the retention test context is used before its beforeAll ran')
    return { t, store }
  }

  /** Whether the store still holds the object (HEAD answers 404 once it is deleted). */
  async function objectExists(key: string): Promise<boolean> {
    const { store } = ready()
    try {
      await store.client.send(new HeadObjectCommand({ Bucket: store.bucket, Key: key }))
      return true
    } catch (e) {
      if ((e as { $metadata?: { httpStatusCode?: number } }).$metadata?.httpStatusCode === 404) return false
      throw e
    }
  }

  /** Moves a closed case's closing 30 months back: past the default 24-month period today (the app role may change a case's row; closing time is not a record). */
  async function expire(caseId: string): Promise<void> {
    await ready().t.pool.query(`UPDATE cases SET closed_at = closed_at - interval '30 months' WHERE id = $1`, [caseId])
  }

  /** Gives the case's file a thumbnail, as the thumbnail job leaves one (object and row); answers its key. */
  async function addThumbnail(c: { id: string; objectKey: string }): Promise<string> {
    const { t, store } = ready()
    const key = `thumbnails/${c.objectKey}.webp`
    await store.client.send(new PutObjectCommand({ Bucket: store.bucket, Key: key, Body: Buffer.from('thumbnail bytes'), ContentType: 'image/webp' }))
    await t.pool.query(
      `INSERT INTO evidence_thumbnails (evidence_id, state, object_key, content_type, width_px, height_px, size_bytes) SELECT id, 'done', $2, 'image/webp', 1, 1, 15 FROM evidence_files WHERE case_id = $1`,
      [c.id, key],
    )
    return key
  }

  /**
   * A case of the office in field work with one uploaded file (and, given `addedText`, the
   * complainant's added text), then closed with a finding and no follow-up.
   */
  async function closedCaseWithFile(office: Office, fileName: string, report: Report = {}, addedText?: string): Promise<ClosedCaseWithFile> {
    const { t } = ready()
    const c = await makeCase(t, { office, state: 'field_work', report })
    const inv = await signIn(t, c.investigator!)
    const bytes = Buffer.from(`capture of ${c.id}\n433.92,-61.5\n`)
    const up = await inv
      .post(`/api/cases/${c.id}/evidence`)
      .set('X-Forwarded-For', uniqueAddress())
      .field('kind', 'other')
      .attach('file', bytes, { filename: fileName, contentType: 'text/csv' })
    expect(up.status, JSON.stringify(up.body)).toBe(201)
    if (addedText !== undefined) await addComplainantInformation(t.services, { role: 'tracking_link', caseId: c.id }, c.id, addedText)
    const proposed = await proposeFinding(t.services, c.investigator!.actor, c.id, {
      version: c.version,
      sourceDescription: 'A mains adapter in the barn',
      recommendedAction: 'advise_operator',
      calculationIds: [],
      evidenceIds: [],
      summary: 'Adapter replaced by the owner.',
    })
    const closed = await closeCase(t.services, c.supervisor!.actor, c.id, { version: proposed.version, resolution: 'source_corrected', reason: 'Adapter replaced.' })
    const { rows } = await t.pool.query<{ evidence_id: string; object_key: string; stored_file_id: string }>(
      `SELECT e.id AS evidence_id, s.object_key, s.id AS stored_file_id FROM evidence_files e JOIN stored_files s ON s.id = e.stored_file_id WHERE e.case_id = $1`,
      [c.id],
    )
    expect(rows).toHaveLength(1)
    return { ...c, state: 'closed', version: closed.version, evidenceId: rows[0]!.evidence_id, objectKey: rows[0]!.object_key, storedFileId: rows[0]!.stored_file_id, bytes }
  }

  return {
    get t() {
      return ready().t
    },
    get store() {
      return ready().store
    },
    objectExists,
    expire,
    addThumbnail,
    closedCaseWithFile,
  }
}
