/**
 * Does the time of an answer tell whether an address has an account? Measures, over HTTP on
 * loopback, registration and password-reset requests for addresses with an account and for
 * addresses without one, interleaved in random order, and compares their medians.
 *
 *   node --import tsx ops/bench/account-discovery.bench.ts --database-url <owner url> [--runs 200] [--out ops/bench/results/account-discovery.md]
 *
 * Use a throwaway database (see README.md): the benchmark migrates it and adds accounts
 * named acct-bench-*@example.test. Every request uses a fresh address on both sides, so the
 * per-address mail cap never short-cuts one side only.
 * Goal: the medians of the two sides differ by less than their own spread (p90 − p10).
 */
import type { AddressInfo } from 'node:net'
import type { Server } from 'node:http'
import PgBoss from 'pg-boss'
import { createApp } from '../../server/app'
import { createPool, runMigrations } from '../../server/db/client'
import { MAIL_QUEUE } from '../../server/jobs/boss'
import { hashPassword } from '../../server/modules/auth/passwords'
import { argValue, loadAverage, machineInfo, machineLine, percentile, postgresVersion, reportResult } from './support'

const databaseUrl = argValue('--database-url')
if (!databaseUrl) {
  console.error('Give --database-url of a throwaway database (see ops/bench/README.md).')
  process.exit(2)
}
const runs = Number(argValue('--runs', '200'))
const out = argValue('--out')

await runMigrations(databaseUrl)
const pool = createPool(databaseUrl, 10)
const boss = new PgBoss({ connectionString: databaseUrl, schema: 'pgboss', max: 2, supervise: false, schedule: false })
boss.on('error', (e) => console.error('job queue error:', e))
await boss.start()
await boss.createQueue(MAIL_QUEUE)
// one proxy trusted, so each request can come from its own address (the per-address limit)
const handle = createApp({ pool, boss, sessionSecret: 'bench-session-secret-that-is-long-enough-0123', publicUrl: 'http://127.0.0.1', trustProxy: 1 })
const server: Server = await new Promise((resolve) => {
  const s = handle.app.listen(0, '127.0.0.1', () => resolve(s))
})
const url = `http://127.0.0.1:${(server.address() as AddressInfo).port}`

const stamp = `${process.pid}-${Date.now()}`
const existing = (i: number) => `acct-bench-${stamp}-${i}@example.test`
const unknown = (i: number) => `acct-bench-none-${stamp}-${i}@example.test`
const passwordHash = await hashPassword('bench-password-0')
for (let i = 0; i < 2 * runs; i++) {
  await pool.query(`INSERT INTO users (email, name, role, password_hash) VALUES ($1, 'Bench Person', 'complainant', $2)`, [existing(i), passwordHash])
}

let addressN = 0
async function timed(path: string, body: unknown): Promise<number> {
  addressN += 1
  const t0 = performance.now()
  const res = await fetch(`${url}${path}`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', 'x-forwarded-for': `10.${(addressN >> 16) & 255}.${(addressN >> 8) & 255}.${addressN & 255}` },
    body: JSON.stringify(body),
  })
  await res.arrayBuffer()
  const ms = performance.now() - t0
  if (res.status !== 202) throw new Error(`${path}: ${res.status}`)
  return ms
}

type Side = 'account' | 'no account'
const samples: Record<string, Record<Side, number[]>> = { register: { account: [], 'no account': [] }, 'password-reset': { account: [], 'no account': [] } }
const machine = machineInfo()
machine.postgres = await postgresVersion(databaseUrl)

// warm-up: the first hashes and queries of a process are slower
for (let i = 0; i < 5; i++) {
  await timed('/api/auth/password-reset', { email: `acct-bench-warm-${stamp}-${i}@example.test` })
  await timed('/api/auth/register', { name: 'Warm Up', email: `acct-bench-warm-${stamp}-${i}@example.test`, password: 'bench-password-1' })
}

// interleaved, the order of each pair drawn at random, so load changes hit both sides alike
let seed = 12345
const coin = () => ((seed = (seed * 1103515245 + 12345) % 2 ** 31) & 1) === 1
for (let i = 0; i < runs; i++) {
  const reset = [
    async () => samples['password-reset']!.account.push(await timed('/api/auth/password-reset', { email: existing(i) })),
    async () => samples['password-reset']!['no account'].push(await timed('/api/auth/password-reset', { email: unknown(i) })),
  ]
  const register = [
    async () => samples.register!.account.push(await timed('/api/auth/register', { name: 'Bench Again', email: existing(runs + i), password: 'bench-password-1' })),
    async () => samples.register!['no account'].push(await timed('/api/auth/register', { name: 'Bench New', email: unknown(runs + i), password: 'bench-password-1' })),
  ]
  for (const pair of [reset, register]) {
    if (coin()) pair.reverse()
    for (const step of pair) await step()
  }
}
machine.loadEnd = loadAverage()

const f = (ms: number) => ms.toFixed(1)
const rows = Object.entries(samples).map(([route, s]) => {
  const a = s.account
  const n = s['no account']
  const spread = Math.min(percentile(a, 90) - percentile(a, 10), percentile(n, 90) - percentile(n, 10))
  const diff = percentile(a, 50) - percentile(n, 50)
  return `| POST /api/auth/${route} | ${f(percentile(a, 50))} | ${f(percentile(n, 50))} | ${diff >= 0 ? '+' : ''}${f(diff)} | ${f(percentile(a, 90))} / ${f(percentile(n, 90))} | ${f(spread)} | ${Math.abs(diff) < spread ? 'yes' : 'NO'} |`
})
const md = `# Account discovery by timing — \`account-discovery.bench.ts\`

${machineLine(machine)}

${runs} requests per route and side, over HTTP on loopback, pairs interleaved in random order, each
from its own client address and for its own e-mail address. Times in ms, request to full answer.

| route | median, account | median, no account | difference | p90 account / no account | smaller p10–p90 spread | difference < spread |
| --- | ---: | ---: | ---: | ---: | ---: | --- |
${rows.join('\n')}
`
reportResult(md, out)

await new Promise<void>((r) => server.close(() => r()))
await boss.stop({ graceful: false, wait: true, timeout: 2000 })
handle.close()
await pool.query(`DELETE FROM users WHERE email LIKE $1`, [`acct-bench-%${stamp}%`])
await pool.end()
