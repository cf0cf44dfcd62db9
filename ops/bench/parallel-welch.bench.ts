/**
 * Benchmark: the Welch PSD of a long recording on every core (worker threads, the server's
 * `createParallelWelchAccumulator`) against scipy.signal.welch on the same samples, in the same
 * run, with a numerical cross-check against scipy and against the single-threaded accumulator.
 *
 *   node --import tsx ops/bench/parallel-welch.bench.ts [--samples-log2 24] [--runs 7] [--out ops/bench/results/parallel-welch.md]
 *
 * The samples (seeded: two tones and Gaussian noise, complex float32) are written to a .cf32
 * file that scipy reads (ops/bench/welch_scipy.py bench). Each round times one parallel
 * estimate (pushed in blocks of 2^17 samples, 1 MiB, awaiting `ready()` after each, as the
 * processing job pushes decoded blocks), one single-threaded accumulator and one warm scipy call, so all three see the same
 * machine load. The worker pool is started before the rounds (a server keeps it running); its
 * cold start is reported apart. Target: parallel ≤ 0.6 × scipy.
 */
import { execFileSync, spawnSync } from 'node:child_process'
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs'
import { availableParallelism, cpus, loadavg, tmpdir } from 'node:os'
import { dirname, join } from 'node:path'
import { fileURLToPath } from 'node:url'
import { createWelchAccumulator } from '../../shared/radio/spectrum/welch-accumulator.ts'
import {
  closeParallelWelchWorkers,
  createParallelWelchAccumulator,
  warmParallelWelchWorkers,
} from '../../server/modules/evidence/processing/parallel-welch.ts'

const here = dirname(fileURLToPath(import.meta.url))
const args = process.argv.slice(2)
const arg = (name: string) => (args.includes(name) ? args[args.indexOf(name) + 1] : undefined)
const runs = Number(arg('--runs')) || 7
const samplesLog2 = Number(arg('--samples-log2')) || 24
const out = arg('--out')
const SAMPLE_COUNT = 2 ** samplesLog2
const SEGMENT = 4096
const OVERLAP = 2048
const FS_HZ = 10e6
const BLOCK_SAMPLES = 2 ** 17

/** Seeded samples: a tone, a weaker tone and complex Gaussian noise, as interleaved float32. */
function makeSamples(): Float32Array {
  let a = 0x5eed1234
  const uniform = () => {
    a = (a + 0x6d2b79f5) >>> 0
    let t = a
    t = Math.imul(t ^ (t >>> 15), t | 1)
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61)
    return (((t ^ (t >>> 14)) >>> 0) + 0.5) / 4294967296
  }
  const x = new Float32Array(2 * SAMPLE_COUNT)
  const sd = Math.sqrt(1e-4 / 2)
  for (let n = 0; n < SAMPLE_COUNT; n++) {
    const r = Math.sqrt(-2 * Math.log(uniform()))
    const th = 2 * Math.PI * uniform()
    const p1 = 2 * Math.PI * 0.1234567 * n
    const p2 = -2 * Math.PI * 0.3 * n
    x[2 * n] = 0.5 * Math.cos(p1) + 0.01 * Math.cos(p2) + sd * r * Math.cos(th)
    x[2 * n + 1] = 0.5 * Math.sin(p1) + 0.01 * Math.sin(p2) + sd * r * Math.sin(th)
  }
  return x
}

const median = (v: number[]) => {
  const s = [...v].sort((p, q) => p - q)
  return s.length % 2 ? s[(s.length - 1) / 2] : (s[s.length / 2 - 1] + s[s.length / 2]) / 2
}
const ms = (s: number) => (s * 1000).toFixed(1)
const load = () => loadavg().map((l) => l.toFixed(2)).join(' / ')

const python = ['python3', '/usr/bin/python3'].find((p) => spawnSync(p, ['-c', 'import scipy.signal'], { stdio: 'ignore' }).status === 0)
if (!python) {
  console.error('python3 with scipy is needed for this benchmark (the comparison is the point of it).')
  process.exit(2)
}

const welchOpts = { sampleRateHz: FS_HZ, segmentLength: SEGMENT, overlapFraction: OVERLAP / SEGMENT, detrend: 'mean' as const }
const samples = makeSamples()
const dir = mkdtempSync(join(tmpdir(), 'parallel-welch-bench-'))
const inPath = join(dir, 'iq.cf32')
const outPath = join(dir, 'psd.f64')
writeFileSync(inPath, new Uint8Array(samples.buffer, samples.byteOffset, samples.byteLength))

async function runParallel() {
  const p = createParallelWelchAccumulator({ ...welchOpts, sampleCount: SAMPLE_COUNT })
  for (let at = 0; at < samples.length; at += 2 * BLOCK_SAMPLES) {
    p.push(samples.subarray(at, at + 2 * BLOCK_SAMPLES))
    await p.ready() // as the processing job does
  }
  return { workers: p.workerCount, result: await p.result() }
}
function runSingle() {
  const acc = createWelchAccumulator(welchOpts)
  for (let at = 0; at < samples.length; at += 2 * BLOCK_SAMPLES) acc.push(samples.subarray(at, at + 2 * BLOCK_SAMPLES))
  return acc.result()
}

const loadStart = load()
const coldT0 = performance.now()
await warmParallelWelchWorkers()
const coldStartS = (performance.now() - coldT0) / 1000
let par = await runParallel() // warm-up (JIT in the workers)
let single = runSingle()

const parTimes: number[] = []
const singleTimes: number[] = []
const scipyTimes: number[] = []
let scipy: Record<string, unknown> = {}
try {
  for (let r = 0; r < runs; r++) {
    let t0 = performance.now()
    par = await runParallel()
    parTimes.push((performance.now() - t0) / 1000)
    t0 = performance.now()
    single = runSingle()
    singleTimes.push((performance.now() - t0) / 1000)
    const json = execFileSync(python, [join(here, 'welch_scipy.py'), 'bench', inPath, outPath, String(FS_HZ), String(SEGMENT), String(OVERLAP), '2'], {
      encoding: 'utf8',
      maxBuffer: 1 << 20,
    })
    scipy = JSON.parse(json.trim().split('\n').pop() as string)
    scipyTimes.push((scipy.timesS as number[])[1])
    console.log(`round ${r + 1}: parallel ${ms(parTimes[r])} ms, single ${ms(singleTimes[r])} ms, scipy ${ms(scipyTimes[r])} ms (load ${load()})`)
  }
} finally {
  const buf = readFileSync(outPath)
  const ref = new Float64Array(buf.buffer, buf.byteOffset, buf.byteLength / 8)
  let maxVsScipyDb = 0
  let maxVsSingleRel = 0
  for (let j = 0; j < ref.length; j++) {
    maxVsScipyDb = Math.max(maxVsScipyDb, Math.abs(par.result.value.levelDb[j] - 10 * Math.log10(ref[j])))
    const a = 10 ** (par.result.value.levelDb[j] / 10)
    const e = 10 ** (single.value.levelDb[j] / 10)
    maxVsSingleRel = Math.max(maxVsSingleRel, Math.abs(a - e) / e)
  }
  scipy = { ...scipy, maxVsScipyDb, maxVsSingleRel, bins: ref.length }
  rmSync(dir, { recursive: true, force: true })
  await closeParallelWelchWorkers()
}

const parS = median(parTimes)
const singleS = median(singleTimes)
const scipyS = median(scipyTimes)
const ratio = parS / scipyS
const lines = [
  `# Parallel Welch PSD against scipy (${new Date().toISOString().slice(0, 16).replace('T', ' ')} UTC)`,
  '',
  'Produced by `node --import tsx ops/bench/parallel-welch.bench.ts' + (args.length ? ' ' + args.join(' ') : '') + '`.',
  '',
  `- Machine: ${cpus().length} × ${cpus()[0]?.model ?? 'unknown CPU'} (availableParallelism ${availableParallelism()}), Node ${process.version}; load average (1/5/15 min) ${loadStart} at the start, ${load()} at the end (other work shares the machine)`,
  `- Input: 2^${samplesLog2} = ${SAMPLE_COUNT} seeded complex float32 samples (${(SAMPLE_COUNT * 8) / 2 ** 20} MiB as cf32), fs = ${FS_HZ / 1e6} MHz`,
  `- Welch: Hann, ${SEGMENT}-point segments, ${OVERLAP} overlap, ${par.result.value.segmentCount} segments, two-sided density, mean removal (scipy's default detrend='constant')`,
  `- Parallel: ${par.workers} worker threads, samples pushed in blocks of ${BLOCK_SAMPLES} (1 MiB); worker pool started before the rounds (cold start of the pool, tsx loading the sources: ${ms(coldStartS)} ms, not in the timings)`,
  `- scipy ${scipy.scipy} / numpy ${scipy.numpy} / Python ${scipy.python}: \`${scipy.call}\`, second of two calls in a fresh process each round`,
  '',
  '| what | median | runs |',
  '| --- | ---: | --- |',
  `| parallel (createParallelWelchAccumulator, ${par.workers} workers) | **${ms(parS)} ms** | ${parTimes.map(ms).join(', ')} |`,
  `| single-threaded (createWelchAccumulator) | ${ms(singleS)} ms | ${singleTimes.map(ms).join(', ')} |`,
  `| scipy.signal.welch | ${ms(scipyS)} ms | ${scipyTimes.map(ms).join(', ')} |`,
  '',
  `- Ratio parallel / scipy (medians): **${ratio.toFixed(2)}** (target ≤ 0.6: **${ratio <= 0.6 ? 'met' : 'not met'}**); single-threaded / scipy ${(singleS / scipyS).toFixed(2)}; parallel / single ${(parS / singleS).toFixed(2)}`,
  `- Ratio parallel / scipy within each round (same moment's load): ${parTimes.map((t, i) => (t / scipyTimes[i]).toFixed(2)).join(', ')}; median ${median(parTimes.map((t, i) => t / scipyTimes[i])).toFixed(2)}`,
  `- Cross-checks: max |parallel − scipy| over ${scipy.bins} bins = ${(scipy.maxVsScipyDb as number).toExponential(2)} dB (scipy computes in float32 for complex64 input); max relative difference parallel vs single-threaded = ${(scipy.maxVsSingleRel as number).toExponential(2)}`,
]
console.log(lines.join('\n'))
if (out) {
  writeFileSync(out, lines.join('\n') + '\n')
  console.log(`wrote ${out}`)
}
process.exit(ratio <= 0.6 ? 0 : 1)
