/**
 * Benchmark of the estimate request: POST /api/cases/:id/calculations answered with its record
 * stored (the server reads the references the inputs name, runs the kind with the radio library,
 * inserts the record and its timeline event in one transaction), asked many times of a real
 * Quietband server on 127.0.0.1 signed in as the case's investigator.
 *
 *   node --import tsx ops/bench/estimate-request.bench.ts [--iterations 60] [--warmup 5] [--out ops/bench/results/estimate-request.md]
 *
 * Requests: an EIRP and exponent fit of 50 readings and a source location from 50 levels, each
 * once typed and once from 50 stored measurements of the case (which the server reads and copies
 * into the record). Readings are synthetic: P = 30 dBm − L(1 m) − 10·3·log10(d) + 4 dB·z at
 * 433.92 MHz, z seeded normal. It starts a throwaway PostgreSQL cluster of its own (removed at
 * the end), migrates it and seeds the demo. Target: p95 ≤ 30 ms for every request.
 */
import pg from 'pg'
import { prepareDatabase } from '../../server/db/roles'
import { CALCULATION_STATES } from '../../server/policy/calculation-policy'
import { createNormalSource, createUniformSource, freeSpaceLossDb, geodesicDirect } from '../../shared/radio'
import { startCluster } from '../local/clusters'
import { seedDemo } from '../seed-demo'
import { argValue, loadAverage, machineInfo, machineLine, percentile, postgresVersion, reportResult, signIn, startBenchServer } from './support'

const TARGET_P95_MS = 30
const POINTS = 50
const iterations = Number(argValue('--iterations', '60'))
const warmup = Number(argValue('--warmup', '5'))
const out = argValue('--out')

const FREQ_HZ = 433.92e6
const SOURCE = { latDeg: 48.1, lonDeg: -31.2 }
const L0 = freeSpaceLossDb({ freqHz: FREQ_HZ, distanceM: 1 }).value.lossDb

/** 50 synthetic readings round the source, 50 m … 5 km, log-uniform, seeded. */
function readings(): { latDeg: number; lonDeg: number; distanceM: number; receivedPowerDbm: number }[] {
  const u = createUniformSource(7)
  const z = createNormalSource(createUniformSource(8))
  return Array.from({ length: POINTS }, () => {
    const distanceM = 50 * 100 ** u()
    const p = geodesicDirect({ from: SOURCE, bearingDeg: 360 * u(), distanceM })
    return { latDeg: p.latDeg, lonDeg: p.lonDeg, distanceM, receivedPowerDbm: 30 - L0 - 30 * Math.log10(distanceM) + 4 * z() }
  })
}

const machine = machineInfo()
const cluster = await startCluster('qb-bench-estimates-')
try {
  await prepareDatabase(cluster.ownerUrl)
  const owner = new pg.Pool({ connectionString: cluster.ownerUrl, max: 2 })
  await seedDemo(owner)
  const { rows } = await owner.query<{ id: string; email: string }>(
    `SELECT c.id, u.email FROM cases c JOIN users u ON u.id = c.investigator_id WHERE c.status = ANY($1) ORDER BY c.id LIMIT 1`,
    [CALCULATION_STATES],
  )
  await owner.end()
  if (!rows[0]) throw new Error('The demo has no case being worked by an investigator.')
  const caseId = rows[0].id
  machine.postgres = await postgresVersion(cluster.appUrl)

  const server = await startBenchServer(cluster.appUrl)
  try {
    const cookie = await signIn(server.url, rows[0].email)
    const post = async (path: string, body: unknown) => {
      const t0 = performance.now()
      const res = await fetch(`${server.url}${path}`, { method: 'POST', headers: { cookie, 'content-type': 'application/json' }, body: JSON.stringify(body) })
      const json = (await res.json()) as Record<string, unknown>
      if (res.status !== 201) throw new Error(`${path}: ${res.status} ${JSON.stringify(json)}`)
      return { ms: performance.now() - t0, json }
    }
    const pts = readings()
    const ids: string[] = []
    for (const p of pts) {
      const m = {
        takenAt: '2026-11-20T10:15:00Z',
        latDeg: String(p.latDeg),
        lonDeg: String(p.lonDeg),
        freqHz: '433.92 MHz',
        rbwHz: '120 kHz',
        detector: 'rms',
        reading: { unit: 'dBm', value: p.receivedPowerDbm.toFixed(3) },
        antenna: { source: 'gain', antennaGainDbi: '0' },
        cableLossDb: '0',
        polarisation: 'vertical',
      }
      ids.push(((await post(`/api/cases/${caseId}/measurements`, { measurement: m })).json.measurement as { id: string }).id)
    }
    const requests: { name: string; body: unknown }[] = [
      // the store path with next to nothing to compute: what reading, inserting and answering cost alone
      { name: 'baseline: compliance_verdict, typed EIRP and stated limit', body: { kind: 'compliance_verdict', inputs: { eirpDbm: 30, limit: { source: 'stated', spec: { kind: 'eirp', eirpDbm: 27 }, citation: 'Bench condition' } } } },
      { name: `eirp_fit, ${POINTS} typed readings, free exponent`, body: { kind: 'eirp_fit', inputs: { readings: { source: 'typed', points: pts.map((p) => ({ distanceM: p.distanceM, receivedPowerDbm: p.receivedPowerDbm })) }, exponent: { kind: 'free' }, refDistanceM: 1, freqHz: FREQ_HZ } } },
      { name: `eirp_fit, ${POINTS} stored measurements, free exponent`, body: { kind: 'eirp_fit', inputs: { readings: { source: 'measurements', measurementIds: ids, sourcePosition: SOURCE }, exponent: { kind: 'free' }, refDistanceM: 1 } } },
      { name: `source_locate, ${POINTS} typed levels, exponent fitted`, body: { kind: 'source_locate', inputs: { observations: { source: 'typed', levels: pts.map((p) => ({ latDeg: p.latDeg, lonDeg: p.lonDeg, receivedPowerDbm: p.receivedPowerDbm })) }, levelSigmaDb: 4, pathLoss: { refDistanceM: 1, freqHz: FREQ_HZ } } } },
      { name: `source_locate, ${POINTS} stored measurements (levels), exponent fitted`, body: { kind: 'source_locate', inputs: { observations: { source: 'measurements', measurementIds: ids, use: 'levels' }, levelSigmaDb: 4, pathLoss: { refDistanceM: 1 } } } },
    ]
    const lines: string[] = []
    let allWithin = true
    // round robin: every iteration asks each request once, so a change of the machine's load falls on all alike
    for (let i = 0; i < warmup; i++) for (const q of requests) await post(`/api/cases/${caseId}/calculations`, q.body)
    const times: number[][] = requests.map(() => [])
    const summaries: string[] = requests.map(() => '')
    for (let i = 0; i < iterations; i++) {
      for (const [k, q] of requests.entries()) {
        const r = await post(`/api/cases/${caseId}/calculations`, q.body)
        times[k]!.push(r.ms)
        const v = (r.json.calculation as { outputs: { value: { eirpDbm?: number; exponent?: number; marginDb?: number } } }).outputs.value
        summaries[k] = v.exponent !== undefined ? `EIRP ${v.eirpDbm!.toFixed(2)} dBm, n ${v.exponent.toFixed(2)}` : `margin ${v.marginDb!.toFixed(2)} dB`
      }
    }
    for (const [k, q] of requests.entries()) {
      const p95 = percentile(times[k]!, 95)
      const within = p95 <= TARGET_P95_MS
      allWithin &&= within
      lines.push(`| ${q.name} | ${summaries[k]} | ${percentile(times[k]!, 50).toFixed(1)} | **${p95.toFixed(1)}** | ${Math.max(...times[k]!).toFixed(1)} | ${within ? 'yes' : 'NO'} |`)
    }
    machine.loadEnd = loadAverage()
    const md = [
      `# Estimate requests stored as records (${POINTS} points)`,
      '',
      machineLine(machine),
      '',
      `${iterations} timed requests per kind after ${warmup} warm-up ones, one at a time and round robin over the kinds, signed in as the case's investigator; each answer is 201 with the record stored (inputs, outputs, reference copies, timeline event). Synthetic readings P = 30 dBm − L(1 m) − 30·log10(d) + 4 dB·z at 433.92 MHz (truth: EIRP 30 dBm, n = 3). Times are HTTP round trips on 127.0.0.1 (ms).`,
      '',
      `| request | result | p50 | p95 | max | p95 ≤ ${TARGET_P95_MS} ms |`,
      '|---|---|---|---|---|---|',
      ...lines,
      '',
      allWithin ? `Every request within the target (p95 ≤ ${TARGET_P95_MS} ms).` : `NOT every request within the target (p95 ≤ ${TARGET_P95_MS} ms).`,
      '',
    ].join('\n')
    reportResult(md, out)
  } finally {
    await server.close()
  }
} finally {
  cluster.remove()
}
