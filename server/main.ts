/**
 * Starts Quietband from a validated configuration: migrations (advisory-locked), the job
 * queue, the e-mail worker and the HTTP server. Returns a handle that stops all of it.
 */
import type { AddressInfo } from 'node:net'
import type { Server } from 'node:http'
import type { Env } from './config/env'
import { createPool } from './db/client'
import { prepareDatabase } from './db/roles'
import { startBoss, startMailWorker } from './jobs/boss'
import { createMailer } from './mail/mailer'
import { createApp } from './app'
import { createLogger, log, setProcessLogger } from './log/logger'
import { createDb, isDatabaseUnavailable } from './db/client'
import { startEvidenceOrphanSweep } from './modules/evidence/orphan-sweep'
import { startEvidenceProcessingWorker } from './modules/evidence/processing-queue'
import { objectStoreFromEnv } from './storage/object-store'

export interface RunningServer {
  url: string
  port: number
  close(): Promise<void>
}

/**
 * A library's promise rejected because a connection was lost (PostgreSQL went away) is logged
 * and survived: pools reconnect. Any other unhandled rejection is a bug and ends the process.
 * Installed once by every entry that serves (server/index.ts, npm start, npm run dev).
 */
export function guardProcess(): void {
  if (process.listenerCount('unhandledRejection') > 0) return
  process.on('unhandledRejection', (reason) => {
    if (!isDatabaseUnavailable(reason)) throw reason
    log().warn(`unhandled rejection after a lost connection (still running): ${(reason as Error)?.message ?? String(reason)}`)
  })
}

export async function startServer(env: Env): Promise<RunningServer> {
  guardProcess()
  const logger = createLogger({ level: env.LOG_LEVEL, format: env.LOG_FORMAT ?? (env.NODE_ENV === 'development' ? 'pretty' : 'json') })
  setProcessLogger(logger)
  // as the owner: migrations, the job queue's schema and the application's grants
  await prepareDatabase(env.MIGRATION_DATABASE_URL)
  const pool = createPool(env.DATABASE_URL)
  const boss = await startBoss(env.DATABASE_URL, { maintenanceIntervalSeconds: env.JOB_MAINTENANCE_INTERVAL_SECONDS })
  const mailer = createMailer({ smtpUrl: env.SMTP_URL, from: env.MAIL_FROM })
  const mailWorker = env.RUN_WORKERS ? await startMailWorker(boss, mailer, { pollingIntervalSeconds: env.MAIL_POLL_INTERVAL_SECONDS }) : undefined
  const objectStore = objectStoreFromEnv(env)
  const handle = createApp({
    pool,
    boss,
    sessionSecret: env.SESSION_SECRET,
    publicUrl: env.PUBLIC_URL,
    staticDir: env.STATIC_DIR,
    mailboxDir: env.DEV_MAILBOX_DIR,
    listenHost: env.HOST,
    nodeEnv: env.NODE_ENV,
    pruneSessions: true,
    trustProxy: env.TRUST_PROXY,
    logger,
    objectStore,
    mapTiles: env.MAP_TILE_URL && env.MAP_TILE_ATTRIBUTION ? { urlTemplate: env.MAP_TILE_URL, attribution: env.MAP_TILE_ATTRIBUTION } : undefined,
  })
  const orphanSweep = env.RUN_WORKERS ? startEvidenceOrphanSweep({ db: createDb(pool), store: objectStore }) : undefined
  const evidenceWorker = env.RUN_WORKERS ? await startEvidenceProcessingWorker({ boss, db: createDb(pool), objectStore }) : undefined
  const server: Server = await new Promise((resolve, reject) => {
    const s = handle.app.listen(env.PORT, env.HOST, () => resolve(s))
    s.once('error', reject)
  })
  const port = (server.address() as AddressInfo).port
  return {
    url: `http://${env.HOST}:${port}`,
    port,
    async close() {
      // stop accepting, drop idle keep-alive connections, and let requests in flight finish
      const closed = new Promise<void>((r) => server.close(() => r()))
      server.closeIdleConnections()
      await closed
      orphanSweep?.stop()
      await mailWorker?.stop()
      await evidenceWorker?.stop()
      await boss.stop({ graceful: true, wait: true, timeout: 5000 })
      handle.close()
      mailer.close()
      await pool.end()
    },
  }
}
