/**
 * Quietband holds under faults. The real server runs as a child process against a PostgreSQL
 * cluster of this file's own (other test files share the common one, which must never stop):
 * losing the database answers 503 and recovers by itself; a SIGKILL during a burst of reports
 * loses no acknowledged report, and every acknowledged report's e-mail arrives within a minute
 * of the restart, at most one of them twice.
 */
import { execFileSync, spawn, type ChildProcess } from 'node:child_process'
import fs from 'node:fs'
import net from 'node:net'
import os from 'node:os'
import path from 'node:path'
import { fileURLToPath } from 'node:url'
import express from 'express'
import pg from 'pg'
import request from 'supertest'
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest'
import { errorHandler } from '../../server/http/error-handler'
import { requestId } from '../../server/http/request-id'
import { createPool } from '../../server/db/client'
import { prepareDatabase } from '../../server/db/roles'
import { readMailbox, type StoredMessage } from '../../server/mail/dev-mailbox'
import { seedDemo, DEMO_PASSWORD } from '../../ops/seed-demo'
import { freePort } from '../../ops/local/free-port'
import { startSmtpFake, type SmtpFake } from '../../ops/local/smtp-fake'
import { uniqueAddress } from '../support/harness'
import { ensureDemoP12 } from '../../server/modules/case-file/case-file-signing'
import { validReport } from '../support/cases'

const ROOT = fileURLToPath(new URL('../..', import.meta.url))
const DB_SCRIPT = path.join(ROOT, 'ops', 'db.sh')

const base = fs.mkdtempSync(path.join(os.tmpdir(), 'quietband-faults-'))
fs.chmodSync(base, 0o755)
const mailDir = path.join(base, 'mail')
let dbEnv: NodeJS.ProcessEnv
let databaseUrl = ''
let migrationUrl = ''
let smtp: SmtpFake
let relay: Relay
let check: pg.Pool
const running = new Set<ChildProcess>()

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms))

function db(command: 'start' | 'stop'): string {
  return execFileSync('bash', [DB_SCRIPT, command], { env: dbEnv, encoding: 'utf8' })
}

/** Runs `fn` until `ok` holds or the time is up; returns the last value. */
async function waitFor<T>(fn: () => Promise<T>, ok: (v: T) => boolean, timeoutMs: number, everyMs = 200): Promise<T> {
  const t0 = Date.now()
  for (;;) {
    const v = await fn()
    if (ok(v) || Date.now() - t0 > timeoutMs) return v
    await sleep(everyMs)
  }
}

interface App {
  proc: ChildProcess
  url: string
  output: string[]
  exit: Promise<{ code: number | null; signal: NodeJS.Signals | null }>
  alive(): boolean
}

/** Production requires the office's signing certificate: a demo one, made once for this file. */
let caseFileP12: { path: string; passphrase: string } | undefined

/** Starts `server/index.ts` as production does, configured only through its environment. */
async function startApp(extra: Record<string, string> = {}): Promise<App> {
  caseFileP12 ??= ensureDemoP12(path.join(fs.mkdtempSync(path.join(os.tmpdir(), 'qb-faults-')), 'case-file.p12'))
  const port = await freePort()
  const url = `http://127.0.0.1:${port}`
  const env: NodeJS.ProcessEnv = {
    PATH: process.env.PATH,
    HOME: process.env.HOME,
    NODE_ENV: 'production',
    HOST: '127.0.0.1',
    PORT: String(port),
    PUBLIC_URL: url,
    DATABASE_URL: databaseUrl,
    ...(migrationUrl !== databaseUrl ? { MIGRATION_DATABASE_URL: migrationUrl } : {}),
    SESSION_SECRET: 'fault-test-session-secret-that-is-long-enough',
    // nothing reaches the evidence store in these tests; the configuration requires one
    S3_ENDPOINT: 'http://127.0.0.1:9',
    S3_BUCKET: 'quietband-evidence',
    S3_ACCESS_KEY_ID: 'unused',
    S3_SECRET_ACCESS_KEY: 'unused',
    SMTP_URL: relay.url,
    TRUST_PROXY: '1',
    CASE_FILE_P12_PATH: caseFileP12.path,
    CASE_FILE_P12_PASSPHRASE: caseFileP12.passphrase,
    ...extra,
  }
  const proc = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], { cwd: ROOT, env, stdio: ['ignore', 'pipe', 'pipe'] })
  running.add(proc)
  const output: string[] = []
  const exit = new Promise<{ code: number | null; signal: NodeJS.Signals | null }>((resolve) =>
    proc.once('exit', (code, signal) => {
      running.delete(proc)
      resolve({ code, signal })
    }),
  )
  const listening = new Promise<void>((resolve, reject) => {
    const onData = (chunk: Buffer) => {
      output.push(chunk.toString())
      if (output.join('').includes('Quietband listening on')) resolve()
    }
    proc.stdout!.on('data', onData)
    proc.stderr!.on('data', (c: Buffer) => output.push(c.toString()))
    void exit.then(({ code, signal }) => reject(new Error(`the server exited (${code ?? signal}) while starting:\n${output.join('')}`)))
  })
  await listening
  return { proc, url, output, exit, alive: () => proc.exitCode === null && proc.signalCode === null }
}

async function stopApp(app: App): Promise<void> {
  if (!app.alive()) return
  app.proc.kill('SIGTERM')
  const done = await Promise.race([app.exit.then(() => true), sleep(10_000).then(() => false)])
  if (!done) app.proc.kill('SIGKILL')
}

async function signIn(app: App, email: string): Promise<string> {
  const res = await fetch(`${app.url}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json', 'X-Forwarded-For': uniqueAddress() },
    body: JSON.stringify({ email, password: DEMO_PASSWORD }),
  })
  expect(res.status, await res.clone().text()).toBe(200)
  return res.headers.get('set-cookie')!.split(';')[0]!
}

interface Answer {
  status: number
  code?: string
  retryAfter: string | null
}

/** One request; a refused or reset connection counts as status 0. */
async function call(url: string, init: RequestInit = {}): Promise<Answer> {
  try {
    const res = await fetch(url, { ...init, signal: AbortSignal.timeout(15_000) })
    const text = await res.text()
    let code: string | undefined
    try {
      code = JSON.parse(text)?.error?.code
    } catch {
      code = undefined
    }
    return { status: res.status, code, retryAfter: res.headers.get('retry-after') }
  } catch {
    return { status: 0, retryAfter: null }
  }
}

interface Relay {
  url: string
  close(): Promise<void>
}

/**
 * A TCP relay to the SMTP fake that holds each of the server's answers back by `delayMs`,
 * like a distant mail server: a send takes a few hundred milliseconds, so a crash finds
 * a message in flight.
 */
async function slowRelay(targetPort: number, delayMs: number): Promise<Relay> {
  const sockets = new Set<net.Socket>()
  const server = net.createServer((client) => {
    const upstream = net.connect(targetPort, '127.0.0.1')
    sockets.add(client).add(upstream)
    client.pipe(upstream)
    upstream.on('data', (chunk) => setTimeout(() => !client.destroyed && client.write(chunk), delayMs))
    upstream.on('end', () => setTimeout(() => client.end(), delayMs))
    const drop = () => {
      client.destroy()
      upstream.destroy()
      sockets.delete(client)
      sockets.delete(upstream)
    }
    client.on('error', drop).on('close', drop)
    upstream.on('error', drop)
  })
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve))
  const { port } = server.address() as net.AddressInfo
  return {
    url: `smtp://127.0.0.1:${port}`,
    close: () =>
      new Promise<void>((resolve) => {
        for (const s of sockets) s.destroy()
        server.close(() => resolve())
      }),
  }
}

/** The app's database user, from its connection string. */
const appUser = () => decodeURIComponent(new URL(databaseUrl).username)

/** Messages the SMTP fake holds; a file caught half-written is read again next time. */
async function mailbox(): Promise<StoredMessage[]> {
  for (;;) {
    try {
      return await readMailbox(mailDir)
    } catch {
      await sleep(50)
    }
  }
}

beforeAll(async () => {
  dbEnv = { ...process.env, PGDATA_DIR: path.join(base, 'pgdata'), PGPORT: String(await freePort()), DB_NAME: 'quietband_faults', PG_FAST_UNSAFE: '1' }
  const out = db('start')
  databaseUrl = /^DATABASE_URL=(\S+)/m.exec(out)![1]!
  migrationUrl = /^MIGRATION_DATABASE_URL=(\S+)/m.exec(out)?.[1] ?? databaseUrl
  await prepareDatabase(migrationUrl)
  const seedPool = createPool(migrationUrl, 2)
  await seedDemo(seedPool)
  await seedPool.end()
  smtp = await startSmtpFake({ dir: mailDir })
  relay = await slowRelay(smtp.port, 25)
  check = new pg.Pool({ connectionString: databaseUrl, max: 2 })
  check.on('error', () => {}) // this test stops the server under it on purpose
}, 120_000)

afterAll(async () => {
  for (const p of running) p.kill('SIGKILL')
  await check?.end().catch(() => {})
  await relay?.close().catch(() => {})
  await smtp?.close().catch(() => {})
  try {
    if (dbEnv) db('stop')
  } finally {
    fs.rmSync(base, { recursive: true, force: true })
  }
})

describe('the error handler, when the database cannot be reached', () => {
  const withCode = (message: string, code: string) => Object.assign(new Error(message), { code })
  const quiet = vi.spyOn(console, 'error').mockImplementation(() => {})
  afterAll(() => quiet.mockRestore())
  const failingWith = (err: unknown) => {
    const app = express()
    app.use(requestId)
    app.get('/fail', () => {
      throw err
    })
    app.use(errorHandler)
    return request(app).get('/fail')
  }

  it.each([
    ['PostgreSQL shutting down (57P01)', withCode('terminating connection due to administrator command', '57P01')],
    ['PostgreSQL crashed (57P02)', withCode('terminating connection due to unexpected postmaster exit', '57P02')],
    ['PostgreSQL starting up (57P03)', withCode('the database system is starting up', '57P03')],
    ['a connection failure (08006)', withCode('connection failure', '08006')],
    ['a refused connection', withCode('connect ECONNREFUSED 127.0.0.1:5432', 'ECONNREFUSED')],
    ['a reset connection', withCode('read ECONNRESET', 'ECONNRESET')],
    ['a connection refused on every address', new AggregateError([withCode('connect ECONNREFUSED ::1:5432', 'ECONNREFUSED'), withCode('connect ECONNREFUSED 127.0.0.1:5432', 'ECONNREFUSED')])],
    ['a connection ended mid-query', new Error('Connection terminated unexpectedly')],
    ['no connection free in time', new Error('timeout exceeded when trying to connect')],
    ['a driver error wrapped by the query builder', new Error('Failed query: select 1', { cause: withCode('terminating connection due to administrator command', '57P01') })],
  ])('answers %s with 503 database_unavailable and Retry-After', async (_name, err) => {
    const res = await failingWith(err).expect(503)
    expect(res.body).toEqual({ error: { code: 'database_unavailable', message: expect.any(String), requestId: expect.any(String) } })
    expect(Number(res.headers['retry-after'])).toBeGreaterThan(0)
  })

  it.each([
    ['a missing table (42P01)', withCode('relation "nope" does not exist', '42P01')],
    ['a unique violation (23505)', withCode('duplicate key value violates unique constraint', '23505')],
    ['a plain bug', new TypeError("Cannot read properties of undefined (reading 'id')")],
  ])('still answers %s with 500: a bug is not an outage', async (_name, err) => {
    const res = await failingWith(err).expect(500)
    expect(res.body.error.code).toBe('internal_error')
    expect(res.headers['retry-after']).toBeUndefined()
  })
})

describe('a port already in use', () => {
  it('stops a second server on it with one line naming the port (exit 78), and the first keeps serving', async () => {
    const first = await startApp()
    try {
      const port = new URL(first.url).port
      const failed: Error = await startApp({ PORT: port, PUBLIC_URL: first.url }).then(
        () => new Error('the second server started'),
        (e: Error) => e,
      )
      expect(failed.message).toMatch(new RegExp(`exited \\(78\\)[\\s\\S]*Port ${port} on 127\\.0\\.0\\.1 is already in use: stop the other process, or start with another PORT\\.`))
      expect(failed.message).not.toContain('TypeError')
      expect((await fetch(`${first.url}/api/health`)).status).toBe(200)
    } finally {
      await stopApp(first)
    }
  })
})

describe('losing the database', () => {
  it('keeps the app up, answers 503 database_unavailable while PostgreSQL is away, and recovers by itself', async () => {
    const app = await startApp({ JOB_MAINTENANCE_INTERVAL_SECONDS: '1', MAIL_POLL_INTERVAL_SECONDS: '0.5' })
    try {
      const cookie = await signIn(app, 's.okafor@quietband.test')
      const listCases = () => call(`${app.url}/api/cases`, { headers: { cookie } })
      const health = () => call(`${app.url}/api/health`)

      // 12 requests at once leave idle connections in the pool
      const warm = await Promise.all(Array.from({ length: 12 }, listCases))
      expect(warm.map((a) => a.status)).toEqual(Array(12).fill(200))

      // PostgreSQL ends the app's idle connections (an administrator, a failover, a restart)
      const ended = await check.query(`SELECT count(*)::int AS n FROM (SELECT pg_terminate_backend(pid) FROM pg_stat_activity WHERE usename = $1 AND state = 'idle') t`, [appUser()])
      expect(ended.rows[0].n, 'idle connections of the app were ended').toBeGreaterThan(0)
      await sleep(500)
      expect(app.alive(), app.output.join('')).toBe(true)
      expect((await listCases()).status, 'the pool opens new connections').toBe(200)

      // PostgreSQL stops while requests keep coming
      const seen: Answer[] = []
      let load = true
      const traffic = (async () => {
        while (load) {
          seen.push(...(await Promise.all([listCases(), health(), listCases()])))
          await sleep(50)
        }
      })()
      await sleep(300)
      db('stop')
      await sleep(1500)
      expect(app.alive(), app.output.join('')).toBe(true)

      const cases = await listCases()
      expect(cases).toEqual({ status: 503, code: 'database_unavailable', retryAfter: expect.stringMatching(/^\d+$/) })
      expect((await health()).status).toBe(503)
      const report = await call(`${app.url}/api/reports`, {
        method: 'POST',
        headers: { 'Content-Type': 'application/json', 'X-Forwarded-For': uniqueAddress() },
        body: JSON.stringify(validReport()),
      })
      expect(report.status, 'a write is refused with 503, not lost silently').toBe(503)
      expect(report.code).toBe('database_unavailable')

      // PostgreSQL comes back: the same process serves again, with the same session
      db('start')
      const startedAt = Date.now()
      const back = await waitFor(listCases, (a) => a.status === 200, 20_000, 100)
      const recoveredMs = Date.now() - startedAt
      load = false
      await traffic
      expect(back.status, 'the app recovered without a restart').toBe(200)
      expect((await health()).status).toBe(200)
      expect(app.alive()).toBe(true)

      expect(seen.filter((a) => a.status !== 200 && a.status !== 503), 'every answer around the outage was 200 or 503').toEqual([])
      expect(seen.some((a) => a.status === 503), 'the outage was seen by requests in flight').toBe(true)
      expect(seen.filter((a) => a.status === 503).every((a) => a.code === 'database_unavailable')).toBe(true)

      // the job queue survived too: a report filed now gets its e-mail
      const after = validReport()
      const filed = await call(`${app.url}/api/reports`, {
        method: 'POST',
        headers: { 'Content-Type': 'application/json', 'X-Forwarded-For': uniqueAddress() },
        body: JSON.stringify(after),
      })
      expect(filed.status).toBe(201)
      const mail = await waitFor(mailbox, (ms) => ms.some((m) => m.to.includes(after.email)), 20_000)
      expect(mail.filter((m) => m.to.includes(after.email))).toHaveLength(1)
      expect(app.alive()).toBe(true)
      const count = (status: number) => seen.filter((a) => a.status === status).length
      console.info(
        `faults: database outage: ${seen.length} answers around it (${count(200)} × 200, ${count(503)} × 503, no other status); first 200 ${recoveredMs} ms after PostgreSQL was ready again; app never exited`,
      )
      if (process.env.FAULTS_SHOW_APP_OUTPUT) console.info(app.output.join(''))
    } finally {
      await stopApp(app)
    }
  }, 90_000)
})

describe('a crash during a burst of reports', () => {
  it('keeps every acknowledged report with its timeline and delivers each e-mail within a minute of the restart, at most one twice', async () => {
    const settings = { JOB_MAINTENANCE_INTERVAL_SECONDS: '2', MAIL_POLL_INTERVAL_SECONDS: '0.5' }
    const first = await startApp(settings)
    const acknowledged: { reference: string; email: string }[] = []
    const reports = Array.from({ length: 50 }, () => validReport())
    let next = 0
    let killed = false
    const unsentMail = async () => (await check.query(`SELECT count(*)::int AS n FROM pgboss.job WHERE name = 'mail-send' AND state < 'completed'`)).rows[0].n as number
    const reportMailsBeingSent = async () =>
      (await check.query(`SELECT count(*)::int AS n FROM pgboss.job WHERE name = 'mail-send' AND state = 'active' AND data->>'to' = ANY($1)`, [reports.map((r) => r.email)])).rows[0].n as number
    // the demo data's queued e-mail goes out first, so the burst's own e-mail is what the crash interrupts
    expect(await waitFor(unsentMail, (n) => n === 0, 30_000), 'mail queued before the burst was sent').toBe(0)

    // five clients file reports one after another; the process dies part-way through
    const client = async () => {
      while (next < reports.length && !killed) {
        const report = reports[next++]!
        try {
          const res = await fetch(`${first.url}/api/reports`, {
            method: 'POST',
            headers: { 'Content-Type': 'application/json', 'X-Forwarded-For': uniqueAddress() },
            body: JSON.stringify(report),
          })
          const body = (await res.json()) as { reference: string }
          if (res.status === 201) acknowledged.push({ reference: body.reference, email: report.email })
        } catch {
          // the connection died with the process: not acknowledged
        }
        await sleep(150)
      }
    }
    const killer = (async () => {
      // die in the middle: some reports acknowledged, e-mail being sent
      await waitFor(async () => acknowledged.length >= 20 && (await reportMailsBeingSent()) > 0, (ok) => ok, 30_000, 5)
      first.proc.kill('SIGKILL')
      killed = true
    })()
    await Promise.all([killer, ...Array.from({ length: 5 }, client)])
    const died = await first.exit
    expect(died.signal).toBe('SIGKILL')
    expect(acknowledged.length).toBeGreaterThanOrEqual(20)
    expect(acknowledged.length, 'the crash came before the burst ended').toBeLessThan(50)

    const restarted = await startApp(settings)
    const restartedAt = Date.now()
    try {
      // every acknowledged report is there with its timeline
      const { rows } = await check.query(
        `SELECT c.reference, array_agg(e.kind ORDER BY e.id) AS kinds FROM cases c JOIN case_events e ON e.case_id = c.id WHERE c.reference = ANY($1) GROUP BY c.reference`,
        [acknowledged.map((a) => a.reference)],
      )
      expect(rows).toHaveLength(acknowledged.length)
      for (const r of rows) expect(r.kinds, r.reference).toEqual(expect.arrayContaining(['received', 'routed']))

      // every acknowledged report's e-mail arrives within a minute of the restart
      const delivered = (ms: StoredMessage[]) => acknowledged.every((a) => ms.some((m) => m.to.includes(a.email)))
      const all = await waitFor(mailbox, delivered, 60_000, 250)
      const tookMs = Date.now() - restartedAt
      const missing = acknowledged.filter((a) => !all.some((m) => m.to.includes(a.email)))
      expect(missing, 'acknowledged reports whose e-mail did not arrive within 60 s of the restart').toEqual([])

      // at most one message went out twice (the one in flight at the crash), and it is recognisable
      const ours = all.filter((m) => reports.some((r) => m.to.includes(r.email)))
      const byMessageId = new Map<string, number>()
      for (const m of ours) {
        expect(m.messageId, 'every message carries a Message-ID').toBeTruthy()
        byMessageId.set(m.messageId!, (byMessageId.get(m.messageId!) ?? 0) + 1)
      }
      const repeats = [...byMessageId.values()].reduce((n, count) => n + (count - 1), 0)
      expect(repeats).toBeLessThanOrEqual(1)
      const perRecipient = new Map<string, number>()
      for (const m of ours) for (const to of m.to) perRecipient.set(to, (perRecipient.get(to) ?? 0) + 1)
      expect([...perRecipient.values()].filter((n) => n > 1).length).toBeLessThanOrEqual(1)
      console.info(
        `faults: ${acknowledged.length}/50 reports acknowledged before SIGKILL; all ${acknowledged.length} e-mails delivered ${(tookMs / 1000).toFixed(1)} s after the restart; ${repeats} repeated`,
      )
      expect(restarted.alive()).toBe(true)
    } finally {
      await stopApp(restarted)
    }
  }, 120_000)
})
