/**
 * Load benchmark of the case list: 50 concurrent clients for 30 s with autocannon against a
 * real Quietband server (its own process, 127.0.0.1 only), each client signed in (a
 * supervisor's or an administrator's session cookie) and cycling through a mix of list
 * queries as the list screen sends them.
 *
 *   node --import tsx ops/bench/case-list-load.bench.ts --database-url URL [--connections 50]
 *        [--duration 30] [--out ops/bench/results/case-list-load.md]
 *
 * Target: 0 errors and 0 non-2xx answers. Reports requests/s and latency p50/p97.5/p99.
 */
import { spawn } from 'node:child_process'
import path from 'node:path'
import { fileURLToPath } from 'node:url'
import autocannon from 'autocannon'
import pg from 'pg'
import { argValue, loadAverage, machineInfo, machineLine, postgresVersion, reportResult, signIn } from './support'

const databaseUrl = argValue('--database-url', process.env.DATABASE_URL)
if (!databaseUrl) {
  console.error('usage: node --import tsx ops/bench/case-list-load.bench.ts --database-url URL [--connections 50] [--duration 30] [--out file]')
  process.exit(2)
}
const connections = Number(argValue('--connections', '50'))
const durationS = Number(argValue('--duration', '30'))
const out = argValue('--out')
const here = path.dirname(fileURLToPath(import.meta.url))

/** Starts ops/bench/serve.ts and resolves with its URL and a stop function. */
async function startServerProcess(): Promise<{ url: string; stop(): Promise<number | null> }> {
  const child = spawn(process.execPath, ['--import', 'tsx', path.join(here, 'serve.ts'), '--database-url', databaseUrl!], { stdio: ['ignore', 'pipe', 'inherit'] })
  const url = await new Promise<string>((resolve, reject) => {
    let buf = ''
    child.stdout.on('data', (d: Buffer) => {
      buf += d.toString()
      const m = /listening (\S+)/.exec(buf)
      if (m) resolve(m[1]!)
    })
    child.once('exit', (code) => reject(new Error(`bench server exited early (${code})`)))
  })
  return {
    url,
    stop: () =>
      new Promise((resolve) => {
        child.once('exit', (code) => resolve(code))
        child.kill('SIGINT')
      }),
  }
}

async function officeIds(): Promise<Record<string, string>> {
  const c = new pg.Client({ connectionString: databaseUrl })
  await c.connect()
  try {
    const { rows } = await c.query(`SELECT id, name FROM offices`)
    return Object.fromEntries(rows.map((r) => [r.name, r.id]))
  } finally {
    await c.end()
  }
}

/** The mix: what a supervisor and an administrator ask of the list in a working day. */
function mix(offices: Record<string, string>): { who: 'supervisor' | 'admin'; query: string }[] {
  const q = (o: Record<string, string>) => `/api/cases?${new URLSearchParams({ page: '1', pageSize: '25', sort: 'receivedAt', dir: 'desc', ...o })}`
  return [
    { who: 'supervisor', query: q({}) },
    { who: 'supervisor', query: q({ status: 'received,triaged', sort: 'priority', dir: 'asc' }) },
    { who: 'supervisor', query: q({ open: 'true', sort: 'dueAt', dir: 'asc' }) },
    { who: 'supervisor', query: q({ overdue: 'true' }) },
    { who: 'supervisor', query: q({ investigatorId: 'none', open: 'true' }) },
    { who: 'supervisor', query: q({ q: 'harrowmere' }) },
    { who: 'supervisor', query: q({ service: 'maritime,aeronautical,radionavigation,ppdr' }) },
    { who: 'supervisor', query: q({ freqFromHz: '87500000', freqToHz: '108000000' }) },
    { who: 'supervisor', query: q({ page: '40', sort: 'status' }) },
    { who: 'admin', query: q({}) },
    { who: 'admin', query: q({ officeId: offices['Kestrel Bay'] ?? '', open: 'true' }) },
    { who: 'admin', query: q({ priority: '1,2', sort: 'dueAt', dir: 'asc' }) },
    { who: 'admin', query: q({ q: 'masthead', sort: 'service' }) },
    { who: 'admin', query: q({ page: '2000', sort: 'reference', dir: 'asc' }) },
    { who: 'admin', query: q({ open: 'false', pageSize: '100' }) },
  ]
}

async function main(): Promise<void> {
  const machine = machineInfo()
  machine.postgres = await postgresVersion(databaseUrl!)
  const offices = await officeIds()
  const server = await startServerProcess()
  try {
    const cookies = { supervisor: await signIn(server.url, 's.okafor@quietband.test'), admin: await signIn(server.url, 'admin@quietband.test') }
    const requests = mix(offices).map((m) => ({ method: 'GET', path: m.query, headers: { cookie: cookies[m.who] } }))
    // a short warm-up so the first seconds do not measure cold caches and JIT
    await autocannon({ url: server.url, connections: 10, duration: 3, requests })
    console.log(`load: ${connections} connections for ${durationS} s against ${server.url} (load average ${loadAverage()})`)
    const r = await autocannon({ url: server.url, connections, duration: durationS, requests, timeout: 10 })
    machine.loadEnd = loadAverage()
    const md = [
      '# Case list under load (autocannon)',
      '',
      `- ${machineLine(machine)}`,
      `- ${connections} connections for ${r.duration} s, autocannon 9 in this process, the server in its own process (ops/bench/serve.ts: createApp, pool of 10 connections) on 127.0.0.1; one request at a time per connection, no pipelining`,
      `- Mix of ${requests.length} list queries cycled by every connection (9 as a Harrowmere supervisor, 6 as an administrator): default, triage queue by priority, open by due date, overdue, unassigned open, text search, safety services, FM band, page 40 by status, Kestrel Bay open, P1–P2 by due date, text search by service, page 2000 by reference, closed 100 per page`,
      '',
      '| requests/s (mean) | requests total | latency p50 | p97.5 | p99 | max | errors | timeouts | non-2xx |',
      '|---:|---:|---:|---:|---:|---:|---:|---:|---:|',
      `| ${r.requests.average.toFixed(0)} | ${r.requests.total} | ${r.latency.p50} ms | ${r.latency.p97_5} ms | ${r.latency.p99} ms | ${r.latency.max} ms | ${r.errors} | ${r.timeouts} | ${r.non2xx} |`,
      '',
      `Target: 0 errors and 0 non-2xx: **${r.errors === 0 && r.non2xx === 0 ? 'met' : 'missed'}**. Status codes: ${Object.entries(r.statusCodeStats)
        .map(([code, s]) => `${code} × ${s.count}`)
        .join(', ')}.`,
      '',
    ].join('\n')
    reportResult(md, out)
    process.exitCode = r.errors === 0 && r.non2xx === 0 ? 0 : 1
  } finally {
    const code = await server.stop()
    if (code !== 0) console.error(`bench server exited with ${code}`)
  }
}

await main()
