/**
 * Every move of a case: allowed for the right person in the right state, refused otherwise
 * (403 by role or relation, 404 for another office, 409 by state or stale version), with a
 * timeline event written for each accepted move and nothing written for a refused one.
 */
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import pg from 'pg'
import type request from 'supertest'
import type { Office } from '../../server/db/schema'
import type { ReportInput } from '../../shared/schemas/cases'
import { createTestContext, type TestContext } from '../support/harness'
import { caseVersion, fileReport, queuedMails } from '../support/cases'
import { makeOffice, makeUser, reportNear, signIn, type Agent, type TestUser } from '../support/factories'

let t: TestContext
let office: Office // this file's own office
let otherOffice: Office // a neighbour about 5.5 km north, the nearest to transfer to
let supervisorUser: TestUser
let investigatorUser: TestUser
let otherInvestigatorUser: TestUser
let otherOfficeInvestigatorUser: TestUser
let supervisor: Agent
let investigator: Agent
let otherInvestigator: Agent // same office, not assigned
let otherOfficeSupervisor: Agent
let admin: Agent
let investigatorId: string

beforeAll(async () => {
  t = await createTestContext()
  office = await makeOffice(t)
  otherOffice = await makeOffice(t, { centreLatDeg: office.centreLatDeg + 0.05, centreLonDeg: office.centreLonDeg })
  supervisorUser = await makeUser(t, { role: 'supervisor', office })
  investigatorUser = await makeUser(t, { role: 'investigator', office })
  otherInvestigatorUser = await makeUser(t, { role: 'investigator', office })
  otherOfficeInvestigatorUser = await makeUser(t, { role: 'investigator', office: otherOffice })
  supervisor = await signIn(t, supervisorUser)
  investigator = await signIn(t, investigatorUser)
  otherInvestigator = await signIn(t, otherInvestigatorUser)
  otherOfficeSupervisor = await signIn(t, await makeUser(t, { role: 'supervisor', office: otherOffice }))
  admin = await signIn(t, await makeUser(t, { role: 'admin' }))
  investigatorId = investigatorUser.id
})

/** A report filed beside this file's office (so routed to it), unless a place is given. */
const fileHere = (over: Partial<ReportInput> = {}) => fileReport(t, { ...reportNear(office), ...over })
/** A place `northM` metres north of this file's office (1° of latitude is about 111 km). */
const northOfOffice = (northM: number) => ({ latDeg: office.centreLatDeg + northM / 111_000, lonDeg: office.centreLonDeg })
afterAll(() => t.close())

const events = async (caseId: string) =>
  (await t.pool.query(`SELECT kind, from_state, to_state, actor_label, body FROM case_events WHERE case_id = $1 ORDER BY id`, [caseId])).rows
const state = async (caseId: string) => (await t.pool.query(`SELECT status, priority, investigator_id, resolution FROM cases WHERE id = $1`, [caseId])).rows[0]

async function act(agent: Agent, caseId: string, path: string, body: Record<string, unknown> = {}): Promise<request.Response> {
  return agent.post(`/api/cases/${caseId}/${path}`).send({ version: await caseVersion(t.pool, caseId), ...body })
}

/** A case of this file's office moved to a given state along the usual path, through the API. */
async function caseIn(target: 'received' | 'triaged' | 'assigned' | 'field_work' | 'finding_proposed' | 'returned' | 'closed', where: { latDeg: number; lonDeg: number } = reportNear(office)) {
  const f = await fileHere(where)
  const path: [Agent, string, Record<string, unknown>][] = [
    [supervisor, 'triage', { priority: 2 }],
    [supervisor, 'assign', { investigatorId }],
    [investigator, 'start-field-work', {}],
    [investigator, 'propose-finding', { sourceDescription: 'A faulty masthead amplifier', recommendedAction: 'advise_operator', summary: 'Faulty masthead amplifier at the marina, 180 m away.' }],
  ]
  const order = ['received', 'triaged', 'assigned', 'field_work', 'finding_proposed']
  const steps = target === 'returned' ? 5 : target === 'closed' ? 5 : order.indexOf(target)
  for (let i = 0; i < Math.min(steps, 4); i++) {
    const [agent, p, body] = path[i]!
    const res = await act(agent, f.id, p, body)
    expect(res.status, `${p}: ${JSON.stringify(res.body)}`).toBe(200)
  }
  if (target === 'returned') expect((await act(supervisor, f.id, 'return-finding', { reason: 'Measure at the second site too.' })).status).toBe(200)
  if (target === 'closed') expect((await act(supervisor, f.id, 'close', { resolution: 'source_corrected', reason: 'The owner replaced the amplifier.' })).status).toBe(200)
  expect((await state(f.id)).status).toBe(target)
  return f
}

describe('the whole path of a case', () => {
  it('goes received → triaged → assigned → field work → finding proposed → closed, one timeline event per move', async () => {
    const f = await caseIn('closed')
    expect((await events(f.id)).map((e) => [e.kind, e.from_state, e.to_state])).toEqual([
      ['received', null, 'received'],
      ['routed', null, null],
      ['triage', 'received', 'triaged'],
      ['assign', 'triaged', 'assigned'],
      ['startFieldWork', 'assigned', 'field_work'],
      ['proposeFinding', 'field_work', 'finding_proposed'],
      ['close', 'finding_proposed', 'closed'],
    ])
    expect(await state(f.id)).toMatchObject({ status: 'closed', resolution: 'source_corrected', priority: 2 })
  })

  it('tells the complainant at receipt, assignment and closure, and the investigator at assignment', async () => {
    const f = await caseIn('closed')
    const subjects = (await queuedMails(t.pool, f.email)).map((m) => m.subject)
    expect(subjects).toEqual([
      expect.stringContaining('We have received your interference report'),
      expect.stringContaining('An engineer is looking into your report'),
      expect.stringContaining('Your report is closed'),
    ])
    const toInvestigator = (await queuedMails(t.pool, investigatorUser.email)).map((m) => m.subject)
    expect(toInvestigator).toContainEqual(`[${f.reference}] Assigned to you — priority 2`)
    const toSupervisor = (await queuedMails(t.pool, supervisorUser.email)).map((m) => m.subject)
    expect(toSupervisor).toContainEqual(`[${f.reference}] Finding ready for your review`)
  })

  it('e-mails the investigator when their finding is sent back, with the supervisor’s reason', async () => {
    const f = await caseIn('finding_proposed')
    const before = (await queuedMails(t.pool, investigatorUser.email)).length
    expect((await act(supervisor, f.id, 'return-finding', { reason: 'Measure at the second site too.' })).status).toBe(200)
    const mails = await queuedMails(t.pool, investigatorUser.email)
    expect(mails).toHaveLength(before + 1)
    expect(mails.at(-1)!.subject).toBe(`[${f.reference}] Finding sent back for more work`)
    expect(mails.at(-1)!.text).toContain('Measure at the second site too.')
    expect(mails.at(-1)!.text).toContain(`/cases/${f.id}`)
  })

  it('returns a finding for more work, and the investigator proposes again', async () => {
    const f = await caseIn('returned')
    expect((await act(investigator, f.id, 'propose-finding', { sourceDescription: 'A faulty masthead amplifier', recommendedAction: 'advise_operator', summary: 'Second site measured; same source.' })).status).toBe(200)
    expect((await state(f.id)).status).toBe('finding_proposed')
  })

  it('reopens a closed case to its investigator and tells the complainant', async () => {
    const f = await caseIn('closed')
    const res = await act(supervisor, f.id, 'reopen', { reason: 'The complainant reports the noise is back.' })
    expect(res.status).toBe(200)
    expect(res.body.case).toMatchObject({ status: 'assigned', resolution: null, investigatorId })
    const subjects = (await queuedMails(t.pool, f.email)).map((m) => m.subject)
    expect(subjects.at(-1)).toContain('Your report is open again')
  })
})

describe('reopening a report closed at triage', () => {
  it('returns it to triage, since no investigator had it', async () => {
    const f = await fileHere()
    expect((await act(supervisor, f.id, 'dismiss', { resolution: 'no_interference_found', reason: 'The set-top box was faulty, not the signal.' })).status).toBe(200)
    const res = await act(supervisor, f.id, 'reopen', { reason: 'A second household nearby reports the same.' })
    expect(res.status).toBe(200)
    expect(res.body.case).toMatchObject({ status: 'triaged', investigatorId: null, resolution: null, closedAt: null })
  })
})

describe('reopening after the investigator has left', () => {
  it('returns the case to triage without them', async () => {
    const leaverUser = await makeUser(t, { role: 'investigator', office, name: 'Noor Atherley' })
    const leaverId = leaverUser.id
    const leaver = await signIn(t, leaverUser)
    const f = await fileHere()
    expect((await act(supervisor, f.id, 'assign', { investigatorId: leaverId })).status).toBe(200)
    expect((await act(leaver, f.id, 'propose-finding', { sourceDescription: 'A faulty masthead amplifier', recommendedAction: 'advise_operator', summary: 'Nothing found on three visits.' })).status).toBe(200)
    expect((await act(supervisor, f.id, 'close', { resolution: 'no_interference_found', reason: 'We measured three times and found nothing.' })).status).toBe(200)
    await admin.patch(`/api/admin/users/${leaverId}`).send({ active: false }).expect(200)
    const res = await act(supervisor, f.id, 'reopen', { reason: 'It is back every evening.' })
    expect(res.status).toBe(200)
    expect(res.body.case).toMatchObject({ status: 'triaged', investigatorId: null })
  })
})

describe('moves refused', () => {
  it.each([
    ['triage', { priority: 1 }],
    ['assign', { investigatorId: '00000000-0000-4000-8000-000000000000' }],
    ['dismiss', { resolution: 'referred', reason: 'Not ours' }],
  ])('%s by an investigator is 403 and writes nothing', async (path, body) => {
    const f = await fileHere()
    const before = await events(f.id)
    const res = await act(investigator, f.id, path, body)
    expect(res.status).toBe(403)
    expect(res.body.error.code).toBe('forbidden')
    expect(await events(f.id)).toEqual(before)
    expect((await state(f.id)).status).toBe('received')
  })

  it('a move on another office’s case is 404 for its staff, even for a supervisor', async () => {
    const f = await fileReport(t, reportNear(otherOffice))
    const res = await act(supervisor, f.id, 'triage', { priority: 3 })
    expect(res.status).toBe(404)
    expect(res.body.error.code).toBe('case_not_found')
    await supervisor.get(`/api/cases/${f.id}`).expect(404)
    await otherOfficeSupervisor.get(`/api/cases/${f.id}`).expect(200)
  })

  it('an administrator can read every office’s case but makes no moves', async () => {
    const f = await fileHere()
    await admin.get(`/api/cases/${f.id}`).expect(200)
    expect((await act(admin, f.id, 'triage', { priority: 3 })).status).toBe(403)
  })

  it('only the assigned investigator starts field work or proposes a finding', async () => {
    const f = await caseIn('assigned')
    expect((await act(otherInvestigator, f.id, 'start-field-work')).status).toBe(403)
    expect((await act(supervisor, f.id, 'start-field-work')).status).toBe(403)
    expect((await act(investigator, f.id, 'start-field-work')).status).toBe(200)
  })

  it.each([
    ['received', supervisor, 'close', { resolution: 'source_corrected', reason: 'Too early' }],
    ['received', supervisor, 'return-finding', { reason: 'Nothing to return' }],
    ['triaged', supervisor, 'reopen', { reason: 'Not closed' }],
    ['assigned', supervisor, 'transfer', { officeId: '00000000-0000-4000-8000-000000000000', reason: 'Too late to transfer' }],
    ['field_work', supervisor, 'dismiss', { resolution: 'referred', reason: 'Too late to dismiss' }],
    ['closed', supervisor, 'triage', { priority: 1 }],
  ] as const)('from %s, %s is 409 invalid_transition and nothing changes', async (from, _agent, path, body) => {
    const f = await caseIn(from)
    const before = await events(f.id)
    const res = await act(supervisor, f.id, path, body)
    expect(res.status).toBe(409)
    expect(res.body.error.code).toBe('invalid_transition')
    expect(await events(f.id)).toEqual(before)
    expect((await state(f.id)).status).toBe(from)
  })

  it('a stale version is 409 stale_version', async () => {
    const f = await fileHere()
    await act(supervisor, f.id, 'triage', { priority: 3 })
    const res = await supervisor.post(`/api/cases/${f.id}/triage`).send({ version: 1, priority: 1 })
    expect(res.status).toBe(409)
    expect(res.body.error.code).toBe('stale_version')
    expect((await state(f.id)).priority).toBe(3)
  })

  it('assigning an investigator of another office is 400 on the field', async () => {
    const f = await fileHere()
    const res = await act(supervisor, f.id, 'assign', { investigatorId: otherOfficeInvestigatorUser.id })
    expect(res.status).toBe(400)
    expect(res.body.error.details[0].path).toBe('investigatorId')
  })

  it('a move with missing fields lists them and changes nothing', async () => {
    const f = await fileHere()
    const res = await supervisor.post(`/api/cases/${f.id}/close`).send({})
    expect(res.status).toBe(400)
    expect(res.body.error.details.map((d: { path: string }) => d.path).sort()).toEqual(['reason', 'resolution', 'version'])
  })
})

describe('triage work', () => {
  it('transfers a new report to another office, which sees it as new', async () => {
    const f = await fileHere()
    const targets = await supervisor.get(`/api/cases/${f.id}/transfer-offices`).expect(200)
    // every other office, nearest first: the neighbour 5.5 km away leads, the case's own office is not offered
    const offered: { id: string; distanceM: number }[] = targets.body.offices
    expect(offered[0]).toEqual({ id: otherOffice.id, name: otherOffice.name, distanceM: expect.any(Number) })
    expect(offered[0]!.distanceM).toBeGreaterThan(5_000)
    expect(offered[0]!.distanceM).toBeLessThan(6_000)
    expect(offered.map((o) => o.id)).not.toContain(office.id)
    expect(offered.map((o) => o.distanceM)).toEqual([...offered.map((o) => o.distanceM)].sort((a, b) => a - b))
    expect((await act(supervisor, f.id, 'transfer', { officeId: otherOffice.id, reason: 'The site is on the other office’s side of the ridge.' })).status).toBe(200)
    await supervisor.get(`/api/cases/${f.id}`).expect(404)
    const seen = await otherOfficeSupervisor.get(`/api/cases/${f.id}`).expect(200)
    expect(seen.body.case).toMatchObject({ status: 'received', officeName: otherOffice.name, investigatorId: null })
  })

  it('suggests open cases nearby with an overlapping frequency for merging, and merges', async () => {
    // a spot of this test's own, 3 km south of the file's office (the other tests file beside it);
    // the far one 11 km further south, still nearest to this office
    const spot = (northM: number) => northOfOffice(-3_000 + northM)
    const open = await caseIn('assigned', spot(0))
    const dup = await fileHere({ frequencyFrom: 1750, frequencyTo: 1760, ...spot(120) })
    const otherBand = await fileHere({ frequencyFrom: 450, frequencyTo: 470, ...spot(60) })
    const far = await fileHere(spot(-11_000))
    const cands = await supervisor.get(`/api/cases/${dup.id}/merge-candidates`).expect(200)
    const refs = cands.body.candidates.map((c: { reference: string }) => c.reference)
    expect(refs).toContain(open.reference)
    expect(refs).not.toContain(far.reference) // about 11 km away
    expect(refs).not.toContain(otherBand.reference) // no frequency overlap
    const res = await act(supervisor, dup.id, 'merge', { intoCaseId: open.id })
    expect(res.status).toBe(200)
    expect(res.body.case).toMatchObject({ status: 'closed', resolution: 'duplicate', mergedIntoReference: open.reference })
    expect((await events(open.id)).map((e) => e.kind)).toContain('merged_in')
  })

  it('shows each investigator’s open workload for assignment', async () => {
    const f = await fileHere()
    const res = await supervisor.get(`/api/cases/${f.id}/investigators`).expect(200)
    const names = res.body.investigators.map((i: { name: string }) => i.name)
    expect(names).toEqual(expect.arrayContaining([investigatorUser.name, otherInvestigatorUser.name]))
    for (const i of res.body.investigators) expect(i.openCases).toEqual(expect.any(Number))
    // a new investigator of this test's own, so the file's other assignments do not count
    const newcomerUser = await makeUser(t, { role: 'investigator', office, name: 'Ivo Penhallow' })
    const newcomerId = newcomerUser.id
    const open1 = await fileHere()
    const open2 = await fileHere()
    const closed = await fileHere()
    for (const c of [open1, open2, closed]) expect((await act(supervisor, c.id, 'assign', { investigatorId: newcomerId })).status).toBe(200)
    const newcomer = await signIn(t, newcomerUser)
    expect((await act(newcomer, closed.id, 'propose-finding', { sourceDescription: 'A faulty masthead amplifier', recommendedAction: 'advise_operator', summary: 'Nothing there.' })).status).toBe(200)
    expect((await act(supervisor, closed.id, 'close', { resolution: 'no_interference_found', reason: 'Nothing found.' })).status).toBe(200)
    const after = await supervisor.get(`/api/cases/${f.id}/investigators`).expect(200)
    expect(after.body.investigators.find((i: { id: string }) => i.id === newcomerId).openCases).toBe(2)
  })

  it('sends abilities that match the person and the state', async () => {
    const f = await fileHere()
    const sup = (await supervisor.get(`/api/cases/${f.id}`)).body.case.abilities
    const inv = (await investigator.get(`/api/cases/${f.id}`)).body.case.abilities
    expect(sup).toMatchObject({ triage: true, assign: true, dismiss: true, close: false, startFieldWork: false })
    expect(inv).toMatchObject({ triage: false, assign: false, startFieldWork: false, addInternalNote: true, messageComplainant: false })
  })
})

describe('two supervisors at once', () => {
  it('exactly one succeeds, the other gets 409, and nothing is half-written', async () => {
    const second = await signIn(t, await makeUser(t, { role: 'supervisor', office, name: 'Ruth Calder' }))
    for (let round = 0; round < 5; round++) {
      const f = await fileHere()
      const [a, b] = await Promise.all([
        supervisor.post(`/api/cases/${f.id}/triage`).send({ version: 1, priority: 2 }),
        second.post(`/api/cases/${f.id}/assign`).send({ version: 1, investigatorId }),
      ])
      expect([a.status, b.status].sort()).toEqual([200, 409])
      const loser = a.status === 409 ? a : b
      expect(loser.body.error.code).toBe('stale_version')
      expect(loser.body.error.message).toMatch(/Someone else changed this case/)
      const moves = (await events(f.id)).filter((e) => e.to_state && e.kind !== 'received')
      expect(moves).toHaveLength(1)
      expect(await caseVersion(t.pool, f.id)).toBe(2)
    }
  })
})

describe('two supervisors merge a pair of reports into each other at once', () => {
  it('one merge wins and the other is refused on the field: never both closed as duplicates of each other', async () => {
    const second = await signIn(t, await makeUser(t, { role: 'supervisor', office, name: 'Owen Tarrant' }))
    for (let round = 0; round < 5; round++) {
      const a = await fileHere()
      const b = await fileHere()
      const [ra, rb] = await Promise.all([
        supervisor.post(`/api/cases/${a.id}/merge`).send({ version: 1, intoCaseId: b.id }),
        second.post(`/api/cases/${b.id}/merge`).send({ version: 1, intoCaseId: a.id }),
      ])
      expect([ra.status, rb.status].sort(), JSON.stringify([ra.body.error, rb.body.error])).toEqual([200, 400])
      const loser = ra.status === 400 ? ra : rb
      expect(loser.body.error.details[0].path).toBe('intoCaseId')
      const { rows } = await t.pool.query(`SELECT id, status, merged_into_case_id FROM cases WHERE id = ANY($1) ORDER BY status`, [[a.id, b.id]])
      const [closed, open] = rows
      expect(closed.status).toBe('closed')
      expect(open.status).toBe('received')
      expect(closed.merged_into_case_id).toBe(open.id)
      expect(open.merged_into_case_id).toBeNull()
    }
  })
})

/**
 * The rule for merged reports: a merge follows the chain to the open case at its end; reports
 * merged into a case follow it when it is merged in turn; a case holding merged reports is not
 * closed at triage. So a merged report never points at a case closed in any other way than by
 * a finding, whatever order concurrent moves take.
 */
describe('merged reports', () => {
  const mergedInto = async (id: string) => (await t.pool.query(`SELECT status, resolution, merged_into_case_id FROM cases WHERE id = $1`, [id])).rows[0]
  const merge = (agent: Agent, from: string, into: string) => agent.post(`/api/cases/${from}/merge`).send({ version: 1, intoCaseId: into })
  const dismiss = (agent: Agent, id: string) => agent.post(`/api/cases/${id}/dismiss`).send({ version: 1, resolution: 'referred', reason: 'A matter for the aviation authority.' })
  let second: Agent
  beforeAll(async () => {
    second = await signIn(t, await makeUser(t, { role: 'supervisor', office, name: 'Petra Hollis' }))
  })

  it('refuse closing at triage a case that holds merged reports (409), say why, and show no such action', async () => {
    const a = await fileHere()
    const b = await fileHere()
    expect((await merge(supervisor, a.id, b.id)).status).toBe(200)
    const res = await dismiss(supervisor, b.id)
    expect(res.status).toBe(409)
    expect(res.body.error.code).toBe('holds_merged_reports')
    expect(res.body.error.message).toContain(a.reference)
    expect(res.body.error.message).toMatch(/close it with a finding, or merge it into another open case \(the merged reports follow it there\)/)
    expect((await state(b.id)).status).toBe('received')
    expect((await supervisor.get(`/api/cases/${b.id}`)).body.case.abilities).toMatchObject({ dismiss: false, merge: true, assign: true })
  })

  it('carry the reports merged into a case along when it is merged in turn', async () => {
    const a = await fileHere()
    const b = await fileHere()
    const c = await fileHere()
    expect((await merge(supervisor, a.id, b.id)).status).toBe(200)
    expect((await merge(supervisor, b.id, c.id)).status).toBe(200)
    expect(await mergedInto(a.id)).toMatchObject({ status: 'closed', resolution: 'duplicate', merged_into_case_id: c.id })
    expect(await mergedInto(b.id)).toMatchObject({ status: 'closed', resolution: 'duplicate', merged_into_case_id: c.id })
    expect((await events(a.id)).map((e) => e.kind)).toContain('merge_followed')
    expect((await events(c.id)).filter((e) => e.kind === 'merged_in')).toHaveLength(2)
  })

  it('follow the chain: merging into a case merged meanwhile lands on the open case it went to', async () => {
    const a = await fileHere()
    const b = await fileHere()
    const c = await fileHere()
    expect((await merge(supervisor, b.id, c.id)).status).toBe(200)
    const res = await merge(supervisor, a.id, b.id)
    expect(res.status).toBe(200)
    expect(res.body.case).toMatchObject({ mergedIntoCaseId: c.id, mergedIntoReference: c.reference })
    expect((await events(a.id)).find((e) => e.kind === 'merge')!.body).toBe(`Merged into ${c.reference} (${b.reference} had been merged into it).`)
  })

  it('refuse a merge into a case closed in any other way (400 on the field)', async () => {
    const a = await fileHere()
    const b = await fileHere()
    expect((await dismiss(supervisor, b.id)).status).toBe(200)
    const res = await merge(supervisor, a.id, b.id)
    expect(res.status).toBe(400)
    expect(res.body.error.details[0].path).toBe('intoCaseId')
    expect((await state(a.id)).status).toBe('received')
  })

  it('under a merge and a dismissal of its target at once: exactly one wins, never a report merged into a dismissed case', async () => {
    for (let round = 0; round < 6; round++) {
      const a = await fileHere()
      const b = await fileHere()
      const [m, d] = await Promise.all([merge(supervisor, a.id, b.id), dismiss(second, b.id)])
      expect([m.status, d.status].filter((s) => s === 200), JSON.stringify([m.body.error, d.body.error])).toHaveLength(1)
      if (m.status === 200) {
        expect(d.status).toBe(409)
        expect(d.body.error.code).toBe('holds_merged_reports')
        expect(await mergedInto(a.id)).toMatchObject({ status: 'closed', merged_into_case_id: b.id })
        expect((await state(b.id)).status).toBe('received')
      } else {
        expect(m.status).toBe(400)
        expect(await mergedInto(a.id)).toMatchObject({ status: 'received', merged_into_case_id: null })
        expect(await mergedInto(b.id)).toMatchObject({ status: 'closed', resolution: 'referred' })
      }
    }
  })

  it('under two merges racing along a chain (A into B, B into C): both succeed and both reports end in C, which stays open', async () => {
    for (let round = 0; round < 6; round++) {
      const a = await fileHere()
      const b = await fileHere()
      const c = await fileHere()
      const [ab, bc] = await Promise.all([merge(supervisor, a.id, b.id), merge(second, b.id, c.id)])
      expect([ab.status, bc.status], JSON.stringify([ab.body.error, bc.body.error])).toEqual([200, 200])
      expect(await mergedInto(a.id)).toMatchObject({ status: 'closed', resolution: 'duplicate', merged_into_case_id: c.id })
      expect(await mergedInto(b.id)).toMatchObject({ status: 'closed', resolution: 'duplicate', merged_into_case_id: c.id })
      expect(await mergedInto(c.id)).toMatchObject({ status: 'received', merged_into_case_id: null })
    }
  })
})

describe('the timeline', () => {
  it('refuses UPDATE and DELETE in the database (the app role has no such right; the trigger stops even the owner)', async () => {
    const f = await fileHere()
    await expect(t.pool.query(`UPDATE case_events SET body = 'changed' WHERE case_id = $1`, [f.id])).rejects.toThrow(/permission denied|append-only/)
    await expect(t.pool.query(`DELETE FROM case_events WHERE case_id = $1`, [f.id])).rejects.toThrow(/permission denied|append-only/)
    const owner = new pg.Client({ connectionString: inject('migrationDatabaseUrl') })
    await owner.connect()
    try {
      await expect(owner.query(`UPDATE case_events SET body = 'changed' WHERE case_id = $1`, [f.id])).rejects.toThrow(/append-only/)
      await expect(owner.query(`DELETE FROM case_events WHERE case_id = $1`, [f.id])).rejects.toThrow(/append-only/)
    } finally {
      await owner.end()
    }
  })

  it('keeps internal notes apart from messages to the complainant, and e-mails only the latter', async () => {
    const f = await caseIn('assigned')
    const mailsBefore = (await queuedMails(t.pool, f.email)).length
    await investigator.post(`/api/cases/${f.id}/notes`).send({ body: 'Licence register: no station within 1 km.', visibility: 'internal' }).expect(201)
    await investigator.post(`/api/cases/${f.id}/notes`).send({ body: 'Which floor is your antenna on?', visibility: 'complainant', requestsInformation: true }).expect(201)
    const mails = await queuedMails(t.pool, f.email)
    expect(mails.length).toBe(mailsBefore + 1)
    expect(mails.at(-1)!.subject).toContain('We need some information from you')
    const detail = (await supervisor.get(`/api/cases/${f.id}`)).body.case
    const notes = detail.timeline.filter((e: { kind: string }) => ['note', 'information_requested'].includes(e.kind))
    expect(notes.map((e: { visibility: string }) => e.visibility)).toEqual(['internal', 'complainant'])
  })

  it('refuses a message to the complainant from an investigator not on the case', async () => {
    const f = await caseIn('assigned')
    const res = await otherInvestigator.post(`/api/cases/${f.id}/notes`).send({ body: 'Hello', visibility: 'complainant' })
    expect(res.status).toBe(403)
  })
})
