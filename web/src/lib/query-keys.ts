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
  transferOffices: (caseId: string) => [...caseKeys.all, 'transfer-offices', caseId] as const,
}

/** The office's staff, for the case list's investigator filter. */
export const staffKeys = {
  all: ['staff'] as const,
}

/** Every account, for administrators. */
export const userKeys = {
  all: ['admin', 'users'] as const,
}

/** The field offices and their response targets. */
export const officeKeys = {
  all: ['offices'] as const,
}

/** A complainant's reports: their list, and one report by tracking token or by account. */
export const trackingKeys = {
  myReports: () => ['my-reports'] as const,
  report: (via: 'token' | 'account', tokenOrId: string) => ['complainant-report', via, tokenOrId] as const,
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
