import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { createTestContext, signedInAgent, uniqueAddress, type TestContext } from '../support/harness'
import { queuedMails, registerConfirmed } from '../support/accounts'
import { makeOffice, makeUser, signIn, type TestUser } from '../support/factories'
import { MAX_FAILURES_PER_ACCOUNT } from '../../server/modules/auth/auth.service'
import { NO_ACCOUNT_ABILITIES } from '../../shared/schemas/auth'
import type { Role } from '../../shared/domain/roles'
import type { Office } from '../../server/db/schema'

let t: TestContext
let office: Office
/** One account of each role, this file's own (staff of `office`). */
let user: Record<Role, TestUser>
beforeAll(async () => {
  t = await createTestContext()
  office = await makeOffice(t)
  user = {
    admin: await makeUser(t, { role: 'admin' }),
    supervisor: await makeUser(t, { role: 'supervisor', office }),
    investigator: await makeUser(t, { role: 'investigator', office }),
    complainant: await makeUser(t, { role: 'complainant' }),
  }
})
const credentials = (role: Role) => ({ email: user[role].email, password: user[role].password })
afterAll(() => t.close())

const anon = () => request.agent(t.app).set('X-Forwarded-For', uniqueAddress())

/** The link of the newest queued e-mail to an address (mail jobs are rows in pg-boss). */
async function linkFromQueuedMail(to: string): Promise<string> {
  const { rows } = await t.pool.query(
    `SELECT data FROM pgboss.job WHERE name LIKE 'mail-send%' AND data->>'to' = $1 ORDER BY created_on DESC LIMIT 1`,
    [to],
  )
  expect(rows, `a mail to ${to} was queued`).toHaveLength(1)
  const m = /https?:\/\/\S+\/set-password\?token=([A-Za-z0-9_-]+)/.exec(rows[0].data.text)
  expect(m, 'the mail carries a set-password link').not.toBeNull()
  return m![1]!
}

describe('sign-in', () => {
  it.each(['admin', 'supervisor', 'investigator', 'complainant'] as const)('signs in a %s and /api/me returns them with their role', async (role) => {
    const agent = await signIn(t, user[role])
    const me = await agent.get('/api/me').expect(200)
    expect(me.body.user).toMatchObject({ email: user[role].email, role })
    if (role === 'supervisor' || role === 'investigator') expect(me.body.user.officeName).toBe(office.name)
  })

  it.each([
    ['admin', { readCases: true, manageUsers: true, manageOffices: true, readBandLimits: true, manageBandLimits: true, readStationRegister: true, importStationRegister: true, readEquipment: true, manageEquipment: true, readDashboard: true, readAudit: true }],
    ['supervisor', { runOfficeQueue: true, readCases: true, readBandLimits: true, manageBandLimits: true, readStationRegister: true, readEquipment: true, manageEquipment: true, readDashboard: true }],
    ['investigator', { workAssignedCases: true, readCases: true, readBandLimits: true, readStationRegister: true, readEquipment: true }],
    ['complainant', { reportAsAccount: true, followOwnReports: true }],
  ] as const)('tells the signed-in %s what their account may do, and nothing more', async (role, allowed) => {
    const agent = await signIn(t, user[role])
    const me = await agent.get('/api/me').expect(200)
    expect(me.body.abilities).toEqual({ ...NO_ACCOUNT_ABILITIES, ...allowed })
  })

  it('gives the same abilities with the sign-in answer as /api/me does afterwards', async () => {
    const agent = anon()
    const signIn = await agent.post('/api/auth/sign-in').send(credentials('supervisor')).expect(200)
    const me = await agent.get('/api/me').expect(200)
    expect(signIn.body).toEqual(me.body)
    expect(signIn.body.abilities.runOfficeQueue).toBe(true)
  })

  it('gives an anonymous visitor no user and no abilities', async () => {
    expect((await anon().get('/api/me').expect(200)).body).toEqual({ user: null })
  })

  it('sets an HttpOnly, SameSite=Lax session cookie and a new session id at sign-in', async () => {
    const agent = anon()
    await agent.post('/api/auth/password-reset').send({ email: 'nobody-cookie@example.test' }) // no session created
    const res = await agent.post('/api/auth/sign-in').send(credentials('admin')).expect(200)
    const cookie = res.headers['set-cookie']![0]!
    expect(cookie).toMatch(/^qb\.sid=/)
    expect(cookie).toMatch(/HttpOnly/i)
    expect(cookie).toMatch(/SameSite=Lax/i)
    const first = cookie.split(';')[0]
    const again = await agent.post('/api/auth/sign-in').send(credentials('admin')).expect(200)
    expect(again.headers['set-cookie']![0]!.split(';')[0]).not.toBe(first)
  })

  it('answers a wrong password and an unknown account with the same generic 401', async () => {
    const wrong = await anon().post('/api/auth/sign-in').send({ email: user.investigator.email, password: 'not-the-password' }).expect(401)
    const unknown = await anon().post('/api/auth/sign-in').send({ email: 'nobody-at-all@example.test', password: 'not-the-password' }).expect(401)
    expect(wrong.body.error.code).toBe('invalid_credentials')
    expect(wrong.body.error.message).toBe('E-mail or password is not correct.')
    expect(unknown.body.error).toMatchObject({ code: wrong.body.error.code, message: wrong.body.error.message })
  })

  it('refuses the address that keeps guessing one account, even with the right password', async () => {
    const email = `guessed-${process.pid}-${Date.now()}@example.test`
    await registerConfirmed(t, email, 'right-password-1')
    const guesser = anon()
    for (let i = 0; i < MAX_FAILURES_PER_ACCOUNT; i++) {
      await guesser.post('/api/auth/sign-in').send({ email, password: `wrong-${i}-password` }).expect(401)
    }
    const res = await guesser.post('/api/auth/sign-in').send({ email, password: 'right-password-1' }).expect(429)
    expect(res.body.error.code).toBe('too_many_attempts')
    expect(res.body.error.message).toContain('ask for a link by e-mail')
  })

  it('refuses with 429 after repeated failures from one address across accounts', async () => {
    const agent = anon()
    for (let i = 0; i < 20; i++) {
      await agent.post('/api/auth/sign-in').send({ email: `spray-${i}@example.test`, password: 'guess-guess' }).expect(401)
    }
    await agent.post('/api/auth/sign-in').send(credentials('admin')).expect(429)
  })

  it('limits registrations, reset requests and password settings per address (429 after 30 an hour)', async () => {
    const agent = anon()
    for (let i = 0; i < 30; i++) await agent.post('/api/auth/register').send({}).expect(400)
    const res = await agent.post('/api/auth/set-password').send({}).expect(429)
    expect(res.body.error.code).toBe('too_many_attempts')
  })

  it('signs out: /api/me then answers that nobody is signed in', async () => {
    const agent = await signIn(t, user.supervisor)
    await agent.post('/api/auth/sign-out').expect(204)
    expect((await agent.get('/api/me').expect(200)).body).toEqual({ user: null })
  })

  it('lists every field error of a malformed sign-in', async () => {
    const res = await anon().post('/api/auth/sign-in').send({ email: 'not-an-address' }).expect(400)
    expect(res.body.error.code).toBe('validation_failed')
    expect(res.body.error.details.map((d: { path: string }) => d.path).sort()).toEqual(['email', 'password'])
  })
})

describe('complainant registration', () => {
  it('creates a complainant account that works once the e-mailed link confirms the address', async () => {
    const agent = anon()
    const email = `reg-${process.pid}-${Date.now()}@example.test`
    const res = await agent.post('/api/auth/register').send({ name: 'Nell Ashgrove', email, password: 'a-long-enough-pass' }).expect(202)
    expect(res.body).toEqual({ ok: true })
    expect((await agent.get('/api/me').expect(200)).body.user, 'registering signs nobody in').toBeNull()
    const early = await anon().post('/api/auth/sign-in').send({ email, password: 'a-long-enough-pass' }).expect(403)
    expect(early.body.error.code).toBe('email_not_confirmed')
    const [mail] = await queuedMails(t, email)
    expect(mail!.subject).toBe('Confirm your e-mail address for Quietband')
    const token = /\/confirm-email\?token=([A-Za-z0-9_-]+)/.exec(mail!.text)![1]
    const confirmed = anon()
    const done = await confirmed.post('/api/auth/confirm-email').send({ token }).expect(200)
    expect(done.body.user).toMatchObject({ email, role: 'complainant', officeId: null })
    expect((await confirmed.get('/api/me').expect(200)).body.user.email).toBe(email)
    await anon().post('/api/auth/confirm-email').send({ token }).expect(400) // single use
    await anon().post('/api/auth/sign-in').send({ email, password: 'a-long-enough-pass' }).expect(200)
  })
})

describe('password reset', () => {
  it('e-mails a single-use link that sets a new password', async () => {
    const email = `reset-${Date.now()}@example.test`
    await registerConfirmed(t, email, 'first-password-1', 'Ola Reset')
    await anon().post('/api/auth/password-reset').send({ email }).expect(202)
    const token = await linkFromQueuedMail(email)
    const { rows } = await t.pool.query(`SELECT count(*)::int AS n FROM password_tokens WHERE token_hash = $1`, [token])
    expect(rows[0].n, 'the raw token is never stored').toBe(0)
    await anon().post('/api/auth/set-password').send({ token, password: 'second-password-2' }).expect(200)
    await anon().post('/api/auth/set-password').send({ token, password: 'third-password-3' }).expect(400)
    await anon().post('/api/auth/sign-in').send({ email, password: 'first-password-1' }).expect(401)
    await anon().post('/api/auth/sign-in').send({ email, password: 'second-password-2' }).expect(200)
  })

  it('refuses an expired link', async () => {
    const email = `expired-${Date.now()}@example.test`
    await registerConfirmed(t, email, 'first-password-1', 'Ola Late')
    await anon().post('/api/auth/password-reset').send({ email }).expect(202)
    const token = await linkFromQueuedMail(email)
    await t.pool.query(`UPDATE password_tokens SET expires_at = now() - interval '1 minute' WHERE user_id = (SELECT id FROM users WHERE email = $1)`, [email])
    const res = await anon().post('/api/auth/set-password').send({ token, password: 'second-password-2' }).expect(400)
    expect(res.body.error.code).toBe('invalid_token')
  })

  it('answers 202 for an unknown address too, and e-mails it a note without any link to set a password', async () => {
    const email = `ghost-${process.pid}-${Date.now()}@example.test`
    const res = await anon().post('/api/auth/password-reset').send({ email }).expect(202)
    expect(res.body).toEqual({ ok: true })
    const mails = await queuedMails(t, email)
    expect(mails.map((m) => m.subject)).toEqual(['About your Quietband password request'])
    expect(mails[0]!.text).not.toContain('set-password')
  })
})

describe('staff accounts', () => {
  it('lets an administrator create an investigator, who sets a password from the e-mailed link and signs in', async () => {
    const admin = await signIn(t, user.admin)
    const email = `new.staff.${process.pid}.${Date.now()}@quietband.test`
    const created = await admin.post('/api/admin/users').send({ name: 'Pia Hollow', email, role: 'investigator', officeId: office.id }).expect(201)
    expect(created.body.user).toMatchObject({ email, role: 'investigator', officeName: office.name })
    await anon().post('/api/auth/sign-in').send({ email, password: 'anything-at-all' }).expect(401)
    const token = await linkFromQueuedMail(email)
    await anon().post('/api/auth/set-password').send({ token, password: 'my-own-password' }).expect(200)
    const agent = await signedInAgent(t.app, email, 'my-own-password')
    expect((await agent.get('/api/me').expect(200)).body.user.role).toBe('investigator')
  })

  it('refuses an investigator or supervisor without an office', async () => {
    const admin = await signIn(t, user.admin)
    const res = await admin.post('/api/admin/users').send({ name: 'No Office', email: `no-office-${Date.now()}@quietband.test`, role: 'supervisor', officeId: null }).expect(400)
    expect(res.body.error.details).toEqual([{ path: 'officeId', message: 'Investigators and supervisors belong to an office.' }])
  })

  it('deactivated accounts cannot sign in', async () => {
    const admin = await signIn(t, user.admin)
    const email = `leaver-${Date.now()}@example.test`
    const reg = await registerConfirmed(t, email, 'leaver-password', 'Leaver')
    await anon().post('/api/auth/sign-in').send({ email, password: 'leaver-password' }).expect(200)
    await admin.patch(`/api/admin/users/${reg.id}`).send({ active: false }).expect(200)
    await anon().post('/api/auth/sign-in').send({ email, password: 'leaver-password' }).expect(401)
  })
})

describe('cross-site protection', () => {
  it('refuses a state-changing request whose Origin is another site', async () => {
    const res = await anon().post('/api/auth/sign-in').set('Origin', 'https://evil.example').send(credentials('admin')).expect(403)
    expect(res.body.error.code).toBe('cross_site_request')
  })

  it('accepts the same request from the app’s own origin', async () => {
    await anon().post('/api/auth/sign-in').set('Origin', 'http://127.0.0.1:3999').send(credentials('admin')).expect(200)
  })

  it('refuses another site even when the request names that site in its Host header', async () => {
    const res = await anon().post('/api/auth/sign-in').set('Host', 'evil.example').set('Origin', 'http://evil.example').send(credentials('admin')).expect(403)
    expect(res.body.error.code).toBe('cross_site_request')
  })

  it('refuses a cross-site request that carries only Sec-Fetch-Site', async () => {
    await anon().post('/api/auth/sign-out').set('Sec-Fetch-Site', 'cross-site').expect(403)
  })
})

describe('who is signed in', () => {
  it('answers an anonymous visitor with 200 and no user, not an error', async () => {
    const res = await anon().get('/api/me').expect(200)
    expect(res.body).toEqual({ user: null })
  })
})

describe('strict transport security', () => {
  it('is not sent over plain http', async () => {
    const res = await anon().get('/api/health').expect(200)
    expect(res.headers['strict-transport-security']).toBeUndefined()
  })

  it('is sent over https (here: behind the one trusted proxy that ended TLS)', async () => {
    const res = await anon().get('/api/health').set('X-Forwarded-Proto', 'https').expect(200)
    expect(res.headers['strict-transport-security']).toMatch(/max-age=\d+/)
  })
})
