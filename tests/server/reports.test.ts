import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { createTestContext, DEMO, signedInAgent, uniqueAddress, type TestContext } from '../support/harness'
import { fileReport, NEAR_KESTREL_BAY, queuedMails, validReport } from '../support/cases'

let t: TestContext
beforeAll(async () => {
  t = await createTestContext()
})
afterAll(() => t.close())

const post = (body: unknown) => request(t.app).post('/api/reports').set('X-Forwarded-For', uniqueAddress()).send(body as object)
/** Cases from one complainant address (other test files file reports at the same time). */
const casesFrom = async (email: string) => (await t.pool.query(`SELECT count(*)::int AS n FROM cases WHERE complainant_email = $1`, [email])).rows[0].n as number

describe('filing a report', () => {
  it('gives a reference of Quietband’s format and e-mails a private tracking link', async () => {
    const f = await fileReport(t)
    expect(f.reference).toMatch(/^QB-\d{2}-\d{6}$/)
    const mails = await queuedMails(t.pool, f.email)
    expect(mails).toHaveLength(1)
    expect(mails[0]!.subject).toContain(f.reference)
    expect(mails[0]!.text).toContain(`/track/${f.trackingToken}`)
    const { rows } = await t.pool.query(`SELECT count(*)::int AS n FROM case_tracking_tokens WHERE token_hash = $1`, [f.trackingToken])
    expect(rows[0].n, 'the raw token is never stored').toBe(0)
  })

  it('routes to the nearest office by geodesic distance', async () => {
    const near = await fileReport(t, NEAR_KESTREL_BAY)
    const { rows } = await t.pool.query(`SELECT o.name FROM cases c JOIN offices o ON o.id = c.office_id WHERE c.id = $1`, [near.id])
    expect(rows[0].name).toBe('Kestrel Bay')
    const far = await fileReport(t)
    const r2 = await t.pool.query(`SELECT o.name FROM cases c JOIN offices o ON o.id = c.office_id WHERE c.id = $1`, [far.id])
    expect(r2.rows[0].name).toBe('Harrowmere')
  })

  it.each([
    ['maritime', 'nuisance', 1],
    ['radionavigation', 'degradation', 1],
    ['mobile_network', 'outage', 2],
    ['broadcasting', 'degradation', 3],
    ['licence_exempt', 'outage', 4],
  ] as const)('suggests priority for %s with %s as %i', async (service, experience, priority) => {
    const f = await fileReport(t, { service, experience })
    const { rows } = await t.pool.query(`SELECT priority, suggested_priority FROM cases WHERE id = $1`, [f.id])
    expect(rows[0]).toEqual({ priority, suggested_priority: priority })
  })

  it('e-mails the office’s supervisors at once about a safety-of-life report', async () => {
    const before = (await queuedMails(t.pool, DEMO.supervisor)).length
    await fileReport(t, { service: 'aeronautical', experience: 'degradation' })
    const after = await queuedMails(t.pool, DEMO.supervisor)
    expect(after.length).toBe(before + 1)
    expect(after.at(-1)!.subject).toMatch(/Priority 1/)
  })

  it('links the report to a signed-in complainant, who sees it in their reports', async () => {
    const agent = await signedInAgent(t.app, DEMO.complainant)
    const res = await agent.post('/api/reports').send(validReport({ email: DEMO.complainant })).expect(201)
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

describe('tracking links', () => {
  it('open the complainant’s own report and never another one', async () => {
    const a = await fileReport(t)
    const b = await fileReport(t)
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
    const f = await fileReport(t)
    await t.pool.query(`UPDATE case_tracking_tokens SET revoked_at = now() WHERE case_id = $1`, [f.id])
    await request(t.app).get(`/api/track/${f.trackingToken}`).expect(404)
  })

  it('show the complainant no internal notes and no staff names', async () => {
    const f = await fileReport(t)
    const sup = await signedInAgent(t.app, DEMO.supervisor)
    await sup.post(`/api/cases/${f.id}/notes`).send({ body: 'Internal: likely the marina amplifier', visibility: 'internal' }).expect(201)
    const view = await request(t.app).get(`/api/track/${f.trackingToken}`).expect(200)
    const text = JSON.stringify(view.body)
    expect(text).not.toContain('marina amplifier')
    expect(text).not.toContain('Sade Okafor')
  })

  it('and the staff case page are never stored by a browser or a proxy (Cache-Control: no-store)', async () => {
    const f = await fileReport(t)
    const view = await request(t.app).get(`/api/track/${f.trackingToken}`).expect(200)
    expect(view.headers['cache-control']).toBe('no-store')
    const sup = await signedInAgent(t.app, DEMO.supervisor)
    expect((await sup.get(`/api/cases/${f.id}`).expect(200)).headers['cache-control']).toBe('no-store')
    expect((await sup.get('/api/cases/export.csv').expect(200)).headers['cache-control']).toBe('no-store')
    expect((await request(t.app).get(`/api/track/${'A'.repeat(43)}`).expect(404)).headers['cache-control']).toBe('no-store')
  })

  it('let the complainant withdraw once; a second withdrawal is 409 invalid_transition', async () => {
    const f = await fileReport(t)
    const res = await request(t.app).post(`/api/track/${f.trackingToken}/withdraw`).send({ reason: 'It stopped' }).expect(200)
    expect(res.body.report).toMatchObject({ step: 'closed', resolution: 'withdrawn' })
    const again = await request(t.app).post(`/api/track/${f.trackingToken}/withdraw`).send({}).expect(409)
    expect(again.body.error.code).toBe('invalid_transition')
  })
})

describe('the complainant’s view through a whole case', () => {
  it('carries only the report, plain steps, messages meant for them and the closing summary — no internal text, staff names or staff addresses', async () => {
    const sup = await signedInAgent(t.app, DEMO.supervisor)
    const inv = await signedInAgent(t.app, DEMO.investigator)
    const complainant = await signedInAgent(t.app, DEMO.complainant)
    const filed = await complainant.post('/api/reports').set('X-Forwarded-For', uniqueAddress()).send(validReport({ email: DEMO.complainant, phone: '+99 555 0101' })).expect(201)
    const { rows } = await t.pool.query(`SELECT id FROM cases WHERE reference = $1`, [filed.body.reference])
    const id: string = rows[0].id
    const token = /\/track\/([A-Za-z0-9_-]+)$/.exec(filed.body.trackingUrl)![1]!
    const investigatorId = (await t.pool.query(`SELECT id FROM users WHERE email = $1`, [DEMO.investigator])).rows[0].id
    const version = async () => (await t.pool.query(`SELECT version FROM cases WHERE id = $1`, [id])).rows[0].version
    const move = async (agent: typeof sup, path: string, body: object) => agent.post(`/api/cases/${id}/${path}`).send({ version: await version(), ...body }).expect(200)

    // every internal word carries a marker that must never reach the complainant
    await move(sup, 'triage', { priority: 2, note: 'INTERNAL-triage-note' })
    await sup.post(`/api/cases/${id}/notes`).send({ body: 'INTERNAL-staff-note', visibility: 'internal' }).expect(201)
    await move(sup, 'assign', { investigatorId })
    await move(inv, 'start-field-work', {})
    await inv.post(`/api/cases/${id}/notes`).send({ body: 'Can we visit on Tuesday?', visibility: 'complainant', requestsInformation: true }).expect(201)
    await move(inv, 'propose-finding', { reason: 'INTERNAL-finding-draft' })
    await move(sup, 'return-finding', { reason: 'INTERNAL-return-reason' })
    await move(inv, 'propose-finding', { reason: 'INTERNAL-finding-final' })
    await move(sup, 'close', { resolution: 'source_corrected', reason: 'The faulty amplifier was replaced.' })

    const byLink = (await request(t.app).get(`/api/track/${token}`).expect(200)).body.report
    const byAccount = (await complainant.get(`/api/my/reports/${id}`).expect(200)).body.report
    expect(byAccount).toEqual(byLink)
    expect(Object.keys(byLink).sort()).toEqual(
      ['abilities', 'address', 'closedAt', 'closingSummary', 'description', 'entries', 'freqHighHz', 'freqLowHz', 'receivedAt', 'reference', 'resolution', 'resolutionLabel', 'service', 'statusLabel', 'step'].sort(),
    )
    const text = JSON.stringify(byLink)
    expect(text).not.toMatch(/INTERNAL-/)
    for (const staff of ['Sade Okafor', 'Marta Ferreira', DEMO.supervisor, DEMO.investigator]) expect(text).not.toContain(staff)
    expect(text).not.toContain(investigatorId)
    expect(text).toContain('Can we visit on Tuesday?')
    expect(text).toContain('The faulty amplifier was replaced.')
    for (const e of byLink.entries) expect(Object.keys(e).sort()).toEqual(['at', 'from', 'kind', 'text'])
  })
})
