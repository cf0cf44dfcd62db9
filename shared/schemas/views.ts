/**
 * What the API answers, as the browser receives it (JSON: times are ISO 8601 strings).
 * The server's presenters are typed with these and the web reads them, so the two sides
 * cannot drift apart without the type-check saying so.
 */
import type { CaseMoveName, CaseState, ComplainantStep } from '../domain/case-lifecycle'

export type PriorityLevel = 1 | 2 | 3 | 4

export interface TimelineEvent {
  id: number
  at: string
  /** A staff name, 'Complainant', or 'Quietband' for automatic steps. */
  actor: string
  kind: string
  fromState: string | null
  toState: string | null
  body: string | null
  visibility: 'internal' | 'complainant'
  data: Record<string, unknown> | null
}

export type CaseAbilities = Record<CaseMoveName, boolean> & { addInternalNote: boolean; messageComplainant: boolean }

export interface CaseDetail {
  id: string
  reference: string
  /** Sent back with every move; the server refuses a stale one (409 stale_version). */
  version: number
  status: CaseState
  statusLabel: string
  priority: PriorityLevel
  suggestedPriority: PriorityLevel
  service: string
  licenceRef: string | null
  freqLowHz: number
  freqHighHz: number
  address: string
  latDeg: number
  lonDeg: number
  sinceDate: string
  pattern: string
  patternDetail: string | null
  experience: string
  description: string
  complainant: { name: string; email: string; phone: string | null; organisation: string | null; hasAccount: boolean }
  officeId: string
  officeName: string
  investigatorId: string | null
  investigatorName: string | null
  mergedIntoCaseId: string | null
  mergedIntoReference: string | null
  resolution: string | null
  resolutionLabel: string | null
  closingSummary: string | null
  receivedAt: string
  dueAt: string
  closedAt: string | null
  overdue: boolean
  abilities: CaseAbilities
  timeline: TimelineEvent[]
}

export interface CaseListItem {
  id: string
  reference: string
  status: CaseState
  statusLabel: string
  priority: PriorityLevel
  service: string
  freqLowHz: number
  freqHighHz: number
  address: string
  officeId: string
  officeName: string
  investigatorId: string | null
  investigatorName: string | null
  complainantName: string
  receivedAt: string
  dueAt: string
  closedAt: string | null
  overdue: boolean
}

export interface CasePage {
  items: CaseListItem[]
  total: number
  page: number
  pageSize: number
}

export interface MergeCandidate {
  id: string
  reference: string
  status: string
  service: string
  address: string
  freqLowHz: number
  freqHighHz: number
  distanceM: number
  receivedAt: string
}

export interface InvestigatorLoad {
  id: string
  name: string
  openCases: number
}

export interface TransferOffice {
  id: string
  name: string
  /** Geodesic distance from the report's location to the office [m]. */
  distanceM: number
}

export interface ComplainantEntry {
  at: string
  from: 'you' | 'office'
  /** 'status', 'message', 'information_requested', 'complainant_information', … */
  kind: string
  text: string
}

/** The complainant's view of their report: plain steps, never the office's internal states or staff. */
export interface ComplainantReport {
  reference: string
  step: ComplainantStep
  statusLabel: string
  service: string
  freqLowHz: number
  freqHighHz: number
  address: string
  description: string
  receivedAt: string
  closedAt: string | null
  resolution: string | null
  resolutionLabel: string | null
  closingSummary: string | null
  entries: ComplainantEntry[]
  abilities: { withdraw: boolean; addInformation: boolean }
}

export interface MyReportRow {
  id: string
  reference: string
  step: ComplainantStep
  statusLabel: string
  service: string
  address: string
  freqLowHz: number
  freqHighHz: number
  receivedAt: string
  closedAt: string | null
}

export interface OfficeView {
  id: string
  name: string
  regionName: string
  centreLatDeg: number
  centreLonDeg: number
  /** Response target per priority, in hours. */
  responseTargetsHours: { p1: number; p2: number; p3: number; p4: number }
  /** What the viewer may do with this office (computed by the policy). */
  abilities: { setResponseTargets: boolean }
}

/** A message kept by the local SMTP fake, as the development mailbox lists it. */
export interface MailboxMessage {
  id: string
  from: string
  to: string[]
  subject: string
  date: string
  text: string
  html: string | null
  messageId: string | null
}
