import { fileURLToPath } from 'node:url'
import pg from 'pg'
import { drizzle, type NodePgDatabase } from 'drizzle-orm/node-postgres'
import { migrate } from 'drizzle-orm/node-postgres/migrator'
import * as schema from './schema'

export const migrationsFolder = fileURLToPath(new URL('../../drizzle', import.meta.url))

export function createPool(connectionString: string, max = 10): pg.Pool {
  return new pg.Pool({ connectionString, max })
}

export type Db = NodePgDatabase<typeof schema>

export function createDb(client: pg.Pool | pg.PoolClient): Db {
  return drizzle({ client, schema })
}

/**
 * Runs `work` in one transaction on one connection. The drizzle handle and the raw client
 * share that connection, so rows, timeline events and queued jobs commit together.
 */
export async function withTransaction<T>(pool: pg.Pool, work: (tx: { db: Db; client: pg.PoolClient }) => Promise<T>): Promise<T> {
  const client = await pool.connect()
  try {
    await client.query('BEGIN')
    const result = await work({ db: createDb(client), client })
    await client.query('COMMIT')
    return result
  } catch (e) {
    await client.query('ROLLBACK').catch(() => {})
    throw e
  } finally {
    client.release()
  }
}

// drizzle's migrator takes no lock: serialize concurrent starters (several app processes,
// parallel test files) with a session-level advisory lock held on the migrating connection.
const MIGRATION_LOCK_KEY = 5_172_031

export async function runMigrations(connectionString: string): Promise<void> {
  const client = new pg.Client({ connectionString })
  await client.connect()
  try {
    await client.query('SELECT pg_advisory_lock($1)', [MIGRATION_LOCK_KEY])
    await migrate(drizzle({ client }), { migrationsFolder })
  } finally {
    await client.query('SELECT pg_advisory_unlock($1)', [MIGRATION_LOCK_KEY]).catch(() => {})
    await client.end()
  }
}
