/** POST …/information — the complainant adds what they noticed since; the answer is the updated report. */
import { useMutation, useQueryClient } from '@tanstack/react-query'
import { api } from '@/lib/api-client'
import { complainantReportKey, reportBasePath, type ComplainantReport, type ReportSource } from './get-complainant-report'

export const addInformation = (source: ReportSource, body: string) =>
  api.post<{ report: ComplainantReport }>(`${reportBasePath(source)}/information`, { body }).then((r) => r.report)

export function useAddInformation(source: ReportSource) {
  const queryClient = useQueryClient()
  return useMutation({
    mutationFn: (body: string) => addInformation(source, body),
    onSuccess: (report) => queryClient.setQueryData(complainantReportKey(source), report),
  })
}
