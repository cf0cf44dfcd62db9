/**
 * Background jobs in PostgreSQL (pg-boss 10). E-mail is queued as a job in the same
 * transaction as the change that causes it, so a message is never lost: if the SMTP
 * server is down, the worker retries with backoff until it returns.
 *
 * After a crash, a message that was being sent stays `active` until its expiry
 * (MAIL_SEND_EXPIRE_SECONDS); pg-boss's maintenance then puts it back for a retry. So the
 * expiry is short (a mail send, not a batch), maintenance runs every few seconds, and each
 * message is completed on its own right after its send: only the one message in flight at
 * the crash can go out twice, and it carries the same Message-ID both times.
 */
import PgBoss from 'pg-boss'
import type pg from 'pg'
import { CONNECTION_TIMEOUT_MS, isDatabaseUnavailable } from '../db/client'
import type { OutgoingMail, Mailer } from '../mail/mailer'
import { log } from '../log/logger'

export const MAIL_QUEUE = 'mail-send'

/**
 * How long one send may stay `active` before pg-boss counts it as lost and retries it: a send
 * takes a second or two; pg-boss's default is 15 minutes. With maintenance every few seconds
 * and the first retry 10–20 s later, a message interrupted by a crash goes out within a minute.
 */
export const MAIL_SEND_EXPIRE_SECONDS = 20

/** How often pg-boss looks for expired jobs (default 120 s; it may skip one beat, so twice that at worst). */
export const DEFAULT_MAINTENANCE_INTERVAL_SECONDS = 5

export interface BossOptions {
  /** Lets tests keep their mail apart on a shared database. */
  mailQueueName?: string
  maintenanceIntervalSeconds?: number
}

/** Starts the job queue. Its pool's errors (a lost connection) are logged, never fatal. */
export async function startBoss(databaseUrl: string, opts: BossOptions = {}): Promise<PgBoss> {
  const config: PgBoss.ConstructorOptions & { connectionTimeoutMillis: number } = {
    connectionString: databaseUrl,
    schema: 'pgboss',
    max: 4,
    connectionTimeoutMillis: CONNECTION_TIMEOUT_MS,
    maintenanceIntervalSeconds: opts.maintenanceIntervalSeconds ?? DEFAULT_MAINTENANCE_INTERVAL_SECONDS,
    // no cron schedules are used; the scheduler would only add queries that fail during an outage
    schedule: false,
  }
  const boss = new PgBoss(config)
  boss.on('error', (err) => {
    if (isDatabaseUnavailable(err)) log().warn(`job queue: database unavailable (${describeError(err)})`)
    else log().error({ err }, 'job queue error')
  })
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

// a first retry within seconds keeps a message cut off by a crash inside the one-minute target
// (expiry 20 s + maintenance ≤ 5 s + this delay, doubled by pg-boss's jitter at worst)
export const DEFAULT_MAIL_QUEUE_OPTIONS: MailQueueOptions = { retryDelaySeconds: 5, retryLimit: 30 }

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
    expireInSeconds: MAIL_SEND_EXPIRE_SECONDS,
    db: { executeSql: (text, values) => client.query(text, values) },
  })
}

/** The Message-ID of a queued message: the job id, so a repeat after a crash is recognisable. */
export const mailMessageId = (jobId: string) => `<${jobId}@quietband.mail>`

export interface MailWorker {
  /** Finishes the message being sent (if any) and stops; call before stopping the queue. */
  stop(): Promise<void>
}

/**
 * Sends queued mail one message at a time: take one job, send it, mark that job complete
 * (or failed, for pg-boss to retry with backoff), then the next. A crash can therefore
 * repeat at most the one message in flight; the others are either done or untouched.
 * While the database is away the worker waits and tries again; it stops with the queue.
 */
export async function startMailWorker(
  boss: PgBoss,
  mailer: Mailer,
  opts: { pollingIntervalSeconds?: number; queueName?: string } = {},
): Promise<MailWorker> {
  const queue = opts.queueName ?? MAIL_QUEUE
  const pollMs = (opts.pollingIntervalSeconds ?? 1) * 1000
  let stopping = false
  let wake: (() => void) | undefined
  const pause = (ms: number) =>
    new Promise<void>((resolve) => {
      const timer = setTimeout(resolve, ms)
      timer.unref()
      wake = () => {
        clearTimeout(timer)
        resolve()
      }
    })

  /** Marks the job done or failed; retried briefly, so a short database blip does not resend the message. */
  const settle = async (job: PgBoss.Job<OutgoingMail>, mark: () => Promise<unknown>) => {
    const giveUpAt = Date.now() + job.expireInSeconds * 1000 * 0.5
    for (;;) {
      try {
        await mark()
        return
      } catch (err) {
        if (stopping || Date.now() > giveUpAt || !isDatabaseUnavailable(err)) {
          // the job stays active until it expires, then pg-boss retries it
          log().error({ jobId: job.id }, `mail worker: could not record the outcome of the job: ${describeError(err)}`)
          return
        }
        await pause(500)
      }
    }
  }

  const deliver = async (job: PgBoss.Job<OutgoingMail>) => {
    try {
      // a hung SMTP connection must not hold the queue: past the job's expiry it counts as failed
      await withDeadline(mailer.send({ ...job.data, messageId: mailMessageId(job.id) }), job.expireInSeconds * 1000 * 0.75)
    } catch (err) {
      await settle(job, () => boss.fail(queue, job.id, { message: (err as Error).message }))
      return
    }
    await settle(job, () => boss.complete(queue, job.id))
  }

  const loop = (async () => {
    while (!stopping) {
      let found = false
      try {
        // pg-boss's fetch answers [] when the database cannot be reached
        const [job] = await boss.fetch<OutgoingMail>(queue, { batchSize: 1 })
        if (job) {
          found = true
          await deliver(job)
        }
      } catch (err) {
        log().error({ err }, 'mail worker error')
      }
      if (!found && !stopping) await pause(pollMs)
    }
  })()

  const stop = async () => {
    stopping = true
    wake?.()
    await loop
  }
  boss.once('stopped', () => void stop())
  return { stop }
}

function withDeadline<T>(work: Promise<T>, ms: number): Promise<T> {
  let timer: NodeJS.Timeout | undefined
  const late = new Promise<never>((_, reject) => {
    timer = setTimeout(() => reject(new Error(`the SMTP server did not answer within ${Math.round(ms / 1000)} s`)), ms)
  })
  return Promise.race([work, late]).finally(() => clearTimeout(timer))
}

function describeError(err: unknown): string {
  const e = err as { code?: string; message?: string }
  return [e?.code, e?.message].filter(Boolean).join(' ') || String(err)
}
