/**
 * The evidence orphan sweep: an object under the evidence prefix with no stored-file row
 * (its upload's transaction failed and the object could not be removed then, or the process
 * stopped in between) is removed once it is older than an hour, so an upload still writing
 * its row is never touched. Each removal is logged. Runs on an interval in every serving
 * process (a removal is idempotent); incomplete multipart uploads are the bucket's lifecycle
 * rule's to clear, not this sweep's. Each run then queues again the processing a crash left
 * undone (processing-sweep.ts).
 */
import type PgBoss from 'pg-boss'
import type { Db } from '../../db/client'
import { log } from '../../log/logger'
import type { ObjectStore } from '../../storage/object-store'
import { listStoredObjects, removeObject } from '../../storage/stored-files'
import { knownObjectKeys } from './evidence.repo'
import { requeueStrandedProcessing } from './processing-sweep'

/** Objects younger than this are left alone (an upload may still be writing its row). */
export const ORPHAN_MIN_AGE_MS = 60 * 60 * 1000
/** How often the sweep runs in a serving process. */
export const ORPHAN_SWEEP_INTERVAL_MS = 30 * 60 * 1000

const EVIDENCE_PREFIX = 'evidence/'

/** Removes the evidence objects older than `minAgeMs` that have no row; the keys removed. */
export async function sweepEvidenceOrphans(deps: { db: Db; store: ObjectStore | undefined; now?: Date; minAgeMs?: number }): Promise<string[]> {
  const cutoff = (deps.now ?? new Date()).getTime() - (deps.minAgeMs ?? ORPHAN_MIN_AGE_MS)
  const old = (await listStoredObjects(deps.store, EVIDENCE_PREFIX)).filter((o) => o.lastModified.getTime() < cutoff)
  const removed: string[] = []
  for (let i = 0; i < old.length; i += 500) {
    const batch = old.slice(i, i + 500)
    const known = await knownObjectKeys(deps.db, batch.map((o) => o.key))
    for (const o of batch) {
      if (known.has(o.key)) continue
      await removeObject(deps.store!, o.key)
      log().warn(`evidence orphan sweep: removed ${o.key} (no row; last written ${o.lastModified.toISOString()})`)
      removed.push(o.key)
    }
  }
  return removed
}

/**
 * Starts the sweep on an interval (first run after one interval); `stop` ends it. With the job
 * queue given, each run also queues again the processing a crash left undone (processing-sweep.ts).
 */
export function startEvidenceOrphanSweep(deps: { db: Db; store: ObjectStore | undefined; boss?: PgBoss }, intervalMs = ORPHAN_SWEEP_INTERVAL_MS): { stop(): void } {
  if (!deps.store) return { stop() {} }
  let running = false
  const timer = setInterval(() => {
    if (running) return
    running = true
    sweepEvidenceOrphans(deps)
      .catch((e: unknown) => log().warn(`evidence orphan sweep failed (will try again): ${(e as Error)?.message ?? String(e)}`))
      .then(() => (deps.boss ? requeueStrandedProcessing({ db: deps.db, boss: deps.boss }) : undefined))
      .catch((e: unknown) => log().warn(`evidence processing sweep failed (will try again): ${(e as Error)?.message ?? String(e)}`))
      .finally(() => {
        running = false
      })
  }, intervalMs)
  timer.unref()
  return { stop: () => clearInterval(timer) }
}
