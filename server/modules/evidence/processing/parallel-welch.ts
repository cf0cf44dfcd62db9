/**
 * Welch's power spectrum of a long recording on every core: the recording's segments are cut
 * into contiguous ranges of about 2^18 samples, dealt to the worker threads in turn
 * (parallel-welch.worker.ts); each worker adds the periodograms of its ranges' segments into
 * its own sums (the library's `SegmentCutter` and `SegmentTransformer`, the code of
 * `createWelchAccumulator`), and the sums are merged here and scaled by the library's
 * `welchFromSums`. The result equals the single-threaded accumulator's on the same samples up to
 * the order of the floating-point additions.
 *
 * The total number of samples must be known up front (a SigMF dataset's length is), so that
 * every range is fixed before the first block arrives. Samples are pushed in order, as they are
 * decoded; each block is cut at the ranges' edges and sent (copied, then transferred) to the
 * worker of each range it touches: the N − overlap samples at each edge go to both sides. The
 * samples after the last whole segment go with the last range, whose worker checks them as the
 * single-threaded accumulator does. Ranges are dealt in turn rather than one half of the
 * recording per worker so that a stream read in order keeps every worker busy at once, and a
 * reader that awaits `ready()` holds only a few blocks per worker.
 *
 * Workers start once and stay (unreferenced, so they never keep the process alive); each runs
 * the TypeScript worker file through tsx, registered in the worker itself (see BOOTSTRAP).
 */
import { createRequire } from 'node:module'
import { availableParallelism } from 'node:os'
import { dirname, join } from 'node:path'
import { pathToFileURL } from 'node:url'
import { Worker } from 'node:worker_threads'
import { levelReference } from '../../../../shared/radio/spectrum/iq'
import type { WelchAccumulatorOptions } from '../../../../shared/radio/spectrum/welch-accumulator'
import { welchFromSums, welchSettings, type WelchPsd } from '../../../../shared/radio/spectrum/welch-psd'
import { windowSamples, windowSums } from '../../../../shared/radio/spectrum/windows'
import { requireFinite } from '../../../../shared/radio/guards'
import type { RadioResult } from '../../../../shared/radio/types'
import type { WorkerReply, WorkerRequest } from './parallel-welch.worker'

export interface ParallelWelchOptions extends WelchAccumulatorOptions {
  /** Complex samples the recording holds (all of them will be pushed). */
  sampleCount: number
  /** Worker threads to use; default every core (`os.availableParallelism()`). */
  workers?: number
  /** About how many samples each range of segments holds; default 2^18 (2 MiB of cf32). */
  chunkSamples?: number
}

export interface ParallelWelchAccumulator {
  /** Adds the next block of interleaved I,Q,I,Q… samples (any length, in order). */
  push(iq: Float32Array | Float64Array): void
  /**
   * Resolves once no worker has more than a few blocks waiting: a reader that awaits it before
   * reading on holds at most that many blocks per worker in memory, however fast it reads.
   */
  ready(): Promise<void>
  readonly samplesPushed: number
  /** Workers this estimate runs on. */
  readonly workerCount: number
  /** The Welch estimate once every sample was pushed (rejects with the first worker's error). */
  result(): Promise<RadioResult<WelchPsd>>
  /** Drops the estimate (the workers forget their sums). */
  abort(): void
}

interface PoolWorker {
  worker: Worker
  handlers: Map<number, (reply: WorkerReply) => void>
}

/** Blocks a worker may have waiting before `ready()` holds the reader back. */
const MAX_WAITING_BLOCKS = 8
const DEFAULT_CHUNK_SAMPLES = 2 ** 18

let pool: PoolWorker[] = []
let nextJobId = 1

const WORKER_URL = new URL('./parallel-welch.worker.ts', import.meta.url)
const TSX_API = pathToFileURL(join(dirname(createRequire(import.meta.url).resolve('tsx/package.json')), 'dist/esm/api/index.mjs')).href

/**
 * A worker's entry point: registers tsx's loader in the worker's own thread, then imports the
 * TypeScript worker. (On Node 20 a `.ts` entry given to `new Worker` is refused even when the
 * parent runs with `--import tsx`; registering from a plain-JS entry works under the server,
 * scripts and vitest alike.)
 */
const BOOTSTRAP = `import(${JSON.stringify(TSX_API)}).then((api) => { api.register(); return import(${JSON.stringify(WORKER_URL.href)}) })`

function startWorker(): PoolWorker {
  const worker = new Worker(BOOTSTRAP, { eval: true })
  worker.unref()
  const entry: PoolWorker = { worker, handlers: new Map() }
  worker.on('message', (reply: WorkerReply) => entry.handlers.get(reply.jobId)?.(reply))
  const fail = (err: Error) => {
    pool = pool.filter((p) => p !== entry)
    for (const [jobId, h] of entry.handlers) h({ type: 'failed', jobId, message: `a Welch worker stopped: ${err.message}`, isRangeError: false, atSample: Infinity })
    entry.handlers.clear()
  }
  worker.on('error', fail)
  worker.on('exit', (code) => {
    if (pool.includes(entry)) fail(new Error(`exited with code ${code}`))
  })
  return entry
}

/** The pool's workers, started on first use (at most `count`, at least 1). */
function workersFor(count: number): PoolWorker[] {
  while (pool.length < count) pool.push(startWorker())
  return pool.slice(0, count)
}

/** Starts the workers ahead of the first estimate (they load the TypeScript sources once). */
export function warmParallelWelchWorkers(count = availableParallelism()): Promise<void> {
  const ws = workersFor(Math.max(1, count))
  return Promise.all(
    ws.map(
      (p) =>
        new Promise<void>((resolve, reject) => {
          const jobId = nextJobId++
          p.handlers.set(jobId, (r) => {
            p.handlers.delete(jobId)
            if (r.type === 'done') resolve()
            else if (r.type === 'failed') reject(new Error(r.message))
          })
          post(p, { type: 'start', jobId, segmentLength: 2, overlapSamples: 0, window: 'rectangular', removeMean: false })
          post(p, { type: 'finish', jobId })
        }),
    ),
  ).then(() => undefined)
}

/** Stops every worker (tests and benchmarks; the server leaves them running). */
export async function closeParallelWelchWorkers(): Promise<void> {
  const ws = pool
  pool = []
  await Promise.all(ws.map((p) => p.worker.terminate()))
}

function post(p: PoolWorker, msg: WorkerRequest, transfer?: ArrayBuffer[]): void {
  p.worker.postMessage(msg, transfer)
}

/** A Welch estimate split over worker threads; equal to `createWelchAccumulator` on the same samples. */
export function createParallelWelchAccumulator(opts: ParallelWelchOptions): ParallelWelchAccumulator {
  const settings = welchSettings(opts)
  if (opts.fullScaleDbm !== undefined) requireFinite('fullScaleDbm', opts.fullScaleDbm)
  const reference = levelReference(opts.fullScaleDbm)
  const sampleCount = opts.sampleCount
  if (!Number.isInteger(sampleCount) || sampleCount < 1) throw new RangeError(`sampleCount must be a positive whole number (got ${String(sampleCount)}).`)
  const n = settings.segmentLength
  if (sampleCount < n) throw new RangeError(`segmentLength ${n} is longer than the recording (${sampleCount} complex samples).`)
  const step = n - settings.overlapSamples
  const segmentCount = Math.floor((sampleCount - settings.overlapSamples) / step) // welch-psd.ts Eq. (1)

  // ranges of whole segments, about chunkSamples long, dealt to the workers in turn: range r
  // holds segments [r·S, (r+1)·S), i.e. samples [r·S·step, (last segment)·step + N)
  const perRange = Math.max(1, Math.floor((opts.chunkSamples ?? DEFAULT_CHUNK_SAMPLES) / step))
  const rangeCount = Math.ceil(segmentCount / perRange)
  const workerCount = Math.max(1, Math.min(opts.workers ?? availableParallelism(), rangeCount))
  const ranges = Array.from({ length: rangeCount }, (_, r) => {
    const firstSeg = r * perRange
    const endSeg = Math.min(segmentCount, firstSeg + perRange)
    const start = firstSeg * step
    // the samples after the last whole segment go with the last range (checked, not used)
    const end = r === rangeCount - 1 ? sampleCount : (endSeg - 1) * step + n
    return { start, end, segments: endSeg - firstSeg, worker: r % workerCount }
  })
  const expectedSegments = Array.from({ length: workerCount }, (_, w) => ranges.filter((r) => r.worker === w).reduce((sum, r) => sum + r.segments, 0))
  const ws = workersFor(workerCount)
  const jobId = nextJobId++

  const replies: (WorkerReply | undefined)[] = ws.map(() => undefined)
  const waiting = ws.map(() => 0)
  let settle: (() => void) | undefined
  let onAck: (() => void) | undefined
  ws.forEach((p, w) => {
    p.handlers.set(jobId, (reply) => {
      if (reply.type === 'ack') {
        waiting[w]--
        onAck?.()
        return
      }
      // a worker's last word: its sums, or its first failure
      if (replies[w]?.type !== 'failed') replies[w] = reply
      if (reply.type === 'done') p.handlers.delete(jobId)
      settle?.()
      onAck?.()
    })
    post(p, { type: 'start', jobId, segmentLength: n, overlapSamples: settings.overlapSamples, window: settings.windowKind, removeMean: settings.detrend === 'mean' })
  })

  let pushed = 0
  let firstOpenRange = 0
  let finished = false
  const { sumW, sumW2 } = windowSums(windowSamples({ kind: settings.windowKind, length: n }))
  const forget = () =>
    ws.forEach((p) => {
      p.handlers.delete(jobId)
      post(p, { type: 'abort', jobId })
    })

  const accumulator: ParallelWelchAccumulator = {
    workerCount,
    get samplesPushed() {
      return pushed
    },
    push(iq) {
      if (finished) throw new Error('the estimate is finished; no more samples can be pushed.')
      if (iq.length % 2 !== 0) throw new RangeError(`interleaved I/Q blocks must have an even length (got ${iq.length}).`)
      const count = iq.length >> 1
      if (pushed + count > sampleCount) throw new RangeError(`more samples pushed than the ${sampleCount} declared.`)
      while (firstOpenRange < rangeCount && ranges[firstOpenRange].end <= pushed) firstOpenRange++
      for (let r = firstOpenRange; r < rangeCount && ranges[r].start < pushed + count; r++) {
        const range = ranges[r]
        const from = Math.max(range.start, pushed)
        const to = Math.min(range.end, pushed + count)
        if (from >= to) continue
        const part = iq.slice(2 * (from - pushed), 2 * (to - pushed))
        post(ws[range.worker], { type: 'block', jobId, range: r, firstSample: range.start, last: to === range.end, samples: part }, [part.buffer])
        waiting[range.worker]++
      }
      pushed += count
    },
    ready() {
      const caughtUp = () => waiting.every((k) => k <= MAX_WAITING_BLOCKS) || replies.some((r) => r?.type === 'failed')
      if (caughtUp()) return Promise.resolve()
      return new Promise<void>((resolve) => {
        onAck = () => {
          if (caughtUp()) {
            onAck = undefined
            resolve()
          }
        }
      })
    },
    async result() {
      if (finished) throw new Error('result() was already asked for.')
      finished = true
      abandoned.unregister(accumulator)
      ws.forEach((p) => post(p, { type: 'finish', jobId }))
      await new Promise<void>((resolve) => {
        settle = () => {
          if (replies.every((r) => r !== undefined)) resolve()
        }
        settle()
      })
      ws.forEach((p) => p.handlers.delete(jobId))
      // the failure nearest the recording's start is the one a single pass would have met first
      let failed: Extract<WorkerReply, { type: 'failed' }> | undefined
      for (const r of replies) if (r?.type === 'failed' && (!failed || r.atSample < failed.atSample)) failed = r
      if (failed) {
        forget()
        throw failed.isRangeError ? new RangeError(failed.message) : new Error(failed.message)
      }
      const acc = new Float64Array(n)
      let segments = 0
      replies.forEach((r, w) => {
        if (r?.type !== 'done') return
        if (r.segmentCount !== expectedSegments[w]) {
          throw new RangeError(`the recording ended early: ${pushed} of the ${sampleCount} declared samples were pushed.`)
        }
        segments += r.segmentCount
        for (let k = 0; k < n; k++) acc[k] += r.acc[k]
      })
      return welchFromSums({
        acc,
        sampleRateHz: settings.sampleRateHz,
        centerFreqHz: settings.centerFreqHz,
        segmentLength: n,
        overlapSamples: settings.overlapSamples,
        segmentCount: segments,
        samplesUsed: (segments - 1) * step + n,
        windowKind: settings.windowKind,
        detrend: settings.detrend,
        scaling: settings.scaling,
        reference,
        sumW,
        sumW2,
      })
    },
    abort() {
      finished = true
      abandoned.unregister(accumulator)
      forget()
    },
  }
  // an estimate dropped unfinished (the file failed half-way) is forgotten by the workers too
  abandoned.register(accumulator, forget, accumulator)
  return accumulator
}

const abandoned = new FinalizationRegistry<() => void>((forget) => forget())
