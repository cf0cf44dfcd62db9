/**
 * What ops/backup.ts and ops/restore.ts share: the backup folder's manifest, the settings
 * they read from the environment, the PostgreSQL client tools and plain errors.
 */
import { spawn } from 'node:child_process'
import crypto from 'node:crypto'
import fs from 'node:fs'
import { createS3Client } from '../server/storage/s3'

export const MANIFEST_FILE = 'manifest.json'
export const DATABASE_FILE = 'database.dump'
export const OBJECTS_DIR = 'objects'
export const BACKUP_FORMAT = 'quietband-backup'
export const BACKUP_FORMAT_VERSION = 1

export interface ManifestObject {
  key: string
  sizeBytes: number
  sha256: string
  contentType?: string
}

export interface Manifest {
  format: typeof BACKUP_FORMAT
  formatVersion: number
  createdAt: string
  database: {
    file: string
    sizeBytes: number
    sha256: string
    serverVersion: string
    /** Row counts read in the same snapshot that pg_dump saved. */
    rows: { cases: number; caseEvents: number; jobs: number; migrations: number }
  }
  bucket: { name: string; objectCount: number; totalBytes: number }
  objects: ManifestObject[]
}

/** An expected failure (bad arguments, a non-empty target, a damaged backup): message only. */
export class OpsError extends Error {}

/** The owner's database URL: backups and restores read and write every schema. */
export function ownerDatabaseUrl(env: NodeJS.ProcessEnv): string {
  const url = env.MIGRATION_DATABASE_URL ?? env.DATABASE_URL
  if (!url) throw new OpsError('Set MIGRATION_DATABASE_URL (the database owner) or DATABASE_URL.')
  return url
}

export function s3FromEnv(env: NodeJS.ProcessEnv) {
  const missing = ['S3_BUCKET', 'S3_ACCESS_KEY_ID', 'S3_SECRET_ACCESS_KEY'].filter((k) => !env[k])
  if (missing.length) throw new OpsError(`Set ${missing.join(', ')} (the evidence store; see .env.example).`)
  const settings = {
    endpoint: env.S3_ENDPOINT,
    region: env.S3_REGION ?? 'us-east-1',
    bucket: env.S3_BUCKET!,
    accessKeyId: env.S3_ACCESS_KEY_ID!,
    secretAccessKey: env.S3_SECRET_ACCESS_KEY!,
    forcePathStyle: (env.S3_FORCE_PATH_STYLE ?? 'true') === 'true',
  }
  return { client: createS3Client(settings), bucket: settings.bucket }
}

/** libpq settings for a URL, so the password travels in the environment, not on a command line. */
export function libpqEnv(databaseUrl: string): NodeJS.ProcessEnv {
  const u = new URL(databaseUrl)
  return {
    ...process.env,
    PGHOST: decodeURIComponent(u.hostname),
    PGPORT: u.port || '5432',
    PGUSER: decodeURIComponent(u.username),
    PGPASSWORD: decodeURIComponent(u.password),
    PGDATABASE: decodeURIComponent(u.pathname.replace(/^\//, '')),
    ...(u.searchParams.get('sslmode') ? { PGSSLMODE: u.searchParams.get('sslmode')! } : {}),
  }
}

/** The PostgreSQL client tool `name`, from PG_BIN, Debian's PostgreSQL 15 folder, or PATH. */
export function pgTool(name: 'pg_dump' | 'pg_restore'): string {
  for (const dir of [process.env.PG_BIN, '/usr/lib/postgresql/15/bin']) {
    if (dir && fs.existsSync(`${dir}/${name}`)) return `${dir}/${name}`
  }
  return name
}

/** Runs a tool; resolves when it exits 0, else fails with the end of what it wrote on stderr. */
export function run(cmd: string, args: string[], env: NodeJS.ProcessEnv): Promise<void> {
  return new Promise((resolve, reject) => {
    const child = spawn(cmd, args, { env, stdio: ['ignore', 'inherit', 'pipe'] })
    let stderr = ''
    child.stderr.on('data', (d: Buffer) => (stderr += d.toString()))
    child.once('error', (e) => reject(new OpsError(`${cmd} could not run: ${e.message} (install the PostgreSQL 15 client tools or set PG_BIN).`)))
    child.once('exit', (code) => (code === 0 ? resolve() : reject(new OpsError(`${cmd} failed (exit ${code}):\n${stderr.trim().split('\n').slice(-8).join('\n')}`))))
  })
}

export async function sha256File(file: string): Promise<{ sha256: string; sizeBytes: number }> {
  const hash = crypto.createHash('sha256')
  let sizeBytes = 0
  for await (const chunk of fs.createReadStream(file)) {
    hash.update(chunk as Buffer)
    sizeBytes += (chunk as Buffer).length
  }
  return { sha256: hash.digest('hex'), sizeBytes }
}

/** Parses `--name value` and `--flag` arguments. */
export function parseArgs(argv: string[], flags: string[], options: string[]): { flags: Set<string>; options: Map<string, string>; rest: string[] } {
  const out = { flags: new Set<string>(), options: new Map<string, string>(), rest: [] as string[] }
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i]!
    if (flags.includes(a)) out.flags.add(a)
    else if (options.includes(a)) {
      const v = argv[++i]
      if (v === undefined) throw new OpsError(`${a} needs a value.`)
      out.options.set(a, v)
    } else if (a.startsWith('--')) throw new OpsError(`Unknown option ${a}.`)
    else out.rest.push(a)
  }
  return out
}

/** Runs a command-line main: expected failures print their message only, exit code 1. */
export function runMain(main: () => Promise<void>): void {
  main().then(
    () => process.exit(0),
    (e: unknown) => {
      if (e instanceof OpsError) console.error(e.message)
      else console.error(e)
      process.exit(1)
    },
  )
}
