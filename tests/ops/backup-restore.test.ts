/**
 * A backup taken from one cluster and evidence store restores into a fresh cluster and an
 * empty store with every case, every timeline event, the job queue and every object, byte for
 * byte; a non-empty target and a damaged backup are refused with a plain message.
 */
import { execFile } from 'node:child_process'
import crypto from 'node:crypto'
import fs from 'node:fs'
import path from 'node:path'
import { promisify } from 'node:util'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { GetObjectCommand, ListObjectsV2Command, PutObjectCommand } from '@aws-sdk/client-s3'
import pg from 'pg'
import { createPool } from '../../server/db/client'
import { prepareDatabase } from '../../server/db/roles'
import { createS3Client } from '../../server/storage/s3'
import { seedDemo } from '../../ops/seed-demo'
import { startS3Fake, type S3Fake } from '../../ops/local/s3-fake'
import { cleanEnv, reachableTempDir, ROOT, startCluster, type Cluster } from '../../ops/local/clusters'

const run = promisify(execFile)
process.env.AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED = 'true'

const OBJECTS: Record<string, Buffer> = {
  'cases/QB-1/spectrum capture.bin': crypto.randomBytes(300_000),
  'cases/QB-1/notes/site-photo.jpg': crypto.randomBytes(40_000),
  'cases/QB-2/measurements.csv': Buffer.from('freq_hz,level_dbm\n156800000,-61.5\n'),
  'empty-object': Buffer.alloc(0),
}

let source: Cluster
let target: Cluster
let sourceStore: S3Fake
let targetStore: S3Fake
let work: string
let backupDir: string

const s3Env = (s: S3Fake, bucket = s.bucket) => ({ S3_ENDPOINT: s.endpoint, S3_BUCKET: bucket, S3_ACCESS_KEY_ID: s.accessKeyId, S3_SECRET_ACCESS_KEY: s.secretAccessKey })
const client = (s: S3Fake) => createS3Client({ ...s, region: 'us-east-1', forcePathStyle: true })
const sha256 = (b: Buffer) => crypto.createHash('sha256').update(b).digest('hex')

/** Runs an ops script; resolves with its exit code and output, never throws on a non-zero exit. */
async function script(name: string, args: string[], env: Record<string, string>) {
  try {
    const r = await run(process.execPath, ['--import', 'tsx', `ops/${name}.ts`, ...args], { cwd: ROOT, env: cleanEnv(env) })
    return { code: 0, stdout: r.stdout, stderr: r.stderr }
  } catch (e) {
    const err = e as { code: number; stdout: string; stderr: string }
    return { code: err.code, stdout: err.stdout, stderr: err.stderr }
  }
}

async function objectsOf(s: S3Fake, bucket: string): Promise<Record<string, string>> {
  const c = client(s)
  const out: Record<string, string> = {}
  const page = await c.send(new ListObjectsV2Command({ Bucket: bucket }))
  for (const o of page.Contents ?? []) {
    const got = await c.send(new GetObjectCommand({ Bucket: bucket, Key: o.Key! }))
    out[o.Key!] = sha256(Buffer.from(await got.Body!.transformToByteArray()))
  }
  return out
}

async function rowsOf(url: string, sql: string) {
  const c = new pg.Client({ connectionString: url })
  await c.connect()
  try {
    return (await c.query(sql)).rows
  } finally {
    await c.end()
  }
}

beforeAll(async () => {
  work = reachableTempDir('qb-backup-test-')
  ;[source, target] = await Promise.all([startCluster('qb-backup-src-'), startCluster('qb-backup-dst-')])
  sourceStore = await startS3Fake({ directory: path.join(work, 's3-source'), bucket: 'evidence' })
  targetStore = await startS3Fake({ directory: path.join(work, 's3-target'), bucket: 'unrelated' })
  await prepareDatabase(source.ownerUrl)
  const pool = createPool(source.ownerUrl, 2)
  await seedDemo(pool)
  await pool.end()
  for (const [key, body] of Object.entries(OBJECTS)) await client(sourceStore).send(new PutObjectCommand({ Bucket: 'evidence', Key: key, Body: body, ContentLength: body.length }))
  const made = await script('backup', ['--to', path.join(work, 'backups')], { MIGRATION_DATABASE_URL: source.ownerUrl, ...s3Env(sourceStore) })
  expect(made.code, made.stderr).toBe(0)
  backupDir = /Backup written to (\S+)/.exec(made.stdout)![1]!
})

afterAll(async () => {
  await sourceStore?.close()
  await targetStore?.close()
  source?.remove()
  target?.remove()
  if (work) fs.rmSync(work, { recursive: true, force: true })
})

describe('a backup', () => {
  it('is one folder with a manifest naming every object by key, size and SHA-256', () => {
    const manifest = JSON.parse(fs.readFileSync(path.join(backupDir, 'manifest.json'), 'utf8'))
    expect(manifest.objects.map((o: { key: string }) => o.key).sort()).toEqual(Object.keys(OBJECTS).sort())
    for (const o of manifest.objects) {
      expect(o.sizeBytes).toBe(OBJECTS[o.key]!.length)
      expect(o.sha256).toBe(sha256(OBJECTS[o.key]!))
      expect(fs.existsSync(path.join(backupDir, 'objects', o.sha256))).toBe(true)
    }
    expect(manifest.database.rows.cases).toBeGreaterThan(0)
    expect(manifest.database.rows.caseEvents).toBeGreaterThan(manifest.database.rows.cases)
    expect(fs.existsSync(`${backupDir}.partial`)).toBe(false)
  })
})

describe('restoring it into a fresh cluster and an empty store', () => {
  beforeAll(async () => {
    const restored = await script('restore', [backupDir], { MIGRATION_DATABASE_URL: target.ownerUrl, ...s3Env(targetStore, 'evidence-restored') })
    expect(restored.code, restored.stderr).toBe(0)
  })

  it('brings back every case exactly as it was', async () => {
    const sql = `SELECT * FROM cases ORDER BY id`
    const before = await rowsOf(source.ownerUrl, sql)
    expect(before.length).toBeGreaterThan(0)
    expect(await rowsOf(target.ownerUrl, sql)).toEqual(before)
  })

  it('brings back every timeline event with its original time and author', async () => {
    const sql = `SELECT * FROM case_events ORDER BY id`
    const before = await rowsOf(source.ownerUrl, sql)
    expect(before.length).toBeGreaterThan(0)
    expect(await rowsOf(target.ownerUrl, sql)).toEqual(before)
  })

  it('brings back the users, the queued mail and the migration history', async () => {
    for (const sql of [`SELECT * FROM users ORDER BY id`, `SELECT id, name, state, data FROM pgboss.job ORDER BY id`, `SELECT hash, created_at FROM drizzle.__drizzle_migrations ORDER BY id`]) {
      const before = await rowsOf(source.ownerUrl, sql)
      expect(before.length, sql).toBeGreaterThan(0)
      expect(await rowsOf(target.ownerUrl, sql), sql).toEqual(before)
    }
  })

  it('brings back every object byte for byte', async () => {
    const want = Object.fromEntries(Object.entries(OBJECTS).map(([k, b]) => [k, sha256(b)]))
    expect(await objectsOf(targetStore, 'evidence-restored')).toEqual(want)
  })

  it('keeps the timeline protected from the application role of the new cluster', async () => {
    await expect(rowsOf(target.appUrl, `UPDATE case_events SET body = 'rewritten'`)).rejects.toThrow(/permission denied/)
    expect((await rowsOf(target.appUrl, `SELECT count(*)::int AS n FROM cases`))[0].n).toBeGreaterThan(0)
  })

  it('refuses to restore over a database that is no longer empty, in one line and without a stack trace', async () => {
    const again = await script('restore', [backupDir], { MIGRATION_DATABASE_URL: target.ownerUrl, ...s3Env(targetStore, 'evidence-restored') })
    expect(again.code).toBe(1)
    expect(again.stderr).toMatch(/is not empty .*Nothing was changed/)
    expect(again.stderr).not.toMatch(/\n\s+at /)
  })
})

describe('a damaged backup', () => {
  it('is refused before anything is changed', async () => {
    const copy = path.join(work, 'damaged')
    fs.cpSync(backupDir, copy, { recursive: true })
    const manifest = JSON.parse(fs.readFileSync(path.join(copy, 'manifest.json'), 'utf8'))
    const victim = path.join(copy, 'objects', manifest.objects.find((o: { sizeBytes: number }) => o.sizeBytes > 0).sha256)
    const bytes = fs.readFileSync(victim)
    bytes[0] = bytes[0]! ^ 0xff
    fs.writeFileSync(victim, bytes)
    const res = await script('restore', [copy, '--force'], { MIGRATION_DATABASE_URL: target.ownerUrl, ...s3Env(targetStore, 'evidence-restored') })
    expect(res.code).toBe(1)
    expect(res.stderr).toMatch(/The backup is damaged: the object .* does not match its SHA-256/)
    expect((await rowsOf(target.ownerUrl, `SELECT count(*)::int AS n FROM case_events`))[0].n).toBeGreaterThan(0)
  })
})
