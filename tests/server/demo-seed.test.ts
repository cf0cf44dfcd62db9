/**
 * The demo cases seeded with the demo offices and staff (ops/seed-demo-cases.ts), as the
 * global setup left them in the test database. Demo cases are picked out by their
 * descriptions, so reports filed by other test files do not count.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { CASE_STATES } from '../../shared/domain/case-lifecycle'
import { DEMO_CASES, DEMO_REGION } from '../../ops/seed-demo-cases'
import { DEMO_USERS } from '../../ops/seed-demo'
import { dueFollowUpsResponseSchema } from '../../shared/schemas/follow-ups'
import { dashboardViewSchema } from '../../shared/schemas/dashboard'
import { createTestContext, DEMO, signedInAgent, type TestContext } from '../support/harness'

interface DemoRow {
  id: string
  reference: string
  description: string
  status: string
  priority: number
  office_name: string
  lat_deg: number
  lon_deg: number
  resolution: string | null
  overdue: boolean
  received_at: Date
  due_at: Date
  closed_at: Date | null
}

let t: TestContext
let demo: DemoRow[]
beforeAll(async () => {
  t = await createTestContext()
  const { rows } = await t.pool.query<DemoRow>(
    `SELECT c.id, c.reference, c.description, c.status, c.priority, o.name AS office_name, c.lat_deg, c.lon_deg, c.resolution,
            (c.status <> 'closed' AND c.due_at < now()) AS overdue, c.received_at, c.due_at, c.closed_at
       FROM cases c JOIN offices o ON o.id = c.office_id
      WHERE c.description = ANY($1)
      ORDER BY c.reference`,
    [DEMO_CASES.map((d) => d.report.description)],
  )
  demo = rows
})
afterAll(() => t.close())

describe('the demo cases', () => {
  it('are all seeded, once each', () => {
    expect(demo).toHaveLength(DEMO_CASES.length)
    expect(new Set(demo.map((d) => d.reference)).size).toBe(DEMO_CASES.length)
  })

  it('cover at least 5 different states', () => {
    const states = new Set(demo.map((d) => d.status))
    expect(states.size).toBeGreaterThanOrEqual(5)
    for (const s of states) expect(CASE_STATES).toContain(s)
  })

  it('cover all 4 priorities and both offices', () => {
    expect([...new Set(demo.map((d) => d.priority))].sort()).toEqual([1, 2, 3, 4])
    expect([...new Set(demo.map((d) => d.office_name))].sort()).toEqual(['Harrowmere', 'Kestrel Bay'])
  })

  it('land in the office each story names (routing by nearest office)', () => {
    for (const story of DEMO_CASES) {
      const row = demo.find((d) => d.description === story.report.description)
      expect(row?.office_name, story.report.address).toBe(story.office)
    }
  })

  it('include an overdue open case, which the list filter overdue=true finds', async () => {
    const overdue = demo.filter((d) => d.overdue)
    expect(overdue.length).toBeGreaterThanOrEqual(1)
    const admin = await signedInAgent(t.app, DEMO.admin)
    const res = await admin.get('/api/cases').query({ overdue: 'true', pageSize: 200 }).expect(200)
    const listed = new Set(res.body.items.map((i: { reference: string }) => i.reference))
    for (const d of overdue) expect(listed.has(d.reference), d.reference).toBe(true)
  })

  it('include closings with enforcement action and with no interference found', () => {
    const resolutions = demo.filter((d) => d.status === 'closed').map((d) => d.resolution)
    expect(resolutions).toContain('enforcement_action')
    expect(resolutions).toContain('no_interference_found')
  })

  it('keep their times in order: received before due, and before closing', () => {
    for (const d of demo) {
      expect(d.due_at.getTime(), d.reference).toBeGreaterThan(d.received_at.getTime())
      if (d.closed_at) expect(d.closed_at.getTime(), d.reference).toBeGreaterThan(d.received_at.getTime())
    }
  })

  it('each have a received event, and a timeline whose last move ends in the current state', async () => {
    for (const d of demo) {
      const { rows } = await t.pool.query(`SELECT kind, to_state FROM case_events WHERE case_id = $1 ORDER BY id`, [d.id])
      expect(rows.filter((e) => e.kind === 'received'), d.reference).toHaveLength(1)
      expect(rows[0].kind, d.reference).toBe('received')
      const lastMove = rows.filter((e) => e.to_state !== null).at(-1)
      expect(lastMove.to_state, d.reference).toBe(d.status)
    }
  })

  it('have timelines on the story’s clock: received when the case says, closed when it says', async () => {
    for (const c of demo) {
      const { rows } = await t.pool.query(`SELECT kind, at, to_state FROM case_events WHERE case_id = $1 ORDER BY id`, [c.id])
      expect(rows[0].kind, c.reference).toBe('received')
      expect(rows[0].at.getTime(), `${c.reference} received`).toBe(c.received_at.getTime())
      for (let i = 1; i < rows.length; i++) expect(rows[i].at.getTime(), `${c.reference} event ${i} in order`).toBeGreaterThanOrEqual(rows[i - 1].at.getTime())
      // the closing move is at the closing time (an enforcement record may follow it)
      if (c.closed_at) expect(rows.filter((e) => e.to_state !== null).at(-1).at.getTime(), `${c.reference} closed`).toBe(c.closed_at.getTime())
    }
  })

  it('include an open follow-up overdue at its office, in the investigator’s queue and on the supervisor’s dashboard', async () => {
    const story = DEMO_CASES.find((d) => d.enforcement)!
    const reference = demo.find((d) => d.description === story.report.description)!.reference
    const investigator = await signedInAgent(t.app, DEMO.investigator)
    const queue = dueFollowUpsResponseSchema.parse((await investigator.get('/api/follow-ups/due').expect(200)).body)
    expect(queue.items.filter((i) => i.caseReference === reference).map((i) => i.standing)).toEqual(['overdue'])
    const supervisor = await signedInAgent(t.app, DEMO.supervisor)
    const dashboard = dashboardViewSchema.parse((await supervisor.get('/api/dashboard').expect(200)).body)
    expect(dashboard.followUps.overdue).toBeGreaterThanOrEqual(1)
  })

  it('lie inside the demo region’s bounding box', () => {
    for (const d of demo) {
      expect(d.lat_deg, d.reference).toBeGreaterThanOrEqual(DEMO_REGION.latMinDeg)
      expect(d.lat_deg, d.reference).toBeLessThanOrEqual(DEMO_REGION.latMaxDeg)
      expect(d.lon_deg, d.reference).toBeGreaterThanOrEqual(DEMO_REGION.lonMinDeg)
      expect(d.lon_deg, d.reference).toBeLessThanOrEqual(DEMO_REGION.lonMaxDeg)
    }
  })
})

describe('the demo accounts', () => {
  it.each(DEMO_USERS.map((u) => [u.email, u.role, u.office] as const))('%s signs in with the demo password as %s of %s', async (email, role, office) => {
    const agent = await signedInAgent(t.app, email)
    const me = await agent.get('/api/me').expect(200)
    expect(me.body.user).toMatchObject({ email, role, officeName: office })
  })
})
