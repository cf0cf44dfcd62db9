/**
 * E-mail is never lost: it is queued in the same transaction as the change, and the worker
 * retries until the SMTP server answers. Stopping the server and starting it again delivers
 * every message exactly once.
 */
import fs from 'node:fs'
import os from 'node:os'
import path from 'node:path'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createTestContext, type TestContext } from '../support/harness'
import { startSmtpFake, type SmtpFake } from '../../ops/local/smtp-fake'
import { readMailbox } from '../../server/mail/dev-mailbox'
import { createMailer } from '../../server/mail/mailer'
import { composeMail } from '../../server/mail/templates'
import { queueMail, startMailWorker } from '../../server/jobs/boss'
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
  })

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
