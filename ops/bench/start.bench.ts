/**
 * Benchmark of `npm start` on an installed copy of the project: the time from running the
 * command until the URL it prints answers (GET / → 200), in four situations:
 *
 *   first    a fresh installed copy: no database cluster, no web build (initdb, migrations,
 *            demo seed and `vite build` all happen)
 *   stopped  PostgreSQL stopped, web build stale (removed): start the cluster and build again
 *   cold     PostgreSQL stopped, web already built ("cold-ish": services stopped)
 *   warm     PostgreSQL already running, web already built
 *
 *   node --import tsx ops/bench/start.bench.ts [--runs 3] [--keep]
 *
 * The copy lives in a temporary folder (sources copied, node_modules copied as installed),
 * so the shared working tree, its .local services and its dist/ are never touched. Each run
 * uses a spare PORT and a spare PGPORT, is stopped with SIGINT (as Ctrl-C would) and the
 * benchmark checks that PostgreSQL is stopped again when `npm start` started it.
 * Target: < 10 s. Writes nothing into the project unless --out is given.
 */
import { execFileSync, spawn } from 'node:child_process'
import fs from 'node:fs'
import os from 'node:os'
import path from 'node:path'
import { fileURLToPath } from 'node:url'
import { argValue, loadAverage, machineInfo, machineLine, percentile, reportResult } from './support'
import { freePort } from '../local/free-port'

const ROOT = fileURLToPath(new URL('../..', import.meta.url))
const runs = Number(argValue('--runs', '3'))
const keep = process.argv.includes('--keep')
const out = argValue('--out')
const TARGET_S = 10
const SKIP_TOP = new Set(['node_modules', '.local', 'dist', 'test-results', 'playwright-report', 'coverage', '.pgdata', '.git'])

type Scenario = 'first' | 'stopped' | 'cold' | 'warm'

/** An installed copy of the project: sources plus node_modules, without local state. */
function makeCopy(): { base: string; dir: string } {
  const base = fs.mkdtempSync(path.join(os.tmpdir(), 'qb-start-bench-'))
  fs.chmodSync(base, 0o755) // the postgres OS user must reach the data folder inside
  const dir = path.join(base, 'quietband')
  fs.cpSync(ROOT, dir, { recursive: true, verbatimSymlinks: true, filter: (src) => !SKIP_TOP.has(path.relative(ROOT, src).split(path.sep)[0]!) })
  execFileSync('cp', ['-a', path.join(ROOT, 'node_modules'), path.join(dir, 'node_modules')])
  return { base, dir }
}

interface Copy {
  dir: string
  pgPort: number
  env: NodeJS.ProcessEnv
}

function dbScript(c: Copy, cmd: 'start' | 'stop' | 'status'): boolean {
  try {
    execFileSync('bash', [path.join(c.dir, 'ops', 'db.sh'), cmd], { env: c.env, stdio: 'ignore' })
    return true
  } catch {
    return false
  }
}

interface RunResult {
  scenario: Scenario
  urlAnswersS: number
  readyLine: string
  pgStoppedAfter: boolean | null
}

async function waitForUrl(url: string, child: ReturnType<typeof spawn>, timeoutMs: number): Promise<number> {
  const t0 = performance.now()
  for (;;) {
    if (child.exitCode !== null) throw new Error(`npm start exited with ${child.exitCode} before answering`)
    try {
      const res = await fetch(url, { signal: AbortSignal.timeout(1000) })
      if (res.status === 200) return performance.now()
    } catch {
      // not listening yet
    }
    if (performance.now() - t0 > timeoutMs) throw new Error(`${url} did not answer within ${timeoutMs / 1000} s`)
    await new Promise((r) => setTimeout(r, 25))
  }
}

async function runOnce(c: Copy, scenario: Scenario): Promise<RunResult> {
  // prepare the situation
  if (scenario === 'first') {
    dbScript(c, 'stop')
    fs.rmSync(path.join(c.dir, '.local'), { recursive: true, force: true })
    fs.rmSync(path.join(c.dir, 'dist'), { recursive: true, force: true })
  } else if (scenario === 'stopped') {
    dbScript(c, 'stop')
    fs.rmSync(path.join(c.dir, 'dist'), { recursive: true, force: true })
  } else if (scenario === 'cold') {
    dbScript(c, 'stop')
  } else {
    if (!dbScript(c, 'start')) throw new Error('could not start PostgreSQL for the warm run')
  }
  const port = await freePort()
  const url = `http://127.0.0.1:${port}/`
  const t0 = performance.now()
  const child = spawn('npm', ['start'], { cwd: c.dir, env: { ...c.env, PORT: String(port) }, detached: true, stdio: ['ignore', 'pipe', 'pipe'] })
  let output = ''
  child.stdout!.on('data', (d: Buffer) => (output += d.toString()))
  child.stderr!.on('data', (d: Buffer) => (output += d.toString()))
  let measured: RunResult
  try {
    const t1 = await waitForUrl(url, child, 120_000)
    const health = await fetch(`${url}api/health`)
    if (health.status !== 200) throw new Error(`/api/health answered ${health.status}`)
    // give start.ts a moment to print its banner (it prints right after listening)
    for (let i = 0; i < 40 && !/ready in/.test(output); i++) await new Promise((r) => setTimeout(r, 25))
    const readyLine = /\(ready in [^)]*\)/.exec(output)?.[0] ?? '(no ready line)'
    measured = { scenario, urlAnswersS: (t1 - t0) / 1000, readyLine, pgStoppedAfter: null }
  } catch (e) {
    console.error(output)
    await stopProcessGroup(child.pid!)
    throw e
  }
  if (!(await stopProcessGroup(child.pid!))) {
    throw new Error(`npm start (process group ${child.pid}) did not stop within 30 s of SIGINT`)
  }
  return measured
}

/**
 * Ctrl-C: SIGINT to the process group this benchmark started (npm, its shell, node); npm
 * itself dies of the signal at once, so wait until the whole group has gone. True when it has.
 */
async function stopProcessGroup(pgid: number): Promise<boolean> {
  const groupAlive = () => {
    try {
      process.kill(-pgid, 0)
      return true
    } catch {
      return false
    }
  }
  if (groupAlive()) process.kill(-pgid, 'SIGINT')
  const t0 = Date.now()
  while (groupAlive() && Date.now() - t0 < 30_000) await new Promise((r) => setTimeout(r, 50))
  return !groupAlive()
}

async function main(): Promise<void> {
  const machine = machineInfo()
  console.log(`copying the project into a temporary folder…`)
  const { base, dir } = makeCopy()
  const pgPort = await freePort()
  const env: NodeJS.ProcessEnv = { ...process.env, PGPORT: String(pgPort), NO_UPDATE_NOTIFIER: '1', npm_config_update_notifier: 'false', npm_config_fund: 'false' }
  for (const k of ['DATABASE_URL', 'PGDATA_DIR', 'SMTP_URL', 'S3_ENDPOINT', 'S3_BUCKET', 'SESSION_SECRET', 'PUBLIC_URL', 'STATIC_DIR', 'PORT', 'DEV_MAILBOX_DIR']) delete env[k]
  const copy: Copy = { dir, pgPort, env }
  const results: RunResult[] = []
  try {
    for (const scenario of ['first', 'stopped', 'cold', 'warm'] as const) {
      for (let i = 0; i < runs; i++) {
        const r = await runOnce(copy, scenario)
        // npm start stops the cluster it started; in the warm runs the benchmark started it
        const running = dbScript(copy, 'status')
        r.pgStoppedAfter = !running
        if (scenario !== 'warm' && running) throw new Error(`PostgreSQL is still running after npm start stopped (${scenario} run)`)
        if (scenario === 'warm') dbScript(copy, 'stop')
        results.push(r)
        console.log(`${scenario.padEnd(8)} run ${i + 1}: URL answered after ${r.urlAnswersS.toFixed(2)} s ${r.readyLine}; PostgreSQL stopped afterwards: ${r.pgStoppedAfter ? 'yes' : 'no (left running, as it was running before)'} · load ${loadAverage()}`)
      }
    }
  } finally {
    dbScript(copy, 'stop')
    if (!keep) fs.rmSync(base, { recursive: true, force: true })
    else console.log(`kept ${dir}`)
  }
  machine.loadEnd = loadAverage()
  const describe: Record<Scenario, string> = {
    first: 'fresh installed copy: initdb, migrations, demo seed, vite build',
    stopped: 'PostgreSQL stopped, web build missing (vite build runs)',
    cold: 'PostgreSQL stopped, web already built',
    warm: 'PostgreSQL already running, web already built',
  }
  const rows = (['first', 'stopped', 'cold', 'warm'] as const).map((s) => {
    const t = results.filter((r) => r.scenario === s).map((r) => r.urlAnswersS)
    return `| ${s} | ${describe[s]} | ${t.map((v) => v.toFixed(2)).join(', ')} | ${percentile(t, 50).toFixed(2)} | ${Math.max(...t).toFixed(2)} | ${Math.max(...t) < TARGET_S ? 'yes' : '**no**'} |`
  })
  const md = [
    '# `npm start` until the URL answers',
    '',
    `- ${machineLine(machine)}`,
    `- An installed copy of the project in a temporary folder (sources and node_modules copied; no .local, no dist), PORT and PGPORT set to spare ports; time from spawning \`npm start\` until GET / answers 200 (polled every 25 ms), then SIGINT to its process group; ${runs} runs per situation`,
    `- After every run the benchmark checked that PostgreSQL was stopped again when \`npm start\` had started it (the warm runs start it beforehand and stop it afterwards)`,
    '',
    '| situation | what happens | runs (s) | median (s) | worst (s) | < 10 s |',
    '|---|---|---|---:|---:|:---:|',
    ...rows,
    '',
  ].join('\n')
  reportResult(md, out)
}

await main()
