/** The case list: scoping, filters, sorting, paging, overdue flags, CSV, response targets. */
import { sql } from 'drizzle-orm'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { CASE_STATES } from '../../shared/domain/case-lifecycle'
import { dueAtFor, isOverdue } from '../../shared/domain/case-clocks'
import type { Priority } from '../../shared/domain/services'
import { caseListQuerySchema } from '../../shared/schemas/cases'
import { createDb } from '../../server/db/client'
import { findCasePage } from '../../server/modules/cases/case-list.repo'
import { notOverdueSql, overdueSql } from '../../server/modules/cases/due'
import type { Office } from '../../server/db/schema'
import { createTestContext, type TestContext } from '../support/harness'
import { makeCase, makeOffice, makeUser, signIn, uniqueWord, type Agent, type TestUser } from '../support/factories'
import type { ReportInput } from '../../shared/schemas/cases'

let t: TestContext
let office: Office
let adminUser: TestUser
let supervisor: Agent
let investigator: Agent
let admin: Agent
const tag = uniqueWord('zq') // a word only this file's reports contain
const made: { id: string; reference: string }[] = []
/** A report filed in this file's office (routed there, checked). */
const fileHere = (report: Partial<ReportInput>) => makeCase(t, { office, report })

beforeAll(async () => {
  t = await createTestContext()
  office = await makeOffice(t)
  const otherOffice = await makeOffice(t)
  const supervisorUser = await makeUser(t, { role: 'supervisor', office })
  const investigatorUser = await makeUser(t, { role: 'investigator', office })
  adminUser = await makeUser(t, { role: 'admin' })
  supervisor = await signIn(t, supervisorUser)
  investigator = await signIn(t, investigatorUser)
  admin = await signIn(t, adminUser)
  const specs = [
    { service: 'maritime', experience: 'outage', frequencyFrom: 156.8, frequencyTo: undefined },
    { service: 'broadcasting', experience: 'degradation', frequencyFrom: 98.4, frequencyTo: undefined },
    { service: 'licence_exempt', experience: 'nuisance', frequencyFrom: 2.4, frequencyTo: 2.4835, frequencyUnit: 'GHz' },
    { service: 'mobile_network', experience: 'outage', frequencyFrom: 1710, frequencyTo: 1785 },
  ] as const
  for (const s of specs) {
    const report = { ...s, description: `Case list test ${tag}: ${s.service} trouble every evening.` }
    // the broadcasting one is assigned to the investigator
    made.push(await makeCase(t, { office, report, ...(s.service === 'broadcasting' ? { state: 'assigned', supervisor: supervisorUser, investigator: investigatorUser } : {}) }))
  }
  made.push(await makeCase(t, { office: otherOffice, report: { service: 'amateur', experience: 'degradation', description: `Case list test ${tag} at another office.` } }))
})
afterAll(() => t.close())

const list = (agent: Agent, query: string) => {
  const params = new URLSearchParams({ q: tag, pageSize: '50' })
  for (const [k, v] of new URLSearchParams(query)) params.set(k, v)
  return agent.get(`/api/cases?${params}`)
}

describe('the case list', () => {
  it('shows staff their own office only, and an administrator every office', async () => {
    const sup = await list(supervisor, '').expect(200)
    expect(sup.body.total).toBe(4)
    expect(new Set(sup.body.items.map((i: { officeName: string }) => i.officeName))).toEqual(new Set([office.name]))
    const all = await list(admin, '').expect(200)
    expect(all.body.total).toBe(5)
  })

  it('filters by status, priority, service, investigator and frequency range', async () => {
    expect((await list(supervisor, 'status=assigned')).body.items.map((i: { reference: string }) => i.reference)).toEqual([made[1]!.reference])
    expect((await list(supervisor, 'priority=1')).body.items.map((i: { service: string }) => i.service)).toEqual(['maritime'])
    expect((await list(supervisor, 'service=licence_exempt,mobile_network')).body.total).toBe(2)
    expect((await list(investigator, 'investigatorId=me')).body.items.map((i: { reference: string }) => i.reference)).toEqual([made[1]!.reference])
    expect((await list(supervisor, 'investigatorId=none')).body.total).toBe(3)
    // 150–160 MHz overlaps only the marine channel; 1.7–2.5 GHz overlaps the mobile band and the 2.4 GHz band
    expect((await list(supervisor, 'freqFromHz=150000000&freqToHz=160000000')).body.items.map((i: { service: string }) => i.service)).toEqual(['maritime'])
    expect((await list(supervisor, 'freqFromHz=1700000000&freqToHz=2500000000')).body.total).toBe(2)
  })

  it('sorts by priority then age, and pages', async () => {
    const byPriority = await list(supervisor, 'sort=priority&dir=asc').expect(200)
    expect(byPriority.body.items.map((i: { priority: number }) => i.priority)).toEqual([1, 2, 3, 4])
    const page2 = await list(supervisor, 'sort=priority&dir=asc&pageSize=3&page=2').expect(200)
    expect(page2.body.items.map((i: { priority: number }) => i.priority)).toEqual([4])
    expect(page2.body).toMatchObject({ total: 4, page: 2, pageSize: 3 })
    const byFreq = await list(supervisor, 'sort=frequency&dir=desc').expect(200)
    const freqs = byFreq.body.items.map((i: { freqLowHz: number }) => i.freqLowHz)
    expect(freqs).toEqual([...freqs].sort((a, b) => b - a))
  })

  it('flags and filters overdue cases', async () => {
    const late = made[2]!
    await t.pool.query(`UPDATE cases SET due_at = now() - interval '2 hours' WHERE id = $1`, [late.id])
    const res = await list(supervisor, 'overdue=true').expect(200)
    expect(res.body.items.map((i: { reference: string }) => i.reference)).toEqual([late.reference])
    expect(res.body.items[0].overdue).toBe(true)
    const detail = await supervisor.get(`/api/cases/${late.id}`).expect(200)
    expect(detail.body.case.overdue).toBe(true)
  })

  it('refuses an unknown sort or status with 400', async () => {
    await list(supervisor, 'sort=colour').expect(400)
    await list(supervisor, 'status=lost').expect(400)
  })

  it('exports the filtered list as CSV with every page and quoted cells', async () => {
    const res = await supervisor.get(`/api/cases/export.csv?q=${tag}&sort=priority&dir=asc&pageSize=1`).expect(200)
    expect(res.headers['content-type']).toMatch(/text\/csv/)
    const lines = res.text.trim().split('\r\n')
    expect(lines[0]).toMatch(/^reference,status,priority,service/)
    expect(lines).toHaveLength(5) // header + the office's 4 cases, though pageSize was 1
    expect(lines[1]).toContain(`"${made[0]!.reference}"`)
  })

  it('neutralises spreadsheet formulas in exported free text', async () => {
    const f = await fileHere({ address: '=HYPERLINK("http://evil.example")', description: `Formula test ${tag}x` })
    const res = await supervisor.get(`/api/cases/export.csv?q=${tag}x`).expect(200)
    expect(res.text).toContain(`"'=HYPERLINK(""http://evil.example"")"`)
    expect(res.text).toContain(f.reference)
  })
})

describe('the CSV export’s cells', () => {
  it('neutralise spreadsheet formula triggers (@, +) at the start of a cell, and keep quotes and line breaks inside it', async () => {
    const mark = `${tag}csv`
    const f = await fileHere({ name: '@SUM(A1:A9)', address: '+1+cmd|" /C calc"!A0\nback entrance', description: `CSV cell test ${mark}` })
    const res = await supervisor.get(`/api/cases/export.csv?q=${mark}`).expect(200)
    const [header, line, ...rest] = res.text.split('\r\n')
    expect(header).toMatch(/^reference,/)
    expect(rest).toEqual(['']) // one row, then the final line break
    expect(line).toContain(`"${f.reference}"`)
    expect(line).toContain(`"'@SUM(A1:A9)"`)
    expect(line).toContain(`"'+1+cmd|"" /C calc""!A0\nback entrance"`)
    // every cell is quoted: no cell of the row starts with a trigger outside quotes
    expect(line!.split(',').every((cell) => cell.startsWith('"'))).toBe(true)
  })
})

describe('response targets', () => {
  it('tell each viewer whether they may change them, and only an administrator edits the office itself', async () => {
    const sup = (await supervisor.get('/api/offices').expect(200)).body.offices
    const inv = (await investigator.get('/api/offices').expect(200)).body.offices
    const adm = (await admin.get('/api/offices').expect(200)).body.offices
    expect(sup.map((o: { abilities: object }) => o.abilities)).toEqual([{ setResponseTargets: true, edit: false }])
    expect(inv.map((o: { abilities: object }) => o.abilities)).toEqual([{ setResponseTargets: false, edit: false }])
    expect(adm.every((o: { abilities: { setResponseTargets: boolean; edit: boolean } }) => o.abilities.setResponseTargets && o.abilities.edit)).toBe(true)
  })

  it('lets the office’s supervisor change them, and open cases’ due times follow', async () => {
    const officeId = office.id
    const f = await fileHere({ service: 'broadcasting', experience: 'degradation' }) // priority 3
    const res = await supervisor.put(`/api/offices/${officeId}/response-targets`).send({ p1: 2, p2: 12, p3: 48, p4: 200 }).expect(200)
    expect(res.body.office.responseTargetsHours).toEqual({ p1: 2, p2: 12, p3: 48, p4: 200 })
    const { rows: c } = await t.pool.query(`SELECT extract(epoch from (due_at - received_at))::int / 3600 AS h FROM cases WHERE id = $1`, [f.id])
    expect(c[0].h).toBe(48)
    await supervisor.put(`/api/offices/${officeId}/response-targets`).send({ p1: 4, p2: 24, p3: 72, p4: 240 }).expect(200)
    await supervisor.put(`/api/offices/${officeId}/response-targets`).send({ p1: 0, p2: 24, p3: 72, p4: 240 }).expect(400)
    await investigator.put(`/api/offices/${officeId}/response-targets`).send({ p1: 4, p2: 24, p3: 72, p4: 240 }).expect(403)
  })
})

describe('the list’s total', () => {
  const matching = async () => (await t.pool.query(`SELECT count(*)::int AS n FROM cases WHERE search_text LIKE $1`, [`%${tag}%`])).rows[0].n as number

  it('is exact, and says it is not capped, while few cases match', async () => {
    const n = await matching()
    const res = await list(admin, 'pageSize=2').expect(200)
    expect(res.body).toMatchObject({ total: n, totalCapped: false })
    expect(res.body.items).toHaveLength(2)
  })

  it('stops counting one case past the cap, and says the total is capped', async () => {
    const db = createDb(t.pool)
    const n = await matching()
    const q = caseListQuerySchema.parse({ q: tag, pageSize: '2' })
    const me = adminUser.id
    expect(await findCasePage(db, { all: true }, q, me, new Date(), n)).toMatchObject({ total: n, capped: false })
    const capped = await findCasePage(db, { all: true }, q, me, new Date(), n - 1)
    expect(capped).toMatchObject({ total: n - 1, capped: true })
    expect(capped.rows).toHaveLength(2) // the page itself is whole
  })
})

describe('overdue, in SQL and in the shared rule', () => {
  const due = new Date('2026-06-01T12:00:00.000Z')
  const instants = [-1000, 0, 1000].map((ms) => new Date(due.getTime() + ms))

  it('agree for every state a second before, at, and a second after the due time', async () => {
    const db = createDb(t.pool)
    for (const status of CASE_STATES) {
      for (const now of instants) {
        const { rows } = await db.execute<{ overdue: boolean; not_overdue: boolean }>(
          sql`SELECT ${overdueSql('resolution', now)} AS overdue, ${notOverdueSql('resolution', now)} AS not_overdue
              FROM (VALUES (${status}::text, ${due.toISOString()}::timestamptz)) AS cases(status, due_at)`,
        )
        const shared = isOverdue('resolution', { status, dueAt: due }, now)
        expect(rows[0]!.overdue, `${status} at ${now.toISOString()}`).toBe(shared)
        expect(rows[0]!.not_overdue, `${status} at ${now.toISOString()}`).toBe(!shared)
      }
    }
    // the edge itself: open at the due time is not yet overdue, a second later it is
    expect(instants.map((now) => isOverdue('resolution', { status: 'assigned', dueAt: due }, now))).toEqual([false, false, true])
  })

  it('agree on a real case through the list’s overdue filter, both ways', async () => {
    const db = createDb(t.pool)
    const open = made[3]!
    await t.pool.query(`UPDATE cases SET due_at = $2 WHERE id = $1`, [open.id, due])
    const me = adminUser.id
    for (const now of instants) {
      const expected = isOverdue('resolution', { status: 'received', dueAt: due }, now)
      const overdue = await findCasePage(db, { all: true }, caseListQuerySchema.parse({ q: tag, overdue: 'true', pageSize: '50' }), me, now)
      const notOverdue = await findCasePage(db, { all: true }, caseListQuerySchema.parse({ q: tag, overdue: 'false', pageSize: '50' }), me, now)
      const row = [...overdue.rows, ...notOverdue.rows].filter((r) => r.id === open.id)
      expect(row, now.toISOString()).toHaveLength(1) // in exactly one of the two lists
      expect(overdue.rows.some((r) => r.id === open.id), now.toISOString()).toBe(expected)
      expect(row[0]!.overdue, now.toISOString()).toBe(expected)
    }
  })

  it('due times recomputed in SQL for new targets equal the shared rule’s', async () => {
    const officeId = office.id
    const targets = { 1: 3, 2: 13, 3: 50, 4: 201 } as const
    await supervisor.put(`/api/offices/${officeId}/response-targets`).send({ p1: 3, p2: 13, p3: 50, p4: 201 }).expect(200)
    try {
      const { rows: open } = await t.pool.query<{ received_at: Date; priority: Priority; due_at: Date }>(
        `SELECT received_at, priority, due_at FROM cases WHERE id = ANY($1) AND status <> 'closed'`,
        [made.slice(0, 4).map((m) => m.id)],
      )
      expect(open.length).toBeGreaterThan(0)
      for (const c of open) expect(c.due_at.toISOString()).toBe(dueAtFor(c.received_at, c.priority, targets).toISOString())
    } finally {
      await supervisor.put(`/api/offices/${officeId}/response-targets`).send({ p1: 4, p2: 24, p3: 72, p4: 240 }).expect(200)
    }
  })
})
