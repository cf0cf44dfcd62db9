/** POST …/withdraw — the complainant withdraws the report; it closes as withdrawn. */
import { useMutation, useQueryClient } from '@tanstack/react-query'
import { api } from '@/lib/api-client'
import { trackingKeys } from '@/lib/query-keys'
import { complainantReportKey, reportBasePath, type ComplainantReport, type ReportSource } from './get-complainant-report'

export const withdrawReport = (source: ReportSource, reason: string | undefined) =>
  api.post<{ report: ComplainantReport }>(`${reportBasePath(source)}/withdraw`, reason ? { reason } : {}).then((r) => r.report)

export function useWithdrawReport(source: ReportSource) {
  const queryClient = useQueryClient()
  return useMutation({
    mutationFn: (reason: string | undefined) => withdrawReport(source, reason),
    onSuccess: (report) => {
      queryClient.setQueryData(complainantReportKey(source), report)
      void queryClient.invalidateQueries({ queryKey: trackingKeys.myReports() })
    },
  })
}
