/**
 * Benchmark: Welch PSD of 2^22 complex samples, 4096-point Hann segments, 50 % overlap,
 * timed against scipy.signal.welch on the same samples, with a numerical cross-check.
 *
 *   node --import tsx ops/bench/welch.bench.ts [--runs N] [--write-results]
 *
 * Target: at most 2× scipy's time and under 1 s. Needs python3 with scipy for the comparison;
 * when none is found and the script runs as root outside CI, it installs Debian's
 * python3-scipy with apt-get (this script only; CI never does).
 */
import { execFileSync, spawnSync } from 'node:child_process'
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs'
import { cpus, loadavg, tmpdir } from 'node:os'
import { dirname, join } from 'node:path'
import { fileURLToPath } from 'node:url'
import { welchPsd } from '../../shared/radio/spectrum/welch-psd.ts'

const here = dirname(fileURLToPath(import.meta.url))
const args = process.argv.slice(2)
const runs = Number(args[args.indexOf('--runs') + 1]) || 7
const writeResults = args.includes('--write-results')

const SAMPLE_COUNT = 2 ** 22
const SEGMENT = 4096
const OVERLAP = 2048
const FS_HZ = 10e6

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

function hasScipy(python: string): boolean {
  const r = spawnSync(python, ['-c', 'import scipy.signal'], { stdio: 'ignore' })
  return r.status === 0
}

function findPython(): string | undefined {
  for (const p of ['python3', '/usr/bin/python3']) if (hasScipy(p)) return p
  const root = typeof process.getuid === 'function' && process.getuid() === 0
  if (!root || process.env.CI) return undefined
  console.log('python3 with scipy not found; installing Debian python3-scipy (bench only) …')
  const update = spawnSync('apt-get', ['update'], { stdio: 'inherit' })
  const install = update.status === 0 ? spawnSync('apt-get', ['install', '-y', 'python3-scipy'], { stdio: 'inherit' }) : update
  if (install.status === 0 && hasScipy('/usr/bin/python3')) return '/usr/bin/python3'
  return undefined
}

const samples = makeSamples()
const runOurs = () => welchPsd({ iq: samples, sampleRateHz: FS_HZ, segmentLength: SEGMENT, detrend: 'mean' })
let ours = runOurs() // warm-up (JIT)

// Rounds alternate one timed welchPsd run with one warm scipy run (a fresh python process runs
// scipy twice and reports the second), so both sides see the same machine load.
const python = findPython()
const dir = mkdtempSync(join(tmpdir(), 'welch-bench-'))
const inPath = join(dir, 'iq.f32')
const outPath = join(dir, 'psd.f64')
if (python) writeFileSync(inPath, new Uint8Array(samples.buffer, samples.byteOffset, samples.byteLength))
const times: number[] = []
const scipyTimes: number[] = []
let report: Record<string, unknown> = {}
try {
  for (let r = 0; r < runs; r++) {
    const t0 = performance.now()
    ours = runOurs()
    times.push((performance.now() - t0) / 1000)
    if (python) {
      const args = [join(here, 'welch_scipy.py'), 'bench', inPath, outPath, String(FS_HZ), String(SEGMENT), String(OVERLAP), '2']
      const json = execFileSync(python, args, { encoding: 'utf8' })
      report = JSON.parse(json.trim().split('\n').pop() as string)
      scipyTimes.push((report.timesS as number[])[1])
    }
  }
  if (python) {
    const buf = readFileSync(outPath)
    const ref = new Float64Array(buf.buffer, buf.byteOffset, buf.byteLength / 8)
    let maxAbsDb = 0
    for (let j = 0; j < ref.length; j++) maxAbsDb = Math.max(maxAbsDb, Math.abs(ours.value.levelDb[j] - 10 * Math.log10(ref[j])))
    report = { ...report, maxAbsDb, bins: ref.length, medianS: median(scipyTimes) }
  }
} finally {
  rmSync(dir, { recursive: true, force: true })
}
const oursS = median(times)
const fmt = (v: number[]) => v.map((t) => (t * 1000).toFixed(1)).join(', ')
console.log(`welchPsd: ${SAMPLE_COUNT} complex samples, N = ${SEGMENT}, overlap ${OVERLAP}, ${ours.value.segmentCount} segments`)
console.log(`  median of ${runs}: ${(oursS * 1000).toFixed(1)} ms (runs: ${fmt(times)} ms)`)
if (python) {
  const scipyS = report.medianS as number
  report.ratio = oursS / scipyS
  console.log(`scipy ${report.scipy} (numpy ${report.numpy}, Python ${report.python}, output ${report.dtype}): median ${(scipyS * 1000).toFixed(1)} ms (runs: ${fmt(scipyTimes)} ms)`)
  console.log(`  call: ${report.call}`)
  console.log(`  max |ours − scipy| over ${report.bins} bins: ${(report.maxAbsDb as number).toExponential(2)} dB`)
  console.log(`  ratio ours/scipy: ${(oursS / scipyS).toFixed(2)} (target ≤ 2), ours ${oursS < 1 ? '<' : '≥'} 1 s`)
} else {
  console.log('scipy: not run (no python3 with scipy found)')
}

if (writeResults) {
  const machine = `${cpus().length} × ${cpus()[0]?.model ?? 'unknown CPU'}, Node ${process.version}; load average at the end ${loadavg()
    .map((l) => l.toFixed(2))
    .join(' / ')} (other work shares the machine, so absolute times vary; rounds alternate one welchPsd run with one warm scipy run)`
  const lines = [
    '# Results: radio spectrum (Welch PSD)',
    '',
    'Produced by `node --import tsx ops/bench/welch.bench.ts --write-results`.',
    '',
    `- Machine: ${machine}`,
    `- Input: ${SAMPLE_COUNT} (2^22) seeded complex float32 samples (two tones and Gaussian noise), fs = ${FS_HZ / 1e6} MHz`,
    `- Welch: Hann, ${SEGMENT}-point segments, ${OVERLAP} overlap (50 %), ${ours.value.segmentCount} segments, two-sided density, mean removal (as scipy's default detrend='constant')`,
    `- welchPsd (fft.js 4.0.4): median of ${runs} runs **${(oursS * 1000).toFixed(1)} ms** (runs: ${fmt(times)} ms)`,
  ]
  if (python && report.medianS !== undefined) {
    lines.push(
      `- scipy ${report.scipy} / numpy ${report.numpy} / Python ${report.python}: \`${report.call}\`, median of ${runs} warm runs **${((report.medianS as number) * 1000).toFixed(1)} ms** (runs: ${fmt(scipyTimes)} ms; output dtype ${report.dtype})`,
      `- Ratio welchPsd / scipy: **${(report.ratio as number).toFixed(2)}** (target ≤ 2); under 1 s: **${oursS < 1 ? 'yes' : 'no'}**`,
      `- Cross-check: max |welchPsd − scipy| over all ${SEGMENT} bins = **${(report.maxAbsDb as number).toExponential(2)} dB** (scipy works in float32 for complex64 input; welchPsd in float64)`,
    )
  } else {
    lines.push('- scipy: not run (no python3 with scipy found)')
  }
  lines.push(
    '- The same cross-check runs in CI without python: `tests/shared/radio/spectrum/welch-psd.test.ts` compares welchPsd with stored scipy output (`tests/fixtures/radio/spectrum-welch-scipy.json`, regenerate with `python3 ops/bench/welch_scipy.py fixtures tests/fixtures/radio/spectrum-welch-scipy.json tests/fixtures/radio/spectrum-trace-scipy.json`).',
  )
  writeFileSync(join(here, 'RESULTS-radio-spectrum.md'), lines.join('\n') + '\n')
  console.log(`wrote ${join(here, 'RESULTS-radio-spectrum.md')}`)
}
