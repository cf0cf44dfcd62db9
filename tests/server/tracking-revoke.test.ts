/**
 * Closing a case's tracking links: a supervisor of the case's office closes every link the
 * complainant was ever sent, with a reason; the links then answer 404 like an unknown one, the
 * timeline and the audit log record it, and the complainant's own account still shows the
 * report. Another office's supervisor finds no case (404); an investigator is refused (403).
 */
import request from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { trackingLinksRevokedResponseSchema } from '../../shared/schemas/people'
import { caseResponseSchema } from '../../shared/schemas/views'
import { eventTitle } from '../../shared/domain/timeline-titles'
import { createTestContext, uniqueAddress, type TestContext } from '../support/harness'
import { registerConfirmed } from '../support/accounts'
import { fileReport, queuedMails } from '../support/cases'
import { makeCase, makeOffice, makeUser, reportNear, signIn, uniqueWord } from '../support/factories'

let t: TestContext
beforeAll(async () => {
  t = await createTestContext()
})
afterAll(() => t?.close())

const track = (token: string) => request(t.app).get(`/api/track/${token}`).set('X-Forwarded-For', uniqueAddress())
const eventsOf = async (id: string) =>
  (await t.pool.query<{ kind: string; body: string; visibility: string; actor_user_id: string; data: Record<string, unknown> }>(`SELECT * FROM case_events WHERE case_id = $1 AND kind = 'tracking_links_revoked'`, [id])).rows

describe('revoking a case’s tracking links', () => {
  it('makes every link of the case answer 404, with a timeline entry and an audit entry', async () => {
    const office = await makeOffice(t)
    const c = await makeCase(t, { office, state: 'assigned' })
    // the assignment e-mailed a second link; both work until revoked
    const { rows } = await t.pool.query<{ n: number }>(`SELECT count(*)::int AS n FROM case_tracking_tokens WHERE case_id = $1`, [c.id])
    expect(rows[0]!.n).toBeGreaterThanOrEqual(2)
    await track(c.trackingToken).expect(200)

    const sup = await signIn(t, c.supervisor!)
    const before = caseResponseSchema.parse((await sup.get(`/api/cases/${c.id}`).expect(200)).body)
    expect(before.case.abilities.revokeTrackingLinks).toBe(true)
    const res = await sup.post(`/api/cases/${c.id}/tracking-links/revoke`).send({ reason: 'The complainant forwarded the link to a neighbour by mistake.' })
    expect(res.status, JSON.stringify(res.body)).toBe(200)
    expect(trackingLinksRevokedResponseSchema.parse(res.body).revokedCount).toBe(rows[0]!.n)

    const gone = await track(c.trackingToken)
    expect(gone.status).toBe(404)
    expect(gone.body.error.code).toBe('tracking_not_found')
    const [e, ...more] = await eventsOf(c.id)
    expect(more).toHaveLength(0)
    expect(e).toMatchObject({ visibility: 'internal', actor_user_id: c.supervisor!.id, body: 'The complainant forwarded the link to a neighbour by mistake.', data: { revokedCount: rows[0]!.n } })
    const after = caseResponseSchema.parse((await sup.get(`/api/cases/${c.id}`).expect(200)).body)
    const last = after.case.timeline.at(-1)!
    expect(last.kind).toBe('tracking_links_revoked')
    expect(eventTitle(last)).toBe(`Tracking links closed (${rows[0]!.n})`)
    const audit = await t.pool.query(`SELECT action, actor_user_id, office_id, details FROM audit_log WHERE target_type = 'case' AND target_id = $1 AND action = 'tracking_links.revoked'`, [c.id])
    expect(audit.rows).toEqual([{ action: 'tracking_links.revoked', actor_user_id: c.supervisor!.id, office_id: office.id, details: { reference: c.reference, revokedCount: rows[0]!.n } }])

    // a second revoke finds nothing left open, and says so
    const again = await sup.post(`/api/cases/${c.id}/tracking-links/revoke`).send({ reason: 'Checking again.' })
    expect(again.body).toEqual({ revokedCount: 0 })
  })

  it('is another office’s case to a supervisor of another office (404) and refused to the investigator (403); the links keep working', async () => {
    const office = await makeOffice(t)
    const c = await makeCase(t, { office, state: 'field_work' })
    const otherSup = await signIn(t, await makeUser(t, { role: 'supervisor', office: await makeOffice(t) }))
    const other = await otherSup.post(`/api/cases/${c.id}/tracking-links/revoke`).send({ reason: 'Not mine to close.' })
    expect(other.status).toBe(404)
    expect(other.body.error.code).toBe('case_not_found')
    const inv = await signIn(t, c.investigator!)
    const detail = caseResponseSchema.parse((await inv.get(`/api/cases/${c.id}`).expect(200)).body)
    expect(detail.case.abilities.revokeTrackingLinks).toBe(false)
    expect((await inv.post(`/api/cases/${c.id}/tracking-links/revoke`).send({ reason: 'Trying anyway.' })).status).toBe(403)
    const sup = await signIn(t, c.supervisor!)
    const bad = await sup.post(`/api/cases/${c.id}/tracking-links/revoke`).send({ reason: ' ' })
    expect(bad.status).toBe(400)
    expect(bad.body.error.details.map((d: { path: string }) => d.path)).toEqual(['reason'])
    await track(c.trackingToken).expect(200)
    expect(await eventsOf(c.id)).toHaveLength(0)
  })

  it('leaves the complainant’s account working, and a later e-mail carries a fresh link', async () => {
    const office = await makeOffice(t)
    const email = `${uniqueWord('owner')}@example.test`
    const { agent } = await registerConfirmed(t, email)
    const filed = await fileReport(t, { email, ...reportNear(office) })
    const supervisor = await makeUser(t, { role: 'supervisor', office })
    const investigator = await makeUser(t, { role: 'investigator', office })
    const sup = await signIn(t, supervisor)
    await sup.post(`/api/cases/${filed.id}/tracking-links/revoke`).send({ reason: 'Link shared on a public forum.' }).expect(200)
    await track(filed.trackingToken).expect(404)
    const mine = await agent.get(`/api/my/reports/${filed.id}`).expect(200)
    expect(mine.body.report.reference).toBe(filed.reference)

    await sup.post(`/api/cases/${filed.id}/assign`).send({ version: 1, investigatorId: investigator.id }).expect(200)
    const mails = await queuedMails(t.pool, email)
    const fresh = /\/track\/([A-Za-z0-9_-]+)/.exec(mails.at(-1)!.text)![1]!
    expect(fresh).not.toBe(filed.trackingToken)
    await track(fresh).expect(200)
  })
})
