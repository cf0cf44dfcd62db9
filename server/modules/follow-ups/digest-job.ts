/**
 * The hourly check that sends the office digests, as a pg-boss job: a queue with the `stately`
 * policy holds at most one waiting check; each run sends what is due (digest.service.ts) and
 * queues the next check an interval later. Starting the worker queues a check at once (pg-boss
 * refuses it while one is already waiting), so a restart never loses the chain and the
 * `digest_sends` record keeps a restart from sending a day's digest twice.
 */
import { log } from '../../log/logger'
import { runOfficeDigests, type DigestDeps } from './digest.service'

export const DIGEST_QUEUE = 'office-digest'
export const DIGEST_CHECK_INTERVAL_SECONDS = 3600

export interface DigestWorker {
  stop(): Promise<void>
}

export async function startDigestWorker(
  deps: DigestDeps,
  opts: { queueName?: string; intervalSeconds?: number; pollingIntervalSeconds?: number; now?: () => Date; /** Only these offices (tests); every office when absent. */ officeIds?: readonly string[] } = {},
): Promise<DigestWorker> {
  const queue = opts.queueName ?? DIGEST_QUEUE
  const interval = opts.intervalSeconds ?? DIGEST_CHECK_INTERVAL_SECONDS
  const now = opts.now ?? (() => new Date())
  await deps.boss.createQueue(queue, { name: queue, policy: 'stately' })
  const next = (startAfter: number) => deps.boss.send(queue, {}, { startAfter, retryLimit: 2, expireInSeconds: 15 * 60 })
  await deps.boss.work(queue, { batchSize: 1, pollingIntervalSeconds: opts.pollingIntervalSeconds ?? 30 }, async ([job]) => {
    if (!job) return
    try {
      const run = await runOfficeDigests(deps, now(), { officeIds: opts.officeIds })
      if (run.sent.length > 0) log().info(`office digest sent for ${run.sent.length} office(s)`)
      if (run.nothingToReport.length > 0) log().info(`office digest: nothing late or due for ${run.nothingToReport.length} office(s), none sent`)
    } catch (err) {
      log().error({ err, jobId: job.id }, 'office digest check failed')
    } finally {
      await next(interval).catch((err: unknown) => log().error({ err }, 'could not queue the next office digest check'))
    }
  })
  await next(0)
  return {
    async stop() {
      await deps.boss.offWork(queue).catch(() => {})
    },
  }
}

