/**
 * Every /api route, called as anonymous and as each role, answers the expected status.
 * A route that exists in the app but not in this matrix fails the first test: new routes
 * must join it. Every answer is also checked against the API document (GET /api/openapi.json).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import fs from 'node:fs'
import os from 'node:os'
import path from 'node:path'
import { createTestContext, uniqueAddress, type TestContext } from '../support/harness'
import { listRoutes } from '../support/routes'
import { makeCase, makeOffice, makeUser, signIn, type TestUser } from '../support/factories'
import { expectAnswerMatchesDocument } from '../support/api-document'

type Who = 'anonymous' | 'complainant' | 'investigator' | 'supervisor' | 'admin'
const WHO: Who[] = ['anonymous', 'complainant', 'investigator', 'supervisor', 'admin']
/** This file's own accounts (made in beforeAll); the investigator and supervisor are of the own office. */
let ACCOUNT: Record<Exclude<Who, 'anonymous'>, TestUser>

interface Row {
  route: string
  /** Concrete path to call (route parameters filled in). */
  path?: (ids: Ids) => string
  body?: unknown
  expect: [number, number, number, number, number] // anonymous, complainant, investigator, supervisor, admin
}
interface Ids {
  otherOfficeId: string
  otherOfficeStaffId: string
  ownOfficeId: string
  /** A case of the own office (the staff actors' office). */
  ownCaseId: string
  /** A case of the other office. */
  otherCaseId: string
  trackingToken: string
}

/** A well-formed import request (the register's routes check the role before the upload they name). */
const MATRIX_IMPORT = {
  delimiter: 'comma',
  mapping: { fields: { stationCode: { column: 'code' }, licensee: { column: 'holder' }, latitude: { column: 'lat' }, longitude: { column: 'lon' }, lowFreq: { column: 'low' }, highFreq: { column: 'high' }, eirp: { column: 'eirp' } } },
}

const MATRIX: Row[] = [
  { route: 'GET /api/health', expect: [200, 200, 200, 200, 200] },
  // the API document is public: it describes routes, never data
  { route: 'GET /api/openapi.json', expect: [200, 200, 200, 200, 200] },
  { route: 'GET /api/me', expect: [200, 200, 200, 200, 200] }, // anonymous: { user: null }
  { route: 'POST /api/auth/sign-in', body: { email: 'matrix-nobody@example.test', password: 'not-a-password' }, expect: [401, 401, 401, 401, 401] },
  { route: 'POST /api/auth/sign-out', expect: [204, 204, 204, 204, 204] },
  { route: 'POST /api/auth/register', body: { name: '', email: 'not-an-address', password: 'short' }, expect: [400, 400, 400, 400, 400] },
  { route: 'POST /api/auth/confirm-email', body: { token: 'x'.repeat(43) }, expect: [400, 400, 400, 400, 400] },
  { route: 'POST /api/auth/password-reset', body: { email: 'nobody@example.test' }, expect: [202, 202, 202, 202, 202] },
  { route: 'POST /api/auth/set-password', body: { token: 'x'.repeat(43), password: 'long-enough-password' }, expect: [400, 400, 400, 400, 400] },
  { route: 'GET /api/admin/users', expect: [401, 403, 403, 403, 200] },
  { route: 'POST /api/admin/users', body: {}, expect: [401, 403, 403, 403, 400] },
  {
    route: 'PATCH /api/admin/users/:id',
    path: () => '/api/admin/users/00000000-0000-4000-8000-000000000000',
    body: { active: true },
    expect: [401, 403, 403, 403, 404],
  },
  { route: 'GET /api/staff', expect: [401, 403, 200, 200, 200] },
  { route: 'GET /api/staff/:id', path: (ids) => `/api/staff/${ids.otherOfficeStaffId}`, expect: [401, 403, 404, 404, 200] },
  { route: 'GET /api/offices', expect: [401, 403, 200, 200, 200] },
  { route: 'GET /api/offices/:id', path: (ids) => `/api/offices/${ids.otherOfficeId}`, expect: [401, 403, 404, 404, 200] },
  { route: 'PUT /api/offices/:id/response-targets', path: (ids) => `/api/offices/${ids.otherOfficeId}/response-targets`, body: { p1: 4, p2: 24, p3: 72, p4: 240 }, expect: [401, 403, 403, 404, 200] },
  { route: 'PUT /api/offices/:id/first-response-targets', path: (ids) => `/api/offices/${ids.otherOfficeId}/first-response-targets`, body: { p1: 1, p2: 8, p3: 24, p4: 72 }, expect: [401, 403, 403, 404, 200] },
  { route: 'GET /api/dashboard', expect: [401, 403, 403, 200, 200] },
  { route: 'PUT /api/offices/:id/time-zone', path: (ids) => `/api/offices/${ids.otherOfficeId}/time-zone`, body: { timeZone: 'UTC' }, expect: [401, 403, 403, 404, 200] },
  // new offices stand far north with no area, so they never take another test's report
  { route: 'POST /api/admin/offices', body: { name: `Matrix office ${process.pid}`, latDeg: 71, lonDeg: 1, timeZone: 'UTC', area: null }, expect: [401, 403, 403, 403, 201] },
  { route: 'POST /api/admin/offices/check-area', body: { area: { type: 'Polygon', coordinates: [[[1, 71], [2, 71], [2, 72], [1, 71]]] } }, expect: [401, 403, 403, 403, 200] },
  {
    route: 'PUT /api/admin/offices/:id',
    path: (ids) => `/api/admin/offices/${ids.otherOfficeId}`,
    body: { name: `Matrix other office ${process.pid}`, latDeg: 72, lonDeg: 1, timeZone: 'UTC', area: null, version: 1 },
    expect: [401, 403, 403, 403, 200],
  },
  // a person's own saved views of the case list (staff); another person's id is not found
  { route: 'GET /api/me/saved-views', expect: [401, 403, 200, 200, 200] },
  { route: 'POST /api/me/saved-views', body: { name: '', listQuery: 'open=true' }, expect: [401, 403, 400, 400, 400] },
  { route: 'DELETE /api/me/saved-views/:id', path: () => '/api/me/saved-views/00000000-0000-4000-8000-000000000000', expect: [401, 403, 404, 404, 404] },
  // the region map (outline, coast, offices' points and areas) is public: the report form needs it
  { route: 'GET /api/region', expect: [200, 200, 200, 200, 200] },
  // served only to loopback connections of a loopback development server with no proxy declared;
  // this app trusts a proxy, so it is off for everyone (each condition: dev-mailbox.test.ts)
  { route: 'GET /api/dev/mailbox', expect: [404, 404, 404, 404, 404] },
  // reports and tracking (public); a bad body is 400 for everyone, a good one is covered in reports.test.ts
  { route: 'POST /api/reports', body: {}, expect: [400, 400, 400, 400, 400] },
  { route: 'GET /api/track/:token', path: (ids) => `/api/track/${ids.trackingToken}`, expect: [200, 200, 200, 200, 200] },
  { route: 'POST /api/track/:token/information', path: (ids) => `/api/track/${ids.trackingToken}/information`, body: { body: 'Still there at night.' }, expect: [201, 201, 201, 201, 201] },
  { route: 'POST /api/track/:token/withdraw', path: () => `/api/track/${'Z'.repeat(43)}/withdraw`, body: {}, expect: [404, 404, 404, 404, 404] },
  // a signed-in complainant's reports; the other office's case is not theirs
  { route: 'GET /api/my/reports', expect: [401, 200, 403, 403, 403] },
  { route: 'GET /api/my/reports/:id', path: (ids) => `/api/my/reports/${ids.otherCaseId}`, expect: [401, 404, 403, 403, 403] },
  { route: 'POST /api/my/reports/:id/information', path: (ids) => `/api/my/reports/${ids.otherCaseId}/information`, body: { body: 'x' }, expect: [401, 404, 403, 403, 403] },
  { route: 'POST /api/my/reports/:id/withdraw', path: (ids) => `/api/my/reports/${ids.otherCaseId}/withdraw`, body: {}, expect: [401, 404, 403, 403, 403] },
  // staff case routes: another office's case is 404 to staff, visible to an administrator
  { route: 'GET /api/cases', expect: [401, 403, 200, 200, 200] },
  { route: 'GET /api/cases/export.csv', expect: [401, 403, 200, 200, 200] },
  { route: 'GET /api/cases/:id', path: (ids) => `/api/cases/${ids.otherCaseId}`, expect: [401, 403, 404, 404, 200] },
  { route: 'GET /api/cases/:id/merge-candidates', path: (ids) => `/api/cases/${ids.otherCaseId}/merge-candidates`, expect: [401, 403, 404, 404, 200] },
  { route: 'GET /api/cases/:id/nearby-cases', path: (ids) => `/api/cases/${ids.otherCaseId}/nearby-cases`, expect: [401, 403, 404, 404, 200] },
  { route: 'GET /api/cases/:id/investigators', path: (ids) => `/api/cases/${ids.otherCaseId}/investigators`, expect: [401, 403, 404, 404, 200] },
  { route: 'GET /api/cases/:id/transfer-offices', path: (ids) => `/api/cases/${ids.otherCaseId}/transfer-offices`, expect: [401, 403, 404, 404, 200] },
  { route: 'POST /api/cases/:id/notes', path: (ids) => `/api/cases/${ids.ownCaseId}/notes`, body: { body: 'Checked the licence register.', visibility: 'internal' }, expect: [401, 403, 201, 201, 403] },
  // moves on the own office's new report: only the supervisor may triage; the state decides the rest
  { route: 'POST /api/cases/:id/triage', path: (ids) => `/api/cases/${ids.otherCaseId}/triage`, body: { version: 1, priority: 2 }, expect: [401, 403, 404, 404, 403] },
  { route: 'POST /api/cases/:id/assign', path: (ids) => `/api/cases/${ids.otherCaseId}/assign`, body: { version: 1, investigatorId: '00000000-0000-4000-8000-000000000000' }, expect: [401, 403, 404, 404, 403] },
  { route: 'POST /api/cases/:id/transfer', path: (ids) => `/api/cases/${ids.otherCaseId}/transfer`, body: { version: 1, officeId: '00000000-0000-4000-8000-000000000000', reason: 'Closer office' }, expect: [401, 403, 404, 404, 403] },
  { route: 'POST /api/cases/:id/merge', path: (ids) => `/api/cases/${ids.otherCaseId}/merge`, body: { version: 1, intoCaseId: '00000000-0000-4000-8000-000000000000' }, expect: [401, 403, 404, 404, 403] },
  { route: 'POST /api/cases/:id/dismiss', path: (ids) => `/api/cases/${ids.otherCaseId}/dismiss`, body: { version: 1, resolution: 'referred', reason: 'For the aviation authority' }, expect: [401, 403, 404, 404, 403] },
  { route: 'POST /api/cases/:id/start-field-work', path: (ids) => `/api/cases/${ids.ownCaseId}/start-field-work`, body: { version: 1 }, expect: [401, 403, 403, 403, 403] },
  { route: 'POST /api/cases/:id/propose-finding', path: (ids) => `/api/cases/${ids.ownCaseId}/propose-finding`, body: { version: 1, sourceDescription: 'A faulty masthead amplifier', recommendedAction: 'advise_operator', summary: 'Found it' }, expect: [401, 403, 403, 403, 403] },
  { route: 'POST /api/cases/:id/return-finding', path: (ids) => `/api/cases/${ids.ownCaseId}/return-finding`, body: { version: 1, reason: 'More work' }, expect: [401, 403, 403, 409, 403] },
  { route: 'POST /api/cases/:id/close', path: (ids) => `/api/cases/${ids.ownCaseId}/close`, body: { version: 1, resolution: 'source_corrected', reason: 'Fixed' }, expect: [401, 403, 403, 409, 403] },
  { route: 'POST /api/cases/:id/reopen', path: (ids) => `/api/cases/${ids.ownCaseId}/reopen`, body: { version: 1, reason: 'Back again' }, expect: [401, 403, 403, 409, 403] },
  // closing a case's tracking links: a supervisor of its office (another office's case: 404 to staff; the administrator: 403)
  { route: 'POST /api/cases/:id/tracking-links/revoke', path: (ids) => `/api/cases/${ids.otherCaseId}/tracking-links/revoke`, body: { reason: 'Matrix check' }, expect: [401, 403, 404, 404, 403] },
  // calculation records: staff of the case's office read them (another office's case 404, the administrator 403);
  // the assigned investigator or the office's supervisor store them while the case is worked (the own new report: 409)
  {
    route: 'POST /api/cases/:id/calculations',
    path: (ids) => `/api/cases/${ids.ownCaseId}/calculations`,
    body: { kind: 'compliance_verdict', inputs: { eirpDbm: '23 dBm', limit: { source: 'band-limit', bandLimitId: 'en300328-2g4-eirp' } } },
    expect: [401, 403, 403, 409, 403],
  },
  { route: 'GET /api/cases/:id/calculations', path: (ids) => `/api/cases/${ids.otherCaseId}/calculations`, expect: [401, 403, 404, 404, 200] },
  // findings: staff of the case's office and administrators read them (another office's case 404); proposing is the propose-finding move
  { route: 'GET /api/cases/:id/findings', path: (ids) => `/api/cases/${ids.otherCaseId}/findings`, expect: [401, 403, 404, 404, 200] },
  { route: 'GET /api/calculations/:id/recompute', path: () => '/api/calculations/00000000-0000-4000-8000-000000000000/recompute', expect: [401, 403, 404, 404, 404] },
  // the national band-limit list: staff read it; supervisors and administrators edit (an entry that does not exist: 404)
  { route: 'GET /api/band-limits', expect: [401, 403, 200, 200, 200] },
  {
    route: 'PATCH /api/band-limits/:id',
    path: () => '/api/band-limits/00000000-0000-4000-8000-000000000000',
    body: { changes: { citation: 'Matrix' }, reason: 'Matrix check', version: 1 },
    expect: [401, 403, 403, 404, 404],
  },
  { route: 'GET /api/band-limits/:id/history', path: () => '/api/band-limits/00000000-0000-4000-8000-000000000000/history', expect: [401, 403, 404, 404, 404] },
  // the licence register: staff read it; only administrators import (this app has no file store: a form that is not multipart is 400 before it)
  { route: 'POST /api/station-register/uploads', body: {}, expect: [401, 403, 403, 403, 400] },
  { route: 'POST /api/station-register/uploads/:id/inspect', path: () => '/api/station-register/uploads/00000000-0000-4000-8000-000000000000/inspect', body: {}, expect: [401, 403, 403, 403, 404] },
  {
    route: 'POST /api/station-register/uploads/:id/preview',
    path: () => '/api/station-register/uploads/00000000-0000-4000-8000-000000000000/preview',
    body: MATRIX_IMPORT,
    expect: [401, 403, 403, 403, 404],
  },
  {
    route: 'POST /api/station-register/uploads/:id/confirm',
    path: () => '/api/station-register/uploads/00000000-0000-4000-8000-000000000000/confirm',
    body: MATRIX_IMPORT,
    expect: [401, 403, 403, 403, 404],
  },
  { route: 'GET /api/station-register/stations', expect: [401, 403, 200, 200, 200] },
  { route: 'GET /api/station-register/stations/:id', path: () => '/api/station-register/stations/00000000-0000-4000-8000-000000000000', expect: [401, 403, 404, 404, 404] },
  { route: 'GET /api/station-register/versions', expect: [401, 403, 200, 200, 200] },
  { route: 'GET /api/station-register/versions/:version', path: () => '/api/station-register/versions/999999999', expect: [401, 403, 404, 404, 404] },
  {
    route: 'POST /api/station-register/candidates',
    body: { victimPosition: { latDeg: 47.7, lonDeg: -30.6 }, lowFreqHz: '446 MHz', highFreqHz: '446.2 MHz' },
    expect: [401, 403, 200, 200, 200],
  },
  // an office's equipment register: its staff read it, its supervisor and administrators keep it (the other office: 404 to staff)
  { route: 'GET /api/offices/:id/equipment', path: (ids) => `/api/offices/${ids.otherOfficeId}/equipment`, expect: [401, 403, 404, 404, 200] },
  {
    route: 'POST /api/offices/:id/equipment',
    path: (ids) => `/api/offices/${ids.otherOfficeId}/equipment`,
    body: { item: { name: 'Matrix analyser', type: 'analyser', calibrationDueOn: '2030-01-01' } },
    expect: [401, 403, 404, 404, 201],
  },
  {
    route: 'PATCH /api/equipment/:id',
    path: () => '/api/equipment/00000000-0000-4000-8000-000000000000',
    body: { item: { name: 'Matrix analyser', type: 'analyser' }, version: 1 },
    expect: [401, 403, 404, 404, 404],
  },
  { route: 'GET /api/equipment/:id/history', path: () => '/api/equipment/00000000-0000-4000-8000-000000000000/history', expect: [401, 403, 404, 404, 404] },
  // a case's measurements: staff of its office read them; the assigned investigator or the supervisor record them while
  // the case is worked (the own new report: the unassigned investigator 403, the supervisor 409, the administrator 403)
  { route: 'GET /api/cases/:id/measurements', path: (ids) => `/api/cases/${ids.otherCaseId}/measurements`, expect: [401, 403, 404, 404, 200] },
  // a case's evidence files: staff of its office upload and list (another office's case 404); the complainant through the
  // tracking link or their account (another's report 404); one file's download, check, removal and custody: staff (none here: 404)
  { route: 'POST /api/cases/:id/evidence', path: (ids) => `/api/cases/${ids.otherCaseId}/evidence`, body: { kind: 'photo' }, expect: [401, 403, 404, 404, 403] },
  { route: 'GET /api/cases/:id/evidence', path: (ids) => `/api/cases/${ids.otherCaseId}/evidence`, expect: [401, 403, 404, 404, 403] },
  { route: 'POST /api/track/:token/evidence', path: () => `/api/track/${'Z'.repeat(43)}/evidence`, body: { kind: 'photo' }, expect: [404, 404, 404, 404, 404] },
  { route: 'GET /api/track/:token/evidence', path: (ids) => `/api/track/${ids.trackingToken}/evidence`, expect: [200, 200, 200, 200, 200] },
  { route: 'POST /api/my/reports/:id/evidence', path: (ids) => `/api/my/reports/${ids.otherCaseId}/evidence`, body: { kind: 'photo' }, expect: [401, 404, 403, 403, 403] },
  { route: 'GET /api/my/reports/:id/evidence', path: (ids) => `/api/my/reports/${ids.otherCaseId}/evidence`, expect: [401, 404, 403, 403, 403] },
  { route: 'GET /api/evidence/:id/download', path: () => '/api/evidence/00000000-0000-4000-8000-000000000000/download', expect: [401, 403, 404, 404, 403] },
  { route: 'POST /api/evidence/:id/verify', path: () => '/api/evidence/00000000-0000-4000-8000-000000000000/verify', body: {}, expect: [401, 403, 404, 404, 403] },
  { route: 'POST /api/evidence/:id/remove', path: () => '/api/evidence/00000000-0000-4000-8000-000000000000/remove', body: { reason: 'Matrix check' }, expect: [401, 403, 404, 404, 403] },
  { route: 'GET /api/evidence/:id/custody', path: () => '/api/evidence/00000000-0000-4000-8000-000000000000/custody', expect: [401, 403, 404, 404, 403] },
  // sharing a staff file with the complainant: staff of its office (own office 200, removed file 409: evidence-sharing.test.ts)
  { route: 'POST /api/evidence/:id/share', path: () => '/api/evidence/00000000-0000-4000-8000-000000000000/share', body: { shared: true }, expect: [401, 403, 404, 404, 403] },
  // the complainant downloads a file the office shared (own report 200, not shared 404: evidence-sharing.test.ts)
  { route: 'GET /api/track/:token/evidence/:evidenceId/download', path: (ids) => `/api/track/${ids.trackingToken}/evidence/00000000-0000-4000-8000-000000000000/download`, expect: [404, 404, 404, 404, 404] },
  { route: 'GET /api/my/reports/:id/evidence/:evidenceId/download', path: (ids) => `/api/my/reports/${ids.otherCaseId}/evidence/00000000-0000-4000-8000-000000000000/download`, expect: [401, 404, 403, 403, 403] },
  // a photo's thumbnail: whoever may see the file, the complainant included for their own uploads (own office 200, another office 404: evidence-thumbnails.test.ts)
  { route: 'GET /api/evidence/:id/thumbnail', path: () => '/api/evidence/00000000-0000-4000-8000-000000000000/thumbnail', expect: [401, 404, 404, 404, 403] },
  // a spectrum file's analysis (summary, display trace, spectrogram): staff of its office (own office 200 and another office 404: evidence-processing.test.ts)
  { route: 'GET /api/evidence/:id/analysis', path: () => '/api/evidence/00000000-0000-4000-8000-000000000000/analysis', expect: [401, 403, 404, 404, 403] },
  // channel power and occupied bandwidth of a band of that analysis (own office 200: evidence-band.test.ts)
  { route: 'POST /api/evidence/:id/band', path: () => '/api/evidence/00000000-0000-4000-8000-000000000000/band', body: { lowFreqHz: 101.5e6, highFreqHz: 102.5e6 }, expect: [401, 403, 404, 404, 403] },
  // that band's channel power kept as a measurement, computed by the server (own office 201, removed file 409, unassigned investigator 403: evidence-band.test.ts)
  {
    route: 'POST /api/evidence/:id/band-measurement',
    path: () => '/api/evidence/00000000-0000-4000-8000-000000000000/band-measurement',
    body: { lowFreqHz: 101.5e6, highFreqHz: 102.5e6, takenAt: '2026-11-20T09:00:00.000Z', latDeg: 48.1, lonDeg: -31.35 },
    expect: [401, 403, 404, 404, 403],
  },
  // a case's evidence bundle (ZIP of its files and manifest): staff of its office; another office's case is 404
  { route: 'GET /api/cases/:id/evidence-bundle', path: (ids) => `/api/cases/${ids.otherCaseId}/evidence-bundle`, expect: [401, 403, 404, 404, 200] },
  // a case's signed case file (PDF), recorded on its timeline: staff of its office and administrators; another office's case is 404
  { route: 'GET /api/cases/:id/case-file', path: (ids) => `/api/cases/${ids.otherCaseId}/case-file`, expect: [401, 403, 404, 404, 200] },
  {
    route: 'POST /api/cases/:id/measurements',
    path: (ids) => `/api/cases/${ids.ownCaseId}/measurements`,
    body: { measurement: { takenAt: '2026-01-05T10:00:00Z', latDeg: '51', lonDeg: '-1', freqHz: '433.92 MHz', reading: { unit: 'dBm', value: '-60' }, antenna: { source: 'gain', antennaGainDbi: '0' } } },
    expect: [401, 403, 403, 409, 403],
  },
  {
    route: 'PATCH /api/measurements/:id',
    path: () => '/api/measurements/00000000-0000-4000-8000-000000000000',
    body: { measurement: { takenAt: '2026-01-05T10:00:00Z', latDeg: '51', lonDeg: '-1', freqHz: '433.92 MHz', reading: { unit: 'dBm', value: '-60' } }, version: 1 },
    expect: [401, 403, 404, 404, 404],
  },
  {
    route: 'POST /api/measurements/:id/corrections',
    path: () => '/api/measurements/00000000-0000-4000-8000-000000000000/corrections',
    body: { measurement: { takenAt: '2026-01-05T10:00:00Z', latDeg: '51', lonDeg: '-1', freqHz: '433.92 MHz', reading: { unit: 'dBm', value: '-60' } } },
    expect: [401, 403, 404, 404, 404],
  },
  // the responsible party, notices and replies: staff of the case's office record (another office 404); administrators read only (403 to record)
  { route: 'GET /api/cases/:id/responsible-party', path: (ids) => `/api/cases/${ids.otherCaseId}/responsible-party`, expect: [401, 403, 404, 404, 200] },
  { route: 'POST /api/cases/:id/responsible-party', path: (ids) => `/api/cases/${ids.otherCaseId}/responsible-party`, body: { name: 'Matrix party', phone: '+00 555 0100' }, expect: [401, 403, 404, 404, 403] },
  { route: 'POST /api/cases/:id/notices', path: (ids) => `/api/cases/${ids.otherCaseId}/notices`, body: { servedOn: '2026-01-05', method: 'email', summary: 'Matrix notice' }, expect: [401, 403, 404, 404, 403] },
  { route: 'POST /api/cases/:id/party-replies', path: (ids) => `/api/cases/${ids.otherCaseId}/party-replies`, body: { receivedOn: '2026-01-05', summary: 'Matrix reply' }, expect: [401, 403, 404, 404, 403] },
  // follow-ups: the same; their moves answer 404 for a follow-up outside the office (own office: follow-ups.test.ts); the due list is the actor's own
  { route: 'GET /api/cases/:id/follow-ups', path: (ids) => `/api/cases/${ids.otherCaseId}/follow-ups`, expect: [401, 403, 404, 404, 200] },
  { route: 'POST /api/cases/:id/follow-ups', path: (ids) => `/api/cases/${ids.otherCaseId}/follow-ups`, body: { dueOn: '2099-01-05', expected: 'Matrix follow-up' }, expect: [401, 403, 404, 404, 403] },
  { route: 'POST /api/follow-ups/:id/confirm', path: () => '/api/follow-ups/00000000-0000-4000-8000-000000000000/confirm', body: { version: 1, note: 'Matrix note' }, expect: [401, 403, 404, 404, 404] },
  { route: 'POST /api/follow-ups/:id/escalate', path: () => '/api/follow-ups/00000000-0000-4000-8000-000000000000/escalate', body: { version: 1, note: 'Matrix note' }, expect: [401, 403, 404, 404, 404] },
  { route: 'POST /api/follow-ups/:id/reopen', path: () => '/api/follow-ups/00000000-0000-4000-8000-000000000000/reopen', body: { version: 1, note: 'Matrix note' }, expect: [401, 403, 404, 404, 404] },
  { route: 'GET /api/follow-ups/due', expect: [401, 403, 200, 200, 200] },
  // legal hold: staff of the office read it, its supervisors and admins set and lift it (own office: retention.test.ts); set before lift, so the admin lifts a hold in force
  { route: 'GET /api/cases/:id/legal-hold', path: (ids) => `/api/cases/${ids.otherCaseId}/legal-hold`, expect: [401, 403, 404, 404, 200] },
  { route: 'POST /api/cases/:id/legal-hold', path: (ids) => `/api/cases/${ids.otherCaseId}/legal-hold`, body: { reason: 'Matrix hold' }, expect: [401, 403, 403, 404, 200] },
  { route: 'POST /api/cases/:id/legal-hold/lift', path: (ids) => `/api/cases/${ids.otherCaseId}/legal-hold/lift`, body: { reason: 'Matrix lift' }, expect: [401, 403, 403, 404, 200] },
  // retention: the office's staff read its period, admins set it and see the dry run
  { route: 'GET /api/offices/:id/retention', path: (ids) => `/api/offices/${ids.otherOfficeId}/retention`, expect: [401, 403, 404, 404, 200] },
  { route: 'PUT /api/offices/:id/retention', path: (ids) => `/api/offices/${ids.otherOfficeId}/retention`, body: { retentionMonths: 24 }, expect: [401, 403, 403, 403, 200] },
  { route: 'GET /api/admin/retention/dry-run', expect: [401, 403, 403, 403, 200] },
  // what Quietband e-mails the signed-in person (every role)
  { route: 'GET /api/me/emails', expect: [401, 200, 200, 200, 200] },
  // the audit log: administrators only
  { route: 'GET /api/admin/audit', expect: [401, 403, 403, 403, 200] },
  { route: 'GET /api/admin/audit.csv', expect: [401, 403, 403, 403, 200] },
]

let t: TestContext
let ids: Ids
const mailboxDir = fs.mkdtempSync(path.join(os.tmpdir(), 'qb-matrix-mail-'))

beforeAll(async () => {
  t = await createTestContext({ mailboxDir })
  const ownOffice = await makeOffice(t)
  const otherOffice = await makeOffice(t)
  ACCOUNT = {
    complainant: await makeUser(t, { role: 'complainant' }),
    investigator: await makeUser(t, { role: 'investigator', office: ownOffice }),
    supervisor: await makeUser(t, { role: 'supervisor', office: ownOffice }),
    admin: await makeUser(t, { role: 'admin' }),
  }
  ids = {
    ownOfficeId: ownOffice.id,
    otherOfficeId: otherOffice.id,
    otherOfficeStaffId: (await makeUser(t, { role: 'investigator', office: otherOffice })).id,
    ownCaseId: (await makeCase(t, { office: ownOffice })).id,
    otherCaseId: (await makeCase(t, { office: otherOffice })).id,
    trackingToken: (await makeCase(t, { office: otherOffice })).trackingToken,
  }
})
afterAll(async () => {
  await t.close()
  fs.rmSync(mailboxDir, { recursive: true, force: true })
})

describe('route × role matrix', () => {
  it('covers every /api route of the app, and only those', () => {
    expect(MATRIX.map((r) => r.route).sort()).toEqual(listRoutes(t.handle.api))
  })

  for (const row of MATRIX) {
    it(`${row.route} answers ${row.expect.join('/')} to ${WHO.join('/')}`, async () => {
      const [method, routePath] = row.route.split(' ') as [string, string]
      const target = row.path ? row.path(ids) : routePath
      const got: number[] = []
      for (const who of WHO) {
        // a fresh agent per call: sign-out must not end the session other rows use
        const agent = who === 'anonymous' ? request.agent(t.app).set('X-Forwarded-For', uniqueAddress()) : await signIn(t, ACCOUNT[who])
        const call = agent[method.toLowerCase() as 'get' | 'post' | 'patch' | 'delete'](target)
        const res = row.body !== undefined ? await call.send(row.body as object) : await call
        got.push(res.status)
        // every answer, error or not, fits what the API document says of it
        expectAnswerMatchesDocument(method, routePath, res)
        if (res.status >= 400) {
          // every error uses the one body shape
          expect(res.body.error, `${who} ${row.route}`).toMatchObject({ code: expect.any(String), message: expect.any(String), requestId: expect.any(String) })
        }
      }
      expect(got).toEqual(row.expect)
    })
  }
})
