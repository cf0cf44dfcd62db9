import { fileURLToPath } from 'node:url'
import pg from 'pg'
import { drizzle, type NodePgDatabase } from 'drizzle-orm/node-postgres'
import { migrate } from 'drizzle-orm/node-postgres/migrator'
import * as schema from './schema'
import { log } from '../log/logger'

export const migrationsFolder = fileURLToPath(new URL('../../drizzle', import.meta.url))

/** How long a query waits for a connection before the database counts as unavailable. */
export const CONNECTION_TIMEOUT_MS = 5_000

/**
 * The application's connection pool. PostgreSQL may end idle connections at any time
 * (restart, failover, an administrator's pg_terminate_backend); the pool then emits 'error',
 * which would end the process without a listener. The pool has already dropped that
 * connection and opens a new one for the next query, so logging it is enough.
 */
export function createPool(connectionString: string, max = 10): pg.Pool {
  const pool = new pg.Pool({ connectionString, max, connectionTimeoutMillis: CONNECTION_TIMEOUT_MS })
  pool.on('error', (err) => log().warn(`database connection lost: ${describeDbError(err)}`))
  return pool
}

// Node's socket errors, and PostgreSQL's: 57P01 admin_shutdown, 57P02 crash_shutdown,
// 57P03 cannot_connect_now, 53300 too_many_connections; class 08 is connection_exception.
const UNAVAILABLE_CODES = new Set(['ECONNREFUSED', 'ECONNRESET', 'ETIMEDOUT', 'EPIPE', 'EHOSTUNREACH', 'ENETUNREACH', 'EAI_AGAIN', '57P01', '57P02', '57P03', '53300'])
// node-postgres and its pool say these in words only
const UNAVAILABLE_MESSAGES = [/^Connection terminated/, /timeout exceeded when trying to connect/, /is not queryable/, /^Query read timeout/]

/**
 * Whether an error means the database cannot be reached right now (rather than a bad query).
 * Follows `cause` (drizzle wraps driver errors) and AggregateError's `errors` (a refused
 * connection to each address of a host).
 */
export function isDatabaseUnavailable(err: unknown, depth = 0): boolean {
  if (!err || typeof err !== 'object' || depth > 5) return false
  const e = err as { code?: unknown; message?: unknown; cause?: unknown; errors?: unknown }
  if (typeof e.code === 'string' && (UNAVAILABLE_CODES.has(e.code) || /^08[0-9A-Z]{3}$/.test(e.code))) return true
  if (typeof e.message === 'string' && UNAVAILABLE_MESSAGES.some((m) => m.test(e.message as string))) return true
  if (Array.isArray(e.errors) && e.errors.some((x) => isDatabaseUnavailable(x, depth + 1))) return true
  return isDatabaseUnavailable(e.cause, depth + 1)
}

/** Whether an error is PostgreSQL's unique violation (23505) of the named constraint, through drizzle's wrapping. */
export function isUniqueViolation(e: unknown, constraint: string): boolean {
  const err = (e as { cause?: unknown })?.cause ?? e
  return typeof err === 'object' && err !== null && (err as { code?: string }).code === '23505' && (err as { constraint?: string }).constraint === constraint
}

/** One cheap round trip, given up after `timeoutMs` (the health check). */
export async function pingDatabase(pool: pg.Pool, timeoutMs = 2000): Promise<void> {
  // node-postgres honours query_timeout per query; its types list it for clients only
  const ping = { text: 'SELECT 1', query_timeout: timeoutMs } as pg.QueryConfig
  await pool.query(ping)
}

function describeDbError(err: unknown): string {
  const e = err as { code?: string; message?: string }
  return [e?.code, e?.message].filter(Boolean).join(' ') || String(err)
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
  // a checked-out connection has no pool listener: if PostgreSQL ends it between two queries,
  // its 'error' would end the process. The next query fails instead, and the pool drops it.
  let lost: Error | undefined
  const onLost = (err: Error) => {
    lost = err
  }
  client.on('error', onLost)
  try {
    await client.query('BEGIN')
    const result = await work({ db: createDb(client), client })
    await client.query('COMMIT')
    return result
  } catch (e) {
    await client.query('ROLLBACK').catch(() => {})
    throw e
  } finally {
    client.removeListener('error', onLost)
    client.release(lost)
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
