/**
 * The project-local PostgreSQL (ops/db.sh) starts in the two ordinary places where it used to
 * stop: a port already taken by another program, and a clone in a private folder that the
 * `postgres` OS user cannot enter. Each case uses clusters and folders of its own and removes
 * them; the developer's cluster under .local/ is never touched.
 */
import { execFile, execFileSync } from 'node:child_process'
import fs from 'node:fs'
import net from 'node:net'
import os from 'node:os'
import path from 'node:path'
import { promisify } from 'node:util'
import { afterEach, describe, expect, it } from 'vitest'
import pg from 'pg'
import { freePort } from '../../ops/local/free-port'
import { cleanEnv, DB_SCRIPT, reachableTempDir } from '../../ops/local/clusters'

const run = promisify(execFile)
const cleanups: Array<() => void | Promise<void>> = []
afterEach(async () => {
  for (const c of cleanups.splice(0).reverse()) await c()
})

async function dbSh(script: string, cmd: string, env: NodeJS.ProcessEnv) {
  try {
    const r = await run('bash', [script, cmd], { env })
    return { code: 0, stdout: r.stdout, stderr: r.stderr }
  } catch (e) {
    const err = e as { code: number; stdout: string; stderr: string }
    return { code: err.code, stdout: err.stdout, stderr: err.stderr }
  }
}

/** Holds a TCP port on 127.0.0.1 like another program would. */
async function occupy(port: number): Promise<net.Server> {
  const s = net.createServer((sock) => sock.destroy())
  await new Promise<void>((resolve, reject) => {
    s.once('error', reject)
    s.listen(port, '127.0.0.1', () => resolve())
  })
  cleanups.push(() => new Promise<void>((r) => s.close(() => r())))
  return s
}

async function canConnect(url: string): Promise<boolean> {
  const c = new pg.Client({ connectionString: url })
  await c.connect()
  const { rows } = await c.query('SELECT 1 AS one')
  await c.end()
  return rows[0].one === 1
}

function throwaway(prefix: string, extra: Record<string, string> = {}) {
  const base = reachableTempDir(prefix)
  const env = cleanEnv({ PGDATA_DIR: path.join(base, 'pgdata'), PG_FAST_UNSAFE: '1', ...extra })
  cleanups.push(() => {
    try {
      execFileSync('bash', [DB_SCRIPT, 'stop'], { env, stdio: 'ignore' })
    } finally {
      fs.rmSync(base, { recursive: true, force: true })
    }
  })
  return env
}

describe('when the port is taken by another program', () => {
  it('says so in one line, without a stack trace, when the port was asked for', async () => {
    const port = await freePort()
    await occupy(port)
    const res = await dbSh(DB_SCRIPT, 'start', throwaway('qb-port-given-', { PGPORT: String(port) }))
    expect(res.code).toBe(1)
    const lines = res.stderr.trim().split('\n')
    expect(lines).toHaveLength(1)
    expect(lines[0]).toMatch(/^Port \d+ on 127\.0\.0\.1 is taken by another program.*PGPORT=/)
    expect(lines[0]).toContain(`Port ${port} `)
    expect(res.stderr).not.toMatch(/pg_ctl: could not start server/)
  })

  it('moves the project cluster to a free port, says which, and keeps it', async () => {
    const first = await freePort()
    const env = throwaway('qb-port-moved-', { PGPORT: String(first) })
    expect((await dbSh(DB_SCRIPT, 'start', env)).code).toBe(0)
    expect((await dbSh(DB_SCRIPT, 'stop', env)).code).toBe(0)
    await occupy(first)
    delete env.PGPORT // from now on the port is the cluster's own choice
    const moved = await dbSh(DB_SCRIPT, 'start', env)
    expect(moved.code, moved.stderr).toBe(0)
    const newPort = Number(new URL(/^DATABASE_URL=(\S+)/m.exec(moved.stdout)![1]!).port)
    expect(newPort).not.toBe(first)
    expect(moved.stderr).toContain(`Port ${first} on 127.0.0.1 is taken by another program, so the project's PostgreSQL now uses port ${newPort}`)
    expect(await canConnect(/^MIGRATION_DATABASE_URL=(\S+)/m.exec(moved.stdout)![1]!)).toBe(true)
    expect((await dbSh(DB_SCRIPT, 'url', env)).stdout).toContain(`:${newPort}/`)
    expect((await dbSh(DB_SCRIPT, 'stop', env)).code).toBe(0)
    const again = await dbSh(DB_SCRIPT, 'start', env)
    expect(again.stdout).toContain(`:${newPort}/`)
    expect(again.stderr).not.toContain('is taken')
  })
})

describe.skipIf(process.getuid?.() !== 0)('a clone in a private folder, started as root', () => {
  it('keeps the data folder where the postgres user can reach it, says where, and remembers it', async () => {
    const privateDir = fs.mkdtempSync(path.join(os.tmpdir(), 'qb-private-')) // 0700, like mktemp -d
    const project = path.join(privateDir, 'quietband')
    fs.mkdirSync(path.join(project, 'ops'), { recursive: true })
    fs.copyFileSync(DB_SCRIPT, path.join(project, 'ops', 'db.sh'))
    const script = path.join(project, 'ops', 'db.sh')
    const env = cleanEnv({ PGPORT: String(await freePort()), PG_FAST_UNSAFE: '1' })
    cleanups.push(() => {
      const location = path.join(project, '.local', 'pgdata-location')
      const dataDir = fs.existsSync(location) ? fs.readFileSync(location, 'utf8').trim() : undefined
      try {
        execFileSync('bash', [script, 'stop'], { env, stdio: 'ignore' })
      } finally {
        if (dataDir?.startsWith('/var/lib/quietband/')) {
          fs.rmSync(path.dirname(dataDir), { recursive: true, force: true })
          // the shared parent goes too when nothing else is in it
          if (fs.readdirSync('/var/lib/quietband').length === 0) fs.rmdirSync('/var/lib/quietband')
        }
        fs.rmSync(privateDir, { recursive: true, force: true })
      }
    })
    expect(fs.statSync(privateDir).mode & 0o777).toBe(0o700)

    const res = await dbSh(script, 'start', env)
    expect(res.code, res.stderr).toBe(0)
    const dataDir = fs.readFileSync(path.join(project, '.local', 'pgdata-location'), 'utf8').trim()
    expect(dataDir).toMatch(/^\/var\/lib\/quietband\/quietband-[0-9a-f]{10}\/pgdata$/)
    expect(res.stderr).toContain(`data folder is ${dataDir}`)
    expect(fs.existsSync(path.join(dataDir, 'PG_VERSION'))).toBe(true)
    expect(await canConnect(/^DATABASE_URL=(\S+)/m.exec(res.stdout)![1]!)).toBe(true)
    expect((await dbSh(script, 'where', env)).stdout).toContain(`PGDATA_DIR=${dataDir}`)
    expect((await dbSh(script, 'status', env)).code).toBe(0)
  })
})
