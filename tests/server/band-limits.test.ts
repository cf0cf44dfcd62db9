/**
 * The national band-limit list: seeded from the radio library's BAND_LIMITS, read by staff,
 * revised by supervisors and administrators with a reason and the version they saw, every
 * revision kept in an append-only history the application cannot rewrite.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { inject } from 'vitest'
import pg from 'pg'
import { BAND_LIMITS } from '../../shared/radio/compliance/band-limits'
import { bandLimitHistoryResponseSchema, bandLimitResponseSchema, bandLimitsResponseSchema, type BandLimitView } from '../../shared/schemas/views'
import { seedBandLimits } from '../../server/modules/band-limits/band-limits.seed'
import { createTestContext, type TestContext } from '../support/harness'
import { expectAnswerMatchesDocument } from '../support/api-document'
import { makeBandLimit, makeOffice, makeUser, signIn, type Agent, type TestUser } from '../support/factories'

const appUrl = inject('databaseUrl')
const ownerUrl = inject('migrationDatabaseUrl')

let t: TestContext
let supervisorUser: TestUser
let investigator: Agent
let supervisor: Agent
let admin: Agent

beforeAll(async () => {
  t = await createTestContext()
  const office = await makeOffice(t)
  supervisorUser = await makeUser(t, { role: 'supervisor', office })
  supervisor = await signIn(t, supervisorUser)
  investigator = await signIn(t, await makeUser(t, { role: 'investigator', office }))
  admin = await signIn(t, await makeUser(t, { role: 'admin' }))
})
afterAll(async () => {
  await t?.close()
})

async function listed(agent: Agent): Promise<BandLimitView[]> {
  const res = await agent.get('/api/band-limits').expect(200)
  return bandLimitsResponseSchema.parse(res.body).bandLimits
}

describe('the seeded band-limit list', () => {
  it('holds every entry of the library once, with its limit, citation and verification status', async () => {
    const byKey = new Map((await listed(investigator)).map((b) => [b.key, b]))
    const seeded = BAND_LIMITS.map((e) => byKey.get(e.id))
    expect(seeded.filter(Boolean)).toHaveLength(BAND_LIMITS.length)
    for (const [i, entry] of BAND_LIMITS.entries()) {
      expect(seeded[i], entry.id).toMatchObject({
        title: entry.title,
        bandsHz: entry.bandsHz,
        spec: entry.spec,
        citation: entry.citation,
        verified: entry.status === '[V-S]',
        statusNote: entry.statusNote,
        conditions: entry.conditions ?? null,
        version: 1,
        updatedBy: null,
      })
    }
  })

  it('keeps the values as the library writes them: 20 dBm EIRP at 2.4 GHz verified, its density unverified', async () => {
    const byKey = new Map((await listed(investigator)).map((b) => [b.key, b]))
    expect(byKey.get('en300328-2g4-eirp')).toMatchObject({ bandsHz: [{ lowHz: 2_400_000_000, highHz: 2_483_500_000 }], spec: { kind: 'eirp', eirpDbm: 20 }, verified: true })
    expect(byKey.get('en300328-2g4-psd')).toMatchObject({ spec: { kind: 'eirp-density', eirpDensityDbm: 10, referenceBandwidthHz: 1_000_000 }, verified: false })
    // 125 mW written as dBm, exactly as the library computes it
    expect(byKey.get('cfr47-15-407-unii1-ap-elevation')!.spec).toEqual({ kind: 'eirp', eirpDbm: 10 * Math.log10(125) })
    // the gain rule keeps its own citation
    expect(byKey.get('cfr47-15-247-2g4-ptp')!.spec).toMatchObject({ gainRule: { kind: 'reduce-conducted-above', thresholdGainDbi: 6, reductionDbPerDb: 1 / 3, citation: expect.stringContaining('§15.247(c)(1)(i)') } })
  })

  it('adds nothing at a second start, and leaves an edited entry as it was edited', async () => {
    const own = await makeBandLimit(t)
    await supervisor.patch(`/api/band-limits/${own.id}`).send({ changes: { title: 'Edited title' }, reason: 'Clearer wording', version: 1 }).expect(200)
    expect(await seedBandLimits(t.services.db)).toBe(0)
    const entry = { id: own.key, title: 'Library title', bandsHz: [{ lowHz: 1e9, highHz: 2e9 }], spec: { kind: 'erp' as const, erpDbm: 0 }, citation: 'x', status: '[V-S]' as const, statusNote: 'x' }
    expect(await seedBandLimits(t.services.db, [entry])).toBe(0)
    expect((await listed(admin)).find((b) => b.id === own.id)).toMatchObject({ title: 'Edited title', version: 2 })
  })
})

describe('PATCH /api/band-limits/:id', () => {
  it('changes the limit, bumps the version and names the editor', async () => {
    const own = await makeBandLimit(t)
    const res = await supervisor
      .patch(`/api/band-limits/${own.id}`)
      .send({ changes: { spec: { kind: 'erp', erpDbm: '14 dBm' }, bandsHz: [{ lowHz: '433.05 MHz', highHz: '434.79 MHz' }], verified: true }, reason: 'Checked against the published table', version: 1 })
      .expect(200)
    const { bandLimit } = bandLimitResponseSchema.parse(res.body)
    expectAnswerMatchesDocument('PATCH', '/api/band-limits/:id', res)
    expect(bandLimit).toMatchObject({ spec: { kind: 'erp', erpDbm: 14 }, bandsHz: [{ lowHz: 433_050_000, highHz: 434_790_000 }], verified: true, version: 2, updatedBy: supervisorUser.name })
  })

  it('keeps the old value in the history with who changed it, when and why', async () => {
    const own = await makeBandLimit(t, { spec: { kind: 'erp', erpDbm: 10 }, status: '[M]' })
    await supervisor.patch(`/api/band-limits/${own.id}`).send({ changes: { spec: { kind: 'erp', erpDbm: 14 }, verified: true, title: own.title }, reason: 'New national table', version: 1 }).expect(200)
    const history = bandLimitHistoryResponseSchema.parse((await investigator.get(`/api/band-limits/${own.id}/history`).expect(200)).body).changes
    expect(history).toHaveLength(1)
    // the unchanged title is not part of the change
    expect(history[0]).toMatchObject({
      by: supervisorUser.name,
      reason: 'New national table',
      version: 2,
      before: { spec: { kind: 'erp', erpDbm: 10 }, verified: false },
      after: { spec: { kind: 'erp', erpDbm: 14 }, verified: true },
    })
    expect(Object.keys(history[0]!.after).sort()).toEqual(['spec', 'verified'])
    expect(Date.now() - Date.parse(history[0]!.at)).toBeLessThan(60_000)
  })

  it('lists the history newest first', async () => {
    const own = await makeBandLimit(t)
    await admin.patch(`/api/band-limits/${own.id}`).send({ changes: { citation: 'Second citation' }, reason: 'First fix', version: 1 }).expect(200)
    await supervisor.patch(`/api/band-limits/${own.id}`).send({ changes: { citation: 'Third citation' }, reason: 'Second fix', version: 2 }).expect(200)
    const history = bandLimitHistoryResponseSchema.parse((await admin.get(`/api/band-limits/${own.id}/history`).expect(200)).body).changes
    expect(history.map((c) => [c.reason, c.before.citation, c.after.citation])).toEqual([
      ['Second fix', 'Second citation', 'Third citation'],
      ['First fix', 'Test citation, clause 1', 'Second citation'],
    ])
  })

  it('answers 409 stale_version to an edit made on an older version, and changes nothing', async () => {
    const own = await makeBandLimit(t)
    await supervisor.patch(`/api/band-limits/${own.id}`).send({ changes: { citation: 'First' }, reason: 'One', version: 1 }).expect(200)
    const res = await admin.patch(`/api/band-limits/${own.id}`).send({ changes: { citation: 'Second' }, reason: 'Two', version: 1 }).expect(409)
    expect(res.body.error.code).toBe('stale_version')
    expect((await listed(admin)).find((b) => b.id === own.id)).toMatchObject({ citation: 'First', version: 2 })
  })

  it('answers 403 to an investigator, who reads the list but may not change it', async () => {
    const own = await makeBandLimit(t)
    const res = await investigator.patch(`/api/band-limits/${own.id}`).send({ changes: { citation: 'Mine' }, reason: 'Because', version: 1 }).expect(403)
    expect(res.body.error.code).toBe('forbidden')
    expect((await listed(investigator)).find((b) => b.id === own.id)).toMatchObject({ citation: own.citation, version: 1 })
  })

  it('answers 400 with a message per field for numbers that are not numbers or carry the wrong unit', async () => {
    const own = await makeBandLimit(t)
    const res = await supervisor
      .patch(`/api/band-limits/${own.id}`)
      .send({ changes: { bandsHz: [{ lowHz: '0x10', highHz: '434.79 mHz' }], spec: { kind: 'erp', erpDbm: '14 W' } }, reason: 'Typo test', version: 1 })
      .expect(400)
    expect(res.body.error.code).toBe('validation_failed')
    const paths = Object.fromEntries((res.body.error.details as { path: string; message: string }[]).map((d) => [d.path, d.message]))
    expect(paths['changes.bandsHz.0.lowHz']).toMatch(/decimal number/)
    expect(paths['changes.bandsHz.0.highHz']).toMatch(/Use one of these units/)
    expect(paths['changes.spec.erpDbm']).toMatch(/Use one of these units.*dBm/)
  })

  it('answers 400 for a range whose upper edge is below its lower edge, a missing reason and an unknown field', async () => {
    const own = await makeBandLimit(t)
    const res = await supervisor
      .patch(`/api/band-limits/${own.id}`)
      .send({ changes: { bandsHz: [{ lowHz: '2 GHz', highHz: '1 GHz' }], colour: 'red' }, reason: '  ', version: 1 })
      .expect(400)
    const paths = (res.body.error.details as { path: string }[]).map((d) => d.path)
    expect(paths).toEqual(expect.arrayContaining(['changes.bandsHz.0.highHz', 'reason', 'changes']))
  })

  it('answers 400 no_change when every value sent is the one stored', async () => {
    const own = await makeBandLimit(t)
    const res = await supervisor.patch(`/api/band-limits/${own.id}`).send({ changes: { title: own.title, spec: own.spec }, reason: 'Nothing', version: 1 }).expect(400)
    expect(res.body.error.code).toBe('no_change')
  })

  it('answers 404 for an entry that does not exist', async () => {
    const res = await supervisor.patch('/api/band-limits/00000000-0000-4000-8000-000000000000').send({ changes: { citation: 'x' }, reason: 'x', version: 1 }).expect(404)
    expect(res.body.error.code).toBe('band_limit_not_found')
  })
})

describe('the band-limit history in the database', () => {
  let app: pg.Pool
  let owner: pg.Pool
  let bandLimitId: string
  beforeAll(async () => {
    app = new pg.Pool({ connectionString: appUrl, max: 2 })
    owner = new pg.Pool({ connectionString: ownerUrl, max: 1 })
    bandLimitId = (await makeBandLimit(t)).id
    await supervisor.patch(`/api/band-limits/${bandLimitId}`).send({ changes: { citation: 'Kept' }, reason: 'To be kept', version: 1 }).expect(200)
  })
  afterAll(async () => {
    await app?.end()
    await owner?.end()
  })

  it.skipIf(appUrl === ownerUrl)('may not be updated, deleted or truncated by the application role', async () => {
    await expect(app.query(`UPDATE band_limit_changes SET reason = 'rewritten' WHERE band_limit_id = $1`, [bandLimitId])).rejects.toThrow(/permission denied/)
    await expect(app.query(`DELETE FROM band_limit_changes WHERE band_limit_id = $1`, [bandLimitId])).rejects.toThrow(/permission denied/)
    await expect(app.query('TRUNCATE band_limit_changes')).rejects.toThrow(/permission denied/)
    const { rows } = await owner.query(`SELECT reason FROM band_limit_changes WHERE band_limit_id = $1`, [bandLimitId])
    expect(rows).toEqual([{ reason: 'To be kept' }])
  })

  it('refuses a change even to the owner', async () => {
    await expect(owner.query(`UPDATE band_limit_changes SET reason = 'rewritten' WHERE band_limit_id = $1`, [bandLimitId])).rejects.toThrow(/append-only/)
  })

  it('gets the database time on an entry the application writes, whatever the insert says', async () => {
    const c = await app.connect()
    try {
      await c.query('BEGIN')
      const { rows } = await c.query(
        `INSERT INTO band_limit_changes (band_limit_id, changed_at, changed_by, reason, version, before, after)
         VALUES ($1, '2001-02-03T04:05:06Z', $2, 'Back-dated', 9, '{}', '{}') RETURNING changed_at, now() AS db_now`,
        [bandLimitId, supervisorUser.id],
      )
      expect(rows[0].changed_at.toISOString()).toBe(rows[0].db_now.toISOString())
    } finally {
      await c.query('ROLLBACK')
      c.release()
    }
  })
})
