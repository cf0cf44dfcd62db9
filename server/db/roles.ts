/**
 * The two database roles. The migration (owner) role runs the migrations, creates or migrates
 * the job queue's schema and grants the application group (`quietband_app`) what it needs
 * there; the application connects as a member of that group and cannot change the schema,
 * rewrite the timeline or delete queued mail (see drizzle/0004_app_role.sql).
 */
import pg from 'pg'
import PgBoss from 'pg-boss'
import { createDb, createPool, runMigrations } from './client'
import { seedBandLimits } from '../modules/band-limits/band-limits.seed'
import { log } from '../log/logger'

export const APP_GROUP_ROLE = 'quietband_app'
export const JOB_QUEUE_SCHEMA = 'pgboss'

// serializes the grants of processes starting together ("tuple concurrently updated")
const JOB_QUEUE_GRANT_LOCK_KEY = 5_172_032

/**
 * Brings the database up to date as its owner: migrations, then the job queue's own schema
 * (pg-boss creates or migrates it), then the application's rights on that schema, then the
 * reference data every installation starts with (the band-limit list, added where missing).
 */
export async function prepareDatabase(migrationUrl: string): Promise<void> {
  await runMigrations(migrationUrl)
  await prepareJobQueue(migrationUrl)
  await seedReferenceData(migrationUrl)
}

/** The band limits of the radio library that the list does not hold yet (none after the first start). */
export async function seedReferenceData(migrationUrl: string): Promise<void> {
  const pool = createPool(migrationUrl, 1)
  try {
    const added = await seedBandLimits(createDb(pool))
    if (added > 0) log().info(`band-limit list: ${added} entries added from the radio library`)
  } finally {
    await pool.end()
  }
}

export async function prepareJobQueue(migrationUrl: string): Promise<void> {
  const boss = new PgBoss({ connectionString: migrationUrl, schema: JOB_QUEUE_SCHEMA, max: 1, supervise: false, schedule: false, migrate: true })
  boss.on('error', (err) => log().error({ err }, 'job queue error while preparing the database'))
  await boss.start()
  await boss.stop({ graceful: false, wait: true, timeout: 2000 })
  const client = new pg.Client({ connectionString: migrationUrl })
  await client.connect()
  try {
    await client.query('BEGIN')
    await client.query('SELECT pg_advisory_xact_lock($1)', [JOB_QUEUE_GRANT_LOCK_KEY])
    await client.query('SELECT quietband_secure_job_queue()')
    await client.query('COMMIT')
  } catch (e) {
    await client.query('ROLLBACK').catch(() => {})
    throw e
  } finally {
    await client.end()
  }
}

/**
 * Whether the application's connection is protected: it neither owns the timeline nor is a
 * superuser. False when one URL serves both migrations and the app.
 */
export async function appRoleIsProtected(databaseUrl: string): Promise<boolean> {
  const client = new pg.Client({ connectionString: databaseUrl })
  await client.connect()
  try {
    const { rows } = await client.query<{ protected: boolean }>(
      `SELECT NOT r.rolsuper AND NOT pg_has_role(current_user, c.relowner, 'USAGE') AS protected
         FROM pg_roles r, pg_class c
        WHERE r.rolname = current_user AND c.oid = 'public.case_events'::regclass`,
    )
    return rows[0]?.protected ?? false
  } finally {
    await client.end()
  }
}
