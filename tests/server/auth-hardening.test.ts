/**
 * Sign-in limits under concurrency, what setting a password ends, reset e-mail limits,
 * deactivated accounts' sessions, and the origin check on every state-changing method.
 * (Failures that slow an account down instead of locking it: auth-lockout.test.ts.)
 * Every account here is made for the test: demo accounts' sessions are shared with other files.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { createTestContext, signedInAgent, uniqueAddress, type TestContext } from '../support/harness'
import { queuedTokens as queuedLinkTokens, registerConfirmed } from '../support/accounts'
import { makeOffice, makeUser, signIn, type TestUser } from '../support/factories'
import { MAX_FAILURES_PER_ACCOUNT, MAX_RESET_MAILS_PER_HOUR } from '../../server/modules/auth/auth.service'
import type { Office } from '../../server/db/schema'

let t: TestContext
let office: Office
let adminUser: TestUser
beforeAll(async () => {
  t = await createTestContext()
  office = await makeOffice(t)
  adminUser = await makeUser(t, { role: 'admin' })
})
afterAll(() => t.close())

const anon = () => request.agent(t.app).set('X-Forwarded-For', uniqueAddress())
let n = 0
const freshEmail = (what: string) => `${what}-${process.pid}-${Date.now()}-${++n}@example.test`

/** Registers a complainant account and confirms it; returns its id and the agent signed in as it. */
const register = (email: string, password = 'first-password-1') => registerConfirmed(t, email, password)

/** The token of every set-password link queued to an address, oldest first. */
const queuedTokens = (to: string) => queuedLinkTokens(t, to, 'set-password')

describe('sign-in limits', () => {
  it('count parallel guesses from one address against one account: of 20 at once, at most the limit reach the password check', async () => {
    const email = freshEmail('burst')
    const address = uniqueAddress()
    const results = await Promise.all(
      Array.from({ length: 20 }, (_, i) => request(t.app).post('/api/auth/sign-in').set('X-Forwarded-For', address).send({ email, password: `wrong-guess-${i}` })),
    )
    const statuses = results.map((r) => r.status)
    expect(statuses.every((s) => s === 401 || s === 429), statuses.join(',')).toBe(true)
    expect(statuses.filter((s) => s === 401).length, statuses.join(',')).toBeLessThanOrEqual(MAX_FAILURES_PER_ACCOUNT)
    for (const r of results.filter((x) => x.status === 429)) expect(r.body.error.code).toBe('too_many_attempts')
  })

  it('let the right password through after fewer failures than the limit, and count it as a success', async () => {
    const email = freshEmail('almost')
    await register(email, 'right-password-1')
    const agent = anon()
    for (let i = 0; i < MAX_FAILURES_PER_ACCOUNT - 1; i++) await agent.post('/api/auth/sign-in').send({ email, password: `wrong-${i}-password` }).expect(401)
    await agent.post('/api/auth/sign-in').send({ email, password: 'right-password-1' }).expect(200)
    const { rows } = await t.pool.query(`SELECT succeeded, count(*)::int AS n FROM sign_in_attempts WHERE email = $1 GROUP BY succeeded ORDER BY succeeded`, [email])
    expect(rows).toEqual([
      { succeeded: false, n: MAX_FAILURES_PER_ACCOUNT - 1 },
      { succeeded: true, n: 1 },
    ])
  })

  it('do not count refused attempts, so knocking on after a refusal does not prolong it', async () => {
    const email = freshEmail('locked')
    const guesser = anon()
    for (let i = 0; i < MAX_FAILURES_PER_ACCOUNT; i++) await guesser.post('/api/auth/sign-in').send({ email, password: `wrong-${i}-password` }).expect(401)
    for (let i = 0; i < 3; i++) await guesser.post('/api/auth/sign-in').send({ email, password: 'another-guess' }).expect(429)
    const { rows } = await t.pool.query(`SELECT count(*)::int AS n FROM sign_in_attempts WHERE email = $1`, [email])
    expect(rows[0].n).toBe(MAX_FAILURES_PER_ACCOUNT)
  })
})

describe('setting a password from a link', () => {
  it('ends every session the account had, and signs in only the person who used the link', async () => {
    const email = freshEmail('stolen-session')
    const { agent: before } = await register(email)
    const elsewhere = await signedInAgent(t.app, email, 'first-password-1')
    expect((await before.get('/api/me').expect(200)).body.user.email).toBe(email)
    await anon().post('/api/auth/password-reset').send({ email }).expect(202)
    const [token] = await queuedTokens(email)
    const user = anon()
    await user.post('/api/auth/set-password').send({ token, password: 'second-password-2' }).expect(200)
    expect((await before.get('/api/me').expect(200)).body.user).toBeNull()
    expect((await elsewhere.get('/api/me').expect(200)).body.user).toBeNull()
    expect((await user.get('/api/me').expect(200)).body.user.email).toBe(email)
  })

  it('leaves other accounts’ sessions alone', async () => {
    const mine = freshEmail('mine')
    const theirs = freshEmail('theirs')
    await register(mine)
    const { agent: other } = await register(theirs)
    await anon().post('/api/auth/password-reset').send({ email: mine }).expect(202)
    const [token] = await queuedTokens(mine)
    await anon().post('/api/auth/set-password').send({ token, password: 'second-password-2' }).expect(200)
    expect((await other.get('/api/me').expect(200)).body.user.email).toBe(theirs)
  })

  it('revokes every other outstanding link of the account', async () => {
    const email = freshEmail('two-links')
    await register(email)
    await anon().post('/api/auth/password-reset').send({ email }).expect(202)
    await anon().post('/api/auth/password-reset').send({ email }).expect(202)
    const [first, second] = await queuedTokens(email)
    expect(first).toBeDefined()
    expect(second).toBeDefined()
    await anon().post('/api/auth/set-password').send({ token: second, password: 'second-password-2' }).expect(200)
    const res = await anon().post('/api/auth/set-password').send({ token: first, password: 'third-password-3' }).expect(400)
    expect(res.body.error.code).toBe('invalid_token')
    await anon().post('/api/auth/sign-in').send({ email, password: 'second-password-2' }).expect(200)
  })

  it('refuses an invitation link once the account has been deactivated', async () => {
    const admin = await signIn(t, adminUser)
    const email = `invited-${process.pid}-${Date.now()}@quietband.test`
    const created = await admin.post('/api/admin/users').send({ name: 'Nia Pending', email, role: 'investigator', officeId: office.id }).expect(201)
    await admin.patch(`/api/admin/users/${created.body.user.id}`).send({ active: false }).expect(200)
    const [token] = await queuedTokens(email)
    const res = await anon().post('/api/auth/set-password').send({ token, password: 'my-own-password' }).expect(400)
    expect(res.body.error.code).toBe('invalid_token')
  })
})

describe('reset e-mails', () => {
  it(`go out at most ${MAX_RESET_MAILS_PER_HOUR} times an hour to one account, while every request answers 202 alike`, async () => {
    const email = freshEmail('flood')
    await register(email)
    for (let i = 0; i < MAX_RESET_MAILS_PER_HOUR + 3; i++) {
      const res = await anon().post('/api/auth/password-reset').send({ email }).expect(202)
      expect(res.body).toEqual({ ok: true })
    }
    expect(await queuedTokens(email)).toHaveLength(MAX_RESET_MAILS_PER_HOUR)
  })

  it('are limited per account even when the requests come at once', async () => {
    const email = freshEmail('flood-burst')
    await register(email)
    await Promise.all(Array.from({ length: 10 }, () => anon().post('/api/auth/password-reset').send({ email }).expect(202)))
    expect(await queuedTokens(email)).toHaveLength(MAX_RESET_MAILS_PER_HOUR)
  })
})

describe('a deactivated account', () => {
  it('loses its open sessions at once, and gets them back only by signing in after reactivation', async () => {
    const admin = await signIn(t, adminUser)
    const email = freshEmail('leaver')
    const { id, agent } = await register(email, 'leaver-password')
    expect((await agent.get('/api/me').expect(200)).body.user.id).toBe(id)
    await admin.patch(`/api/admin/users/${id}`).send({ active: false }).expect(200)
    expect((await agent.get('/api/me').expect(200)).body).toEqual({ user: null })
    const res = await agent.get('/api/my/reports').expect(401)
    expect(res.body.error.code).toBe('unauthenticated')
    await admin.patch(`/api/admin/users/${id}`).send({ active: true }).expect(200)
    expect((await agent.get('/api/me').expect(200)).body).toEqual({ user: null })
    await signedInAgent(t.app, email, 'leaver-password')
  })
})

describe('the origin check', () => {
  it.each([
    ['PUT', '/api/offices/00000000-0000-4000-8000-000000000000/response-targets', { p1: 4, p2: 24, p3: 72, p4: 240 }],
    ['PATCH', '/api/admin/users/00000000-0000-4000-8000-000000000000', { active: false }],
    ['DELETE', '/api/admin/users/00000000-0000-4000-8000-000000000000', {}],
    ['POST', '/api/cases/00000000-0000-4000-8000-000000000000/close', { version: 1 }],
  ] as const)('refuses %s from another site before anything else runs, even for a signed-in administrator', async (method, path, body) => {
    const admin = await signIn(t, adminUser)
    const call = admin[method.toLowerCase() as 'put' | 'patch' | 'delete' | 'post'](path)
    const res = await call.set('Origin', 'https://evil.example').send(body)
    expect(res.status).toBe(403)
    expect(res.body.error.code).toBe('cross_site_request')
  })

  it('refuses an opaque origin ("null") and a same-site but not same-origin request', async () => {
    const a = await anon().post('/api/auth/sign-in').set('Origin', 'null').send({ email: adminUser.email, password: adminUser.password })
    expect(a.status).toBe(403)
    const b = await anon().post('/api/auth/sign-in').set('Sec-Fetch-Site', 'same-site').send({ email: adminUser.email, password: adminUser.password })
    expect(b.status).toBe(403)
  })

  it('lets reads through from anywhere (they change nothing)', async () => {
    await anon().get('/api/health').set('Origin', 'https://evil.example').expect(200)
  })
})
