/** Throwaway PostgreSQL clusters of a test file's own (ops/db.sh with its own folder and port). */
import { execFileSync } from 'node:child_process'
import fs from 'node:fs'
import os from 'node:os'
import path from 'node:path'
import { fileURLToPath } from 'node:url'
import { freePort } from './free-port'

export const ROOT = fileURLToPath(new URL('../..', import.meta.url))
export const DB_SCRIPT = path.join(ROOT, 'ops', 'db.sh')

/** The environment without any database or store settings of the developer's. */
export function cleanEnv(extra: Record<string, string> = {}): NodeJS.ProcessEnv {
  const env = { ...process.env }
  for (const k of Object.keys(env)) if (/^(PG|DB_|DATABASE_URL|MIGRATION_DATABASE_URL|S3_|TEST_DATABASE_URL)/.test(k)) delete env[k]
  return { ...env, ...extra }
}

/** A folder under the system's temporary folder that the postgres OS user can enter. */
export function reachableTempDir(prefix: string): string {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), prefix))
  fs.chmodSync(dir, 0o755)
  return dir
}

export interface Cluster {
  appUrl: string
  ownerUrl: string
  env: NodeJS.ProcessEnv
  /** Stops the cluster and removes its folder. */
  remove(): void
}

export async function startCluster(prefix: string): Promise<Cluster> {
  const base = reachableTempDir(prefix)
  const env = cleanEnv({ PGDATA_DIR: path.join(base, 'pgdata'), PGPORT: String(await freePort()), PG_FAST_UNSAFE: '1' })
  const remove = () => {
    try {
      execFileSync('bash', [DB_SCRIPT, 'stop'], { env, stdio: 'ignore' })
    } finally {
      fs.rmSync(base, { recursive: true, force: true })
    }
  }
  try {
    const out = execFileSync('bash', [DB_SCRIPT, 'start'], { env, encoding: 'utf8' })
    return { appUrl: /^DATABASE_URL=(\S+)/m.exec(out)![1]!, ownerUrl: /^MIGRATION_DATABASE_URL=(\S+)/m.exec(out)![1]!, env, remove }
  } catch (e) {
    remove()
    throw e
  }
}
