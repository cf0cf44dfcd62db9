/**
 * Background jobs in PostgreSQL (pg-boss 10). E-mail is queued as a job in the same
 * transaction as the change that causes it, so a message is never lost: if the SMTP
 * server is down, the worker retries with backoff until it returns.
 */
import PgBoss from 'pg-boss'
import type pg from 'pg'
import type { OutgoingMail, Mailer } from '../mail/mailer'

export const MAIL_QUEUE = 'mail-send'

/** Starts the job queue; `mailQueueName` lets tests keep their mail apart on a shared database. */
export async function startBoss(databaseUrl: string, opts: { mailQueueName?: string } = {}): Promise<PgBoss> {
  const boss = new PgBoss({ connectionString: databaseUrl, schema: 'pgboss', max: 4 })
  boss.on('error', (err) => console.error('job queue error:', err))
  await boss.start()
  await boss.createQueue(opts.mailQueueName ?? MAIL_QUEUE)
  return boss
}

export interface MailQueueOptions {
  /** Queue name (default MAIL_QUEUE). */
  queueName?: string
  /** First retry delay in seconds; doubles each time (pg-boss backoff). */
  retryDelaySeconds: number
  retryLimit: number
}

export const DEFAULT_MAIL_QUEUE_OPTIONS: MailQueueOptions = { retryDelaySeconds: 10, retryLimit: 30 }

/** Queues an e-mail on the given transaction's connection (commits or rolls back with it). */
export async function queueMail(
  boss: PgBoss,
  client: pg.PoolClient | pg.Pool,
  mail: OutgoingMail,
  opts: MailQueueOptions = DEFAULT_MAIL_QUEUE_OPTIONS,
): Promise<void> {
  await boss.send(opts.queueName ?? MAIL_QUEUE, mail, {
    retryLimit: opts.retryLimit,
    retryDelay: opts.retryDelaySeconds,
    retryBackoff: true,
    db: { executeSql: (text, values) => client.query(text, values) },
  })
}

/**
 * Sends queued mail, up to `batchSize` per poll. A message that fails is failed on its own
 * (pg-boss retries it later with backoff); the others in the batch complete. So one bad
 * address or an SMTP outage never resends a message that already went out.
 */
export async function startMailWorker(
  boss: PgBoss,
  mailer: Mailer,
  opts: { pollingIntervalSeconds?: number; batchSize?: number; queueName?: string } = {},
): Promise<string> {
  const queue = opts.queueName ?? MAIL_QUEUE
  return boss.work<OutgoingMail>(queue, { pollingIntervalSeconds: opts.pollingIntervalSeconds ?? 1, batchSize: opts.batchSize ?? 20 }, async (jobs) => {
    for (const job of jobs) {
      try {
        // the job id doubles as Message-ID, so a rare resend after a crash is recognisable
        await mailer.send({ ...job.data, messageId: `<${job.id}@quietband.mail>` })
      } catch (err) {
        await boss.fail(queue, job.id, { message: (err as Error).message })
      }
    }
  })
}
