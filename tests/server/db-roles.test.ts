/**
 * The application's database role cannot rewrite history: it owns nothing, changes no schema,
 * cannot change or remove timeline events or queued mail, and the time of an event it writes
 * is the database's. pg-boss still does all its work (send, fetch, fail and retry, complete,
 * archive) under that role.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { inject } from 'vitest'
import pg from 'pg'
import PgBoss from 'pg-boss'
import { createTestContext, type TestContext } from '../support/harness'
import { makeCase, makeOffice, makeUser, signIn, type TestUser } from '../support/factories'

const appUrl = inject('databaseUrl')
const ownerUrl = inject('migrationDatabaseUrl')
const sameRole = appUrl === ownerUrl

let app: pg.Pool
let owner: pg.Pool
let t: TestContext
let caseId: string
/** The supervisor of the case's office (this file's own). */
let supervisorUser: TestUser

/** Runs `work` as the given pool in a transaction that is always rolled back. */
async function inRolledBack<T>(pool: pg.Pool, work: (c: pg.PoolClient) => Promise<T>): Promise<T> {
  const c = await pool.connect()
  try {
    await c.query('BEGIN')
    return await work(c)
  } finally {
    await c.query('ROLLBACK').catch(() => {})
    c.release()
  }
}

describe.skipIf(sameRole)('the application database role', () => {
  beforeAll(async () => {
    app = new pg.Pool({ connectionString: appUrl, max: 3 })
    owner = new pg.Pool({ connectionString: ownerUrl, max: 2 })
    t = await createTestContext()
    const office = await makeOffice(t)
    supervisorUser = await makeUser(t, { role: 'supervisor', office })
    caseId = (await makeCase(t, { office })).id
  })
  afterAll(async () => {
    await t?.close()
    await app?.end()
    await owner?.end()
  })

  describe('against the timeline', () => {
    it('may not disable its triggers', async () => {
      await expect(app.query('ALTER TABLE case_events DISABLE TRIGGER ALL')).rejects.toThrow(/must be owner/)
      await expect(app.query('ALTER TABLE case_events DISABLE TRIGGER case_events_append_only')).rejects.toThrow(/must be owner/)
    })

    it('may not drop a trigger', async () => {
      await expect(app.query('DROP TRIGGER case_events_append_only ON case_events')).rejects.toThrow(/must be owner/)
      await expect(app.query('DROP TRIGGER case_events_server_time ON case_events')).rejects.toThrow(/must be owner/)
    })

    it('may not replace the trigger functions', async () => {
      await expect(
        app.query(`CREATE OR REPLACE FUNCTION quietband_refuse_change() RETURNS trigger LANGUAGE plpgsql AS $$ BEGIN RETURN OLD; END $$`),
      ).rejects.toThrow(/permission denied for schema public|must be owner/)
      await expect(
        app.query(`CREATE OR REPLACE FUNCTION quietband_server_time() RETURNS trigger LANGUAGE plpgsql AS $$ BEGIN RETURN NEW; END $$`),
      ).rejects.toThrow(/permission denied for schema public|must be owner/)
    })

    it('may not truncate it', async () => {
      await expect(app.query('TRUNCATE case_events')).rejects.toThrow(/permission denied/)
    })

    it('may not update or delete an event', async () => {
      await expect(app.query(`UPDATE case_events SET body = 'rewritten' WHERE case_id = $1`, [caseId])).rejects.toThrow(/permission denied/)
      await expect(app.query(`DELETE FROM case_events WHERE case_id = $1`, [caseId])).rejects.toThrow(/permission denied/)
      const { rows } = await owner.query(`SELECT count(*)::int AS n FROM case_events WHERE case_id = $1`, [caseId])
      expect(rows[0].n).toBeGreaterThan(0)
    })

    it('may correct measurements and equipment but never delete or empty them', async () => {
      // the demo's registers hold equipment; a delete the role may not make fails before it looks at any row
      await expect(app.query('DELETE FROM measurements')).rejects.toThrow(/permission denied/)
      await expect(app.query('DELETE FROM equipment')).rejects.toThrow(/permission denied/)
      await expect(app.query('TRUNCATE measurements')).rejects.toThrow(/permission denied/)
      await expect(app.query('TRUNCATE equipment')).rejects.toThrow(/permission denied/)
      // updating stays possible (an unused measurement is edited in place, an item gets a new version)
      await expect(inRolledBack(app, (c) => c.query(`UPDATE equipment SET notes = notes WHERE false`))).resolves.toBeDefined()
    })

    it('may not drop or alter the table, or add one of its own', async () => {
      await expect(app.query('DROP TABLE case_events')).rejects.toThrow(/must be owner/)
      await expect(app.query('ALTER TABLE case_events ADD COLUMN note text')).rejects.toThrow(/must be owner/)
      await expect(app.query('CREATE TABLE public.shadow (id int)')).rejects.toThrow(/permission denied/)
    })

    it('gets the database time on an event whatever the insert says', async () => {
      const row = await inRolledBack(app, async (c) => {
        const { rows } = await c.query(
          `INSERT INTO case_events (case_id, at, actor_label, kind, visibility) VALUES ($1, '2001-02-03T04:05:06Z', 'Back-dater', 'note', 'internal')
           RETURNING at, now() AS db_now`,
          [caseId],
        )
        return rows[0]
      })
      expect(row.at.toISOString()).toBe(row.db_now.toISOString())
    })

    it('leaves the owner the time it gives, so demo stories keep their own clock', async () => {
      const row = await inRolledBack(owner, async (c) => {
        const { rows } = await c.query(
          `INSERT INTO case_events (case_id, at, actor_label, kind, visibility) VALUES ($1, '2001-02-03T04:05:06Z', 'Story', 'note', 'internal') RETURNING at`,
          [caseId],
        )
        return rows[0]
      })
      expect(row.at.toISOString()).toBe('2001-02-03T04:05:06.000Z')
    })

    it('writes the signed-in user as the author of a note, whatever the request body claims', async () => {
      const supervisor = await signIn(t, supervisorUser)
      const someoneElse = await makeUser(t, { role: 'admin' })
      const body = `Author check ${Date.now()}`
      await supervisor
        .post(`/api/cases/${caseId}/notes`)
        .send({ body, visibility: 'internal', actorUserId: someoneElse.id, actorLabel: 'Someone Else', at: '2001-02-03T04:05:06Z' })
        .expect(201)
      const { rows } = await owner.query(
        `SELECT e.actor_label = u.name AS labelled_as_author, u.email, e.at > now() - interval '1 minute' AS recent FROM case_events e JOIN users u ON u.id = e.actor_user_id WHERE e.case_id = $1 AND e.body = $2`,
        [caseId, body],
      )
      expect(rows).toEqual([{ labelled_as_author: true, email: supervisorUser.email, recent: true }])
    })
  })

  describe('against the job queue', () => {
    let boss: PgBoss
    const queue = `roles-test-${process.pid}`
    beforeAll(async () => {
      boss = new PgBoss({ connectionString: appUrl, schema: 'pgboss', max: 2, supervise: false, schedule: false })
      boss.on('error', () => {})
      await boss.start()
      await boss.createQueue(queue)
    })
    afterAll(async () => {
      await boss?.stop({ graceful: false, wait: true, timeout: 2000 })
    })

    it('may not delete queued mail, and the job stays queued', async () => {
      const id = (await boss.send(queue, { to: 'kept@example.test' }))!
      await expect(app.query(`DELETE FROM pgboss.job WHERE name = $1 AND id = $2`, [queue, id])).rejects.toThrow(/still queued/)
      const { rows } = await app.query(`SELECT state FROM pgboss.job WHERE name = $1 AND id = $2`, [queue, id])
      expect(rows).toEqual([{ state: 'created' }])
    })

    it('may not rewrite the content of queued mail, truncate the queue or change its tables', async () => {
      const id = (await boss.send(queue, { to: 'unchanged@example.test' }))!
      await expect(app.query(`UPDATE pgboss.job SET data = '{"to":"elsewhere@example.test"}' WHERE id = $1`, [id])).rejects.toThrow(/permission denied/)
      await expect(app.query('TRUNCATE pgboss.job')).rejects.toThrow(/permission denied/)
      await expect(app.query('DROP TABLE pgboss.job')).rejects.toThrow(/must be owner/)
      await expect(app.query('ALTER TABLE pgboss.job DISABLE TRIGGER job_kept')).rejects.toThrow(/must be owner/)
      await expect(app.query(`SELECT pgboss.delete_queue($1)`, [queue])).rejects.toThrow(/permission denied/)
    })

    it('still lets pg-boss fetch, fail and retry, complete and archive jobs', async () => {
      const worked = `${queue}-worked`
      await boss.createQueue(worked)
      const id = (await boss.send(worked, { to: 'worked@example.test' }, { retryLimit: 2, retryDelay: 0 }))!
      const [first] = await boss.fetch(worked)
      expect(first!.id).toBe(id)
      await boss.fail(worked, id, { message: 'SMTP down' })
      expect((await boss.getJobById(worked, id))!.state).toBe('retry')
      const [again] = await boss.fetch(worked)
      expect(again!.id).toBe(id)
      await boss.complete(worked, id)
      expect((await boss.getJobById(worked, id))!.state).toBe('completed')
      // make it old enough to archive (the owner may), then let the app's maintenance run
      await owner.query(`UPDATE pgboss.job SET completed_on = now() - interval '30 days' WHERE name = $1 AND id = $2`, [worked, id])
      await boss.maintain()
      const { rows } = await app.query(`SELECT (SELECT count(*)::int FROM pgboss.job WHERE id = $1) AS queued, (SELECT count(*)::int FROM pgboss.archive WHERE id = $1) AS archived`, [id])
      expect(rows[0]).toEqual({ queued: 0, archived: 1 })
    })
  })

  describe('elsewhere', () => {
    it('owns no table, sequence or function, and is no superuser', async () => {
      const { rows } = await app.query(
        `SELECT (SELECT count(*)::int FROM pg_class WHERE relowner = r.oid) AS relations,
                (SELECT count(*)::int FROM pg_proc WHERE proowner = r.oid) AS functions, r.rolsuper, r.rolcreaterole, r.rolcreatedb
           FROM pg_roles r WHERE r.rolname = current_user`,
      )
      expect(rows[0]).toEqual({ relations: 0, functions: 0, rolsuper: false, rolcreaterole: false, rolcreatedb: false })
    })

    it('cannot read or change the migration history', async () => {
      await expect(app.query('SELECT count(*) FROM drizzle.__drizzle_migrations')).rejects.toThrow(/permission denied/)
    })

    it('may not make a table append-only or lift it', async () => {
      await expect(app.query(`SELECT make_append_only('users', 'created_at')`)).rejects.toThrow(/permission denied/)
    })
  })
})
