/**
 * The daily retention run as a pg-boss job: a `stately` queue holds at most one waiting run;
 * each run erases and disposes of what has expired (retention.service.ts) and queues the next a
 * day later. Starting the worker queues a run at once (refused while one is waiting), so a
 * restart never loses the chain; the run itself is idempotent (a second run finds nothing new).
 */
import { log } from '../../log/logger'
import type { ServiceContext } from '../../context'
import { runRetention } from './retention.service'

export const RETENTION_QUEUE = 'retention-run'
export const RETENTION_INTERVAL_SECONDS = 24 * 3600

export interface RetentionWorker {
  stop(): Promise<void>
}

export async function startRetentionWorker(
  ctx: ServiceContext,
  opts: { queueName?: string; intervalSeconds?: number; pollingIntervalSeconds?: number; now?: () => Date; /** Only these offices (tests); every office when absent. */ officeIds?: readonly string[] } = {},
): Promise<RetentionWorker> {
  const queue = opts.queueName ?? RETENTION_QUEUE
  const interval = opts.intervalSeconds ?? RETENTION_INTERVAL_SECONDS
  const now = opts.now ?? (() => ctx.now())
  await ctx.boss.createQueue(queue, { name: queue, policy: 'stately' })
  const next = (startAfter: number) => ctx.boss.send(queue, {}, { startAfter, retryLimit: 2, expireInSeconds: 60 * 60 })
  await ctx.boss.work(queue, { batchSize: 1, pollingIntervalSeconds: opts.pollingIntervalSeconds ?? 60 }, async ([job]) => {
    if (!job) return
    try {
      const run = await runRetention(ctx, { now: now(), dryRun: false, officeIds: opts.officeIds })
      if (run.cases.length > 0 || run.pendingDisposals.length > 0) {
        log().info(`retention run: ${run.cases.length} case(s) erased or disposed of, ${run.kept.length} kept, ${run.pendingDisposals.length} earlier deletion(s) finished`)
      }
    } catch (err) {
      log().error({ err, jobId: job.id }, 'retention run failed')
    } finally {
      await next(interval).catch((err: unknown) => log().error({ err }, 'could not queue the next retention run'))
    }
  })
  await next(0)
  return {
    async stop() {
      await ctx.boss.offWork(queue).catch(() => {})
    },
  }
}
