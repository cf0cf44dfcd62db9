/**
 * Backs up Quietband: the whole PostgreSQL database (application tables, the job queue and the
 * migration history) with pg_dump, and every object of the evidence bucket, into one folder:
 *
 *   <to>/quietband-<UTC time>/manifest.json   what is inside: row counts, each object's key,
 *                                             size and SHA-256, the dump's size and SHA-256
 *                             database.dump   pg_dump custom format (pg_restore reads it)
 *                             objects/<sha256> each object's bytes, named by their SHA-256
 *
 *   node --import tsx ops/backup.ts [--to <folder>]      (default: .local/backups)
 *
 * Reads MIGRATION_DATABASE_URL (else DATABASE_URL) and the S3_* settings from the environment
 * or .env. Consistency: the database is dumped first, from one snapshot; the bucket is copied
 * after, so every object the dumped rows refer to is in the backup (evidence objects are added,
 * never replaced or removed). The folder is written as `<name>.partial` and renamed when done,
 * so a folder without that suffix is always complete.
 */
import crypto from 'node:crypto'
import fs from 'node:fs'
import path from 'node:path'
import { pathToFileURL } from 'node:url'
import { pipeline } from 'node:stream/promises'
import type { Readable } from 'node:stream'
import { GetObjectCommand, ListObjectsV2Command, type S3Client } from '@aws-sdk/client-s3'
import pg from 'pg'
import {
  BACKUP_FORMAT,
  BACKUP_FORMAT_VERSION,
  DATABASE_FILE,
  libpqEnv,
  MANIFEST_FILE,
  OBJECTS_DIR,
  OpsError,
  ownerDatabaseUrl,
  parseArgs,
  pgTool,
  run,
  runMain,
  s3FromEnv,
  sha256File,
  type Manifest,
  type ManifestObject,
} from './backup-common'

export interface BackupOptions {
  databaseUrl: string
  s3: { client: S3Client; bucket: string }
  /** The folder that receives the backup's own folder. */
  toDir: string
  now?: Date
}

export async function backup(opts: BackupOptions): Promise<{ dir: string; manifest: Manifest }> {
  const stamp = (opts.now ?? new Date()).toISOString().replace(/[-:]/g, '').replace(/\.\d+Z$/, 'Z')
  const dir = path.resolve(opts.toDir, `quietband-${stamp}`)
  if (fs.existsSync(dir)) throw new OpsError(`${dir} already exists.`)
  const partial = `${dir}.partial`
  fs.rmSync(partial, { recursive: true, force: true })
  fs.mkdirSync(path.join(partial, OBJECTS_DIR), { recursive: true, mode: 0o700 })
  try {
    const database = await dumpDatabase(opts.databaseUrl, path.join(partial, DATABASE_FILE))
    const objects = await copyBucket(opts.s3.client, opts.s3.bucket, path.join(partial, OBJECTS_DIR))
    const manifest: Manifest = {
      format: BACKUP_FORMAT,
      formatVersion: BACKUP_FORMAT_VERSION,
      createdAt: (opts.now ?? new Date()).toISOString(),
      database,
      bucket: { name: opts.s3.bucket, objectCount: objects.length, totalBytes: objects.reduce((s, o) => s + o.sizeBytes, 0) },
      objects,
    }
    fs.writeFileSync(path.join(partial, MANIFEST_FILE), JSON.stringify(manifest, null, 2) + '\n')
    fs.renameSync(partial, dir)
    return { dir, manifest }
  } catch (e) {
    fs.rmSync(partial, { recursive: true, force: true })
    throw e
  }
}

/** pg_dump of the whole database from one exported snapshot, with row counts from the same snapshot. */
async function dumpDatabase(databaseUrl: string, file: string): Promise<Manifest['database']> {
  const client = new pg.Client({ connectionString: databaseUrl })
  await client.connect().catch((e: Error) => {
    throw new OpsError(`Cannot connect to the database: ${e.message}`)
  })
  try {
    await client.query('BEGIN ISOLATION LEVEL REPEATABLE READ READ ONLY')
    const { rows } = await client.query(`SELECT pg_export_snapshot() AS snapshot, current_setting('server_version') AS version`)
    const count = async (table: string) =>
      (await client.query(`SELECT CASE WHEN to_regclass($1) IS NULL THEN 0 ELSE 1 END AS present`, [table])).rows[0].present
        ? Number((await client.query(`SELECT count(*) AS n FROM ${table}`)).rows[0].n)
        : 0
    const counted = { cases: await count('public.cases'), caseEvents: await count('public.case_events'), jobs: await count('pgboss.job'), migrations: await count('drizzle.__drizzle_migrations') }
    await run(pgTool('pg_dump'), ['--format=custom', `--snapshot=${rows[0].snapshot}`, '--no-password', `--file=${file}`], libpqEnv(databaseUrl))
    await client.query('COMMIT')
    const { sha256, sizeBytes } = await sha256File(file)
    return { file: DATABASE_FILE, sizeBytes, sha256, serverVersion: rows[0].version, rows: counted }
  } finally {
    await client.end().catch(() => {})
  }
}

/** Copies every object of the bucket into `dir`, each file named by its SHA-256. */
async function copyBucket(client: S3Client, bucket: string, dir: string): Promise<ManifestObject[]> {
  const objects: ManifestObject[] = []
  let token: string | undefined
  do {
    const page = await client.send(new ListObjectsV2Command({ Bucket: bucket, ContinuationToken: token })).catch((e: Error) => {
      throw new OpsError(`Cannot list the bucket ${bucket}: ${e.message}`)
    })
    for (const item of page.Contents ?? []) {
      const key = item.Key!
      const got = await client.send(new GetObjectCommand({ Bucket: bucket, Key: key }))
      const tmp = path.join(dir, `.incoming-${crypto.randomUUID()}`)
      const hash = crypto.createHash('sha256')
      let sizeBytes = 0
      const body = got.Body as Readable
      body.on('data', (c: Buffer) => {
        hash.update(c)
        sizeBytes += c.length
      })
      await pipeline(body, fs.createWriteStream(tmp))
      const sha256 = hash.digest('hex')
      const target = path.join(dir, sha256)
      if (fs.existsSync(target)) fs.rmSync(tmp)
      else fs.renameSync(tmp, target)
      objects.push({ key, sizeBytes, sha256, ...(got.ContentType ? { contentType: got.ContentType } : {}) })
    }
    token = page.IsTruncated ? page.NextContinuationToken : undefined
  } while (token)
  return objects
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  runMain(async () => {
    const { loadDotEnv, LOCAL_DIR } = await import('./local/services')
    loadDotEnv()
    process.env.AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED ??= 'true'
    const args = parseArgs(process.argv.slice(2), [], ['--to'])
    const toDir = args.options.get('--to') ?? path.join(LOCAL_DIR, 'backups')
    fs.mkdirSync(toDir, { recursive: true })
    const { dir, manifest } = await backup({ databaseUrl: ownerDatabaseUrl(process.env), s3: s3FromEnv(process.env), toDir })
    const r = manifest.database.rows
    console.log(`Backup written to ${dir}
  database: ${r.cases} cases, ${r.caseEvents} timeline events, ${r.jobs} queued or recent jobs, ${r.migrations} migrations (${manifest.database.sizeBytes} bytes)
  bucket ${manifest.bucket.name}: ${manifest.bucket.objectCount} objects, ${manifest.bucket.totalBytes} bytes`)
  })
}
