/**
 * What the mocked API answers, built only through the shared view schemas: every builder
 * fills a complete record with invented demo data, lays the test's changes over it and runs
 * it through the schema's `parse`. When a shape changes in shared/schemas/views.ts and a
 * builder no longer fits it, the tests that use it fail here instead of testing a screen
 * against an answer the server can no longer give.
 */
import type { z } from 'zod'
import { CASE_STATE_LABELS } from '../../shared/domain/case-lifecycle'
import { meResponseSchema } from '../../shared/schemas/auth'
import { regionMapSchema, type RegionMap } from '../../shared/schemas/region'
import {
  caseAbilitiesSchema,
  caseListItemSchema,
  casePageSchema,
  caseResponseSchema,
  investigatorsResponseSchema,
  mergeCandidatesResponseSchema,
  officesResponseSchema,
  officeViewSchema,
  staffListResponseSchema,
  submittedReportSchema,
  transferOfficesResponseSchema,
  userRowSchema,
  type CaseAbilities,
  type CaseDetail,
  type CaseListItem,
  type InvestigatorLoad,
  type MergeCandidate,
  type OfficeView,
  type TransferOffice,
  type UserRow,
} from '../../shared/schemas/views'

/** Invented ids of the demo region's offices and staff (stable, so URLs in tests can name them). */
export const IDS = {
  case: '0b6f1c2e-5d3a-4e8b-9c71-2a4f6e8d0c13',
  tarnwickOffice: '4c1d2e3f-8a9b-4c0d-9e1f-2a3b4c5d6e7f',
  orlessOffice: '7e8f9a0b-1c2d-4e3f-8a4b-5c6d7e8f9a0b',
  investigatorIlse: '9a8b7c6d-5e4f-4a3b-8c2d-1e0f9a8b7c6d',
  investigatorMorven: '1f2e3d4c-5b6a-4978-8a1b-2c3d4e5f6a7b',
  supervisor: '2b3c4d5e-6f7a-4b8c-9d0e-1f2a3b4c5d6e',
} as const

const RECEIVED_AT = '2026-11-30T08:15:00.000Z'
const DUE_AT = '2026-12-08T08:15:00.000Z'

/** No move allowed: the starting point of every ability set in tests. */
export function noAbilities(): CaseAbilities {
  const keys = Object.keys(caseAbilitiesSchema.shape) as (keyof CaseAbilities)[]
  return caseAbilitiesSchema.parse(Object.fromEntries(keys.map((k) => [k, false])))
}

/** An ability set with exactly the named flags true. */
export function abilities(...allowed: (keyof CaseAbilities)[]): CaseAbilities {
  return caseAbilitiesSchema.parse({ ...noAbilities(), ...Object.fromEntries(allowed.map((k) => [k, true])) })
}

/** GET /api/cases/:id — a received report of a harbour radio outage, with the test's changes. */
export function caseResponse(changes: Partial<CaseDetail> = {}): z.output<typeof caseResponseSchema> {
  const detail: CaseDetail = {
    id: IDS.case,
    reference: 'QB-26-000412',
    version: 3,
    status: 'received',
    statusLabel: CASE_STATE_LABELS[changes.status ?? 'received'],
    priority: 2,
    suggestedPriority: 2,
    service: 'maritime',
    licenceRef: 'Ship station "Grey Heron"',
    freqLowHz: 156_800_000,
    freqHighHz: 156_800_000,
    address: 'Berth 4, Tarnwick harbour',
    latDeg: 48.12,
    lonDeg: -31.35,
    sinceDate: '2026-11-27',
    pattern: 'intermittent',
    patternDetail: null,
    experience: 'degradation',
    description: 'A rasping noise covers channel 16 in the harbour every few minutes.',
    complainant: { name: 'Edda Marlow', email: 'edda.marlow@example.test', phone: null, organisation: 'Tarnwick Pilots', hasAccount: false },
    officeId: IDS.tarnwickOffice,
    officeName: 'Tarnwick Field Office',
    investigatorId: null,
    investigatorName: null,
    mergedIntoCaseId: null,
    mergedIntoReference: null,
    resolution: null,
    resolutionLabel: null,
    closingSummary: null,
    receivedAt: RECEIVED_AT,
    dueAt: DUE_AT,
    closedAt: null,
    overdue: false,
    firstResponseDueAt: '2026-11-30T16:15:00.000Z',
    firstRespondedAt: null,
    firstResponseOverdue: false,
    abilities: noAbilities(),
    timeline: [
      { id: 1, at: RECEIVED_AT, actor: 'Quietband', kind: 'received', fromState: null, toState: 'received', body: null, visibility: 'complainant', data: null },
    ],
    ...changes,
  }
  return caseResponseSchema.parse({ case: detail })
}

/** GET /api/cases/:id/investigators — the office's investigators, lightest load first. */
export function investigatorsResponse(list?: InvestigatorLoad[]) {
  return investigatorsResponseSchema.parse({
    investigators: list ?? [
      { id: IDS.investigatorIlse, name: 'Ilse Brannock', openCases: 2 },
      { id: IDS.investigatorMorven, name: 'Morven Achterberg', openCases: 5 },
    ],
  })
}

/** GET /api/cases/:id/merge-candidates — open cases nearby on an overlapping frequency. */
export function mergeCandidatesResponse(list?: MergeCandidate[]) {
  return mergeCandidatesResponseSchema.parse({
    candidates: list ?? [
      {
        id: '5d6e7f8a-9b0c-4d1e-8f2a-3b4c5d6e7f8a',
        reference: 'QB-26-000398',
        status: 'assigned',
        service: 'maritime',
        address: 'Fish quay, Tarnwick',
        freqLowHz: 156_800_000,
        freqHighHz: 156_800_000,
        distanceM: 640,
        receivedAt: '2026-11-21T14:02:00.000Z',
      },
    ],
  })
}

/** GET /api/cases/:id/transfer-offices — the other offices, nearest first. */
export function transferOfficesResponse(list?: TransferOffice[]) {
  return transferOfficesResponseSchema.parse({ offices: list ?? [{ id: IDS.orlessOffice, name: 'Orless Field Office', distanceM: 41_500 }] })
}

/** One office as GET /api/offices lists it. */
export function office(changes: Partial<OfficeView> = {}): OfficeView {
  return officeViewSchema.parse({
    id: IDS.tarnwickOffice,
    name: 'Tarnwick Field Office',
    regionName: 'Vellmark Coast',
    address: '4 Quay Row, Tarnwick',
    centreLatDeg: 48.1,
    centreLonDeg: -31.4,
    area: null,
    version: 1,
    responseTargetsHours: { p1: 4, p2: 48, p3: 168, p4: 336 },
    firstResponseTargetsHours: { p1: 1, p2: 8, p3: 24, p4: 72 },
    timeZone: 'Atlantic/Azores',
    abilities: { setResponseTargets: false, edit: false },
    ...changes,
  })
}

/** GET /api/offices */
export function officesResponse(list: OfficeView[] = [office()]) {
  return officesResponseSchema.parse({ offices: list })
}

/** One staff account as GET /api/staff lists it. */
export function staffMember(changes: Partial<UserRow> & Pick<UserRow, 'id' | 'name'>): UserRow {
  return userRowSchema.parse({
    email: `${changes.name.toLowerCase().replace(/[^a-z]+/g, '.')}@tarnwick.example.test`,
    role: 'investigator',
    officeId: IDS.tarnwickOffice,
    officeName: 'Tarnwick Field Office',
    active: true,
    createdAt: '2026-01-05T09:00:00.000Z',
    lastSignedInAt: '2026-11-29T07:40:00.000Z',
    ...changes,
  })
}

/** GET /api/staff — the office's staff: two investigators and their supervisor. */
export function staffResponse(list?: UserRow[]) {
  return staffListResponseSchema.parse({
    staff: list ?? [
      staffMember({ id: IDS.investigatorIlse, name: 'Ilse Brannock' }),
      staffMember({ id: IDS.investigatorMorven, name: 'Morven Achterberg' }),
      staffMember({ id: IDS.supervisor, name: 'Oskar Vellan', role: 'supervisor' }),
    ],
  })
}

/** One row of the case list. */
export function caseListItem(changes: Partial<CaseListItem> = {}): CaseListItem {
  return caseListItemSchema.parse({
    id: IDS.case,
    reference: 'QB-26-000412',
    status: 'received',
    statusLabel: CASE_STATE_LABELS[changes.status ?? 'received'],
    priority: 2,
    service: 'maritime',
    freqLowHz: 156_800_000,
    freqHighHz: 156_800_000,
    address: 'Berth 4, Tarnwick harbour',
    officeId: IDS.tarnwickOffice,
    officeName: 'Tarnwick Field Office',
    investigatorId: null,
    investigatorName: null,
    complainantName: 'Edda Marlow',
    receivedAt: RECEIVED_AT,
    dueAt: DUE_AT,
    closedAt: null,
    overdue: false,
    ...changes,
  })
}

/** GET /api/cases — one page of the list. */
export function casePage(items: CaseListItem[], paging: Partial<Omit<z.input<typeof casePageSchema>, 'items'>> = {}) {
  return casePageSchema.parse({ items, total: items.length, totalCapped: false, page: 1, pageSize: 25, ...paging })
}

/** POST /api/reports (201) */
export function submittedReport(changes: Partial<z.input<typeof submittedReportSchema>> = {}) {
  return submittedReportSchema.parse({
    reference: 'QB-26-000413',
    officeName: 'Tarnwick Field Office',
    trackingUrl: 'http://localhost:3000/track/tk_4f9c1e2b7a6d5c3e8f0a1b2c3d4e5f6a',
    warnings: [],
    ...changes,
  })
}

/** GET /api/me for a visitor who is not signed in. */
export function anonymousMe() {
  return meResponseSchema.parse({ user: null })
}

/**
 * GET /api/region — a small invented stretch of coast: its outline, the land, one town and
 * one office. `null` gives the answer of a service with no region set up (offices only).
 */
export function regionMapResponse(region: 'configured' | null = 'configured'): RegionMap {
  const office = { type: 'Feature', geometry: { type: 'Point', coordinates: [-31.4, 48.1] }, properties: { kind: 'office', name: 'Tarnwick Field Office' } }
  if (region === null) return regionMapSchema.parse({ type: 'FeatureCollection', features: [office], basemap: { kind: 'offline' } })
  const ring = (w: number, s: number, e: number, n: number) => [[[w, s], [e, s], [e, n], [w, n], [w, s]]]
  return regionMapSchema.parse({
    type: 'FeatureCollection',
    features: [
      { type: 'Feature', geometry: { type: 'Polygon', coordinates: ring(-32, 47.6, -30.6, 48.6) }, properties: { kind: 'region', name: 'Vellmark Coast' } },
      { type: 'Feature', geometry: { type: 'Polygon', coordinates: ring(-31.8, 47.9, -30.6, 48.6) }, properties: { kind: 'coast' } },
      { type: 'Feature', geometry: { type: 'Point', coordinates: [-31.35, 48.12] }, properties: { kind: 'place', name: 'Tarnwick', placeKind: 'town' } },
      office,
    ],
    basemap: { kind: 'offline' },
  })
}
