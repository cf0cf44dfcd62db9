/**
 * Retention and legal hold against the local S3 fake: a retention run erases the personal data
 * of a closed case whose office period has ended (name and contact replaced by a marker, the
 * complainant's free text by a redacted copy, evidence objects deleted with their rows kept and
 * marked), leaves a held case, a not-yet-expired case and a case with an open follow-up
 * untouched, records each erasure and disposal, and its dry run lists exactly what the real run
 * then removes; a second run does nothing new. An office's period shorter than its closed cases'
 * open follow-ups need is refused with nothing changed. Legal-hold routes by role.
 */
import { beforeAll, describe, expect, it } from 'vitest'
import { runRetention } from '../../server/modules/retention/retention.service'
import { startRetentionWorker } from '../../server/modules/retention/retention-job'
import { retentionEndsAt } from '../../shared/domain/retention'
import { legalHoldViewSchema, retentionRunViewSchema, retentionSettingViewSchema, type RetentionPlanCase } from '../../shared/schemas/retention'
import type { Office } from '../../server/db/schema'
import type { TestContext } from '../support/harness'
import { actionsOfPlan, recordedActions } from '../support/retention-actions'
import { sha256, useRetentionTestContext } from '../support/retention'
import { makeCase, makeOffice, makeUser, signIn, type Agent } from '../support/factories'
import { closedWithDeadline, dayFromToday } from '../support/factories'

const retention = useRetentionTestContext('retention')
const { objectExists, expire, addThumbnail, closedCaseWithFile } = retention
let t: TestContext
let admin: Agent

beforeAll(async () => {
  t = retention.t
  admin = await signIn(t, await makeUser(t, { role: 'admin' }))
}, 120_000)

const NAME = 'Ines Marlow'
const PHONE = '+44 20 7946 0958'
const DESCRIPTION = `Hum on 433.92 MHz every evening since March. Call Ines on ${PHONE} or write to ines.marlow@example.test.`
const ADDED = 'It is worse after 9 pm; my other number is 0161 496 0000.'

/** A case of the office with an evidence file and the complainant's added text, closed without a follow-up. */
const closedCaseWithEvidence = (office: Office) =>
  closedCaseWithFile(office, 'capture.csv', { name: NAME, phone: PHONE, organisation: 'Marlow Farm Radio Club', description: DESCRIPTION }, ADDED)

/** Everything the run may touch of a case, to compare before and after. */
async function snapshot(caseId: string) {
  const q = async (sql: string) => (await t.pool.query(sql, [caseId])).rows
  return {
    c: await q(`SELECT * FROM cases WHERE id = $1`),
    events: await q(`SELECT id, kind, body, redacted_at FROM case_events WHERE case_id = $1 ORDER BY id`),
    evidence: await q(`SELECT id, disposed_at FROM evidence_files WHERE case_id = $1 ORDER BY id`),
    actions: await q(`SELECT * FROM retention_actions WHERE case_id = $1 ORDER BY id`),
  }
}

/** A time 25 calendar months after now: past the default 24-month period of a case closed today. */
const after25Months = () => {
  const d = new Date()
  d.setUTCMonth(d.getUTCMonth() + 25)
  return d
}

describe('the retention run', () => {
  let officeA: Office
  let officeB: Office
  let expired: Awaited<ReturnType<typeof closedCaseWithEvidence>>
  let held: Awaited<ReturnType<typeof closedCaseWithEvidence>>
  let young: Awaited<ReturnType<typeof closedCaseWithEvidence>>
  let planned: RetentionPlanCase
  const runAt = after25Months()

  beforeAll(async () => {
    officeA = await makeOffice(t)
    officeB = await makeOffice(t)
    expired = await closedCaseWithEvidence(officeA)
    held = await closedCaseWithEvidence(officeA)
    young = await closedCaseWithEvidence(officeB)
    const sup = await signIn(t, held.supervisor!)
    const hold = await sup.post(`/api/cases/${held.id}/legal-hold`).send({ reason: 'Court order 2026/114: keep all records.' })
    expect(hold.status, JSON.stringify(hold.body)).toBe(200)
    const longer = await admin.put(`/api/offices/${officeB.id}/retention`).send({ retentionMonths: '36 months' })
    expect(longer.status, JSON.stringify(longer.body)).toBe(200)
    expect(retentionSettingViewSchema.parse(longer.body.retention).retentionMonths).toBe(36)
  }, 120_000)

  it('erases the expired case, keeps the held and the young one, and its dry run lists exactly what the real run removes', async () => {
    // the expired case's file has a thumbnail (as the thumbnail job leaves it): it goes with the file
    const thumbKey = await addThumbnail(expired)
    const before = { expired: await snapshot(expired.id), held: await snapshot(held.id), young: await snapshot(young.id) }

    const dry = retentionRunViewSchema.parse(await runRetention(t.services, { now: runAt, dryRun: true, officeIds: [officeA.id, officeB.id] }))
    expect(dry.dryRun).toBe(true)
    expect(dry.cases.map((c) => c.caseId)).toEqual([expired.id])
    expect(dry.kept).toEqual([{ caseId: held.id, reference: held.reference, reason: 'legal_hold' }])
    planned = dry.cases[0]!
    expect(planned.fields).toEqual(['complainantName', 'complainantEmail', 'complainantPhone', 'complainantOrganisation', 'address', 'description'])
    expect(dry.pendingDisposals).toEqual([])
    // the unsent e-mails about the case to the complainant (no mail worker runs here): the report's receipt and its closing
    const { rows: queued } = await t.pool.query(`SELECT id::text AS id FROM pgboss.job WHERE name = $1 AND data->>'to' = $2 AND starts_with(data->>'subject', $3) ORDER BY created_on, id`, [
      t.mailQueueName,
      expired.email,
      `[${expired.reference}]`,
    ])
    expect(queued.length).toBeGreaterThanOrEqual(2)
    expect(planned.queuedMails.map((m) => m.jobId)).toEqual(queued.map((q) => q.id))
    expect(planned.evidence).toEqual([{ evidenceId: expect.any(String), objectKey: expired.objectKey, sha256: sha256(expired.bytes), thumbnailKey: thumbKey }])
    expect(planned.redactedEventIds.length).toBeGreaterThanOrEqual(1)
    // the dry run changed nothing
    expect(await snapshot(expired.id)).toEqual(before.expired)
    expect(await objectExists(expired.objectKey)).toBe(true)

    const real = retentionRunViewSchema.parse(await runRetention(t.services, { now: runAt, dryRun: false, officeIds: [officeA.id, officeB.id] }))
    expect(real.dryRun).toBe(false)
    expect(real.cases).toEqual(dry.cases)
    expect(real.kept).toEqual(dry.kept)
    expect(real.pendingDisposals).toEqual([])

    // personal data: marker for name and contact, redacted copy of the free text
    const marker = `erased on ${runAt.toISOString().slice(0, 10)}`
    const { rows: [c] } = await t.pool.query(`SELECT * FROM cases WHERE id = $1`, [expired.id])
    expect(c).toMatchObject({ complainant_name: marker, complainant_email: marker, complainant_phone: marker, complainant_organisation: marker, complainant_user_id: null, status: 'closed' })
    expect(c.personal_data_erased_at).not.toBeNull()
    expect(c.description).toContain('433.92 MHz')
    for (const gone of ['Ines', 'Marlow', '7946', 'ines.marlow@example.test']) expect(c.description).not.toContain(gone)
    expect(c.search_text).not.toContain('marlow')
    const { rows: added } = await t.pool.query(`SELECT id, body, redacted_at FROM case_events WHERE case_id = $1 AND kind = 'complainant_information'`, [expired.id])
    expect(added).toHaveLength(1)
    expect(added[0].body).toContain('worse after 9 pm')
    expect(added[0].body).not.toContain('496 0000')
    expect(added[0].redacted_at).not.toBeNull()
    expect(planned.redactedEventIds).toContain(Number(added[0].id))

    // evidence: the object is gone from the store, the row stays, marked
    expect(await objectExists(expired.objectKey)).toBe(false)
    expect(await objectExists(thumbKey)).toBe(false)
    const { rows: thumb } = await t.pool.query(`SELECT state, object_key FROM evidence_thumbnails WHERE evidence_id = $1`, [planned.evidence[0]!.evidenceId])
    expect(thumb).toEqual([{ state: 'failed', object_key: null }])
    const { rows: ev } = await t.pool.query(`SELECT disposed_at FROM evidence_files WHERE case_id = $1`, [expired.id])
    expect(ev).toHaveLength(1)
    expect(ev[0].disposed_at).not.toBeNull()
    const download = await (await signIn(t, expired.investigator!)).get(`/api/evidence/${planned.evidence[0]!.evidenceId}/download`)
    expect(download.status).toBe(410)
    expect(download.body.error.code).toBe('evidence_disposed')

    // the record: exactly the dry run's plan, each object's deletion 'pending' then 'done', the evidence row with the bytes' SHA-256 (node:crypto over what was uploaded)
    expect(await recordedActions(t.pool, expired.id)).toEqual(actionsOfPlan(planned))
    const { rows: disposals } = await t.pool.query(`SELECT action, stage, object_key, sha256 FROM retention_actions WHERE case_id = $1 AND stage IS NOT NULL ORDER BY id`, [expired.id])
    expect(disposals).toEqual([
      { action: 'evidence_disposed', stage: 'pending', object_key: expired.objectKey, sha256: sha256(expired.bytes) },
      { action: 'thumbnail_disposed', stage: 'pending', object_key: thumbKey, sha256: null },
      { action: 'evidence_disposed', stage: 'done', object_key: expired.objectKey, sha256: sha256(expired.bytes) },
      { action: 'thumbnail_disposed', stage: 'done', object_key: thumbKey, sha256: null },
    ])
    const { rows: stillQueued } = await t.pool.query(`SELECT count(*)::int AS n FROM pgboss.job WHERE name = $1 AND id::text = ANY($2)`, [t.mailQueueName, queued.map((q) => q.id)])
    expect(stillQueued[0].n).toBe(0)
    const { rows: kinds } = await t.pool.query(`SELECT kind FROM case_events WHERE case_id = $1 ORDER BY id DESC LIMIT 2`, [expired.id])
    expect(kinds.map((k) => k.kind).sort()).toEqual(['evidence_disposed', 'personal_data_erased'])
    const { rows: audit } = await t.pool.query(`SELECT action, actor_user_id FROM audit_log WHERE target_id = $1`, [expired.id])
    expect(audit).toEqual([{ action: 'retention.run', actor_user_id: null }])

    // the held case and the case whose (longer) period has not ended: untouched
    expect(await snapshot(held.id)).toEqual(before.held)
    expect(await snapshot(young.id)).toEqual(before.young)
    expect(await objectExists(held.objectKey)).toBe(true)
    expect(await objectExists(young.objectKey)).toBe(true)
  })

  it('does nothing new on a second run', async () => {
    const count = async () => (await t.pool.query(`SELECT count(*)::int AS n FROM retention_actions WHERE case_id = ANY($1)`, [[expired.id, held.id, young.id]])).rows[0].n
    const n = await count()
    expect(n).toBe(actionsOfPlan(planned).length)
    const before = await snapshot(expired.id)
    const again = await runRetention(t.services, { now: runAt, dryRun: false, officeIds: [officeA.id, officeB.id] })
    expect(again.cases).toEqual([])
    expect(await count()).toBe(n)
    expect(await snapshot(expired.id)).toEqual(before)
  })

  it('takes the held case once its hold is lifted', async () => {
    const sup = await signIn(t, held.supervisor!)
    expect((await sup.post(`/api/cases/${held.id}/legal-hold/lift`).send({ reason: 'The court released the records.' })).status).toBe(200)
    const dry = await runRetention(t.services, { now: runAt, dryRun: true, officeIds: [officeA.id] })
    expect(dry.cases.map((c) => c.caseId)).toEqual([held.id])
  })

  it('keeps the timeline append-only for everything but the redaction function', async () => {
    const { rows: [e] } = await t.pool.query(`SELECT id FROM case_events WHERE case_id = $1 AND redacted_at IS NOT NULL LIMIT 1`, [expired.id])
    await expect(t.pool.query(`UPDATE case_events SET body = 'rewritten' WHERE id = $1`, [e.id])).rejects.toThrow(/permission denied/)
    // a second redaction of the same entry changes nothing
    const { rows } = await t.pool.query(`SELECT quietband_redact_case_event($1, 'again') AS changed`, [e.id])
    expect(rows[0].changed).toBe(false)
    const { rows: kept } = await t.pool.query(`SELECT body FROM case_events WHERE id = $1`, [e.id])
    expect(kept[0].body).not.toBe('again')
    // and setting the flag by hand does not open the table to the app role
    const client = await t.pool.connect()
    try {
      await client.query('BEGIN')
      await client.query(`SELECT set_config('quietband.retention_erasure', 'on', true)`)
      await expect(client.query(`UPDATE case_events SET body = 'rewritten' WHERE id = $1`, [e.id])).rejects.toThrow(/permission denied/)
    } finally {
      await client.query('ROLLBACK')
      client.release()
    }
  })
})

describe('a closed case with an open follow-up', () => {
  it('is kept by the run, and a retention period shorter than its follow-up needs is refused with nothing changed', async () => {
    const office = await makeOffice(t)
    // due 400 days after closing: 13 calendar months are at most 397 days, so 14 months are needed
    const c = await closedWithDeadline(t, office, dayFromToday(400))
    const setting = retentionSettingViewSchema.parse((await admin.get(`/api/offices/${office.id}/retention`).expect(200)).body.retention)
    expect(setting).toMatchObject({ retentionMonths: 24, minimumMonths: 14, minimumBecause: { caseId: c.id, reference: c.reference, dueOn: dayFromToday(400) } })

    const refused = await admin.put(`/api/offices/${office.id}/retention`).send({ retentionMonths: 6 })
    expect(refused.status).toBe(400)
    expect(refused.body.error.code).toBe('validation_failed')
    expect(refused.body.error.details).toEqual([{ path: 'retentionMonths', message: expect.stringContaining(c.reference) }])
    expect(refused.body.error.details[0].message).toContain('at least 14 months')
    const { rows } = await t.pool.query(`SELECT retention_months FROM offices WHERE id = $1`, [office.id])
    expect(rows[0].retention_months).toBe(24)
    const { rows: audit } = await t.pool.query(`SELECT count(*)::int AS n FROM audit_log WHERE target_id = $1 AND action = 'retention.changed'`, [office.id])
    expect(audit[0].n).toBe(0)

    const ok = await admin.put(`/api/offices/${office.id}/retention`).send({ retentionMonths: 14 })
    expect(ok.status, JSON.stringify(ok.body)).toBe(200)
    const { rows: changed } = await t.pool.query(`SELECT details FROM audit_log WHERE target_id = $1 AND action = 'retention.changed'`, [office.id])
    expect(changed).toEqual([{ details: { fromMonths: 24, toMonths: 14 } }])

    // past its period, the run still keeps it while the follow-up is open
    const far = new Date()
    far.setUTCMonth(far.getUTCMonth() + 30)
    const dry = await runRetention(t.services, { now: far, dryRun: true, officeIds: [office.id] })
    expect(dry.cases).toEqual([])
    expect(dry.kept).toEqual([{ caseId: c.id, reference: c.reference, reason: 'open_follow_up' }])
  })

  it('refuses a period that is not whole months, naming the field', async () => {
    const office = await makeOffice(t)
    for (const bad of [0, 2.5, '0x10', 'twelve', 1201, true]) {
      const res = await admin.put(`/api/offices/${office.id}/retention`).send({ retentionMonths: bad })
      expect(res.status, String(bad)).toBe(400)
      expect(res.body.error.details[0].path).toBe('retentionMonths')
    }
    const sup = await signIn(t, await makeUser(t, { role: 'supervisor', office }))
    expect((await sup.put(`/api/offices/${office.id}/retention`).send({ retentionMonths: 12 })).status).toBe(403)
    expect((await sup.get(`/api/offices/${office.id}/retention`)).body.retention.abilities).toEqual({ set: false })
  })
})

describe('legal hold routes', () => {
  it('let the office supervisor and admins set and lift, with timeline and audit entries; others are refused', async () => {
    const office = await makeOffice(t)
    const c = await makeCase(t, { office, state: 'closed' })
    const sup = await signIn(t, c.supervisor!)
    const inv = await signIn(t, c.investigator!)
    const otherSup = await signIn(t, await makeUser(t, { role: 'supervisor', office: await makeOffice(t) }))
    const complainant = await signIn(t, await makeUser(t, { role: 'complainant' }))

    expect((await inv.post(`/api/cases/${c.id}/legal-hold`).send({ reason: 'x' })).status).toBe(403)
    expect((await complainant.post(`/api/cases/${c.id}/legal-hold`).send({ reason: 'x' })).status).toBe(403)
    expect((await otherSup.post(`/api/cases/${c.id}/legal-hold`).send({ reason: 'x' })).status).toBe(404)
    const empty = await sup.post(`/api/cases/${c.id}/legal-hold`).send({ reason: ' ', until: dayFromToday(-1) })
    expect(empty.status).toBe(400)
    expect(empty.body.error.details.map((d: { path: string }) => d.path)).toEqual(['reason'])
    const past = await sup.post(`/api/cases/${c.id}/legal-hold`).send({ reason: 'Appeal pending', until: dayFromToday(-1) })
    expect(past.status).toBe(400)
    expect(past.body.error.details).toEqual([{ path: 'until', message: expect.stringContaining('cannot be in the past') }])
    expect((await sup.post(`/api/cases/${c.id}/legal-hold/lift`).send({ reason: 'nothing to lift' })).status).toBe(409)

    const until = dayFromToday(90)
    const set = await sup.post(`/api/cases/${c.id}/legal-hold`).send({ reason: 'Appeal pending', until })
    expect(set.status, JSON.stringify(set.body)).toBe(200)
    const view = legalHoldViewSchema.parse(set.body.legalHold)
    expect(view.active).toMatchObject({ reason: 'Appeal pending', until, byName: c.supervisor!.name })
    expect(view.abilities).toEqual({ set: true, lift: true })
    const seen = legalHoldViewSchema.parse((await inv.get(`/api/cases/${c.id}/legal-hold`).expect(200)).body.legalHold)
    expect(seen.active?.reason).toBe('Appeal pending')
    expect(seen.abilities).toEqual({ set: false, lift: false })
    expect((await inv.post(`/api/cases/${c.id}/legal-hold/lift`).send({ reason: 'x' })).status).toBe(403)

    const lifted = await admin.post(`/api/cases/${c.id}/legal-hold/lift`).send({ reason: 'Appeal decided' })
    expect(lifted.status).toBe(200)
    const after = legalHoldViewSchema.parse(lifted.body.legalHold)
    expect(after.active).toBeNull()
    expect(after.history.map((h) => h.action)).toEqual(['lifted', 'set'])

    const { rows: events } = await t.pool.query(`SELECT kind, body FROM case_events WHERE case_id = $1 AND kind LIKE 'legal_hold%' ORDER BY id`, [c.id])
    expect(events).toEqual([
      { kind: 'legal_hold_set', body: `Legal hold until ${until}: Appeal pending` },
      { kind: 'legal_hold_lifted', body: 'Legal hold lifted: Appeal decided' },
    ])
    const { rows: audit } = await t.pool.query(`SELECT action FROM audit_log WHERE target_id = $1 ORDER BY id`, [c.id])
    expect(audit.map((a) => a.action)).toEqual(['legal_hold.set', 'legal_hold.lifted'])
  })

  it('holds the case up to and including its last day, and no longer after', async () => {
    const office = await makeOffice(t)
    const c = await closedCaseWithEvidence(office)
    await expire(c.id)
    const sup = await signIn(t, c.supervisor!)
    const lastDay = dayFromToday(10)
    expect((await sup.post(`/api/cases/${c.id}/legal-hold`).send({ reason: 'Until the hearing', until: lastDay })).status).toBe(200)
    const onLastDay = await runRetention(t.services, { now: new Date(`${lastDay}T23:00:00Z`), dryRun: true, officeIds: [office.id] })
    expect(onLastDay.cases).toEqual([])
    expect(onLastDay.kept).toEqual([{ caseId: c.id, reference: c.reference, reason: 'legal_hold' }])
    const dayAfter = await runRetention(t.services, { now: new Date(`${dayFromToday(11)}T00:30:00Z`), dryRun: true, officeIds: [office.id] })
    expect(dayAfter.cases.map((x) => x.caseId)).toEqual([c.id])
  })
})

describe('the end of a period', () => {
  it('is the same in the app (retentionEndsAt, used for the follow-up minimum) as in PostgreSQL’s month arithmetic (used by the run)', async () => {
    for (const [closed, months] of [['2026-01-31T10:00:00Z', 1], ['2027-01-31T10:00:00Z', 13], ['2026-08-31T23:30:00Z', 6], ['2026-03-15T00:00:00Z', 24], ['2028-02-29T12:00:00Z', 12]] as const) {
      const { rows } = await t.pool.query<{ ends: Date }>(`SELECT ($1::timestamptz AT TIME ZONE 'UTC' + make_interval(months => $2)) AT TIME ZONE 'UTC' AS ends`, [closed, months])
      expect(retentionEndsAt(new Date(closed), months).toISOString(), `${closed} + ${months} months`).toBe(rows[0]!.ends.toISOString())
    }
  })
})

describe('the dry run for admins', () => {
  it('lists an expired case and changes nothing; only admins may see it', async () => {
    const office = await makeOffice(t)
    const c = await closedCaseWithEvidence(office)
    // the case closed 30 months ago
    await expire(c.id)
    const before = await snapshot(c.id)
    const res = await admin.get('/api/admin/retention/dry-run')
    expect(res.status).toBe(200)
    const run = retentionRunViewSchema.parse(res.body.run)
    expect(run.dryRun).toBe(true)
    const mine = run.cases.find((x) => x.caseId === c.id)
    expect(mine).toMatchObject({ reference: c.reference, evidence: [{ objectKey: c.objectKey, sha256: sha256(c.bytes) }] })
    expect(await snapshot(c.id)).toEqual(before)
    expect(await objectExists(c.objectKey)).toBe(true)
    const sup = await signIn(t, c.supervisor!)
    expect((await sup.get('/api/admin/retention/dry-run')).status).toBe(403)
  })
})

describe('the scheduled job', () => {
  it('runs at once on start with its clock and erases the expired case of its offices', async () => {
    const office = await makeOffice(t)
    const c = await closedCaseWithEvidence(office)
    const worker = await startRetentionWorker(t.services, { queueName: `retention-test-${process.pid}-${Date.now()}`, now: after25Months, officeIds: [office.id], pollingIntervalSeconds: 0.5 })
    try {
      const deadline = Date.now() + 20_000
      let erased: string | null = null
      while (Date.now() < deadline) {
        erased = (await t.pool.query(`SELECT personal_data_erased_at FROM cases WHERE id = $1`, [c.id])).rows[0].personal_data_erased_at
        if (erased) break
        await new Promise((r) => setTimeout(r, 250))
      }
      expect(erased).not.toBeNull()
      expect(await objectExists(c.objectKey)).toBe(false)
    } finally {
      await worker.stop()
    }
  }, 30_000)
})
