/**
 * The dashboard (GET /api/dashboard): every figure equals the case list's count for the filters
 * the figure links to (shared/domain/dashboard-figures.ts), for a supervisor and for an
 * administrator with and without the office filter; "today" follows the office's time zone;
 * the percentiles equal a hand computation; the first-response clock starts and stops as
 * shared/domain/case-clocks.ts says.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { sql } from 'drizzle-orm'
import { CASE_CLOCK_NAMES, isDueSoon, isOverdue } from '../../shared/domain/case-clocks'
import { figureFilters, type FigureFilters } from '../../shared/domain/dashboard-figures'
import { caseListQuerySchema } from '../../shared/schemas/cases'
import { DASHBOARD_WINDOWS_DAYS, dashboardViewSchema, type DashboardView } from '../../shared/schemas/dashboard'
import type { Office } from '../../server/db/schema'
import { listCases } from '../../server/modules/cases/case-list.service'
import { addCaseNote } from '../../server/modules/cases/case-notes.service'
import { getDashboard } from '../../server/modules/dashboard/dashboard.service'
import { dueSoonSql, overdueSql } from '../../server/modules/cases/due'
import { createTestContext, type TestContext } from '../support/harness'
import { makeCase, makeOffice, makeUser, signIn, type Agent, type TestUser } from '../support/factories'
import { closedWithDeadline, dayFromToday } from '../support/factories'

let t: TestContext
let office: Office
let otherOffice: Office
let supervisorUser: TestUser
let investigatorUser: TestUser
let adminUser: TestUser
let supervisor: Agent
let admin: Agent
let investigator: Agent

const HOUR_MS = 3_600_000

beforeAll(async () => {
  t = await createTestContext()
  office = await makeOffice(t, { timeZone: 'Atlantic/Azores' })
  otherOffice = await makeOffice(t)
  supervisorUser = await makeUser(t, { role: 'supervisor', office })
  investigatorUser = await makeUser(t, { role: 'investigator', office })
  const secondInvestigator = await makeUser(t, { role: 'investigator', office })
  adminUser = await makeUser(t, { role: 'admin' })
  supervisor = await signIn(t, supervisorUser)
  admin = await signIn(t, adminUser)
  investigator = await signIn(t, investigatorUser)
  const staff = { supervisor: supervisorUser, investigator: investigatorUser }
  await makeCase(t, { office }) // new, untriaged
  const waitingTooLong = await makeCase(t, { office })
  await makeCase(t, { office, state: 'triaged', priority: 1, supervisor: supervisorUser })
  await makeCase(t, { office, state: 'assigned', ...staff })
  const late = await makeCase(t, { office, state: 'field_work', ...staff })
  await makeCase(t, { office, state: 'finding_proposed', supervisor: supervisorUser, investigator: secondInvestigator })
  await makeCase(t, { office, state: 'closed', ...staff })
  await makeCase(t, { office: otherOffice, state: 'assigned' })
  await makeCase(t, { office: otherOffice })
  // one case past its resolution target, one past its first-response target
  await t.pool.query(`UPDATE cases SET due_at = now() - interval '2 hours' WHERE id = $1`, [late.id])
  await t.pool.query(`UPDATE cases SET first_response_due_at = now() - interval '1 hour' WHERE id = $1`, [waitingTooLong.id])
})
afterAll(() => t.close())

/** The case list's count for a figure's filters (the list's own API, as the figure's link opens it). */
async function listed(agent: Agent, filters: FigureFilters): Promise<number> {
  const res = await agent.get(`/api/cases?${new URLSearchParams({ ...filters, pageSize: '1' })}`).expect(200)
  expect(res.body.totalCapped).toBe(false)
  return res.body.total as number
}

/** Every figure of a dashboard, with the filters its link carries. */
function figures(d: DashboardView): { name: string; value: number; filters: FigureFilters }[] {
  const o = d.officeId
  return [
    ...d.openByStatePriority.map((c) => ({ name: `open ${c.status} P${c.priority}`, value: c.count, filters: figureFilters.open(o, c.status, c.priority) })),
    { name: 'overdue', value: d.clocks.overdue, filters: figureFilters.overdue(o) },
    { name: 'due soon', value: d.clocks.dueSoon, filters: figureFilters.dueSoon(o) },
    { name: 'first response overdue', value: d.clocks.firstResponseOverdue, filters: figureFilters.firstResponseOverdue(o) },
    { name: 'received today', value: d.clocks.receivedToday, filters: figureFilters.receivedToday(o) },
    ...d.workload.flatMap((w) => [
      { name: `${w.name} open`, value: w.open, filters: figureFilters.workload(o, w.investigatorId) },
      { name: `${w.name} overdue`, value: w.overdue, filters: figureFilters.workload(o, w.investigatorId, true) },
    ]),
    { name: 'unassigned', value: d.unassigned.open, filters: figureFilters.workload(o, 'none') },
    { name: 'unassigned overdue', value: d.unassigned.overdue, filters: figureFilters.workload(o, 'none', true) },
    ...d.performance.map((p) => ({ name: `${p.clock} ${p.windowDays} d P${p.priority}`, value: p.count, filters: figureFilters.performance(o, p.clock, p.windowDays, p.priority) })),
  ]
}

async function dashboard(agent: Agent, query = ''): Promise<DashboardView> {
  const res = await agent.get(`/api/dashboard${query}`).expect(200)
  return dashboardViewSchema.parse(res.body)
}

async function expectFiguresMatchList(agent: Agent, d: DashboardView) {
  for (const f of figures(d)) expect(await listed(agent, f.filters), f.name).toBe(f.value)
}

describe('the dashboard’s figures', () => {
  it('equal the case list’s counts for a supervisor, who sees their own office', async () => {
    const d = await dashboard(supervisor)
    expect(d.officeId).toBe(office.id)
    expect(d.offices.map((o) => o.name)).toEqual([office.name])
    expect(d.offices[0]!.timeZone).toBe('Atlantic/Azores')
    expect(d.officeChoices).toEqual([{ id: office.id, name: office.name }])
    // what this file made: six open cases in five states, one overdue, one waiting too long for a first answer
    expect(d.openByStatePriority.reduce((n, c) => n + c.count, 0)).toBe(6)
    expect(d.clocks.overdue).toBe(1)
    expect(d.clocks.firstResponseOverdue).toBe(1)
    expect(d.unassigned.open).toBe(3)
    expect(d.workload.map((w) => w.open).sort()).toEqual([1, 2])
    expect(d.workload.find((w) => w.investigatorId === investigatorUser.id)).toMatchObject({ open: 2, overdue: 1 })
    expect(d.map.cases).toHaveLength(6)
    expect(d.map.cases.map((c) => c.priority)).toEqual([...d.map.cases.map((c) => c.priority)].sort())
    // closed today: one case closed in every window
    expect(d.performance.filter((p) => p.clock === 'resolution' && p.windowDays === 30).reduce((n, p) => n + p.count, 0)).toBe(1)
    await expectFiguresMatchList(supervisor, d)
  })

  it('equal the case list’s counts for an administrator filtered to one office', async () => {
    const d = await dashboard(admin, `?officeId=${office.id}`)
    expect(d.officeId).toBe(office.id)
    expect(d.officeChoices.map((o) => o.id)).toEqual(expect.arrayContaining([office.id, otherOffice.id]))
    await expectFiguresMatchList(admin, d)
    const other = await dashboard(admin, `?officeId=${otherOffice.id}`)
    expect(other.openByStatePriority.reduce((n, c) => n + c.count, 0)).toBe(2)
    await expectFiguresMatchList(admin, other)
  })

  it('equal the case list’s counts for an administrator over every office', async () => {
    // other test files add cases meanwhile: compare when the dashboard read the same before and after the list
    for (let attempt = 1; ; attempt++) {
      const before = await dashboard(admin)
      const counts = await Promise.all(figures(before).map((f) => listed(admin, f.filters)))
      const after = await dashboard(admin)
      const stable = JSON.stringify(figures(before).map((f) => f.value)) === JSON.stringify(figures(after).map((f) => f.value))
      if (!stable && attempt < 5) continue
      expect(before.officeId).toBeNull()
      expect(before.offices.length).toBeGreaterThanOrEqual(2)
      expect(counts).toEqual(figures(before).map((f) => f.value))
      break
    }
  })

  it('are refused to an investigator and a complainant, and another office is not found for a supervisor', async () => {
    await investigator.get('/api/dashboard').expect(403)
    await supervisor.get(`/api/dashboard?officeId=${otherOffice.id}`).expect(404)
    const own = await supervisor.get(`/api/dashboard?officeId=${office.id}`).expect(200)
    expect(own.body.officeId).toBe(office.id)
    const bad = await admin.get('/api/dashboard?officeId=not-an-office').expect(400)
    expect(bad.body.error.code).toBe('validation_failed')
    expect(bad.body.error.details).toEqual([expect.objectContaining({ path: 'officeId' })])
  })
})

describe('follow-ups on the dashboard', () => {
  it('counts the office’s follow-ups due today and overdue, apart from the case figures', async () => {
    const o = await makeOffice(t, { timeZone: 'UTC' })
    const sup = await makeUser(t, { role: 'supervisor', office: o })
    const before = await getDashboard(t.services, sup.actor, {})
    expect(before.followUps).toEqual({ due: 0, overdue: 0 })
    const start = new Date()
    await closedWithDeadline(t, o, dayFromToday(2, start))
    await closedWithDeadline(t, o, dayFromToday(10, start))
    const at = (days: number) => getDashboard({ ...t.services, now: () => new Date(start.getTime() + days * 24 * HOUR_MS) }, sup.actor, {})
    expect((await at(0)).followUps).toEqual({ due: 0, overdue: 0 })
    expect((await at(2)).followUps).toEqual({ due: 1, overdue: 0 }) // the first deadline is the office's today
    expect((await at(4)).followUps).toEqual({ due: 0, overdue: 1 })
  })
})

describe('"today" in the office’s time zone', () => {
  it('is set by the supervisor as a time zone the platform knows, stored in its canonical spelling', async () => {
    const o = await makeOffice(t)
    const agent = await signIn(t, await makeUser(t, { role: 'supervisor', office: o }))
    const set = await agent.put(`/api/offices/${o.id}/time-zone`).send({ timeZone: 'Atlantic/Azores' }).expect(200)
    expect(set.body.office.timeZone).toBe('Atlantic/Azores')
    expect((await agent.put(`/api/offices/${o.id}/time-zone`).send({ timeZone: 'utc' }).expect(200)).body.office.timeZone).toBe('UTC')
    for (const bad of ['Mars/Olympus_Mons', '', 'EST5EDT; drop table', 42]) {
      const res = await agent.put(`/api/offices/${o.id}/time-zone`).send({ timeZone: bad }).expect(400)
      expect(res.body.error.details.map((d: { path: string }) => d.path)).toEqual(['timeZone'])
    }
    const { rows } = await t.pool.query<{ time_zone: string }>(`SELECT time_zone FROM offices WHERE id = $1`, [o.id])
    expect(rows[0]!.time_zone).toBe('UTC') // the bad ones changed nothing
  })

  it('starts at the office’s local midnight, on either side of it and across the clock change', async () => {
    const azores = await makeOffice(t, { timeZone: 'Atlantic/Azores' })
    const utc = await makeOffice(t, { timeZone: 'UTC' })
    const sup = await makeUser(t, { role: 'supervisor', office: azores })
    const utcSup = await makeUser(t, { role: 'supervisor', office: utc })
    const received = ['2026-12-04T00:59:59Z', '2026-12-04T01:00:00Z', '2026-12-04T23:59:00Z', '2026-12-05T00:10:00Z']
    for (const o of [azores, utc]) {
      for (const at of received) {
        const c = await makeCase(t, { office: o })
        await t.pool.query(`UPDATE cases SET received_at = $2 WHERE id = $1`, [c.id, at])
      }
    }
    // The Azores keep UTC−1 in winter and UTC+0 in summer (IANA tz database, Atlantic/Azores).
    // At 00:30 UTC on 5 December it is 23:30 on 4 December there: its day began at 01:00 UTC on the 4th.
    const winterNow = new Date('2026-12-05T00:30:00Z')
    const at = (now: Date) => ({ ...t.services, now: () => now })
    const count = async (actor: TestUser, now: Date) => {
      const d = await getDashboard(at(now), actor.actor, {})
      const l = await listCases(at(now), actor.actor, caseListQuerySchema.parse({ ...figureFilters.receivedToday(d.officeId), pageSize: '1' }))
      expect(l.total).toBe(d.clocks.receivedToday)
      return d.clocks.receivedToday
    }
    // Azores: 01:00 (its midnight, inclusive), 23:59 and 00:10 UTC → 3; UTC: only 00:10 on the 5th → 1
    expect(await count(sup, winterNow)).toBe(3)
    expect(await count(utcSup, winterNow)).toBe(1)
    // at 00:59:59 UTC on the 4th it is still the 3rd in the Azores: the case received that second is
    // today's there (and nothing later, which has not happened yet at that moment)
    expect(await count(sup, new Date('2026-12-04T00:59:59Z'))).toBe(1)
    expect(await count(utcSup, new Date('2026-12-04T00:59:59Z'))).toBe(1)
    expect(await count(utcSup, new Date('2026-12-04T00:59:58Z'))).toBe(0)
    // in summer the Azores are on UTC: their midnight is 00:00 UTC
    const summer = await makeCase(t, { office: azores })
    await t.pool.query(`UPDATE cases SET received_at = '2026-07-01T00:00:00Z' WHERE id = $1`, [summer.id])
    const late = await makeCase(t, { office: azores })
    await t.pool.query(`UPDATE cases SET received_at = '2026-06-30T23:59:59Z' WHERE id = $1`, [late.id])
    expect(await count(sup, new Date('2026-07-01T00:30:00Z'))).toBe(1)
  })
})

describe('response performance', () => {
  it('gives the median and 90th percentile a hand computation gives', async () => {
    const perfOffice = await makeOffice(t)
    const sup = await makeUser(t, { role: 'supervisor', office: perfOffice })
    const now = new Date()
    // five cases closed a day ago after 2, 5, 7, 11 and 30 hours; resolution target 6 h
    const closingHours = [30, 2, 11, 5, 7]
    // first answered after 1, 2, 3 and 10 hours (the fifth never was); first-response target 2.5 h
    const answerHours = [10, 1, null, 3, 2]
    for (let i = 0; i < closingHours.length; i++) {
      const c = await makeCase(t, { office: perfOffice, state: 'closed' })
      const closedAt = new Date(now.getTime() - 24 * HOUR_MS)
      const receivedAt = new Date(closedAt.getTime() - closingHours[i]! * HOUR_MS)
      const answered = answerHours[i] === null ? null : new Date(receivedAt.getTime() + answerHours[i]! * HOUR_MS)
      await t.pool.query(
        `UPDATE cases SET received_at = $2, closed_at = $3, due_at = $4, first_responded_at = $5, first_response_due_at = $6, priority = 2 WHERE id = $1`,
        [c.id, receivedAt, closedAt, new Date(receivedAt.getTime() + 6 * HOUR_MS), answered, new Date(receivedAt.getTime() + 2.5 * HOUR_MS)],
      )
    }
    const d = await getDashboard({ ...t.services, now: () => now }, sup.actor, {})
    const row = (clock: (typeof CASE_CLOCK_NAMES)[number], windowDays: number) => d.performance.find((p) => p.clock === clock && p.windowDays === windowDays && p.priority === 2)!
    // Linear interpolation between closest ranks, the definition of PostgreSQL's percentile_cont
    // and of numpy.percentile's default ("linear"): rank h = p·(n − 1), value x[⌊h⌋] + (h − ⌊h⌋)(x[⌊h⌋+1] − x[⌊h⌋]).
    // Closing, sorted 2, 5, 7, 11, 30: median h = 2 → 7; 90th h = 3.6 → 11 + 0.6·19 = 22.4 (numpy.percentile([2,5,7,11,30], 90) = 22.4).
    for (const w of DASHBOARD_WINDOWS_DAYS) {
      const r = row('resolution', w)
      expect(r.count).toBe(5)
      expect(r.medianHours).toBeCloseTo(7, 9)
      expect(r.p90Hours).toBeCloseTo(22.4, 9)
      expect(r.metTarget).toBe(2) // 2 h and 5 h are within 6 h
    }
    // First response, sorted 1, 2, 3, 10: median h = 1.5 → 2.5; 90th h = 2.7 → 3 + 0.7·7 = 7.9.
    const fr = row('firstResponse', 30)
    expect(fr.count).toBe(4)
    expect(fr.medianHours).toBeCloseTo(2.5, 9)
    expect(fr.p90Hours).toBeCloseTo(7.9, 9)
    expect(fr.metTarget).toBe(2) // 1 h and 2 h are within 2.5 h
    // other priorities had nothing in the window: no figure rather than a zero
    expect(row('resolution', 30).priority).toBe(2)
    expect(d.performance.find((p) => p.clock === 'resolution' && p.windowDays === 30 && p.priority === 1)).toMatchObject({ count: 0, medianHours: null, p90Hours: null })
    // a window that ends before the closings leaves them out
    const later = await getDashboard({ ...t.services, now: () => new Date(now.getTime() + 31 * 24 * HOUR_MS) }, sup.actor, {})
    expect(later.performance.find((p) => p.clock === 'resolution' && p.windowDays === 30 && p.priority === 2)!.count).toBe(0)
    expect(later.performance.find((p) => p.clock === 'resolution' && p.windowDays === 90 && p.priority === 2)!.count).toBe(5)
  })
})

describe('the first-response clock', () => {
  it('is the shared rule in SQL too: overdue and due soon agree with case-clocks.ts at their edges', async () => {
    const o = await makeOffice(t)
    const c = await makeCase(t, { office: o })
    const due = new Date('2026-06-01T12:00:00Z')
    await t.pool.query(`UPDATE cases SET first_response_due_at = $2, due_at = $2 WHERE id = $1`, [c.id, due])
    const instants = [-24 * HOUR_MS - 1, -24 * HOUR_MS, -1, 0, 1].map((ms) => new Date(due.getTime() + ms))
    for (const now of instants) {
      const { rows } = await t.pool.query<{ status: 'received' }>(`SELECT status FROM cases WHERE id = $1`, [c.id])
      const [row] = await t.services.db.execute<{ fr_overdue: boolean; due_soon: boolean }>(
        sql`SELECT ${overdueSql('firstResponse', now)} AS fr_overdue, ${dueSoonSql('resolution', now)} AS due_soon FROM cases WHERE id = ${c.id}`,
      ).then((r) => r.rows)
      expect(row!.fr_overdue, now.toISOString()).toBe(isOverdue('firstResponse', { status: rows[0]!.status, dueAt: due, stoppedAt: null }, now))
      expect(row!.due_soon, now.toISOString()).toBe(isDueSoon('resolution', { status: rows[0]!.status, dueAt: due }, now))
    }
  })

  it('stops at triage or at a first message to the complainant, whichever comes first', async () => {
    const o = await makeOffice(t)
    const sup = await makeUser(t, { role: 'supervisor', office: o })
    const fresh = await makeCase(t, { office: o })
    const triaged = await makeCase(t, { office: o, state: 'triaged', supervisor: sup })
    const messaged = await makeCase(t, { office: o })
    await addCaseNote(t.services, sup.actor, messaged.id, { body: 'We have your report and will look at it today.', visibility: 'complainant' })
    const internal = await makeCase(t, { office: o })
    await addCaseNote(t.services, sup.actor, internal.id, { body: 'Check the harbour first.', visibility: 'internal' })
    const { rows } = await t.pool.query<{ id: string; first_responded_at: Date | null; first_response_due_at: Date; received_at: Date; priority: number }>(
      `SELECT id, first_responded_at, first_response_due_at, received_at, priority FROM cases WHERE office_id = $1`,
      [o.id],
    )
    const by = new Map(rows.map((r) => [r.id, r]))
    expect(by.get(fresh.id)!.first_responded_at).toBeNull()
    expect(by.get(internal.id)!.first_responded_at).toBeNull() // an internal note is no answer
    expect(by.get(triaged.id)!.first_responded_at).not.toBeNull()
    expect(by.get(messaged.id)!.first_responded_at).not.toBeNull()
    // due: received + the office's first-response hours for the priority (defaults 1, 8, 24, 72 h)
    const hours = { 1: o.firstResponseP1Hours, 2: o.firstResponseP2Hours, 3: o.firstResponseP3Hours, 4: o.firstResponseP4Hours } as Record<number, number>
    for (const r of rows) expect(r.first_response_due_at.getTime() - r.received_at.getTime()).toBe(hours[r.priority]! * HOUR_MS)
    // a day later, the two unanswered cases are overdue on it, the answered ones never
    const d = await getDashboard({ ...t.services, now: () => new Date(Date.now() + 4 * 24 * HOUR_MS) }, sup.actor, {})
    expect(d.clocks.firstResponseOverdue).toBe(2)
  })

  it('follows the office’s first-response targets when a supervisor changes them, and refuses bad figures', async () => {
    const o = await makeOffice(t)
    const sup = await makeUser(t, { role: 'supervisor', office: o })
    const agent = await signIn(t, sup)
    const waiting = await makeCase(t, { office: o })
    const answered = await makeCase(t, { office: o, state: 'triaged', supervisor: sup })
    const before = await t.pool.query<{ id: string; first_response_due_at: Date }>(`SELECT id, first_response_due_at FROM cases WHERE office_id = $1`, [o.id])
    const res = await agent.put(`/api/offices/${o.id}/first-response-targets`).send({ p1: 2, p2: 5, p3: 30, p4: 96 }).expect(200)
    expect(res.body.office.firstResponseTargetsHours).toEqual({ p1: 2, p2: 5, p3: 30, p4: 96 })
    const after = await t.pool.query<{ id: string; first_response_due_at: Date; received_at: Date; priority: 1 | 2 | 3 | 4 }>(`SELECT id, first_response_due_at, received_at, priority FROM cases WHERE office_id = $1`, [o.id])
    const w = after.rows.find((r) => r.id === waiting.id)!
    expect(w.first_response_due_at.getTime() - w.received_at.getTime()).toBe({ 1: 2, 2: 5, 3: 30, 4: 96 }[w.priority] * HOUR_MS)
    // an answered case's clock has stopped: its due time stays as it was
    expect(after.rows.find((r) => r.id === answered.id)!.first_response_due_at).toEqual(before.rows.find((r) => r.id === answered.id)!.first_response_due_at)
    const bad = await agent.put(`/api/offices/${o.id}/first-response-targets`).send({ p1: 0, p2: 'x', p3: 30, p4: 96 }).expect(400)
    expect(bad.body.error.details.map((d: { path: string }) => d.path).sort()).toEqual(['p1', 'p2'])
  })
})
