/** GET /api/my/reports — a signed-in complainant's reports, newest first. */
import { queryOptions, useQuery } from '@tanstack/react-query'
import type { ComplainantStep } from '../../../../../shared/domain/case-lifecycle'
import { api } from '../../../lib/api-client'

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

export const getMyReports = (signal?: AbortSignal) => api.get<{ reports: MyReportRow[] }>('/api/my/reports', signal).then((r) => r.reports)

export const myReportsQueryOptions = () => queryOptions({ queryKey: ['my-reports'], queryFn: ({ signal }) => getMyReports(signal) })

export const useMyReports = () => useQuery(myReportsQueryOptions())
