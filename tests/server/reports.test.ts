import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { createTestContext, uniqueAddress, type TestContext } from '../support/harness'
import { fileReport, queuedMails, validReport } from '../support/cases'
import { FAR_FROM_EVERY_TEST_OFFICE, makeOffice, makeUser, reportNear, signIn } from '../support/factories'
import type { Office } from '../../server/db/schema'
import { ADDITIONS_PER_HOUR_PER_CASE } from '../../server/modules/cases/case-notes.service'
import { TRACKING_GUESSES_PER_HOUR_PER_ADDRESS } from '../../server/modules/cases/public.routes'
import { FAR_FROM_EVERY_OFFICE_M } from '../../server/modules/cases/reports.service'

let t: TestContext
let office: Office // this file's own office: only its reports arrive there
beforeAll(async () => {
  t = await createTestContext()
  office = await makeOffice(t)
})
/** A report filed beside this file's office. */
const fileHere = (over: Parameters<typeof validReport>[0] = {}) => fileReport(t, { ...reportNear(office), ...over })
const officeOf = async (caseId: string) => (await t.pool.query(`SELECT office_id FROM cases WHERE id = $1`, [caseId])).rows[0].office_id as string
afterAll(() => t.close())

const post = (body: unknown) => request(t.app).post('/api/reports').set('X-Forwarded-For', uniqueAddress()).send(body as object)
/** Cases from one complainant address (other test files file reports at the same time). */
const casesFrom = async (email: string) => (await t.pool.query(`SELECT count(*)::int AS n FROM cases WHERE complainant_email = $1`, [email])).rows[0].n as number

describe('filing a report', () => {
  it('gives a reference of Quietband’s format and e-mails a private tracking link', async () => {
    const f = await fileHere()
    expect(f.reference).toMatch(/^QB-\d{2}-\d{6}$/)
    const mails = await queuedMails(t.pool, f.email)
    expect(mails).toHaveLength(1)
    expect(mails[0]!.subject).toContain(f.reference)
    expect(mails[0]!.text).toContain(`/track/${f.trackingToken}`)
    const { rows } = await t.pool.query(`SELECT count(*)::int AS n FROM case_tracking_tokens WHERE token_hash = $1`, [f.trackingToken])
    expect(rows[0].n, 'the raw token is never stored').toBe(0)
  })

  it('routes to the nearest office by geodesic distance', async () => {
    // two offices 0.5° of latitude apart (about 55 km); a place 0.1° from one is nearer to it
    const south = await makeOffice(t)
    const north = await makeOffice(t, { centreLatDeg: south.centreLatDeg + 0.5, centreLonDeg: south.centreLonDeg })
    const at = (latDeg: number) => ({ latDeg, lonDeg: south.centreLonDeg + 0.05 })
    expect(await officeOf((await fileReport(t, at(south.centreLatDeg + 0.1))).id)).toBe(south.id)
    expect(await officeOf((await fileReport(t, at(south.centreLatDeg + 0.4))).id)).toBe(north.id)
    // just either side of the midway line
    expect(await officeOf((await fileReport(t, at(south.centreLatDeg + 0.249))).id)).toBe(south.id)
    expect(await officeOf((await fileReport(t, at(south.centreLatDeg + 0.251))).id)).toBe(north.id)
  })

  it.each([
    ['maritime', 'nuisance', 1],
    ['radionavigation', 'degradation', 1],
    ['mobile_network', 'outage', 2],
    ['broadcasting', 'degradation', 3],
    ['licence_exempt', 'outage', 4],
  ] as const)('suggests priority for %s with %s as %i', async (service, experience, priority) => {
    const f = await fileHere({ service, experience })
    const { rows } = await t.pool.query(`SELECT priority, suggested_priority FROM cases WHERE id = $1`, [f.id])
    expect(rows[0]).toEqual({ priority, suggested_priority: priority })
  })

  it('e-mails the office’s supervisors at once about a safety-of-life report', async () => {
    const supervisor = await makeUser(t, { role: 'supervisor', office })
    const before = (await queuedMails(t.pool, supervisor.email)).length
    const f = await fileHere({ service: 'aeronautical', experience: 'degradation' })
    const after = await queuedMails(t.pool, supervisor.email)
    expect(after.length).toBe(before + 1)
    expect(after.at(-1)!.subject).toMatch(/Priority 1/)
    expect(after.at(-1)!.subject).toContain(f.reference)
  })

  it('links the report to a signed-in complainant, who sees it in their reports', async () => {
    const complainant = await makeUser(t, { role: 'complainant' })
    const agent = await signIn(t, complainant)
    const res = await agent.post('/api/reports').send(validReport({ email: complainant.email, ...reportNear(office) })).expect(201)
    const mine = await agent.get('/api/my/reports').expect(200)
    expect(mine.body.reports.map((r: { reference: string }) => r.reference)).toContain(res.body.reference)
  })
})

describe('a report with bad input', () => {
  it('lists every field error and saves nothing', async () => {
    const res = await post({ name: '', email: 'nope', frequencyFrom: -3, frequencyUnit: 'MHz', latDeg: 95 }).expect(400)
    const paths = res.body.error.details.map((d: { path: string }) => d.path)
    for (const p of ['name', 'email', 'service', 'frequencyFrom', 'address', 'latDeg', 'lonDeg', 'since', 'pattern', 'experience', 'description']) expect(paths).toContain(p)
    // one bad field in an otherwise good report: still nothing saved
    const almost = validReport({ latDeg: 95 })
    await post(almost).expect(400)
    expect(await casesFrom(almost.email)).toBe(0)
  })

  it('refuses an upper frequency below the lower one, and a frequency above 3 THz', async () => {
    const a = await post(validReport({ frequencyFrom: 900, frequencyTo: 800 })).expect(400)
    expect(a.body.error.details).toEqual([expect.objectContaining({ path: 'frequencyTo' })])
    const b = await post(validReport({ frequencyFrom: 4000, frequencyTo: undefined, frequencyUnit: 'GHz' })).expect(400)
    expect(b.body.error.details[0].path).toBe('frequencyFrom')
  })

  it('treats a blank latitude or longitude as missing, never as zero', async () => {
    const res = await post({ ...validReport(), latDeg: '', lonDeg: ' ' }).expect(400)
    expect(res.body.error.details.map((d: { path: string }) => d.path).sort()).toEqual(['latDeg', 'lonDeg'])
  })

  it('refuses oversize text with 400', async () => {
    const res = await post(validReport({ description: 'x'.repeat(4001) })).expect(400)
    expect(res.body.error.details[0].path).toBe('description')
  })

  it('refuses a filled honeypot field', async () => {
    const report = validReport()
    const res = await post({ ...report, website: 'http://spam.example' }).expect(400)
    expect(res.body.error.details[0].path).toBe('website')
    expect(await casesFrom(report.email)).toBe(0)
  })

  it('asks for the hours when it happens at certain hours', async () => {
    const res = await post(validReport({ pattern: 'certain_hours' })).expect(400)
    expect(res.body.error.details[0].path).toBe('patternDetail')
  })

  it('limits reports per address (429 after the hourly allowance)', async () => {
    const address = uniqueAddress()
    let last = 0
    for (let i = 0; i < 11; i++) last = (await request(t.app).post('/api/reports').set('X-Forwarded-For', address).send({})).status
    expect(last).toBe(429)
  })
})

describe('numbers, dates and places in a report', () => {
  it.each([
    ['latDeg', false],
    ['latDeg', []],
    ['frequencyFrom', true],
    ['frequencyFrom', '0x10'],
    ['frequencyTo', { value: 1785 }],
  ])('refuses %s = %j with 400 on that field and stores nothing', async (field, input) => {
    const report = validReport({ [field]: input })
    const res = await post(report).expect(400)
    expect(res.body.error.code).toBe('validation_failed')
    expect(res.body.error.details).toEqual([{ path: field, message: expect.stringMatching(/as a decimal number/) }])
    expect(await casesFrom(report.email)).toBe(0)
  })

  it('refuses a subnormal frequency (1e-320 kHz) instead of storing it', async () => {
    const report = validReport({ frequencyFrom: 1e-320, frequencyTo: undefined, frequencyUnit: 'kHz' })
    const res = await post(report).expect(400)
    expect(res.body.error.details).toEqual([{ path: 'frequencyFrom', message: 'The frequency is too close to zero to be a real value.' }])
    expect(await casesFrom(report.email)).toBe(0)
  })

  it('stores a frequency typed as text with a decimal comma or its own unit, exactly in Hz', async () => {
    const f = await fileReport(t, { frequencyFrom: '433,92', frequencyTo: '434.79 MHz', frequencyUnit: 'MHz', latDeg: '48,1', lonDeg: '−31.35' })
    const { rows } = await t.pool.query(`SELECT freq_low_hz, freq_high_hz, lat_deg, lon_deg FROM cases WHERE id = $1`, [f.id])
    expect(rows[0]).toEqual({ freq_low_hz: 433_920_000, freq_high_hz: 434_790_000, lat_deg: 48.1, lon_deg: -31.35 })
  })

  it('refuses a start date in the future with a plain message', async () => {
    const report = validReport({ since: '2999-01-01' })
    const res = await post(report).expect(400)
    expect(res.body.error.details).toEqual([{ path: 'since', message: 'The date it started cannot be in the future.' }])
    expect(await casesFrom(report.email)).toBe(0)
  })

  it(`files a report far from every office (over ${FAR_FROM_EVERY_OFFICE_M / 1000} km) but warns the reporter and flags the case`, async () => {
    const report = validReport(FAR_FROM_EVERY_TEST_OFFICE) // far in the north, away from the demo region and every test office
    const res = await post(report).expect(201)
    expect(res.body.warnings).toEqual([{ code: 'far_from_offices', path: 'latDeg', message: expect.stringMatching(/^The place you gave is \d+ km from our nearest field office/) }])
    const { rows } = await t.pool.query(`SELECT e.kind, e.visibility, e.body FROM case_events e JOIN cases c ON c.id = e.case_id WHERE c.reference = $1 AND e.kind = 'far_from_offices'`, [res.body.reference])
    expect(rows).toEqual([{ kind: 'far_from_offices', visibility: 'internal', body: expect.stringMatching(/^Check the location/) }])
  })

  it('gives no warning for a report near an office', async () => {
    const res = await post(validReport(reportNear(office))).expect(201)
    expect(res.body.warnings).toEqual([])
  })
})

describe('tracking links', () => {
  it('open the complainant’s own report and never another one', async () => {
    const a = await fileHere()
    const b = await fileHere()
    const ra = await request(t.app).get(`/api/track/${a.trackingToken}`).expect(200)
    const rb = await request(t.app).get(`/api/track/${b.trackingToken}`).expect(200)
    expect(ra.body.report.reference).toBe(a.reference)
    expect(rb.body.report.reference).toBe(b.reference)
    // the token of A cannot act on B: there is no parameter to name another case
    await request(t.app).post(`/api/track/${a.trackingToken}/information`).send({ body: 'More detail from A' }).expect(201)
    const rb2 = await request(t.app).get(`/api/track/${b.trackingToken}`).expect(200)
    expect(JSON.stringify(rb2.body)).not.toContain('More detail from A')
  })

  it('answer 404 for an unknown or revoked token', async () => {
    const res = await request(t.app).get(`/api/track/${'A'.repeat(43)}`).expect(404)
    expect(res.body.error.code).toBe('tracking_not_found')
    const f = await fileHere()
    await t.pool.query(`UPDATE case_tracking_tokens SET revoked_at = now() WHERE case_id = $1`, [f.id])
    await request(t.app).get(`/api/track/${f.trackingToken}`).expect(404)
  })

  it('show the complainant no internal notes and no staff names', async () => {
    const f = await fileHere()
    const supervisor = await makeUser(t, { role: 'supervisor', office, name: 'Sade Okafor' })
    const sup = await signIn(t, supervisor)
    await sup.post(`/api/cases/${f.id}/notes`).send({ body: 'Internal: likely the marina amplifier', visibility: 'internal' }).expect(201)
    const view = await request(t.app).get(`/api/track/${f.trackingToken}`).expect(200)
    const text = JSON.stringify(view.body)
    expect(text).not.toContain('marina amplifier')
    expect(text).not.toContain(supervisor.name)
  })

  it('and the staff case page are never stored by a browser or a proxy (Cache-Control: no-store)', async () => {
    const f = await fileHere()
    const view = await request(t.app).get(`/api/track/${f.trackingToken}`).expect(200)
    expect(view.headers['cache-control']).toBe('no-store')
    const sup = await signIn(t, await makeUser(t, { role: 'supervisor', office }))
    expect((await sup.get(`/api/cases/${f.id}`).expect(200)).headers['cache-control']).toBe('no-store')
    expect((await sup.get('/api/cases/export.csv').expect(200)).headers['cache-control']).toBe('no-store')
    expect((await request(t.app).get(`/api/track/${'A'.repeat(43)}`).expect(404)).headers['cache-control']).toBe('no-store')
  })

  it('let the complainant withdraw once; a second withdrawal is 409 invalid_transition', async () => {
    const f = await fileHere()
    const res = await request(t.app).post(`/api/track/${f.trackingToken}/withdraw`).send({ reason: 'It stopped' }).expect(200)
    expect(res.body.report).toMatchObject({ step: 'closed', resolution: 'withdrawn' })
    const again = await request(t.app).post(`/api/track/${f.trackingToken}/withdraw`).send({}).expect(409)
    expect(again.body.error.code).toBe('invalid_transition')
  })
})

describe('tracking links under abuse', () => {
  it(`refuse an address with 429 after ${TRACKING_GUESSES_PER_HOUR_PER_ADDRESS} links that do not open, while other addresses are served`, async () => {
    const f = await fileHere()
    const address = uniqueAddress()
    const guess = (token: string) => request(t.app).get(`/api/track/${token}`).set('X-Forwarded-For', address)
    // opening a good link does not count
    await guess(f.trackingToken).expect(200)
    for (let i = 0; i < TRACKING_GUESSES_PER_HOUR_PER_ADDRESS; i++) await guess(`guess${String(i).padStart(40, '0')}`).expect(404)
    const refused = await guess(`guess${'9'.repeat(40)}`).expect(429)
    expect(refused.body.error).toEqual({ code: 'too_many_tracking_attempts', message: expect.stringMatching(/^Too many tracking links that do not work/), requestId: expect.any(String) })
    await guess(f.trackingToken).expect(429)
    await request(t.app).post(`/api/track/${f.trackingToken}/information`).set('X-Forwarded-For', address).send({ body: 'More' }).expect(429)
    await request(t.app).get(`/api/track/${f.trackingToken}`).set('X-Forwarded-For', uniqueAddress()).expect(200)
  })

  it(`take ${ADDITIONS_PER_HOUR_PER_CASE} additions per case per hour, then answer 429 and store nothing more`, async () => {
    const f = await fileHere()
    const add = (i: number) => request(t.app).post(`/api/track/${f.trackingToken}/information`).set('X-Forwarded-For', uniqueAddress()).send({ body: `Addition ${i}: ${'x'.repeat(4000 - 20)}` })
    for (let i = 0; i < ADDITIONS_PER_HOUR_PER_CASE; i++) await add(i).expect(201)
    const refused = await add(99).expect(429)
    expect(refused.body.error).toEqual({ code: 'too_many_additions', message: expect.stringMatching(/^This report has had \d+ additions in the last hour/), requestId: expect.any(String) })
    const { rows } = await t.pool.query(`SELECT count(*)::int AS n FROM case_events WHERE case_id = $1 AND kind = 'complainant_information'`, [f.id])
    expect(rows[0].n).toBe(ADDITIONS_PER_HOUR_PER_CASE)
  })

  it('hold the additions limit when many arrive at once', async () => {
    const f = await fileHere()
    const results = await Promise.all(
      Array.from({ length: ADDITIONS_PER_HOUR_PER_CASE + 8 }, (_, i) => request(t.app).post(`/api/track/${f.trackingToken}/information`).set('X-Forwarded-For', uniqueAddress()).send({ body: `Parallel ${i}` })),
    )
    expect(results.filter((r) => r.status === 201)).toHaveLength(ADDITIONS_PER_HOUR_PER_CASE)
    expect(results.filter((r) => r.status === 429)).toHaveLength(8)
    const { rows } = await t.pool.query(`SELECT count(*)::int AS n FROM case_events WHERE case_id = $1 AND kind = 'complainant_information'`, [f.id])
    expect(rows[0].n).toBe(ADDITIONS_PER_HOUR_PER_CASE)
  })
})

describe('the complainant’s view through a whole case', () => {
  it('carries only the report, plain steps, messages meant for them and the closing summary — no internal text, staff names or staff addresses', async () => {
    const supervisorUser = await makeUser(t, { role: 'supervisor', office, name: 'Sade Okafor' })
    const investigatorUser = await makeUser(t, { role: 'investigator', office, name: 'Marta Ferreira' })
    const complainantUser = await makeUser(t, { role: 'complainant' })
    const sup = await signIn(t, supervisorUser)
    const inv = await signIn(t, investigatorUser)
    const complainant = await signIn(t, complainantUser)
    const filed = await complainant.post('/api/reports').set('X-Forwarded-For', uniqueAddress()).send(validReport({ email: complainantUser.email, phone: '+99 555 0101', ...reportNear(office) })).expect(201)
    const { rows } = await t.pool.query(`SELECT id FROM cases WHERE reference = $1`, [filed.body.reference])
    const id: string = rows[0].id
    const token = /\/track\/([A-Za-z0-9_-]+)$/.exec(filed.body.trackingUrl)![1]!
    const investigatorId = investigatorUser.id
    const version = async () => (await t.pool.query(`SELECT version FROM cases WHERE id = $1`, [id])).rows[0].version
    const move = async (agent: typeof sup, path: string, body: object) => agent.post(`/api/cases/${id}/${path}`).send({ version: await version(), ...body }).expect(200)

    // every internal word carries a marker that must never reach the complainant
    await move(sup, 'triage', { priority: 2, note: 'INTERNAL-triage-note' })
    await sup.post(`/api/cases/${id}/notes`).send({ body: 'INTERNAL-staff-note', visibility: 'internal' }).expect(201)
    await move(sup, 'assign', { investigatorId })
    await move(inv, 'start-field-work', {})
    await inv.post(`/api/cases/${id}/notes`).send({ body: 'Can we visit on Tuesday?', visibility: 'complainant', requestsInformation: true }).expect(201)
    await move(inv, 'propose-finding', { sourceDescription: 'A faulty masthead amplifier', recommendedAction: 'advise_operator', summary: 'INTERNAL-finding-draft' })
    await move(sup, 'return-finding', { reason: 'INTERNAL-return-reason' })
    await move(inv, 'propose-finding', { sourceDescription: 'A faulty masthead amplifier', recommendedAction: 'advise_operator', summary: 'INTERNAL-finding-final' })
    await move(sup, 'close', { resolution: 'source_corrected', reason: 'The faulty amplifier was replaced.' })

    const byLink = (await request(t.app).get(`/api/track/${token}`).expect(200)).body.report
    const byAccount = (await complainant.get(`/api/my/reports/${id}`).expect(200)).body.report
    expect(byAccount).toEqual(byLink)
    expect(Object.keys(byLink).sort()).toEqual(
      ['abilities', 'address', 'closedAt', 'closingSummary', 'description', 'entries', 'freqHighHz', 'freqLowHz', 'receivedAt', 'reference', 'resolution', 'resolutionLabel', 'service', 'statusLabel', 'step'].sort(),
    )
    const text = JSON.stringify(byLink)
    expect(text).not.toMatch(/INTERNAL-/)
    for (const staff of [supervisorUser.name, investigatorUser.name, supervisorUser.email, investigatorUser.email]) expect(text).not.toContain(staff)
    expect(text).not.toContain(investigatorId)
    expect(text).toContain('Can we visit on Tuesday?')
    expect(text).toContain('The faulty amplifier was replaced.')
    for (const e of byLink.entries) expect(Object.keys(e).sort()).toEqual(['at', 'from', 'kind', 'text'])
  })
})
