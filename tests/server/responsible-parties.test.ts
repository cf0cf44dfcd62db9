/**
 * The responsible party and proof of notice: the party's record keeps every version; notices
 * (date and method required, "other" described) and replies are append-only records with a
 * timeline entry each; only staff of the case's office record them (another office 404,
 * complainant 403); bad input answers 400 naming every field.
 */
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import pg from 'pg'
import { responsiblePartyResponseSchema } from '../../shared/schemas/follow-ups'
import { createTestContext, type TestContext } from '../support/harness'
import { expectAnswerMatchesDocument } from '../support/api-document'
import { makeCase, makeOffice, makeUser, signIn } from '../support/factories'
import { dayFromToday } from '../support/factories'

let t: TestContext
let owner: pg.Pool
beforeAll(async () => {
  t = await createTestContext()
  owner = new pg.Pool({ connectionString: inject('migrationDatabaseUrl'), max: 1 })
})
afterAll(async () => {
  await t?.close()
  await owner?.end()
})

const paths = (res: { body: { error: { details: { path: string }[] } } }) => res.body.error.details.map((d) => d.path).sort()

describe('the responsible party', () => {
  it('keeps each edit as a new version, the latest current, with timeline entries', async () => {
    const office = await makeOffice(t)
    const c = await makeCase(t, { office, state: 'field_work' })
    const inv = await signIn(t, c.investigator!)
    const first = await inv.post(`/api/cases/${c.id}/responsible-party`).send({ name: 'Harbour boat club', address: '3 Quay Row, Harrowmere', phone: '' })
    expect(first.status, JSON.stringify(first.body)).toBe(201)
    const second = await inv.post(`/api/cases/${c.id}/responsible-party`).send({ name: 'Harbour Boat Club Ltd', email: 'secretary@boatclub.example' })
    expect(second.status).toBe(201)
    const body = responsiblePartyResponseSchema.parse(second.body)
    expectAnswerMatchesDocument('POST', '/api/cases/:id/responsible-party', second)
    expect(body.current).toMatchObject({ version: 2, name: 'Harbour Boat Club Ltd', email: 'secretary@boatclub.example', address: null, recordedBy: c.investigator!.name })
    expect(body.earlier).toEqual([expect.objectContaining({ version: 1, name: 'Harbour boat club', address: '3 Quay Row, Harrowmere', phone: null })])
    expect(body.abilities.record).toBe(true)
    const { rows } = await t.pool.query(`SELECT kind FROM case_events WHERE case_id = $1 AND kind = 'party_recorded'`, [c.id])
    expect(rows).toHaveLength(2)
  })

  it('refuses a record without a name or any way to reach them', async () => {
    const office = await makeOffice(t)
    const c = await makeCase(t, { office, state: 'assigned' })
    const sup = await signIn(t, c.supervisor!)
    const res = await sup.post(`/api/cases/${c.id}/responsible-party`).send({ name: '', email: 'not-an-address' })
    expect(res.status).toBe(400)
    expect(paths(res)).toEqual(['email', 'name'])
    const none = await sup.post(`/api/cases/${c.id}/responsible-party`).send({ name: 'Someone' })
    expect(none.status).toBe(400)
    expect(none.body.error.details[0].message).toMatch(/at least one way to reach them/)
  })
})

describe('notices and replies', () => {
  it('records a notice with its date, method and reference, and a reply to it', async () => {
    const office = await makeOffice(t)
    const c = await makeCase(t, { office, state: 'field_work' })
    const inv = await signIn(t, c.investigator!)
    expect((await inv.post(`/api/cases/${c.id}/notices`).send({ servedOn: dayFromToday(0), method: 'registered_post', summary: 'Replace the amplifier within 7 days.' })).status).toBe(400) // no party yet
    await inv.post(`/api/cases/${c.id}/responsible-party`).send({ name: 'R. Marlow', address: '12 Fen Lane' }).expect(201)
    const n = await inv.post(`/api/cases/${c.id}/notices`).send({ servedOn: dayFromToday(-1), method: 'registered_post', reference: 'RP 4471 0093', summary: 'Replace the amplifier within 7 days.' })
    expect(n.status, JSON.stringify(n.body)).toBe(201)
    const notice = responsiblePartyResponseSchema.parse(n.body).notices[0]!
    expectAnswerMatchesDocument('POST', '/api/cases/:id/notices', n)
    expect(notice).toMatchObject({ servedOn: dayFromToday(-1), method: 'registered_post', methodLabel: 'Registered post', reference: 'RP 4471 0093', servedBy: c.investigator!.name, evidenceId: null })
    const other = await inv.post(`/api/cases/${c.id}/notices`).send({ servedOn: dayFromToday(0), method: 'other', methodOther: 'Left with the harbour master', servedBy: 'Officer K. Dunmore', summary: 'Second notice' })
    expect(other.status).toBe(201)
    const r = await inv.post(`/api/cases/${c.id}/party-replies`).send({ receivedOn: dayFromToday(0), noticeId: notice.id, summary: 'The owner has ordered a new amplifier.' })
    expect(r.status, JSON.stringify(r.body)).toBe(201)
    const body = responsiblePartyResponseSchema.parse(r.body)
    expectAnswerMatchesDocument('POST', '/api/cases/:id/party-replies', r)
    expect(body.notices).toHaveLength(2)
    expect(body.replies).toEqual([expect.objectContaining({ noticeId: notice.id, summary: 'The owner has ordered a new amplifier.' })])
    const { rows } = await t.pool.query<{ kind: string; body: string }>(`SELECT kind, body FROM case_events WHERE case_id = $1 AND kind IN ('notice_served', 'party_reply') ORDER BY id`, [c.id])
    expect(rows.map((e) => e.kind)).toEqual(['notice_served', 'notice_served', 'party_reply'])
    expect(rows[0]!.body).toContain('Registered post')
    expect(rows[1]!.body).toContain('Left with the harbour master')
  })

  it('refuses a notice without a date or method, "other" without a description, a future date, and a file or notice of no such record', async () => {
    const office = await makeOffice(t)
    const c = await makeCase(t, { office, state: 'field_work' })
    const inv = await signIn(t, c.investigator!)
    await inv.post(`/api/cases/${c.id}/responsible-party`).send({ name: 'R. Marlow', phone: '+00 555 0100' }).expect(201)
    const missing = await inv.post(`/api/cases/${c.id}/notices`).send({ summary: 'Replace it' })
    expect(missing.status).toBe(400)
    expect(paths(missing)).toEqual(['method', 'servedOn'])
    expect(missing.body.error.details.find((d: { path: string }) => d.path === 'servedOn').message).toBe('Enter the day it was served.')
    const other = await inv.post(`/api/cases/${c.id}/notices`).send({ servedOn: 'yesterday', method: 'other', summary: 'Replace it' })
    expect(paths(other)).toEqual(['methodOther', 'servedOn'])
    const yearZero = await inv.post(`/api/cases/${c.id}/notices`).send({ servedOn: '0000-01-01', method: 'email', summary: 'Replace it' })
    expect(yearZero.status).toBe(400)
    expect(yearZero.body.error.details).toEqual([{ path: 'servedOn', message: 'Check the year: the date must lie between 1970 and 2199.' }])
    const future = await inv.post(`/api/cases/${c.id}/notices`).send({ servedOn: dayFromToday(5), method: 'email', summary: 'Replace it' })
    expect(future.status).toBe(400)
    expect(future.body.error.details[0].message).toMatch(/future/)
    const noFile = await inv.post(`/api/cases/${c.id}/notices`).send({ servedOn: dayFromToday(0), method: 'email', summary: 'Replace it', evidenceId: '00000000-0000-4000-8000-000000000000' })
    expect(paths(noFile)).toEqual(['evidenceId'])
    const noNotice = await inv.post(`/api/cases/${c.id}/party-replies`).send({ receivedOn: dayFromToday(0), noticeId: '00000000-0000-4000-8000-000000000000', summary: 'A reply' })
    expect(paths(noNotice)).toEqual(['noticeId'])
    const { rows } = await t.pool.query(`SELECT count(*)::int AS n FROM party_notices WHERE case_id = $1`, [c.id])
    expect(rows[0].n).toBe(0)
  })

  it('links a notice to a file of the same case, never to another case’s file or a removed one', async () => {
    const office = await makeOffice(t)
    const c = await makeCase(t, { office, state: 'field_work' })
    const other = await makeCase(t, { office, state: 'assigned', supervisor: c.supervisor })
    const inv = await signIn(t, c.investigator!)
    await inv.post(`/api/cases/${c.id}/responsible-party`).send({ name: 'R. Marlow', phone: '+00 555 0100' }).expect(201)
    /** An evidence row as the upload would leave it (the object itself is not needed here). */
    const evidenceOf = async (caseId: string, removed = false) => {
      const { rows: [f] } = await owner.query<{ id: string }>(
        `INSERT INTO stored_files (object_key, original_name, size_bytes, sha256, content_type, content_type_source, purpose, uploaded_by)
         VALUES ($1, 'receipt.pdf', 10, $2, 'application/pdf', 'sniffed', 'evidence', $3) RETURNING id`,
        [`test/${crypto.randomUUID()}`, 'b'.repeat(64), c.investigator!.id],
      )
      const { rows: [e] } = await owner.query<{ id: string }>(
        `INSERT INTO evidence_files (case_id, stored_file_id, kind, uploader_role, uploader_user_id, display_name, submitted_name_json${removed ? ', removed_at, removed_by, removed_reason' : ''})
         VALUES ($1, $2, 'document', 'staff', $3, 'receipt.pdf', '"receipt.pdf"'${removed ? ", now(), $3, 'Wrong file'" : ''}) RETURNING id`,
        [caseId, f!.id, c.investigator!.id],
      )
      return e!.id
    }
    const notice = (evidenceId: string) => ({ servedOn: dayFromToday(0), method: 'registered_post', summary: 'Replace it', evidenceId })
    expect((await inv.post(`/api/cases/${c.id}/notices`).send(notice(await evidenceOf(other.id)))).status).toBe(400)
    expect((await inv.post(`/api/cases/${c.id}/notices`).send(notice(await evidenceOf(c.id, true)))).status).toBe(400)
    const own = await evidenceOf(c.id)
    const ok = await inv.post(`/api/cases/${c.id}/notices`).send(notice(own))
    expect(ok.status, JSON.stringify(ok.body)).toBe(201)
    expect(ok.body.notices[0].evidenceId).toBe(own)
  })

  it('answers 404 to another office, 403 to a complainant, and lets an administrator read but not record', async () => {
    const office = await makeOffice(t)
    const c = await makeCase(t, { office, state: 'assigned' })
    const stranger = await signIn(t, await makeUser(t, { role: 'investigator', office: await makeOffice(t) }))
    expect((await stranger.get(`/api/cases/${c.id}/responsible-party`)).status).toBe(404)
    expect((await stranger.post(`/api/cases/${c.id}/responsible-party`).send({ name: 'Someone', phone: '1' })).status).toBe(404)
    const complainant = await signIn(t, await makeUser(t, { role: 'complainant' }))
    expect((await complainant.get(`/api/cases/${c.id}/responsible-party`)).status).toBe(403)
    const admin = await signIn(t, await makeUser(t, { role: 'admin' }))
    const read = await admin.get(`/api/cases/${c.id}/responsible-party`)
    expect(read.status).toBe(200)
    expect(read.body.abilities.record).toBe(false)
    expect((await admin.post(`/api/cases/${c.id}/responsible-party`).send({ name: 'Admin', phone: '1' })).status).toBe(403)
  })

  it('keeps the records append-only in the database', async () => {
    const office = await makeOffice(t)
    const c = await makeCase(t, { office, state: 'assigned' })
    const sup = await signIn(t, c.supervisor!)
    await sup.post(`/api/cases/${c.id}/responsible-party`).send({ name: 'R. Marlow', phone: '+00 555 0100' }).expect(201)
    await sup.post(`/api/cases/${c.id}/notices`).send({ servedOn: dayFromToday(0), method: 'in_person', summary: 'Switch it off' }).expect(201)
    for (const sql of [
      `UPDATE responsible_parties SET name = 'Changed' WHERE case_id = $1`,
      `DELETE FROM party_notices WHERE case_id = $1`,
      `UPDATE party_notices SET served_on = '2000-01-01' WHERE case_id = $1`,
    ]) {
      await expect(t.pool.query(sql, [c.id]), sql).rejects.toThrow()
      await expect(owner.query(sql, [c.id]), `${sql} (as the owner)`).rejects.toThrow()
    }
  })
})
