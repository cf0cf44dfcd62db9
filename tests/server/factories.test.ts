/** The test factories: each test's office, people and cases are its own and are what they say. */
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { CASE_STATES } from '../../shared/domain/case-lifecycle'
import { createTestContext, type TestContext } from '../support/harness'
import { makeCase, makeOffice, makeUser, pathTo, signIn } from '../support/factories'

let t: TestContext
beforeAll(async () => {
  t = await createTestContext()
})
afterAll(() => t.close())

describe('the test factories', () => {
  it('walk a case to every state along the lifecycle’s own moves', async () => {
    const office = await makeOffice(t)
    const supervisor = await makeUser(t, { role: 'supervisor', office })
    const investigator = await makeUser(t, { role: 'investigator', office })
    for (const state of CASE_STATES) {
      const c = await makeCase(t, { office, state, supervisor, investigator })
      const { rows } = await t.pool.query(`SELECT status, version, office_id FROM cases WHERE id = $1`, [c.id])
      expect(rows[0], state).toEqual({ status: state, version: c.version, office_id: office.id })
      expect(c.version, state).toBe(1 + pathTo(state).length)
    }
  })

  it('route each office’s reports to that office, beside any number of other offices', async () => {
    const [a, b] = [await makeOffice(t), await makeOffice(t)]
    const inA = await makeCase(t, { office: a })
    const inB = await makeCase(t, { office: b })
    expect([inA.office.id, inB.office.id]).toEqual([a.id, b.id])
    const { rows } = await t.pool.query(`SELECT id, office_id FROM cases WHERE id = ANY($1) ORDER BY reference`, [[inA.id, inB.id]])
    expect(new Map(rows.map((r) => [r.id, r.office_id]))).toEqual(new Map([[inA.id, a.id], [inB.id, b.id]]))
  })

  it('make users who sign in with their own password and see their own office', async () => {
    const office = await makeOffice(t)
    const supervisor = await makeUser(t, { role: 'supervisor', office })
    const me = await (await signIn(t, supervisor)).get('/api/me').expect(200)
    expect(me.body.user).toMatchObject({ id: supervisor.id, role: 'supervisor', officeId: office.id, officeName: office.name })
    const complainant = await makeUser(t, { role: 'complainant' })
    expect((await (await signIn(t, complainant)).get('/api/me').expect(200)).body.user).toMatchObject({ id: complainant.id, role: 'complainant' })
  })

  it('set a priority asked for at triage', async () => {
    const office = await makeOffice(t)
    const c = await makeCase(t, { office, state: 'assigned', priority: 1 })
    const { rows } = await t.pool.query(`SELECT status, priority FROM cases WHERE id = $1`, [c.id])
    expect(rows[0]).toEqual({ status: 'assigned', priority: 1 })
  })
})
