/**
 * Restores a backup made by ops/backup.ts into an empty database and an empty bucket:
 *
 *   node --import tsx ops/restore.ts <backup folder> [--force]
 *
 * Reads MIGRATION_DATABASE_URL (else DATABASE_URL; the role that will own the restored objects,
 * named as in the backed-up database) and the S3_* settings from the environment or .env.
 * Before changing anything it checks every file against the manifest's SHA-256 and refuses a
 * target database that already has tables or a bucket that already has objects; --force
 * replaces the database's contents and writes over objects with the same keys. The database is
 * restored in one transaction (all or nothing); afterwards the row counts and every object are
 * checked against the manifest.
 */
import fs from 'node:fs'
import path from 'node:path'
import { pathToFileURL } from 'node:url'
import { CreateBucketCommand, HeadBucketCommand, HeadObjectCommand, ListObjectsV2Command, PutObjectCommand, type S3Client } from '@aws-sdk/client-s3'
import pg from 'pg'
import { APP_GROUP_ROLE } from '../server/db/roles'
import {
  BACKUP_FORMAT,
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
} from './backup-common'

export interface RestoreOptions {
  fromDir: string
  databaseUrl: string
  s3: { client: S3Client; bucket: string }
  force?: boolean
}

export async function restore(opts: RestoreOptions): Promise<Manifest> {
  const manifest = await readVerifiedBackup(opts.fromDir)
  const db = new pg.Client({ connectionString: opts.databaseUrl })
  await db.connect().catch((e: Error) => {
    throw new OpsError(`Cannot connect to the target database: ${e.message}`)
  })
  try {
    await checkDatabaseTarget(db, opts.force ?? false)
    await checkBucketTarget(opts.s3.client, opts.s3.bucket, opts.force ?? false)
    if (opts.force) await emptyDatabase(db)
    const env = libpqEnv(opts.databaseUrl)
    await run(pgTool('pg_restore'), ['--no-owner', '--exit-on-error', '--single-transaction', '--no-password', `--dbname=${env.PGDATABASE}`, path.join(opts.fromDir, DATABASE_FILE)], env)
    for (const o of manifest.objects) {
      const file = path.join(opts.fromDir, OBJECTS_DIR, o.sha256)
      await opts.s3.client.send(
        new PutObjectCommand({ Bucket: opts.s3.bucket, Key: o.key, Body: fs.createReadStream(file), ContentLength: o.sizeBytes, ...(o.contentType ? { ContentType: o.contentType } : {}) }),
      )
    }
    await checkRestored(db, opts.s3.client, opts.s3.bucket, manifest)
    return manifest
  } finally {
    await db.end().catch(() => {})
  }
}

/** Reads the manifest and checks the dump and every object file against it. */
export async function readVerifiedBackup(dir: string): Promise<Manifest> {
  const manifestFile = path.join(dir, MANIFEST_FILE)
  if (!fs.existsSync(manifestFile)) throw new OpsError(`${dir} is not a Quietband backup: it has no ${MANIFEST_FILE}.`)
  const manifest = JSON.parse(fs.readFileSync(manifestFile, 'utf8')) as Manifest
  if (manifest.format !== BACKUP_FORMAT) throw new OpsError(`${manifestFile} is not a Quietband backup manifest.`)
  const check = async (file: string, want: { sha256: string; sizeBytes: number }, what: string) => {
    if (!fs.existsSync(file)) throw new OpsError(`The backup is incomplete: ${what} is missing (${file}).`)
    const got = await sha256File(file)
    if (got.sha256 !== want.sha256 || got.sizeBytes !== want.sizeBytes) throw new OpsError(`The backup is damaged: ${what} does not match its SHA-256 in the manifest. Nothing was restored.`)
  }
  await check(path.join(dir, DATABASE_FILE), manifest.database, 'the database dump')
  for (const o of manifest.objects) await check(path.join(dir, OBJECTS_DIR, o.sha256), o, `the object ${o.key}`)
  return manifest
}

async function checkDatabaseTarget(db: pg.Client, force: boolean): Promise<void> {
  const { rows } = await db.query(
    `SELECT current_database() AS name, count(c.oid)::int AS tables,
            EXISTS (SELECT FROM pg_roles WHERE rolname = $1) AS group_exists
       FROM pg_namespace n LEFT JOIN pg_class c ON c.relnamespace = n.oid AND c.relkind IN ('r', 'p')
      WHERE n.nspname IN ('public', 'pgboss', 'drizzle')`,
    [APP_GROUP_ROLE],
  )
  const { name, tables, group_exists } = rows[0]
  if (!group_exists) {
    throw new OpsError(`The role ${APP_GROUP_ROLE} does not exist in the target cluster. Create it first (CREATE ROLE ${APP_GROUP_ROLE} NOLOGIN; ops/db.sh start does it for a local cluster).`)
  }
  if (tables > 0 && !force) {
    throw new OpsError(`The database ${name} is not empty (${tables} tables). Restore into an empty database, or add --force to replace its contents. Nothing was changed.`)
  }
}

async function checkBucketTarget(client: S3Client, bucket: string, force: boolean): Promise<void> {
  try {
    await client.send(new HeadBucketCommand({ Bucket: bucket }))
  } catch (e) {
    if ((e as { $metadata?: { httpStatusCode?: number } }).$metadata?.httpStatusCode !== 404) throw new OpsError(`Cannot reach the bucket ${bucket}: ${(e as Error).message}`)
    await client.send(new CreateBucketCommand({ Bucket: bucket }))
    return
  }
  const page = await client.send(new ListObjectsV2Command({ Bucket: bucket, MaxKeys: 1 }))
  if ((page.KeyCount ?? page.Contents?.length ?? 0) > 0 && !force) {
    throw new OpsError(`The bucket ${bucket} is not empty. Restore into an empty bucket, or add --force to write over objects with the same keys. Nothing was changed.`)
  }
}

async function emptyDatabase(db: pg.Client): Promise<void> {
  await db.query('BEGIN')
  await db.query('DROP SCHEMA IF EXISTS pgboss CASCADE')
  await db.query('DROP SCHEMA IF EXISTS drizzle CASCADE')
  await db.query('DROP SCHEMA IF EXISTS public CASCADE')
  await db.query('CREATE SCHEMA public')
  await db.query('COMMIT')
}

async function checkRestored(db: pg.Client, client: S3Client, bucket: string, manifest: Manifest): Promise<void> {
  const count = async (table: string) => Number((await db.query(`SELECT count(*) AS n FROM ${table}`)).rows[0].n)
  const want = manifest.database.rows
  const got = { cases: await count('public.cases'), caseEvents: await count('public.case_events'), jobs: await count('pgboss.job'), migrations: await count('drizzle.__drizzle_migrations') }
  for (const k of Object.keys(want) as (keyof typeof want)[]) {
    if (got[k] !== want[k]) throw new OpsError(`Restored database differs from the backup: ${k} ${got[k]} instead of ${want[k]}.`)
  }
  for (const o of manifest.objects) {
    const head = await client.send(new HeadObjectCommand({ Bucket: bucket, Key: o.key }))
    if (head.ContentLength !== o.sizeBytes) throw new OpsError(`Restored object ${o.key} has ${head.ContentLength} bytes instead of ${o.sizeBytes}.`)
  }
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  runMain(async () => {
    const { loadDotEnv } = await import('./local/services')
    loadDotEnv()
    process.env.AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED ??= 'true'
    const args = parseArgs(process.argv.slice(2), ['--force'], [])
    if (args.rest.length !== 1) throw new OpsError('Usage: node --import tsx ops/restore.ts <backup folder> [--force]')
    const fromDir = path.resolve(args.rest[0]!)
    const manifest = await restore({ fromDir, databaseUrl: ownerDatabaseUrl(process.env), s3: s3FromEnv(process.env), force: args.flags.has('--force') })
    const r = manifest.database.rows
    console.log(`Restored ${fromDir} (made ${manifest.createdAt})
  database: ${r.cases} cases, ${r.caseEvents} timeline events, ${r.jobs} jobs, ${r.migrations} migrations — counts checked
  bucket: ${manifest.objects.length} objects, sizes checked
Start the app as usual; it applies any newer migrations and the job queue's grants.`)
  })
}
