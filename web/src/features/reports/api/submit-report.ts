/** POST /api/reports — anyone may report; a signed-in complainant's report joins their account. */
import { useMutation, useQueryClient } from '@tanstack/react-query'
import type { Report, ReportWarning } from '../../../../../shared/schemas/cases'
import { api } from '../../../lib/api-client'

export interface SubmittedReport {
  reference: string
  officeName: string
  /** The private tracking link, also e-mailed to the complainant. */
  trackingUrl: string
  /** Things to check about the report, which was filed all the same (a place far from every office). */
  warnings: ReportWarning[]
}

export const submitReport = (input: Report) => api.post<SubmittedReport>('/api/reports', input)

export function useSubmitReport() {
  const queryClient = useQueryClient()
  return useMutation({
    mutationFn: submitReport,
    // A signed-in complainant's list gains the new report.
    onSuccess: () => queryClient.invalidateQueries({ queryKey: ['my-reports'] }),
  })
}
