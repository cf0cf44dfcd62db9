/**
 * Offices set up by an administrator: details and an area, which route the next report.
 * Areas here lie far north (58–66° N, 5–25° E), away from the demo region and from every
 * test office's point (they lie south of 30° N), so other test files' reports never land in them.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { createTestContext, uniqueAddress, type TestContext } from '../support/harness'
import { validReport } from '../support/cases'
import { makeOffice, makeUser, signIn, uniqueWord, type Agent } from '../support/factories'
import { officeSavedResponseSchema, areaCheckResponseSchema } from '../../shared/schemas/offices'
import type { AreaGeometry } from '../../shared/schemas/region'

let t: TestContext
let admin: Agent
let supervisor: Agent

const box = (south: number, west: number, north: number, east: number): AreaGeometry => ({
  type: 'Polygon',
  coordinates: [[[west, south], [east, south], [east, north], [west, north], [west, south]]],
})
const newOffice = (over: Record<string, unknown> = {}) => ({
  name: `Office ${uniqueWord('o')}`,
  regionName: 'Northern fells',
  address: '1 Fell Road, Brackmoor',
  latDeg: 60.5,
  lonDeg: 10.5,
  timeZone: 'Europe/Oslo',
  area: box(60, 10, 61, 11),
  ...over,
})

beforeAll(async () => {
  t = await createTestContext()
  admin = await signIn(t, await makeUser(t, { role: 'admin' }))
  supervisor = await signIn(t, await makeUser(t, { role: 'supervisor', office: await makeOffice(t) }))
})
afterAll(() => t.close())

/** Files a report at the place; answers the case's office and its internal routing entries. */
async function fileAt(latDeg: number, lonDeg: number) {
  const res = await request(t.app).post('/api/reports').set('X-Forwarded-For', uniqueAddress()).send(validReport({ latDeg, lonDeg }))
  expect(res.status, JSON.stringify(res.body)).toBe(201)
  const { rows } = await t.pool.query<{ office_id: string; kind: string; body: string; data: Record<string, unknown> }>(
    `SELECT c.office_id, e.kind, e.body, e.data FROM cases c JOIN case_events e ON e.case_id = c.id WHERE c.reference = $1 AND e.kind IN ('routed', 'outside_office_areas') ORDER BY e.id`,
    [res.body.reference],
  )
  return { officeId: rows[0]!.office_id, events: rows }
}

describe('a new office with an area', () => {
  it('is created by an administrator and receives the next report filed inside its area, though another office is nearer', async () => {
    // a second office without an area stands about 20 km from the report's place; the new office's own point about 160 km
    const nearer = (await admin.post('/api/admin/offices').send(newOffice({ latDeg: 60.05, lonDeg: 11.3, area: null })).expect(201)).body
    const res = await admin.post('/api/admin/offices').send(newOffice({ latDeg: 58.6, lonDeg: 11 })).expect(201)
    const saved = officeSavedResponseSchema.parse(res.body)
    expect(saved).toEqual(res.body)
    expect(saved.warnings.map((w) => w.code)).toEqual(['position_outside_area'])
    expect(saved.office).toMatchObject({ address: '1 Fell Road, Brackmoor', timeZone: 'Europe/Oslo', version: 1, area: box(60, 10, 61, 11), abilities: { edit: true } })

    const filed = await fileAt(60.05, 10.95)
    expect(filed.officeId).toBe(saved.office.id)
    expect(filed.officeId).not.toBe(nearer.office.id)
    expect(filed.events).toEqual([expect.objectContaining({ kind: 'routed', data: expect.objectContaining({ basis: 'inside_area', holderOfficeIds: [saved.office.id] }) })])
  })

  it('leaves a report outside every area to the nearest office, with a warning on the case', async () => {
    const lone = (await admin.post('/api/admin/offices').send(newOffice({ latDeg: 64, lonDeg: 20, area: null })).expect(201)).body.office
    const filed = await fileAt(64.01, 20.01)
    expect(filed.officeId).toBe(lone.id)
    expect(filed.events.map((e) => e.kind)).toEqual(['routed', 'outside_office_areas'])
    expect(filed.events[0]!.data.basis).toBe('outside_areas')
    expect(filed.events[1]!.body).toMatch(/^Check the location: it lies outside every office's area, so the case went to the nearest office/)
  })

  it('that overlaps another is saved with a warning naming the other office, and a report in the overlap goes to the nearer one', async () => {
    const first = (await admin.post('/api/admin/offices').send(newOffice({ latDeg: 62.4, lonDeg: 15.5, area: box(62, 15, 63, 16) })).expect(201)).body.office
    const res = await admin.post('/api/admin/offices').send(newOffice({ latDeg: 62.8, lonDeg: 15.5, area: box(62.5, 15, 63.5, 16) })).expect(201)
    const [w] = res.body.warnings
    expect(w).toMatchObject({ code: 'area_overlaps', otherOfficeId: first.id, otherOfficeName: first.name })
    expect(w.overlapKm2).toBeGreaterThan(2500)
    expect(w.message).toContain('goes to whichever of')
    // in the overlap (62.5–63° N), nearer the second office's point
    expect((await fileAt(62.9, 15.5)).officeId).toBe(res.body.office.id)
    expect((await fileAt(62.55, 15.5)).officeId).toBe(first.id)
  })
})

describe('editing an office', () => {
  it('replaces its details and area, one version at a time, and audits each change', async () => {
    const { office } = (await admin.post('/api/admin/offices').send(newOffice({ latDeg: 65.5, lonDeg: 24.5, area: box(65, 24, 66, 25) })).expect(201)).body
    const edited = await admin.put(`/api/admin/offices/${office.id}`).send(newOffice({ name: office.name, address: '2 New Street', latDeg: 65.5, lonDeg: 24.5, area: box(65, 24, 66, 25.5), version: 1 })).expect(200)
    expect(edited.body.office).toMatchObject({ address: '2 New Street', version: 2, area: box(65, 24, 66, 25.5) })

    const stale = await admin.put(`/api/admin/offices/${office.id}`).send(newOffice({ name: office.name, address: 'Lost edit', latDeg: 65.5, lonDeg: 24.5, version: 1 })).expect(409)
    expect(stale.body.error.code).toBe('stale_version')
    expect((await admin.get(`/api/offices/${office.id}`).expect(200)).body.office.address).toBe('2 New Street')

    const { rows } = await t.pool.query(`SELECT action, details FROM audit_log WHERE target_id = $1 ORDER BY id`, [office.id])
    expect(rows.map((r) => r.action)).toEqual(['office.created', 'office.updated', 'office.area_changed'])
    expect(rows[1].details.changed).toEqual(['address'])
  })

  it('refuses a name another office has', async () => {
    const a = (await admin.post('/api/admin/offices').send(newOffice({ area: null })).expect(201)).body.office
    const b = (await admin.post('/api/admin/offices').send(newOffice({ area: null })).expect(201)).body.office
    expect((await admin.post('/api/admin/offices').send(newOffice({ name: a.name, area: null })).expect(409)).body.error.code).toBe('office_name_taken')
    const renamed = await admin.put(`/api/admin/offices/${b.id}`).send(newOffice({ name: a.name, area: null, version: 1 })).expect(409)
    expect(renamed.body.error.code).toBe('office_name_taken')
  })
})

describe('bad input is refused with a clear error and nothing saved', () => {
  const officesNamed = async (name: string) => (await t.pool.query('SELECT id FROM offices WHERE name = $1', [name])).rowCount

  it.each([
    ['an outline that crosses itself', { area: { type: 'Polygon', coordinates: [[[10, 60], [11, 61], [11, 60], [10, 61], [10, 60]]] } }, 'area', /^The outline crosses itself near 60.50° N, 10.50° E/],
    ['an area that is not a polygon', { area: { type: 'LineString', coordinates: [[10, 60], [11, 61]] } }, 'area.type', /^An area is a GeoJSON Polygon or MultiPolygon/],
    ['an unknown time zone', { timeZone: 'Vellmark/Harbour' }, 'timeZone', /^Choose a time zone from the list/],
    ['a latitude off the globe', { latDeg: 123 }, 'latDeg', /^Latitude is between/],
  ])('%s', async (_label, change, path, message) => {
    const body = newOffice(change)
    const res = await admin.post('/api/admin/offices').send(body).expect(400)
    expect(res.body.error.code).toBe('validation_failed')
    expect(res.body.error.details).toEqual([{ path, message: expect.stringMatching(message) }])
    expect(await officesNamed(body.name as string)).toBe(0)
  })

  it('an edit with a crossing outline leaves the office as it was', async () => {
    const { office } = (await admin.post('/api/admin/offices').send(newOffice({ latDeg: 59.5, lonDeg: 6.5, area: box(59, 6, 60, 7) })).expect(201)).body
    await admin.put(`/api/admin/offices/${office.id}`).send(newOffice({ name: office.name, area: { type: 'Polygon', coordinates: [[[6, 59], [7, 60], [7, 59], [6, 60], [6, 59]]] }, version: 1 })).expect(400)
    expect((await admin.get(`/api/offices/${office.id}`).expect(200)).body.office).toMatchObject({ version: 1, area: box(59, 6, 60, 7) })
  })
})

describe('checking an area before saving', () => {
  it('answers its size and its overlaps, ignoring the office’s own saved area', async () => {
    const { office } = (await admin.post('/api/admin/offices').send(newOffice({ latDeg: 58.5, lonDeg: 8.5, area: box(58, 8, 59, 9) })).expect(201)).body
    const res = await admin.post('/api/admin/offices/check-area').send({ area: box(58, 8, 59, 9.5), latDeg: 58.5, lonDeg: 8.5, officeId: office.id }).expect(200)
    const checked = areaCheckResponseSchema.parse(res.body)
    // a 1.5° × 1° cell from 58° N on the mean-radius sphere (R = 6 371 008.8 m): R²·Δλ·(sin 59° − sin 58°)
    // (spherical cell area, recalled from memory; the shared tests also check the method against GeographicLib)
    const rad = Math.PI / 180
    const expectedKm2 = (6371008.8 ** 2 * 1.5 * rad * (Math.sin(59 * rad) - Math.sin(58 * rad))) / 1e6
    expect(checked.areaKm2).toBeCloseTo(expectedKm2, -1)
    expect(checked.warnings).toEqual([])
    const other = await admin.post('/api/admin/offices/check-area').send({ area: box(58, 8, 59, 9.5) }).expect(200)
    expect(other.body.warnings).toEqual([expect.objectContaining({ code: 'area_overlaps', otherOfficeId: office.id })])
  })

  it('is for administrators only, as is every change of offices', async () => {
    await supervisor.post('/api/admin/offices/check-area').send({ area: box(58, 8, 59, 9) }).expect(403)
    await supervisor.post('/api/admin/offices').send(newOffice()).expect(403)
  })
})
