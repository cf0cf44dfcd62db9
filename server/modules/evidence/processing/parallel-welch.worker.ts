/**
 * One worker of the parallel Welch estimate (parallel-welch.ts): it receives the samples of
 * contiguous ranges of segments and adds each segment's periodogram into its own sums, with the
 * library's segment cutter (one per range) and transformer — the very code of the
 * single-threaded accumulator.
 *
 * Messages in: `start` (a job's settings and where its range starts), `block` (interleaved
 * samples, in order), `finish`, `abort`. Out: `ack` for each block, `done` with the sums, or `failed`.
 */
import { parentPort } from 'node:worker_threads'
import { SegmentCutter, SegmentTransformer } from '../../../../shared/radio/spectrum/welch-accumulator'
import type { WindowKind } from '../../../../shared/radio/spectrum/windows'

export type WorkerRequest =
  | { type: 'start'; jobId: number; segmentLength: number; overlapSamples: number; window: WindowKind; removeMean: boolean }
  /** Samples of range `range`, which starts at `firstSample` of the recording; `last` ends the range. */
  | { type: 'block'; jobId: number; range: number; firstSample: number; last: boolean; samples: Float32Array | Float64Array }
  | { type: 'finish'; jobId: number }
  | { type: 'abort'; jobId: number }

export type WorkerReply =
  | { type: 'done'; jobId: number; acc: Float64Array; segmentCount: number }
  /** atSample: the recording's sample the failure is at (Infinity when it is not about one). */
  | { type: 'failed'; jobId: number; message: string; isRangeError: boolean; atSample: number }
  | { type: 'ack'; jobId: number }

interface Job {
  segmentLength: number
  overlapSamples: number
  transformer: SegmentTransformer
  removeMean: boolean
  acc: Float64Array
  /** The ranges being read, and the segments of the ranges already ended. */
  cutters: Map<number, SegmentCutter>
  segmentsDone: number
  failed: boolean
}

const transformers = new Map<string, SegmentTransformer>()
const jobs = new Map<number, Job>()

function transformerFor(segmentLength: number, window: WindowKind): SegmentTransformer {
  const key = `${window}:${segmentLength}`
  let t = transformers.get(key)
  if (!t) {
    t = new SegmentTransformer({ segmentLength, window })
    transformers.set(key, t)
  }
  return t
}

const port = parentPort
if (!port) throw new Error('parallel-welch.worker.ts runs as a worker thread only.')

port.on('message', (msg: WorkerRequest) => {
  if (msg.type === 'start') {
    const transformer = transformerFor(msg.segmentLength, msg.window)
    const acc = new Float64Array(msg.segmentLength)
    jobs.set(msg.jobId, { segmentLength: msg.segmentLength, overlapSamples: msg.overlapSamples, transformer, removeMean: msg.removeMean, acc, cutters: new Map(), segmentsDone: 0, failed: false })
    return
  }
  const job = jobs.get(msg.jobId)
  if (!job) return
  if (msg.type === 'block') {
    if (!job.failed) {
      let cutter = job.cutters.get(msg.range)
      if (!cutter) {
        cutter = new SegmentCutter(job.segmentLength, job.overlapSamples, (seg) => job.transformer.addPeriodogram(seg, job.acc, job.removeMean))
        // sample indices in the cutter's messages count from the recording's start, not the range's
        cutter.samplesPushed = msg.firstSample
        job.cutters.set(msg.range, cutter)
      }
      try {
        cutter.push(msg.samples)
      } catch (e) {
        job.failed = true
        const message = (e as Error).message
        const at = /first at complex sample (\d+)/.exec(message)
        port.postMessage({ type: 'failed', jobId: msg.jobId, message, isRangeError: e instanceof RangeError, atSample: at ? Number(at[1]) : Infinity } satisfies WorkerReply)
      }
      if (msg.last) {
        job.segmentsDone += cutter.segmentCount
        job.cutters.delete(msg.range)
      }
    }
    port.postMessage({ type: 'ack', jobId: msg.jobId } satisfies WorkerReply) // the block is done with
    return
  }
  jobs.delete(msg.jobId)
  if (msg.type === 'finish' && !job.failed) {
    let segmentCount = job.segmentsDone
    for (const c of job.cutters.values()) segmentCount += c.segmentCount
    const reply: WorkerReply = { type: 'done', jobId: msg.jobId, acc: job.acc, segmentCount }
    port.postMessage(reply, [job.acc.buffer as ArrayBuffer])
  }
})
