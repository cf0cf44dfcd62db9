/**
 * GET /api/cases/:id/nearby-cases: the other open cases of the case's office within 10 km of its
 * position, nearest first, with their geodesic distance; closed cases, farther cases and another
 * office's cases are left out; another office's staff do not find the case, complainants may not ask.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { z } from 'zod'
import request from 'supertest'
import { nearbyCasesResponseSchema, type NearbyCase } from '../../shared/schemas/nearby-cases'
import { CASE_STATE_LABELS } from '../../shared/domain/case-lifecycle'
import type { Office } from '../../server/db/schema'
import { createTestContext, type TestContext } from '../support/harness'
import { makeCase, makeOffice, makeUser, reportNear, signIn, type Agent, type TestCase } from '../support/factories'

/**
 * WGS 84 defining parameters: a = 6 378 137 m, 1/f = 298.257223563 (NIMA TR8350.2, WGS 84
 * definition; recalled from memory, and the same as GeographicLib's WGS84 constants).
 */
const WGS84_A_M = 6_378_137
const WGS84_F = 1 / 298.257223563
const WGS84_E2 = WGS84_F * (2 - WGS84_F)

/**
 * Hand computation of the distance between two points on one meridian: the meridian arc
 * ∫ M(φ) dφ with the meridian radius of curvature M(φ) = a(1 − e²)/(1 − e² sin²φ)^{3/2}
 * (the textbook formula, e.g. Snyder, USGS PP 1395, ch. 3 [chapter recalled from memory]),
 * taken at the mid latitude: for 1 km the neglected term is below a micrometre.
 */
function meridianArcM(lat1Deg: number, lat2Deg: number): number {
  const rad = Math.PI / 180
  const mid = ((lat1Deg + lat2Deg) / 2) * rad
  const mM = (WGS84_A_M * (1 - WGS84_E2)) / Math.pow(1 - WGS84_E2 * Math.sin(mid) ** 2, 1.5)
  return mM * Math.abs(lat2Deg - lat1Deg) * rad
}

/** About 1 km of latitude [deg] (the exact distance is computed by hand above). */
const ABOUT_1_KM_DEG = 0.009

let t: TestContext
let office: Office
let nextOffice: Office
let subject: TestCase
let oneKmSouth: TestCase
let fiveKmEast: TestCase
let closedNear: TestCase
let twentyKmSouth: TestCase
let otherOfficeCase: TestCase
let supervisor: Agent
let investigator: Agent
let admin: Agent
let complainant: Agent
let nextOfficeSupervisor: Agent

/** The body parses with the schema and the schema keeps all of it. */
function expectFits(res: request.Response, status = 200): NearbyCase[] {
  expect(res.status, JSON.stringify(res.body)).toBe(status)
  const parsed = nearbyCasesResponseSchema.safeParse(res.body)
  expect(parsed.success, parsed.success ? '' : z.prettifyError(parsed.error)).toBe(true)
  expect(parsed.data, 'the answer holds only what its schema declares').toEqual(res.body)
  return parsed.data!.cases
}

beforeAll(async () => {
  t = await createTestContext()
  office = await makeOffice(t)
  // another office about 5 km north: its cases lie within 10 km of this office's
  nextOffice = await makeOffice(t, { centreLatDeg: office.centreLatDeg + 0.045, centreLonDeg: office.centreLonDeg })
  const here = reportNear(office)
  const eastDeg = 5_000 / (111_320 * Math.cos((here.latDeg * Math.PI) / 180))
  const sup = await makeUser(t, { role: 'supervisor', office })
  const inv = await makeUser(t, { role: 'investigator', office })
  subject = await makeCase(t, { office, state: 'assigned', supervisor: sup, investigator: inv })
  oneKmSouth = await makeCase(t, { office, state: 'triaged', supervisor: sup, report: { latDeg: here.latDeg - ABOUT_1_KM_DEG, lonDeg: here.lonDeg } })
  fiveKmEast = await makeCase(t, { office, report: { latDeg: here.latDeg, lonDeg: here.lonDeg + eastDeg } })
  closedNear = await makeCase(t, { office, state: 'closed', supervisor: sup, investigator: inv, report: { latDeg: here.latDeg - 2 * ABOUT_1_KM_DEG, lonDeg: here.lonDeg } })
  twentyKmSouth = await makeCase(t, { office, report: { latDeg: here.latDeg - 0.18, lonDeg: here.lonDeg } })
  otherOfficeCase = await makeCase(t, { office: nextOffice })
  ;[supervisor, investigator, admin, complainant, nextOfficeSupervisor] = await Promise.all([
    signIn(t, sup),
    signIn(t, inv),
    makeUser(t, { role: 'admin' }).then((u) => signIn(t, u)),
    makeUser(t, { role: 'complainant' }).then((u) => signIn(t, u)),
    makeUser(t, { role: 'supervisor', office: nextOffice }).then((u) => signIn(t, u)),
  ])
})
afterAll(() => t.close())

describe('GET /api/cases/:id/nearby-cases', () => {
  it('lists the office’s other open cases within 10 km, nearest first, and leaves out closed, farther and other offices’ cases', async () => {
    const cases = expectFits(await supervisor.get(`/api/cases/${subject.id}/nearby-cases`))
    expect(cases.map((c) => c.reference)).toEqual([oneKmSouth.reference, fiveKmEast.reference])
    const ids = cases.map((c) => c.id)
    expect(ids).not.toContain(subject.id)
    expect(ids).not.toContain(closedNear.id)
    expect(ids).not.toContain(twentyKmSouth.id)
    expect(ids).not.toContain(otherOfficeCase.id)
    expect(cases[0]).toMatchObject({ id: oneKmSouth.id, status: 'triaged', statusLabel: CASE_STATE_LABELS.triaged })
    expect(cases[1]).toMatchObject({ id: fiveKmEast.id, status: 'received', statusLabel: CASE_STATE_LABELS.received })
    expect(cases[1]!.distanceM).toBeGreaterThan(4_900)
    expect(cases[1]!.distanceM).toBeLessThan(5_100)
  })

  it('gives the distance of a case 1 km south as the WGS 84 meridian arc computed by hand, to the metre it is rounded to', async () => {
    const [detail, nearby] = await Promise.all([supervisor.get(`/api/cases/${subject.id}`), supervisor.get(`/api/cases/${subject.id}/nearby-cases`)])
    const centre = detail.body.case as { latDeg: number; lonDeg: number }
    const near = expectFits(nearby).find((c) => c.id === oneKmSouth.id)!
    expect(near.lonDeg, 'the two points lie on one meridian').toBe(centre.lonDeg)
    const byHandM = meridianArcM(centre.latDeg, near.latDeg)
    expect(byHandM).toBeGreaterThan(990)
    expect(byHandM).toBeLessThan(1_010)
    expect(Math.abs(near.distanceM - byHandM), `${near.distanceM} m answered, ${byHandM} m by hand`).toBeLessThanOrEqual(0.5 + 1e-6)
  })

  it('answers the case’s investigator and an administrator alike', async () => {
    const asInvestigator = expectFits(await investigator.get(`/api/cases/${subject.id}/nearby-cases`))
    const asAdmin = expectFits(await admin.get(`/api/cases/${subject.id}/nearby-cases`))
    expect(asInvestigator.map((c) => c.id)).toEqual([oneKmSouth.id, fiveKmEast.id])
    expect(asAdmin).toEqual(asInvestigator)
  })

  it('lists from the other office’s side only that office’s cases', async () => {
    const cases = expectFits(await nextOfficeSupervisor.get(`/api/cases/${otherOfficeCase.id}/nearby-cases`))
    expect(cases).toEqual([])
  })

  it('returns 404 when the case belongs to another office, 403 to a complainant, 401 without a session', async () => {
    const notFound = await nextOfficeSupervisor.get(`/api/cases/${subject.id}/nearby-cases`)
    expect(notFound.status).toBe(404)
    expect(notFound.body.error.code).toBe('case_not_found')
    expect((await complainant.get(`/api/cases/${subject.id}/nearby-cases`)).status).toBe(403)
    expect((await request(t.app).get(`/api/cases/${subject.id}/nearby-cases`)).status).toBe(401)
    expect((await supervisor.get('/api/cases/not-a-case/nearby-cases')).status).toBe(404)
  })
})
