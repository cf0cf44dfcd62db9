/**
 * Every TanStack Query cache key of the web app, one factory per feature, so a query and the
 * calls that refresh it (invalidateQueries, setQueryData, removeQueries) name the same entry.
 * Keys are arrays from the general to the particular: invalidating `caseKeys.all` refreshes
 * every case list and case page, `caseKeys.lists()` only the lists. A new query adds its key
 * here; `queryKey: [` written by hand elsewhere is a mistake.
 */
import { listStateToSearchParams, type CaseListState } from './case-list-state'

/** The signed-in user and their abilities (GET /api/me); kept when another user signs in. */
export const meKeys = {
  all: ['me'] as const,
  /** The person's own saved views of the case list. */
  savedViews: () => ['me', 'saved-views'] as const,
}

/** Cases: the list (any filters), one case, and what a case's moves offer to choose from. */
export const caseKeys = {
  all: ['cases'] as const,
  lists: () => [...caseKeys.all, 'list'] as const,
  /** Keyed by the list's own URL query (defaults left out), so two states asking the same thing share an entry. */
  list: (filters: CaseListState) => [...caseKeys.lists(), listStateToSearchParams(filters).toString()] as const,
  detail: (caseId: string) => [...caseKeys.all, 'detail', caseId] as const,
  investigators: (caseId: string) => [...caseKeys.all, 'investigators', caseId] as const,
  mergeCandidates: (caseId: string) => [...caseKeys.all, 'merge-candidates', caseId] as const,
  /** The office's other open cases around a case, for its map. */
  nearbyCases: (caseId: string) => [...caseKeys.all, 'nearby-cases', caseId] as const,
  transferOffices: (caseId: string) => [...caseKeys.all, 'transfer-offices', caseId] as const,
  /** The case's findings (current and earlier proposals). */
  findings: (caseId: string) => [...caseKeys.all, 'findings', caseId] as const,
  /** The case's stored calculation records. */
  calculations: (caseId: string) => [...caseKeys.all, 'calculations', caseId] as const,
  /** A stored calculation run again with the current library. */
  recompute: (calculationId: string) => [...caseKeys.all, 'recompute', calculationId] as const,
  /** The case's measurements. */
  measurements: (caseId: string) => [...caseKeys.all, 'measurements', caseId] as const,
  /** The case's evidence files. */
  evidence: (caseId: string) => [...caseKeys.all, 'evidence', caseId] as const,
  /** One evidence file's chain of custody. */
  custody: (evidenceId: string) => [...caseKeys.all, 'custody', evidenceId] as const,
  /** One spectrum evidence file's analysis (summary, display trace, spectrogram). */
  analysis: (evidenceId: string) => [...caseKeys.all, 'analysis', evidenceId] as const,
}

/** The office's staff, for the case list's investigator filter. */
export const staffKeys = {
  all: ['staff'] as const,
}

/** Every account, for administrators. */
export const userKeys = {
  all: ['admin', 'users'] as const,
}

/** The audit log, per filter set and page (administrators). */
export const auditKeys = {
  all: ['admin', 'audit'] as const,
  list: (query: string) => [...auditKeys.all, query] as const,
}

/** The dashboard, per office filter ('all': every office in the viewer's scope). */
export const dashboardKeys = {
  all: ['dashboard'] as const,
  view: (officeId: string | null) => [...dashboardKeys.all, officeId ?? 'all'] as const,
}

/** The field offices and their response targets. */
export const officeKeys = {
  all: ['offices'] as const,
  /** One office as its edit page reads it (under `all`: saving any office refreshes it). */
  detail: (officeId: string) => [...officeKeys.all, 'detail', officeId] as const,
  /** A check of an area being drawn (its size and overlaps); apart from `all`, so saving an office does not re-ask it. */
  areaCheck: (request: { area: unknown; latDeg?: number; lonDeg?: number; officeId?: string }) => ['office-area-check', request] as const,
}

/** Retention: a case's legal hold and an office's retention period. */
export const retentionKeys = {
  all: ['retention'] as const,
  legalHold: (caseId: string) => [...retentionKeys.all, 'legal-hold', caseId] as const,
  office: (officeId: string) => [...retentionKeys.all, 'office', officeId] as const,
  /** What the next retention run would erase (administrators). */
  dryRun: () => [...retentionKeys.all, 'dry-run'] as const,
}

/** A complainant's reports: their list, and one report by tracking token or by account. */
export const trackingKeys = {
  myReports: () => ['my-reports'] as const,
  report: (via: 'token' | 'account', tokenOrId: string) => ['complainant-report', via, tokenOrId] as const,
  /** The files the complainant put on that report. */
  evidence: (via: 'token' | 'account', tokenOrId: string) => ['complainant-report', via, tokenOrId, 'evidence'] as const,
}

/** The public region map. */
export const regionKeys = {
  map: () => ['region-map'] as const,
}

/** The development mailbox. */
export const mailboxKeys = {
  all: ['dev', 'mailbox'] as const,
}

/** The national band-limit list, and each entry's history of changes. */
export const bandLimitKeys = {
  all: ['band-limits'] as const,
  list: () => [...bandLimitKeys.all, 'list'] as const,
  history: (bandLimitId: string) => [...bandLimitKeys.all, 'history', bandLimitId] as const,
}

/** The licence register: a search of a version's stations, the versions, one version's report. */
export const stationRegisterKeys = {
  all: ['station-register'] as const,
  stations: (search: { q?: string; freq?: string; page?: number; version?: number }) => [...stationRegisterKeys.all, 'stations', search] as const,
  versions: () => [...stationRegisterKeys.all, 'versions'] as const,
  version: (version: number) => [...stationRegisterKeys.all, 'version', version] as const,
}

/** An office's antennas-and-instruments register, and each item's history of changes. */
export const equipmentKeys = {
  all: ['equipment'] as const,
  list: (officeId: string) => [...equipmentKeys.all, 'list', officeId] as const,
  history: (equipmentId: string) => [...equipmentKeys.all, 'history', equipmentId] as const,
}

/**
 * A case's enforcement records: the responsible party with its notices and replies, and the
 * follow-ups. Under `caseKeys.all`, so a case move (closing creates a follow-up) refreshes them.
 */
export const enforcementKeys = {
  party: (caseId: string) => [...caseKeys.all, 'responsible-party', caseId] as const,
  followUps: (caseId: string) => [...caseKeys.all, 'follow-ups', caseId] as const,
  /** The viewer's follow-ups due today or overdue (the queue). */
  due: () => [...caseKeys.all, 'follow-ups-due'] as const,
}

/** What Quietband e-mails the signed-in person. */
export const notificationKeys = {
  myEmails: () => ['my-emails'] as const,
}

/** The API's own OpenAPI document, read by the API reference page. */
export const apiReferenceKeys = {
  document: () => ['api-reference', 'document'] as const,
}
