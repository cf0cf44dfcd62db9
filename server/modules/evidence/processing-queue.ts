/**
 * The evidence processing job: an uploaded spectrum capture or I/Q recording is read in the
 * background (pg-boss queue EVIDENCE_PROCESSING_QUEUE) into a summary, a display trace and a
 * spectrogram (processing/process-evidence.ts). Queuing marks the file's analysis `queued`;
 * the worker takes one job at a time, records its progress, and records a failure with its
 * message: a bad file never stops the worker or the process.
 */
import type PgBoss from 'pg-boss'
import type { ServiceContext } from '../../context'
import type { Db } from '../../db/client'
import { log } from '../../log/logger'
import type { ObjectStore } from '../../storage/object-store'
import { runEvidenceProcessing } from './processing/process-evidence'
import { markAnalysisQueued } from './processing/analyses.repo'
import { runEvidenceThumbnail } from './thumbnails/make-thumbnail'

export const EVIDENCE_PROCESSING_QUEUE = 'evidence-processing'

/** A recording of a few hundred MB takes well under a minute; past this pg-boss retries it. */
export const EVIDENCE_PROCESSING_EXPIRE_SECONDS = 15 * 60

interface EvidenceJob {
  evidenceId: string
  /** Absent: the spectrum analysis; 'thumbnail': an image's thumbnail (thumbnails/make-thumbnail.ts). */
  task?: 'thumbnail'
}

/** Creates the queue (idempotent: pg-boss ignores an existing one). */
export async function createEvidenceProcessingQueue(boss: PgBoss, queueName = EVIDENCE_PROCESSING_QUEUE): Promise<void> {
  await boss.createQueue(queueName)
}

/** Marks the file's analysis queued and sends the job. */
export async function queueEvidenceProcessing(ctx: Pick<ServiceContext, 'db' | 'boss'>, evidenceId: string): Promise<void> {
  await createEvidenceProcessingQueue(ctx.boss)
  await markAnalysisQueued(ctx.db, evidenceId)
  await ctx.boss.send(EVIDENCE_PROCESSING_QUEUE, { evidenceId } satisfies EvidenceJob, {
    // a failure is recorded on the analysis; a retry would only repeat it for a bad file
    retryLimit: 0,
    expireInSeconds: EVIDENCE_PROCESSING_EXPIRE_SECONDS,
  })
}

/** Sends the job that makes an image's thumbnail (same queue and worker as the analyses). */
export async function queueEvidenceThumbnail(ctx: Pick<ServiceContext, 'boss'>, evidenceId: string): Promise<void> {
  await createEvidenceProcessingQueue(ctx.boss)
  await ctx.boss.send(EVIDENCE_PROCESSING_QUEUE, { evidenceId, task: 'thumbnail' } satisfies EvidenceJob, { retryLimit: 0, expireInSeconds: EVIDENCE_PROCESSING_EXPIRE_SECONDS })
}

export interface EvidenceProcessingWorker {
  stop(): Promise<void>
}

/**
 * Processes queued files one at a time. Every outcome is recorded on the analysis row by
 * runEvidenceProcessing, which never throws for a bad file; anything else is logged.
 */
export async function startEvidenceProcessingWorker(
  deps: { boss: PgBoss; db: Db; objectStore?: ObjectStore },
  opts: { pollingIntervalSeconds?: number; queueName?: string } = {},
): Promise<EvidenceProcessingWorker> {
  const queue = opts.queueName ?? EVIDENCE_PROCESSING_QUEUE
  await createEvidenceProcessingQueue(deps.boss, queue)
  await deps.boss.work<EvidenceJob>(queue, { batchSize: 1, pollingIntervalSeconds: opts.pollingIntervalSeconds ?? 2 }, async ([job]) => {
    if (!job) return
    try {
      if (job.data.task === 'thumbnail') await runEvidenceThumbnail({ db: deps.db, objectStore: deps.objectStore }, job.data.evidenceId)
      else await runEvidenceProcessing({ db: deps.db, objectStore: deps.objectStore }, job.data.evidenceId)
    } catch (err) {
      // the outcome could not even be recorded (database away): pg-boss marks the job failed
      log().error({ err, jobId: job.id }, 'evidence processing worker error')
      throw err
    }
  })
  return {
    async stop() {
      await deps.boss.offWork(queue).catch(() => {})
    },
  }
}
