/**
 * A real listening Quietband for browser tests: the built web app (dist/web), the API on the
 * throwaway database, an SMTP fake with its development mailbox and a running mail worker.
 */
// the AWS SDK's notice that later releases will need Node 22 (known; see the stack notes), once per process
process.env.AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED ??= 'true'
import fs from 'node:fs'
import os from 'node:os'
import path from 'node:path'
import type { Server } from 'node:http'
import { fileURLToPath } from 'node:url'
import { inject } from 'vitest'
import { testMailQueue } from './harness'
import { createApp } from '../../server/app'
import { createDb, createPool } from '../../server/db/client'
import { startBoss, startMailWorker } from '../../server/jobs/boss'
import { startEvidenceProcessingWorker } from '../../server/modules/evidence/processing-queue'
import { createMailer } from '../../server/mail/mailer'
import { startSmtpFake } from '../../ops/local/smtp-fake'
import { freePort } from '../../ops/local/free-port'
import { createObjectStore } from '../../server/storage/object-store'

export const WEB_DIST = fileURLToPath(new URL('../../dist/web', import.meta.url))

export interface RunningWeb {
  baseUrl: string
  mailboxDir: string
  close(): Promise<void>
}

export async function startWebServer(): Promise<RunningWeb> {
  if (!fs.existsSync(path.join(WEB_DIST, 'index.html'))) throw new Error('dist/web is missing: run `npx vite build` (npm test does it first)')
  const databaseUrl = inject('databaseUrl')
  const mailboxDir = fs.mkdtempSync(path.join(os.tmpdir(), 'qb-e2e-mail-'))
  const smtp = await startSmtpFake({ dir: mailboxDir })
  const pool = createPool(databaseUrl, 5)
  const mailQueueName = testMailQueue()
  const boss = await startBoss(databaseUrl, { mailQueueName })
  const mailer = createMailer({ smtpUrl: smtp.url, from: 'Quietband <no-reply@quietband.test>' })
  await startMailWorker(boss, mailer, { pollingIntervalSeconds: 0.5, queueName: mailQueueName })
  // the public URL must be known before listening (e-mailed links, origin checks): pick the port first
  const port = await freePort()
  const baseUrl = `http://127.0.0.1:${port}`
  const s3 = inject('s3')
  const objectStore = s3 && createObjectStore({ ...s3, region: 'us-east-1', forcePathStyle: true, maxUploadBytes: 50e6 })
  await startEvidenceProcessingWorker({ boss, db: createDb(pool), objectStore }, { pollingIntervalSeconds: 0.5 })
  const handle = createApp({ objectStore, pool, boss, sessionSecret: 'e2e-session-secret-long-enough-0123456789', publicUrl: baseUrl, staticDir: WEB_DIST, mailboxDir, listenHost: '127.0.0.1', mailQueue: { queueName: mailQueueName, retryDelaySeconds: 1, retryLimit: 10 } })
  const server: Server = await new Promise((resolve, reject) => {
    const s = handle.app.listen(port, '127.0.0.1', () => resolve(s))
    s.once('error', reject)
  })
  return {
    baseUrl,
    mailboxDir,
    async close() {
      server.closeAllConnections()
      await new Promise((r) => server.close(r))
      await boss.stop({ graceful: false, wait: true, timeout: 3000 })
      handle.close()
      mailer.close()
      await smtp.close()
      await pool.end()
      fs.rmSync(mailboxDir, { recursive: true, force: true })
    },
  }
}
