/** Complainant accounts for API tests: register, read the queued e-mail, confirm the address. */
import { expect } from 'vitest'
import request from 'supertest'
import { uniqueAddress, type TestContext } from './harness'

export interface QueuedMail {
  to: string
  subject: string
  text: string
}

/** Every e-mail queued to an address (mail jobs are rows in pg-boss), oldest first. */
export async function queuedMails(t: TestContext, to: string): Promise<QueuedMail[]> {
  const { rows } = await t.pool.query(`SELECT data FROM pgboss.job WHERE name LIKE 'mail-send%' AND data->>'to' = $1 ORDER BY created_on, id`, [to])
  return rows.map((r) => r.data as QueuedMail)
}

/** The tokens of the links to `page` (e.g. 'confirm-email', 'set-password') queued to an address, oldest first. */
export async function queuedTokens(t: TestContext, to: string, page: string): Promise<string[]> {
  const re = new RegExp(`/${page}\\?token=([A-Za-z0-9_-]+)`)
  return (await queuedMails(t, to)).map((m) => re.exec(m.text)?.[1]).filter((x): x is string => !!x)
}

/**
 * Registers a complainant and confirms the address from the e-mailed link, as its owner
 * would; returns the account's id and an agent signed in as it (confirming signs in).
 */
export async function registerConfirmed(t: TestContext, email: string, password = 'first-password-1', name = 'Test Person') {
  await request(t.app).post('/api/auth/register').set('X-Forwarded-For', uniqueAddress()).send({ name, email, password }).expect(202)
  const [token] = await queuedTokens(t, email, 'confirm-email')
  expect(token, `a confirmation link was queued to ${email}`).toBeDefined()
  const agent = request.agent(t.app).set('X-Forwarded-For', uniqueAddress())
  const res = await agent.post('/api/auth/confirm-email').send({ token }).expect(200)
  return { id: res.body.user.id as string, agent }
}
