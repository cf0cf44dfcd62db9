/**
 * What else the retention run erases when a case's period ends, against the local S3 fake:
 * merge entries of other cases that quote the complainant, the case's address (its position
 * kept, rounded to 0.01°), its evidence files' names (stored_files stays append-only but for the
 * one SECURITY DEFINER function), unsent e-mails about the case to the complainant, and the
 * complainant's account when nothing else keeps it. Each is recorded, and the dry run lists
 * exactly what the real run records. Objects are deleted only after the records commit
 * ('pending'), each marked 'done' once gone: when the store fails half-way, the next run
 * finishes the deletion and nothing is lost or recorded twice.
 */
import { DeleteObjectCommand, type S3Client } from '@aws-sdk/client-s3'
import { beforeAll, describe, expect, it } from 'vitest'
import type { ObjectStore } from '../../server/storage/object-store'
import { mergeCase } from '../../server/modules/cases/case-moves.service'
import { runRetention } from '../../server/modules/retention/retention.service'
import { retentionRunViewSchema, type RetentionPlanCase } from '../../shared/schemas/retention'
import type { Office } from '../../server/db/schema'
import type { TestContext } from '../support/harness'
import { makeCase, makeOffice, makeUser, signIn } from '../support/factories'
import { actionsOfPlan, recordedActions } from '../support/retention-actions'
import { sha256, useRetentionTestContext } from '../support/retention'

const retention = useRetentionTestContext('retention-gaps')
const { objectExists, expire, addThumbnail, closedCaseWithFile } = retention
let store: ObjectStore
let t: TestContext

beforeAll(() => {
  t = retention.t
  store = retention.store
})

const marker = (at: Date) => `erased on ${at.toISOString().slice(0, 10)}`

/** The dry run, then the real run, of one office; the real run must answer what the dry run listed. */
async function dryThenReal(office: Office, now = new Date(), services = t.services) {
  const dry = retentionRunViewSchema.parse(await runRetention(services, { now, dryRun: true, officeIds: [office.id] }))
  const real = retentionRunViewSchema.parse(await runRetention(services, { now, dryRun: false, officeIds: [office.id] }))
  expect(real.cases).toEqual(dry.cases)
  expect(real.kept).toEqual(dry.kept)
  return { dry, real }
}

const onlyCase = (run: { cases: RetentionPlanCase[] }, id: string) => {
  expect(run.cases.map((c) => c.caseId)).toEqual([id])
  return run.cases[0]!
}

describe('merge entries of other cases', () => {
  it('are redacted when the merged report is erased, recorded, and listed by the dry run', async () => {
    const office = await makeOffice(t)
    const supervisor = await makeUser(t, { role: 'supervisor', office })
    const target = await makeCase(t, { office, state: 'received', supervisor })
    const dup = await makeCase(t, { office, state: 'received', report: { name: 'Orla Brennick', phone: '+44 20 7946 0111' } })
    await mergeCase(t.services, supervisor.actor, dup.id, { version: dup.version, intoCaseId: target.id })
    const { rows: [entry] } = await t.pool.query(`SELECT id, body FROM case_events WHERE case_id = $1 AND kind = 'merged_in'`, [target.id])
    expect(entry.body).toBe(`${dup.reference} (Orla Brennick) was merged into this case.`)
    await expire(dup.id)

    const { dry } = await dryThenReal(office)
    // the target is still open: only the merged report is erased
    const plan = onlyCase(dry, dup.id)
    expect(plan.mergeEventIds).toEqual([Number(entry.id)])

    const { rows: [after] } = await t.pool.query(`SELECT body, redacted_at FROM case_events WHERE id = $1`, [entry.id])
    expect(after.body).toBe(`${dup.reference} ([name removed]) was merged into this case.`)
    expect(after.redacted_at).not.toBeNull()
    expect(await recordedActions(t.pool, dup.id)).toEqual(actionsOfPlan(plan))
    expect((await recordedActions(t.pool, dup.id)).map((a) => a.action)).toContain('merge_entries_redacted')
    // the open target keeps its own complainant's data
    const { rows: [tc] } = await t.pool.query(`SELECT complainant_name, personal_data_erased_at FROM cases WHERE id = $1`, [target.id])
    expect(tc).toEqual({ complainant_name: 'Ines Marlow', personal_data_erased_at: null })
  })
})

describe('the case address', () => {
  it('becomes the marker, in the text too; the position is kept rounded to 0.01°, recorded', async () => {
    const office = await makeOffice(t)
    const address = '7 Brennick Row, Harrowmere'
    const c = await makeCase(t, { office, state: 'closed', report: { address, description: `Buzzing at ${address} on 1800 MHz every night.` } })
    const { rows: [before] } = await t.pool.query(`SELECT lat_deg, lon_deg FROM cases WHERE id = $1`, [c.id])
    await expire(c.id)
    const now = new Date()
    const { dry } = await dryThenReal(office, now)
    const plan = onlyCase(dry, c.id)
    expect(plan.fields).toContain('address')
    // rounded to two decimals, written out independently of the code under test (toFixed)
    const rounded = { latDeg: Number(before.lat_deg.toFixed(2)), lonDeg: Number(before.lon_deg.toFixed(2)) }
    expect(plan.coarsePosition).toEqual(rounded)

    const { rows: [after] } = await t.pool.query(`SELECT address, lat_deg, lon_deg, description, search_text FROM cases WHERE id = $1`, [c.id])
    expect(after.address).toBe(marker(now))
    expect({ latDeg: after.lat_deg, lonDeg: after.lon_deg }).toEqual(rounded)
    expect(Math.abs(after.lat_deg - before.lat_deg)).toBeLessThanOrEqual(0.005)
    expect(after.description).toBe('Buzzing at [address removed] on 1800 MHz every night.')
    expect(after.search_text).not.toContain('brennick')
    expect(await recordedActions(t.pool, c.id)).toEqual(actionsOfPlan(plan))
    expect((await recordedActions(t.pool, c.id)).find((a) => a.action === 'location_coarsened')?.details).toEqual({ positionStepDeg: 0.01 })
  })
})

describe('evidence file names', () => {
  it('become erased-<sha256 prefix>.<ext> in the append-only stored_files (through its one function), the evidence row and the timeline', async () => {
    const office = await makeOffice(t)
    const c = await closedCaseWithFile(office, 'Orla Brennick meter readings.csv', { name: 'Orla Brennick' })
    await expire(c.id)
    const { dry } = await dryThenReal(office)
    const plan = onlyCase(dry, c.id)
    const name = `erased-${sha256(c.bytes).slice(0, 12)}.csv`
    expect(plan.fileNames).toEqual([{ evidenceId: c.evidenceId, storedFileId: c.storedFileId, name }])

    const { rows: [file] } = await t.pool.query(`SELECT original_name, name_erased_at FROM stored_files WHERE id = $1`, [c.storedFileId])
    expect(file.original_name).toBe(name)
    expect(file.name_erased_at).not.toBeNull()
    const { rows: [ev] } = await t.pool.query(`SELECT display_name, submitted_name_json FROM evidence_files WHERE id = $1`, [c.evidenceId])
    expect(ev).toEqual({ display_name: name, submitted_name_json: JSON.stringify(name) })
    const { rows: added } = await t.pool.query(`SELECT body, redacted_at FROM case_events WHERE case_id = $1 AND kind = 'evidence_added'`, [c.id])
    expect(added).toEqual([{ body: `Added the file "${name}".`, redacted_at: expect.any(Date) }])
    expect(await recordedActions(t.pool, c.id)).toEqual(actionsOfPlan(plan))

    // the app role still cannot change stored_files; the function changes a name once, and only to the marker's shape
    await expect(t.pool.query(`UPDATE stored_files SET original_name = 'x.csv' WHERE id = $1`, [c.storedFileId])).rejects.toThrow(/permission denied/)
    expect((await t.pool.query(`SELECT quietband_erase_stored_file_name($1, $2) AS changed`, [c.storedFileId, name])).rows[0].changed).toBe(false)
    const open = await closedCaseWithFile(await makeOffice(t), 'Someone.csv')
    expect((await t.pool.query(`SELECT quietband_erase_stored_file_name($1, 'Someone Else.csv') AS changed`, [open.storedFileId])).rows[0].changed).toBe(false)
    expect((await t.pool.query(`SELECT original_name FROM stored_files WHERE id = $1`, [open.storedFileId])).rows[0].original_name).toBe('Someone.csv')
  })
})

describe('queued e-mails', () => {
  it('about the erased case to its complainant are cancelled and deleted; mail about a live case to the same address stays', async () => {
    const office = await makeOffice(t)
    const email = `queued-${process.pid}-${Date.now()}@example.test`
    const c = await makeCase(t, { office, state: 'closed', report: { email } })
    const live = await makeCase(t, { office, state: 'received', report: { email } })
    const jobsAbout = async (ref: string) =>
      (await t.pool.query(`SELECT id::text AS id FROM pgboss.job WHERE name = $1 AND data->>'to' = $2 AND starts_with(data->>'subject', $3) ORDER BY created_on, id`, [t.mailQueueName, email, `[${ref}]`])).rows.map(
        (r) => r.id as string,
      )
    const queued = await jobsAbout(c.reference)
    const liveJobs = await jobsAbout(live.reference)
    // no mail worker runs in this file: the receipt and the closing are still waiting
    expect(queued.length).toBeGreaterThanOrEqual(2)
    expect(liveJobs.length).toBeGreaterThanOrEqual(1)
    await expire(c.id)

    const { dry } = await dryThenReal(office)
    const plan = onlyCase(dry, c.id)
    expect(plan.queuedMails.map((m) => m.jobId)).toEqual(queued)
    expect(plan.queuedMails.every((m) => m.subject.startsWith(`[${c.reference}]`))).toBe(true)
    expect(await jobsAbout(c.reference)).toEqual([])
    expect(await jobsAbout(live.reference)).toEqual(liveJobs)
    expect(await recordedActions(t.pool, c.id)).toEqual(actionsOfPlan(plan))
    expect((await recordedActions(t.pool, c.id)).find((a) => a.action === 'queued_mail_cancelled')?.details).toEqual({ count: queued.length, jobIds: queued })
  })
})

describe('the complainant’s account', () => {
  it('is kept while it has another case, and the dry run says so', async () => {
    const office = await makeOffice(t)
    const u = await makeUser(t, { role: 'complainant' })
    const c = await makeCase(t, { office, state: 'closed', report: { email: u.email } })
    const other = await makeCase(t, { office, state: 'received', report: { email: u.email } })
    const { rows: linked } = await t.pool.query(`SELECT id FROM cases WHERE complainant_user_id = $1 ORDER BY id`, [u.id])
    expect(linked.map((r) => r.id).sort()).toEqual([c.id, other.id].sort())
    await t.pool.query(`UPDATE users SET last_signed_in_at = now() - interval '30 months' WHERE id = $1`, [u.id])
    await expire(c.id)

    const { dry } = await dryThenReal(office)
    const plan = onlyCase(dry, c.id)
    expect(plan.account).toEqual({ outcome: 'kept', userId: u.id, reason: 'other_cases', otherCases: 1 })
    const { rows: [row] } = await t.pool.query(`SELECT name, email, active FROM users WHERE id = $1`, [u.id])
    expect(row).toEqual({ name: u.name, email: u.email, active: true })
    expect((await recordedActions(t.pool, c.id)).map((a) => a.action)).not.toContain('account_deactivated')
  })

  it('is kept when it signed in within the retention period', async () => {
    const office = await makeOffice(t)
    const u = await makeUser(t, { role: 'complainant' })
    const c = await makeCase(t, { office, state: 'closed', report: { email: u.email } })
    await signIn(t, u)
    await expire(c.id)
    const { dry } = await dryThenReal(office)
    expect(onlyCase(dry, c.id).account).toEqual({ outcome: 'kept', userId: u.id, reason: 'signed_in', lastSignedInAt: expect.any(String) })
    expect((await t.pool.query(`SELECT active FROM users WHERE id = $1`, [u.id])).rows[0].active).toBe(true)
  })

  it('is deactivated, its name and e-mail replaced and its sessions ended, when nothing keeps it; two expiring cases of one account count as one', async () => {
    const office = await makeOffice(t)
    const u = await makeUser(t, { role: 'complainant' })
    const first = await makeCase(t, { office, state: 'closed', report: { email: u.email } })
    const second = await makeCase(t, { office, state: 'closed', report: { email: u.email } })
    const agent = await signIn(t, u)
    expect((await agent.get('/api/me')).body.user).toMatchObject({ id: u.id })
    await t.pool.query(`UPDATE users SET last_signed_in_at = now() - interval '30 months' WHERE id = $1`, [u.id])
    await expire(first.id)
    await expire(second.id)
    await t.pool.query(`UPDATE cases SET closed_at = closed_at - interval '1 day' WHERE id = $1`, [first.id])

    const now = new Date()
    const { dry } = await dryThenReal(office, now)
    expect(dry.cases.map((c) => c.caseId)).toEqual([first.id, second.id])
    // the first still sees the second; the second, erased after the first, closes the account
    expect(dry.cases[0]!.account).toEqual({ outcome: 'kept', userId: u.id, reason: 'other_cases', otherCases: 1 })
    expect(dry.cases[1]!.account).toEqual({ outcome: 'deactivated', userId: u.id })

    const { rows: [row] } = await t.pool.query(`SELECT name, email, active, password_hash FROM users WHERE id = $1`, [u.id])
    expect(row).toEqual({ name: marker(now), email: `erased-${u.id}@erased.invalid`, active: false, password_hash: null })
    expect((await agent.get('/api/me')).body.user).toBeNull()
    expect(await recordedActions(t.pool, second.id)).toEqual(actionsOfPlan(dry.cases[1]!))
    const deactivated = (await recordedActions(t.pool, second.id)).find((a) => a.action === 'account_deactivated')
    expect(deactivated?.details).toEqual({ userId: u.id, sessionsEnded: 1 })
    const { rows: audit } = await t.pool.query(`SELECT action, actor_user_id, details FROM audit_log WHERE target_type = 'user' AND target_id = $1`, [u.id])
    expect(audit).toEqual([{ action: 'user.deactivated', actor_user_id: null, details: { role: 'complainant', sessionsEnded: 1, byRetentionOf: second.reference } }])
    // the old address can no longer sign in
    expect((await agent.post('/api/auth/sign-in').send({ email: u.email, password: u.password })).status).toBe(401)
  })
})

describe('object deletion after the records commit', () => {
  it('leaves a deletion the store refused pending, and the next run finishes it without recording anything twice', async () => {
    const office = await makeOffice(t)
    const c = await closedCaseWithFile(office, 'capture.csv')
    const thumbKey = await addThumbnail(c)
    await expire(c.id)
    const first = onlyCase(retentionRunViewSchema.parse(await runRetention(t.services, { now: new Date(), dryRun: true, officeIds: [office.id] })), c.id)
    expect(first.evidence).toEqual([{ evidenceId: c.evidenceId, objectKey: c.objectKey, sha256: sha256(c.bytes), thumbnailKey: thumbKey }])

    // a store that deletes the first object and then fails (as if it went away half-way)
    let deletes = 0
    const failing: ObjectStore = {
      ...store,
      client: {
        send: async (command: unknown) => {
          if (command instanceof DeleteObjectCommand && ++deletes > 1) throw new Error('store unavailable')
          return store.client.send(command as DeleteObjectCommand)
        },
      } as unknown as S3Client,
    }
    const crashed = retentionRunViewSchema.parse(await runRetention({ ...t.services, objectStore: failing }, { now: new Date(), dryRun: false, officeIds: [office.id] }))
    expect(crashed.cases).toEqual([first])
    expect(await objectExists(c.objectKey)).toBe(false)
    expect(await objectExists(thumbKey)).toBe(true)
    const stages = async () =>
      (await t.pool.query(`SELECT action, stage, object_key FROM retention_actions WHERE case_id = $1 AND stage IS NOT NULL ORDER BY id`, [c.id])).rows
    expect(await stages()).toEqual([
      { action: 'evidence_disposed', stage: 'pending', object_key: c.objectKey },
      { action: 'thumbnail_disposed', stage: 'pending', object_key: thumbKey },
      { action: 'evidence_disposed', stage: 'done', object_key: c.objectKey },
    ])
    // the erasure itself is committed
    expect((await t.pool.query(`SELECT personal_data_erased_at FROM cases WHERE id = $1`, [c.id])).rows[0].personal_data_erased_at).not.toBeNull()

    // the next run lists the pending deletion, finishes it, and records it done once
    const { dry, real } = await dryThenReal(office)
    const pending = [{ caseId: c.id, action: 'thumbnail_disposed', evidenceId: c.evidenceId, objectKey: thumbKey }]
    expect(dry.cases).toEqual([])
    expect(dry.pendingDisposals).toEqual(pending)
    expect(real.pendingDisposals).toEqual(pending)
    expect(await objectExists(thumbKey)).toBe(false)
    expect(await recordedActions(t.pool, c.id)).toEqual(actionsOfPlan(first))

    // and a third run has nothing left to do
    const again = await runRetention(t.services, { now: new Date(), dryRun: false, officeIds: [office.id] })
    expect(again.cases).toEqual([])
    expect(again.pendingDisposals).toEqual([])
    expect(await recordedActions(t.pool, c.id)).toEqual(actionsOfPlan(first))
  })

  it('records nothing as deleted and erases nothing when the case’s transaction fails, and keeps the objects', async () => {
    const office = await makeOffice(t)
    const c = await closedCaseWithFile(office, 'capture.csv')
    await expire(c.id)
    // without a file store the run refuses a case with objects before anything commits
    await expect(runRetention({ ...t.services, objectStore: undefined }, { now: new Date(), dryRun: false, officeIds: [office.id] })).rejects.toThrow()
    expect(await recordedActions(t.pool, c.id)).toEqual([])
    expect((await t.pool.query(`SELECT personal_data_erased_at FROM cases WHERE id = $1`, [c.id])).rows[0].personal_data_erased_at).toBeNull()
    expect(await objectExists(c.objectKey)).toBe(true)
  })
})
