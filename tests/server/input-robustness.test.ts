/**
 * Odd input never breaks the API: every state-changing route, called as anonymous and as each
 * role with odd values in each field (nulls, arrays, objects, huge numbers, control characters,
 * unicode, wrong types) and with odd whole bodies, answers a 4xx or a 2xx — never a 500 — and
 * every error uses the one body shape. Odd ids in paths and repeated query parameters likewise.
 * A state-changing route missing from the FUZZ table fails the first test: new routes join it.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { createTestContext, uniqueAddress, type TestContext } from '../support/harness'
import { listRoutes } from '../support/routes'
import { caseVersion, fileReport, validReport } from '../support/cases'
import { makeBandLimit, makeOffice, makeUser, reportNear, signIn, type TestUser } from '../support/factories'
import type { Office } from '../../server/db/schema'
import { addEquipment } from '../../server/modules/equipment/equipment.service'
import { recordMeasurement } from '../../server/modules/measurements/measurements.service'
import { addFollowUp, moveFollowUp } from '../../server/modules/follow-ups/follow-ups.service'
import { equipmentContentSchema, measurementContentSchema } from '../../shared/schemas/measurements'

type Who = 'anonymous' | 'complainant' | 'investigator' | 'supervisor' | 'admin'
const WHO: Who[] = ['anonymous', 'complainant', 'investigator', 'supervisor', 'admin']
/** This file's own accounts (made in beforeAll); the staff belong to its own office. */
let ACCOUNT: Record<Exclude<Who, 'anonymous'>, TestUser>
let ownOffice: Office
type Agent = ReturnType<typeof request.agent>

/** Values put in place of one field at a time. */
const ODD_VALUES: unknown[] = [
  null,
  true,
  0,
  -1,
  1.5,
  1e308,
  -1e308,
  2 ** 53 + 2,
  '',
  '   ',
  '\u0000',
  'a\u0000b',
  'x'.repeat(5000),
  '💥 ünïcødé ‮ right-to-left ‭ 𝔘𝔫𝔦',
  '\ud800 lone surrogate',
  "' OR 1=1; --",
  '<script>alert(1)</script>',
  '-'.repeat(36),
  'a'.repeat(36),
  '00000000-0000-0000-0000-000000000000',
  '0000-01-01',
  '1e400',
  'NaN',
  [],
  ['a', 'b'],
  {},
  { $gt: '' },
]

/** Whole bodies sent as they are (raw JSON text, or another content type). */
const ODD_BODIES: { type: string; raw: string }[] = [
  { type: 'application/json', raw: 'null' },
  { type: 'application/json', raw: '[]' },
  { type: 'application/json', raw: '[1,2,3]' },
  { type: 'application/json', raw: '"just text"' },
  { type: 'application/json', raw: '12345' },
  { type: 'application/json', raw: '{}' },
  { type: 'application/json', raw: '{"__proto__":{"role":"admin"},"constructor":{"prototype":{"x":1}}}' },
  { type: 'application/json', raw: '{"a":' },
  { type: 'application/json', raw: '{"version":1e400,"priority":-1e400,"p1":1e400,"active":1e400,"frequencyFrom":1e400}' },
  { type: 'application/json', raw: '['.repeat(5000) + ']'.repeat(5000) },
  { type: 'text/plain', raw: 'hello' },
  { type: 'application/x-www-form-urlencoded', raw: 'a=b&a=c&version=1' },
]

type CaseState = 'received' | 'assigned' | 'finding_proposed' | 'closed'

interface Ids {
  ownOfficeId: string
  otherOfficeId: string
  investigatorId: string
  throwawayUserId: string
  /** An open case of the own office that merges are pointed at. */
  mergeTargetId: string
}

/**
 * One state-changing route: where to send it, and a body that passes validation so that each
 * odd field is the only thing wrong with it. `path(renew)` is asked again with renew = true
 * after a request succeeded, so that moves keep reaching the code that writes.
 */
interface FuzzRow {
  route: string
  path: (renew: boolean) => Promise<string>
  base: () => Promise<Record<string, unknown>>
}

let t: TestContext
let ids: Ids
let supervisor: Agent
let investigator: Agent
let complainant: Agent

beforeAll(async () => {
  t = await createTestContext()
  ownOffice = await makeOffice(t)
  const otherOffice = await makeOffice(t)
  ACCOUNT = {
    complainant: await makeUser(t, { role: 'complainant' }),
    investigator: await makeUser(t, { role: 'investigator', office: ownOffice }),
    supervisor: await makeUser(t, { role: 'supervisor', office: ownOffice }),
    admin: await makeUser(t, { role: 'admin' }),
  }
  const throwawayEmail = `fuzz-throwaway-${process.pid}-${Date.now()}@example.test`
  await request(t.app)
    .post('/api/auth/register')
    .set('X-Forwarded-For', uniqueAddress())
    .send({ name: 'Fuzz Throwaway', email: throwawayEmail, password: 'a-long-enough-pass' })
    .expect(202)
  supervisor = await signIn(t, ACCOUNT.supervisor)
  investigator = await signIn(t, ACCOUNT.investigator)
  complainant = await signIn(t, ACCOUNT.complainant)
  ids = {
    ownOfficeId: ownOffice.id,
    otherOfficeId: otherOffice.id,
    investigatorId: ACCOUNT.investigator.id,
    throwawayUserId: (await t.pool.query(`SELECT id FROM users WHERE email = $1`, [throwawayEmail])).rows[0].id,
    mergeTargetId: (await fileHere()).id,
  }
})
afterAll(() => t.close())

/** A report filed beside this file's own office. */
const fileHere = () => fileReport(t, reportNear(ownOffice))

/** A fresh case of the own office moved to `state` along the usual path. */
async function caseIn(state: CaseState): Promise<string> {
  const f = await fileHere()
  const move = async (agent: Agent, path: string, body: Record<string, unknown>) =>
    agent.post(`/api/cases/${f.id}/${path}`).send({ version: await caseVersion(t.pool, f.id), ...body }).expect(200)
  if (state === 'received') return f.id
  await move(supervisor, 'assign', { investigatorId: ids.investigatorId })
  if (state === 'assigned') return f.id
  await move(investigator, 'propose-finding', { sourceDescription: 'A faulty masthead amplifier', recommendedAction: 'advise_operator', summary: 'Faulty amplifier at the marina.' })
  if (state === 'finding_proposed') return f.id
  await move(supervisor, 'close', { resolution: 'source_corrected', reason: 'The owner replaced it.' })
  return f.id
}

/** A case route whose case is made afresh in `state` whenever a request succeeded. */
function caseRow(sub: string, state: CaseState, body: () => Record<string, unknown>): FuzzRow {
  let caseId: string | undefined
  return {
    route: `POST /api/cases/:id/${sub}`,
    async path(renew) {
      if (!caseId || renew) caseId = await caseIn(state)
      return `/api/cases/${caseId}/${sub}`
    },
    async base() {
      return { version: await caseVersion(t.pool, caseId!), ...body() }
    },
  }
}

/** A complainant route: through a tracking link, or as this file's signed-in complainant. */
function complainantRow(route: string, body: Record<string, unknown>): FuzzRow {
  let target: string | undefined
  const viaLink = route.includes(':token')
  return {
    route,
    async path(renew) {
      if (!target || renew) {
        if (viaLink) target = (await fileHere()).trackingToken
        else {
          const res = await complainant.post('/api/reports').set('X-Forwarded-For', uniqueAddress()).send(validReport({ email: ACCOUNT.complainant.email, ...reportNear(ownOffice) })).expect(201)
          target = (await t.pool.query(`SELECT id FROM cases WHERE reference = $1`, [res.body.reference])).rows[0].id
        }
      }
      return route.split(' ')[1]!.replace(/:token|:id/, target!)
    },
    base: async () => body,
  }
}

/** Storing a calculation on a case being worked (a new case whenever one was stored). */
function calculationRow(): FuzzRow {
  let caseId: string | undefined
  return {
    route: 'POST /api/cases/:id/calculations',
    async path(renew) {
      if (!caseId || renew) caseId = await caseIn('assigned')
      return `/api/cases/${caseId}/calculations`
    },
    base: async () => ({
      kind: 'eirp_single_point',
      inputs: { measurement: { kind: 'field-strength', fieldStrengthDbuvPerM: '74.77 dBµV/m', freqHz: '100 MHz' }, distanceM: '1 km', model: { kind: 'free-space', freqHz: '100 MHz' } },
    }),
  }
}

/** Editing a band-limit entry of this file's own (a fresh entry, at version 1, after each edit). */
function bandLimitRow(): FuzzRow {
  let id: string | undefined
  return {
    route: 'PATCH /api/band-limits/:id',
    async path(renew) {
      if (!id || renew) id = (await makeBandLimit(t)).id
      return `/api/band-limits/${id}`
    },
    base: async () => ({ changes: { citation: 'Fuzzed citation, clause 2' }, reason: 'Fuzzing the edit', version: 1 }),
  }
}

/** A measurement as a form sends it. */
const MEASUREMENT = { takenAt: '2026-11-20T10:15:00Z', latDeg: '48.1', lonDeg: '-31.35', freqHz: '433.92 MHz', reading: { unit: 'dBm', value: '-60' }, antenna: { source: 'gain', antennaGainDbi: '2 dBi' } }

/** An item of the own office's register at version 1 (a fresh one after each edit). */
function equipmentRow(): FuzzRow {
  let id: string | undefined
  return {
    route: 'PATCH /api/equipment/:id',
    async path(renew) {
      if (!id || renew) id = (await addEquipment(t.services, ACCOUNT.supervisor.actor, ids.ownOfficeId, equipmentContentSchema.parse({ name: 'Fuzz receiver', type: 'receiver' }))).id
      return `/api/equipment/${id}`
    },
    base: async () => ({ item: { name: 'Fuzz receiver 2', type: 'receiver' }, version: 1 }),
  }
}

/** Recording a measurement on a case being worked; editing and correcting one (a fresh one after each success). */
function measurementRow(route: 'POST /api/cases/:id/measurements' | 'PATCH /api/measurements/:id' | 'POST /api/measurements/:id/corrections'): FuzzRow {
  let target: string | undefined
  return {
    route,
    async path(renew) {
      if (!target || renew) {
        const caseId = await caseIn('assigned')
        target = route === 'POST /api/cases/:id/measurements' ? caseId : (await recordMeasurement(t.services, ACCOUNT.supervisor.actor, caseId, measurementContentSchema.parse(MEASUREMENT))).id
      }
      return route.split(' ')[1]!.replace(':id', target)
    },
    base: async () => (route === 'PATCH /api/measurements/:id' ? { measurement: MEASUREMENT, version: 1 } : { measurement: MEASUREMENT }),
  }
}

/** A case's enforcement records (responsible party, notices, replies, follow-ups) on a case of the own office. */
function enforcementRow(sub: 'responsible-party' | 'notices' | 'party-replies' | 'follow-ups', body: Record<string, unknown>): FuzzRow {
  let caseId: string | undefined
  return {
    route: `POST /api/cases/:id/${sub}`,
    async path() {
      caseId ??= (await fileHere()).id
      return `/api/cases/${caseId}/${sub}`
    },
    base: async () => body,
  }
}

/** A follow-up move on a fresh follow-up of the own office (confirmed first when the move is a reopening). */
function followUpMoveRow(move: 'confirm' | 'escalate' | 'reopen'): FuzzRow {
  let id: string | undefined
  return {
    route: `POST /api/follow-ups/:id/${move}`,
    async path(renew) {
      if (!id || renew) {
        const caseId = (await fileHere()).id
        id = (await addFollowUp(t.services, ACCOUNT.supervisor.actor, caseId, { dueOn: '2099-01-05', expected: 'Fuzz follow-up' })).id
        if (move === 'reopen') await moveFollowUp(t.services, ACCOUNT.supervisor.actor, id, 'confirm', { version: 1, note: 'Fuzz confirm' })
      }
      return `/api/follow-ups/${id}/${move}`
    },
    base: async () => ({ version: move === 'reopen' ? 2 : 1, note: 'Fuzz note' }),
  }
}

const fixed = (route: string, path: () => string, body: () => Record<string, unknown>): FuzzRow => ({
  route,
  path: async () => path(),
  base: async () => body(),
})

const FUZZ_AREA = { type: 'Polygon', coordinates: [[[2, 73], [3, 73], [3, 74], [2, 74], [2, 73]]] }

const NO_SUCH_UPLOAD = '5d2f0c3e-8a41-4c55-9b0e-2f7a9c1d6e40'

const FUZZ: FuzzRow[] = [
  fixed('POST /api/auth/sign-in', () => '/api/auth/sign-in', () => ({ email: `fuzz-nobody-${process.pid}@example.test`, password: 'not-the-password' })),
  fixed('POST /api/auth/sign-out', () => '/api/auth/sign-out', () => ({})),
  fixed('POST /api/auth/register', () => '/api/auth/register', () => ({ name: 'Fuzz Person', email: `fuzz-register-${process.pid}@example.test`, password: 'a-long-enough-pass' })),
  fixed('POST /api/auth/confirm-email', () => '/api/auth/confirm-email', () => ({ token: 'x'.repeat(43) })),
  fixed('POST /api/auth/password-reset', () => '/api/auth/password-reset', () => ({ email: `fuzz-nobody-${process.pid}@example.test` })),
  fixed('POST /api/auth/set-password', () => '/api/auth/set-password', () => ({ token: 'x'.repeat(43), password: 'long-enough-password' })),
  fixed('POST /api/admin/users', () => '/api/admin/users', () => ({ name: 'Fuzz Staff', email: `fuzz-staff-${process.pid}@quietband.test`, role: 'investigator', officeId: ids.otherOfficeId })),
  // the throwaway account is a complainant: a complainant's own role, no office (a change that changes nothing)
  fixed('PATCH /api/admin/users/:id', () => `/api/admin/users/${ids.throwawayUserId}`, () => ({ active: true, role: 'complainant', officeId: null })),
  // the office's own targets: no single odd field below makes a valid set, so nothing changes
  fixed('PUT /api/offices/:id/response-targets', () => `/api/offices/${ids.ownOfficeId}/response-targets`, () => ({ p1: 4, p2: 24, p3: 72, p4: 240 })),
  fixed('PUT /api/offices/:id/first-response-targets', () => `/api/offices/${ids.ownOfficeId}/first-response-targets`, () => ({ p1: 1, p2: 8, p3: 24, p4: 72 })),
  fixed('PUT /api/offices/:id/time-zone', () => `/api/offices/${ids.ownOfficeId}/time-zone`, () => ({ timeZone: 'Atlantic/Azores' })),
  // far north, a tiny area of its own: an office the fuzz happens to create takes no other test's report
  fixed('POST /api/admin/offices', () => '/api/admin/offices', () => ({ name: `Fuzz office ${process.pid}`, latDeg: 73.5, lonDeg: 2.5, timeZone: 'UTC', area: FUZZ_AREA })),
  fixed('POST /api/admin/offices/check-area', () => '/api/admin/offices/check-area', () => ({ area: FUZZ_AREA, latDeg: 73.5, lonDeg: 2.5 })),
  fixed('PUT /api/admin/offices/:id', () => `/api/admin/offices/${ids.ownOfficeId}`, () => ({ name: `Fuzz own office ${process.pid}`, latDeg: 73.6, lonDeg: 2.6, timeZone: 'UTC', area: null, version: 999 })),
  fixed('POST /api/reports', () => '/api/reports', () => validReport(reportNear(ownOffice)) as unknown as Record<string, unknown>),
  complainantRow('POST /api/track/:token/information', { body: 'Still there at night.' }),
  complainantRow('POST /api/track/:token/withdraw', { reason: 'It stopped.' }),
  complainantRow('POST /api/my/reports/:id/information', { body: 'Also in the mornings.' }),
  complainantRow('POST /api/my/reports/:id/withdraw', { reason: 'It stopped.' }),
  calculationRow(),
  bandLimitRow(),
  fixed('POST /api/offices/:id/equipment', () => `/api/offices/${ids.ownOfficeId}/equipment`, () => ({ item: { name: 'Fuzz analyser', type: 'analyser' } })),
  equipmentRow(),
  // the register import: JSON where a file is expected, and the steps of an upload nobody made
  fixed('POST /api/station-register/uploads', () => '/api/station-register/uploads', () => ({ delimiter: 'comma' })),
  fixed('POST /api/station-register/uploads/:id/inspect', () => `/api/station-register/uploads/${NO_SUCH_UPLOAD}/inspect`, () => ({ delimiter: 'comma' })),
  fixed('POST /api/station-register/uploads/:id/preview', () => `/api/station-register/uploads/${NO_SUCH_UPLOAD}/preview`, () => ({ delimiter: 'comma', mapping: { fields: {} } })),
  fixed('POST /api/station-register/uploads/:id/confirm', () => `/api/station-register/uploads/${NO_SUCH_UPLOAD}/confirm`, () => ({ delimiter: 'comma', mapping: { fields: {} } })),
  fixed('POST /api/station-register/candidates', () => '/api/station-register/candidates', () => ({ victimPosition: { latDeg: '48.1', lonDeg: '-31.4' }, lowFreqHz: '446 MHz', highFreqHz: '446.2 MHz' })),
  // evidence: JSON where a multipart form is expected (this app has no file store), and one file nobody uploaded
  fixed('POST /api/cases/:id/evidence', () => `/api/cases/${ids.mergeTargetId}/evidence`, () => ({ kind: 'photo' })),
  complainantRow('POST /api/track/:token/evidence', { kind: 'photo' }),
  complainantRow('POST /api/my/reports/:id/evidence', { kind: 'photo' }),
  fixed('POST /api/evidence/:id/verify', () => `/api/evidence/${NO_SUCH_UPLOAD}/verify`, () => ({})),
  fixed('POST /api/evidence/:id/remove', () => `/api/evidence/${NO_SUCH_UPLOAD}/remove`, () => ({ reason: 'Filed on the wrong case.' })),
  fixed('POST /api/evidence/:id/share', () => `/api/evidence/${NO_SUCH_UPLOAD}/share`, () => ({ shared: true, note: 'Fuzz note' })),
  fixed('POST /api/evidence/:id/band', () => `/api/evidence/${NO_SUCH_UPLOAD}/band`, () => ({ lowFreqHz: '101.5 MHz', highFreqHz: 102.5e6 })),
  fixed('POST /api/evidence/:id/band-measurement', () => `/api/evidence/${NO_SUCH_UPLOAD}/band-measurement`, () => ({ lowFreqHz: '101.5 MHz', highFreqHz: '102.5 MHz', takenAt: '2026-12-01T10:00:00Z', latDeg: '48.1', lonDeg: '-31.4' })),
  // a person's saved views of the case list (several succeed: names then repeat, and the cap answers 409)
  fixed('POST /api/me/saved-views', () => '/api/me/saved-views', () => ({ name: 'Fuzz view', listQuery: 'open=true' })),
  fixed('DELETE /api/me/saved-views/:id', () => `/api/me/saved-views/${NO_SUCH_UPLOAD}`, () => ({})),
  // legal hold on a case of the own office (valid bodies set and lift holds; a lift with none in force is 409) and the office's retention period
  fixed('POST /api/cases/:id/legal-hold', () => `/api/cases/${ids.mergeTargetId}/legal-hold`, () => ({ reason: 'Fuzz hold', until: '2099-01-05' })),
  fixed('POST /api/cases/:id/legal-hold/lift', () => `/api/cases/${ids.mergeTargetId}/legal-hold/lift`, () => ({ reason: 'Fuzz lift' })),
  fixed('PUT /api/offices/:id/retention', () => `/api/offices/${ids.ownOfficeId}/retention`, () => ({ retentionMonths: 24 })),
  measurementRow('POST /api/cases/:id/measurements'),
  measurementRow('PATCH /api/measurements/:id'),
  measurementRow('POST /api/measurements/:id/corrections'),
  caseRow('notes', 'received', () => ({ body: 'Checked the register.', visibility: 'internal', requestsInformation: false })),
  caseRow('triage', 'received', () => ({ priority: 2, note: 'Looks like an outage.' })),
  caseRow('assign', 'received', () => ({ investigatorId: ids.investigatorId })),
  caseRow('transfer', 'received', () => ({ officeId: ids.otherOfficeId, reason: 'Closer office' })),
  caseRow('merge', 'received', () => ({ intoCaseId: ids.mergeTargetId })),
  caseRow('dismiss', 'received', () => ({ resolution: 'referred', reason: 'For the aviation authority' })),
  caseRow('start-field-work', 'assigned', () => ({})),
  caseRow('propose-finding', 'assigned', () => ({ sourceDescription: 'A faulty masthead amplifier', sourceLatDeg: '48.1', sourceLonDeg: '-31.35', calculationIds: [], evidenceIds: [], recommendedAction: 'advise_operator', summary: 'Found it' })),
  caseRow('return-finding', 'finding_proposed', () => ({ reason: 'More work' })),
  caseRow('close', 'finding_proposed', () => ({ resolution: 'source_corrected', reason: 'Fixed' })),
  caseRow('reopen', 'closed', () => ({ reason: 'Back again' })),
  caseRow('tracking-links/revoke', 'received', () => ({ reason: 'Fuzz: link shared by mistake' })),
  enforcementRow('responsible-party', { name: 'Fuzz party', phone: '+00 555 0100' }),
  enforcementRow('notices', { servedOn: '2026-01-05', method: 'email', summary: 'Fuzz notice' }),
  enforcementRow('party-replies', { receivedOn: '2026-01-05', summary: 'Fuzz reply' }),
  enforcementRow('follow-ups', { dueOn: '2099-01-05', expected: 'Fuzz follow-up' }),
  followUpMoveRow('confirm'),
  followUpMoveRow('escalate'),
  followUpMoveRow('reopen'),
]

async function agentFor(who: Who): Promise<Agent> {
  return who === 'anonymous' ? request.agent(t.app) : signIn(t, ACCOUNT[who])
}

/** Sends one request and checks it: a known status below 500, and the one error body. */
async function expectHandled(label: string, res: request.Response): Promise<void> {
  expect(res.status, `${label} → ${res.status} ${res.text.slice(0, 300)}`).toBeLessThan(500)
  if (res.status >= 400) {
    expect(res.body?.error, `${label} error body`).toMatchObject({ code: expect.any(String), message: expect.any(String), requestId: expect.any(String) })
    expect(res.body.error.code, label).toMatch(/^[a-z][a-z_]*$/)
  }
}

function send(agent: Agent, method: string, path: string) {
  // a distinct client address per request keeps the report and sign-in limits from deciding the answer
  return agent[method.toLowerCase() as 'post' | 'put' | 'patch'](path).set('X-Forwarded-For', uniqueAddress())
}

describe('odd input to every state-changing route', () => {
  it('covers every POST, PUT, PATCH and DELETE route of the app', () => {
    const changing = listRoutes(t.handle.api).filter((r) => !r.startsWith('GET '))
    expect(FUZZ.map((r) => r.route).sort()).toEqual(changing)
  })

  for (const row of FUZZ) {
    it(`${row.route} never answers 500, as anyone, whatever the fields hold`, async () => {
      const [method] = row.route.split(' ') as [string]
      let path = await row.path(false)
      const fields = Object.keys(await row.base())
      for (const who of WHO) {
        // a fresh session per route and role: a sign-out or a sign-in in one row must not steer another
        const agent = await agentFor(who)
        for (const field of fields) {
          for (const value of ODD_VALUES) {
            const res = await send(agent, method, path).send({ ...(await row.base()), [field]: value })
            await expectHandled(`${who} ${row.route} ${field}=${JSON.stringify(value)?.slice(0, 40)}`, res)
            if (res.status < 300) path = await row.path(true)
          }
        }
        for (const body of ODD_BODIES) {
          const res = await send(agent, method, path).set('Content-Type', body.type).send(body.raw)
          await expectHandled(`${who} ${row.route} body ${body.raw.slice(0, 40)}`, res)
        }
      }
    })
  }
})

/** Ids that are not uuids, or that PostgreSQL would refuse to read as one. */
const ODD_IDS = ['not-a-uuid', 'a'.repeat(36), '-'.repeat(36), 'g'.repeat(8) + '-0000-4000-8000-000000000000', '0'.repeat(32), `{${'0'.repeat(32)}}`, '%00', '%E0%A4%A', "1'%20OR%20'1'='1", 'x'.repeat(2000)]

describe('odd ids in paths', () => {
  const idRoutes = [
    'GET /api/cases/:id',
    'GET /api/cases/:id/merge-candidates',
    'GET /api/cases/:id/investigators',
    'GET /api/cases/:id/transfer-offices',
    'POST /api/cases/:id/notes',
    'POST /api/cases/:id/triage',
    'POST /api/cases/:id/close',
    'POST /api/cases/:id/tracking-links/revoke',
    'GET /api/my/reports/:id',
    'POST /api/my/reports/:id/information',
    'POST /api/my/reports/:id/withdraw',
    'GET /api/staff/:id',
    'GET /api/offices/:id',
    'PUT /api/offices/:id/response-targets',
    'PATCH /api/admin/users/:id',
    'GET /api/track/:token',
    'POST /api/track/:token/information',
    'POST /api/track/:token/withdraw',
    'POST /api/cases/:id/calculations',
    'GET /api/cases/:id/calculations',
    'GET /api/calculations/:id/recompute',
    'PATCH /api/band-limits/:id',
    'GET /api/band-limits/:id/history',
    'GET /api/offices/:id/equipment',
    'POST /api/offices/:id/equipment',
    'PATCH /api/equipment/:id',
    'GET /api/equipment/:id/history',
    'GET /api/cases/:id/measurements',
    'POST /api/cases/:id/measurements',
    'PATCH /api/measurements/:id',
    'POST /api/measurements/:id/corrections',
    'GET /api/cases/:id/responsible-party',
    'POST /api/cases/:id/responsible-party',
    'POST /api/cases/:id/notices',
    'POST /api/cases/:id/party-replies',
    'GET /api/cases/:id/follow-ups',
    'POST /api/cases/:id/follow-ups',
    'POST /api/follow-ups/:id/confirm',
    'POST /api/follow-ups/:id/escalate',
    'POST /api/follow-ups/:id/reopen',
  ]

  it('answer 400 or 404 with the one error body, never 500, to anyone', async () => {
    for (const who of WHO) {
      const agent = await agentFor(who)
      for (const route of idRoutes) {
        const [method, pattern] = route.split(' ') as [string, string]
        for (const id of ODD_IDS) {
          const path = pattern.replace(/:id|:token/, id)
          const call = agent[method.toLowerCase() as 'get' | 'post' | 'put' | 'patch'](path).set('X-Forwarded-For', uniqueAddress())
          const res = method === 'GET' ? await call : await call.send({ version: 1, body: 'x', reason: 'Some reason', visibility: 'internal', priority: 2, active: true })
          await expectHandled(`${who} ${method} ${path.slice(0, 80)}`, res)
          expect(res.status, `${who} ${method} ${path.slice(0, 80)}`).toBeGreaterThanOrEqual(400)
        }
      }
    }
  })

  it('a 36-character id that is not a uuid is no case (404 case_not_found), not a database error', async () => {
    const supervisor = await signIn(t, ACCOUNT.supervisor)
    for (const id of ['a'.repeat(36), '-'.repeat(36), 'abcdef01-2345-6789-abcd-ef01234567-x']) {
      const res = await supervisor.get(`/api/cases/${id}`)
      expect(res.status, id).toBe(404)
      expect(res.body.error.code).toBe('case_not_found')
    }
    const complainant = await signIn(t, ACCOUNT.complainant)
    const mine = await complainant.get(`/api/my/reports/${'b'.repeat(36)}`)
    expect(mine.status).toBe(404)
    expect(mine.body.error.code).toBe('case_not_found')
  })
})

describe('odd query strings on the case list and its export', () => {
  const queries = [
    'page=1&page=2',
    'pageSize=10&pageSize=20',
    'sort=priority&sort=status',
    'dir=asc&dir=desc',
    'q=a&q=b',
    'q=%00',
    'q=a%00b',
    'q=%25%5F%5C',
    'overdue=true&overdue=false',
    'officeId=not-a-uuid',
    'officeId=' + 'a'.repeat(36),
    'investigatorId=' + '-'.repeat(36),
    'freqFromHz=1e400',
    'freqFromHz=-1',
    'freqToHz=abc',
    'page=0',
    'page=1e9',
    'pageSize=100000',
    'status[]=received',
    'status=received&status=closed',
    'priority=1,9',
    'service=',
    'page[]=1',
    'q=' + 'x'.repeat(5000),
  ]

  it('answers 200 or 400 with the one error body, never 500', async () => {
    for (const who of ['investigator', 'supervisor', 'admin'] as const) {
      const agent = await agentFor(who)
      for (const q of queries) {
        for (const path of ['/api/cases', '/api/cases/export.csv']) {
          const res = await agent.get(`${path}?${q}`)
          await expectHandled(`${who} ${path}?${q.slice(0, 60)}`, res)
        }
      }
    }
  })

  it('answers a repeated scalar parameter with 400 validation_failed', async () => {
    const supervisor = await signIn(t, ACCOUNT.supervisor)
    for (const q of ['page=1&page=2', 'q=a&q=b', 'sort=priority&sort=status']) {
      const res = await supervisor.get(`/api/cases?${q}`)
      expect(res.status, q).toBe(400)
      expect(res.body.error.code).toBe('validation_failed')
    }
  })
})

describe('text that cannot be stored', () => {
  it('refuses U+0000 in a report, a note, a search and a name with 400 on the field, and saves nothing', async () => {
    const report = await request(t.app).post('/api/reports').set('X-Forwarded-For', uniqueAddress()).send(validReport({ description: 'Hum on the line\u0000 every evening.' }))
    expect(report.status).toBe(400)
    expect(report.body.error.details).toEqual([{ path: 'description', message: expect.stringContaining('U+0000') }])
    expect((await t.pool.query(`SELECT count(*)::int AS n FROM cases WHERE description LIKE 'Hum on the line%'`)).rows[0].n).toBe(0)

    const f = await fileHere()
    const supervisor = await signIn(t, ACCOUNT.supervisor)
    const note = await supervisor.post(`/api/cases/${f.id}/notes`).send({ body: 'a\u0000b', visibility: 'internal' })
    expect(note.status).toBe(400)
    expect(note.body.error.details[0].path).toBe('body')
    const info = await request(t.app).post(`/api/track/${f.trackingToken}/information`).send({ body: '\u0000' })
    expect(info.status).toBe(400)
    const search = await supervisor.get('/api/cases?q=a%00b')
    expect(search.status).toBe(400)
    expect(search.body.error.details[0].path).toBe('q')
    const register = await request(t.app).post('/api/auth/register').set('X-Forwarded-For', uniqueAddress()).send({ name: 'Nul\u0000Name', email: `nul-${Date.now()}@example.test`, password: 'a-long-enough-pass' })
    expect(register.status).toBe(400)
    expect(register.body.error.details[0].path).toBe('name')
  })

  it('refuses a lone UTF-16 surrogate in text that is e-mailed (a withdrawal, a message) with 400 on the field, and changes nothing', async () => {
    const f = await fileHere()
    const withdraw = await request(t.app).post(`/api/track/${f.trackingToken}/withdraw`).send({ reason: 'It stopped \ud83d' })
    expect(withdraw.status).toBe(400)
    expect(withdraw.body.error.details).toEqual([{ path: 'reason', message: expect.stringContaining('broken character') }])
    expect((await t.pool.query(`SELECT status FROM cases WHERE id = $1`, [f.id])).rows[0].status).toBe('received')
    const supervisor = await signIn(t, ACCOUNT.supervisor)
    const message = await supervisor.post(`/api/cases/${f.id}/notes`).send({ body: '\udc00 When can we visit?', visibility: 'complainant' })
    expect(message.status).toBe(400)
    expect(message.body.error.details[0].path).toBe('body')
    // a whole emoji is fine
    await supervisor.post(`/api/cases/${f.id}/notes`).send({ body: 'When can we visit? 📡', visibility: 'complainant' }).expect(201)
  })

  it('refuses a start date in year 0000 (no such year in PostgreSQL) with 400 on the field', async () => {
    const res = await request(t.app).post('/api/reports').set('X-Forwarded-For', uniqueAddress()).send(validReport({ since: '0000-01-01' }))
    expect(res.status).toBe(400)
    expect(res.body.error.details).toEqual([{ path: 'since', message: 'Enter a date from 1900 on.' }])
  })
})
