/**
 * Follow-ups: the approved finding's compliance deadline becomes one follow-up; staff add
 * others (never before the office's today); confirming, escalating and reopening are one move
 * each with a timeline entry, refused by role (403), state (409) and version (409); a deadline
 * that passes makes the follow-up overdue on the office's calendar, in the queue and in the
 * dashboard's figures.
 */
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import { caseFollowUpsResponseSchema, dueFollowUpsResponseSchema, followUpResponseSchema, followUpViewSchema } from '../../shared/schemas/follow-ups'
import { localDay } from '../../shared/domain/follow-ups'
import { createTestContext, type TestContext } from '../support/harness'
import { expectAnswerMatchesDocument } from '../support/api-document'
import { makeCase, makeOffice, makeUser, signIn } from '../support/factories'
import { atLocal, closedWithDeadline, dayFromToday } from '../support/factories'
import { listDueFollowUps } from '../../server/modules/follow-ups/follow-ups.service'
import { followUpFigures } from '../../server/modules/follow-ups/follow-ups.repo'

let t: TestContext
beforeAll(async () => {
  t = await createTestContext()
})
afterAll(() => t?.close())

const timelineKinds = async (caseId: string) =>
  (await t.pool.query<{ kind: string }>(`SELECT kind FROM case_events WHERE case_id = $1 ORDER BY id`, [caseId])).rows.map((r) => r.kind)

describe('a follow-up from the approved finding', () => {
  it('is created when the supervisor approves a finding with a compliance deadline, once, with a timeline entry', async () => {
    const office = await makeOffice(t)
    const deadline = dayFromToday(7)
    const c = await closedWithDeadline(t, office, deadline)
    const sup = await signIn(t, c.supervisor!)
    const res = await sup.get(`/api/cases/${c.id}/follow-ups`)
    expect(res.status, JSON.stringify(res.body)).toBe(200)
    const body = caseFollowUpsResponseSchema.parse(res.body)
    expect(body.followUps).toHaveLength(1)
    const f = body.followUps[0]!
    expect(f).toMatchObject({ dueOn: deadline, source: 'finding', state: 'open', standing: 'upcoming' })
    expect(f.expected).toContain('masthead amplifier')
    expect(f.abilities).toEqual({ confirm: true, escalate: true, reopen: false })
    expect(await timelineKinds(c.id)).toContain('follow_up_added')
  })

  it('is not created when the finding has no deadline', async () => {
    const office = await makeOffice(t)
    const c = await makeCase(t, { office, state: 'closed' })
    const { rows } = await t.pool.query(`SELECT count(*)::int AS n FROM follow_ups WHERE case_id = $1`, [c.id])
    expect(rows[0].n).toBe(0)
  })
})

describe('adding a follow-up', () => {
  it('refuses a deadline before the office’s today and a missing text, naming the fields', async () => {
    const office = await makeOffice(t)
    const c = await makeCase(t, { office, state: 'assigned' })
    const inv = await signIn(t, c.investigator!)
    const past = await inv.post(`/api/cases/${c.id}/follow-ups`).send({ dueOn: dayFromToday(-3), expected: 'Replace the amplifier' })
    expect(past.status).toBe(400)
    expect(past.body.error.details).toEqual([expect.objectContaining({ path: 'dueOn', message: expect.stringContaining('cannot be in the past') })])
    const empty = await inv.post(`/api/cases/${c.id}/follow-ups`).send({ dueOn: '', expected: '' })
    expect(empty.status).toBe(400)
    expect(empty.body.error.details.map((d: { path: string }) => d.path).sort()).toEqual(['dueOn', 'expected'])
    const ok = await inv.post(`/api/cases/${c.id}/follow-ups`).send({ dueOn: dayFromToday(2), expected: 'Send the replacement invoice' })
    expect(ok.status, JSON.stringify(ok.body)).toBe(201)
    expect(followUpViewSchema.parse(ok.body.followUp)).toMatchObject({ source: 'staff', state: 'open' })
    // the whole answer is its view schema, nothing undeclared
    expect(followUpResponseSchema.parse(ok.body)).toEqual(ok.body)
  })

  it('answers 404 for another office’s case and 403 to a complainant', async () => {
    const office = await makeOffice(t)
    const other = await makeOffice(t)
    const c = await makeCase(t, { office })
    const stranger = await signIn(t, await makeUser(t, { role: 'supervisor', office: other }))
    expect((await stranger.post(`/api/cases/${c.id}/follow-ups`).send({ dueOn: dayFromToday(2), expected: 'Anything' })).status).toBe(404)
    expect((await stranger.get(`/api/cases/${c.id}/follow-ups`)).status).toBe(404)
    const complainant = await signIn(t, await makeUser(t, { role: 'complainant' }))
    expect((await complainant.get(`/api/cases/${c.id}/follow-ups`)).status).toBe(403)
  })
})

describe('follow-up moves', () => {
  it('confirms, refuses a second confirm (409) and a stale version (409), lets only the supervisor reopen, each with a timeline entry', async () => {
    const office = await makeOffice(t)
    const c = await closedWithDeadline(t, office, dayFromToday(5))
    const [inv, sup] = await Promise.all([signIn(t, c.investigator!), signIn(t, c.supervisor!)])
    const f = caseFollowUpsResponseSchema.parse((await inv.get(`/api/cases/${c.id}/follow-ups`)).body).followUps[0]!
    const noNote = await inv.post(`/api/follow-ups/${f.id}/confirm`).send({ version: f.version })
    expect(noNote.status).toBe(400)
    const confirmed = await inv.post(`/api/follow-ups/${f.id}/confirm`).send({ version: f.version, note: 'Visited: new amplifier fitted, no emission measured.' })
    expect(confirmed.status, JSON.stringify(confirmed.body)).toBe(200)
    expect(confirmed.body.followUp).toMatchObject({ state: 'complied', standing: 'closed', version: f.version + 1 })
    expectAnswerMatchesDocument('POST', '/api/follow-ups/:id/confirm', confirmed)
    const again = await inv.post(`/api/follow-ups/${f.id}/confirm`).send({ version: f.version + 1, note: 'Again' })
    expect(again.status).toBe(409)
    expect(again.body.error.code).toBe('invalid_transition')
    const stale = await sup.post(`/api/follow-ups/${f.id}/reopen`).send({ version: f.version, note: 'Emission back' })
    expect(stale.status).toBe(409)
    expect(stale.body.error.code).toBe('stale_version')
    const byInvestigator = await inv.post(`/api/follow-ups/${f.id}/reopen`).send({ version: f.version + 1, note: 'Emission back' })
    expect(byInvestigator.status).toBe(403)
    const pastDeadline = await sup.post(`/api/follow-ups/${f.id}/reopen`).send({ version: f.version + 1, note: 'Emission back', dueOn: dayFromToday(-5) })
    expect(pastDeadline.status).toBe(400)
    const reopened = await sup.post(`/api/follow-ups/${f.id}/reopen`).send({ version: f.version + 1, note: 'The neighbour reports the noise again.', dueOn: dayFromToday(3) })
    expect(reopened.status, JSON.stringify(reopened.body)).toBe(200)
    expect(reopened.body.followUp).toMatchObject({ state: 'open', dueOn: dayFromToday(3) })
    expectAnswerMatchesDocument('POST', '/api/follow-ups/:id/reopen', reopened)
    const kinds = await timelineKinds(c.id)
    expect(kinds.filter((k) => k.startsWith('follow_up_'))).toEqual(['follow_up_added', 'follow_up_confirm', 'follow_up_reopen'])
  })

  it('answers 404 for a follow-up of another office and for a malformed id', async () => {
    const office = await makeOffice(t)
    const c = await closedWithDeadline(t, office, dayFromToday(5))
    const { rows } = await t.pool.query<{ id: string }>(`SELECT id FROM follow_ups WHERE case_id = $1`, [c.id])
    const stranger = await signIn(t, await makeUser(t, { role: 'supervisor', office: await makeOffice(t) }))
    const res = await stranger.post(`/api/follow-ups/${rows[0]!.id}/escalate`).send({ version: 1, note: 'Not mine' })
    expect(res.status).toBe(404)
    expect(res.body.error.code).toBe('follow_up_not_found')
    expect((await stranger.post(`/api/follow-ups/not-an-id/escalate`).send({ version: 1, note: 'x' })).status).toBe(404)
  })
})

describe('the follow-ups table', () => {
  // (skipped when the tests run as the owner, with TEST_DATABASE_URL on one role)
  it.skipIf(inject('databaseUrl') === inject('migrationDatabaseUrl'))('refuses the application a deletion: a follow-up changes only through its moves', async () => {
    const office = await makeOffice(t)
    const c = await closedWithDeadline(t, office, dayFromToday(5))
    await expect(t.pool.query(`DELETE FROM follow_ups WHERE case_id = $1`, [c.id])).rejects.toThrow(/permission denied/)
    const { rows } = await t.pool.query(`SELECT count(*)::int AS n FROM follow_ups WHERE case_id = $1`, [c.id])
    expect(rows[0].n).toBe(1)
  })
})

describe('a deadline that passes', () => {
  it('shows the follow-up as due on its day and overdue the day after, on the office’s calendar, in the queue and in the figures', async () => {
    const timeZone = 'Pacific/Auckland'
    const office = await makeOffice(t, { timeZone })
    const deadline = dayFromToday(4)
    const c = await closedWithDeadline(t, office, deadline)
    const investigator = c.investigator!
    const { rows } = await t.pool.query<{ id: string }>(`SELECT id FROM follow_ups WHERE case_id = $1`, [c.id])
    const id = rows[0]!.id
    const at = (now: Date) => ({ ...t.services, now: () => now })

    // 23:30 the evening before the deadline, office time: nothing due yet
    const eveBefore = atLocal(dayFromToday(-1, new Date(`${deadline}T12:00:00Z`)), 23, 30, timeZone)
    expect((await listDueFollowUps(at(eveBefore), investigator.actor)).items).toEqual([])

    // 09:00 on the deadline, office time: due, although in UTC it is still the day before
    const onTheDay = atLocal(deadline, 9, 0, timeZone)
    expect(onTheDay.toISOString().slice(0, 10)).toBe(dayFromToday(-1, new Date(`${deadline}T12:00:00Z`)))
    const due = dueFollowUpsResponseSchema.parse(await listDueFollowUps(at(onTheDay), investigator.actor))
    expect(due.today).toBe(deadline)
    expect(due.items).toEqual([expect.objectContaining({ id, standing: 'due', caseReference: c.reference })])

    const dayAfter = atLocal(dayFromToday(1, new Date(`${deadline}T12:00:00Z`)), 0, 15, timeZone)
    const late = await listDueFollowUps(at(dayAfter), investigator.actor)
    expect(late.items).toEqual([expect.objectContaining({ id, standing: 'overdue' })])
    // the supervisor's view of the office holds it too; another investigator's does not
    expect((await listDueFollowUps(at(dayAfter), c.supervisor!.actor)).items.map((i) => i.id)).toContain(id)
    const other = await makeUser(t, { role: 'investigator', office })
    expect((await listDueFollowUps(at(dayAfter), other.actor)).items).toEqual([])

    const [figures] = await followUpFigures(t.services.db, [office.id], dayAfter)
    expect(figures).toMatchObject({ officeId: office.id, due: 0, overdue: 1 })
    expect(figures!.overdueItems.map((i) => i.id)).toEqual([id])
    expect(localDay(dayAfter, timeZone) > deadline).toBe(true)
  })

  it('is no longer due or overdue once confirmed', async () => {
    const office = await makeOffice(t)
    const c = await closedWithDeadline(t, office, dayFromToday(1))
    const { rows } = await t.pool.query<{ id: string }>(`SELECT id FROM follow_ups WHERE case_id = $1`, [c.id])
    const later = new Date(Date.now() + 10 * 86_400_000)
    expect((await followUpFigures(t.services.db, [office.id], later))[0]).toMatchObject({ overdue: 1 })
    const sup = await signIn(t, c.supervisor!)
    expect((await sup.post(`/api/follow-ups/${rows[0]!.id}/escalate`).send({ version: 1, note: 'No reply to the warning; passed to enforcement.' })).status).toBe(200)
    expect((await followUpFigures(t.services.db, [office.id], later))[0]).toMatchObject({ due: 0, overdue: 0 })
  })
})
