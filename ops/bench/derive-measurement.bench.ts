/**
 * Benchmark: what the measurement form computes on every keystroke — the figures read with the
 * strict quantity parser, then shared/measurements/derive.ts through a register antenna with a
 * 40-point antenna-factor table (interpolated), an instrument with its range checks, a cable and
 * a preamplifier — and the two simpler cases (a typed gain; a reading already in the field).
 *
 *   node --import tsx ops/bench/derive-measurement.bench.ts [--iterations N]
 *
 * Target: < 4 ms per keystroke (the budget of a smooth form); it should be microseconds.
 */
import { loadavg, cpus } from 'node:os'
import { deriveMeasurement, type DeriveEquipment, type DeriveInputs } from '../../shared/measurements/derive.ts'
import { readQuantity } from '../../shared/schemas/quantities.ts'

const args = process.argv.slice(2)
const iterations = Number(args[args.indexOf('--iterations') + 1]) || 200_000

const table = Array.from({ length: 40 }, (_, i) => ({ freqHz: 30e6 * 1.09 ** i, antennaFactorDbPerM: 8 + 0.45 * i }))
const antenna: DeriveEquipment = {
  id: '00000000-0000-4000-8000-000000000001', version: 1, name: 'Log-periodic', type: 'antenna', serial: null, antennaGainDbi: null,
  antennaFactorTable: table, minFreqHz: 30e6, maxFreqHz: 1e9, maxInputDbm: null, calibrationDueOn: '2027-01-31',
}
const analyser: DeriveEquipment = {
  id: '00000000-0000-4000-8000-000000000002', version: 1, name: 'Analyser', type: 'analyser', serial: null, antennaGainDbi: null,
  antennaFactorTable: null, minFreqHz: 9e3, maxFreqHz: 6e9, maxInputDbm: 20, calibrationDueOn: '2026-01-31',
}

/** One keystroke: read the typed figures, then derive. `k` varies the figures so nothing is cached. */
function keystroke(kind: 'register' | 'gain' | 'field', k: number): number {
  const freq = readQuantity(`${433 + (k % 97) / 100} MHz`, 'frequency', { label: 'f', min: 0, minExclusive: true })
  const reading = readQuantity(`${-60 - (k % 13) / 10}`, kind === 'field' ? 'fieldStrength' : 'power', { label: 'r' })
  const cable = readQuantity('2.5 dB', 'loss', { label: 'c', min: 0 })
  if (!freq.ok || !reading.ok || !cable.ok) throw new Error('unreadable figure')
  const inputs: DeriveInputs = {
    takenAt: '2026-11-20T10:15:00Z',
    freqHz: freq.value,
    reading: { value: reading.value, unit: kind === 'field' ? 'dBµV/m' : 'dBm' },
    antenna: kind === 'register' ? { source: 'register', item: antenna } : kind === 'gain' ? { source: 'gain', antennaGainDbi: 6 } : { source: 'none' },
    instrument: kind === 'field' ? undefined : analyser,
    cableLossDb: cable.value,
    preampGainDb: kind === 'register' ? 20 : undefined,
  }
  return deriveMeasurement(inputs).derived.fieldStrengthDbuvPerM ?? 0
}

function time(kind: 'register' | 'gain' | 'field') {
  for (let i = 0; i < 20_000; i++) keystroke(kind, i) // warm up
  const samples: number[] = []
  let sink = 0
  const batch = 1000
  for (let b = 0; b < iterations / batch; b++) {
    const t0 = process.hrtime.bigint()
    for (let i = 0; i < batch; i++) sink += keystroke(kind, b * batch + i)
    samples.push(Number(process.hrtime.bigint() - t0) / 1e3 / batch) // µs per keystroke
  }
  samples.sort((a, b) => a - b)
  const q = (p: number) => samples[Math.min(samples.length - 1, Math.floor(p * samples.length))]!
  if (!Number.isFinite(sink)) throw new Error('non-finite result')
  return { median: q(0.5), p99: q(0.99), max: samples[samples.length - 1]! }
}

console.log(`derive-measurement: ${iterations} keystrokes per case, batches of 1000; ${cpus().length} CPUs, load ${loadavg()[0]!.toFixed(2)}, Node ${process.version}`)
console.log('| case | median µs/keystroke | p99 of batch means | max batch mean | target |')
console.log('|---|---|---|---|---|')
let worst = 0
for (const kind of ['register', 'gain', 'field'] as const) {
  const r = time(kind)
  worst = Math.max(worst, r.max)
  console.log(`| ${kind} | ${r.median.toFixed(2)} | ${r.p99.toFixed(2)} | ${r.max.toFixed(2)} | < 4000 µs |`)
}
console.log(worst < 4000 ? 'PASS: every batch mean under 4 ms per keystroke' : 'FAIL: over 4 ms per keystroke')
process.exitCode = worst < 4000 ? 0 : 1
