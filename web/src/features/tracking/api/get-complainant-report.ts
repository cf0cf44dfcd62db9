/**
 * GET /api/track/:token (anyone holding the private link) or GET /api/my/reports/:id (the
 * signed-in complainant): the same plain view of one report either way.
 */
import { queryOptions, useQuery } from '@tanstack/react-query'
import { api } from '@/lib/api-client'
import { trackingKeys } from '@/lib/query-keys'
import type { ComplainantEntry, ComplainantReport } from '@shared/schemas/views'
export type { ComplainantEntry, ComplainantReport }

/** How the complainant reaches the report: the e-mailed link, or their account. */
export type ReportSource = { kind: 'token'; token: string } | { kind: 'account'; id: string }

export const reportBasePath = (source: ReportSource) =>
  source.kind === 'token' ? `/api/track/${encodeURIComponent(source.token)}` : `/api/my/reports/${encodeURIComponent(source.id)}`

export const complainantReportKey = (source: ReportSource) => trackingKeys.report(source.kind, source.kind === 'token' ? source.token : source.id)

export const getComplainantReport = (source: ReportSource, signal?: AbortSignal) =>
  api.get<{ report: ComplainantReport }>(reportBasePath(source), signal).then((r) => r.report)

export const complainantReportQueryOptions = (source: ReportSource) =>
  queryOptions({ queryKey: complainantReportKey(source), queryFn: ({ signal }) => getComplainantReport(source, signal) })

export const useComplainantReport = (source: ReportSource) => useQuery(complainantReportQueryOptions(source))
