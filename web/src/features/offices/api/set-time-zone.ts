/** PUT /api/offices/:id/time-zone — the office's IANA time zone ("today" on the dashboard, the digest). */
import { useMutation, useQueryClient } from '@tanstack/react-query'
import { api } from '@/lib/api-client'
import { dashboardKeys, officeKeys } from '@/lib/query-keys'
import type { Office } from './get-offices'

export const setTimeZone = (options: { officeId: string; timeZone: string }) =>
  api.put<{ office: Office }>(`/api/offices/${encodeURIComponent(options.officeId)}/time-zone`, { timeZone: options.timeZone })

export function useSetTimeZone() {
  const queryClient = useQueryClient()
  return useMutation({
    mutationFn: setTimeZone,
    onSuccess: () => Promise.all([queryClient.invalidateQueries({ queryKey: officeKeys.all }), queryClient.invalidateQueries({ queryKey: dashboardKeys.all })]),
  })
}
