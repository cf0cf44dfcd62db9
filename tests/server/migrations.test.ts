import pg from 'pg'
import { describe, expect, inject, it } from 'vitest'
import { runMigrations } from '../../server/db/client'

describe('migrations', () => {
  it('serialize concurrent starters on a fresh database (advisory lock) and are idempotent', async () => {
    const url = inject('migrationDatabaseUrl')
    const admin = new pg.Client({ connectionString: url })
    await admin.connect()
    const name = `migrate_race_${process.pid}`
    await admin.query(`DROP DATABASE IF EXISTS ${name}`)
    await admin.query(`CREATE DATABASE ${name}`)
    const raceUrl = url.replace(/\/[^/]+$/, `/${name}`)
    try {
      await Promise.all([1, 2, 3, 4].map(() => runMigrations(raceUrl)))
      await runMigrations(raceUrl)
      const c = new pg.Client({ connectionString: raceUrl })
      await c.connect()
      const applied = await c.query('SELECT count(*)::int AS n FROM drizzle.__drizzle_migrations')
      const files = (await import('../../drizzle/meta/_journal.json')).default.entries.length
      const tables = await c.query(`SELECT count(*)::int AS n FROM information_schema.tables WHERE table_schema = 'public' AND table_name IN ('offices','users','session')`)
      await c.end()
      expect(applied.rows[0].n).toBe(files)
      expect(tables.rows[0].n).toBe(3)
    } finally {
      await admin.query(`DROP DATABASE IF EXISTS ${name} WITH (FORCE)`)
      await admin.end()
    }
  })
})
