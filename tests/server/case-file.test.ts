/**
 * The case file (PDF): a worked case — a measurement, a stored calculation, an evidence file and
 * a finding approved by the supervisor — downloaded as its signed case file. The PDF's text
 * (extracted with pdf-parse, independent of pdfkit) holds the case and file references, the
 * timeline's entries, the approval (name and time), the evidence file's SHA-256 as the
 * evidence bundle's manifest gives it, the measurement's and calculation's methods and library
 * version, the cautions and "page n of N". Its signature is checked two ways outside the code
 * that made it: by hand with node-forge and node:crypto (the CMS in /Contents, its message
 * digest over the /ByteRange bytes, the RSA signature over the signed attributes, the signer's
 * certificate the demo one) and by OpenSSL's `cms -verify`; one altered byte fails both. The
 * SHA-256 of the downloaded bytes equals the "case file issued" timeline entry, which is
 * append-only. Another office's case is 404, a complainant 403. Configuration: production
 * without a certificate, a missing file, a wrong passphrase, an expired certificate and a key
 * not matching its certificate each stop the start with a message naming the setting.
 */
import crypto from 'node:crypto'
import { execFileSync } from 'node:child_process'
import fs from 'node:fs'
import os from 'node:os'
import path from 'node:path'
import forge from 'node-forge'
import { PDFParse } from 'pdf-parse'
import type { Response } from 'superagent'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import pg from 'pg'
import { startS3Fake, type S3Fake } from '../../ops/local/s3-fake'
import { ConfigError, loadEnv } from '../../server/config/env'
import { credentialsToP12, ensureDemoP12, generateDemoCredentials, processDemoSigner, signerFromP12File } from '../../server/modules/case-file/case-file-signing'
import { issueCaseFile } from '../../server/modules/case-file/case-file.service'
import { mayIssueCaseFile } from '../../server/policy/case-file-policy'
import { createObjectStore, type ObjectStore } from '../../server/storage/object-store'
import { CAUTION_LINES } from '../../shared/domain/cautions'
import { eventTitle } from '../../shared/domain/timeline-titles'
import { bundleManifestSchema } from '../../shared/schemas/evidence-bundle'
import { evidenceUploadResponseSchema } from '../../shared/schemas/evidence'
import { findingsResponseSchema } from '../../shared/schemas/findings'
import { caseFollowUpsResponseSchema, responsiblePartyResponseSchema } from '../../shared/schemas/follow-ups'
import { NOTICE_METHOD_LABELS, FOLLOW_UP_STATE_LABELS } from '../../shared/domain/follow-ups'
import { caseResponseSchema } from '../../shared/schemas/views'
import { createTestContext, type TestContext } from '../support/harness'
import { makeCase, makeOffice, makeUser, signIn, type Agent, type TestCase } from '../support/factories'
import { readZip } from '../support/zip-reader'
import { dayFromToday } from '../support/factories'
import { FREE_SPACE_FIELD_ROWS } from '../fixtures/radio/propagation-free-space'

let fake: S3Fake
let store: ObjectStore
let t: TestContext
let owner: pg.Pool
let worked: TestCase
let investigator: Agent
let supervisor: Agent
let stranger: Agent
const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'qb-case-file-'))
const sha256 = (b: Buffer) => crypto.createHash('sha256').update(b).digest('hex')

const PNG = Buffer.from(
  '89504e470d0a1a0a0000000d4948445200000001000000010806000000' + '1f15c4890000000d49444154789c6360f8cfc0f01f0005000201e2' + '21bc330000000049454e44ae426082',
  'hex',
)
/** The inputs of findings.test.ts (register row 1-5 read backwards; the numbers are checked in calculations.test.ts). */
const ROW_1_5 = FREE_SPACE_FIELD_ROWS.find((r) => r.id === '1-5')!
const eirpInputs = {
  measurement: { kind: 'field-strength', fieldStrengthDbuvPerM: `${ROW_1_5.expected} dBµV/m`, freqHz: '100 MHz' },
  distanceM: '1 km',
  model: { kind: 'free-space', freqHz: '100 MHz' },
  measurementContributions: [{ name: 'antenna calibration', distribution: { kind: 'normal', expandedUncertainty: '1.5 dB', coverageFactor: 2 } }],
}
const CLOSING = 'Warning issued; the club replaced the amplifier within 7 days.'

/** The enforcement record the worked case gets (dates relative to today, as the server refuses notices served in the future and deadlines in the past). */
const PARTY_FIRST = { name: 'Harbour boat club', address: '2 Quayside Road' }
const PARTY = { name: 'Harbour Boat Club (secretary)', address: '2 Quayside Road, Harrowmere', phone: '+00 555 0142' }
const NOTICES = [
  { servedOn: dayFromToday(-3), method: 'registered_post', reference: 'RP-4471-HB', summary: 'Replace the masthead amplifier within 7 days.' },
  { servedOn: dayFromToday(-1), method: 'in_person', servedBy: 'Night-shift investigator', summary: 'Reminder handed to the club secretary at the quay.' },
] as const
const REPLY = { receivedOn: dayFromToday(-1), summary: 'The club has ordered a new amplifier and will fit it on Saturday.' }
const STAFF_FOLLOW_UP = { dueOn: dayFromToday(10), expected: 'Send the invoice of the replacement amplifier' }
const CONFIRM_NOTE = 'Saw the new amplifier fitted; the hiss is gone.'

/** supertest collects a binary answer into a Buffer with this parser. */
const binary = (res: Response, cb: (err: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = []
  res.on('data', (c: Buffer) => chunks.push(c))
  res.on('end', () => cb(null, Buffer.concat(chunks)))
}

const versionOf = async (caseId: string) => (await owner.query<{ version: number }>('SELECT version FROM cases WHERE id = $1', [caseId])).rows[0]!.version

let evidenceSha: string
let calcMethods: { id: string; source: string }[]
let calcLibraryVersion: string

beforeAll(async () => {
  process.env.AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED = 'true'
  fake = await startS3Fake({ directory: dir, bucket: 'case-file-test' })
  store = createObjectStore({ ...fake, region: 'us-east-1', forcePathStyle: true, maxUploadBytes: 1024 * 1024 })
  t = await createTestContext({ objectStore: store })
  owner = new pg.Pool({ connectionString: inject('migrationDatabaseUrl'), max: 2 })
  const office = await makeOffice(t)
  worked = await makeCase(t, { office, state: 'field_work' })
  investigator = await signIn(t, worked.investigator!)
  supervisor = await signIn(t, worked.supervisor!)
  stranger = await signIn(t, await makeUser(t, { role: 'supervisor', office: await makeOffice(t) }))

  // the work: an evidence file, a measurement, a stored calculation, a finding, its approval
  const up = await investigator.post(`/api/cases/${worked.id}/evidence`).field('kind', 'photo').attach('file', PNG, { filename: 'mast.png', contentType: 'image/png' })
  expect(up.status, JSON.stringify(up.body)).toBe(201)
  evidenceUploadResponseSchema.parse(up.body)
  const m = await investigator.post(`/api/cases/${worked.id}/measurements`).send({
    measurement: { takenAt: new Date(Date.now() - 3600_000).toISOString(), latDeg: '48.1', lonDeg: '-31.35', heightM: '1.5 m', freqHz: '433.92 MHz', rbwHz: '120 kHz', detector: 'rms', reading: { unit: 'dBµV', value: '40' }, antenna: { source: 'gain', antennaGainDbi: '2.15 dBi' }, cableLossDb: '3' },
  })
  expect(m.status, JSON.stringify(m.body)).toBe(201)
  const calc = await investigator.post(`/api/cases/${worked.id}/calculations`).send({ kind: 'eirp_single_point', inputs: eirpInputs })
  expect(calc.status, JSON.stringify(calc.body)).toBe(201)
  calcMethods = calc.body.calculation.methods
  calcLibraryVersion = calc.body.calculation.libraryVersion
  const proposed = await investigator.post(`/api/cases/${worked.id}/propose-finding`).send({
    version: await versionOf(worked.id),
    sourceDescription: 'A faulty masthead amplifier on the boathouse roof',
    operator: 'Harbour boat club',
    recommendedAction: 'advise_operator',
    complianceDeadline: new Date(Date.now() + 7 * 86_400_000).toISOString().slice(0, 10),
    calculationIds: [calc.body.calculation.id],
    evidenceIds: [],
    summary: 'Measured at the quay; the amplifier oscillates when the mast heater runs.',
  })
  expect(proposed.status, JSON.stringify(proposed.body)).toBe(200)
  const closed = await supervisor.post(`/api/cases/${worked.id}/close`).send({ version: await versionOf(worked.id), resolution: 'enforcement_action', reason: CLOSING })
  expect(closed.status, JSON.stringify(closed.body)).toBe(200)

  // the enforcement record, through the routes the case page uses: the party (changed once),
  // two notices (one with the photo as proof of posting), a reply, a follow-up added by staff,
  // and the finding's follow-up confirmed by the supervisor
  const evidenceId = evidenceUploadResponseSchema.parse(up.body).evidence.id
  for (const party of [PARTY_FIRST, PARTY]) {
    const r = await investigator.post(`/api/cases/${worked.id}/responsible-party`).send(party)
    expect(r.status, JSON.stringify(r.body)).toBe(201)
  }
  for (const notice of [{ ...NOTICES[0], evidenceId }, NOTICES[1]]) {
    const r = await investigator.post(`/api/cases/${worked.id}/notices`).send(notice)
    expect(r.status, JSON.stringify(r.body)).toBe(201)
  }
  const party = responsiblePartyResponseSchema.parse((await investigator.get(`/api/cases/${worked.id}/responsible-party`)).body)
  const posted = party.notices.find((n) => n.method === 'registered_post')!
  const reply = await investigator.post(`/api/cases/${worked.id}/party-replies`).send({ ...REPLY, noticeId: posted.id })
  expect(reply.status, JSON.stringify(reply.body)).toBe(201)
  const added = await investigator.post(`/api/cases/${worked.id}/follow-ups`).send(STAFF_FOLLOW_UP)
  expect(added.status, JSON.stringify(added.body)).toBe(201)
  const fromFinding = caseFollowUpsResponseSchema.parse((await supervisor.get(`/api/cases/${worked.id}/follow-ups`)).body).followUps.find((f) => f.source === 'finding')!
  const confirmed = await supervisor.post(`/api/follow-ups/${fromFinding.id}/confirm`).send({ version: fromFinding.version, note: CONFIRM_NOTE })
  expect(confirmed.status, JSON.stringify(confirmed.body)).toBe(200)

  // the evidence file's SHA-256 as the evidence bundle's manifest gives it
  const zip = await investigator.get(`/api/cases/${worked.id}/evidence-bundle`).buffer(true).parse(binary)
  expect(zip.status).toBe(200)
  const manifest = bundleManifestSchema.parse(JSON.parse(readZip(zip.body as Buffer).find((e) => e.name === 'manifest.json')!.data.toString('utf8')))
  evidenceSha = manifest.files[0]!.sha256
  expect(evidenceSha).toBe(sha256(PNG))
}, 60_000)

afterAll(async () => {
  await t?.close()
  await owner?.end()
  await fake?.close()
  fs.rmSync(dir, { recursive: true, force: true })
})

async function download(agent: Agent, caseId = worked.id) {
  return agent.get(`/api/cases/${caseId}/case-file`).buffer(true).parse(binary)
}

/**
 * The PDF's text as pdf-parse reads it, whitespace collapsed; `body` leaves out each page's
 * footer (drawn last on the page), so text running over a page break reads on.
 */
async function pdfText(pdf: Buffer): Promise<{ text: string; body: string; footers: string[]; pages: number }> {
  const parser = new PDFParse({ data: new Uint8Array(pdf) })
  try {
    const r = await parser.getText()
    if (process.env.QB_CASE_FILE_OUT) {
      // for a look at the pages: QB_CASE_FILE_OUT=<folder> writes the PDF and each page as PNG
      fs.mkdirSync(process.env.QB_CASE_FILE_OUT, { recursive: true })
      fs.writeFileSync(path.join(process.env.QB_CASE_FILE_OUT, 'case-file.pdf'), pdf)
      const shots = await parser.getScreenshot({ scale: 1.4, imageBuffer: true })
      for (const p of shots.pages) fs.writeFileSync(path.join(process.env.QB_CASE_FILE_OUT, `page-${p.pageNumber}.png`), p.data)
    }
    const squeeze = (s: string) => s.replace(/\s+/g, ' ').trim()
    const footerAt = (s: string) => s.lastIndexOf(`Case file ${worked.reference}-CF`)
    return {
      text: squeeze(r.text),
      body: squeeze(r.pages.map((p) => p.text.slice(0, footerAt(p.text))).join(' ')),
      footers: r.pages.map((p) => squeeze(p.text.slice(footerAt(p.text)))),
      pages: r.total,
    }
  } finally {
    await parser.destroy()
  }
}

/** The signature's parts, read from the file as any verifier would: /ByteRange and /Contents of the last signature dictionary. */
function signatureParts(pdf: Buffer): { signedBytes: Buffer; cms: Buffer; coversWholeFile: boolean } {
  const s = pdf.toString('latin1')
  const ranges = [...s.matchAll(/\/ByteRange\s*\[\s*(\d+)\s+(\d+)\s+(\d+)\s+(\d+)\s*\]/g)]
  expect(ranges.length, 'one signature').toBe(1)
  const [a, b, c, d] = ranges[0]!.slice(1).map(Number) as [number, number, number, number]
  const signedBytes = Buffer.concat([pdf.subarray(a, a + b), pdf.subarray(c, c + d)])
  const hex = s.slice(a + b + 1, c - 1) // between '<' and '>'
  const cms = Buffer.from(hex.replace(/(00)+$/, ''), 'hex')
  return { signedBytes, cms, coversWholeFile: a === 0 && c + d === pdf.length && pdf[a + b] === 0x3c && pdf[c - 1] === 0x3e }
}

/** Verifies a detached CMS by hand (RFC 5652 §5.4, §5.6): the message digest over the bytes, then RSA over the DER SET of signed attributes. */
function verifyByHand(pdf: Buffer): { ok: boolean; certificateSha256: string } {
  const { signedBytes, cms } = signatureParts(pdf)
  const p7 = forge.pkcs7.messageFromAsn1(forge.asn1.fromDer(forge.util.createBuffer(cms.toString('binary')))) as forge.pkcs7.PkcsSignedData & {
    rawCapture: { authenticatedAttributes: forge.asn1.Asn1[]; signature: string }
  }
  const cert = p7.certificates[0]!
  const attrs = p7.rawCapture.authenticatedAttributes
  const digestAttr = attrs.find((a) => forge.asn1.derToOid((a.value as forge.asn1.Asn1[])[0]!.value as string) === forge.pki.oids.messageDigest!)!
  const signedDigest = Buffer.from(((digestAttr.value as forge.asn1.Asn1[])[1]!.value as forge.asn1.Asn1[])[0]!.value as string, 'binary')
  const digestMatches = signedDigest.equals(crypto.createHash('sha256').update(signedBytes).digest())
  const setDer = Buffer.from(forge.asn1.toDer(forge.asn1.create(forge.asn1.Class.UNIVERSAL, forge.asn1.Type.SET, true, attrs)).getBytes(), 'binary')
  const publicKeyPem = forge.pki.publicKeyToPem(cert.publicKey)
  const signatureOk = crypto.verify('sha256', setDer, publicKeyPem, Buffer.from(p7.rawCapture.signature, 'binary'))
  const certDer = Buffer.from(forge.asn1.toDer(forge.pki.certificateToAsn1(cert)).getBytes(), 'binary')
  return { ok: digestMatches && signatureOk, certificateSha256: sha256(certDer) }
}

/** OpenSSL's own CMS check of the detached signature over the signed bytes, trusting the certificate it carries. */
function verifyWithOpenssl(pdf: Buffer): boolean {
  const { signedBytes, cms } = signatureParts(pdf)
  const work = fs.mkdtempSync(path.join(os.tmpdir(), 'qb-cms-'))
  try {
    fs.writeFileSync(path.join(work, 'sig.der'), cms)
    fs.writeFileSync(path.join(work, 'content.bin'), signedBytes)
    execFileSync('openssl', ['pkcs7', '-inform', 'DER', '-in', 'sig.der', '-print_certs', '-out', 'signer.pem'], { cwd: work, stdio: 'pipe' })
    execFileSync('openssl', ['cms', '-verify', '-binary', '-inform', 'DER', '-in', 'sig.der', '-content', 'content.bin', '-CAfile', 'signer.pem', '-purpose', 'any', '-out', '/dev/null'], { cwd: work, stdio: 'pipe' })
    return true
  } catch {
    return false
  } finally {
    fs.rmSync(work, { recursive: true, force: true })
  }
}

describe('GET /api/cases/:id/case-file', () => {
  let pdf: Buffer
  let headers: Record<string, string>

  it('answers a signed PDF as an attachment named by the file’s reference', async () => {
    const r = await download(supervisor)
    expect(r.status, (r.body as Buffer).toString('utf8').slice(0, 300)).toBe(200)
    pdf = r.body as Buffer
    headers = r.headers as Record<string, string>
    expect(headers['content-type']).toBe('application/pdf')
    expect(headers['content-disposition']).toBe(`attachment; filename="${worked.reference}-CF1.pdf"`)
    expect(pdf.subarray(0, 5).toString('latin1')).toBe('%PDF-')
    expect(pdf.toString('latin1')).toContain('/SubFilter /ETSI.CAdES.detached')
  })

  it('holds the references, the timeline, the approval, the evidence hash, methods and library versions, the cautions and page numbers', async () => {
    const { body: text, footers, pages } = await pdfText(pdf)
    expect(text).toContain(`Case file — ${worked.reference}`)
    expect(text).toContain(`file ${worked.reference}-CF1`)
    // every page's footer: the file's reference and "page n of N"
    expect(pages).toBeGreaterThan(1)
    expect(footers).toHaveLength(pages)
    footers.forEach((f, i) => expect(f).toMatch(new RegExp(`^Case file ${worked.reference}-CF1 · case ${worked.reference} · .* Page ${i + 1} of ${pages}\\b`)))

    // the timeline: each entry's title as the case page shows it
    const detail = caseResponseSchema.parse((await supervisor.get(`/api/cases/${worked.id}`)).body).case
    const before = detail.timeline.filter((e) => e.kind !== 'case_file_issued')
    expect(before.length).toBeGreaterThan(5)
    for (const e of before) expect(text, e.kind).toContain(eventTitle(e).replace(/\s+/g, ' '))
    expect(text).toContain(CLOSING)

    // the approval: the supervisor's name and the time, as the findings API gives them
    const findings = findingsResponseSchema.parse((await supervisor.get(`/api/cases/${worked.id}/findings`)).body)
    const review = findings.current!.review!
    expect(review.outcome).toBe('approved')
    expect(text).toContain(`Approved by ${worked.supervisor!.name}`)
    expect(text).toContain(`${review.at} UTC`)

    // the evidence manifest's SHA-256 (the bundle's), the calculation's methods and library version
    expect(text).toContain(evidenceSha)
    for (const m of calcMethods) expect(text).toContain(`${m.id} — ${m.source.replace(/\s+/g, ' ')}`)
    expect(text).toContain(calcLibraryVersion)
    expect(text).toContain(CAUTION_LINES[0])
    expect(text).toContain('DEMO SIGNATURE')
    // the complainant's contact details stay in the case record
    expect(text).not.toContain(detail.complainant.email)
  })

  it('lists the enforcement record: the party as recorded and changed, each notice’s day, method and proof, the reply, each follow-up’s deadline, state and who moved it', async () => {
    const { body: text } = await pdfText(pdf)
    expect(text).toContain('8. Responsible party and notices')
    expect(text).toContain('9. Follow-ups')
    // the party: the current record, when it was changed and by whom, and the earlier version
    const party = responsiblePartyResponseSchema.parse((await supervisor.get(`/api/cases/${worked.id}/responsible-party`)).body)
    expect(party.current!.version).toBe(2)
    expect(text).toContain(`Name ${PARTY.name}`)
    expect(text).toContain(`phone: ${PARTY.phone}`)
    expect(text).toContain(`Changed (version 2)`)
    expect(text).toContain(`Earlier: version 1 ${PARTY_FIRST.name} — recorded`)
    // each notice, oldest first, with the day it was served and how; its reference, who served it and the proof file's hash
    expect(party.notices).toHaveLength(2)
    NOTICES.forEach((n, i) => expect(text).toContain(`N${i + 1}. Served on ${n.servedOn} — ${NOTICE_METHOD_LABELS[n.method]}`))
    expect(text).toContain('Reference RP-4471-HB')
    expect(text).toContain(`Served by ${worked.investigator!.name}`)
    expect(text).toContain('Served by Night-shift investigator')
    expect(text).toContain(`mast.png, SHA-256 ${evidenceSha.slice(0, 16)}… (E1 in the manifest)`)
    // the reply, tied to the notice it answers
    expect(text).toContain(`R1. Received on ${REPLY.receivedOn} — to notice N1`)
    expect(text).toContain(REPLY.summary)
    // each follow-up: its deadline and state as the follow-ups API gives them, and who moved it when
    const { followUps } = caseFollowUpsResponseSchema.parse((await supervisor.get(`/api/cases/${worked.id}/follow-ups`)).body)
    expect(followUps).toHaveLength(2)
    followUps.forEach((f, i) => expect(text).toContain(`F${i + 1}. Due on ${f.dueOn} — ${f.stateLabel}`))
    expect(followUps.map((f) => f.stateLabel).sort()).toEqual([FOLLOW_UP_STATE_LABELS.complied, FOLLOW_UP_STATE_LABELS.open].sort())
    expect(text).toContain(`Expected ${STAFF_FOLLOW_UP.expected}`)
    expect(text).toContain(`Follow-up confirmed: complied — ${worked.supervisor!.name}`)
    expect(text).toContain(CONFIRM_NOTE)
    expect(text).toContain(`Follow-up added — ${worked.investigator!.name}`)
  })

  it('says so in one line per section when a case has no responsible party, notice, reply or follow-up', async () => {
    const bare = await makeCase(t, { office: worked.office, state: 'field_work' })
    const r = await download(supervisor, bare.id)
    expect(r.status).toBe(200)
    const { text } = await pdfText(r.body as Buffer)
    expect(text).toMatch(/8\. Responsible party and notices No responsible party, notice or reply has been recorded\. /)
    expect(text).toMatch(/9\. Follow-ups No follow-up has been set\. /)
    // one line, not an empty list per kind of record
    expect(text).not.toContain('Notices served')
    expect(text).not.toContain('No notice has been served.')
  })

  it('carries a signature that verifies against the demo certificate, by hand and with OpenSSL; one altered byte fails both', async () => {
    const parts = signatureParts(pdf)
    expect(parts.coversWholeFile, 'the /ByteRange covers every byte but the signature itself').toBe(true)
    const byHand = verifyByHand(pdf)
    expect(byHand.ok).toBe(true)
    expect(byHand.certificateSha256).toBe(processDemoSigner().certificateSha256)
    expect(verifyWithOpenssl(pdf)).toBe(true)

    // one byte inside the signed range (the first page's content), changed
    const tampered = Buffer.from(pdf)
    const at = Math.floor(parts.signedBytes.length / 3)
    tampered[at] = tampered[at]! ^ 0x01
    expect(verifyByHand(tampered).ok).toBe(false)
    expect(verifyWithOpenssl(tampered)).toBe(false)
  })

  it('records the file on the timeline: its SHA-256 equals that of the downloaded bytes, with its pages and who issued it', async () => {
    const { pages } = await pdfText(pdf)
    const { rows } = await owner.query<{ actor_user_id: string; actor_label: string; data: Record<string, unknown> }>(
      "SELECT actor_user_id, actor_label, data FROM case_events WHERE case_id = $1 AND kind = 'case_file_issued' ORDER BY id",
      [worked.id],
    )
    expect(rows).toHaveLength(1)
    expect(rows[0]!.data.sha256).toBe(sha256(pdf))
    expect(headers['x-case-file-sha256']).toBe(sha256(pdf))
    expect(rows[0]!.data.pageCount).toBe(pages)
    expect(rows[0]!.data.fileReference).toBe(`${worked.reference}-CF1`)
    expect(rows[0]!.actor_user_id).toBe(worked.supervisor!.id)
    expect(rows[0]!.actor_label).toBe(worked.supervisor!.name)
    // the entry is on the case page's timeline, and the record cannot be changed afterwards
    const detail = caseResponseSchema.parse((await investigator.get(`/api/cases/${worked.id}`)).body).case
    expect(detail.timeline.at(-1)).toMatchObject({ kind: 'case_file_issued', data: expect.objectContaining({ sha256: sha256(pdf) }) })
    expect(eventTitle(detail.timeline.at(-1)!)).toBe(`Case file ${worked.reference}-CF1 issued`)
    await expect(t.pool.query("UPDATE case_events SET data = '{}' WHERE case_id = $1 AND kind = 'case_file_issued'", [worked.id])).rejects.toThrow()
  })

  it('numbers the next file CF2 for an investigator of the office, whose timeline lists the first one with its hash', async () => {
    const r = await download(investigator)
    expect(r.status).toBe(200)
    const second = r.body as Buffer
    expect(r.headers['content-disposition']).toContain(`${worked.reference}-CF2.pdf`)
    const { body: text } = await pdfText(second)
    expect(text).toContain(`Case file ${worked.reference}-CF1 issued`)
    expect(text).toContain(sha256(pdf))
    expect(verifyByHand(second).ok).toBe(true)
    const { rows } = await owner.query<{ data: { sha256: string } }>("SELECT data FROM case_events WHERE case_id = $1 AND kind = 'case_file_issued' ORDER BY id", [worked.id])
    expect(rows.map((x) => x.data.sha256)).toEqual([sha256(pdf), sha256(second)])
  })

  it('answers 404 to another office and 403 to a complainant, and records nothing', async () => {
    const other = await download(stranger)
    expect(other.status).toBe(404)
    expect(JSON.parse((other.body as Buffer).toString('utf8')).error.code).toBe('case_not_found')
    const complainant = await signIn(t, await makeUser(t, { role: 'complainant' }))
    expect((await download(complainant)).status).toBe(403)
    const notACase = await download(supervisor, 'not-a-uuid')
    expect(notACase.status).toBe(404)
    const { rows } = await owner.query<{ n: number }>("SELECT count(*)::int AS n FROM case_events WHERE case_id = $1 AND kind = 'case_file_issued'", [worked.id])
    expect(rows[0]!.n).toBe(2)
  })

  it('answers 503 naming the setting when the certificate has expired since the server started, and records nothing', async () => {
    const expired = { ...processDemoSigner(), notAfter: new Date(Date.now() - 86_400_000) }
    const services = { ...t.services, caseFileSigner: () => expired }
    const before = (await owner.query<{ n: number }>("SELECT count(*)::int AS n FROM case_events WHERE case_id = $1 AND kind = 'case_file_issued'", [worked.id])).rows[0]!.n
    await expect(issueCaseFile(services, worked.supervisor!.actor, worked.id)).rejects.toMatchObject({ status: 503, code: 'case_file_certificate_expired', message: expect.stringContaining('CASE_FILE_P12_PATH') })
    await expect(issueCaseFile({ ...t.services, caseFileSigner: undefined }, worked.supervisor!.actor, worked.id)).rejects.toMatchObject({ status: 503, code: 'case_file_signing_unavailable' })
    const after = (await owner.query<{ n: number }>("SELECT count(*)::int AS n FROM case_events WHERE case_id = $1 AND kind = 'case_file_issued'", [worked.id])).rows[0]!.n
    expect(after).toBe(before)
  })

  it('tells staff of the office they may issue it (abilities); the policy refuses complainants and other offices', async () => {
    const detail = caseResponseSchema.parse((await investigator.get(`/api/cases/${worked.id}`)).body).case
    expect(detail.abilities.issueCaseFile).toBe(true)
    const theCase = { officeId: worked.office.id }
    expect(mayIssueCaseFile({ id: 'a', role: 'admin', officeId: null }, theCase)).toBe(true)
    expect(mayIssueCaseFile({ id: 'b', role: 'supervisor', officeId: 'another-office' }, theCase)).toBe(false)
    expect(mayIssueCaseFile({ id: 'c', role: 'complainant', officeId: null }, theCase)).toBe(false)
    expect(mayIssueCaseFile({ role: 'tracking_link', caseId: worked.id }, theCase)).toBe(false)
  })
})

describe('the signing certificate in configuration', () => {
  const base = {
    PUBLIC_URL: 'http://127.0.0.1:3000',
    DATABASE_URL: 'postgres://u:p@127.0.0.1:5432/db',
    SESSION_SECRET: 'x'.repeat(40),
    S3_BUCKET: 'bucket',
    S3_ACCESS_KEY_ID: 'k',
    S3_SECRET_ACCESS_KEY: 's',
    SMTP_URL: 'smtp://127.0.0.1:25',
  }
  const work = fs.mkdtempSync(path.join(os.tmpdir(), 'qb-p12-'))
  afterAll(() => fs.rmSync(work, { recursive: true, force: true }))
  const configError = (f: () => unknown): string => {
    try {
      f()
    } catch (e) {
      expect(e).toBeInstanceOf(ConfigError)
      return (e as Error).message
    }
    throw new Error('expected a ConfigError')
  }

  it('is required in production, and optional elsewhere (a demo certificate signs)', () => {
    expect(configError(() => loadEnv({ ...base, NODE_ENV: 'production' }))).toMatch(/CASE_FILE_P12_PATH: CASE_FILE_P12_PATH is required in production/)
    expect(loadEnv({ ...base, NODE_ENV: 'production', CASE_FILE_P12_PATH: '/etc/quietband/office.p12' }).CASE_FILE_P12_PATH).toBe('/etc/quietband/office.p12')
    expect(loadEnv({ ...base, NODE_ENV: 'development' }).CASE_FILE_P12_PATH).toBeUndefined()
  })

  it('keeps the demo PKCS#12 (npm start) once made, and makes it again when expired; it signs as a DEMO certificate', () => {
    const file = path.join(work, 'local', 'case-file-demo.p12')
    const first = ensureDemoP12(file)
    const bytes = fs.readFileSync(file)
    expect((fs.statSync(file).mode & 0o777).toString(8)).toBe('600')
    const signer = signerFromP12File(first.path, first.passphrase)
    expect(signer.demo).toBe(true)
    ensureDemoP12(file)
    expect(fs.readFileSync(file).equals(bytes), 'reused').toBe(true)
    ensureDemoP12(file, new Date(Date.now() + 2 * 365 * 86_400_000))
    expect(fs.readFileSync(file).equals(bytes), 'replaced once expired').toBe(false)
  })

  it('refuses a missing file, a wrong passphrase, an expired certificate and a key not matching its certificate, naming the setting', () => {
    const good = generateDemoCredentials()
    const file = path.join(work, 'good.p12')
    fs.writeFileSync(file, credentialsToP12(good, 'right'))
    const signer = signerFromP12File(file, 'right')
    expect(signer.demo).toBe(true)
    expect(signer.subject).toMatch(/DEMO/)

    expect(configError(() => signerFromP12File(path.join(work, 'absent.p12'), 'right'))).toMatch(/CASE_FILE_P12_PATH .*cannot be read: ENOENT/)
    expect(configError(() => signerFromP12File(file, 'wrong'))).toMatch(/CASE_FILE_P12_PATH .*cannot be read as PKCS#12.*CASE_FILE_P12_PASSPHRASE/)
    expect(configError(() => signerFromP12File(file, 'right', new Date(Date.now() + 2 * 365 * 86_400_000)))).toMatch(/certificate in CASE_FILE_P12_PATH .* is valid from .* not now/)

    const other = generateDemoCredentials()
    const mismatched = path.join(work, 'mismatched.p12')
    fs.writeFileSync(mismatched, credentialsToP12({ certificate: good.certificate, privateKeyPem: other.privateKeyPem }, 'right'))
    expect(configError(() => signerFromP12File(mismatched, 'right'))).toMatch(/CASE_FILE_P12_PATH .*certificate does not match its private key/)
  })
})
