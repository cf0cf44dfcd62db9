/**
 * GET /api/track/:token (anyone holding the private link) or GET /api/my/reports/:id (the
 * signed-in complainant): the same plain view of one report either way.
 */
import { queryOptions, useQuery } from '@tanstack/react-query'
import type { ComplainantStep } from '../../../../../shared/domain/case-lifecycle'
import { api } from '../../../lib/api-client'

/** How the complainant reaches the report: the e-mailed link, or their account. */
export type ReportSource = { kind: 'token'; token: string } | { kind: 'account'; id: string }

export interface ComplainantEntry {
  at: string
  from: 'you' | 'office'
  /** 'status', 'message', 'information_requested', 'complainant_information', … */
  kind: string
  text: string
}

export interface ComplainantReport {
  reference: string
  /** Where the report stands, in the complainant's steps (the office's own states are not sent). */
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

export const reportBasePath = (source: ReportSource) =>
  source.kind === 'token' ? `/api/track/${encodeURIComponent(source.token)}` : `/api/my/reports/${encodeURIComponent(source.id)}`

export const complainantReportKey = (source: ReportSource) => ['complainant-report', source.kind, source.kind === 'token' ? source.token : source.id] as const

export const getComplainantReport = (source: ReportSource, signal?: AbortSignal) =>
  api.get<{ report: ComplainantReport }>(reportBasePath(source), signal).then((r) => r.report)

export const complainantReportQueryOptions = (source: ReportSource) =>
  queryOptions({ queryKey: complainantReportKey(source), queryFn: ({ signal }) => getComplainantReport(source, signal) })

export const useComplainantReport = (source: ReportSource) => useQuery(complainantReportQueryOptions(source))
