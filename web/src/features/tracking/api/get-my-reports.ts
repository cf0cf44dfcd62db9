/** GET /api/my/reports — a signed-in complainant's reports, newest first. */
import { queryOptions, useQuery } from '@tanstack/react-query'
import { api } from '@/lib/api-client'
import { trackingKeys } from '@/lib/query-keys'
import type { MyReportRow } from '@shared/schemas/views'
export type { MyReportRow }

export const getMyReports = (signal?: AbortSignal) => api.get<{ reports: MyReportRow[] }>('/api/my/reports', signal).then((r) => r.reports)

export const myReportsQueryOptions = () => queryOptions({ queryKey: trackingKeys.myReports(), queryFn: ({ signal }) => getMyReports(signal) })

export const useMyReports = () => useQuery(myReportsQueryOptions())
