/**
 * Findings are structured records: proposing one writes the finding row, moves the case, adds
 * the timeline event and queues the supervisors' e-mails in one transaction; a finding links
 * only its own case's calculations and its own case's evidence files that were not removed
 * (else 400 naming the bad ids, nothing written); the table is append-only; each proposal is a
 * new row and the latest is the current one.
 */
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import pg from 'pg'
import { createHash, randomUUID } from 'node:crypto'
import { insertEvidence } from '../../server/modules/evidence/evidence.repo'
import { findingsResponseSchema } from '../../shared/schemas/findings'
import { createTestContext, type TestContext } from '../support/harness'
import { expectAnswerMatchesDocument } from '../support/api-document'
import { makeCase, makeOffice, signIn, type Agent, type TestCase } from '../support/factories'
import { FREE_SPACE_FIELD_ROWS } from '../fixtures/radio/propagation-free-space'
import { queuedMails } from '../support/cases'

const appUrl = inject('databaseUrl')
const ownerUrl = inject('migrationDatabaseUrl')
const sameRole = appUrl === ownerUrl

let t: TestContext
let owner: pg.Pool
let app: pg.Pool

/** The same inputs as calculations.test.ts (register row 1-5 read backwards): the numbers are checked there. */
const ROW_1_5 = FREE_SPACE_FIELD_ROWS.find((r) => r.id === '1-5')!
const eirpInputs = {
  measurement: { kind: 'field-strength', fieldStrengthDbuvPerM: `${ROW_1_5.expected} dBµV/m`, freqHz: '100 MHz' },
  distanceM: '1 km',
  model: { kind: 'free-space', freqHz: '100 MHz' },
  measurementContributions: [{ name: 'antenna calibration', distribution: { kind: 'normal', expandedUncertainty: '1.5 dB', coverageFactor: 2 } }],
}

const proposal = (over: Record<string, unknown> = {}) => ({
  sourceDescription: 'A faulty masthead amplifier on the boathouse roof',
  sourceLatDeg: '48.1021',
  sourceLonDeg: '-31.3504°',
  operator: 'Harbour boat club',
  recommendedAction: 'advise_operator',
  complianceDeadline: new Date(Date.now() + 14 * 86_400_000).toISOString().slice(0, 10),
  calculationIds: [],
  evidenceIds: [],
  summary: 'Measured at three points; the amplifier oscillates when the mast heater runs.',
  ...over,
})

const db = () => owner
const statusOf = async (caseId: string) => (await db().query<{ status: string; version: number }>(`SELECT status, version FROM cases WHERE id = $1`, [caseId])).rows[0]!
const findingCount = async (caseId: string) => (await db().query<{ n: number }>(`SELECT count(*)::int AS n FROM findings WHERE case_id = $1`, [caseId])).rows[0]!.n
const proposeEvents = async (caseId: string) =>
  (await db().query<{ n: number }>(`SELECT count(*)::int AS n FROM case_events WHERE case_id = $1 AND kind = 'proposeFinding'`, [caseId])).rows[0]!.n

async function storeEirp(agent: Agent, caseId: string) {
  const res = await agent.post(`/api/cases/${caseId}/calculations`).send({ kind: 'eirp_single_point', inputs: eirpInputs })
  expect(res.status, JSON.stringify(res.body)).toBe(201)
  return res.body.calculation as { id: string; outputs: unknown; warnings: string[]; methods: { id: string }[]; libraryVersion: string }
}

/** An evidence file row on the case (no object is read here: only its name and hash are shown). */
async function addEvidenceRow(c: TestCase, name: string): Promise<{ id: string; sha256: string }> {
  const sha256 = createHash('sha256').update(`${name} ${randomUUID()}`).digest('hex')
  const e = await insertEvidence(
    t.services.db,
    { objectKey: `evidence/${randomUUID()}`, originalName: name, sizeBytes: 10, sha256, contentType: 'text/csv', contentTypeSource: 'sniffed', purpose: 'evidence', uploadedBy: c.investigator!.id },
    { caseId: c.id, kind: 'spectrum_capture', uploaderRole: 'staff', uploaderUserId: c.investigator!.id, displayName: name, submittedNameJson: JSON.stringify(name) },
  )
  return { id: e.id, sha256 }
}

async function propose(agent: Agent, c: TestCase, body: Record<string, unknown>) {
  const version = (await statusOf(c.id)).version
  return agent.post(`/api/cases/${c.id}/propose-finding`).send({ version, ...body })
}

beforeAll(async () => {
  t = await createTestContext()
  owner = new pg.Pool({ connectionString: ownerUrl, max: 2 })
  app = new pg.Pool({ connectionString: appUrl, max: 2 })
})
afterAll(async () => {
  await t?.close()
  await owner?.end()
  await app?.end()
})

describe('proposing a structured finding', () => {
  it('stores the row, moves the case, writes the timeline event and e-mails the supervisor in one go', async () => {
    const office = await makeOffice(t)
    const c = await makeCase(t, { office, state: 'field_work' })
    const inv = await signIn(t, c.investigator!)
    const calc = await storeEirp(inv, c.id)
    const res = await propose(inv, c, proposal({ calculationIds: [calc.id] }))
    expect(res.status, JSON.stringify(res.body)).toBe(200)
    expect(res.body.case.status).toBe('finding_proposed')
    expect(await findingCount(c.id)).toBe(1)
    const row = (await db().query(`SELECT * FROM findings WHERE case_id = $1`, [c.id])).rows[0]
    expect(row).toMatchObject({
      author_user_id: c.investigator!.id,
      source_lat_deg: 48.1021,
      source_lon_deg: -31.3504,
      operator: 'Harbour boat club',
      recommended_action: 'advise_operator',
      calculation_ids: [calc.id],
      evidence_ids: [],
    })
    const event = (await db().query(`SELECT body, data FROM case_events WHERE case_id = $1 AND kind = 'proposeFinding'`, [c.id])).rows[0]
    expect(event.body).toBe(proposal().summary)
    expect(event.data.findingId).toBe(row.id)
    const toSupervisor = (await queuedMails(t.pool, c.supervisor!.email)).map((m) => m.subject)
    expect(toSupervisor, 'the supervisor is asked to review').toContain(`[${c.reference}] Finding ready for your review`)

    // the finding as the supervisor reads it: the linked record exactly as stored, warnings and all
    const sup = await signIn(t, c.supervisor!)
    const read = await sup.get(`/api/cases/${c.id}/findings`)
    expect(read.status).toBe(200)
    const parsed = findingsResponseSchema.parse(read.body)
    expectAnswerMatchesDocument('GET', '/api/cases/:id/findings', read)
    expect(parsed.current!.sourcePosition).toEqual({ latDeg: 48.1021, lonDeg: -31.3504 })
    expect(parsed.current!.recommendedActionLabel).toEqual(expect.any(String))
    expect(parsed.current!.calculations).toHaveLength(1)
    const linked = parsed.current!.calculations[0]!
    expect(linked.outputs).toEqual(calc.outputs)
    expect(linked.warnings).toEqual(calc.warnings)
    expect(linked.methods).toEqual(calc.methods)
    expect(linked.libraryVersion).toBe(calc.libraryVersion)
    expect(linked.outputs.interval, 'the stored interval travels with the finding').toBeDefined()
    expect(parsed.current!.review).toBeNull()
    expect(parsed.earlier).toEqual([])
  })

  it('refuses another case’s calculation with a 400 naming it, and leaves the case, the timeline and the findings unchanged', async () => {
    const office = await makeOffice(t)
    const c = await makeCase(t, { office, state: 'field_work' })
    const other = await makeCase(t, { office, state: 'field_work' })
    const inv = await signIn(t, c.investigator!)
    const own = await storeEirp(inv, c.id)
    const foreign = await storeEirp(await signIn(t, other.investigator!), other.id)
    const unknown = '00000000-0000-4000-8000-000000000000'
    const before = await statusOf(c.id)
    const res = await propose(inv, c, proposal({ calculationIds: [own.id, foreign.id, unknown] }))
    expect(res.status).toBe(400)
    expect(res.body.error.code).toBe('validation_failed')
    const detail = res.body.error.details.find((d: { path: string }) => d.path === 'calculationIds')
    expect(detail.message).toContain(foreign.id)
    expect(detail.message).toContain(unknown)
    expect(detail.message).not.toContain(own.id)
    expect(await statusOf(c.id)).toEqual(before)
    expect(await findingCount(c.id)).toBe(0)
    expect(await proposeEvents(c.id)).toBe(0)
  })

  it('answers 400 listing every bad field: half a position, a past deadline, evidence ids, an unknown action', async () => {
    const office = await makeOffice(t)
    const c = await makeCase(t, { office, state: 'field_work' })
    const inv = await signIn(t, c.investigator!)
    const res = await propose(
      inv,
      c,
      proposal({ sourceLonDeg: '', complianceDeadline: '2020-01-01', evidenceIds: ['a'], recommendedAction: 'shrug', sourceDescription: '', authorisedStationId: 'station-9' }),
    )
    expect(res.status).toBe(400)
    const paths = (res.body.error.details as { path: string }[]).map((d) => d.path).sort()
    // an evidence id that is no uuid is named by its place in the list, as a calculation id is
    expect(paths).toEqual(['authorisedStationId', 'complianceDeadline', 'evidenceIds.0', 'recommendedAction', 'sourceDescription', 'sourceLonDeg'].sort())
    const again = await propose(inv, c, proposal({ sourceLonDeg: '' }))
    expect(again.status).toBe(400)
    expect((again.body.error.details as { path: string }[]).map((d) => d.path)).toEqual(['sourceLonDeg'])
    expect(await findingCount(c.id)).toBe(0)
  })

  it('is the assigned investigator’s move only: a colleague or the supervisor gets 403, another office 404', async () => {
    const office = await makeOffice(t)
    const c = await makeCase(t, { office, state: 'field_work' })
    const sup = await signIn(t, c.supervisor!)
    expect((await propose(sup, c, proposal())).status).toBe(403)
    const otherOffice = await makeOffice(t)
    const stranger = await makeCase(t, { office: otherOffice, state: 'field_work' })
    expect((await (await signIn(t, stranger.investigator!)).get(`/api/cases/${c.id}/findings`)).status).toBe(404)
    expect(await findingCount(c.id)).toBe(0)
  })
})

describe('evidence files on a finding', () => {
  it('keeps the case’s own files in the order linked and shows each with its name and hash', async () => {
    const office = await makeOffice(t)
    const c = await makeCase(t, { office, state: 'field_work' })
    const inv = await signIn(t, c.investigator!)
    const trace = await addEvidenceRow(c, 'harbour-trace.csv')
    const photo = await addEvidenceRow(c, 'mast.jpg')
    const res = await propose(inv, c, proposal({ evidenceIds: [photo.id, trace.id] }))
    expect(res.status, JSON.stringify(res.body)).toBe(200)
    const row = (await db().query(`SELECT evidence_ids FROM findings WHERE case_id = $1`, [c.id])).rows[0]
    expect(row.evidence_ids).toEqual([photo.id, trace.id])

    // removed after the proposal: still listed (the record keeps what it rested on), marked
    const sup = await signIn(t, c.supervisor!)
    expect((await sup.post(`/api/evidence/${photo.id}/remove`).send({ reason: 'Wrong mast photographed.' })).status).toBe(200)
    const read = await sup.get(`/api/cases/${c.id}/findings`)
    const parsed = findingsResponseSchema.parse(read.body)
    expect(parsed).toEqual(read.body)
    expect(parsed.current!.evidenceIds).toEqual([photo.id, trace.id])
    expect(parsed.current!.evidence).toEqual([
      { id: photo.id, name: 'mast.jpg', sha256: photo.sha256, removed: true },
      { id: trace.id, name: 'harbour-trace.csv', sha256: trace.sha256, removed: false },
    ])
  })

  it('refuses another case’s file, an unknown id and a removed file with a 400 naming each, and writes nothing', async () => {
    const office = await makeOffice(t)
    const c = await makeCase(t, { office, state: 'field_work' })
    const other = await makeCase(t, { office, state: 'field_work' })
    const inv = await signIn(t, c.investigator!)
    const own = await addEvidenceRow(c, 'own.csv')
    const gone = await addEvidenceRow(c, 'gone.csv')
    const foreign = await addEvidenceRow(other, 'foreign.csv')
    const unknown = '00000000-0000-4000-8000-00000000e0e0'
    expect((await (await signIn(t, c.supervisor!)).post(`/api/evidence/${gone.id}/remove`).send({ reason: 'Uploaded by mistake.' })).status).toBe(200)
    const before = await statusOf(c.id)
    const res = await propose(inv, c, proposal({ evidenceIds: [own.id, foreign.id, gone.id, unknown] }))
    expect(res.status).toBe(400)
    expect(res.body.error.code).toBe('validation_failed')
    const details = res.body.error.details as { path: string; message: string }[]
    expect(details.map((d) => d.path)).toEqual(['evidenceIds'])
    const message = details[0]!.message
    expect(message).toContain(`Not evidence files of this case: ${foreign.id}, ${unknown}.`)
    expect(message).toContain(`Removed from the case, so not linkable: ${gone.id} (gone.csv).`)
    expect(message).not.toContain(own.id)
    expect(await statusOf(c.id)).toEqual(before)
    expect(await findingCount(c.id)).toBe(0)
    expect(await proposeEvents(c.id)).toBe(0)
  })
})

describe('review: send back, propose again, approve', () => {
  it('keeps both proposals, the latest current, each with the supervisor’s answer; approving closes the case', async () => {
    const office = await makeOffice(t)
    const c = await makeCase(t, { office, state: 'field_work' })
    const inv = await signIn(t, c.investigator!)
    const sup = await signIn(t, c.supervisor!)
    expect((await propose(inv, c, proposal({ summary: 'First look: the amplifier.' }))).status).toBe(200)
    const back = await sup.post(`/api/cases/${c.id}/return-finding`).send({ version: (await statusOf(c.id)).version, reason: 'Measure at the second house too.' })
    expect(back.status).toBe(200)
    const calc = await storeEirp(inv, c.id)
    expect((await propose(inv, c, proposal({ summary: 'Second house measured; same source.', recommendedAction: 'formal_warning', calculationIds: [calc.id] }))).status).toBe(200)
    expect(await findingCount(c.id)).toBe(2)

    let read = findingsResponseSchema.parse((await sup.get(`/api/cases/${c.id}/findings`)).body)
    expect(read.current!.summary).toBe('Second house measured; same source.')
    expect(read.current!.recommendedAction).toBe('formal_warning')
    expect(read.current!.review).toBeNull()
    expect(read.earlier.map((f) => f.summary)).toEqual(['First look: the amplifier.'])
    expect(read.earlier[0]!.review).toMatchObject({ outcome: 'returned', comments: 'Measure at the second house too.' })

    const closed = await sup.post(`/api/cases/${c.id}/close`).send({ version: (await statusOf(c.id)).version, resolution: 'enforcement_action', reason: 'Warning issued; the club replaced the amplifier.' })
    expect(closed.status).toBe(200)
    expect(closed.body.case.status).toBe('closed')
    read = findingsResponseSchema.parse((await inv.get(`/api/cases/${c.id}/findings`)).body)
    expect(read.current!.review).toMatchObject({ outcome: 'approved', comments: 'Warning issued; the club replaced the amplifier.' })
  })
})

describe.skipIf(sameRole)('the findings table for the application role', () => {
  it('accepts inserts but refuses UPDATE, DELETE and TRUNCATE', async () => {
    const office = await makeOffice(t)
    const c = await makeCase(t, { office, state: 'finding_proposed' })
    const { rows } = await app.query<{ id: string }>(`SELECT id FROM findings WHERE case_id = $1`, [c.id])
    expect(rows).toHaveLength(1)
    const id = rows[0]!.id
    await expect(app.query(`UPDATE findings SET summary = 'changed' WHERE id = $1`, [id])).rejects.toThrow()
    await expect(app.query(`DELETE FROM findings WHERE id = $1`, [id])).rejects.toThrow()
    await expect(app.query(`TRUNCATE findings`)).rejects.toThrow()
    await expect(owner.query(`UPDATE findings SET summary = 'changed' WHERE id = $1`, [id]), 'not even the owner').rejects.toThrow()
    expect((await app.query(`SELECT summary FROM findings WHERE id = $1`, [id])).rows[0].summary).not.toBe('changed')
  })

  it('takes the time of a new row from the database, not from the writer', async () => {
    const office = await makeOffice(t)
    const c = await makeCase(t, { office, state: 'field_work' })
    const client = await app.connect()
    try {
      await client.query('BEGIN')
      const { rows } = await client.query<{ at: Date }>(
        `INSERT INTO findings (case_id, author_user_id, at, source_description, calculation_ids, recommended_action, summary)
         VALUES ($1, $2, '2000-01-01T00:00:00Z', 'Backdated', '[]'::jsonb, 'no_action', 'Backdated row') RETURNING at`,
        [c.id, c.investigator!.id],
      )
      expect(rows[0]!.at.getUTCFullYear()).not.toBe(2000)
    } finally {
      await client.query('ROLLBACK').catch(() => {})
      client.release()
    }
  })
})
