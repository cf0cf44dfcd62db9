/**
 * What the API answers, as the browser receives it (JSON: times are ISO 8601 strings).
 * Each shape is a zod schema and its type is inferred from it: the server's presenters are
 * typed with these types, tests parse real answers with the schemas, network mocks and the
 * API document are generated from them. Change a shape here, and only here.
 */
import { z } from 'zod'
import { CASE_MOVES, CASE_STATES, COMPLAINANT_STEPS, RESOLUTIONS, TIMELINE_VISIBILITIES, type CaseMoveName } from '../domain/case-lifecycle'
import { ROLES } from '../domain/roles'
import { AFFECTED_SERVICES, EXPERIENCES, OCCURRENCE_PATTERNS, PRIORITIES } from '../domain/services'
import { CALCULATION_KINDS } from '../calculations/kinds'
import type { LimitSpec } from '../radio/compliance/limit-spec'
import { areaSchema } from './region'

/** An instant as JSON carries it: ISO 8601 in UTC (`2026-03-01T09:30:00.000Z`). */
const instant = z.iso.datetime()
const id = z.uuid()

export const prioritySchema = z.literal(PRIORITIES)
export const caseStateSchema = z.enum(CASE_STATES)
export const complainantStepSchema = z.enum(COMPLAINANT_STEPS)
export const affectedServiceSchema = z.enum(AFFECTED_SERVICES)
export const resolutionSchema = z.enum(RESOLUTIONS)
export const roleSchema = z.enum(ROLES)

export const timelineEventSchema = z.object({
  id: z.number().int(),
  at: instant,
  /** A staff name, 'Complainant', or 'Quietband' for automatic steps. */
  actor: z.string(),
  kind: z.string(),
  fromState: caseStateSchema.nullable(),
  toState: caseStateSchema.nullable(),
  body: z.string().nullable(),
  visibility: z.enum(TIMELINE_VISIBILITIES),
  data: z.record(z.string(), z.unknown()).nullable(),
}).meta({ id: 'TimelineEvent' })
export type TimelineEvent = z.infer<typeof timelineEventSchema>

const moveFlags = Object.fromEntries((Object.keys(CASE_MOVES) as CaseMoveName[]).map((m) => [m, z.boolean()])) as Record<CaseMoveName, z.ZodBoolean>

/** What the viewer may do with a case now (computed by the case policy): one flag per move, and notes. */
export const caseAbilitiesSchema = z.object({
  ...moveFlags,
  addInternalNote: z.boolean(),
  messageComplainant: z.boolean(),
  /** Run and store calculations (the workbench): the assigned investigator or the office supervisor while the case is worked. */
  storeCalculation: z.boolean(),
  /** Issue the signed case file (PDF): staff of the case's office and administrators, in any state. */
  issueCaseFile: z.boolean(),
  /** Close every private tracking link of the case: a supervisor of its office, in any state. */
  revokeTrackingLinks: z.boolean(),
})
export type CaseAbilities = z.infer<typeof caseAbilitiesSchema>

export const caseDetailSchema = z.object({
  id,
  reference: z.string(),
  /** Sent back with every move; the server refuses a stale one (409 stale_version). */
  version: z.number().int().min(1),
  status: caseStateSchema,
  statusLabel: z.string(),
  priority: prioritySchema,
  suggestedPriority: prioritySchema,
  service: affectedServiceSchema,
  licenceRef: z.string().nullable(),
  freqLowHz: z.number(),
  freqHighHz: z.number(),
  address: z.string(),
  latDeg: z.number(),
  lonDeg: z.number(),
  sinceDate: z.iso.date(),
  pattern: z.enum(OCCURRENCE_PATTERNS),
  patternDetail: z.string().nullable(),
  experience: z.enum(EXPERIENCES),
  description: z.string(),
  complainant: z.object({
    name: z.string(),
    email: z.string(),
    phone: z.string().nullable(),
    organisation: z.string().nullable(),
    hasAccount: z.boolean(),
  }),
  officeId: id,
  officeName: z.string(),
  investigatorId: id.nullable(),
  investigatorName: z.string().nullable(),
  mergedIntoCaseId: id.nullable(),
  mergedIntoReference: z.string().nullable(),
  resolution: resolutionSchema.nullable(),
  resolutionLabel: z.string().nullable(),
  closingSummary: z.string().nullable(),
  receivedAt: instant,
  dueAt: instant,
  closedAt: instant.nullable(),
  overdue: z.boolean(),
  /** The first-response clock (shared/domain/case-clocks.ts): its due time, the moment it stopped (null while none), overdue on it now. */
  firstResponseDueAt: instant,
  firstRespondedAt: instant.nullable(),
  firstResponseOverdue: z.boolean(),
  abilities: caseAbilitiesSchema,
  timeline: z.array(timelineEventSchema),
}).meta({ id: 'CaseDetail', description: 'A case as staff see it: the report, the state and clocks, the timeline, and what the viewer may do now.' })
export type CaseDetail = z.infer<typeof caseDetailSchema>

export const caseListItemSchema = z.object({
  id,
  reference: z.string(),
  status: caseStateSchema,
  statusLabel: z.string(),
  priority: prioritySchema,
  service: affectedServiceSchema,
  freqLowHz: z.number(),
  freqHighHz: z.number(),
  address: z.string(),
  officeId: id,
  officeName: z.string(),
  investigatorId: id.nullable(),
  investigatorName: z.string().nullable(),
  complainantName: z.string(),
  receivedAt: instant,
  dueAt: instant,
  closedAt: instant.nullable(),
  overdue: z.boolean(),
})
export type CaseListItem = z.infer<typeof caseListItemSchema>

/** GET /api/cases */
export const casePageSchema = z.object({
  items: z.array(caseListItemSchema),
  /** Exact up to EXACT_TOTAL_UP_TO (shared/domain/case-list.ts); that number when more match. */
  total: z.number().int().min(0),
  /** More cases match than `total` says: the server stopped counting at EXACT_TOTAL_UP_TO. */
  totalCapped: z.boolean(),
  page: z.number().int().min(1),
  pageSize: z.number().int().min(1),
})
export type CasePage = z.infer<typeof casePageSchema>

export const mergeCandidateSchema = z.object({
  id,
  reference: z.string(),
  status: caseStateSchema,
  service: affectedServiceSchema,
  address: z.string(),
  freqLowHz: z.number(),
  freqHighHz: z.number(),
  distanceM: z.number().min(0),
  receivedAt: instant,
})
export type MergeCandidate = z.infer<typeof mergeCandidateSchema>

export const investigatorLoadSchema = z.object({
  id,
  name: z.string(),
  openCases: z.number().int().min(0),
})
export type InvestigatorLoad = z.infer<typeof investigatorLoadSchema>

export const transferOfficeSchema = z.object({
  id,
  name: z.string(),
  /** Geodesic distance from the report's location to the office [m]. */
  distanceM: z.number().min(0),
})
export type TransferOffice = z.infer<typeof transferOfficeSchema>

export const complainantEntrySchema = z.object({
  at: instant,
  from: z.enum(['you', 'office']),
  /** 'status', 'message', 'information_requested', 'complainant_information', … */
  kind: z.string(),
  text: z.string(),
})
export type ComplainantEntry = z.infer<typeof complainantEntrySchema>

/** The complainant's view of their report: plain steps, never the office's internal states or staff. */
export const complainantReportSchema = z.object({
  reference: z.string(),
  step: complainantStepSchema,
  statusLabel: z.string(),
  service: affectedServiceSchema,
  freqLowHz: z.number(),
  freqHighHz: z.number(),
  address: z.string(),
  description: z.string(),
  receivedAt: instant,
  closedAt: instant.nullable(),
  resolution: resolutionSchema.nullable(),
  resolutionLabel: z.string().nullable(),
  closingSummary: z.string().nullable(),
  entries: z.array(complainantEntrySchema),
  abilities: z.object({ withdraw: z.boolean(), addInformation: z.boolean() }),
})
export type ComplainantReport = z.infer<typeof complainantReportSchema>

export const myReportRowSchema = z.object({
  id,
  reference: z.string(),
  step: complainantStepSchema,
  statusLabel: z.string(),
  service: affectedServiceSchema,
  address: z.string(),
  freqLowHz: z.number(),
  freqHighHz: z.number(),
  receivedAt: instant,
  closedAt: instant.nullable(),
})
export type MyReportRow = z.infer<typeof myReportRowSchema>

/** Response target per priority [h]. */
export const responseTargetsHoursSchema = z.object({ p1: z.number(), p2: z.number(), p3: z.number(), p4: z.number() })

export const officeViewSchema = z.object({
  id,
  name: z.string(),
  regionName: z.string(),
  /** Postal address ('' when not given). */
  address: z.string(),
  /** The office's position (routing measures distances from it). */
  centreLatDeg: z.number(),
  centreLonDeg: z.number(),
  /** Its area (GeoJSON Polygon or MultiPolygon), or null: reports inside go to this office. */
  area: areaSchema.nullable(),
  /** Sent back with an edit; the server refuses a stale one (409 stale_version). */
  version: z.number().int().min(1),
  /** Response target per priority, in hours. */
  responseTargetsHours: responseTargetsHoursSchema,
  /** First-response target per priority, in hours (shared/domain/case-clocks.ts). */
  firstResponseTargetsHours: responseTargetsHoursSchema,
  /** The office's IANA time zone ("today" and "next 24 hours" on the dashboard follow it). */
  timeZone: z.string(),
  /** What the viewer may do with this office (computed by the policy). */
  abilities: z.object({ setResponseTargets: z.boolean(), edit: z.boolean() }),
}).meta({ id: 'Office' })
export type OfficeView = z.infer<typeof officeViewSchema>

/**
 * An account as staff lists and the administrator's user list show it. The signed-in user
 * (`SessionUser` in ./auth) is this shape without `active` and `createdAt`.
 */
export const userRowSchema = z.object({
  id,
  email: z.string(),
  name: z.string(),
  role: roleSchema,
  officeId: id.nullable(),
  officeName: z.string().nullable(),
  active: z.boolean(),
  createdAt: instant,
  /** The last successful sign-in, for administrators; null before the first sign-in (and in the staff lists other roles read). */
  lastSignedInAt: instant.nullable(),
})
export type UserRow = z.infer<typeof userRowSchema>

/** Something the reporter should check about a report that was filed all the same. */
export const reportWarningSchema = z.object({
  /** 'far_from_offices': the place lies more than a set distance from every office. */
  code: z.enum(['far_from_offices']),
  /** The form field it is about. */
  path: z.string(),
  message: z.string(),
})
export type ReportWarning = z.infer<typeof reportWarningSchema>

/** POST /api/reports (201): where the report went and how to follow it. */
export const submittedReportSchema = z.object({
  reference: z.string(),
  officeName: z.string(),
  /** The private tracking link, also e-mailed to the complainant. */
  trackingUrl: z.string(),
  warnings: z.array(reportWarningSchema),
})
export type SubmittedReportView = z.infer<typeof submittedReportSchema>

/** A message kept by the local SMTP fake, as the development mailbox lists it. */
export const mailboxMessageSchema = z.object({
  id: z.string(),
  from: z.string(),
  to: z.array(z.string()),
  subject: z.string(),
  date: z.string(),
  text: z.string(),
  html: z.string().nullable(),
  messageId: z.string().nullable(),
})
export type MailboxMessage = z.infer<typeof mailboxMessageSchema>

const conductedGainRuleViewSchema = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('no-reduction'), citation: z.string().optional() }),
  z.object({ kind: z.literal('reduce-conducted-above'), thresholdGainDbi: z.number(), reductionDbPerDb: z.number(), citation: z.string().optional() }),
])
const eirpGainRuleViewSchema = z.object({ kind: z.literal('reduce-eirp-below'), thresholdGainDbi: z.number(), reductionDbPerDb: z.number(), citation: z.string().optional() })

/** A limit as written (the radio library's LimitSpec): powers and densities in dBm, bandwidths in Hz. */
export const limitSpecViewSchema: z.ZodType<LimitSpec> = z.lazy(() =>
  z.discriminatedUnion('kind', [
    z.object({ kind: z.literal('eirp'), eirpDbm: z.number(), gainRule: eirpGainRuleViewSchema.optional() }),
    z.object({ kind: z.literal('erp'), erpDbm: z.number() }),
    z.object({ kind: z.literal('eirp-density'), eirpDensityDbm: z.number(), referenceBandwidthHz: z.number() }),
    z.object({ kind: z.literal('conducted'), conductedPowerDbm: z.number(), gainRule: conductedGainRuleViewSchema }),
    z.object({ kind: z.literal('conducted-density'), conductedDensityDbm: z.number(), referenceBandwidthHz: z.number(), gainRule: conductedGainRuleViewSchema }),
    z.object({ kind: z.literal('lesser-of'), limits: z.array(limitSpecViewSchema) }),
  ]),
).meta({ id: 'LimitSpec', description: 'A limit as written: one limit (EIRP, ERP, EIRP density, conducted power or density), or the lesser of several.' })

/** What a band-limit entry says (the fields an edit may change). */
export const bandLimitContentViewSchema = z.object({
  title: z.string(),
  bandsHz: z.array(z.object({ lowHz: z.number(), highHz: z.number() })),
  spec: limitSpecViewSchema,
  citation: z.string(),
  /** False: recalled, not checked against the regulation's text. */
  verified: z.boolean(),
  statusNote: z.string(),
  conditions: z.string().nullable(),
})

/** An entry of the national band-limit list. */
export const bandLimitViewSchema = bandLimitContentViewSchema.extend({
  id,
  /** The radio library's stable id of the entry, cited by findings. */
  key: z.string(),
  /** Sent back with an edit; the server refuses a stale one (409 stale_version). */
  version: z.number().int().min(1),
  updatedAt: instant,
  /** The name of whoever changed it last; null while it is as seeded. */
  updatedBy: z.string().nullable(),
})
export type BandLimitView = z.infer<typeof bandLimitViewSchema>

/** One edit of a band limit: who, when, why, and the changed fields before and after. */
export const bandLimitChangeViewSchema = z.object({
  id: z.number().int(),
  at: instant,
  by: z.string(),
  reason: z.string(),
  /** The entry's version this change made. */
  version: z.number().int().min(2),
  before: bandLimitContentViewSchema.partial(),
  after: bandLimitContentViewSchema.partial(),
})
export type BandLimitChangeView = z.infer<typeof bandLimitChangeViewSchema>

/** The bodies of the API's answers, by route (each wraps the shapes above in one named field). */
export const caseResponseSchema = z.object({ case: caseDetailSchema })
/** A move's answer: the case as it now stands; null when the move took it out of the actor's sight (a transfer). */
export const caseMoveResponseSchema = z.object({ case: caseDetailSchema.nullable() })
export type CaseMoveResponse = z.infer<typeof caseMoveResponseSchema>
export const mergeCandidatesResponseSchema = z.object({ candidates: z.array(mergeCandidateSchema) })
export const investigatorsResponseSchema = z.object({ investigators: z.array(investigatorLoadSchema) })
export const transferOfficesResponseSchema = z.object({ offices: z.array(transferOfficeSchema) })
export const complainantReportResponseSchema = z.object({ report: complainantReportSchema })
export const myReportsResponseSchema = z.object({ reports: z.array(myReportRowSchema) })
export const officesResponseSchema = z.object({ offices: z.array(officeViewSchema) })
export const officeResponseSchema = z.object({ office: officeViewSchema })
export const usersResponseSchema = z.object({ users: z.array(userRowSchema) })
export const userResponseSchema = z.object({ user: userRowSchema })
export const staffListResponseSchema = z.object({ staff: z.array(userRowSchema) })
export const staffMemberResponseSchema = z.object({ staff: userRowSchema })
export const mailboxResponseSchema = z.object({ messages: z.array(mailboxMessageSchema) })
export const bandLimitsResponseSchema = z.object({ bandLimits: z.array(bandLimitViewSchema) })
export const bandLimitResponseSchema = z.object({ bandLimit: bandLimitViewSchema })
export const bandLimitHistoryResponseSchema = z.object({ changes: z.array(bandLimitChangeViewSchema) })

/** A calculation record of a case (shared/calculations): inputs as read, the server's outputs, and what it rests on. */
type Json = string | number | boolean | null | Json[] | { [key: string]: Json }
/** Any JSON value (named, so the API document can refer to it from itself). */
const jsonValue: z.ZodType<Json> = z.lazy(() => z.union([z.string(), z.number(), z.boolean(), z.null(), z.array(jsonValue), z.record(z.string(), jsonValue)])).meta({ id: 'JsonValue' })
const methodRefSchema = z.object({ id: z.string(), source: z.string() })
export const calculationViewSchema = z.object({
  id,
  caseId: id,
  kind: z.enum(CALCULATION_KINDS),
  kindLabel: z.string(),
  /** As read: numbers in the base unit named in their key (freqHz, distanceM, eirpDbm). */
  inputs: z.record(z.string(), jsonValue),
  outputs: z.object({
    value: jsonValue,
    interval: z.object({ quantity: z.string(), low: z.number(), high: z.number(), basis: z.string() }).optional(),
  }),
  warnings: z.array(z.string()),
  methods: z.array(methodRefSchema),
  libraryVersion: z.string(),
  author: z.object({ id, name: z.string() }),
  at: instant,
  /** Copies of the references used (a band-limit entry, …), as they were when the record was made. */
  references: z.record(z.string(), jsonValue),
  measurementIds: z.array(z.string()),
  evidenceIds: z.array(z.string()),
})
export type CalculationView = z.infer<typeof calculationViewSchema>

/** A record recomputed with the current library: every output value, stored beside now. */
export const recomputeViewSchema = z.object({
  calculationId: id,
  kind: z.enum(CALCULATION_KINDS),
  storedLibraryVersion: z.string(),
  currentLibraryVersion: z.string(),
  sameLibraryVersion: z.boolean(),
  /** Relative tolerance under the same library version (1e-9). */
  tolerance: z.number(),
  differences: z.array(
    z.object({ path: z.string(), stored: jsonValue.optional(), now: jsonValue.optional(), relativeDifference: z.number().nullable(), differs: z.boolean() }),
  ),
  largestRelativeDifference: z.number(),
  /** Any value beyond the tolerance, or changed. */
  differs: z.boolean(),
  warningsNow: z.array(z.string()),
  methodsNow: z.array(methodRefSchema),
  /** When the record cannot be run again at all (its inputs no longer read), why. */
  refused: z.string().nullable(),
})
export type RecomputeView = z.infer<typeof recomputeViewSchema>

export const calculationResponseSchema = z.object({ calculation: calculationViewSchema })
export const calculationsResponseSchema = z.object({ calculations: z.array(calculationViewSchema) })
export const recomputeResponseSchema = z.object({ recompute: recomputeViewSchema })
