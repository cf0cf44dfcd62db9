/** An app wired to the throwaway test database, with helpers to act as each demo role. */
import { inject } from 'vitest'
import request from 'supertest'
import type PgBoss from 'pg-boss'
import type pg from 'pg'
import { createApp, type AppHandle } from '../../server/app'
import { createDb, createPool } from '../../server/db/client'
import { startBoss } from '../../server/jobs/boss'
import { DEMO_PASSWORD } from '../../ops/seed-demo'
import type { Logger } from '../../server/log/logger'
import type { ServiceContext } from '../../server/context'
import type { ObjectStore } from '../../server/storage/object-store'

export const DEMO = {
  admin: 'admin@quietband.test',
  supervisor: 's.okafor@quietband.test',
  investigator: 'm.ferreira@quietband.test',
  complainant: 'rosa.lindqvist@example.test',
  otherSupervisor: 'l.brandt@quietband.test',
  otherInvestigator: 'a.kowalczyk@quietband.test',
} as const
export { DEMO_PASSWORD }

export interface TestContext {
  handle: AppHandle
  app: AppHandle['app']
  pool: pg.Pool
  boss: PgBoss
  databaseUrl: string
  /** This context's own mail queue (see testMailQueue). */
  mailQueueName: string
  /** The services' context the app runs with (same pool, queue and address), for test factories. */
  services: ServiceContext
  close(): Promise<void>
}

/** A mail queue of this test file's own, so workers of other files never take its messages. */
export const testMailQueue = () => `mail-send-test-${process.pid}-${Math.random().toString(36).slice(2, 8)}`

export async function createTestContext(
  opts: { mailboxDir?: string; publicUrl?: string; logger?: Logger; objectStore?: ObjectStore; /** Another database than the shared test database (the app role's URL). */ databaseUrl?: string } = {},
): Promise<TestContext> {
  const databaseUrl = opts.databaseUrl ?? inject('databaseUrl')
  const pool = createPool(databaseUrl, 5)
  const mailQueueName = testMailQueue()
  const boss = await startBoss(databaseUrl, { mailQueueName })
  const publicUrl = opts.publicUrl ?? 'http://127.0.0.1:3999'
  const mailQueue = { queueName: mailQueueName, retryDelaySeconds: 1, retryLimit: 10 }
  const handle = createApp({
    pool,
    boss,
    sessionSecret: 'test-session-secret-that-is-long-enough-0123',
    publicUrl,
    mailboxDir: opts.mailboxDir,
    mailQueue,
    trustProxy: 1,
    logger: opts.logger,
    objectStore: opts.objectStore,
    // failed sign-ins answer at once here; the growing delay has its own tests (auth-lockout.test.ts)
    signInDelay: () => 0,
  })
  return {
    mailQueueName,
    services: { pool, db: createDb(pool), boss, publicUrl: publicUrl.replace(/\/$/, ''), mailQueue, now: () => new Date(), objectStore: opts.objectStore },
    handle,
    app: handle.app,
    pool,
    boss,
    databaseUrl,
    async close() {
      await boss.stop({ graceful: false, wait: true, timeout: 3000 })
      handle.close()
      await pool.end()
    },
  }
}

let addressCounter = 0
/**
 * A distinct client address per agent, so the per-address limits of one test never touch
 * another, also across the test files' processes: the middle octets carry this process's id,
 * the outer ones a counter (up to about 60,000 agents per file).
 */
export function uniqueAddress(): string {
  addressCounter += 1
  const pid = process.pid % 65536
  return `${10 + (addressCounter >> 8)}.${pid >> 8}.${pid & 255}.${addressCounter & 255}`
}

/** A supertest agent signed in as the given e-mail (demo password by default). */
export async function signedInAgent(app: TestContext['app'], email: string, password = DEMO_PASSWORD) {
  const agent = request.agent(app).set('X-Forwarded-For', uniqueAddress())
  const res = await agent.post('/api/auth/sign-in').send({ email, password })
  if (res.status !== 200) throw new Error(`sign-in as ${email} failed: ${res.status} ${JSON.stringify(res.body)}`)
  return agent
}
