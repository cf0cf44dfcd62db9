/**
 * Shared pieces of the server benchmarks: a real Quietband HTTP server on loopback wired to a
 * benchmark database, signing in, percentiles, and a description of the machine (which is
 * shared with other engineers' jobs, so its load is part of every result).
 */
import { execFileSync } from 'node:child_process'
import type { AddressInfo } from 'node:net'
import type { Server } from 'node:http'
import fs from 'node:fs'
import os from 'node:os'
import path from 'node:path'
import pg from 'pg'
import PgBoss from 'pg-boss'
import { createApp } from '../../server/app'
import { createPool } from '../../server/db/client'
import { MAIL_QUEUE } from '../../server/jobs/boss'
import type { ObjectStore } from '../../server/storage/object-store'
import { DEMO_PASSWORD } from '../seed-demo'
import { optionValue } from '../command-line'

export interface BenchServer {
  url: string
  pool: pg.Pool
  close(): Promise<void>
}

/** Query text and values of every statement the app's pool runs, while recording is on. */
export interface QueryRecorder {
  on: boolean
  queries: { text: string; values: unknown[] }[]
}

/**
 * Quietband's app (createApp, as production wires it, without the e-mail worker) listening on
 * 127.0.0.1 on a free port. The pool can record the SQL it runs, for EXPLAIN of the same text.
 */
export async function startBenchServer(databaseUrl: string, opts: { poolMax?: number; recorder?: QueryRecorder; objectStore?: ObjectStore } = {}): Promise<BenchServer> {
  const pool = createPool(databaseUrl, opts.poolMax ?? 10)
  if (opts.recorder) recordQueries(pool, opts.recorder)
  // the list needs no job queue; one is still required by createApp, so a quiet one
  const boss = new PgBoss({ connectionString: databaseUrl, schema: 'pgboss', max: 2, supervise: false, schedule: false })
  boss.on('error', (e) => console.error('job queue error:', e))
  await boss.start()
  await boss.createQueue(MAIL_QUEUE)
  const handle = createApp({ pool, boss, sessionSecret: 'bench-session-secret-that-is-long-enough-0123', publicUrl: 'http://127.0.0.1', objectStore: opts.objectStore })
  const server: Server = await new Promise((resolve, reject) => {
    const s = handle.app.listen(0, '127.0.0.1', () => resolve(s))
    s.once('error', reject)
  })
  const port = (server.address() as AddressInfo).port
  return {
    url: `http://127.0.0.1:${port}`,
    pool,
    async close() {
      await new Promise<void>((r) => server.close(() => r()))
      server.closeAllConnections?.()
      // requests whose clients already left (the end of a load run) still hold pool clients
      for (const t0 = Date.now(); pool.totalCount > pool.idleCount && Date.now() - t0 < 10_000; ) await new Promise((r) => setTimeout(r, 50))
      await boss.stop({ graceful: false, wait: true, timeout: 2000 })
      handle.close()
      await pool.end()
    },
  }
}

function recordQueries(pool: pg.Pool, recorder: QueryRecorder): void {
  const original = pool.query.bind(pool) as (...args: unknown[]) => unknown
  ;(pool as unknown as { query: (...args: unknown[]) => unknown }).query = (...args: unknown[]) => {
    if (recorder.on) {
      const first = args[0] as string | { text: string; values?: unknown[] }
      if (typeof first === 'string') recorder.queries.push({ text: first, values: (args[1] as unknown[]) ?? [] })
      else recorder.queries.push({ text: first.text, values: (args[1] as unknown[]) ?? first.values ?? [] })
    }
    return original(...args)
  }
}

/** Signs in with the demo password and returns the session cookie ("qb.sid=…"). */
export async function signIn(url: string, email: string, password = DEMO_PASSWORD): Promise<string> {
  const res = await fetch(`${url}/api/auth/sign-in`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email, password }) })
  if (res.status !== 200) throw new Error(`sign-in as ${email} failed: ${res.status} ${await res.text()}`)
  const cookie = res.headers.getSetCookie().find((c) => c.startsWith('qb.sid='))
  if (!cookie) throw new Error('no session cookie in the sign-in answer')
  return cookie.split(';')[0]!
}

/** The p-th percentile (0–100) by the nearest-rank method. */
export function percentile(values: readonly number[], p: number): number {
  if (values.length === 0) throw new RangeError('percentile of an empty list')
  const sorted = [...values].sort((a, b) => a - b)
  const rank = Math.max(1, Math.ceil((p / 100) * sorted.length))
  return sorted[rank - 1]!
}

export interface MachineInfo {
  date: string
  cpus: number
  cpuModel: string
  memoryGiB: number
  node: string
  postgres?: string
  /** 1, 5 and 15 minute load averages (uptime) when the measurement started and ended. */
  loadStart: string
  loadEnd?: string
}

export function loadAverage(): string {
  return os
    .loadavg()
    .map((l) => l.toFixed(2))
    .join(' / ')
}

export function machineInfo(): MachineInfo {
  let cpus = os.cpus().length
  try {
    cpus = Number(execFileSync('nproc', { encoding: 'utf8' }).trim())
  } catch {
    // nproc missing: os.cpus() stands
  }
  return {
    date: new Date().toISOString(),
    cpus,
    cpuModel: os.cpus()[0]?.model.trim() ?? 'unknown',
    memoryGiB: Math.round((os.totalmem() / 2 ** 30) * 10) / 10,
    node: process.version,
    loadStart: loadAverage(),
  }
}

export async function postgresVersion(databaseUrl: string): Promise<string> {
  const c = new pg.Client({ connectionString: databaseUrl })
  await c.connect()
  try {
    return (await c.query('SHOW server_version')).rows[0].server_version
  } finally {
    await c.end()
  }
}

export function machineLine(m: MachineInfo): string {
  return `${m.date.slice(0, 16).replace('T', ' ')} UTC · ${m.cpus} CPUs (nproc; ${m.cpuModel}) · ${m.memoryGiB} GiB RAM · Node ${m.node}${m.postgres ? ` · PostgreSQL ${m.postgres}` : ''} · load average (1/5/15 min) ${m.loadStart} at start${m.loadEnd ? `, ${m.loadEnd} at end` : ''} — the machine is shared with other engineers' jobs`
}

/** Reads `--name value` from the command line (node:util parseArgs, ops/command-line.ts), with a default. */
export const argValue = optionValue

/** Prints a result table, and writes it to `out` when given (the results/ files). */
export function reportResult(md: string, out: string | undefined): void {
  if (out) {
    fs.mkdirSync(path.dirname(out), { recursive: true })
    fs.writeFileSync(out, md)
    console.log(`wrote ${out}`)
  }
  console.log(md)
}
