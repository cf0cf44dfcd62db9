/**
 * The processing sweep: an upload queues its file's background work only after its row is
 * committed, so a crash in between (or a job lost with its worker) leaves a file that is never
 * analysed or never gets its thumbnail. This sweep, run beside the orphan sweep, queues again
 * the files of a processed kind with no analysis, or whose analysis stayed queued or running
 * past the job's expiry with no live job, and the images with no thumbnail and no live job.
 * Files younger than `minAgeMs` are left to their upload. Each re-queue is logged.
 */
import type PgBoss from 'pg-boss'
import type { Db } from '../../db/client'
import { log } from '../../log/logger'
import { EVIDENCE_PROCESSING_EXPIRE_SECONDS, EVIDENCE_PROCESSING_QUEUE, queueEvidenceThumbnail } from './processing-queue'
import { filesWithStrandedAnalysis, imagesWithoutThumbnail } from './processing-sweep.repo'
import { startAnalysis } from './start-processing'

/** Files younger than this are left alone (their upload is still queuing them). */
export const PROCESSING_SWEEP_MIN_AGE_MS = 10 * 60 * 1000
/** At most this many files are queued again per run. */
const BATCH = 200

export interface ProcessingSweepResult {
  /** Files whose analysis was queued again. */
  analyses: string[]
  /** Images whose thumbnail was queued again. */
  thumbnails: string[]
}

/** Queues again the background work a crash or a lost job left undone. */
export async function requeueStrandedProcessing(deps: { db: Db; boss: PgBoss; now?: Date; minAgeMs?: number }): Promise<ProcessingSweepResult> {
  const uploadedBefore = new Date((deps.now ?? new Date()).getTime() - (deps.minAgeMs ?? PROCESSING_SWEEP_MIN_AGE_MS))
  const opts = { uploadedBefore, expireSeconds: EVIDENCE_PROCESSING_EXPIRE_SECONDS, queue: EVIDENCE_PROCESSING_QUEUE, limit: BATCH }
  const ctx = { db: deps.db, boss: deps.boss }
  const result: ProcessingSweepResult = { analyses: [], thumbnails: [] }
  for (const f of await filesWithStrandedAnalysis(deps.db, opts)) {
    // a half of a SigMF recording still without its partner stays waiting: not a re-queue
    if ((await startAnalysis(ctx, f)) !== 'queued') continue
    log().warn(`evidence processing sweep: queued ${f.id} ("${f.displayName}") again (no analysis, or its job was lost)`)
    result.analyses.push(f.id)
  }
  for (const id of await imagesWithoutThumbnail(deps.db, opts)) {
    await queueEvidenceThumbnail(ctx, id)
    log().warn(`evidence processing sweep: queued the thumbnail of ${id} again`)
    result.thumbnails.push(id)
  }
  return result
}
