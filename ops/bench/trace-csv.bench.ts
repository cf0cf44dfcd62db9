/**
 * Benchmark: a 1,000,000-point analyser trace as CSV, parsed and summarised as the evidence
 * processing job does it.
 *
 *   node --import tsx ops/bench/trace-csv.bench.ts [--points 1000000] [--runs 7] [--out ops/bench/results/trace-csv.md]
 *
 * The CSV (header with units, MHz and dBm, six decimals; seeded noise at about −100 dBm with
 * three signals) is made in memory. Timed per run:
 *  - parse: `parseTraceCsv` on the text;
 *  - job: `analyseSpectrumFile` on the file's bytes read from a stream in 1 MiB chunks (decode,
 *    parse, summary: noise floor, peaks, occupied bandwidth; display trace) — everything the
 *    processing job does but the object store and the database.
 * Target: the job path under 1 s.
 */
import { Readable } from 'node:stream'
import { writeFileSync } from 'node:fs'
import { cpus, loadavg } from 'node:os'
import { parseTraceCsv } from '../../shared/radio/spectrum/trace-csv.ts'
import { analyseSpectrumFile } from '../../server/modules/evidence/processing/analyse-spectrum.ts'

const args = process.argv.slice(2)
const arg = (name: string) => (args.includes(name) ? args[args.indexOf(name) + 1] : undefined)
const points = Number(arg('--points')) || 1_000_000
const runs = Number(arg('--runs')) || 7
const out = arg('--out')

function makeCsv(): string {
  let a = 0x7ace0001
  const uniform = () => {
    a = (a + 0x6d2b79f5) >>> 0
    let t = a
    t = Math.imul(t ^ (t >>> 15), t | 1)
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61)
    return (((t ^ (t >>> 14)) >>> 0) + 0.5) / 4294967296
  }
  const startMhz = 400
  const stepMhz = 100 / points
  const bumps = [
    { f: 433.92, w: 0.05, dbm: -40 },
    { f: 446.00625, w: 0.004, dbm: -62 },
    { f: 470.5, w: 2, dbm: -75 },
  ]
  const lines = ['Frequency (MHz),Level (dBm)']
  for (let i = 0; i < points; i++) {
    const f = startMhz + i * stepMhz
    let mw = 10 ** ((-100 + 2 * (uniform() - 0.5) * 1.7) / 10)
    for (const b of bumps) mw += 10 ** (b.dbm / 10) * Math.exp(-((f - b.f) ** 2) / (2 * b.w * b.w))
    lines.push(`${f.toFixed(6)},${(10 * Math.log10(mw)).toFixed(3)}`)
  }
  return lines.join('\n') + '\n'
}

const median = (v: number[]) => {
  const s = [...v].sort((p, q) => p - q)
  return s.length % 2 ? s[(s.length - 1) / 2] : (s[s.length / 2 - 1] + s[s.length / 2]) / 2
}
const load = () => loadavg().map((l) => l.toFixed(2)).join(' / ')
const fmt = (v: number[]) => v.map((t) => t.toFixed(0)).join(', ')

const csv = makeCsv()
const bytes = Buffer.from(csv, 'utf8')
const stream = () =>
  Readable.from(
    (function* () {
      for (let at = 0; at < bytes.length; at += 1 << 20) yield bytes.subarray(at, at + (1 << 20))
    })(),
  )
const loadStart = load()

const parseTimes: number[] = []
const jobTimes: number[] = []
let summary: Awaited<ReturnType<typeof analyseSpectrumFile>> | undefined
for (let r = -1; r < runs; r++) {
  // round −1 warms the JIT
  let t0 = performance.now()
  const parsed = parseTraceCsv({ csvText: csv })
  const parseMs = performance.now() - t0
  if (parsed.freqHz.length !== points) throw new Error(`parsed ${parsed.freqHz.length} points, expected ${points}`)
  t0 = performance.now()
  summary = await analyseSpectrumFile({ open: async () => stream(), originalName: 'trace.csv', contentType: 'text/csv' })
  const jobMs = performance.now() - t0
  if (r >= 0) {
    parseTimes.push(parseMs)
    jobTimes.push(jobMs)
    console.log(`run ${r + 1}: parse ${parseMs.toFixed(0)} ms, job path ${jobMs.toFixed(0)} ms (load ${load()})`)
  }
}
const s = summary?.summary
const lines = [
  `# Trace CSV: ${points.toLocaleString('en')} points parsed and summarised (${new Date().toISOString().slice(0, 16).replace('T', ' ')} UTC)`,
  '',
  'Produced by `node --import tsx ops/bench/trace-csv.bench.ts' + (args.length ? ' ' + args.join(' ') : '') + '`.',
  '',
  `- Machine: ${cpus().length} × ${cpus()[0]?.model ?? 'unknown CPU'}, Node ${process.version}; load average (1/5/15 min) ${loadStart} at the start, ${load()} at the end`,
  `- Input: ${(bytes.length / 2 ** 20).toFixed(1)} MiB of CSV, header \`Frequency (MHz),Level (dBm)\`, ${points.toLocaleString('en')} rows \`400.000000,-99.512\` …`,
  '',
  '| what | median | runs (ms) | target |',
  '| --- | ---: | --- | --- |',
  `| parseTraceCsv | **${median(parseTimes).toFixed(0)} ms** | ${fmt(parseTimes)} | — |`,
  `| job path: analyseSpectrumFile (stream → text → parse → noise floor, peaks, OBW → display trace) | **${median(jobTimes).toFixed(0)} ms** | ${fmt(jobTimes)} | < 1 s: **${median(jobTimes) < 1000 ? 'met' : 'not met'}** |`,
  '',
  `- Result: ${s?.pointCount} points, noise floor ${s?.noiseFloorDbm.toFixed(2)} dBm, ${s?.peaks.length} peaks (strongest ${s?.peaks[0]?.levelDbm.toFixed(2)} dBm at ${((s?.peaks[0]?.freqHz ?? 0) / 1e6).toFixed(4)} MHz), display trace ${summary?.displayTrace.freqHz.length} points`,
]
console.log(lines.join('\n'))
if (out) {
  writeFileSync(out, lines.join('\n') + '\n')
  console.log(`wrote ${out}`)
}
process.exit(median(jobTimes) < 1000 ? 0 : 1)
