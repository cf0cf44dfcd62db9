/**
 * Evidence files on a case, against the local S3 fake: a large upload streamed into the store
 * with the hash of its bytes; the store down, too large, refused content, empty files and odd
 * names; who sees what (another office's staff and another complainant: 404); downloads,
 * integrity checks and removals in the chain of custody; the orphan sweep; a complainant's
 * limits (no file on a closed case, so many files per case per hour).
 */
import crypto from 'node:crypto'
import fs from 'node:fs'
import os from 'node:os'
import path from 'node:path'
import { GetObjectCommand, HeadObjectCommand, ListObjectsV2Command, PutObjectCommand } from '@aws-sdk/client-s3'
import request from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { startS3Fake, type S3Fake } from '../../ops/local/s3-fake'
import { createObjectStore, type ObjectStore } from '../../server/storage/object-store'
import { sweepEvidenceOrphans } from '../../server/modules/evidence/orphan-sweep'
import { cleanFileName, attachmentDisposition } from '../../server/modules/evidence/file-names'
import { custodyListResponseSchema, evidenceListResponseSchema, evidenceUploadResponseSchema, verifyEvidenceResponseSchema, type EvidenceView } from '../../shared/schemas/evidence'
import { validReport } from '../support/cases'
import { createTestContext, uniqueAddress, type TestContext } from '../support/harness'
import { expectAnswerMatchesDocument } from '../support/api-document'
import { makeCase, makeOffice, makeUser, reportNear, signIn, type Agent, type TestCase, type TestUser } from '../support/factories'

const MiB = 1024 * 1024
let fake: S3Fake
let store: ObjectStore
let t: TestContext
let down: TestContext
let worked: TestCase
let supervisor: Agent
let investigator: Agent
let otherOfficeStaff: Agent
let owner: TestUser
let ownerAgent: Agent
let ownerCaseId: string
let stranger: Agent
const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'qb-evidence-s3-'))

beforeAll(async () => {
  process.env.AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED = 'true'
  fake = await startS3Fake({ directory: dir, bucket: 'evidence-test' })
  store = createObjectStore({ ...fake, region: 'us-east-1', forcePathStyle: true, maxUploadBytes: 64 * 1024, evidenceMaxBytes: { staff: 60 * MiB, complainant: 1 * MiB } })
  t = await createTestContext({ objectStore: store })
  // a store nobody listens on: port 9 (discard) on loopback is closed
  down = await createTestContext({
    objectStore: createObjectStore({ endpoint: 'http://127.0.0.1:9', region: 'us-east-1', bucket: 'nowhere', accessKeyId: 'x', secretAccessKey: 'y', forcePathStyle: true, maxUploadBytes: 1e6 }),
  })
  const office = await makeOffice(t)
  worked = await makeCase(t, { office, state: 'field_work' })
  supervisor = await signIn(t, worked.supervisor!)
  investigator = await signIn(t, worked.investigator!)
  otherOfficeStaff = await signIn(t, await makeUser(t, { role: 'supervisor', office: await makeOffice(t) }))
  owner = await makeUser(t, { role: 'complainant' })
  ownerAgent = await signIn(t, owner)
  const filed = await ownerAgent.post('/api/reports').set('X-Forwarded-For', uniqueAddress()).send(validReport({ email: owner.email, ...reportNear(office) })).expect(201)
  ownerCaseId = (await t.pool.query(`SELECT id FROM cases WHERE reference = $1`, [filed.body.reference])).rows[0].id
  stranger = await signIn(t, await makeUser(t, { role: 'complainant' }))
}, 120_000)
afterAll(async () => {
  await t?.close()
  await down?.close()
  await fake?.close()
  fs.rmSync(dir, { recursive: true, force: true })
})

const sha256 = (b: Buffer) => crypto.createHash('sha256').update(b).digest('hex')

/** A 1×1 PNG (signature, IHDR, IDAT, IEND with their CRCs). */
function tinyPng(): Buffer {
  const crcTable = Array.from({ length: 256 }, (_, n) => {
    let c = n
    for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1
    return c >>> 0
  })
  const crc = (b: Buffer) => {
    let c = 0xffffffff
    for (const x of b) c = crcTable[(c ^ x) & 0xff]! ^ (c >>> 8)
    return (c ^ 0xffffffff) >>> 0
  }
  const chunk = (type: string, data: Buffer) => {
    const len = Buffer.alloc(4)
    len.writeUInt32BE(data.length)
    const body = Buffer.concat([Buffer.from(type, 'ascii'), data])
    const c = Buffer.alloc(4)
    c.writeUInt32BE(crc(body))
    return Buffer.concat([len, body, c])
  }
  const ihdr = Buffer.from([0, 0, 0, 1, 0, 0, 0, 1, 8, 2, 0, 0, 0])
  const idat = Buffer.from([0x78, 0x9c, 0x63, 0xf8, 0xcf, 0xc0, 0x00, 0x00, 0x03, 0x01, 0x01, 0x00])
  return Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]), chunk('IHDR', ihdr), chunk('IDAT', idat), chunk('IEND', Buffer.alloc(0))])
}

/** An ELF executable's opening bytes (what a Linux program starts with), padded. */
const elf = () => Buffer.concat([Buffer.from([0x7f, 0x45, 0x4c, 0x46, 0x02, 0x01, 0x01, 0x00]), Buffer.alloc(8), Buffer.from([0x02, 0x00, 0x3e, 0x00]), Buffer.alloc(5000, 1)])

const CSV = Buffer.from('freq_mhz,level_dbm\n433.92,-61.5\n433.93,-62.0\n')

function uploadTo(agent: request.Agent | ReturnType<typeof request>, url: string, kind: string | undefined, bytes: Buffer, filename: string, contentType = 'application/octet-stream') {
  const req = (agent as request.Agent).post(url).set('X-Forwarded-For', uniqueAddress())
  if (kind !== undefined) req.field('kind', kind)
  return req.attach('file', bytes, { filename, contentType })
}
const staffUpload = (agent: Agent, kind: string | undefined, bytes: Buffer, filename: string, contentType?: string) => uploadTo(agent, `/api/cases/${worked.id}/evidence`, kind, bytes, filename, contentType)

async function counts(ctx: TestContext = t): Promise<{ evidence: number; files: number }> {
  const { rows } = await ctx.pool.query(`SELECT (SELECT count(*)::int FROM evidence_files) AS evidence, (SELECT count(*)::int FROM stored_files WHERE purpose = 'evidence') AS files`)
  return rows[0]
}
async function evidenceKeys(): Promise<string[]> {
  const r = await store.client.send(new ListObjectsV2Command({ Bucket: store.bucket, Prefix: 'evidence/' }))
  return (r.Contents ?? []).map((o) => o.Key!)
}
async function objectKeyOf(evidenceId: string): Promise<string> {
  const { rows } = await t.pool.query(`SELECT s.object_key FROM evidence_files e JOIN stored_files s ON s.id = e.stored_file_id WHERE e.id = $1`, [evidenceId])
  return rows[0].object_key
}
async function storedBytes(key: string): Promise<Buffer> {
  const r = await store.client.send(new GetObjectCommand({ Bucket: store.bucket, Key: key }))
  return Buffer.from(await r.Body!.transformToByteArray())
}

describe('uploading evidence', () => {
  it('streams a 50 MB recording into the store; the stored object hashes to the SHA-256 of the bytes sent', async () => {
    const bytes = crypto.randomBytes(50 * MiB)
    const expected = sha256(bytes)
    const res = await staffUpload(investigator, 'iq_recording', bytes, 'capture-433.sigmf-data').expect(201)
    const { evidence } = evidenceUploadResponseSchema.parse(res.body)
    expect(evidence.sha256).toBe(expected)
    expectAnswerMatchesDocument('POST', '/api/cases/:id/evidence', res)
    expect(evidence.sizeBytes).toBe(50 * MiB)
    // raw samples carry no signature: kept as octet-stream, whatever was declared
    expect(evidence.contentType).toBe('application/octet-stream')
    expect(evidence.uploadedBy).toMatchObject({ id: worked.investigator!.id, role: 'staff', name: worked.investigator!.name })
    // half of a two-file SigMF recording: it waits for its metadata before it is queued (no worker runs in this file)
    expect(evidence.processing).toEqual({ state: 'none', progress: 0, message: expect.stringMatching(/^Waiting for its metadata "capture-433\.sigmf-meta"/) })
    const key = await objectKeyOf(evidence.id)
    expect(key.startsWith('evidence/')).toBe(true)
    expect(sha256(await storedBytes(key))).toBe(expected)
    const { rows } = await t.pool.query(`SELECT kind, body, visibility, data FROM case_events WHERE case_id = $1 AND kind = 'evidence_added'`, [worked.id])
    expect(rows).toHaveLength(1)
    expect(rows[0]).toMatchObject({ visibility: 'internal', data: { evidenceId: evidence.id, sha256: expected } })
  }, 120_000)

  it('decides the type from the content: a PNG is an image, a CSV is CSV, whatever the browser declared', async () => {
    const png = await staffUpload(investigator, 'photo', tinyPng(), 'mast.png', 'application/x-whatever').expect(201)
    expect(png.body.evidence.contentType).toBe('image/png')
    // a photo is not processed
    expect(png.body.evidence.processing).toEqual({ state: 'none', progress: 0 })
    const csv = await staffUpload(investigator, 'spectrum_capture', CSV, 'sweep.txt', 'image/png').expect(201)
    expect(csv.body.evidence.contentType).toBe('text/csv')
    const meta = await staffUpload(investigator, 'spectrum_capture', Buffer.from('{"global":{"core:datatype":"cf32_le","core:sample_rate":1000000},"captures":[],"annotations":[]}'), 'x.sigmf-meta').expect(201)
    expect(meta.body.evidence.contentType).toBe('application/json')
    const { rows } = await t.pool.query(`SELECT content_type_source FROM stored_files s JOIN evidence_files e ON e.stored_file_id = s.id WHERE e.id = $1`, [png.body.evidence.id])
    expect(rows[0].content_type_source).toBe('sniffed')
  })

  it('refuses random bytes declared as a PNG photo and an executable (415), leaving no row and no object', async () => {
    const before = await counts()
    const keysBefore = await evidenceKeys()
    const random = await staffUpload(investigator, 'photo', crypto.randomBytes(20_000), 'holiday.png', 'image/png').expect(415)
    expect(random.body.error.code).toBe('unsupported_file_type')
    expect(random.body.error.message).toMatch(/not a recognised format/)
    const exe = await staffUpload(investigator, 'iq_recording', elf(), 'recording.sigmf-data').expect(415)
    expect(exe.body.error.message).toMatch(/application\/x-elf/)
    expect(await counts()).toEqual(before)
    expect((await evidenceKeys()).sort()).toEqual(keysBefore.sort())
  })

  it('refuses an empty file (400), a missing or unknown kind (400) and a form that is not multipart (400)', async () => {
    const before = await counts()
    const empty = await staffUpload(investigator, 'document', Buffer.alloc(0), 'empty.pdf').expect(400)
    expect(empty.body.error.code).toBe('file_empty')
    const noKind = await staffUpload(investigator, undefined, CSV, 'a.csv').expect(400)
    expect(noKind.body.error.details).toEqual([expect.objectContaining({ path: 'kind' })])
    const badKind = await staffUpload(investigator, 'selfie', CSV, 'a.csv').expect(400)
    expect(badKind.body.error.code).toBe('validation_failed')
    const json = await investigator.post(`/api/cases/${worked.id}/evidence`).send({ kind: 'photo' }).expect(400)
    expect(json.body.error.code).toBe('not_multipart')
    expect(await counts()).toEqual(before)
  })

  it('cleans names with separators, control characters or over 255 characters, and keeps the name as sent in the row', async () => {
    const sent = `..\\secret:*?${'x'.repeat(300)}.csv`
    const res = await staffUpload(investigator, 'document', CSV, sent).expect(201)
    const name: string = res.body.evidence.originalName
    // eslint-disable-next-line no-control-regex
    expect(name).not.toMatch(/[\\/:*?\u0000-\u001f]/)
    expect(Array.from(name).length).toBeLessThanOrEqual(255)
    expect(name.endsWith('.csv')).toBe(true)
    const { rows } = await t.pool.query(`SELECT submitted_name_json FROM evidence_files WHERE id = $1`, [res.body.evidence.id])
    // the form's parser already drops a directory part; the rest is kept as sent
    expect(JSON.parse(rows[0].submitted_name_json)).toBe(sent.slice(sent.lastIndexOf('\\') + 1))
    expect(cleanFileName('../../etc/passwd')).toBe('_.._etc_passwd')
    expect(cleanFileName('scan\u0007\u001b[31m.csv')).toBe('scan__[31m.csv')
    // a raw control character in the form's part header is a malformed form: 400, never 500
    expect((await staffUpload(investigator, 'document', CSV, 'bell\u0007.csv').expect(400)).body.error.code).toBe('bad_upload')
    expect(cleanFileName('\u0000\u0001')).toBe('evidence')
    expect(attachmentDisposition('Messung Ü "1".csv')).toBe(`attachment; filename="Messung _ _1_.csv"; filename*=UTF-8''Messung%20%C3%9C%20%221%22.csv`)
  })

  it('answers 503 storage_unavailable when the store is down, and writes no row', async () => {
    const before = await counts(down)
    const agent = await signIn(down, worked.investigator!)
    const res = await uploadTo(agent, `/api/cases/${worked.id}/evidence`, 'document', CSV, 'a.csv').expect(503)
    expect(res.body.error.code).toBe('storage_unavailable')
    expect(await counts(down)).toEqual(before)
  })

  it('holds a complainant to their limit (413) and staff to theirs', async () => {
    const before = await counts()
    const big = Buffer.from('a,b\n'.repeat((1.5 * MiB) / 4))
    const res = await uploadTo(request.agent(t.app), `/api/track/${worked.trackingToken}/evidence`, 'document', big, 'log.csv').expect(413)
    expect(res.body.error.code).toBe('file_too_large')
    expect(res.body.error.message).toMatch(/1 MB/)
    expect(await counts()).toEqual(before)
    // the same file is within the staff limit
    await staffUpload(investigator, 'document', big, 'log.csv').expect(201)
  })
})

describe('who sees which files', () => {
  let staffFile: EvidenceView
  let linkFile: EvidenceView
  let ownerFile: EvidenceView

  beforeAll(async () => {
    staffFile = (await staffUpload(supervisor, 'photo', tinyPng(), 'antenna.png').expect(201)).body.evidence
    linkFile = (await uploadTo(request.agent(t.app), `/api/track/${worked.trackingToken}/evidence`, 'photo', tinyPng(), 'my-tv.png').expect(201)).body.evidence
    ownerFile = (await uploadTo(ownerAgent, `/api/my/reports/${ownerCaseId}/evidence`, 'spectrum_capture', CSV, 'scan.csv').expect(201)).body.evidence
  })

  it('staff of the office see every file of the case; the complainant sees only their own uploads', async () => {
    const staff = evidenceListResponseSchema.parse((await investigator.get(`/api/cases/${worked.id}/evidence`).expect(200)).body)
    expect(staff.evidence.map((e) => e.id)).toEqual(expect.arrayContaining([staffFile.id, linkFile.id]))
    expect(staff.evidence.find((e) => e.id === linkFile.id)!.uploadedBy).toEqual({ id: null, name: 'Complainant', role: 'complainant' })
    const viaLink = evidenceListResponseSchema.parse((await request(t.app).get(`/api/track/${worked.trackingToken}/evidence`).expect(200)).body)
    expect(viaLink.evidence.map((e) => e.id)).toEqual([linkFile.id])
    expect(viaLink.evidence[0]!.abilities).toEqual({ download: false, verify: false, remove: false, share: false })
    const mine = evidenceListResponseSchema.parse((await ownerAgent.get(`/api/my/reports/${ownerCaseId}/evidence`).expect(200)).body)
    expect(mine.evidence.map((e) => e.id)).toEqual([ownerFile.id])
    expect(mine.evidence[0]!.uploadedBy).toMatchObject({ id: owner.id, role: 'complainant' })
    // the complainant's upload is on the timeline they see
    const { rows } = await t.pool.query(`SELECT visibility FROM case_events WHERE case_id = $1 AND kind = 'evidence_added'`, [ownerCaseId])
    expect(rows).toEqual([{ visibility: 'complainant' }])
  })

  it('another office and another complainant get 404', async () => {
    expect((await otherOfficeStaff.get(`/api/cases/${worked.id}/evidence`).expect(404)).body.error.code).toBe('case_not_found')
    await otherOfficeStaff.get(`/api/evidence/${staffFile.id}/download`).expect(404)
    await otherOfficeStaff.post(`/api/evidence/${staffFile.id}/verify`).expect(404)
    await otherOfficeStaff.get(`/api/evidence/${staffFile.id}/custody`).expect(404)
    await otherOfficeStaff.post(`/api/evidence/${staffFile.id}/remove`).send({ reason: 'Not ours' }).expect(404)
    await uploadTo(otherOfficeStaff, `/api/cases/${worked.id}/evidence`, 'photo', tinyPng(), 'x.png').expect(404)
    await stranger.get(`/api/my/reports/${ownerCaseId}/evidence`).expect(404)
    await uploadTo(stranger, `/api/my/reports/${ownerCaseId}/evidence`, 'document', CSV, 'x.csv').expect(404)
    await request(t.app).get(`/api/evidence/not-a-uuid/download`).expect(401)
    await investigator.get(`/api/evidence/not-a-uuid/download`).expect(404)
  })

  it('a download streams the file as an attachment and writes who, when and from where in the custody log', async () => {
    const res = await investigator.get(`/api/evidence/${staffFile.id}/download`).set('X-Forwarded-For', '198.51.100.7').buffer(true).parse((r, cb) => {
      const parts: Buffer[] = []
      r.on('data', (c: Buffer) => parts.push(c))
      r.on('end', () => cb(null, Buffer.concat(parts)))
    })
    expect(res.status).toBe(200)
    expect(Buffer.compare(res.body as Buffer, tinyPng())).toBe(0)
    expect(res.headers['content-disposition']).toBe('attachment; filename="antenna.png"; filename*=UTF-8\'\'antenna.png')
    expect(res.headers['content-type']).toBe('image/png')
    expect(res.headers['x-evidence-sha256']).toBe(sha256(tinyPng()))
    const custody = custodyListResponseSchema.parse((await supervisor.get(`/api/evidence/${staffFile.id}/custody`).expect(200)).body).custody
    expect(custody.map((c) => c.action)).toEqual(['uploaded', 'downloaded'])
    expect(custody[1]).toMatchObject({ actor: worked.investigator!.name, from: '198.51.100.7' })
  })

  it('an integrity check passes, then detects an object changed in the store behind the app', async () => {
    const ok = verifyEvidenceResponseSchema.parse((await investigator.post(`/api/evidence/${linkFile.id}/verify`).expect(200)).body)
    expect(ok).toMatchObject({ outcome: 'verified', expectedSha256: sha256(tinyPng()), actualSha256: sha256(tinyPng()) })
    expect(ok.evidence.verification).toMatchObject({ outcome: 'verified', by: worked.investigator!.name })
    const tampered = Buffer.concat([tinyPng(), Buffer.from('appended')])
    await store.client.send(new PutObjectCommand({ Bucket: store.bucket, Key: await objectKeyOf(linkFile.id), Body: tampered }))
    const bad = verifyEvidenceResponseSchema.parse((await investigator.post(`/api/evidence/${linkFile.id}/verify`).expect(200)).body)
    expect(bad).toMatchObject({ outcome: 'failed', expectedSha256: sha256(tinyPng()), actualSha256: sha256(tampered) })
    expect(bad.evidence.verification?.outcome).toBe('failed')
    const custody = (await investigator.get(`/api/evidence/${linkFile.id}/custody`).expect(200)).body.custody as { action: string; detail?: string }[]
    expect(custody.map((c) => c.action)).toEqual(['uploaded', 'verified', 'verification_failed'])
    expect(custody[2]!.detail).toContain(sha256(tampered))
    const { rows } = await t.pool.query(`SELECT count(*)::int AS n FROM case_events WHERE case_id = $1 AND kind = 'evidence_integrity_failed'`, [worked.id])
    expect(rows[0].n).toBe(1)
  })

  it('only the office supervisor removes a file, with a reason; staff still see it marked and can download it, the complainant no longer sees it', async () => {
    expect((await investigator.post(`/api/evidence/${linkFile.id}/remove`).send({ reason: 'Wrong case' }).expect(403)).body.error.code).toBe('forbidden')
    expect((await supervisor.post(`/api/evidence/${linkFile.id}/remove`).send({}).expect(400)).body.error.details[0].path).toBe('reason')
    await ownerAgent.post(`/api/evidence/${ownerFile.id}/remove`).send({ reason: 'Mine' }).expect(403)
    const res = await supervisor.post(`/api/evidence/${linkFile.id}/remove`).send({ reason: 'Filed on the wrong case by the complainant.' }).expect(200)
    expectAnswerMatchesDocument('POST', '/api/evidence/:id/remove', res)
    expect(res.body.evidence.removed).toMatchObject({ by: worked.supervisor!.name, reason: 'Filed on the wrong case by the complainant.' })
    expect(res.body.evidence.abilities.remove).toBe(false)
    expect((await supervisor.post(`/api/evidence/${linkFile.id}/remove`).send({ reason: 'Again' }).expect(409)).body.error.code).toBe('evidence_already_removed')
    const staff = evidenceListResponseSchema.parse((await investigator.get(`/api/cases/${worked.id}/evidence`).expect(200)).body)
    expect(staff.evidence.find((e) => e.id === linkFile.id)!.removed).not.toBeNull()
    expect((await request(t.app).get(`/api/track/${worked.trackingToken}/evidence`).expect(200)).body.evidence).toEqual([])
    await investigator.get(`/api/evidence/${linkFile.id}/download`).expect(200)
    // the object is kept
    await store.client.send(new HeadObjectCommand({ Bucket: store.bucket, Key: await objectKeyOf(linkFile.id) }))
    const custody = (await supervisor.get(`/api/evidence/${linkFile.id}/custody`).expect(200)).body.custody as { action: string; detail?: string }[]
    expect(custody.map((c) => c.action).slice(-2)).toEqual(['removed', 'downloaded'])
    const { rows } = await t.pool.query(`SELECT visibility FROM case_events WHERE case_id = $1 AND kind = 'evidence_removed'`, [worked.id])
    expect(rows).toEqual([{ visibility: 'internal' }])
  })

  it('the custody log is append-only and evidence rows cannot be deleted by the application', async () => {
    await expect(t.pool.query(`UPDATE evidence_custody SET detail = 'rewritten' WHERE evidence_id = $1`, [staffFile.id])).rejects.toThrow(/permission denied|append-only/)
    await expect(t.pool.query(`DELETE FROM evidence_custody WHERE evidence_id = $1`, [staffFile.id])).rejects.toThrow(/permission denied|append-only/)
    await expect(t.pool.query(`DELETE FROM evidence_files WHERE id = $1`, [staffFile.id])).rejects.toThrow(/permission denied/)
    const { rows } = await t.pool.query(`SELECT count(*)::int AS n FROM evidence_custody WHERE evidence_id = $1`, [staffFile.id])
    expect(rows[0].n).toBeGreaterThan(0)
  })
})

describe('the orphan sweep', () => {
  it('removes an evidence object with no row once it is older than an hour, and nothing else', async () => {
    const planted = `evidence/${crypto.randomUUID()}`
    await store.client.send(new PutObjectCommand({ Bucket: store.bucket, Key: planted, Body: Buffer.from('left behind') }))
    // other test files store evidence rows in the same database (with objects in stores of their own)
    const recorded = new Set((await t.pool.query(`SELECT object_key FROM stored_files WHERE purpose = 'evidence'`)).rows.map((r) => r.object_key as string))
    const before = await evidenceKeys()
    expect(before.filter((k) => recorded.has(k)).length).toBeGreaterThan(0)
    // young: left alone
    expect(await sweepEvidenceOrphans({ db: t.services.db, store })).toEqual([])
    expect(await evidenceKeys()).toContain(planted)
    // an hour and more later: removed, and only it
    const removed = await sweepEvidenceOrphans({ db: t.services.db, store, now: new Date(Date.now() + 61 * 60 * 1000) })
    expect(removed).toEqual([planted])
    const left = await evidenceKeys()
    expect(left).not.toContain(planted)
    // everything else this store held is still there, and each of it has its row
    expect(left.sort()).toEqual(before.filter((k) => k !== planted).sort())
    expect(left.every((k) => recorded.has(k))).toBe(true)
  })
})

describe('complainant upload limits', () => {
  let limited: TestContext
  let office: Awaited<ReturnType<typeof makeOffice>>
  beforeAll(async () => {
    // the same store, configured for 3 complainant files per case per hour
    limited = await createTestContext({
      objectStore: createObjectStore({ ...fake, region: 'us-east-1', forcePathStyle: true, maxUploadBytes: 64 * 1024, evidenceMaxBytes: { staff: 60 * MiB, complainant: 1 * MiB }, evidenceComplainantFilesPerHour: 3 }),
    })
    office = await makeOffice(limited)
  }, 60_000)
  afterAll(async () => {
    await limited?.close()
  })

  it('refuses a file on a closed case by the tracking link (409 case_closed), storing nothing', async () => {
    const closed = await makeCase(t, { office: worked.office, state: 'closed' })
    const before = await counts()
    const keys = await evidenceKeys()
    const res = await uploadTo(request.agent(t.app), `/api/track/${closed.trackingToken}/evidence`, 'document', CSV, 'late.csv', 'text/csv')
    expect(res.status).toBe(409)
    expect(res.body.error.code).toBe('case_closed')
    expect(res.body.error.message).toMatch(/This report is closed, so no more files can be added to it/)
    expect(await counts()).toEqual(before)
    expect(await evidenceKeys()).toEqual(keys)
    // staff of the office still add files to the closed case's record
    await uploadTo(await signIn(t, closed.supervisor!), `/api/cases/${closed.id}/evidence`, 'document', CSV, 'after-close.csv', 'text/csv').expect(201)
  })

  it('refuses a file on a report the signed-in complainant withdrew (closed): 409', async () => {
    const filed = await ownerAgent.post('/api/reports').set('X-Forwarded-For', uniqueAddress()).send(validReport({ email: owner.email, ...reportNear(worked.office) })).expect(201)
    const id = (await t.pool.query(`SELECT id FROM cases WHERE reference = $1`, [filed.body.reference])).rows[0].id
    await uploadTo(ownerAgent, `/api/my/reports/${id}/evidence`, 'document', CSV, 'before.csv', 'text/csv').expect(201)
    await ownerAgent.post(`/api/my/reports/${id}/withdraw`).send({ reason: 'It stopped.' }).expect(200)
    const res = await uploadTo(ownerAgent, `/api/my/reports/${id}/evidence`, 'document', CSV, 'after.csv', 'text/csv')
    expect(res.status).toBe(409)
    expect(res.body.error.code).toBe('case_closed')
  })

  it('holds a complainant to the configured files per case per hour (429 too_many_files); staff and other cases are not held', async () => {
    const c = await makeCase(limited, { office })
    const track = (name: string) => uploadTo(request.agent(limited.app), `/api/track/${c.trackingToken}/evidence`, 'document', CSV, name, 'text/csv')
    for (const n of [1, 2, 3]) await track(`part-${n}.csv`).expect(201)
    const before = await counts(limited)
    const res = await track('part-4.csv')
    expect(res.status).toBe(429)
    expect(res.body.error.code).toBe('too_many_files')
    expect(res.body.error.message).toMatch(/3 files have been added to this report in the last hour, the most we take/)
    expect(await counts(limited)).toEqual(before)
    // staff of the office are not held by it, and another case's complainant has their own count
    await uploadTo(await signIn(limited, await makeUser(limited, { role: 'investigator', office })), `/api/cases/${c.id}/evidence`, 'document', CSV, 'staff.csv', 'text/csv').expect(201)
    const other = await makeCase(limited, { office })
    await uploadTo(request.agent(limited.app), `/api/track/${other.trackingToken}/evidence`, 'document', CSV, 'other.csv', 'text/csv').expect(201)
  })

  it('keeps to the limit when uploads arrive at once (counted under the case lock)', async () => {
    const c = await makeCase(limited, { office })
    const track = (name: string) => uploadTo(request.agent(limited.app), `/api/track/${c.trackingToken}/evidence`, 'document', CSV, name, 'text/csv')
    await track('one.csv').expect(201)
    await track('two.csv').expect(201)
    const statuses = (await Promise.all([track('a.csv'), track('b.csv'), track('c.csv')])).map((r) => r.status).sort()
    expect(statuses).toEqual([201, 429, 429])
    const { rows } = await limited.pool.query(`SELECT count(*)::int AS n FROM evidence_files WHERE case_id = $1`, [c.id])
    expect(rows[0].n).toBe(3)
  })
})
