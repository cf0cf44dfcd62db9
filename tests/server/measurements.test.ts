/**
 * The office's equipment register and a case's measurements through the API: the server derives
 * every level itself (and refuses a client that sends one), a 400 lists every problem, an edit
 * is made on the version seen and only until a calculation uses the measurement, after which a
 * correction supersedes it and the original stays; calibration warnings follow the measurement;
 * another office's records are not found; the register's history is kept and append-only.
 */
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import pg from 'pg'
import { z } from 'zod'
import {
  equipmentHistoryResponseSchema,
  equipmentListResponseSchema,
  equipmentResponseSchema,
  measurementResponseSchema,
  measurementsResponseSchema,
} from '../../shared/schemas/measurements'
import { deriveMeasurement } from '../../shared/measurements/derive'
import { measurementReferencesForCase } from '../../server/modules/measurements/measurement-references'
import { MEASUREMENT_CHAIN_ROWS } from '../fixtures/radio/chain-checks'
import { createTestContext, type TestContext } from '../support/harness'
import { makeCase, makeOffice, makeUser, signIn, type Agent, type TestCase } from '../support/factories'
import type request from 'supertest'
import { mayManageEquipment, mayReadEquipment, mayReadMeasurements, mayWriteMeasurements, measurementsAllowedIn } from '../../server/policy/equipment-policy'
import { CASE_STATES } from '../../shared/domain/case-lifecycle'

const ownerUrl = inject('migrationDatabaseUrl')

let t: TestContext
let owner: pg.Pool
let worked: TestCase
let investigator: Agent
let supervisor: Agent
let colleague: Agent
let admin: Agent
let otherInvestigator: Agent
let otherCase: TestCase
/** The investigator assigned to the other office's case. */
let otherAssigned: Agent
let antennaId: string
let analyserId: string
let expiredId: string

/** The body parses with the schema and the schema keeps all of it. */
function expectFits(schema: z.ZodType, res: request.Response, status = 200): void {
  expect(res.status, JSON.stringify(res.body)).toBe(status)
  const parsed = schema.safeParse(res.body)
  expect(parsed.success, parsed.success ? '' : z.prettifyError(parsed.error)).toBe(true)
  expect(parsed.data, 'the answer holds only what its schema declares').toEqual(res.body)
}

const LPDA = {
  name: 'Log-periodic LP-1',
  type: 'antenna',
  serial: 'LP-0001',
  antennaFactorTable: [
    { freqHz: '200 MHz', antennaFactorDbPerM: '11.0' },
    { freqHz: '300 MHz', antennaFactorDbPerM: '13.5' },
    { freqHz: '500 MHz', antennaFactorDbPerM: '17.2' },
    { freqHz: '1 GHz', antennaFactorDbPerM: '23.4' },
  ],
  minFreqHz: '200 MHz',
  maxFreqHz: '1 GHz',
  calibrationDueOn: '2030-01-31',
}
const ANALYSER = { name: 'Handheld analyser HA-9', type: 'analyser', maxInputDbm: '20 dBm', minFreqHz: '9 kHz', maxFreqHz: '6 GHz', calibrationDueOn: '2030-01-31', defaultCableLossDb: '1.5' }

/** A measurement typed as the form sends it. */
const typed = (over: Record<string, unknown> = {}) => ({
  takenAt: '2026-11-20T10:15:00Z',
  latDeg: '51.2',
  lonDeg: '-1.3',
  heightM: '1.5 m',
  freqHz: '433.92 MHz',
  rbwHz: '120 kHz',
  detector: 'rms',
  reading: { unit: 'dBµV', value: '40' },
  antenna: { source: 'register', equipmentId: antennaId },
  instrumentId: analyserId,
  cableLossDb: '3',
  polarisation: 'vertical',
  ...over,
})

const post = (agent: Agent, caseId: string, m: object) => agent.post(`/api/cases/${caseId}/measurements`).send({ measurement: m })

/** A calculation record naming the measurements (as the calculation kinds that use them will). */
async function useInCalculation(caseId: string, authorId: string, ids: string[]): Promise<void> {
  await owner.query(
    `INSERT INTO calculations (case_id, kind, inputs, outputs, warnings, methods, library_version, author_user_id, measurement_ids)
     VALUES ($1, 'compliance_verdict', '{}', '{}', '[]', '[]', '2.0.0', $2, $3)`,
    [caseId, authorId, JSON.stringify(ids)],
  )
}

beforeAll(async () => {
  t = await createTestContext()
  owner = new pg.Pool({ connectionString: ownerUrl, max: 2 })
  const office = await makeOffice(t)
  const otherOffice = await makeOffice(t)
  worked = await makeCase(t, { office, state: 'field_work' })
  investigator = await signIn(t, worked.investigator!)
  supervisor = await signIn(t, worked.supervisor!)
  colleague = await signIn(t, await makeUser(t, { role: 'investigator', office }))
  admin = await signIn(t, await makeUser(t, { role: 'admin' }))
  otherInvestigator = await signIn(t, await makeUser(t, { role: 'investigator', office: otherOffice }))
  otherCase = await makeCase(t, { office: otherOffice, state: 'field_work' })
  otherAssigned = await signIn(t, otherCase.investigator!)
  const add = async (item: object) => {
    const res = await supervisor.post(`/api/offices/${office.id}/equipment`).send({ item })
    expectFits(equipmentResponseSchema, res, 201)
    return res.body.item.id as string
  }
  antennaId = await add(LPDA)
  analyserId = await add(ANALYSER)
  expiredId = await add({ name: 'Biconical BC-2', type: 'antenna', antennaGainDbi: '1.5 dBi', calibrationDueOn: '2026-06-30' })
})
afterAll(async () => {
  await owner?.end()
  await t?.close()
})

describe('the equipment register', () => {
  it('lists the office’s items to its staff, with what the viewer may do', async () => {
    const officeId = worked.office.id
    const mine = await investigator.get(`/api/offices/${officeId}/equipment`)
    expectFits(equipmentListResponseSchema, mine)
    expect(mine.body.items.map((i: { name: string }) => i.name).sort()).toEqual(['Biconical BC-2', 'Handheld analyser HA-9', 'Log-periodic LP-1'])
    expect(mine.body.abilities).toEqual({ manage: false })
    expect((await supervisor.get(`/api/offices/${officeId}/equipment`)).body.abilities).toEqual({ manage: true })
    expect(mine.body.items.find((i: { name: string }) => i.name === 'Biconical BC-2').calibrationState).toBe('expired')
  })

  it('is not found for staff of another office, and an investigator may not add to it', async () => {
    const officeId = worked.office.id
    expect((await otherInvestigator.get(`/api/offices/${officeId}/equipment`)).status).toBe(404)
    expect((await otherInvestigator.get(`/api/equipment/${antennaId}/history`)).status).toBe(404)
    expect((await investigator.post(`/api/offices/${officeId}/equipment`).send({ item: ANALYSER })).status).toBe(403)
    expect((await admin.get(`/api/offices/${officeId}/equipment`)).status).toBe(200)
  })

  it('refuses a gain and a table together, a table whose frequencies fall, and a gain on a cable, listing each', async () => {
    const res = await supervisor.post(`/api/offices/${worked.office.id}/equipment`).send({
      item: { ...LPDA, antennaGainDbi: '5', antennaFactorTable: [LPDA.antennaFactorTable[1], LPDA.antennaFactorTable[0]] },
    })
    expect(res.status).toBe(400)
    expect(res.body.error.details.map((d: { path: string }) => d.path).sort()).toEqual(['item.antennaFactorTable.1.freqHz', 'item.antennaGainDbi'])
    const cable = await supervisor.post(`/api/offices/${worked.office.id}/equipment`).send({ item: { name: 'Cable', type: 'cable', antennaGainDbi: '3' } })
    expect(cable.body.error.details).toEqual([{ path: 'item.type', message: 'Only an antenna has a gain or an antenna-factor table.' }])
  })

  it('keeps every change in the history with its version, refuses a stale version, and the history cannot be altered', async () => {
    const first = await supervisor.patch(`/api/equipment/${expiredId}`).send({ item: { name: 'Biconical BC-2', type: 'antenna', antennaGainDbi: '1.5 dBi', calibrationDueOn: '2026-06-30', serial: 'BC-77' }, version: 1, reason: 'Serial added' })
    expectFits(equipmentResponseSchema, first)
    expect(first.body.item).toMatchObject({ version: 2, serial: 'BC-77' })
    const stale = await supervisor.patch(`/api/equipment/${expiredId}`).send({ item: { name: 'Biconical BC-2b', type: 'antenna' }, version: 1 })
    expect(stale.status).toBe(409)
    expect(stale.body.error.code).toBe('stale_version')
    const history = await investigator.get(`/api/equipment/${expiredId}/history`)
    expectFits(equipmentHistoryResponseSchema, history)
    expect(history.body.changes.map((c: { version: number }) => c.version)).toEqual([2, 1])
    expect(history.body.changes[0]).toMatchObject({ reason: 'Serial added', before: { serial: null }, after: { serial: 'BC-77' } })
    expect(history.body.changes[1].after).toMatchObject({ name: 'Biconical BC-2', antennaGainDbi: 1.5 })
    await expect(owner.query(`UPDATE equipment_changes SET reason = 'x' WHERE equipment_id = $1`, [expiredId])).rejects.toThrow()
    await expect(owner.query(`DELETE FROM equipment_changes WHERE equipment_id = $1`, [expiredId])).rejects.toThrow()
  })
})

describe('recording a measurement', () => {
  it('stores the levels the server derived, the same the shared derivation gives, with methods and equipment copies', async () => {
    const res = await post(investigator, worked.id, typed())
    expectFits(measurementResponseSchema, res, 201)
    const m = res.body.measurement
    // E = V + AF + L_cable (register 2-5, ITU Handbook on Spectrum Monitoring 2011), AF from the table by log-frequency interpolation
    const chain = MEASUREMENT_CHAIN_ROWS.find((r) => r.id === '2-5')!
    expect(chain.expected.fieldStrengthDbuvPerM).toBe(chain.inputs.readingDbuv + chain.inputs.antennaFactorDbPerM + chain.inputs.cableLossDb)
    expect(m.derived.fieldStrengthDbuvPerM).toBeCloseTo(40 + 16.17329488947475 + 3, 9) // numpy.interp on log10 f gives 16.1733 dB/m at 433.92 MHz
    expect(m.derived.antennaFactorDbPerM).toBeCloseTo(16.17329488947475, 9)
    expect(m.methods.fieldStrengthDbuvPerM.id).toBe('measurement-chain-af')
    expect(m.methods.antennaFactorDbPerM.id).toBe('antenna-factor-table-log-frequency')
    expect(m.equipment.map((e: { name: string }) => e.name)).toEqual(['Log-periodic LP-1', 'Handheld analyser HA-9'])
    expect(m.warnings).toEqual([])
    expect(m.author).toBe(worked.investigator!.name)
    expect(m).toMatchObject({ freqHz: 433.92e6, rbwHz: 120e3, heightM: 1.5, reading: { value: 40, unit: 'dBµV' }, version: 1, supersedesId: null, abilities: { edit: true, correct: true } })
    const again = deriveMeasurement({
      takenAt: m.takenAt,
      freqHz: m.freqHz,
      reading: m.reading,
      antenna: { source: 'factor', antennaFactorDbPerM: m.derived.antennaFactorDbPerM },
      cableLossDb: 3,
    })
    expect(m.derived.pfdDbwPerM2).toBeCloseTo(again.derived.pfdDbwPerM2!, 9)
    expect(m.derived.isotropicReceivedPowerDbm).toBeCloseTo(again.derived.isotropicReceivedPowerDbm!, 9)
  })

  it('refuses a client that sends derived values or any key it does not know', async () => {
    const res = await post(investigator, worked.id, { ...typed(), derived: { fieldStrengthDbuvPerM: 99 } })
    expect(res.status).toBe(400)
    expect(res.body.error.details).toEqual([expect.objectContaining({ path: 'measurement', message: expect.stringMatching(/derived/) })])
    const top = await investigator.post(`/api/cases/${worked.id}/measurements`).send({ measurement: typed(), warnings: [] })
    expect(top.status).toBe(400)
  })

  it('answers 400 listing every impossible value at once: frequency 0, negative height, a time in the future, a bad latitude', async () => {
    const future = new Date(Date.now() + 3600_000).toISOString()
    const res = await post(investigator, worked.id, typed({ freqHz: '0 MHz', heightM: '-2', takenAt: future, latDeg: '95' }))
    expect(res.status).toBe(400)
    expect(res.body.error.code).toBe('validation_failed')
    expect(res.body.error.details.map((d: { path: string }) => d.path).sort()).toEqual(['measurement.freqHz', 'measurement.heightM', 'measurement.latDeg', 'measurement.takenAt'])
    expect(res.body.error.details.find((d: { path: string }) => d.path === 'measurement.takenAt').message).toMatch(/future/)
  })

  it('answers 400 for a reading above the instrument’s input range, and for a frequency outside the antenna’s table', async () => {
    const over = await post(investigator, worked.id, typed({ reading: { unit: 'dBm', value: '25' } }))
    expect(over.status).toBe(400)
    expect(over.body.error.details).toEqual([{ path: 'measurement.reading.value', message: expect.stringMatching(/above what Handheld analyser HA-9 can take \(20 dBm/) }])
    const outside = await post(investigator, worked.id, typed({ freqHz: '150 MHz' }))
    expect(outside.body.error.details).toEqual([{ path: 'measurement.freqHz', message: expect.stringMatching(/covers 200 MHz to 1000 MHz; 150 MHz is outside it/) }])
  })

  it('refuses an antenna or instrument of another office’s register', async () => {
    const res = await post(otherAssigned, otherCase.id, typed({ instrumentId: analyserId }))
    expect(res.status).toBe(400)
    expect(res.body.error.details.map((d: { path: string }) => d.path).sort()).toEqual(['measurement.antenna.equipmentId', 'measurement.instrumentId'])
  })

  it('carries a warning for an antenna whose calibration had run out when the measurement was taken', async () => {
    const res = await post(investigator, worked.id, typed({ antenna: { source: 'register', equipmentId: expiredId } }))
    expect(res.status).toBe(201)
    expect(res.body.measurement.warnings).toEqual(['Biconical BC-2: calibration ran out on 2026-06-30, before this measurement (2026-11-20).'])
    const refs = await measurementReferencesForCase(t.services.db, worked.id, [res.body.measurement.id])
    expect(refs[0]!.warnings).toEqual(res.body.measurement.warnings)
    expect(refs[0]!.equipment.map((e) => e.calibrationDueOn)).toEqual(['2026-06-30', '2030-01-31'])
  })

  it('lets the assigned investigator and the supervisor record; a colleague and the administrator may not; another office’s case is 404', async () => {
    expect((await post(supervisor, worked.id, typed())).status).toBe(201)
    expect((await post(colleague, worked.id, typed())).status).toBe(403)
    expect((await post(admin, worked.id, typed())).status).toBe(403)
    expect((await post(otherInvestigator, worked.id, typed())).status).toBe(404)
    expect((await otherInvestigator.get(`/api/cases/${worked.id}/measurements`)).status).toBe(404)
    const list = await colleague.get(`/api/cases/${worked.id}/measurements`)
    expectFits(measurementsResponseSchema, list)
    expect(list.body.abilities).toEqual({ record: false })
    expect(list.body.measurements.every((m: { abilities: { edit: boolean } }) => !m.abilities.edit)).toBe(true)
  })
})

describe('editing and correcting', () => {
  it('edits with the version seen, and refuses a stale version with 409', async () => {
    const m = (await post(investigator, worked.id, typed())).body.measurement
    const edited = await investigator.patch(`/api/measurements/${m.id}`).send({ measurement: typed({ reading: { unit: 'dBµV', value: '42' } }), version: 1 })
    expectFits(measurementResponseSchema, edited)
    expect(edited.body.measurement.version).toBe(2)
    expect(edited.body.measurement.derived.fieldStrengthDbuvPerM).toBeCloseTo(m.derived.fieldStrengthDbuvPerM + 2, 9)
    const stale = await investigator.patch(`/api/measurements/${m.id}`).send({ measurement: typed(), version: 1 })
    expect(stale.status).toBe(409)
    expect(stale.body.error.code).toBe('stale_version')
  })

  it('refuses an edit once a calculation uses the measurement (409 measurement_in_use), and a correction supersedes it, the original kept', async () => {
    const m = (await post(investigator, worked.id, typed())).body.measurement
    await useInCalculation(worked.id, worked.investigator!.id, [m.id])
    const refused = await investigator.patch(`/api/measurements/${m.id}`).send({ measurement: typed({ reading: { unit: 'dBµV', value: '41' } }), version: 1 })
    expect(refused.status).toBe(409)
    expect(refused.body.error.code).toBe('measurement_in_use')
    expect(refused.body.error.message).toMatch(/correction/)

    const correction = await investigator.post(`/api/measurements/${m.id}/corrections`).send({ measurement: typed({ reading: { unit: 'dBµV', value: '41' } }) })
    expectFits(measurementResponseSchema, correction, 201)
    expect(correction.body.measurement.supersedesId).toBe(m.id)

    const list = (await investigator.get(`/api/cases/${worked.id}/measurements`)).body.measurements as { id: string; supersededById: string | null; version: number; reading: { value: number }; usedByCalculations: number; abilities: object }[]
    const old = list.find((x) => x.id === m.id)!
    expect(old).toMatchObject({ supersededById: correction.body.measurement.id, version: 1, reading: { value: 40 }, usedByCalculations: 1, abilities: { edit: false, correct: false } })
    const twice = await investigator.post(`/api/measurements/${m.id}/corrections`).send({ measurement: typed() })
    expect(twice.status).toBe(409)
    expect(twice.body.error.code).toBe('measurement_superseded')
  })

  it('gives the calculations helper only the named measurements of the case', async () => {
    const mine = (await post(investigator, worked.id, typed())).body.measurement
    const theirs = (await post(otherAssigned, otherCase.id, typed({ antenna: { source: 'gain', antennaGainDbi: '0' }, instrumentId: undefined }))).body.measurement
    const refs = await measurementReferencesForCase(t.services.db, worked.id, [theirs.id, mine.id, 'not-an-id'])
    expect(refs.map((r) => r.id)).toEqual([mine.id])
    expect(refs[0]).toMatchObject({ freqHz: 433.92e6, latitudeDeg: 51.2, longitudeDeg: -1.3, heightM: 1.5, resolutionBandwidthHz: 120e3, detector: 'rms', version: 1 })
    expect(refs[0]!.derived.fieldStrengthDbuvPerM).toBeCloseTo(mine.derived.fieldStrengthDbuvPerM, 9)
  })

  it('is not found to another office’s staff, for edits and corrections alike', async () => {
    const m = (await post(investigator, worked.id, typed())).body.measurement
    expect((await otherInvestigator.patch(`/api/measurements/${m.id}`).send({ measurement: typed(), version: 1 })).status).toBe(404)
    expect((await otherInvestigator.post(`/api/measurements/${m.id}/corrections`).send({ measurement: typed() })).status).toBe(404)
  })
})

describe('the demo registers', () => {
  it('give each demo office a log-periodic antenna with an antenna-factor table, an analyser and a cable; Harrowmere’s biconical has run out of calibration', async () => {
    const { rows } = await owner.query<{ office: string; name: string; type: string; table: boolean; due: string | null }>(
      `SELECT o.name AS office, e.name, e.type, e.antenna_factor_table IS NOT NULL AS table, e.calibration_due_on::text AS due
         FROM equipment e JOIN offices o ON o.id = e.office_id WHERE o.name IN ('Harrowmere', 'Kestrel Bay') ORDER BY o.name, e.name`,
    )
    for (const office of ['Harrowmere', 'Kestrel Bay']) {
      const kit = rows.filter((r) => r.office === office)
      expect(kit.some((r) => r.type === 'antenna' && r.table && r.name.startsWith('Log-periodic'))).toBe(true)
      expect(kit.some((r) => r.type === 'analyser')).toBe(true)
      expect(kit.some((r) => r.type === 'cable')).toBe(true)
    }
    expect(rows.filter((r) => r.due !== null && r.due < '2026-12-01').map((r) => `${r.office}: ${r.name}`)).toEqual(['Harrowmere: Biconical antenna BC-1'])
    const history = await owner.query<{ n: number }>(`SELECT count(*)::int AS n FROM equipment_changes c JOIN equipment e ON e.id = c.equipment_id JOIN offices o ON o.id = e.office_id WHERE o.name = 'Harrowmere'`)
    expect(history.rows[0]!.n).toBe(rows.filter((r) => r.office === 'Harrowmere').length)
  })
})

describe('the equipment and measurement policies (pure)', () => {
  const OFFICE = '00000000-0000-4000-8000-00000000000a'
  const OTHER = '00000000-0000-4000-8000-00000000000b'
  const who = (role: 'investigator' | 'supervisor' | 'admin' | 'complainant', officeId: string | null, id = '00000000-0000-4000-8000-0000000000a1') => ({ id, role, officeId })
  const assignedTo = (investigatorId: string | null) => ({ id: 'c', officeId: OFFICE, status: 'field_work' as const, investigatorId, complainantUserId: null })

  it.each([
    ['investigator of the office', who('investigator', OFFICE), true, false],
    ['supervisor of the office', who('supervisor', OFFICE), true, true],
    ['supervisor of another office', who('supervisor', OTHER), false, false],
    ['investigator of another office', who('investigator', OTHER), false, false],
    ['administrator', who('admin', null), true, true],
    ['complainant', who('complainant', null), false, false],
  ] as const)('register: the %s reads %s and manages %s', (_name, actor, reads, manages) => {
    expect(mayReadEquipment(actor, OFFICE)).toBe(reads)
    expect(mayManageEquipment(actor, OFFICE)).toBe(manages)
  })

  it.each([
    ['assigned investigator', who('investigator', OFFICE, 'inv-1'), true, true],
    ['another investigator of the office', who('investigator', OFFICE, 'inv-2'), true, false],
    ['supervisor of the office', who('supervisor', OFFICE), true, true],
    ['administrator', who('admin', null), true, false],
    ['supervisor of another office', who('supervisor', OTHER), false, false],
  ] as const)('measurements: the %s reads %s and writes %s', (_name, actor, reads, writes) => {
    expect(mayReadMeasurements(actor, assignedTo('inv-1'))).toBe(reads)
    expect(mayWriteMeasurements(actor, assignedTo('inv-1'))).toBe(writes)
  })

  it('allows writing only while the case is being worked', () => {
    expect(CASE_STATES.filter(measurementsAllowedIn)).toEqual(['assigned', 'field_work', 'returned'])
  })
})
