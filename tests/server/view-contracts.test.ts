/**
 * Every main answer of the API, as a browser receives it, fits its schema in
 * shared/schemas/views.ts exactly: nothing missing or of another type (the parse fails), and
 * nothing the schema does not declare (the parse drops it, and the result differs from the body).
 * A presenter that drifts from its schema fails here.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { z } from 'zod'
import { meResponseSchema, signedInSchema } from '../../shared/schemas/auth'
import { legalHoldResponseSchema, retentionRunResponseSchema, retentionSettingResponseSchema } from '../../shared/schemas/retention'
import {
  casePageSchema,
  caseResponseSchema,
  complainantReportResponseSchema,
  investigatorsResponseSchema,
  mergeCandidatesResponseSchema,
  myReportsResponseSchema,
  officeResponseSchema,
  officesResponseSchema,
  staffListResponseSchema,
  staffMemberResponseSchema,
  submittedReportSchema,
  transferOfficesResponseSchema,
  usersResponseSchema,
} from '../../shared/schemas/views'
import { createTestContext, uniqueAddress, type TestContext } from '../support/harness'
import { caseVersion, fileReport, validReport } from '../support/cases'
import { makeOffice, makeUser, reportNear, signIn, type Agent, type TestUser } from '../support/factories'
import type { Office } from '../../server/db/schema'
import { findingsResponseSchema } from '../../shared/schemas/findings'
import { caseFollowUpsResponseSchema, dueFollowUpsResponseSchema, followUpViewSchema, myEmailsResponseSchema, responsiblePartyResponseSchema } from '../../shared/schemas/follow-ups'
import { auditPageSchema } from '../../shared/schemas/audit'
import { personChangedResponseSchema, trackingLinksRevokedResponseSchema } from '../../shared/schemas/people'
import { expectAnswerFitsItsRoute } from '../support/api-document'

let t: TestContext
let office: Office
let users: Record<'supervisor' | 'investigator' | 'admin' | 'complainant', TestUser>
let supervisor: Agent
let investigator: Agent
let admin: Agent
let complainant: Agent
/** A report filed beside this file's own office. */
const fileHere = () => fileReport(t, reportNear(office))

beforeAll(async () => {
  t = await createTestContext()
  office = await makeOffice(t)
  await makeOffice(t) // another office to be offered for a transfer
  users = {
    supervisor: await makeUser(t, { role: 'supervisor', office }),
    investigator: await makeUser(t, { role: 'investigator', office }),
    admin: await makeUser(t, { role: 'admin' }),
    complainant: await makeUser(t, { role: 'complainant' }),
  }
  ;[supervisor, investigator, admin, complainant] = await Promise.all([signIn(t, users.supervisor), signIn(t, users.investigator), signIn(t, users.admin), signIn(t, users.complainant)])
})
afterAll(() => t.close())

/** The body parses with the schema and the schema keeps all of it. */
function expectFits(schema: z.ZodType, res: request.Response, status = 200): void {
  expect(res.status, JSON.stringify(res.body)).toBe(status)
  const parsed = schema.safeParse(res.body)
  expect(parsed.success, parsed.success ? '' : z.prettifyError(parsed.error)).toBe(true)
  expect(parsed.data, 'the answer holds only what its schema declares').toEqual(res.body)
  // and the API document (GET /api/openapi.json) says the same of it
  expectAnswerFitsItsRoute(res)
}

describe('the answers of the API fit their view schemas', () => {
  it('a filed report, and the complainant’s view of it through the tracking link', async () => {
    const filed = await request(t.app).post('/api/reports').set('X-Forwarded-For', uniqueAddress()).send(validReport(reportNear(office)))
    expectFits(submittedReportSchema, filed, 201)
    const token = /\/track\/([A-Za-z0-9_-]+)$/.exec(filed.body.trackingUrl)![1]!
    expectFits(complainantReportResponseSchema, await request(t.app).get(`/api/track/${token}`).set('X-Forwarded-For', uniqueAddress()))
  })

  it('the case list, a case with its timeline, and the choices a supervisor is offered', async () => {
    const f = await fileHere()
    const triaged = await supervisor.post(`/api/cases/${f.id}/triage`).send({ version: await caseVersion(t.pool, f.id), priority: 2, note: 'Outage at home, licensed network.' })
    expectFits(caseResponseSchema, triaged)
    expect(triaged.body.case.timeline.length, 'the case has a timeline to check').toBeGreaterThan(1)
    expectFits(casePageSchema, await supervisor.get('/api/cases?pageSize=5'))
    expectFits(mergeCandidatesResponseSchema, await supervisor.get(`/api/cases/${f.id}/merge-candidates`))
    expectFits(investigatorsResponseSchema, await supervisor.get(`/api/cases/${f.id}/investigators`))
    expectFits(transferOfficesResponseSchema, await supervisor.get(`/api/cases/${f.id}/transfer-offices`))
  })

  it('a closed case with its resolution, as the investigator sees it', async () => {
    const f = await fileHere()
    const investigatorId = users.investigator.id
    const step = async (agent: typeof supervisor, path: string, body: Record<string, unknown>) =>
      agent.post(`/api/cases/${f.id}/${path}`).send({ version: await caseVersion(t.pool, f.id), ...body })
    for (const [agent, path, body] of [
      [supervisor, 'triage', { priority: 3 }],
      [supervisor, 'assign', { investigatorId }],
      [investigator, 'start-field-work', {}],
      [investigator, 'propose-finding', { sourceDescription: 'A faulty masthead amplifier', recommendedAction: 'advise_operator', summary: 'A faulty amplifier two houses away.' }],
      [supervisor, 'close', { resolution: 'source_corrected', reason: 'The owner replaced the amplifier.' }],
    ] as const) {
      expect((await step(agent, path, body)).status, path).toBe(200)
    }
    const detail = await investigator.get(`/api/cases/${f.id}`)
    expectFits(caseResponseSchema, detail)
    expect(detail.body.case.resolution).toBe('source_corrected')
    const findings = await investigator.get(`/api/cases/${f.id}/findings`)
    expectFits(findingsResponseSchema, findings)
    expect(findings.body.current.review.outcome).toBe('approved')
  })

  it('offices, staff and users', async () => {
    const offices = await supervisor.get('/api/offices')
    expectFits(officesResponseSchema, offices)
    expectFits(officeResponseSchema, await supervisor.get(`/api/offices/${offices.body.offices[0].id}`))
    const staff = await supervisor.get('/api/staff')
    expectFits(staffListResponseSchema, staff)
    expectFits(staffMemberResponseSchema, await supervisor.get(`/api/staff/${staff.body.staff[0].id}`))
    expectFits(usersResponseSchema, await admin.get('/api/admin/users'))
  })

  it('moving a person and closing a case’s tracking links', async () => {
    const moved = await makeUser(t, { role: 'investigator', office })
    expectFits(personChangedResponseSchema, await admin.patch(`/api/admin/users/${moved.id}`).send({ role: 'supervisor' }))
    const filed = await fileReport(t, reportNear(office))
    expectFits(trackingLinksRevokedResponseSchema, await supervisor.post(`/api/cases/${filed.id}/tracking-links/revoke`).send({ reason: 'Contract check' }))
  })

  it('a complainant’s own reports', async () => {
    const filed = await complainant.post('/api/reports').set('X-Forwarded-For', uniqueAddress()).send(validReport(reportNear(office)))
    expectFits(submittedReportSchema, filed, 201)
    const mine = await complainant.get('/api/my/reports')
    expectFits(myReportsResponseSchema, mine)
    expect(mine.body.reports.length).toBeGreaterThan(0)
    expectFits(complainantReportResponseSchema, await complainant.get(`/api/my/reports/${mine.body.reports[0].id}`))
  })

  it('the responsible party, notices, replies, follow-ups and their moves, the due list and the e-mails a person gets', async () => {
    const f = await fileHere()
    const today = new Date().toISOString().slice(0, 10)
    const party = await supervisor.post(`/api/cases/${f.id}/responsible-party`).send({ name: 'Harbour boat club', email: 'club@boatclub.example' })
    expectFits(responsiblePartyResponseSchema, party, 201)
    const notice = await supervisor.post(`/api/cases/${f.id}/notices`).send({ servedOn: today, method: 'in_person', reference: 'N-1', summary: 'Switch the amplifier off.' })
    expectFits(responsiblePartyResponseSchema, notice, 201)
    expectFits(responsiblePartyResponseSchema, await supervisor.post(`/api/cases/${f.id}/party-replies`).send({ receivedOn: today, noticeId: notice.body.notices[0].id, summary: 'Done.' }), 201)
    expectFits(responsiblePartyResponseSchema, await supervisor.get(`/api/cases/${f.id}/responsible-party`))
    const added = await supervisor.post(`/api/cases/${f.id}/follow-ups`).send({ dueOn: '2099-01-05', expected: 'Replace the amplifier' })
    expectFits(z.object({ followUp: followUpViewSchema }), added, 201)
    expectFits(z.object({ followUp: followUpViewSchema }), await supervisor.post(`/api/follow-ups/${added.body.followUp.id}/escalate`).send({ version: 1, note: 'No answer.' }))
    expectFits(caseFollowUpsResponseSchema, await supervisor.get(`/api/cases/${f.id}/follow-ups`))
    expectFits(dueFollowUpsResponseSchema, await investigator.get('/api/follow-ups/due'))
    expectFits(myEmailsResponseSchema, await investigator.get('/api/me/emails'))
  })

  it('the audit list, with an administrative change and an opening of personal details in it', async () => {
    const f = await fileHere()
    expect((await supervisor.get(`/api/cases/${f.id}`)).status).toBe(200)
    expect((await supervisor.put(`/api/offices/${office.id}/time-zone`).send({ timeZone: 'Europe/Lisbon' })).status).toBe(200)
    const page = await admin.get('/api/admin/audit').query({ officeId: office.id })
    expectFits(auditPageSchema, page)
    expect(page.body.entries.map((e: { action: string }) => e.action)).toEqual(expect.arrayContaining(['complainant_details.viewed', 'office.time_zone_changed']))
  })

  it('a legal hold set and lifted, an office’s retention period and the retention dry run', async () => {
    const f = await fileHere()
    expectFits(legalHoldResponseSchema, await supervisor.post(`/api/cases/${f.id}/legal-hold`).send({ reason: 'Appeal pending', until: '2099-01-05' }))
    expectFits(legalHoldResponseSchema, await investigator.get(`/api/cases/${f.id}/legal-hold`))
    expectFits(legalHoldResponseSchema, await supervisor.post(`/api/cases/${f.id}/legal-hold/lift`).send({ reason: 'Appeal decided' }))
    expectFits(retentionSettingResponseSchema, await supervisor.get(`/api/offices/${office.id}/retention`))
    expectFits(retentionSettingResponseSchema, await admin.put(`/api/offices/${office.id}/retention`).send({ retentionMonths: 24 }))
    expectFits(retentionRunResponseSchema, await admin.get('/api/admin/retention/dry-run'))
  })

  it('who is signed in, for an account and for an anonymous visitor', async () => {
    expectFits(meResponseSchema, await investigator.get('/api/me'))
    expectFits(meResponseSchema, await request(t.app).get('/api/me'))
    const signedIn = await request(t.app).post('/api/auth/sign-in').set('X-Forwarded-For', uniqueAddress()).send({ email: users.supervisor.email, password: users.supervisor.password })
    expectFits(signedInSchema, signedIn)
  })
})
