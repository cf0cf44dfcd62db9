/**
 * E-mail is never lost: it is queued in the same transaction as the change, and the worker
 * retries until the SMTP server answers. Stopping the server and starting it again delivers
 * every message exactly once.
 */
import fs from 'node:fs'
import os from 'node:os'
import path from 'node:path'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createTestContext, testMailQueue, type TestContext } from '../support/harness'
import { startSmtpFake, type SmtpFake } from '../../ops/local/smtp-fake'
import { readMailbox } from '../../server/mail/dev-mailbox'
import { createMailer, type Mailer, type OutgoingMail } from '../../server/mail/mailer'
import { composeMail } from '../../server/mail/templates'
import { mailMessageId, queueMail, startMailWorker } from '../../server/jobs/boss'
import { withTransaction } from '../../server/db/client'

let t: TestContext
let smtp: SmtpFake
const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'qb-mail-'))

async function waitFor<T>(fn: () => Promise<T>, ok: (v: T) => boolean, timeoutMs: number): Promise<T> {
  const t0 = Date.now()
  for (;;) {
    const v = await fn()
    if (ok(v) || Date.now() - t0 > timeoutMs) return v
    await new Promise((r) => setTimeout(r, 200))
  }
}

beforeAll(async () => {
  t = await createTestContext()
  smtp = await startSmtpFake({ dir })
  await startMailWorker(t.boss, createMailer({ smtpUrl: smtp.url, from: 'Quietband <no-reply@quietband.test>' }), { pollingIntervalSeconds: 0.5, queueName: t.mailQueueName })
})
afterAll(async () => {
  await smtp.close().catch(() => {})
  await t.close()
  fs.rmSync(dir, { recursive: true, force: true })
})

describe('the e-mail outbox', () => {
  it('sends a queued message with its text and HTML parts', async () => {
    const to = `outbox-1-${Date.now()}@example.test`
    await queueMail(t.boss, t.pool, composeMail(to, 'Grüße – case QB ✓', ['Hello,', 'https://quietband.test/track/abc']), { queueName: t.mailQueueName, retryDelaySeconds: 1, retryLimit: 5 })
    const mine = await waitFor(() => readMailbox(dir), (ms) => ms.some((m) => m.to.includes(to)), 10_000)
    const m = mine.find((x) => x.to.includes(to))!
    expect(m.subject).toBe('Grüße – case QB ✓')
    expect(m.text).toContain('https://quietband.test/track/abc')
    expect(m.html).toContain('<a href="https://quietband.test/track/abc">')
    const { rows } = await t.pool.query(`SELECT id FROM pgboss.job WHERE data->>'to' = $1`, [to])
    expect(m.messageId, 'the Message-ID is the job id, so a repeat is recognisable').toBe(mailMessageId(rows[0].id))
  })

  it('counts a message as lost after seconds, not pg-boss’s default 15 minutes', async () => {
    const queueName = testMailQueue() // no worker: the job stays queued
    await t.boss.createQueue(queueName)
    const to = `expiry-${Date.now()}@example.test`
    await queueMail(t.boss, t.pool, composeMail(to, 'expiry', ['expiry']), { queueName, retryDelaySeconds: 1, retryLimit: 5 })
    const { rows } = await t.pool.query(`SELECT extract(epoch FROM expire_in)::int AS s FROM pgboss.job WHERE data->>'to' = $1`, [to])
    expect(rows[0].s).toBeGreaterThan(0)
    expect(rows[0].s).toBeLessThanOrEqual(30)
  })

  it('marks each message sent as soon as it is sent, leaving the rest untouched', async () => {
    const queueName = testMailQueue()
    await t.boss.createQueue(queueName)
    const stamp = Date.now()
    const recipients = [1, 2, 3].map((i) => `one-by-one-${i}-${stamp}@example.test`)
    for (const to of recipients) await queueMail(t.boss, t.pool, composeMail(to, to, ['one at a time']), { queueName, retryDelaySeconds: 1, retryLimit: 5 })
    // the second send hangs, as when the process dies in the middle of it
    const sent: string[] = []
    let release!: () => void
    const held = new Promise<void>((r) => (release = r))
    const mailer: Mailer = {
      async send(mail: OutgoingMail) {
        sent.push(mail.to)
        if (sent.length === 2) await held
      },
      close() {},
    }
    const worker = await startMailWorker(t.boss, mailer, { pollingIntervalSeconds: 0.5, queueName })
    const states = async () =>
      (await t.pool.query(`SELECT data->>'to' AS to, state FROM pgboss.job WHERE name = $1`, [queueName])).rows.reduce(
        (acc: Record<string, string>, r: { to: string; state: string }) => ({ ...acc, [r.to]: r.state }),
        {},
      )
    try {
      await waitFor(async () => sent.length, (n) => n === 2, 10_000)
      expect(await states()).toEqual({ [recipients[0]!]: 'completed', [recipients[1]!]: 'active', [recipients[2]!]: 'created' })
      release()
      const done = await waitFor(states, (s) => Object.values(s).every((v) => v === 'completed'), 10_000)
      expect(Object.values(done)).toEqual(['completed', 'completed', 'completed'])
      expect(sent).toEqual(recipients)
    } finally {
      release()
      await worker.stop()
    }
  })

  it('sends again, within a minute, a message a crashed worker had taken and never finished', async () => {
    const queueName = testMailQueue()
    await t.boss.createQueue(queueName)
    const to = `orphaned-${Date.now()}@example.test`
    await queueMail(t.boss, t.pool, composeMail(to, 'orphaned', ['taken by a worker that died']), { queueName, retryDelaySeconds: 1, retryLimit: 5 })
    // a worker takes the job and dies without a word: the job stays active
    const [taken] = await t.boss.fetch(queueName)
    expect(taken).toBeDefined()
    const worker = await startMailWorker(t.boss, createMailer({ smtpUrl: smtp.url, from: 'Quietband <no-reply@quietband.test>' }), { pollingIntervalSeconds: 0.5, queueName })
    try {
      const t0 = Date.now()
      const all = await waitFor(() => readMailbox(dir), (ms) => ms.some((m) => m.to.includes(to)), 60_000)
      const mine = all.filter((m) => m.to.includes(to))
      expect(mine, `delivered after ${Date.now() - t0} ms`).toHaveLength(1)
      expect(mine[0]!.messageId).toBe(mailMessageId(taken!.id))
    } finally {
      await worker.stop()
    }
  }, 90_000)

  it('queues nothing when the transaction rolls back', async () => {
    const to = `rolled-back-${Date.now()}@example.test`
    await expect(
      withTransaction(t.pool, async ({ client }) => {
        await queueMail(t.boss, client, composeMail(to, 'never', ['never']), { queueName: t.mailQueueName, retryDelaySeconds: 1, retryLimit: 5 })
        throw new Error('the change failed')
      }),
    ).rejects.toThrow('the change failed')
    const { rows } = await t.pool.query(`SELECT count(*)::int AS n FROM pgboss.job WHERE data->>'to' = $1`, [to])
    expect(rows[0].n).toBe(0)
  })

  it('delivers every message exactly once after the SMTP server was down and came back', async () => {
    const port = smtp.port
    await smtp.close()
    const stamp = Date.now()
    const recipients = [1, 2, 3].map((i) => `down-${i}-${stamp}@example.test`)
    for (const to of recipients) await queueMail(t.boss, t.pool, composeMail(to, `While down ${to}`, ['queued while the server was down']), { queueName: t.mailQueueName, retryDelaySeconds: 1, retryLimit: 20 })
    // the worker tries and fails while the server is down
    const retried = await waitFor(
      async () => (await t.pool.query(`SELECT min(retry_count)::int AS n FROM pgboss.job WHERE data->>'to' = ANY($1)`, [recipients])).rows[0].n as number,
      (n) => n > 0,
      30_000,
    )
    expect(retried, 'every message failed at least once and was rescheduled').toBeGreaterThan(0)
    smtp = await startSmtpFake({ dir, port })
    const all = await waitFor(
      () => readMailbox(dir),
      (ms) => recipients.every((to) => ms.some((m) => m.to.includes(to))),
      45_000,
    )
    for (const to of recipients) expect(all.filter((m) => m.to.includes(to)), to).toHaveLength(1)
  }, 90_000)
})
