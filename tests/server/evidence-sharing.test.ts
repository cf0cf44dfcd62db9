/**
 * Staff files shared with the complainant, against the local S3 fake: staff of the office share
 * a file and stop sharing it (custody entries, a timeline entry the complainant sees); the
 * complainant lists it through the tracking link and their account and downloads it (a custody
 * entry each time); another office 404, a complainant 403, a removed or disposed file 409. The
 * policy's pure rules as a table of who × which file.
 */
import fs from 'node:fs'
import os from 'node:os'
import path from 'node:path'
import request from 'supertest'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import { z } from 'zod'
import { startS3Fake, type S3Fake } from '../../ops/local/s3-fake'
import { createObjectStore } from '../../server/storage/object-store'
import type { CaseAccess, CaseActor } from '../../server/policy/case-policy'
import { evidenceAbilities, mayComplainantDownloadEvidence, mayDownloadEvidence, maySeeEvidence, mayShareEvidence, type EvidenceAccess } from '../../server/policy/evidence-policy'
import { complainantReportResponseSchema } from '../../shared/schemas/views'
import { custodyListResponseSchema, evidenceAbilitiesSchema, evidenceViewSchema } from '../../shared/schemas/evidence'
import { validReport } from '../support/cases'
import { createTestContext, uniqueAddress, type TestContext } from '../support/harness'
import { makeCase, makeOffice, makeUser, reportNear, signIn, type Agent, type TestCase } from '../support/factories'

/** The evidence view as this feature answers it: the sharing fields present, nothing unknown. */
const strictEvidence = z.strictObject({
  ...evidenceViewSchema.shape,
  sharedWithComplainant: z.boolean(),
  abilities: z.strictObject({ ...evidenceAbilitiesSchema.shape, share: z.boolean() }),
})
const strictList = z.strictObject({ evidence: z.array(strictEvidence) })
const strictOne = z.strictObject({ evidence: strictEvidence })

let fake: S3Fake
let t: TestContext
let worked: TestCase
let supervisor: Agent
let investigator: Agent
let otherOfficeStaff: Agent
let ownerAgent: Agent
let ownerCaseId: string
let stranger: Agent
const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'qb-evidence-sharing-'))
const CSV = Buffer.from('freq_mhz,level_dbm\n433.92,-61.5\n433.93,-62.0\n')

beforeAll(async () => {
  process.env.AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED = 'true'
  fake = await startS3Fake({ directory: dir, bucket: 'evidence-sharing-test' })
  t = await createTestContext({ objectStore: createObjectStore({ ...fake, region: 'us-east-1', forcePathStyle: true, maxUploadBytes: 64 * 1024 }) })
  const office = await makeOffice(t)
  worked = await makeCase(t, { office, state: 'field_work' })
  supervisor = await signIn(t, worked.supervisor!)
  investigator = await signIn(t, worked.investigator!)
  otherOfficeStaff = await signIn(t, await makeUser(t, { role: 'supervisor', office: await makeOffice(t) }))
  const owner = await makeUser(t, { role: 'complainant' })
  ownerAgent = await signIn(t, owner)
  const filed = await ownerAgent.post('/api/reports').set('X-Forwarded-For', uniqueAddress()).send(validReport({ email: owner.email, ...reportNear(office) })).expect(201)
  ownerCaseId = (await t.pool.query(`SELECT id FROM cases WHERE reference = $1`, [filed.body.reference])).rows[0].id
  stranger = await signIn(t, await makeUser(t, { role: 'complainant' }))
}, 120_000)
afterAll(async () => {
  await t?.close()
  await fake?.close()
  fs.rmSync(dir, { recursive: true, force: true })
})

function upload(agent: request.Agent, url: string, name: string, bytes: Buffer<ArrayBuffer> = CSV) {
  return agent.post(url).set('X-Forwarded-For', uniqueAddress()).field('kind', 'document').attach('file', bytes, { filename: name, contentType: 'text/csv' })
}
const staffUpload = (caseId: string, name: string, bytes?: Buffer<ArrayBuffer>) => upload(investigator, `/api/cases/${caseId}/evidence`, name, bytes).expect(201)

function download(agent: request.Agent | ReturnType<typeof request>, url: string) {
  return (agent as request.Agent)
    .get(url)
    .set('X-Forwarded-For', '203.0.113.44')
    .buffer(true)
    .parse((r, cb) => {
      const parts: Buffer[] = []
      r.on('data', (c: Buffer) => parts.push(c))
      r.on('end', () => cb(null, Buffer.concat(parts)))
    })
}
const share = (agent: Agent, id: string, shared: boolean, note?: string) => agent.post(`/api/evidence/${id}/share`).send(note === undefined ? { shared } : { shared, note })
const custodyOf = async (id: string) => custodyListResponseSchema.parse((await supervisor.get(`/api/evidence/${id}/custody`).expect(200)).body).custody
const linkList = async () => strictList.parse((await request(t.app).get(`/api/track/${worked.trackingToken}/evidence`).expect(200)).body).evidence

describe('sharing a staff file with the complainant', () => {
  let report: { id: string; sha256: string }
  const reportBytes = Buffer.from('freq_mhz,level_dbm\n101.1,-40.0\n101.2,-41.5\n')

  beforeAll(async () => {
    report = (await staffUpload(worked.id, 'site-visit.csv', reportBytes)).body.evidence
  })

  it('is not shared at first: the staff view says so and offers to share it; the complainant does not see it', async () => {
    const staff = strictList.parse((await investigator.get(`/api/cases/${worked.id}/evidence`).expect(200)).body).evidence.find((e) => e.id === report.id)!
    expect(staff.sharedWithComplainant).toBe(false)
    expect(staff.abilities.share).toBe(true)
    expect((await linkList()).map((e) => e.id)).not.toContain(report.id)
    expect((await download(request(t.app), `/api/track/${worked.trackingToken}/evidence/${report.id}/download`)).status).toBe(404)
  })

  it('another office gets 404 and a complainant 403; a bad body is a 400 naming the field', async () => {
    expect((await share(otherOfficeStaff, report.id, true).expect(404)).body.error.code).toBe('evidence_not_found')
    expect((await share(ownerAgent, report.id, true).expect(403)).body.error.code).toBe('forbidden')
    const bad = await investigator.post(`/api/evidence/${report.id}/share`).send({ shared: 'yes', extra: 1 }).expect(400)
    expect(bad.body.error.code).toBe('validation_failed')
    expect(bad.body.error.details.map((d: { path: string }) => d.path)).toEqual(expect.arrayContaining(['shared']))
    expect((await custodyOf(report.id)).map((c) => c.action)).toEqual(['uploaded'])
  })

  it('shares it: a custody entry with the note, a timeline entry the complainant reads, and the file in their list marked as from the office', async () => {
    const res = strictOne.parse((await share(investigator, report.id, true, 'The site visit readings.').set('X-Forwarded-For', '198.51.100.9').expect(200)).body)
    expect(res.evidence.sharedWithComplainant).toBe(true)
    expect(res.evidence.abilities.share).toBe(true)
    const custody = await custodyOf(report.id)
    expect(custody.map((c) => c.action)).toEqual(['uploaded', 'shared_with_complainant'])
    expect(custody[1]).toMatchObject({ actor: worked.investigator!.name, from: '198.51.100.9', detail: 'The site visit readings.' })
    const tracked = complainantReportResponseSchema.parse((await request(t.app).get(`/api/track/${worked.trackingToken}`).expect(200)).body)
    expect(tracked.report.entries).toContainEqual(expect.objectContaining({ from: 'office', kind: 'evidence_shared', text: 'A file was shared with you: site-visit.csv' }))
    const seen = (await linkList()).find((e) => e.id === report.id)!
    expect(seen).toMatchObject({ sharedWithComplainant: true, uploadedBy: { role: 'staff' }, abilities: { download: true, verify: false, remove: false, share: false } })
    // no staff name or id reaches the complainant
    expect(seen.uploadedBy).toEqual({ id: null, name: 'The office', role: 'staff' })
    // sharing again changes nothing and writes nothing
    await share(supervisor, report.id, true).expect(200)
    expect((await custodyOf(report.id)).length).toBe(2)
  })

  it('the tracking link downloads it, streamed, each access in the custody log as the complainant', async () => {
    const res = await download(request(t.app), `/api/track/${worked.trackingToken}/evidence/${report.id}/download`)
    expect(res.status).toBe(200)
    expect(Buffer.compare(res.body as Buffer, reportBytes)).toBe(0)
    expect(res.headers['content-disposition']).toContain('attachment; filename="site-visit.csv"')
    expect(res.headers['x-content-type-options']).toBe('nosniff')
    expect(res.headers['cache-control']).toBe('private, no-store')
    expect(res.headers['x-evidence-sha256']).toBe(report.sha256)
    const last = (await custodyOf(report.id)).at(-1)!
    expect(last).toMatchObject({ action: 'downloaded', actor: 'Complainant', from: '203.0.113.44', detail: 'Downloaded by the complainant (shared by the office).' })
  })

  it('the complainant’s own uploads stay not downloadable by them (404), and a file of another case is not found through this link', async () => {
    const own = (await upload(request.agent(t.app), `/api/track/${worked.trackingToken}/evidence`, 'my-scan.csv').expect(201)).body.evidence
    expect(strictOne.parse({ evidence: own }).evidence.abilities.download).toBe(false)
    expect((await download(request(t.app), `/api/track/${worked.trackingToken}/evidence/${own.id}/download`)).status).toBe(404)
    const elsewhere = (await staffUpload(ownerCaseId, 'other-case.csv')).body.evidence
    await share(investigator, elsewhere.id, true).expect(200)
    expect((await download(request(t.app), `/api/track/${worked.trackingToken}/evidence/${elsewhere.id}/download`)).status).toBe(404)
    expect((await download(request(t.app), `/api/track/${worked.trackingToken}/evidence/not-a-uuid/download`)).status).toBe(404)
  })

  it('stops sharing: a custody entry, an internal timeline entry, gone from the list, and the download is 404', async () => {
    const res = strictOne.parse((await share(supervisor, report.id, false).expect(200)).body)
    expect(res.evidence.sharedWithComplainant).toBe(false)
    expect((await custodyOf(report.id)).map((c) => c.action).slice(-1)).toEqual(['sharing_stopped'])
    const { rows } = await t.pool.query(`SELECT kind, visibility FROM case_events WHERE case_id = $1 AND kind LIKE 'evidence_%shared' ORDER BY id`, [worked.id])
    expect(rows).toEqual([
      { kind: 'evidence_shared', visibility: 'complainant' },
      { kind: 'evidence_unshared', visibility: 'internal' },
    ])
    expect((await linkList()).map((e) => e.id)).not.toContain(report.id)
    expect((await download(request(t.app), `/api/track/${worked.trackingToken}/evidence/${report.id}/download`)).status).toBe(404)
  })

  it('refuses to share a complainant’s upload (409)', async () => {
    const own = (await upload(request.agent(t.app), `/api/track/${worked.trackingToken}/evidence`, 'theirs.csv').expect(201)).body.evidence
    expect((await share(investigator, own.id, false).expect(409)).body.error.code).toBe('evidence_from_complainant')
  })
})

describe('a signed-in complainant and a shared file', () => {
  let shared: { id: string }

  beforeAll(async () => {
    shared = (await staffUpload(ownerCaseId, 'letter.csv')).body.evidence
    await share(investigator, shared.id, true).expect(200)
  })

  it('lists it and downloads it from their report; the custody log names the complainant', async () => {
    const mine = strictList.parse((await ownerAgent.get(`/api/my/reports/${ownerCaseId}/evidence`).expect(200)).body).evidence
    expect(mine.find((e) => e.id === shared.id)).toMatchObject({ sharedWithComplainant: true, uploadedBy: { role: 'staff' }, abilities: { download: true } })
    const res = await download(ownerAgent, `/api/my/reports/${ownerCaseId}/evidence/${shared.id}/download`)
    expect(res.status).toBe(200)
    expect(Buffer.compare(res.body as Buffer, CSV)).toBe(0)
    expect((await custodyOf(shared.id)).at(-1)).toMatchObject({ action: 'downloaded', actor: 'Complainant' })
  })

  it('another complainant gets 404; staff are sent to their own route (403)', async () => {
    expect((await download(stranger, `/api/my/reports/${ownerCaseId}/evidence/${shared.id}/download`)).status).toBe(404)
    expect((await download(investigator, `/api/my/reports/${ownerCaseId}/evidence/${shared.id}/download`)).status).toBe(403)
  })

  it('a removed file leaves the complainant’s list, cannot be downloaded by them (404) and cannot be shared again (409)', async () => {
    await supervisor.post(`/api/evidence/${shared.id}/remove`).send({ reason: 'Sent to the wrong report.' }).expect(200)
    const mine = strictList.parse((await ownerAgent.get(`/api/my/reports/${ownerCaseId}/evidence`).expect(200)).body).evidence
    expect(mine.map((e) => e.id)).not.toContain(shared.id)
    expect((await download(ownerAgent, `/api/my/reports/${ownerCaseId}/evidence/${shared.id}/download`)).status).toBe(404)
    const refused = await share(supervisor, shared.id, true).expect(409)
    expect(refused.body.error).toMatchObject({ code: 'evidence_removed', message: expect.stringMatching(/removed from the case/) })
    await share(supervisor, shared.id, false).expect(409)
  })

  it('a file whose object the retention run deleted cannot be shared (409)', async () => {
    const old = (await staffUpload(ownerCaseId, 'old.csv')).body.evidence
    // the application role may change the row's retention and sharing columns (it has no DELETE)
    await t.pool.query(`UPDATE evidence_files SET disposed_at = now() WHERE id = $1`, [old.id])
    const refused = await share(investigator, old.id, true).expect(409)
    expect(refused.body.error.code).toBe('evidence_disposed')
  })
})

describe.skipIf(inject('databaseUrl') === inject('migrationDatabaseUrl'))('the application role on evidence rows', () => {
  it('may update the sharing column but may not delete a row', async () => {
    const { rows } = await t.pool.query(
      `SELECT has_column_privilege(current_user, 'evidence_files', 'shared_with_complainant', 'UPDATE') AS upd, has_table_privilege(current_user, 'evidence_files', 'DELETE') AS del`,
    )
    expect(rows[0]).toEqual({ upd: true, del: false })
  })
})

describe('the evidence policy on sharing (pure)', () => {
  const c: CaseAccess = { id: 'case-1', officeId: 'office-1', complainantUserId: 'user-c', status: 'field_work', investigatorId: 'user-i' }
  const staffFile = (over: Partial<EvidenceAccess> = {}): EvidenceAccess => ({ caseId: 'case-1', uploaderRole: 'staff', removedAt: null, sharedWithComplainant: false, disposedAt: null, ...over })
  const ownUpload: EvidenceAccess = { caseId: 'case-1', uploaderRole: 'complainant', removedAt: null, sharedWithComplainant: true, disposedAt: null }
  const investigatorHere = { role: 'investigator', id: 'user-i', officeId: 'office-1' } as CaseActor
  const supervisorElsewhere = { role: 'supervisor', id: 'user-s', officeId: 'office-2' } as CaseActor
  const link = { role: 'tracking_link', caseId: 'case-1' } as CaseActor
  const account = { role: 'complainant', id: 'user-c', officeId: null } as CaseActor
  const removed = new Date('2026-12-01T00:00:00Z')

  it.each([
    ['staff of the office, a staff file', investigatorHere, staffFile(), { see: true, share: true, staffDownload: true, complainantDownload: false }],
    ['staff of the office, a removed staff file', investigatorHere, staffFile({ removedAt: removed }), { see: true, share: false, staffDownload: true, complainantDownload: false }],
    ['staff of the office, a disposed staff file', investigatorHere, staffFile({ disposedAt: removed }), { see: true, share: false, staffDownload: true, complainantDownload: false }],
    ['staff of the office, a complainant upload', investigatorHere, ownUpload, { see: true, share: false, staffDownload: true, complainantDownload: false }],
    ['staff of another office', supervisorElsewhere, staffFile({ sharedWithComplainant: true }), { see: false, share: false, staffDownload: false, complainantDownload: false }],
    ['the tracking link, a file not shared', link, staffFile(), { see: false, share: false, staffDownload: false, complainantDownload: false }],
    ['the tracking link, a shared file', link, staffFile({ sharedWithComplainant: true }), { see: true, share: false, staffDownload: false, complainantDownload: true }],
    ['the tracking link, a shared file since removed', link, staffFile({ sharedWithComplainant: true, removedAt: removed }), { see: false, share: false, staffDownload: false, complainantDownload: false }],
    ['the tracking link, their own upload', link, ownUpload, { see: true, share: false, staffDownload: false, complainantDownload: false }],
    ['the signed-in complainant, a shared file', account, staffFile({ sharedWithComplainant: true }), { see: true, share: false, staffDownload: false, complainantDownload: true }],
  ])('%s', (_label, actor, e, want) => {
    expect({
      see: maySeeEvidence(actor, c, e),
      share: mayShareEvidence(actor, c, e),
      staffDownload: mayDownloadEvidence(actor, c, e),
      complainantDownload: mayComplainantDownloadEvidence(actor, c, e),
    }).toEqual(want)
  })

  it('offers the complainant no download of a shared file whose object was disposed', () => {
    expect(evidenceAbilities(link, c, staffFile({ sharedWithComplainant: true, disposedAt: removed })).download).toBe(false)
    expect(evidenceAbilities(link, c, staffFile({ sharedWithComplainant: true })).download).toBe(true)
  })
})
