/**
 * Every page's URL, in one place: `path` is the router's pattern (app/router.tsx), `href(…)`
 * builds a link to it from typed values (ids, tokens, the case list's filters), encoding what
 * needs encoding. Links, redirects, navigation and the main nav all use these; a page address
 * written as a string elsewhere is a mistake.
 */
import { DEFAULT_LIST_STATE, listStateToSearchParams, type CaseListState } from './case-list-state'

const page = <P extends string>(path: P) => ({ path, href: () => path })

/** `?name=value` for a value that is set, '' otherwise. */
const query = (name: string, value: string | null | undefined) => (value ? `?${new URLSearchParams({ [name]: value })}` : '')

export const paths = {
  home: page('/'),
  /** `next`: the page (path and query) to return to after signing in. */
  signIn: { path: '/sign-in', href: (next?: string) => `/sign-in${query('next', next)}` },
  register: page('/register'),
  forgotPassword: page('/forgot-password'),
  /** Opened from an e-mailed link that carries the token. */
  setPassword: { path: '/set-password', href: (token?: string) => `/set-password${query('token', token)}` },
  confirmEmail: { path: '/confirm-email', href: (token?: string) => `/confirm-email${query('token', token)}` },
  report: page('/report'),
  track: page('/track'),
  trackReport: { path: '/track/:token', href: (token: string) => `/track/${encodeURIComponent(token)}` },
  devMailbox: page('/dev/mailbox'),
  work: page('/work'),
  /** The supervisor's own office: its targets and time zone. */
  officeSettings: page('/office/settings'),
  /** The office at a glance (supervisors: their office; administrators: every office, or one by `officeId`). */
  dashboard: { path: '/dashboard', href: (officeId?: string | null) => `/dashboard${query('officeId', officeId)}` },
  /** The case list; `filters` are written to the query as the list itself writes them (defaults left out). */
  cases: {
    path: '/cases',
    href: (filters: Partial<CaseListState> = {}) => {
      const search = listStateToSearchParams({ ...DEFAULT_LIST_STATE, ...filters }).toString()
      return search ? `/cases?${search}` : '/cases'
    },
  },
  case: { path: '/cases/:id', href: (caseId: string) => `/cases/${encodeURIComponent(caseId)}` },
  admin: page('/admin'),
  adminUsers: page('/admin/users'),
  /** The offices; `officeId` chooses whose settings show (the first office otherwise). */
  adminOffices: { path: '/admin/offices', href: (officeId?: string | null) => `/admin/offices${query('officeId', officeId)}` },
  /** A new field office with its area (administrators). */
  adminOfficeNew: page('/admin/offices/new'),
  /** An office's details and area (administrators). */
  adminOfficeEdit: { path: '/admin/offices/:id/edit', href: (officeId: string) => `/admin/offices/${encodeURIComponent(officeId)}/edit` },
  /** The audit log: administrative changes, exports and openings of personal details (administrators). */
  adminAudit: page('/admin/audit'),
  /** The national band-limit list (staff read it; supervisors and administrators edit it). */
  bandLimits: page('/registers/band-limits'),
  /** The licence register: authorised stations (staff read it; administrators import new versions). */
  stationRegister: page('/registers/stations'),
  /** The office's antennas and instruments (staff read it; the supervisor and administrators keep it). */
  equipment: page('/registers/equipment'),
  /** The quick calculator: the estimate forms without a case; its inputs live in the query. */
  calculator: page('/calculator'),
  myReports: page('/my-reports'),
  myReport: { path: '/my-reports/:id', href: (reportId: string) => `/my-reports/${encodeURIComponent(reportId)}` },
  /** What Quietband e-mails the signed-in person (every role). */
  myEmails: page('/account/emails'),
  /** The API reference for integrators, read from the API's OpenAPI document (public). */
  apiReference: page('/api-reference'),
} as const
