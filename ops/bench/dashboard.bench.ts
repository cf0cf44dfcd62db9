/**
 * Benchmark of the dashboard (GET /api/dashboard) on about 100,000 cases: a supervisor's own
 * office, an administrator over every office and filtered to one, each asked many times of a
 * real Quietband server on 127.0.0.1.
 *
 *   node --import tsx ops/bench/dashboard.bench.ts [--database-url URL] [--count 100000] [--iterations 40] [--warmup 5] [--out file]
 *
 * Without --database-url it starts a throwaway PostgreSQL cluster, migrates it, seeds the demo
 * and generates --count synthetic cases (ops/generate-cases.ts), and removes it afterwards.
 * Target: p95 ≤ 100 ms for every case.
 */
import pg from 'pg'
import { prepareDatabase } from '../../server/db/roles'
import { createDb, createPool } from '../../server/db/client'
import * as repo from '../../server/modules/dashboard/dashboard.repo'
import { followUpFigures } from '../../server/modules/follow-ups/follow-ups.repo'
import { DASHBOARD_MAP_LIMIT, DASHBOARD_WINDOWS_DAYS } from '../../shared/schemas/dashboard'
import { startCluster, type Cluster } from '../local/clusters'
import { generateCases } from '../generate-cases'
import { seedDemo } from '../seed-demo'
import { argValue, loadAverage, machineInfo, machineLine, percentile, postgresVersion, reportResult, signIn, startBenchServer } from './support'

const TARGET_P95_MS = 100
const iterations = Number(argValue('--iterations', '40'))
const warmup = Number(argValue('--warmup', '5'))
const count = Number(argValue('--count', '100000'))
const out = argValue('--out')

let cluster: Cluster | null = null
let databaseUrl = argValue('--database-url', process.env.DATABASE_URL)
try {
  if (!databaseUrl) {
    cluster = await startCluster('qb-bench-dashboard-')
    await prepareDatabase(cluster.ownerUrl)
    const pool = createPool(cluster.appUrl, 2)
    await seedDemo(pool)
    await pool.end()
    console.log(`generating ${count} cases…`)
    await generateCases({ databaseUrl: cluster.ownerUrl, count })
    databaseUrl = cluster.appUrl
  }
  const m = machineInfo()
  m.postgres = await postgresVersion(databaseUrl)
  const c = new pg.Client({ connectionString: databaseUrl })
  await c.connect()
  const offices = (await c.query<{ id: string; name: string }>(`SELECT id, name FROM offices ORDER BY name`)).rows
  const total = (await c.query<{ n: number }>(`SELECT count(*)::int AS n FROM cases`)).rows[0]!.n
  await c.end()
  const server = await startBenchServer(databaseUrl)
  try {
    const supervisor = await signIn(server.url, 's.okafor@quietband.test')
    const admin = await signIn(server.url, 'admin@quietband.test')
    const cases = [
      { name: 'supervisor (own office)', cookie: supervisor, query: '' },
      { name: 'administrator, every office', cookie: admin, query: '' },
      { name: `administrator, ${offices[0]!.name}`, cookie: admin, query: `?officeId=${offices[0]!.id}` },
    ]
    const rows: string[] = []
    for (const bc of cases) {
      const times: number[] = []
      for (let i = 0; i < warmup + iterations; i++) {
        const t0 = performance.now()
        const res = await fetch(`${server.url}/api/dashboard${bc.query}`, { headers: { cookie: bc.cookie } })
        if (res.status !== 200) throw new Error(`${bc.name}: ${res.status} ${await res.text()}`)
        await res.arrayBuffer()
        if (i >= warmup) times.push(performance.now() - t0)
      }
      const p50 = percentile(times, 50)
      const p95 = percentile(times, 95)
      rows.push(`| ${bc.name} | ${p50.toFixed(1)} | ${p95.toFixed(1)} | ${p95 <= TARGET_P95_MS ? 'yes' : '**no**'} |`)
    }
    // where an administrator's time goes: each of the dashboard's queries alone, every office
    const db = createDb(server.pool)
    const now = new Date()
    const parts: [string, () => Promise<unknown>][] = [
      ['open by state and priority', () => repo.openByStatePriority(db, { all: true })],
      ['clock counts', () => repo.clockCounts(db, { all: true }, now)],
      ['investigator loads', () => repo.investigatorLoads(db, { all: true }, now)],
      ['unassigned', () => repo.unassignedCounts(db, { all: true }, now)],
      ['first-response performance', () => repo.clockPerformance(db, { all: true }, 'firstResponse', DASHBOARD_WINDOWS_DAYS, now)],
      ['resolution performance', () => repo.clockPerformance(db, { all: true }, 'resolution', DASHBOARD_WINDOWS_DAYS, now)],
      ['map', () => repo.openCasesForMap(db, { all: true }, now, DASHBOARD_MAP_LIMIT + 1)],
      ['follow-ups', () => followUpFigures(db, offices.map((o) => o.id), now)],
    ]
    const partRows: string[] = []
    for (const [name, run] of parts) {
      const times: number[] = []
      for (let i = 0; i < 3 + 15; i++) {
        const t0 = performance.now()
        await run()
        if (i >= 3) times.push(performance.now() - t0)
      }
      partRows.push(`| ${name} | ${percentile(times, 50).toFixed(1)} |`)
    }
    rows.push('', 'Each query alone, every office (15 runs after 3 warm-up runs):', '', '| query | p50 (ms) |', '| --- | ---: |', ...partRows)
    m.loadEnd = loadAverage()
    reportResult(
      [
        `# Dashboard benchmark (${total.toLocaleString('en-GB')} cases)`,
        '',
        machineLine(m),
        '',
        `${iterations} requests per case after ${warmup} warm-up requests, one at a time. Target: p95 ≤ ${TARGET_P95_MS} ms.`,
        '',
        '| case | p50 (ms) | p95 (ms) | meets target |',
        '| --- | ---: | ---: | --- |',
        ...rows,
        '',
      ].join('\n'),
      out,
    )
  } finally {
    await server.close()
  }
} finally {
  cluster?.remove()
}
