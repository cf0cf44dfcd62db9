/**
 * Nobody learns from registration or a password reset whether an address has an account:
 * both answer alike and do the same work, and the e-mail tells the owner the rest. A new
 * account works once its address is confirmed; a confirmed address brings the reports
 * filed with it without signing in into "My reports".
 * (Equal time is shown by ops/bench/account-discovery.bench.ts, never asserted here.)
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { createTestContext, uniqueAddress, type TestContext } from '../support/harness'
import { queuedMails, queuedTokens, registerConfirmed } from '../support/accounts'
import { fileReport, validReport } from '../support/cases'
import { makeOffice, makeUser, reportNear, signIn } from '../support/factories'
import type { Office } from '../../server/db/schema'
import { MAX_ACCOUNT_MAILS_PER_HOUR } from '../../server/modules/auth/auth.service'

let t: TestContext
let office: Office // where this file's reports go, away from every other file's
beforeAll(async () => {
  t = await createTestContext()
  office = await makeOffice(t)
})
afterAll(() => t.close())

const anon = () => request.agent(t.app).set('X-Forwarded-For', uniqueAddress())
let n = 0
const freshEmail = (what: string) => `${what}-${process.pid}-${Date.now()}-${++n}@example.test`
const register = (email: string, password = 'a-long-enough-pass', name = 'Ada Pell') => anon().post('/api/auth/register').send({ name, email, password })

describe('registration', () => {
  it('answers a new address and an address with an account the same way', async () => {
    const fresh = await register(freshEmail('new'))
    const taken = await register((await makeUser(t, { role: 'complainant' })).email)
    expect([fresh.status, taken.status]).toEqual([202, 202])
    expect(taken.body).toEqual(fresh.body)
    expect(taken.body).toEqual({ ok: true })
    expect(Object.keys(taken.headers).filter((h) => h !== 'date' && h !== 'x-request-id' && h !== 'etag').sort()).toEqual(
      Object.keys(fresh.headers).filter((h) => h !== 'date' && h !== 'x-request-id' && h !== 'etag').sort(),
    )
  })

  it('e-mails the owner of an existing account that someone tried, with no confirmation link, and changes nothing', async () => {
    const email = freshEmail('owner')
    await registerConfirmed(t, email, 'owners-password-1', 'Owen Bell')
    await register(email, 'intruders-password-1', 'Someone Else').expect(202)
    const mails = await queuedMails(t, email)
    expect(mails.map((m) => m.subject)).toEqual(['Confirm your e-mail address for Quietband', 'Someone tried to create a Quietband account with your address'])
    expect(mails[1]!.text).toContain('Hello Owen Bell')
    expect(mails[1]!.text).not.toContain('confirm-email')
    await anon().post('/api/auth/sign-in').send({ email, password: 'intruders-password-1' }).expect(401)
    const owner = await anon().post('/api/auth/sign-in').send({ email, password: 'owners-password-1' }).expect(200)
    expect(owner.body.user.name).toBe('Owen Bell')
  })

  it(`sends an address at most ${MAX_ACCOUNT_MAILS_PER_HOUR} registration e-mails an hour (its confirmation included), while every attempt answers alike`, async () => {
    const email = freshEmail('flooded')
    await registerConfirmed(t, email)
    for (let i = 0; i < MAX_ACCOUNT_MAILS_PER_HOUR + 3; i++) expect((await register(email).expect(202)).body).toEqual({ ok: true })
    const subjects = (await queuedMails(t, email)).map((m) => m.subject)
    expect(subjects).toHaveLength(MAX_ACCOUNT_MAILS_PER_HOUR)
    expect(subjects.filter((s) => s.startsWith('Someone tried'))).toHaveLength(MAX_ACCOUNT_MAILS_PER_HOUR - 1)
  })

  it('signs nobody in, and the new account cannot sign in before its address is confirmed', async () => {
    const email = freshEmail('pending')
    const agent = anon()
    await agent.post('/api/auth/register').send({ name: 'Pending Person', email, password: 'a-long-enough-pass' }).expect(202)
    expect((await agent.get('/api/me').expect(200)).body.user).toBeNull()
    const res = await anon().post('/api/auth/sign-in').send({ email, password: 'a-long-enough-pass' }).expect(403)
    expect(res.body.error.code).toBe('email_not_confirmed')
  })

  it('does not reveal the account through the sign-in error for a wrong password on an unconfirmed account', async () => {
    const email = freshEmail('pending-wrong')
    await register(email).expect(202)
    const wrong = await anon().post('/api/auth/sign-in').send({ email, password: 'not-the-password' }).expect(401)
    const nobody = await anon().post('/api/auth/sign-in').send({ email: freshEmail('nobody'), password: 'not-the-password' }).expect(401)
    expect(wrong.body.error.message).toBe(nobody.body.error.message)
  })
})

describe('the confirmation link', () => {
  it('cannot be used to set a password, nor a password link to confirm', async () => {
    const email = freshEmail('purposes')
    await register(email).expect(202)
    const [confirm] = await queuedTokens(t, email, 'confirm-email')
    const asPassword = await anon().post('/api/auth/set-password').send({ token: confirm, password: 'hijacked-password-1' }).expect(400)
    expect(asPassword.body.error.code).toBe('invalid_token')
    await anon().post('/api/auth/password-reset').send({ email }).expect(202)
    const [reset] = await queuedTokens(t, email, 'set-password')
    const asConfirm = await anon().post('/api/auth/confirm-email').send({ token: reset }).expect(400)
    expect(asConfirm.body.error.code).toBe('invalid_token')
    // both links still do their own job
    await anon().post('/api/auth/confirm-email').send({ token: confirm }).expect(200)
    await anon().post('/api/auth/set-password').send({ token: reset, password: 'chosen-password-2' }).expect(200)
  })

  it('is refused once expired', async () => {
    const email = freshEmail('late')
    await register(email).expect(202)
    const [token] = await queuedTokens(t, email, 'confirm-email')
    await t.pool.query(`UPDATE password_tokens SET expires_at = now() - interval '1 minute' WHERE user_id = (SELECT id FROM users WHERE email = $1)`, [email])
    const res = await anon().post('/api/auth/confirm-email').send({ token }).expect(400)
    expect(res.body.error.code).toBe('invalid_token')
  })
})

describe('a password set from a reset link', () => {
  it('confirms the address too, so the owner can take back an address someone else registered first', async () => {
    const email = freshEmail('squatted')
    await register(email, 'squatters-password-1', 'Not The Owner').expect(202)
    await anon().post('/api/auth/password-reset').send({ email }).expect(202)
    const [token] = await queuedTokens(t, email, 'set-password')
    await anon().post('/api/auth/set-password').send({ token, password: 'owners-password-2' }).expect(200)
    await anon().post('/api/auth/sign-in').send({ email, password: 'owners-password-2' }).expect(200)
    await anon().post('/api/auth/sign-in').send({ email, password: 'squatters-password-1' }).expect(401)
  })
})

describe('"My reports" of a confirmed account', () => {
  it('lists the reports filed with its address without signing in, before and after the account was made', async () => {
    const email = freshEmail('reporter')
    const before = await fileReport(t, { email, ...reportNear(office) })
    const other = await fileReport(t, reportNear(office)) // someone else's address
    const { agent } = await registerConfirmed(t, email)
    const after = await fileReport(t, { email, ...reportNear(office) })
    const res = await agent.get('/api/my/reports').expect(200)
    const refs = res.body.reports.map((r: { reference: string }) => r.reference)
    expect(refs.sort()).toEqual([before.reference, after.reference].sort())
    expect(refs).not.toContain(other.reference)
    const detail = await agent.get(`/api/my/reports/${before.id}`).expect(200)
    expect(detail.body.report.reference).toBe(before.reference)
  })

  it('does not take reports of an address whose account is not confirmed', async () => {
    const email = freshEmail('unconfirmed-reporter')
    const filed = await fileReport(t, { email, ...reportNear(office) })
    await register(email).expect(202)
    const { rows } = await t.pool.query(`SELECT complainant_user_id FROM cases WHERE id = $1`, [filed.id])
    expect(rows[0].complainant_user_id).toBeNull()
  })

  it('leaves another account’s own list as it was', async () => {
    const owner = await makeUser(t, { role: 'complainant' })
    const agent = await signIn(t, owner)
    const filed = await agent.post('/api/reports').send(validReport({ email: owner.email, ...reportNear(office) })).expect(201)
    await registerConfirmed(t, freshEmail('newcomer'))
    const res = await agent.get('/api/my/reports').expect(200)
    expect(res.body.reports.map((r: { reference: string }) => r.reference)).toEqual([filed.body.reference])
  })
})
