/** POST /api/reports — anyone may report; a signed-in complainant's report joins their account. */
import { useMutation, useQueryClient } from '@tanstack/react-query'
import type { Report } from '@shared/schemas/cases'
import type { SubmittedReportView } from '@shared/schemas/views'
import { api } from '@/lib/api-client'
import { trackingKeys } from '@/lib/query-keys'

/** Where the report went, its private tracking link (also e-mailed), and anything to check about it. */
export type SubmittedReport = SubmittedReportView

export const submitReport = (input: Report) => api.post<SubmittedReport>('/api/reports', input)

export function useSubmitReport() {
  const queryClient = useQueryClient()
  return useMutation({
    mutationFn: submitReport,
    // A signed-in complainant's list gains the new report.
    onSuccess: () => queryClient.invalidateQueries({ queryKey: trackingKeys.myReports() }),
  })
}
