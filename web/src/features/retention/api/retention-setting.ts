/** GET and PUT /api/offices/:id/retention — the months a closed case keeps its complainant's personal data. */
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query'
import { retentionSettingResponseSchema, type RetentionSettingView } from '@shared/schemas/retention'
import { api } from '@/lib/api-client'
import { retentionKeys } from '@/lib/query-keys'

const base = (officeId: string) => `/api/offices/${encodeURIComponent(officeId)}/retention`

export const useRetentionSetting = (officeId: string) =>
  useQuery({ queryKey: retentionKeys.office(officeId), queryFn: ({ signal }) => api.read(retentionSettingResponseSchema, base(officeId), signal).then((r) => r.retention) })

export function useSetRetention(officeId: string) {
  const queryClient = useQueryClient()
  return useMutation({
    /** The months as typed: the server reads them with the strict number parser. */
    mutationFn: (retentionMonths: string) => api.put<{ retention: RetentionSettingView }>(base(officeId), { retentionMonths }).then((r) => r.retention),
    onSuccess: (retention) => queryClient.setQueryData(retentionKeys.office(officeId), retention),
  })
}
