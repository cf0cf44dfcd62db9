/**
 * The audit log: every administrative change, export and opening of a complainant's personal
 * details is written with its actor, target and details in the same transaction as the change;
 * administrators (only) list it with filters and take it as CSV; the application's database
 * role can add entries but never change or remove one.
 */
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import pg from 'pg'
import { processDemoSigner } from '../../server/modules/case-file/case-file-signing'
import { issueCaseFile } from '../../server/modules/case-file/case-file.service'
import type { Office } from '../../server/db/schema'
import { auditPageSchema, type AuditEntryView } from '../../shared/schemas/audit'
import { createTestContext, type TestContext } from '../support/harness'
import { makeBandLimit, makeCase, makeOffice, makeUser, signIn, uniqueWord, type Agent, type TestUser } from '../support/factories'

const appUrl = inject('databaseUrl')
const ownerUrl = inject('migrationDatabaseUrl')
const sameRole = appUrl === ownerUrl

let t: TestContext
let owner: pg.Pool
let office: Office
let adminUser: TestUser
let supervisorUser: TestUser
let investigatorUser: TestUser
let admin: Agent
let supervisor: Agent
let investigator: Agent

beforeAll(async () => {
  t = await createTestContext()
  owner = new pg.Pool({ connectionString: ownerUrl, max: 2 })
  office = await makeOffice(t)
  adminUser = await makeUser(t, { role: 'admin' })
  supervisorUser = await makeUser(t, { role: 'supervisor', office })
  investigatorUser = await makeUser(t, { role: 'investigator', office })
  ;[admin, supervisor, investigator] = await Promise.all([signIn(t, adminUser), signIn(t, supervisorUser), signIn(t, investigatorUser)])
})
afterAll(async () => {
  await t?.close()
  await owner?.end()
})

/** The audit list as the administrator reads it (the answer checked against its schema). */
async function auditList(query: Record<string, string | number>): Promise<{ entries: AuditEntryView[]; total: number }> {
  const res = await admin.get('/api/admin/audit').query(query)
  expect(res.status, JSON.stringify(res.body)).toBe(200)
  return auditPageSchema.parse(res.body)
}

describe('administrative changes are recorded', () => {
  it('inviting, deactivating and reactivating a person: actor, target, office and role, newest first', async () => {
    const email = `${uniqueWord('audited')}@example.test`
    const invited = await admin.post('/api/admin/users').send({ name: 'Audited Person', email, role: 'investigator', officeId: office.id })
    expect(invited.status, JSON.stringify(invited.body)).toBe(201)
    const id = invited.body.user.id as string
    expect((await admin.patch(`/api/admin/users/${id}`).send({ active: false })).status).toBe(200)
    // the same state again changes nothing, so records nothing
    expect((await admin.patch(`/api/admin/users/${id}`).send({ active: false })).status).toBe(200)
    expect((await admin.patch(`/api/admin/users/${id}`).send({ active: true })).status).toBe(200)

    const { entries, total } = await auditList({ targetType: 'user', targetId: id })
    expect(total).toBe(3)
    expect(entries.map((e) => e.action)).toEqual(['user.reactivated', 'user.deactivated', 'user.invited'])
    for (const e of entries) {
      expect(e.actor).toEqual({ id: adminUser.id, name: adminUser.name, email: adminUser.email })
      expect(e).toMatchObject({ targetType: 'user', targetId: id, officeId: office.id, officeName: office.name, details: { role: 'investigator' } })
    }
    expect(entries[2]!.actionLabel).toBe('Person invited')
  })

  it("an office's resolution and first-response targets and its time zone: before and after", async () => {
    const before = (await supervisor.get(`/api/offices/${office.id}`)).body.office
    expect((await supervisor.put(`/api/offices/${office.id}/response-targets`).send({ p1: 5, p2: 25, p3: 73, p4: 241 })).status).toBe(200)
    expect((await supervisor.put(`/api/offices/${office.id}/first-response-targets`).send({ p1: 2, p2: 9, p3: 25, p4: 73 })).status).toBe(200)
    expect((await supervisor.put(`/api/offices/${office.id}/time-zone`).send({ timeZone: 'Pacific/Auckland' })).status).toBe(200)

    const targets = (await auditList({ action: 'office.response_targets_changed', officeId: office.id })).entries
    expect(targets).toHaveLength(1)
    expect(targets[0]).toMatchObject({
      actor: { id: supervisorUser.id },
      targetType: 'office',
      targetId: office.id,
      details: { beforeHours: before.responseTargetsHours, afterHours: { p1: 5, p2: 25, p3: 73, p4: 241 } },
    })
    const first = (await auditList({ action: 'office.first_response_targets_changed', officeId: office.id })).entries
    expect(first.map((e) => e.details)).toEqual([{ beforeHours: before.firstResponseTargetsHours, afterHours: { p1: 2, p2: 9, p3: 25, p4: 73 } }])
    const zone = (await auditList({ action: 'office.time_zone_changed', officeId: office.id })).entries
    expect(zone.map((e) => e.details)).toEqual([{ before: before.timeZone, after: 'Pacific/Auckland' }])
  })

  it('a band-limit edit, and nothing for an edit refused as stale (same transaction)', async () => {
    const limit = await makeBandLimit(t)
    const ok = await supervisor.patch(`/api/band-limits/${limit.id}`).send({ changes: { citation: 'Revised citation, clause 2' }, reason: 'Clause renumbered', version: 1 })
    expect(ok.status, JSON.stringify(ok.body)).toBe(200)
    const stale = await supervisor.patch(`/api/band-limits/${limit.id}`).send({ changes: { citation: 'Another' }, reason: 'Stale try', version: 1 })
    expect(stale.status).toBe(409)
    const { entries } = await auditList({ targetType: 'band_limit', targetId: limit.id })
    expect(entries).toHaveLength(1)
    expect(entries[0]).toMatchObject({ action: 'band_limit.edited', actor: { id: supervisorUser.id }, officeId: null, details: { key: limit.key, version: 2, reason: 'Clause renumbered', fields: ['citation'] } })
  })

  it('equipment added and revised', async () => {
    const added = await supervisor.post(`/api/offices/${office.id}/equipment`).send({ item: { name: 'Audit analyser', type: 'analyser', calibrationDueOn: '2030-01-01' } })
    expect(added.status, JSON.stringify(added.body)).toBe(201)
    const item = added.body.item
    const revised = await supervisor.patch(`/api/equipment/${item.id}`).send({ item: { name: 'Audit analyser 2', type: 'analyser', calibrationDueOn: '2030-01-01' }, version: 1, reason: 'Renamed' })
    expect(revised.status, JSON.stringify(revised.body)).toBe(200)
    const { entries } = await auditList({ targetType: 'equipment', targetId: item.id })
    expect(entries.map((e) => [e.action, e.details.change, e.officeId])).toEqual([
      ['equipment.changed', 'revised', office.id],
      ['equipment.changed', 'added', office.id],
    ])
    expect(entries[0]!.details).toMatchObject({ version: 2, reason: 'Renamed', fields: ['name'] })
  })
})

describe('exports are recorded', () => {
  it('the case list as CSV, with its filters and row count', async () => {
    await makeCase(t, { office })
    const res = await supervisor.get('/api/cases/export.csv').query({ open: 'true', service: 'broadcasting,amateur' })
    expect(res.status).toBe(200)
    const rowCount = res.text.trim().split('\r\n').length - 1
    const { entries } = await auditList({ action: 'cases.exported_csv', actorUserId: supervisorUser.id })
    expect(entries).toHaveLength(1)
    expect(entries[0]).toMatchObject({ targetType: 'case_list', targetId: null, officeId: office.id, details: { rowCount, filters: { open: true, service: ['broadcasting', 'amateur'] } } })
  })

  it("a case's evidence bundle and its signed case file", async () => {
    const c = await makeCase(t, { office, state: 'field_work', supervisor: supervisorUser, investigator: investigatorUser })
    const bundle = await investigator.get(`/api/cases/${c.id}/evidence-bundle`).buffer(true)
    expect(bundle.status).toBe(200)
    await issueCaseFile({ ...t.services, caseFileSigner: () => processDemoSigner() }, supervisorUser.actor, c.id)
    const { entries } = await auditList({ targetType: 'case', targetId: c.id })
    const byAction = Object.fromEntries(entries.map((e) => [e.action, e]))
    expect(byAction['evidence.bundle_exported']).toMatchObject({ actor: { id: investigatorUser.id }, officeId: office.id, details: { reference: c.reference, fileCount: 0, hashMismatches: 0 } })
    expect(byAction['case_file.issued']).toMatchObject({ actor: { id: supervisorUser.id }, officeId: office.id, details: { reference: c.reference, fileReference: `${c.reference}-CF1`, sha256: expect.stringMatching(/^[0-9a-f]{64}$/) } })
  })
})

describe("opening a complainant's personal details", () => {
  const viewsOf = async (caseId: string) => (await auditList({ action: 'complainant_details.viewed', targetId: caseId })).entries

  it('is recorded once per person and case within the hour, and again for another person', async () => {
    const c = await makeCase(t, { office })
    for (let i = 0; i < 3; i++) expect((await supervisor.get(`/api/cases/${c.id}`)).status).toBe(200)
    // two at once still write one entry (the advisory lock)
    await Promise.all([investigator.get(`/api/cases/${c.id}`), investigator.get(`/api/cases/${c.id}`)])
    const views = await viewsOf(c.id)
    expect(views.map((v) => v.actor?.id).sort()).toEqual([supervisorUser.id, investigatorUser.id].sort())
    expect(views[0]).toMatchObject({ targetType: 'case', officeId: office.id, details: { reference: c.reference, fields: expect.arrayContaining(['name', 'email']) } })
    // the case list (no personal details shown beyond the name column) records nothing
    await supervisor.get('/api/cases').query({ q: c.reference })
    expect(await viewsOf(c.id)).toHaveLength(2)
  })

  it('is recorded again once the last entry is more than an hour old, not before', async () => {
    // the owner role keeps the time it gives (make_append_only): entries back-dated by 61 and by 59 minutes
    const older = await makeCase(t, { office })
    const recent = await makeCase(t, { office })
    const insert = (caseId: string, minutes: number) =>
      owner.query(
        `INSERT INTO audit_log (at, actor_user_id, action, target_type, target_id, office_id, details) VALUES (now() - make_interval(mins => $1), $2, 'complainant_details.viewed', 'case', $3, $4, '{}')`,
        [minutes, supervisorUser.id, caseId, office.id],
      )
    await insert(older.id, 61)
    await insert(recent.id, 59)
    expect((await supervisor.get(`/api/cases/${older.id}`)).status).toBe(200)
    expect((await supervisor.get(`/api/cases/${recent.id}`)).status).toBe(200)
    expect(await viewsOf(older.id)).toHaveLength(2)
    expect(await viewsOf(recent.id)).toHaveLength(1)
  })
})

describe('reading the audit list', () => {
  it('only administrators may', async () => {
    for (const agent of [supervisor, investigator]) {
      expect((await agent.get('/api/admin/audit')).status).toBe(403)
      expect((await agent.get('/api/admin/audit.csv')).status).toBe(403)
    }
  })

  it('filters by time and pages newest first', async () => {
    const all = await auditList({ officeId: office.id, pageSize: 200 })
    expect(all.total).toBeGreaterThanOrEqual(5)
    const times = all.entries.map((e) => Date.parse(e.at))
    expect(times).toEqual([...times].sort((a, b) => b - a))
    const second = await auditList({ officeId: office.id, pageSize: 2, page: 2 })
    expect(second.entries.map((e) => e.id)).toEqual(all.entries.slice(2, 4).map((e) => e.id))
    expect(second.total).toBe(all.total)
    const tomorrow = new Date(Date.now() + 86_400_000).toISOString().slice(0, 10)
    expect((await auditList({ officeId: office.id, from: tomorrow })).total).toBe(0)
    expect((await auditList({ officeId: office.id, to: '2000-01-01' })).total).toBe(0)
    const oldest = all.entries.at(-1)!
    const fromOldest = await auditList({ officeId: office.id, from: oldest.at, pageSize: 200 })
    expect(fromOldest.total).toBe(all.total)
    expect((await auditList({ officeId: office.id, to: oldest.at })).total).toBe(0)
  })

  it('refuses bad filters with every problem listed', async () => {
    const res = await admin.get('/api/admin/audit').query({ action: 'user.eaten', actorUserId: 'someone', from: 'yesterday', pageSize: '1000' })
    expect(res.status).toBe(400)
    expect(res.body.error.code).toBe('validation_failed')
    const paths = (res.body.error.details as { path: string }[]).map((d) => d.path).sort()
    expect(paths).toEqual(['action', 'actorUserId', 'from', 'pageSize'])
    const reversed = await admin.get('/api/admin/audit').query({ from: '2026-03-02', to: '2026-03-01' })
    expect(reversed.status).toBe(400)
    expect(reversed.body.error.details).toEqual([expect.objectContaining({ path: 'to', message: 'The end must come after the start.' })])
    expect((await admin.get('/api/admin/audit.csv').query({ to: '2026-02-30' })).status).toBe(400)
  })

  it('as CSV: the same entries as the list, and taking it is recorded', async () => {
    const list = await auditList({ officeId: office.id, pageSize: 200 })
    const res = await admin.get('/api/admin/audit.csv').query({ officeId: office.id })
    expect(res.status).toBe(200)
    expect(res.headers['content-type']).toMatch(/^text\/csv/)
    expect(res.headers['content-disposition']).toMatch(/attachment; filename="quietband-audit-\d{4}-\d{2}-\d{2}\.csv"/)
    const lines = res.text.trim().split('\r\n')
    expect(lines[0]).toBe('id,at,action,action_label,actor_id,actor_name,actor_email,target_type,target_id,office_id,office_name,details')
    expect(lines).toHaveLength(list.total + 1)
    const ids = lines.slice(1).map((l) => Number(JSON.parse(l.split(',')[0]!)))
    expect(ids).toEqual(list.entries.map((e) => e.id))
    expect(lines[1]).toContain(`"${list.entries[0]!.action}"`)
    const taken = (await auditList({ action: 'audit.exported_csv', actorUserId: adminUser.id })).entries
    expect(taken[0]).toMatchObject({ targetType: 'audit_log', details: { rowCount: list.total, truncated: false, filters: { officeId: office.id } } })
  })
})

describe.skipIf(sameRole)('the audit log cannot be changed by the application', () => {
  it('refuses UPDATE, DELETE and TRUNCATE to the application role, and keeps every entry', async () => {
    const { rows: before } = await owner.query(`SELECT count(*)::int AS n FROM audit_log WHERE office_id = $1`, [office.id])
    expect(before[0].n).toBeGreaterThan(0)
    await expect(t.pool.query(`UPDATE audit_log SET details = '{"rewritten": true}' WHERE office_id = $1`, [office.id])).rejects.toThrow(/permission denied/)
    await expect(t.pool.query(`DELETE FROM audit_log WHERE office_id = $1`, [office.id])).rejects.toThrow(/permission denied/)
    await expect(t.pool.query('TRUNCATE audit_log')).rejects.toThrow(/permission denied/)
    await expect(t.pool.query('ALTER TABLE audit_log DISABLE TRIGGER audit_log_append_only')).rejects.toThrow(/must be owner/)
    const { rows: after } = await owner.query(`SELECT count(*)::int AS n FROM audit_log WHERE office_id = $1`, [office.id])
    expect(after[0].n).toBe(before[0].n)
  })

  it('refuses changes to the owner too (the append-only triggers), and sets the time of an app insert from the database', async () => {
    await expect(owner.query(`UPDATE audit_log SET details = '{}' WHERE office_id = $1`, [office.id])).rejects.toThrow(/append-only/)
    await expect(owner.query(`DELETE FROM audit_log WHERE office_id = $1`, [office.id])).rejects.toThrow(/append-only/)
    const { rows } = await t.pool.query(
      `INSERT INTO audit_log (at, actor_user_id, action, target_type, target_id, office_id, details) VALUES ('2001-01-01T00:00:00Z', $1, 'retention.run', 'office', $2, $3, '{}') RETURNING at`,
      [adminUser.id, office.id, office.id],
    )
    expect(Math.abs(new Date(rows[0].at).getTime() - Date.now())).toBeLessThan(60_000)
  })
})
