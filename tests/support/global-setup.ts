/**
 * Starts a throwaway PostgreSQL cluster for the API and browser tests (its own folder and
 * port, deleted afterwards), migrates and seeds the demo once as the owner role, and always
 * stops it — also when setup itself fails (vitest does not call teardown then). Tests get the
 * application role's URL (`databaseUrl`) and the owner's (`migrationDatabaseUrl`).
 */
// the AWS SDK's notice that later releases will need Node 22 (known; see the stack notes), once per process
process.env.AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED ??= 'true'
import { execFileSync } from 'node:child_process'
import fs from 'node:fs'
import os from 'node:os'
import path from 'node:path'
import { fileURLToPath } from 'node:url'
import type { TestProject } from 'vitest/node'
import { createPool } from '../../server/db/client'
import { prepareDatabase } from '../../server/db/roles'
import { seedDemo } from '../../ops/seed-demo'
import { freePort } from '../../ops/local/free-port'
import { startS3Fake } from '../../ops/local/s3-fake'
import { createObjectStore } from '../../server/storage/object-store'

const dbScript = fileURLToPath(new URL('../../ops/db.sh', import.meta.url))

export default async function setup(project: TestProject) {
  if (process.env.TEST_DATABASE_URL) {
    // an existing database: TEST_MIGRATION_DATABASE_URL is its owner (default: the same URL)
    const ownerUrl = process.env.TEST_MIGRATION_DATABASE_URL ?? process.env.TEST_DATABASE_URL
    await prepareDatabase(ownerUrl)
    project.provide('databaseUrl', process.env.TEST_DATABASE_URL)
    project.provide('migrationDatabaseUrl', ownerUrl)
    return
  }
  const base = fs.mkdtempSync(path.join(os.tmpdir(), 'quietband-test-'))
  fs.chmodSync(base, 0o755)
  const env = { ...process.env, PGDATA_DIR: path.join(base, 'pgdata'), PGPORT: String(await freePort()), DB_NAME: 'quietband_test', PG_FAST_UNSAFE: '1' }
  // the S3 fake the demo's licence register is imported through, and the browser tests' app stores into
  const s3 = await startS3Fake({ directory: path.join(base, 's3'), bucket: 'quietband-test' })
  const teardown = async () => {
    try {
      await s3.close()
      execFileSync('bash', [dbScript, 'stop'], { env, stdio: 'ignore' })
    } finally {
      fs.rmSync(base, { recursive: true, force: true })
    }
  }
  try {
    const out = execFileSync('bash', [dbScript, 'start'], { env, encoding: 'utf8' })
    const databaseUrl = /^DATABASE_URL=(\S+)/m.exec(out)![1]!
    const migrationDatabaseUrl = /^MIGRATION_DATABASE_URL=(\S+)/m.exec(out)![1]!
    await prepareDatabase(migrationDatabaseUrl)
    const pool = createPool(migrationDatabaseUrl, 2)
    await seedDemo(pool, { objectStore: createObjectStore({ ...s3, region: 'us-east-1', forcePathStyle: true, maxUploadBytes: 50e6 }) })
    await pool.end()
    project.provide('s3', { endpoint: s3.endpoint, bucket: s3.bucket, accessKeyId: s3.accessKeyId, secretAccessKey: s3.secretAccessKey })
    project.provide('databaseUrl', databaseUrl)
    project.provide('migrationDatabaseUrl', migrationDatabaseUrl)
  } catch (e) {
    await teardown()
    throw e
  }
  return teardown
}

declare module 'vitest' {
  export interface ProvidedContext {
    /** The application role: what the app connects as. */
    databaseUrl: string
    /** The S3 fake of the run (absent with TEST_DATABASE_URL): the browser tests' app stores files there. */
    s3?: { endpoint: string; bucket: string; accessKeyId: string; secretAccessKey: string }
    /** The owner role: migrations, seeding, and tests that need the owner's powers. */
    migrationDatabaseUrl: string
  }
}
