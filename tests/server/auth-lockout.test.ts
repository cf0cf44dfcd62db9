/**
 * Wrong passwords slow an account down instead of locking it: a stranger's guesses cannot
 * keep the owner out, the address that keeps guessing is refused, and a password set from
 * the e-mailed link clears it all. The delay is a pure function, tested as one; the routes
 * run with a tiny injected delay so these tests stay fast.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { createApp, type AppHandle } from '../../server/app'
import { createTestContext, uniqueAddress, type TestContext } from '../support/harness'
import { queuedTokens, registerConfirmed } from '../support/accounts'
import { MAX_FAILURES_PER_ACCOUNT } from '../../server/modules/auth/auth.service'
import { FIRST_DELAY_MS, FREE_FAILURES_PER_ACCOUNT, MAX_DELAY_MS, signInDelayMs } from '../../server/modules/auth/sign-in-delay'

describe('the sign-in delay', () => {
  it('costs nothing for the first few failures (typos)', () => {
    for (let n = 0; n <= FREE_FAILURES_PER_ACCOUNT; n++) expect(signInDelayMs(n), `${n} failures`).toBe(0)
  })

  it('then doubles with each further failure', () => {
    const first = FREE_FAILURES_PER_ACCOUNT + 1
    expect([first, first + 1, first + 2, first + 3].map(signInDelayMs)).toEqual([FIRST_DELAY_MS, 2 * FIRST_DELAY_MS, 4 * FIRST_DELAY_MS, 8 * FIRST_DELAY_MS])
  })

  it('never grows past a few seconds, however many failures there were', () => {
    expect(MAX_DELAY_MS).toBeLessThanOrEqual(5_000)
    for (const n of [8, 20, 1_000, 1e9]) expect(signInDelayMs(n), `${n} failures`).toBe(MAX_DELAY_MS)
  })

  it('never shrinks as failures grow', () => {
    const delays = Array.from({ length: 40 }, (_, n) => signInDelayMs(n))
    expect(delays).toEqual([...delays].sort((a, b) => a - b))
  })

  it('treats a nonsense count as no failures', () => {
    expect([-3, Number.NaN].map(signInDelayMs)).toEqual([0, 0])
  })
})

/** Every delay the app asked for: the failures it was given, and the tiny wait it got back. */
const asked: number[] = []
const TINY_DELAY_MS = 15

let t: TestContext
let app: AppHandle
beforeAll(async () => {
  t = await createTestContext()
  app = createApp({
    pool: t.pool,
    boss: t.boss,
    sessionSecret: 'test-session-secret-that-is-long-enough-0123',
    publicUrl: 'http://127.0.0.1:3999',
    mailQueue: { queueName: t.mailQueueName, retryDelaySeconds: 1, retryLimit: 10 },
    trustProxy: 1,
    signInDelay: (failures) => {
      asked.push(failures)
      return failures > 0 ? TINY_DELAY_MS : 0
    },
  })
})
afterAll(async () => {
  app.close()
  await t.close()
})

let n = 0
const freshEmail = (what: string) => `${what}-${process.pid}-${Date.now()}-${++n}@example.test`
const from = (address: string) => ({
  signIn: (email: string, password: string) => request(app.app).post('/api/auth/sign-in').set('X-Forwarded-For', address).send({ email, password }),
})

describe('many wrong passwords for one account', () => {
  it('do not refuse the owner’s right password from an address that has not been guessing; they only slow the answer', async () => {
    const email = freshEmail('targeted')
    await registerConfirmed(t, email, 'right-password-1')
    // a stranger guesses from several addresses, each staying under its own limit
    const strangers = [uniqueAddress(), uniqueAddress(), uniqueAddress()]
    const guesses = strangers.length * MAX_FAILURES_PER_ACCOUNT
    for (let i = 0; i < guesses; i++) {
      const res = await from(strangers[i % strangers.length]!).signIn(email, `wrong-guess-${i}`)
      expect(res.status, `guess ${i}`).toBe(401)
    }
    asked.length = 0
    const started = performance.now()
    const owner = await from(uniqueAddress()).signIn(email, 'right-password-1')
    const tookMs = performance.now() - started
    expect(owner.status).toBe(200)
    expect(owner.body.user.email).toBe(email)
    expect(asked, 'the delay was asked for with every recent failure of the account').toEqual([guesses])
    expect(tookMs, 'the answer waited for the delay').toBeGreaterThanOrEqual(TINY_DELAY_MS - 1)
  })

  it('say in the answer, in plain words, that tries are slowed down', async () => {
    const email = freshEmail('told')
    const address = uniqueAddress()
    const first = await from(address).signIn(email, 'wrong-guess-0')
    expect(first.body.error.message).toBe('E-mail or password is not correct.')
    for (let i = 1; i < FREE_FAILURES_PER_ACCOUNT; i++) await from(address).signIn(email, `wrong-guess-${i}`).expect(401)
    const later = await from(address).signIn(email, 'wrong-guess-last').expect(401)
    expect(later.body.error.code).toBe('invalid_credentials')
    expect(later.body.error.message).toContain('answered more slowly')
  })

  it('refuse the address that keeps guessing, and only that address', async () => {
    const email = freshEmail('refused')
    await registerConfirmed(t, email, 'right-password-1')
    const guesser = from(uniqueAddress())
    for (let i = 0; i < MAX_FAILURES_PER_ACCOUNT; i++) await guesser.signIn(email, `wrong-guess-${i}`).expect(401)
    const refused = await guesser.signIn(email, 'right-password-1').expect(429)
    expect(refused.body.error.code).toBe('too_many_attempts')
    expect(refused.body.error.message).toMatch(/Wait \d+ minutes, or ask for a link by e-mail/)
    await from(uniqueAddress()).signIn(email, 'right-password-1').expect(200)
  })
})

describe('a password set from the e-mailed link', () => {
  it('lifts the refusal of the owner’s own address and the slow-down, at once', async () => {
    const email = freshEmail('unlocked')
    await registerConfirmed(t, email, 'forgotten-password-1')
    const owner = from(uniqueAddress())
    for (let i = 0; i < MAX_FAILURES_PER_ACCOUNT; i++) await owner.signIn(email, `is-it-this-${i}`).expect(401)
    await owner.signIn(email, 'forgotten-password-1').expect(429)

    await request(app.app).post('/api/auth/password-reset').set('X-Forwarded-For', uniqueAddress()).send({ email }).expect(202)
    const [token] = await queuedTokens(t, email, 'set-password')
    await request(app.app).post('/api/auth/set-password').set('X-Forwarded-For', uniqueAddress()).send({ token, password: 'remembered-password-2' }).expect(200)

    asked.length = 0
    await owner.signIn(email, 'remembered-password-2').expect(200)
    expect(asked, 'no failures are left to slow the account down').toEqual([0])
  })
})

describe('a right password for an address not yet confirmed', () => {
  it('is answered 403 email_not_confirmed and is not counted as a wrong guess', async () => {
    const email = freshEmail('unconfirmed')
    await request(app.app).post('/api/auth/register').set('X-Forwarded-For', uniqueAddress()).send({ name: 'Not Yet', email, password: 'right-password-1' }).expect(202)
    const res = await from(uniqueAddress()).signIn(email, 'right-password-1').expect(403)
    expect(res.body.error.code).toBe('email_not_confirmed')
    expect(res.body.error.message).toContain('Confirm your e-mail address first')
    const { rows } = await t.pool.query(`SELECT count(*)::int AS n FROM sign_in_attempts WHERE email = $1 AND NOT succeeded`, [email])
    expect(rows[0].n).toBe(0)
  })
})
