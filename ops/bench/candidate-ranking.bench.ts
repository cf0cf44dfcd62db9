/**
 * Benchmark of the candidate-source ranking (POST /api/station-register/candidates: the
 * register in force read for the overlapping stations, each ranked by its predicted level at
 * the victim) on a licence register of 100,000 authorised stations, asked many times of a real
 * Quietband server on 127.0.0.1 signed in as an investigator.
 *
 *   node --import tsx ops/bench/candidate-ranking.bench.ts [--stations 100000] [--iterations 60] [--warmup 5] [--out ops/bench/results/candidate-ranking.md]
 *
 * It starts a throwaway PostgreSQL cluster of its own (removed at the end), migrates it, seeds
 * the demo accounts, and makes the 100,000 stations in one INSERT … SELECT over generate_series
 * (frequencies log-uniform from 30 MHz to 40 GHz, channel widths from 12.5 kHz to 56 MHz,
 * positions over the demo region). Target: p95 ≤ 100 ms for every query.
 */
import pg from 'pg'
import { prepareDatabase } from '../../server/db/roles'
import { startCluster } from '../local/clusters'
import { seedDemo } from '../seed-demo'
import { DEMO_REGION_BOX } from '../demo-data/region'
import { argValue, loadAverage, machineInfo, machineLine, percentile, postgresVersion, reportResult, signIn, startBenchServer, type QueryRecorder } from './support'

const TARGET_P95_MS = 100
const stationCount = Number(argValue('--stations', '100000'))
const iterations = Number(argValue('--iterations', '60'))
const warmup = Number(argValue('--warmup', '5'))
const out = argValue('--out')

interface Query {
  name: string
  body: Record<string, unknown>
}
const victim = { latDeg: 48.1, lonDeg: -31.2 }
const QUERIES: Query[] = [
  { name: 'PMR channel 446.0–446.2 MHz, free space', body: { victimPosition: victim, lowFreqHz: '446 MHz', highFreqHz: '446.2 MHz' } },
  { name: 'one frequency, 100.1 MHz', body: { victimPosition: victim, lowFreqHz: '100.1 MHz', highFreqHz: '100.1 MHz' } },
  { name: 'LTE block 806–816 MHz, Hata suburban, top 50', body: { victimPosition: victim, lowFreqHz: '806 MHz', highFreqHz: '816 MHz', model: { kind: 'hata', freqHz: '811 MHz', txHeightM: 30, rxHeightM: 1.5, environment: 'suburban' }, limit: 50 } },
  { name: '1805–1880 MHz with an estimated source, by distance', body: { victimPosition: victim, lowFreqHz: '1805 MHz', highFreqHz: '1880 MHz', estimatedSourcePosition: { latDeg: 48.12, lonDeg: -31.25 }, order: 'distance-to-estimate' } },
  { name: 'wide 400–500 MHz (a broadband noise)', body: { victimPosition: victim, lowFreqHz: '400 MHz', highFreqHz: '500 MHz' } },
  { name: 'nothing authorised: 0.9–1 MHz', body: { victimPosition: victim, lowFreqHz: '0.9 MHz', highFreqHz: '1 MHz' } },
]

/** The register: one version, `count` stations made by the database in one statement. */
async function fillRegister(ownerUrl: string, count: number): Promise<{ seconds: number }> {
  const c = new pg.Client({ connectionString: ownerUrl })
  await c.connect()
  try {
    const t0 = performance.now()
    await c.query('BEGIN')
    const admin = (await c.query(`SELECT id FROM users WHERE email = 'admin@quietband.test'`)).rows[0].id
    const file = (
      await c.query(
        `INSERT INTO stored_files (object_key, original_name, size_bytes, sha256, content_type, content_type_source, purpose, uploaded_by)
         VALUES ('station_register_import/bench-' || gen_random_uuid(), 'bench-register.csv', 0, repeat('0', 64), 'text/csv', 'declared', 'station_register_import', $1) RETURNING id`,
        [admin],
      )
    ).rows[0].id
    await c.query(
      `INSERT INTO station_register_versions (version, imported_by, stored_file_id, file_name, sha256, delimiter, accepted_count, rejected_count, column_mapping, rejected_rows)
       VALUES (1, $1, $2, 'bench-register.csv', repeat('0', 64), 'comma', $3, 0, '{"fields":{}}', '[]')`,
      [admin, file, count],
    )
    const b = DEMO_REGION_BOX
    await c.query('SELECT setseed(0.42)')
    await c.query(
      `INSERT INTO authorised_stations (register_version, line, station_code, licensee, service, latitude_deg, longitude_deg, antenna_height_m,
                                        low_freq_hz, high_freq_hz, "limit", authorised_eirp_dbm)
       SELECT 1, g + 1, 'BENCH-' || g, 'Bench licensee ' || (g % 997), 'Bench service', lat, lon, 10 + 40 * random(),
              centre - width / 2, centre + width / 2, jsonb_build_object('kind', 'eirp', 'eirpDbm', eirp), eirp
       FROM (SELECT g,
                    $1::float8 + ($2::float8 - $1::float8) * random() AS lat,
                    $3::float8 + ($4::float8 - $3::float8) * random() AS lon,
                    exp(ln(30e6) + (ln(40e9) - ln(30e6)) * random()) AS centre,
                    (ARRAY[12.5e3, 25e3, 200e3, 5e6, 20e6, 56e6])[1 + floor(random() * 6)::int] AS width,
                    round((10 + 55 * random())::numeric, 1)::float8 AS eirp
             FROM generate_series(1, $5::int) AS g) s`,
      [b.latMinDeg, b.latMaxDeg, b.lonMinDeg, b.lonMaxDeg, count],
    )
    await c.query('COMMIT')
    await c.query('ANALYZE authorised_stations')
    return { seconds: (performance.now() - t0) / 1000 }
  } finally {
    await c.end()
  }
}

const machine = machineInfo()
const cluster = await startCluster('qb-bench-candidates-')
try {
  await prepareDatabase(cluster.ownerUrl)
  const owner = new pg.Pool({ connectionString: cluster.ownerUrl, max: 2 })
  await seedDemo(owner)
  await owner.end()
  machine.postgres = await postgresVersion(cluster.appUrl)
  const filled = await fillRegister(cluster.ownerUrl, stationCount)
  console.log(`${stationCount} stations made in ${filled.seconds.toFixed(1)} s`)

  const recorder: QueryRecorder = { on: false, queries: [] }
  const server = await startBenchServer(cluster.appUrl, { recorder })
  try {
    const cookie = await signIn(server.url, 'm.ferreira@quietband.test')
    const ask = async (q: Query) => {
      const t0 = performance.now()
      const res = await fetch(`${server.url}/api/station-register/candidates`, { method: 'POST', headers: { cookie, 'content-type': 'application/json' }, body: JSON.stringify(q.body) })
      const body = (await res.json()) as { ranking?: { overlappingCount: number; candidates: unknown[] } }
      if (res.status !== 200 || !body.ranking) throw new Error(`${q.name}: ${res.status} ${JSON.stringify(body)}`)
      return { ms: performance.now() - t0, overlapping: body.ranking.overlappingCount, returned: body.ranking.candidates.length }
    }
    /** PostgreSQL's own execution time for the overlap query the request ran (EXPLAIN ANALYZE of the same text). */
    const sqlMs = async (q: Query): Promise<string> => {
      recorder.queries = []
      recorder.on = true
      await ask(q)
      recorder.on = false
      const overlap = recorder.queries.find((r) => r.text.includes('numrange') && r.text.includes('&&'))
      if (!overlap) return '—'
      const times: number[] = []
      for (let i = 0; i < 5; i++) {
        const { rows } = await server.pool.query(`EXPLAIN (ANALYZE, FORMAT JSON) ${overlap.text}`, overlap.values)
        times.push(rows[0]['QUERY PLAN'][0]['Execution Time'] as number)
      }
      return percentile(times, 50).toFixed(1)
    }
    const rows: string[] = []
    let allWithin = true
    for (const q of QUERIES) {
      for (let i = 0; i < warmup; i++) await ask(q)
      const sql = await sqlMs(q)
      const times: number[] = []
      let last = { overlapping: 0, returned: 0 }
      for (let i = 0; i < iterations; i++) {
        const r = await ask(q)
        times.push(r.ms)
        last = r
      }
      const p95 = percentile(times, 95)
      const within = p95 <= TARGET_P95_MS
      allWithin &&= within
      rows.push(`| ${q.name} | ${last.overlapping} | ${last.returned} | ${sql} | ${percentile(times, 50).toFixed(1)} | **${p95.toFixed(1)}** | ${Math.max(...times).toFixed(1)} | ${within ? 'yes' : 'NO'} |`)
    }
    machine.loadEnd = loadAverage()
    const md = [
      `# Candidate ranking on ${stationCount.toLocaleString('en')} authorised stations`,
      '',
      machineLine(machine),
      '',
      `Register made in ${filled.seconds.toFixed(1)} s (one INSERT … SELECT over generate_series, then ANALYZE). ${iterations} timed requests per query after ${warmup} warm-up ones, signed in as an investigator, one at a time. Times are HTTP round trips on 127.0.0.1 (ms); "SQL" is PostgreSQL's execution time of the overlap query the request ran (EXPLAIN ANALYZE, median of 5).`,
      '',
      '| query | overlapping stations | returned | SQL (median, ms) | p50 | p95 | max | p95 ≤ 100 ms |',
      '|---|---|---|---|---|---|---|---|',
      ...rows,
      '',
      allWithin ? `Every query within the target (p95 ≤ ${TARGET_P95_MS} ms).` : `NOT every query within the target (p95 ≤ ${TARGET_P95_MS} ms).`,
      '',
    ].join('\n')
    reportResult(md, out)
  } finally {
    await server.close()
  }
} finally {
  cluster.remove()
}
