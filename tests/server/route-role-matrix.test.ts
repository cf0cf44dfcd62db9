/**
 * Every /api route, called as anonymous and as each role, answers the expected status.
 * A route that exists in the app but not in this matrix fails the first test: new routes
 * must join it.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import fs from 'node:fs'
import os from 'node:os'
import path from 'node:path'
import { createTestContext, DEMO, signedInAgent, uniqueAddress, type TestContext } from '../support/harness'
import { listRoutes } from '../support/routes'

type Who = 'anonymous' | 'complainant' | 'investigator' | 'supervisor' | 'admin'
const WHO: Who[] = ['anonymous', 'complainant', 'investigator', 'supervisor', 'admin']
const ACCOUNT: Record<Exclude<Who, 'anonymous'>, string> = {
  complainant: DEMO.complainant,
  investigator: DEMO.investigator, // Harrowmere
  supervisor: DEMO.supervisor, // Harrowmere
  admin: DEMO.admin,
}

interface Row {
  route: string
  /** Concrete path to call (route parameters filled in). */
  path?: (ids: Ids) => string
  body?: unknown
  expect: [number, number, number, number, number] // anonymous, complainant, investigator, supervisor, admin
}
interface Ids {
  otherOfficeId: string
  otherOfficeStaffId: string
  ownOfficeId: string
}

const MATRIX: Row[] = [
  { route: 'GET /api/health', expect: [200, 200, 200, 200, 200] },
  { route: 'GET /api/me', expect: [401, 200, 200, 200, 200] },
  { route: 'POST /api/auth/sign-in', body: { email: 'matrix-nobody@example.test', password: 'not-a-password' }, expect: [401, 401, 401, 401, 401] },
  { route: 'POST /api/auth/sign-out', expect: [204, 204, 204, 204, 204] },
  { route: 'POST /api/auth/register', body: { name: '', email: 'not-an-address', password: 'short' }, expect: [400, 400, 400, 400, 400] },
  { route: 'POST /api/auth/password-reset', body: { email: 'nobody@example.test' }, expect: [202, 202, 202, 202, 202] },
  { route: 'POST /api/auth/set-password', body: { token: 'x'.repeat(43), password: 'long-enough-password' }, expect: [400, 400, 400, 400, 400] },
  { route: 'GET /api/admin/users', expect: [401, 403, 403, 403, 200] },
  { route: 'POST /api/admin/users', body: {}, expect: [401, 403, 403, 403, 400] },
  {
    route: 'PATCH /api/admin/users/:id',
    path: () => '/api/admin/users/00000000-0000-4000-8000-000000000000',
    body: { active: true },
    expect: [401, 403, 403, 403, 404],
  },
  { route: 'GET /api/staff', expect: [401, 403, 200, 200, 200] },
  { route: 'GET /api/staff/:id', path: (ids) => `/api/staff/${ids.otherOfficeStaffId}`, expect: [401, 403, 404, 404, 200] },
  { route: 'GET /api/offices', expect: [401, 403, 200, 200, 200] },
  { route: 'GET /api/offices/:id', path: (ids) => `/api/offices/${ids.otherOfficeId}`, expect: [401, 403, 404, 404, 200] },
  { route: 'GET /api/dev/mailbox', expect: [200, 200, 200, 200, 200] },
]

let t: TestContext
let ids: Ids
const mailboxDir = fs.mkdtempSync(path.join(os.tmpdir(), 'qb-matrix-mail-'))

beforeAll(async () => {
  t = await createTestContext({ mailboxDir })
  const { rows: offices } = await t.pool.query(`SELECT id, name FROM offices`)
  const { rows: staff } = await t.pool.query(`SELECT id FROM users WHERE email = $1`, [DEMO.otherInvestigator])
  ids = {
    ownOfficeId: offices.find((o) => o.name === 'Harrowmere').id,
    otherOfficeId: offices.find((o) => o.name === 'Kestrel Bay').id,
    otherOfficeStaffId: staff[0].id,
  }
})
afterAll(async () => {
  await t.close()
  fs.rmSync(mailboxDir, { recursive: true, force: true })
})

describe('route × role matrix', () => {
  it('covers every /api route of the app, and only those', () => {
    expect(MATRIX.map((r) => r.route).sort()).toEqual(listRoutes(t.handle.api))
  })

  for (const row of MATRIX) {
    it(`${row.route} answers ${row.expect.join('/')} to ${WHO.join('/')}`, async () => {
      const [method, routePath] = row.route.split(' ') as [string, string]
      const target = row.path ? row.path(ids) : routePath
      const got: number[] = []
      for (const who of WHO) {
        // a fresh agent per call: sign-out must not end the session other rows use
        const agent = who === 'anonymous' ? request.agent(t.app).set('X-Forwarded-For', uniqueAddress()) : await signedInAgent(t.app, ACCOUNT[who])
        const call = agent[method.toLowerCase() as 'get' | 'post' | 'patch' | 'delete'](target)
        const res = row.body !== undefined ? await call.send(row.body as object) : await call
        got.push(res.status)
        if (res.status >= 400) {
          // every error uses the one body shape
          expect(res.body.error, `${who} ${row.route}`).toMatchObject({ code: expect.any(String), message: expect.any(String), requestId: expect.any(String) })
        }
      }
      expect(got).toEqual(row.expect)
    })
  }
})
