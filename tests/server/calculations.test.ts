/**
 * Calculations are records: the server computes every stored number from the inputs with the
 * radio library, keeps copies of the references it used, never takes a number from the client,
 * and neither the application nor the owner can change a record afterwards. Recomputing with
 * the current library shows every output beside the stored one, and the ops check fails on a
 * record that no longer agrees with its own library version.
 */
import { execFile } from 'node:child_process'
import path from 'node:path'
import { fileURLToPath } from 'node:url'
import { promisify } from 'node:util'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import pg from 'pg'
import { createHash, randomUUID } from 'node:crypto'
import { insertEvidence } from '../../server/modules/evidence/evidence.repo'
import geographiclib from 'geographiclib-geodesic'
import { complianceVerdictOutputSchema, eirpFitOutputSchema, eirpSinglePointOutputSchema } from '../../shared/calculations'
import { assessCompliance, BAND_LIMITS, createPropagationModel, eirpFromMeasurement, RADIO_LIBRARY_VERSION } from '../../shared/radio'
import { calculationResponseSchema, calculationsResponseSchema, recomputeResponseSchema } from '../../shared/schemas/views'
import { FREE_SPACE_FIELD_ROWS } from '../fixtures/radio/propagation-free-space'
import { createTestContext, type TestContext } from '../support/harness'
import { expectAnswerMatchesDocument } from '../support/api-document'
import { makeBandLimit, makeCase, makeOffice, makeUser, signIn, type Agent, type TestCase, type TestUser } from '../support/factories'

const appUrl = inject('databaseUrl')
const ownerUrl = inject('migrationDatabaseUrl')
const sameRole = appUrl === ownerUrl
const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..')

let t: TestContext
let owner: pg.Pool
let app: pg.Pool
/** A case in field work, with its assigned investigator and the office's supervisor. */
let worked: TestCase
let investigator: Agent
let supervisor: Agent
let colleague: TestUser
let otherOfficeInvestigator: TestUser
let otherOfficeCase: TestCase

/** 74.77 dBµV/m measured 1 km away at 100 MHz, free space: register row 1-5 read backwards. */
const ROW_1_5 = FREE_SPACE_FIELD_ROWS.find((r) => r.id === '1-5')!
const eirpInputs = {
  measurement: { kind: 'field-strength', fieldStrengthDbuvPerM: `${ROW_1_5.expected} dBµV/m`, freqHz: '100 MHz' },
  distanceM: '1 km',
  model: { kind: 'free-space', freqHz: '100 MHz' },
  measurementContributions: [{ name: 'antenna calibration', distribution: { kind: 'normal', expandedUncertainty: '1.5 dB', coverageFactor: 2 } }],
  distanceUncertainty: { kind: 'rectangular', halfWidth: '20 m' },
}

const countOf = async (caseId: string) => (await owner.query<{ n: number }>(`SELECT count(*)::int AS n FROM calculations WHERE case_id = $1`, [caseId])).rows[0]!.n

function store(agent: Agent, caseId: string, body: object) {
  return agent.post(`/api/cases/${caseId}/calculations`).send(body)
}

async function opsCheck(caseId: string): Promise<{ code: number; out: string }> {
  const run = promisify(execFile)
  try {
    const { stdout } = await run(process.execPath, ['--import', 'tsx', 'ops/recompute-calculations.ts', '--case', caseId], {
      cwd: root,
      env: { ...process.env, MIGRATION_DATABASE_URL: ownerUrl },
    })
    return { code: 0, out: stdout }
  } catch (e) {
    const err = e as { code?: number; stdout?: string; stderr?: string }
    return { code: err.code ?? -1, out: `${err.stdout ?? ''}${err.stderr ?? ''}` }
  }
}

beforeAll(async () => {
  t = await createTestContext()
  owner = new pg.Pool({ connectionString: ownerUrl, max: 2 })
  app = new pg.Pool({ connectionString: appUrl, max: 2 })
  const office = await makeOffice(t)
  const otherOffice = await makeOffice(t)
  worked = await makeCase(t, { office, state: 'field_work' })
  investigator = await signIn(t, worked.investigator!)
  supervisor = await signIn(t, worked.supervisor!)
  colleague = await makeUser(t, { role: 'investigator', office })
  otherOfficeInvestigator = await makeUser(t, { role: 'investigator', office: otherOffice })
  otherOfficeCase = await makeCase(t, { office: otherOffice, state: 'field_work' })
})
afterAll(async () => {
  await t?.close()
  await owner?.end()
  await app?.end()
})

describe('storing a calculation', () => {
  it('stores the EIRP the radio library computes from the inputs, with units normalised, methods, version and author', async () => {
    const res = await store(investigator, worked.id, { kind: 'eirp_single_point', inputs: eirpInputs }).expect(201)
    const { calculation } = calculationResponseSchema.parse(res.body)
    expectAnswerMatchesDocument('POST', '/api/cases/:id/calculations', res)

    const model = createPropagationModel({ kind: 'free-space', freqHz: 100e6 })
    const direct = eirpFromMeasurement({
      measurement: { kind: 'field-strength', fieldStrengthDbuvPerM: ROW_1_5.expected, freqHz: 100e6 },
      distanceM: 1000,
      model,
      measurementContributions: [{ name: 'antenna calibration', unit: 'dB', distribution: { kind: 'normal', expandedUncertainty: 1.5, coverageFactor: 2 } }],
      distanceUncertainty: { kind: 'rectangular', halfWidth: 20 },
    })
    const value = calculation.outputs.value as Record<string, unknown>
    expect(value.eirpDbm).toBe(direct.value.eirpDbm)
    expect(value.erpDbm).toBe(direct.value.erpDbm)
    expect(value.pathLossDb).toBe(direct.value.pathLossDb)
    expect(calculation.outputs.interval).toEqual(direct.interval)
    expect(calculation.warnings).toEqual(direct.warnings)
    expect(calculation.methods.map((m) => m.id)).toEqual(['eirp-back-calculation', 'free-space-p525'])
    expect(calculation.methods.every((m) => m.source.length > 0)).toBe(true)
    expect(calculation.libraryVersion).toBe(RADIO_LIBRARY_VERSION)
    expect(calculation.author).toEqual({ id: worked.investigator!.id, name: worked.investigator!.name })
    expect(calculation.inputs).toMatchObject({ distanceM: 1000, measurement: { fieldStrengthDbuvPerM: 74.77, freqHz: 100e6 }, model: { freqHz: 100e6 } })
  })

  it('reads 74.77 dBµV/m at 1 km in free space as 30 dBm EIRP (register 1-5, ITU-R P.525-4 §2.1)', async () => {
    // the register's row runs forward (30 dBm → 74.77 dBµV/m at 1 km); the record runs it backwards
    expect(ROW_1_5.source).toMatch(/P\.525-4 §2\.1.*register 1-5/)
    const res = await store(investigator, worked.id, { kind: 'eirp_single_point', inputs: eirpInputs }).expect(201)
    const value = res.body.calculation.outputs.value as { eirpDbm: number }
    expect(Math.abs(value.eirpDbm - ROW_1_5.inputs.eirpDbm)).toBeLessThanOrEqual(ROW_1_5.tolerance)
  })

  it('stores a compliance verdict with a copy of the band-limit entry it was judged against', async () => {
    const entry = BAND_LIMITS.find((e) => e.id === 'en300328-2g4-eirp')!
    const inputs = { eirpDbm: '23 dBm', eirpIntervalDbm: { lowDbm: 21, highDbm: 25 }, limit: { source: 'band-limit', bandLimitId: entry.id } }
    const res = await store(supervisor, worked.id, { kind: 'compliance_verdict', inputs }).expect(201)
    const { calculation } = calculationResponseSchema.parse(res.body)
    const direct = assessCompliance({ eirpDbm: 23, eirpIntervalDbm: { lowDbm: 21, highDbm: 25 }, limit: entry })
    expect(calculation.outputs.value).toMatchObject({ verdict: 'exceeds', marginDb: direct.value.marginDb, appliedLimitEirpDbm: direct.value.appliedLimitEirpDbm })
    expect(calculation.outputs.interval).toEqual(direct.interval)
    expect(calculation.references.limit).toEqual({
      from: 'band-limit-reference',
      entryId: entry.id,
      title: entry.title,
      statusNote: entry.statusNote,
      spec: entry.spec,
      citation: entry.citation,
      status: 'verified',
      entryVersion: 1,
    })
    expect(calculation.methods.map((m) => m.id)).toEqual(['eirp-limit-verdict', 'applied-limit-eirp'])
  })

  it('judges against the register as the office keeps it, and keeps its copy when the register changes later', async () => {
    const own = await makeBandLimit(t, { spec: { kind: 'erp', erpDbm: 10 }, status: '[M]' })
    const editor = await signIn(t, await makeUser(t, { role: 'admin' }))
    await editor.patch(`/api/band-limits/${own.id}`).send({ changes: { spec: { kind: 'erp', erpDbm: '14 dBm' }, verified: true }, reason: 'Checked against the national table', version: 1 }).expect(200)
    const inputs = { eirpDbm: '17 dBm', limit: { source: 'band-limit', bandLimitId: own.key } }
    const res = await store(supervisor, worked.id, { kind: 'compliance_verdict', inputs }).expect(201)
    const { calculation } = calculationResponseSchema.parse(res.body)
    // ERP 14 dBm is EIRP 16.15 dBm (ERP + 2.15 dB, ITU Radio Regulations Nos. 1.161–1.162 — register 3-1): 17 dBm exceeds it by 0.85 dB
    expect(calculation.references.limit).toMatchObject({ entryId: own.key, entryVersion: 2, spec: { kind: 'erp', erpDbm: 14 }, status: 'verified' })
    expect(calculation.outputs.value).toMatchObject({ verdict: 'exceeds', appliedLimitEirpDbm: expect.closeTo(16.15, 2), marginDb: expect.closeTo(0.85, 2) })
    await editor.patch(`/api/band-limits/${own.id}`).send({ changes: { spec: { kind: 'erp', erpDbm: '20 dBm' } }, reason: 'A later revision', version: 2 }).expect(200)
    const again = await investigator.get(`/api/calculations/${calculation.id}/recompute`).expect(200)
    expect(JSON.stringify(again.body)).not.toContain('"erpDbm":20')
    const listed = calculationsResponseSchema.parse((await supervisor.get(`/api/cases/${worked.id}/calculations`).expect(200)).body)
    expect(listed.calculations.find((c) => c.id === calculation.id)!.references.limit).toMatchObject({ entryVersion: 2, spec: { kind: 'erp', erpDbm: 14 } })
  })

  it('judges a stated limit as inconclusive when the interval straddles it, and keeps the stated limit as its reference', async () => {
    const limit = { source: 'stated', spec: { kind: 'erp', erpDbm: '27 dBm' }, citation: 'Licence QB-TEST-7, condition 3' }
    const res = await store(investigator, worked.id, { kind: 'compliance_verdict', inputs: { eirpDbm: 29, eirpIntervalDbm: { lowDbm: 27, highDbm: 31 }, limit } }).expect(201)
    expect(res.body.calculation.outputs.value).toMatchObject({ verdict: 'inconclusive', appliedLimitEirpDbm: 29.15 })
    expect(res.body.calculation.references.limit).toEqual({ from: 'stated', spec: { kind: 'erp', erpDbm: 27 }, citation: 'Licence QB-TEST-7, condition 3' })
  })

  it('writes an internal timeline event naming the record', async () => {
    const res = await store(investigator, worked.id, { kind: 'eirp_single_point', inputs: eirpInputs }).expect(201)
    const { rows } = await owner.query(`SELECT kind, visibility, actor_user_id, body, data FROM case_events WHERE case_id = $1 AND data->>'calculationId' = $2`, [worked.id, res.body.calculation.id])
    expect(rows).toEqual([
      { kind: 'calculation_stored', visibility: 'internal', actor_user_id: worked.investigator!.id, body: expect.stringMatching(/^EIRP 30\.00 dBm/), data: { calculationId: res.body.calculation.id, calculationKind: 'eirp_single_point', libraryVersion: RADIO_LIBRARY_VERSION } },
    ])
  })

  it('lists the case’s records for staff of the office, oldest first', async () => {
    const res = await (await signIn(t, colleague)).get(`/api/cases/${worked.id}/calculations`).expect(200)
    const { calculations } = calculationsResponseSchema.parse(res.body)
    expect(calculations.length).toBe(await countOf(worked.id))
    const times = calculations.map((c) => c.at)
    expect(times).toEqual([...times].sort())
  })

  it('lets an administrator read them, as administrators read every case, but not store one', async () => {
    const admin = await signIn(t, await makeUser(t, { role: 'admin' }))
    const res = await admin.get(`/api/cases/${worked.id}/calculations`).expect(200)
    expect(calculationsResponseSchema.parse(res.body).calculations.length).toBe(await countOf(worked.id))
    await store(admin, worked.id, { kind: 'eirp_single_point', inputs: eirpInputs }).expect(403)
  })
})

describe('refusing', () => {
  it('refuses outputs or a result sent by the client, and stores nothing', async () => {
    const before = await countOf(worked.id)
    for (const extra of [{ outputs: { value: { eirpDbm: 10 } } }, { result: { eirpDbm: 10 } }]) {
      const res = await store(investigator, worked.id, { kind: 'eirp_single_point', inputs: eirpInputs, ...extra }).expect(400)
      expect(res.body.error.code).toBe('validation_failed')
    }
    // also inside the inputs: no key the kind does not know
    await store(investigator, worked.id, { kind: 'eirp_single_point', inputs: { ...eirpInputs, eirpDbm: 10 } }).expect(400)
    expect(await countOf(worked.id)).toBe(before)
  })

  it('refuses a number written loosely, naming the field', async () => {
    const res = await store(investigator, worked.id, { kind: 'eirp_single_point', inputs: { ...eirpInputs, distanceM: '0x10' } }).expect(400)
    expect(res.body.error.details).toEqual([{ path: 'inputs.distanceM', message: expect.stringMatching(/distance to the source/) }])
  })

  it('refuses a band-limit entry that does not exist, with a plain message', async () => {
    const res = await store(investigator, worked.id, { kind: 'compliance_verdict', inputs: { eirpDbm: 20, limit: { source: 'band-limit', bandLimitId: 'no-such-entry' } } }).expect(400)
    expect(res.body.error).toMatchObject({ code: 'calculation_refused', message: 'There is no band-limit entry "no-such-entry".' })
  })

  it('answers 404 for another office’s case, to read and to store', async () => {
    const other = await signIn(t, otherOfficeInvestigator)
    await store(other, worked.id, { kind: 'eirp_single_point', inputs: eirpInputs }).expect(404)
    await other.get(`/api/cases/${worked.id}/calculations`).expect(404)
    const mine = await store(investigator, worked.id, { kind: 'eirp_single_point', inputs: eirpInputs }).expect(201)
    const res = await other.get(`/api/calculations/${mine.body.calculation.id}/recompute`).expect(404)
    expect(res.body.error.code).toBe('calculation_not_found')
    await investigator.get(`/api/cases/${otherOfficeCase.id}/calculations`).expect(404)
  })

  it('answers 403 to a colleague who is not the assigned investigator', async () => {
    await store(await signIn(t, colleague), worked.id, { kind: 'eirp_single_point', inputs: eirpInputs }).expect(403)
  })

  it('answers 409 while the case is not being worked', async () => {
    const fresh = await makeCase(t, { office: worked.office, state: 'triaged', supervisor: worked.supervisor })
    const res = await store(supervisor, fresh.id, { kind: 'eirp_single_point', inputs: eirpInputs }).expect(409)
    expect(res.body.error.code).toBe('invalid_state')
  })
})

describe('recomputing', () => {
  it('shows every output beside the stored one, with no difference under the same library', async () => {
    const stored = await store(investigator, worked.id, { kind: 'eirp_single_point', inputs: eirpInputs }).expect(201)
    const res = await investigator.get(`/api/calculations/${stored.body.calculation.id}/recompute`).expect(200)
    const { recompute } = recomputeResponseSchema.parse(res.body)
    expectAnswerMatchesDocument('GET', '/api/calculations/:id/recompute', res)
    expect(recompute).toMatchObject({ sameLibraryVersion: true, storedLibraryVersion: RADIO_LIBRARY_VERSION, differs: false, largestRelativeDifference: 0, refused: null })
    const eirp = recompute.differences.find((d) => d.path === 'value.eirpDbm')!
    expect(eirp).toEqual({ path: 'value.eirpDbm', stored: stored.body.calculation.outputs.value.eirpDbm, now: stored.body.calculation.outputs.value.eirpDbm, relativeDifference: 0, differs: false })
    expect(recompute.differences.some((d) => d.path === 'interval.low')).toBe(true)
  })
})

describe.skipIf(sameRole)('the record in the database', () => {
  it('cannot be updated, deleted or truncated by the application', async () => {
    const [{ id }] = (await owner.query(`SELECT id FROM calculations WHERE case_id = $1 LIMIT 1`, [worked.id])).rows
    await expect(app.query(`UPDATE calculations SET outputs = '{"value": 1}' WHERE id = $1`, [id])).rejects.toThrow(/permission denied/)
    await expect(app.query(`DELETE FROM calculations WHERE id = $1`, [id])).rejects.toThrow(/permission denied/)
    await expect(app.query('TRUNCATE calculations')).rejects.toThrow(/permission denied/)
    await expect(app.query('ALTER TABLE calculations DISABLE TRIGGER calculations_append_only')).rejects.toThrow(/must be owner/)
  })

  it('cannot be changed by the owner either, while its triggers stand', async () => {
    const [{ id }] = (await owner.query(`SELECT id FROM calculations WHERE case_id = $1 LIMIT 1`, [worked.id])).rows
    await expect(owner.query(`UPDATE calculations SET warnings = '[]' WHERE id = $1`, [id])).rejects.toThrow(/append-only/)
    await expect(owner.query(`DELETE FROM calculations WHERE id = $1`, [id])).rejects.toThrow(/append-only/)
  })

  it('gets the database’s time whatever the application’s insert says', async () => {
    const c = await app.connect()
    try {
      await c.query('BEGIN')
      const { rows } = await c.query(
        `INSERT INTO calculations (case_id, kind, inputs, outputs, warnings, methods, library_version, author_user_id, at)
         VALUES ($1, 'eirp_single_point', '{}', '{}', '[]', '[]', '2.0.0', $2, '2001-02-03T04:05:06Z') RETURNING at, now() AS db_now`,
        [worked.id, worked.investigator!.id],
      )
      expect(rows[0].at.toISOString()).toBe(rows[0].db_now.toISOString())
    } finally {
      await c.query('ROLLBACK')
      c.release()
    }
  })
})

describe.skipIf(sameRole)('the ops check (ops/recompute-calculations.ts)', () => {
  it('passes a case whose records agree, fails once one is tampered with, and lists another version’s differences without failing', async () => {
    const tc = await makeCase(t, { office: worked.office, state: 'field_work', supervisor: worked.supervisor, investigator: worked.investigator })
    const stored = await store(investigator, tc.id, { kind: 'eirp_single_point', inputs: eirpInputs }).expect(201)
    await store(investigator, tc.id, { kind: 'compliance_verdict', inputs: { eirpDbm: 23, limit: { source: 'band-limit', bandLimitId: 'en300328-2g4-eirp' } } }).expect(201)
    const clean = await opsCheck(tc.id)
    expect(clean.out).toMatch(/2 record\(s\) recomputed with library .*: 0 differ under their own version, 0 differ under another version/)
    expect(clean.code).toBe(0)

    // A record made with an older library whose numbers moved: listed with both versions, no failure.
    await owner.query(
      `INSERT INTO calculations (case_id, kind, inputs, outputs, warnings, methods, library_version, author_user_id, reference_copies)
       SELECT case_id, kind, inputs, jsonb_set(outputs, '{value,eirpDbm}', '29.5'), warnings, methods, '1.0.0', author_user_id, reference_copies FROM calculations WHERE id = $1`,
      [stored.body.calculation.id],
    )
    const older = await opsCheck(tc.id)
    expect(older.code).toBe(0)
    const current = RADIO_LIBRARY_VERSION.replace(/\./g, '\\.')
    expect(older.out).toMatch(new RegExp(`differs under another library version\\n\\S+ eirp_single_point: stored with library 1\\.0\\.0, recomputed with ${current}\\n {2}value\\.eirpDbm: stored 29\\.5, now 29\\.99`))

    // Tampering: the owner lifts the append-only trigger in one transaction, changes a stored
    // output by 1e-6 relative, and puts the trigger back (which the migration role alone can do).
    const c = await owner.connect()
    try {
      await c.query('BEGIN')
      await c.query('ALTER TABLE calculations DISABLE TRIGGER calculations_append_only')
      await c.query(`UPDATE calculations SET outputs = jsonb_set(outputs, '{value,erpDbm}', to_jsonb((outputs->'value'->>'erpDbm')::float8 * (1 + 1e-6))) WHERE id = $1`, [stored.body.calculation.id])
      await c.query('ALTER TABLE calculations ENABLE TRIGGER calculations_append_only')
      await c.query('COMMIT')
    } catch (e) {
      await c.query('ROLLBACK')
      throw e
    } finally {
      c.release()
    }
    const tampered = await opsCheck(tc.id)
    expect(tampered.code).toBe(1)
    expect(tampered.out).toMatch(new RegExp(`DIFFERS under the same library version\\n${stored.body.calculation.id} eirp_single_point[^\\n]*\\n  value\\.erpDbm: stored [\\d.]+, now [\\d.]+ \\(relative difference 1\\.000e-6\\)`))
    const res = await investigator.get(`/api/calculations/${stored.body.calculation.id}/recompute`).expect(200)
    expect(res.body.recompute).toMatchObject({ sameLibraryVersion: true, differs: true })
    // and the trigger is back: the owner's plain UPDATE is refused again
    await expect(owner.query(`UPDATE calculations SET warnings = '[]' WHERE id = $1`, [stored.body.calculation.id])).rejects.toThrow(/append-only/)
  })
})

/** A measurement of the case as the form sends it: a reading through an antenna of 0 dBi, no register. */
const measurementBody = (over: Record<string, unknown> = {}) => ({
  takenAt: '2026-11-20T10:15:00Z',
  latDeg: '46.8',
  lonDeg: '7.1',
  heightM: '1.5 m',
  freqHz: '433.92 MHz',
  rbwHz: '120 kHz',
  detector: 'rms',
  reading: { unit: 'dBm', value: '-60' },
  antenna: { source: 'gain', antennaGainDbi: '0' },
  cableLossDb: '0',
  polarisation: 'vertical',
  ...over,
})

async function addMeasurement(agent: Agent, caseId: string, over: Record<string, unknown> = {}): Promise<{ id: string; derived: { isotropicReceivedPowerDbm?: number; fieldStrengthDbuvPerM?: number } }> {
  const res = await agent.post(`/api/cases/${caseId}/measurements`).send({ measurement: measurementBody(over) })
  expect(res.status, JSON.stringify(res.body)).toBe(201)
  return res.body.measurement
}

/** An authorised station of a new register version, inserted as the owner (the import route is tested with the register). */
async function addStation(limit: object, uploadedBy: string): Promise<{ id: string; version: number }> {
  const { rows } = await owner.query<{ id: string; version: number }>(
    `WITH n AS (SELECT coalesce(max(version), 0) + 1 AS version FROM station_register_versions),
     f AS (INSERT INTO stored_files (object_key, original_name, size_bytes, sha256, content_type, content_type_source, purpose, uploaded_by)
           VALUES ('calc-test/' || gen_random_uuid(), 'register.csv', 0, repeat('a', 64), 'text/csv', 'declared', 'station_register_import', $1) RETURNING id),
     v AS (INSERT INTO station_register_versions (version, imported_by, stored_file_id, file_name, sha256, delimiter, accepted_count, rejected_count, column_mapping, rejected_rows)
           SELECT n.version, $1, f.id, 'register.csv', repeat('a', 64), 'comma', 1, 0, '{"fields":{}}', '[]' FROM n, f RETURNING version)
     INSERT INTO authorised_stations (register_version, line, station_code, licensee, service, latitude_deg, longitude_deg, low_freq_hz, high_freq_hz, "limit", authorised_eirp_dbm)
     SELECT v.version, 2, 'NRV-0117', 'Harrowfield Taxi Cooperative', 'PMR', 46.8, 7.1, 433.9e6, 434e6, $2::jsonb, 32.15 FROM v RETURNING id, register_version AS version`,
    [uploadedBy, JSON.stringify(limit)],
  )
  return rows[0]!
}

describe('calculations built on stored measurements, estimates and stations', () => {
  const SOURCE = { latDeg: 46.8, lonDeg: 7.11 }

  it('takes a measurement’s level and keeps its copy (and its id) after the measurement is corrected', async () => {
    const m = await addMeasurement(investigator, worked.id)
    const inputs = { measurementId: m.id, distanceM: '100 m', model: { kind: 'free-space', freqHz: '433.92 MHz' } }
    const res = await store(investigator, worked.id, { kind: 'eirp_single_point', inputs }).expect(201)
    const { calculation } = calculationResponseSchema.parse(res.body)
    const value = eirpSinglePointOutputSchema.parse(calculation.outputs.value)
    // EIRP = P_iso + L_bf(100 m, 433.92 MHz): the library's own forward model, P_iso from the measurement's copy
    const loss = createPropagationModel({ kind: 'free-space', freqHz: 433.92e6 }).lossDb(100).value.lossDb
    expect(value.eirpDbm).toBeCloseTo(m.derived.isotropicReceivedPowerDbm! + loss, 9)
    expect(calculation.measurementIds).toEqual([m.id])
    const copy = (calculation.references.measurements as { id: string; derived: object; version: number }[])[0]!
    expect(copy).toMatchObject({ id: m.id, version: 1, derived: { isotropicReceivedPowerDbm: m.derived.isotropicReceivedPowerDbm, fieldStrengthDbuvPerM: m.derived.fieldStrengthDbuvPerM } })

    await investigator.post(`/api/measurements/${m.id}/corrections`).send({ measurement: measurementBody({ reading: { unit: 'dBm', value: '-50' } }) }).expect(201)
    const listed = calculationsResponseSchema.parse((await investigator.get(`/api/cases/${worked.id}/calculations`).expect(200)).body).calculations.find((c) => c.id === calculation.id)!
    expect(listed.references).toEqual(calculation.references)
    const again = recomputeResponseSchema.parse((await investigator.get(`/api/calculations/${calculation.id}/recompute`).expect(200)).body).recompute
    expect(again.differs).toBe(false)
  })

  it('joins a measurement’s calibration warning to the result', async () => {
    const supervisorOffice = worked.office.id
    const item = await supervisor.post(`/api/offices/${supervisorOffice}/equipment`).send({ item: { name: `Dipole ${Date.now()}`, type: 'antenna', antennaGainDbi: '2.15 dBi', calibrationDueOn: '2026-06-30' } }).expect(201)
    const m = await addMeasurement(investigator, worked.id, { antenna: { source: 'register', equipmentId: item.body.item.id } })
    const res = await store(investigator, worked.id, { kind: 'eirp_single_point', inputs: { measurementId: m.id, sourcePosition: SOURCE, model: { kind: 'free-space', freqHz: 433.92e6 } } }).expect(201)
    const { calculation } = calculationResponseSchema.parse(res.body)
    expect(calculation.warnings.some((w) => /calibrat/i.test(w))).toBe(true)
    expect((calculation.outputs.value as { distanceFrom: string }).distanceFrom).toBe('positions')
  })

  it('fits several measurements and judges a verdict on the stored estimate’s EIRP, keeping a copy of the estimate', async () => {
    // levels from P = 20 − L(1 m) − 30 log10(d) at 433.92 MHz (log-distance model, Rappaport §4.9.1), placed by GeographicLib
    const l0 = createPropagationModel({ kind: 'free-space', freqHz: 433.92e6 }).lossDb(1).value.lossDb
    const ms = []
    for (const [i, d] of [100, 300, 1000, 3000].entries()) {
      const g = geographiclib.Geodesic.WGS84.Direct(SOURCE.latDeg, SOURCE.lonDeg, 90 * i, d)
      const p = 20 - l0 - 30 * Math.log10(d)
      ms.push(await addMeasurement(investigator, worked.id, { latDeg: String(g.lat2), lonDeg: String(g.lon2), reading: { unit: 'dBm', value: String(p) } }))
    }
    const fit = await store(investigator, worked.id, { kind: 'eirp_fit', inputs: { readings: { source: 'measurements', measurementIds: ms.map((m) => m.id), sourcePosition: SOURCE }, exponent: { kind: 'free' }, refDistanceM: '1 m' } }).expect(201)
    const fitted = calculationResponseSchema.parse(fit.body).calculation
    const v = eirpFitOutputSchema.parse(fitted.outputs.value)
    expect(v.eirpDbm).toBeCloseTo(20, 3) // the reading is stored with the strict parser's digits; 1e-3 dB covers them
    expect(v.exponent).toBeCloseTo(3, 3)
    expect(fitted.measurementIds).toEqual(ms.map((m) => m.id))

    const verdict = await store(investigator, worked.id, { kind: 'compliance_verdict', inputs: { eirpCalculationId: fitted.id, limit: { source: 'stated', spec: { kind: 'eirp', eirpDbm: '17 dBm' }, citation: 'Licence condition 4' } } }).expect(201)
    const judged = calculationResponseSchema.parse(verdict.body).calculation
    const j = complianceVerdictOutputSchema.parse(judged.outputs.value)
    expect(j.marginDb).toBeCloseTo(v.eirpDbm - 17, 9) // margin = EIRP − limit, by hand
    expect(judged.references.eirpCalculation).toMatchObject({ id: fitted.id, kind: 'eirp_fit', eirpDbm: v.eirpDbm })
  })

  it('lists the evidence files its measurements were taken from, each once, and none for measurements without one', async () => {
    const evidenceRow = async (name: string) =>
      (
        await insertEvidence(
          t.services.db,
          { objectKey: `calc-test/${randomUUID()}`, originalName: name, sizeBytes: 1, sha256: createHash('sha256').update(randomUUID()).digest('hex'), contentType: 'text/csv', contentTypeSource: 'sniffed', purpose: 'evidence', uploadedBy: null },
          { caseId: worked.id, kind: 'spectrum_capture', uploaderRole: 'complainant', uploaderUserId: null, displayName: name, submittedNameJson: JSON.stringify(name) },
        )
      ).id
    const a = await evidenceRow('north-pier.csv')
    const b = await evidenceRow('south-pier.csv')
    const l0 = createPropagationModel({ kind: 'free-space', freqHz: 433.92e6 }).lossDb(1).value.lossDb
    const ms = []
    for (const [i, [d, file]] of ([[100, a], [300, b], [1000, a], [3000, undefined]] as const).entries()) {
      const g = geographiclib.Geodesic.WGS84.Direct(SOURCE.latDeg, SOURCE.lonDeg, 90 * i, d)
      ms.push(await addMeasurement(investigator, worked.id, { latDeg: String(g.lat2), lonDeg: String(g.lon2), reading: { unit: 'dBm', value: String(20 - l0 - 30 * Math.log10(d)) }, ...(file ? { evidenceFileId: file } : {}) }))
    }
    const fit = await store(investigator, worked.id, { kind: 'eirp_fit', inputs: { readings: { source: 'measurements', measurementIds: ms.map((m) => m.id), sourcePosition: SOURCE }, exponent: { kind: 'free' }, refDistanceM: '1 m' } }).expect(201)
    const fitted = calculationResponseSchema.parse(fit.body).calculation
    expect(fitted.evidenceIds).toEqual([a, b])
    const row = (await owner.query<{ evidence_ids: string[] }>(`SELECT evidence_ids FROM calculations WHERE id = $1`, [fitted.id])).rows[0]!
    expect(row.evidence_ids).toEqual([a, b])
    const single = await store(investigator, worked.id, { kind: 'eirp_single_point', inputs: { measurementId: ms[3]!.id, sourcePosition: SOURCE, model: { kind: 'free-space', freqHz: 433.92e6 } } }).expect(201)
    expect(calculationResponseSchema.parse(single.body).calculation.evidenceIds).toEqual([])
  })

  it('judges against an authorised station’s licence and keeps the station with its register version', async () => {
    const st = await addStation({ kind: 'erp', erpDbm: 30 }, worked.supervisor!.id)
    const res = await store(investigator, worked.id, { kind: 'compliance_verdict', inputs: { eirpDbm: '33 dBm', limit: { source: 'station', stationId: st.id } } }).expect(201)
    const { calculation } = calculationResponseSchema.parse(res.body)
    const v = complianceVerdictOutputSchema.parse(calculation.outputs.value)
    expect(v.appliedLimitEirpDbm).toBeCloseTo(32.15, 9) // ERP + 2.15 dB (ITU RR Nos. 1.161–1.162, register 3-1)
    expect(v.verdict).toBe('exceeds')
    expect(calculation.references.station).toMatchObject({ id: st.id, registerVersion: st.version, stationCode: 'NRV-0117' })
  })

  it('refuses measurements and calculations of another case, and an unknown station, naming each, and stores nothing', async () => {
    const theirs = await addMeasurement(await signIn(t, otherOfficeCase.investigator!), otherOfficeCase.id)
    const theirCalc = await store(await signIn(t, otherOfficeCase.investigator!), otherOfficeCase.id, { kind: 'eirp_single_point', inputs: eirpInputs }).expect(201)
    const before = await countOf(worked.id)
    const a = await store(investigator, worked.id, { kind: 'eirp_single_point', inputs: { measurementId: theirs.id, distanceM: 100, model: { kind: 'free-space', freqHz: 433.92e6 } } }).expect(400)
    expect(a.body.error).toMatchObject({ code: 'calculation_refused', message: `There is no measurement ${theirs.id} on this case.` })
    const b = await store(investigator, worked.id, { kind: 'compliance_verdict', inputs: { eirpCalculationId: theirCalc.body.calculation.id, limit: { source: 'stated', spec: { kind: 'eirp', eirpDbm: 17 }, citation: 'x' } } }).expect(400)
    expect(b.body.error.message).toBe(`There is no stored calculation ${theirCalc.body.calculation.id} on this case.`)
    const missing = '00000000-0000-4000-8000-00000000abcd'
    const c = await store(investigator, worked.id, { kind: 'compliance_verdict', inputs: { eirpDbm: 20, limit: { source: 'station', stationId: missing } } }).expect(400)
    expect(c.body.error.message).toBe(`There is no authorised station ${missing} in the licence register.`)
    expect(await countOf(worked.id)).toBe(before)
  })

  it('refuses to build on a record that gives no EIRP estimate (a verdict), naming it', async () => {
    const verdict = await store(investigator, worked.id, { kind: 'compliance_verdict', inputs: { eirpDbm: 20, limit: { source: 'stated', spec: { kind: 'eirp', eirpDbm: 17 }, citation: 'x' } } }).expect(201)
    const res = await store(investigator, worked.id, { kind: 'exposure_screening', inputs: { eirpCalculationId: verdict.body.calculation.id, freqHz: 1e8, population: 'general-public', groundReflection: false, points: { source: 'typed', distancesM: [10] } } }).expect(400)
    expect(res.body.error.message).toBe(`The stored calculation ${verdict.body.calculation.id} (compliance_verdict) gives no EIRP estimate.`)
  })

  it('refuses a fit with too few readings in the library’s words (400 calculation_refused)', async () => {
    const res = await store(investigator, worked.id, { kind: 'eirp_fit', inputs: { readings: { source: 'typed', points: [{ distanceM: 100, receivedPowerDbm: -60 }] }, exponent: { kind: 'free' }, refDistanceM: 1, refLossDb: 40 } }).expect(400)
    expect(res.body.error).toMatchObject({ code: 'calculation_refused' })
    expect(res.body.error.message).toMatch(/at least 2 readings/)
  })

  it('stores every kind and recomputes each with no difference, from the record alone', async () => {
    const m = await addMeasurement(investigator, worked.id, { bearingDeg: '90', bearingSigmaDeg: '3' })
    const base = calculationResponseSchema.parse((await store(investigator, worked.id, { kind: 'eirp_single_point', inputs: eirpInputs }).expect(201)).body).calculation
    const bodies = [
      { kind: 'eirp_fit', inputs: { readings: { source: 'typed', points: [{ distanceM: 100, receivedPowerDbm: -60 }, { distanceM: 300, receivedPowerDbm: -75 }, { distanceM: 1000, receivedPowerDbm: -88 }] }, exponent: { kind: 'free' }, refDistanceM: 1, freqHz: '433.92 MHz' } },
      { kind: 'source_locate', inputs: { observations: { source: 'typed', bearings: [{ latDeg: 46.8, lonDeg: 7.1, bearingDeg: 45 }, { latDeg: 46.8, lonDeg: 7.13, bearingDeg: 315 }, { latDeg: 46.78, lonDeg: 7.115, bearingDeg: 0 }] }, bearingSigmaDeg: 3 } },
      { kind: 'coexistence', inputs: { eirpCalculationId: base.id, distanceM: '2 km', model: { kind: 'cost231-hata', freqHz: '1800 MHz', txHeightM: 30, rxHeightM: 1.5, cityCorrectionDb: 3 }, victimNoise: { kind: 'noise-figure', bandwidthHz: '200 kHz', noiseFigureDb: 9 }, criterion: { kind: 'named', id: 'i-n-minus-10' } } },
      { kind: 'exposure_screening', inputs: { eirpCalculationId: base.id, freqHz: '100 MHz', population: 'general-public', groundReflection: true, points: { source: 'measurements', measurementIds: [m.id], sourcePosition: SOURCE } } },
      { kind: 'compliance_verdict', inputs: { eirpCalculationId: base.id, limit: { source: 'stated', spec: { kind: 'erp', erpDbm: '1 W' }, citation: 'Licence condition 2' } } },
    ]
    for (const body of bodies) {
      const res = await store(investigator, worked.id, body)
      expect(res.status, JSON.stringify(res.body)).toBe(201)
      const recompute = recomputeResponseSchema.parse((await investigator.get(`/api/calculations/${res.body.calculation.id}/recompute`).expect(200)).body).recompute
      expect(recompute.differs, `${body.kind}: ${JSON.stringify(recompute.differences.filter((d) => d.differs))}`).toBe(false)
      expect(recompute.refused).toBeNull()
      expect(recompute.differences.length).toBeGreaterThan(3)
    }
    const ops = await opsCheck(worked.id)
    expect(ops.code, ops.out).toBe(0)
  })
})
