/**
 * Moving people: an administrator changes a person's role or office in one step; the person's
 * sessions end, the open cases they held in the old office go back to its triage with a
 * timeline entry each, and the audit log records the change. Bad combinations are refused
 * naming the field, and the last active administrator cannot be demoted or deactivated
 * (checked on a database of its own, where the test knows every administrator). Each sign-in
 * is recorded and listed.
 */
import pg from 'pg'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import request from 'supertest'
import { personChangedResponseSchema } from '../../shared/schemas/people'
import { usersResponseSchema } from '../../shared/schemas/views'
import { prepareDatabase } from '../../server/db/roles'
import { createTestContext, uniqueAddress, type TestContext } from '../support/harness'
import { makeCase, makeOffice, makeUser, signIn, type Agent, type TestUser } from '../support/factories'

let t: TestContext
let admin: TestUser
let adminAgent: Agent
beforeAll(async () => {
  t = await createTestContext()
  admin = await makeUser(t, { role: 'admin' })
  adminAgent = await signIn(t, admin)
})
afterAll(() => t?.close())

const caseRow = async (id: string) =>
  (await t.pool.query<{ status: string; investigator_id: string | null; version: number }>(`SELECT status, investigator_id, version FROM cases WHERE id = $1`, [id])).rows[0]!
const eventsOf = async (id: string, kind: string) =>
  (await t.pool.query<{ actor_user_id: string; body: string; from_state: string; to_state: string; data: Record<string, unknown> }>(`SELECT * FROM case_events WHERE case_id = $1 AND kind = $2`, [id, kind])).rows
const auditOf = async (userId: string) =>
  (await t.pool.query<{ action: string; actor_user_id: string; details: Record<string, unknown> }>(`SELECT action, actor_user_id, details FROM audit_log WHERE target_type = 'user' AND target_id = $1 ORDER BY id`, [userId])).rows
const userRow = async (id: string) => (await t.pool.query<{ role: string; office_id: string | null; active: boolean }>(`SELECT role, office_id, active FROM users WHERE id = $1`, [id])).rows[0]!
const sessionsOf = async (id: string) => (await t.pool.query<{ n: number }>(`SELECT count(*)::int AS n FROM session WHERE sess->'passport'->>'user' = $1`, [id])).rows[0]!.n

describe('changing an investigator’s role', () => {
  it('ends their sessions and returns their open cases of the office to triage with a timeline entry', async () => {
    const office = await makeOffice(t)
    const investigator = await makeUser(t, { role: 'investigator', office })
    const colleague = await makeUser(t, { role: 'investigator', office })
    const supervisor = await makeUser(t, { role: 'supervisor', office })
    const assigned = await makeCase(t, { office, state: 'assigned', supervisor, investigator })
    const inField = await makeCase(t, { office, state: 'field_work', supervisor, investigator })
    const closed = await makeCase(t, { office, state: 'closed', supervisor, investigator })
    const colleagues = await makeCase(t, { office, state: 'assigned', supervisor, investigator: colleague })
    const agent = await signIn(t, investigator)
    await agent.get('/api/me').expect(200)
    expect(await sessionsOf(investigator.id)).toBe(1)
    const inFieldVersion = (await caseRow(inField.id)).version

    const res = await adminAgent.patch(`/api/admin/users/${investigator.id}`).send({ role: 'supervisor' })
    expect(res.status, JSON.stringify(res.body)).toBe(200)
    const body = personChangedResponseSchema.parse(res.body)
    expect(body).toMatchObject({ sessionsEnded: 1, casesReturnedToTriage: 2, user: { role: 'supervisor', officeId: office.id } })

    // the old session no longer opens anything
    expect((await agent.get('/api/cases')).status).toBe(401)
    expect((await agent.get('/api/me')).body.user).toBeNull()
    expect(await sessionsOf(investigator.id)).toBe(0)

    for (const c of [assigned, inField]) {
      expect(await caseRow(c.id)).toMatchObject({ status: 'triaged', investigator_id: null })
      const [e] = await eventsOf(c.id, 'returned_to_triage')
      expect(e).toMatchObject({ actor_user_id: admin.id, to_state: 'triaged', data: { previousInvestigatorId: investigator.id } })
      expect(e!.body).toBe(`Returned to triage: ${investigator.name} is now office supervisor. The case awaits a new investigator.`)
    }
    expect((await eventsOf(inField.id, 'returned_to_triage'))[0]!.from_state).toBe('field_work')
    expect((await caseRow(inField.id)).version).toBe(inFieldVersion + 1)
    // a closed case and a colleague's case stay as they were
    expect(await caseRow(closed.id)).toMatchObject({ status: 'closed', investigator_id: investigator.id })
    expect(await caseRow(colleagues.id)).toMatchObject({ status: 'assigned', investigator_id: colleague.id })
    expect(await eventsOf(colleagues.id, 'returned_to_triage')).toHaveLength(0)

    // the supervisor sees the returned case as triage work, and it can be assigned again
    const sup = await signIn(t, supervisor)
    const detail = await sup.get(`/api/cases/${assigned.id}`).expect(200)
    expect(detail.body.case.abilities.assign).toBe(true)
    expect(detail.body.case.timeline.map((e: { kind: string }) => e.kind)).toContain('returned_to_triage')

    expect(await auditOf(investigator.id)).toEqual([
      expect.objectContaining({ action: 'user.invited' }),
      { action: 'user.role_changed', actor_user_id: admin.id, details: { fromRole: 'investigator', toRole: 'supervisor', sessionsEnded: 1, casesReturnedToTriage: 2 } },
    ])
    // signing in again gives the new role
    const again = await signIn(t, investigator)
    expect((await again.get('/api/me')).body.user).toMatchObject({ role: 'supervisor' })
  })
})

describe('moving an investigator to another office', () => {
  it('ends their sessions and returns the old office’s open cases to its triage; the new office gains them', async () => {
    const oldOffice = await makeOffice(t)
    const newOffice = await makeOffice(t)
    const investigator = await makeUser(t, { role: 'investigator', office: oldOffice })
    const c = await makeCase(t, { office: oldOffice, state: 'returned', investigator })
    const closed = await makeCase(t, { office: oldOffice, state: 'closed', investigator })
    const agent = await signIn(t, investigator)

    const res = await adminAgent.patch(`/api/admin/users/${investigator.id}`).send({ officeId: newOffice.id })
    expect(res.status, JSON.stringify(res.body)).toBe(200)
    expect(personChangedResponseSchema.parse(res.body)).toMatchObject({ sessionsEnded: 1, casesReturnedToTriage: 1, user: { role: 'investigator', officeId: newOffice.id, officeName: newOffice.name } })
    expect((await agent.get(`/api/cases/${c.id}`)).status).toBe(401)
    expect(await caseRow(c.id)).toMatchObject({ status: 'triaged', investigator_id: null })
    expect(await eventsOf(c.id, 'returned_to_triage')).toHaveLength(1)
    expect((await auditOf(investigator.id)).map((a) => a.action)).toEqual(['user.invited', 'user.office_changed'])
    expect((await auditOf(investigator.id))[1]!.details).toMatchObject({ fromOfficeId: oldOffice.id, toOfficeId: newOffice.id })

    // a closed case of theirs in the old office, reopened later, goes to triage, not back to them
    const supOld = await signIn(t, closed.supervisor!)
    await supOld.post(`/api/cases/${closed.id}/reopen`).send({ version: closed.version, reason: 'The noise is back.' }).expect(200)
    expect(await caseRow(closed.id)).toMatchObject({ status: 'triaged', investigator_id: null })

    // in the new office the old case is another office's (404), and new work can reach them
    const again = await signIn(t, investigator)
    expect((await again.get(`/api/cases/${c.id}`)).status).toBe(404)
    const supNew = await signIn(t, await makeUser(t, { role: 'supervisor', office: newOffice }))
    const staff = await supNew.get('/api/staff').expect(200)
    expect(staff.body.staff.map((s: { id: string }) => s.id)).toContain(investigator.id)
  })
})

describe('refusals', () => {
  it('names the field of each bad combination and changes nothing', async () => {
    const office = await makeOffice(t)
    const investigator = await makeUser(t, { role: 'investigator', office })
    const complainant = await makeUser(t, { role: 'complainant' })
    const other = await makeUser(t, { role: 'admin' })
    const c = await makeCase(t, { office, state: 'assigned', investigator })
    const agent = await signIn(t, investigator)
    const cases: [string, unknown, string][] = [
      [investigator.id, { officeId: null }, 'officeId'],
      [investigator.id, { role: 'complainant' }, 'role'],
      [investigator.id, { officeId: '00000000-0000-4000-8000-000000000000' }, 'officeId'],
      [investigator.id, { role: 'admin', officeId: office.id }, 'officeId'],
      [investigator.id, {}, 'role'],
      [investigator.id, { role: 'wizard' }, 'role'],
      [investigator.id, { active: 'yes' }, 'active'],
      [complainant.id, { role: 'investigator', officeId: office.id }, 'role'],
      [other.id, { role: 'supervisor' }, 'officeId'],
    ]
    for (const [id, body, field] of cases) {
      const res = await adminAgent.patch(`/api/admin/users/${id}`).send(body as object)
      expect(res.status, `${JSON.stringify(body)} → ${JSON.stringify(res.body)}`).toBe(400)
      expect(res.body.error.code).toBe('validation_failed')
      expect(res.body.error.details.map((d: { path: string }) => d.path)).toContain(field)
    }
    expect(await userRow(investigator.id)).toEqual({ role: 'investigator', office_id: office.id, active: true })
    expect(await userRow(complainant.id)).toEqual({ role: 'complainant', office_id: null, active: true })
    expect(await userRow(other.id)).toEqual({ role: 'admin', office_id: null, active: true })
    expect(await caseRow(c.id)).toMatchObject({ status: 'assigned', investigator_id: investigator.id })
    await agent.get('/api/me').expect(200)
    expect((await agent.get('/api/me')).body.user.id).toBe(investigator.id)
    expect((await auditOf(investigator.id)).map((a) => a.action)).toEqual(['user.invited'])
    expect((await adminAgent.patch('/api/admin/users/00000000-0000-4000-8000-000000000000').send({ active: false })).status).toBe(404)
    expect((await adminAgent.patch(`/api/admin/users/${admin.id}`).send({ active: false })).body.error.code).toBe('cannot_deactivate_self')
  })
})

describe('deactivating and reactivating', () => {
  it('ends the sessions, lets the person back in on reactivation, and audits both', async () => {
    const office = await makeOffice(t)
    const supervisor = await makeUser(t, { role: 'supervisor', office })
    const agent = await signIn(t, supervisor)
    const off = await adminAgent.patch(`/api/admin/users/${supervisor.id}`).send({ active: false })
    expect(off.status, JSON.stringify(off.body)).toBe(200)
    expect(personChangedResponseSchema.parse(off.body)).toMatchObject({ sessionsEnded: 1, user: { active: false } })
    expect((await agent.get('/api/cases')).status).toBe(401)
    const refused = await request(t.app).post('/api/auth/sign-in').set('X-Forwarded-For', uniqueAddress()).send({ email: supervisor.email, password: supervisor.password })
    expect(refused.status).toBe(401)

    const on = await adminAgent.patch(`/api/admin/users/${supervisor.id}`).send({ active: true })
    expect(on.status, JSON.stringify(on.body)).toBe(200)
    expect(personChangedResponseSchema.parse(on.body).user.active).toBe(true)
    await (await signIn(t, supervisor)).get('/api/cases').expect(200)
    expect((await auditOf(supervisor.id)).map((a) => a.action)).toEqual(['user.invited', 'user.deactivated', 'user.reactivated'])
  })

  it('returns a deactivated investigator’s open cases to triage, and reactivation gives none back', async () => {
    const office = await makeOffice(t)
    const investigator = await makeUser(t, { role: 'investigator', office })
    const open = await makeCase(t, { office, state: 'field_work', investigator })
    const closed = await makeCase(t, { office, state: 'closed', investigator })
    const off = await adminAgent.patch(`/api/admin/users/${investigator.id}`).send({ active: false }).expect(200)
    expect(personChangedResponseSchema.parse(off.body)).toMatchObject({ casesReturnedToTriage: 1 })
    expect(await caseRow(open.id)).toMatchObject({ status: 'triaged', investigator_id: null })
    expect((await eventsOf(open.id, 'returned_to_triage'))[0]!.body).toBe(`Returned to triage: ${investigator.name}'s account was deactivated. The case awaits a new investigator.`)
    expect(await caseRow(closed.id)).toMatchObject({ status: 'closed', investigator_id: investigator.id })
    expect((await auditOf(investigator.id)).at(-1)).toMatchObject({ action: 'user.deactivated', details: { role: 'investigator', sessionsEnded: 0, casesReturnedToTriage: 1 } })

    const on = await adminAgent.patch(`/api/admin/users/${investigator.id}`).send({ active: true }).expect(200)
    expect(personChangedResponseSchema.parse(on.body)).toMatchObject({ casesReturnedToTriage: 0 })
    expect(await caseRow(open.id)).toMatchObject({ status: 'triaged', investigator_id: null })
  })
})

describe('last sign-in', () => {
  it('is empty until the first sign-in, then recorded and listed', async () => {
    const office = await makeOffice(t)
    const investigator = await makeUser(t, { role: 'investigator', office })
    // the factory's set-password link signed them in once: forget it to see a first sign-in
    await t.pool.query(`UPDATE users SET last_signed_in_at = NULL WHERE id = $1`, [investigator.id])
    const listed = async () => usersResponseSchema.parse((await adminAgent.get('/api/admin/users').expect(200)).body).users.find((u) => u.id === investigator.id)!
    expect((await listed()).lastSignedInAt).toBeNull()
    const before = Date.now()
    await signIn(t, investigator)
    const at = Date.parse((await listed()).lastSignedInAt!)
    // the database's clock and the test's may differ by a little
    expect(Math.abs(at - before)).toBeLessThan(60_000)
    // colleagues do not see it in the office's staff list
    const colleague = await signIn(t, await makeUser(t, { role: 'supervisor', office }))
    const staff = (await colleague.get('/api/staff').expect(200)).body.staff as { id: string; lastSignedInAt: string | null }[]
    expect(staff.find((s) => s.id === investigator.id)!.lastSignedInAt).toBeNull()
    expect((await adminAgent.get(`/api/staff/${investigator.id}`).expect(200)).body.staff.lastSignedInAt).toBe((await listed()).lastSignedInAt)
  })
})

describe('the last active administrator', () => {
  let own: TestContext
  let ownerAdmin: pg.Client
  const name = `people_last_admin_${process.pid}`
  beforeAll(async () => {
    const ownerUrl = inject('migrationDatabaseUrl')
    ownerAdmin = new pg.Client({ connectionString: ownerUrl })
    await ownerAdmin.connect()
    await ownerAdmin.query(`DROP DATABASE IF EXISTS ${name}`)
    await ownerAdmin.query(`CREATE DATABASE ${name}`)
    await prepareDatabase(ownerUrl.replace(/\/[^/?]+(\?|$)/, `/${name}$1`))
    own = await createTestContext({ databaseUrl: inject('databaseUrl').replace(/\/[^/?]+(\?|$)/, `/${name}$1`) })
  }, 60_000)
  afterAll(async () => {
    await own?.close()
    // the job queue's connections may take a moment to go; FORCE would need a superuser's right
    // to end another role's sessions. The cluster is a throwaway one: a database left behind is harmless.
    for (let attempt = 0; attempt < 20; attempt++) {
      try {
        await ownerAdmin.query(`DROP DATABASE IF EXISTS ${name}`)
        break
      } catch {
        await new Promise((r) => setTimeout(r, 250))
      }
    }
    await ownerAdmin.end()
  })

  it('cannot be demoted or deactivated; of two demoting each other at once, one is refused', async () => {
    const office = await makeOffice(own)
    const a = await makeUser(own, { role: 'admin' })
    const b = await makeUser(own, { role: 'admin' })
    const activeAdmins = async () => (await own.pool.query<{ id: string }>(`SELECT id FROM users WHERE role = 'admin' AND active`)).rows.map((r) => r.id).sort()
    expect(await activeAdmins()).toEqual([a.id, b.id].sort())
    const [agentA, agentB] = [await signIn(own, a), await signIn(own, b)]

    const [resA, resB] = await Promise.all([
      agentA.patch(`/api/admin/users/${b.id}`).send({ role: 'supervisor', officeId: office.id }),
      agentB.patch(`/api/admin/users/${a.id}`).send({ role: 'supervisor', officeId: office.id }),
    ])
    // one wins; the other is refused as the last administrator (409), or, when it arrives after
    // the first has committed, finds its own session ended (401)
    expect([resA.status, resB.status].filter((s) => s === 200)).toHaveLength(1)
    const refused = resA.status === 200 ? resB : resA
    expect([401, 409]).toContain(refused.status)
    if (refused.status === 409) expect(refused.body.error.code).toBe('last_admin')
    const remaining = await activeAdmins()
    expect(remaining).toHaveLength(1)
    const last = remaining[0] === a.id ? a : b
    const demoted = last === a ? b : a
    expect((await own.pool.query(`SELECT role, office_id FROM users WHERE id = $1`, [demoted.id])).rows[0]).toEqual({ role: 'supervisor', office_id: office.id })

    // the last one alone: demoting themself is refused, and nothing changes
    const lastAgent = await signIn(own, last)
    const self = await lastAgent.patch(`/api/admin/users/${last.id}`).send({ role: 'supervisor', officeId: office.id })
    expect(self.status).toBe(409)
    expect(self.body.error.code).toBe('last_admin')
    expect(self.body.error.message).toMatch(/last active administrator/)
    expect((await own.pool.query(`SELECT role, office_id, active FROM users WHERE id = $1`, [last.id])).rows[0]).toEqual({ role: 'admin', office_id: null, active: true })
    await lastAgent.get('/api/admin/users').expect(200)
    const audit = await own.pool.query(`SELECT action FROM audit_log WHERE target_id = $1 AND action <> 'user.invited'`, [last.id])
    expect(audit.rows).toEqual([])

    // with a second administrator again, the first may step down (their own sessions end)
    await lastAgent.patch(`/api/admin/users/${demoted.id}`).send({ role: 'admin' }).expect(200)
    const stepDown = await lastAgent.patch(`/api/admin/users/${last.id}`).send({ role: 'supervisor', officeId: office.id })
    expect(stepDown.status, JSON.stringify(stepDown.body)).toBe(200)
    expect((await lastAgent.get('/api/admin/users')).status).toBe(401)
    expect(await activeAdmins()).toEqual([demoted.id])
  })
})
