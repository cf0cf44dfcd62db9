/**
 * Benchmark of the radio estimation library: locating a source from 50 observations
 * (target < 50 ms) and fitting EIRP and exponent to 1,000 readings (target < 10 ms).
 * Prints median and p95 over repeated runs and writes ops/bench/RESULTS-radio-estimation.md.
 *
 *   node --import tsx ops/bench/locate-fit.bench.ts
 *
 * Data are synthetic and seeded (same inputs on every run).
 */
import { writeFileSync } from 'node:fs'
import { cpus, loadavg } from 'node:os'
import { dirname, join } from 'node:path'
import { fileURLToPath } from 'node:url'
import { fitEirpAndExponent, locateSource, type BearingObservation, type LevelObservation } from '../../shared/radio/estimation'
import { geodesicDirect, geodesicInverse } from '../../shared/radio/geo'
import { createNormalSource, createUniformSource } from '../../shared/radio/uncertainty'

const FREQ_HZ = 900e6
const L0_DB = 20 * Math.log10((4 * Math.PI * FREQ_HZ) / 299_792_458) // free space at 1 m
const SOURCE = { latDeg: 47.2, lonDeg: 8.5 }

function levels(count: number, seed: number): LevelObservation[] {
  const u = createUniformSource(seed)
  const z = createNormalSource(createUniformSource(seed + 1))
  return Array.from({ length: count }, () => {
    const p = geodesicDirect({ from: SOURCE, bearingDeg: 360 * u(), distanceM: 200 * 15 ** u() })
    const d = geodesicInverse({ from: p, to: SOURCE }).distanceM
    return { latDeg: p.latDeg, lonDeg: p.lonDeg, receivedPowerDbm: 40 - L0_DB - 28 * Math.log10(d) + 4 * z(), sigmaDb: 4 }
  })
}

function bearings(count: number, seed: number): BearingObservation[] {
  const u = createUniformSource(seed)
  const z = createNormalSource(createUniformSource(seed + 1))
  return Array.from({ length: count }, (_, i) => {
    const p = geodesicDirect({ from: SOURCE, bearingDeg: (360 * i) / count + 20 * u(), distanceM: 1000 + 4000 * u() })
    return { latDeg: p.latDeg, lonDeg: p.lonDeg, bearingDeg: geodesicInverse({ from: p, to: SOURCE }).initialBearingDeg + 3 * z(), sigmaDeg: 3 }
  })
}

function time(label: string, runs: number, fn: () => void) {
  for (let i = 0; i < 5; i++) fn() // warm-up (JIT)
  const ms: number[] = []
  for (let i = 0; i < runs; i++) {
    const t0 = performance.now()
    fn()
    ms.push(performance.now() - t0)
  }
  ms.sort((a, b) => a - b)
  const pick = (p: number) => ms[Math.min(ms.length - 1, Math.ceil(p * ms.length) - 1)]
  return { label, runs, medianMs: pick(0.5), p95Ms: pick(0.95) }
}

const levels50 = levels(50, 1)
const mixed50 = [...levels(40, 2)]
const bearings10 = bearings(10, 3)
const u = createUniformSource(4)
const z = createNormalSource(createUniformSource(5))
const readings1000 = Array.from({ length: 1000 }, () => {
  const distanceM = 10 * 500 ** u()
  return { distanceM, receivedPowerDbm: 30 - L0_DB - 32 * Math.log10(distanceM) + 6 * z() }
})

// Sanity: the timed calls must solve the problem, or the timing means nothing.
for (const [label, r] of [
  ['levels', locateSource({ levels: levels50, pathLoss: { freqHz: FREQ_HZ } })],
  ['mixed', locateSource({ levels: mixed50, bearings: bearings10, pathLoss: { freqHz: FREQ_HZ } })],
] as const) {
  const missM = geodesicInverse({ from: r.value, to: SOURCE }).distanceM
  console.log(`check ${label}: converged ${r.value.converged} in ${r.value.iterations} iterations, miss ${missM.toFixed(1)} m, 95 % ellipse ${r.value.ellipse95.semiMajorM.toFixed(0)} × ${r.value.ellipse95.semiMinorM.toFixed(0)} m`)
  if (!r.value.converged) throw new Error(`benchmark case ${label} did not converge`)
}

const results = [
  { ...time('locate: 50 level readings, EIRP and n fitted', 50, () => locateSource({ levels: levels50, pathLoss: { freqHz: FREQ_HZ } })), targetMs: 50 },
  { ...time('locate: 40 levels + 10 bearings, EIRP and n fitted', 50, () => locateSource({ levels: mixed50, bearings: bearings10, pathLoss: { freqHz: FREQ_HZ } })), targetMs: 50 },
  { ...time('fit: EIRP and exponent, 1,000 readings', 200, () => fitEirpAndExponent({ readings: readings1000, refDistanceM: 1, freqHz: FREQ_HZ })), targetMs: 10 },
]

const rows = results.map((r) => `| ${r.label} | ${r.runs} | ${r.medianMs.toFixed(2)} | ${r.p95Ms.toFixed(2)} | ${r.targetMs} | ${r.p95Ms < r.targetMs ? 'met' : 'NOT met'} |`)
for (const r of results) console.log(`${r.label}: median ${r.medianMs.toFixed(2)} ms, p95 ${r.p95Ms.toFixed(2)} ms (target < ${r.targetMs} ms)`)

const md = [
  '# Radio estimation benchmark results',
  '',
  `Run: \`node --import tsx ops/bench/locate-fit.bench.ts\` on Node ${process.version}, ${cpus().length} × ${cpus()[0]?.model ?? 'unknown CPU'}, ${new Date().toISOString().slice(0, 10)}.`,
  `Synthetic seeded data; 5 warm-up runs, then the stated number of timed runs. Load average at the end of the run: ${loadavg().map((x) => x.toFixed(1)).join(' / ')} (other work on the machine inflates p95).`,
  '',
  '| case | runs | median (ms) | p95 (ms) | target (ms) | p95 within target |',
  '| --- | --- | --- | --- | --- | --- |',
  ...rows,
  '',
]
const out = join(dirname(fileURLToPath(import.meta.url)), 'RESULTS-radio-estimation.md')
writeFileSync(out, md.join('\n'))
console.log(`written ${out}`)
