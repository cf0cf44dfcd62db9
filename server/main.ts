/**
 * Starts Quietband from a validated configuration: migrations (advisory-locked), the job
 * queue, the e-mail worker and the HTTP server. Returns a handle that stops all of it.
 */
import type { AddressInfo } from 'node:net'
import type { Server } from 'node:http'
import { ConfigError, type Env } from './config/env'
import { createPool } from './db/client'
import { prepareDatabase } from './db/roles'
import { DEFAULT_MAIL_QUEUE_OPTIONS, startBoss, startMailWorker } from './jobs/boss'
import { createMailer } from './mail/mailer'
import { createApp } from './app'
import { createLogger, log, setProcessLogger } from './log/logger'
import { createDb, isDatabaseUnavailable } from './db/client'
import { startEvidenceOrphanSweep } from './modules/evidence/orphan-sweep'
import { startEvidenceProcessingWorker } from './modules/evidence/processing-queue'
import { startDigestWorker } from './modules/follow-ups/digest-job'
import { startRetentionWorker } from './modules/retention/retention-job'
import { objectStoreFromEnv } from './storage/object-store'
import { signerFromP12File } from './modules/case-file/case-file-signing'

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
  // the signing certificate is checked before anything starts: a bad one is a ConfigError naming the setting
  const caseFileSigner = env.CASE_FILE_P12_PATH ? signerFromP12File(env.CASE_FILE_P12_PATH, env.CASE_FILE_P12_PASSPHRASE) : undefined
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
    caseFileSigner,
  })
  if (caseFileSigner?.demo) logger.warn(`case files are signed with a DEMO certificate (${env.CASE_FILE_P12_PATH}): not for legal use`)
  const orphanSweep = env.RUN_WORKERS ? startEvidenceOrphanSweep({ db: createDb(pool), store: objectStore, boss }) : undefined
  const evidenceWorker = env.RUN_WORKERS ? await startEvidenceProcessingWorker({ boss, db: createDb(pool), objectStore }) : undefined
  // the offices' morning digest: an hourly check as a pg-boss job (modules/follow-ups/digest-job.ts)
  const digestWorker = env.RUN_WORKERS ? await startDigestWorker({ pool, db: createDb(pool), boss, publicUrl: env.PUBLIC_URL.replace(/\/$/, ''), mailQueue: DEFAULT_MAIL_QUEUE_OPTIONS }) : undefined
  // the daily retention run (modules/retention/retention-job.ts)
  const retentionWorker = env.RUN_WORKERS
    ? await startRetentionWorker({ pool, db: createDb(pool), boss, publicUrl: env.PUBLIC_URL.replace(/\/$/, ''), mailQueue: DEFAULT_MAIL_QUEUE_OPTIONS, objectStore, now: () => new Date() })
    : undefined
  const server: Server = await new Promise((resolve, reject) => {
    // Express 5 hands a listening error (a port in use, say) to this callback too
    const s = handle.app.listen(env.PORT, env.HOST, (err?: Error) => (err ? reject(listenError(err, env.HOST, env.PORT)) : resolve(s)))
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
      await digestWorker?.stop()
      await retentionWorker?.stop()
      await boss.stop({ graceful: true, wait: true, timeout: 5000 })
      handle.close()
      mailer.close()
      await pool.end()
    },
  }
}

/** A listening error in words an operator can act on (a ConfigError: the start script prints it in one line). */
export function listenError(err: Error, host: string, port: number): Error {
  const code = (err as NodeJS.ErrnoException).code
  if (code === 'EADDRINUSE') return new ConfigError(`Port ${port} on ${host} is already in use: stop the other process, or start with another PORT.`)
  if (code === 'EACCES') return new ConfigError(`Port ${port} on ${host} needs privileges this process does not have: choose a PORT above 1023.`)
  return err
}
