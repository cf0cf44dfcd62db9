/**
 * PUT /api/offices/:id/response-targets (resolution) and /first-response-targets — one of an
 * office's targets per harm class, in hours.
 */
import { useMutation, useQueryClient } from '@tanstack/react-query'
import type { z } from 'zod'
import type { responseTargetsSchema } from '@shared/schemas/auth'
import type { CaseClockName } from '@shared/domain/case-clocks'
import { api } from '@/lib/api-client'
import { caseKeys, dashboardKeys, officeKeys } from '@/lib/query-keys'
import type { Office } from './get-offices'

export type ResponseTargets = z.infer<typeof responseTargetsSchema>

const ROUTE: Record<CaseClockName, string> = { firstResponse: 'first-response-targets', resolution: 'response-targets' }

export const setResponseTargets = (options: { officeId: string; clock: CaseClockName; targets: ResponseTargets }) =>
  api.put<{ office: Office }>(`/api/offices/${encodeURIComponent(options.officeId)}/${ROUTE[options.clock]}`, options.targets)

export function useSetResponseTargets() {
  const queryClient = useQueryClient()
  return useMutation({
    mutationFn: setResponseTargets,
    // due times of open cases follow the new targets: lists, case pages and the dashboard refresh too
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: officeKeys.all }),
        queryClient.invalidateQueries({ queryKey: caseKeys.all }),
        queryClient.invalidateQueries({ queryKey: dashboardKeys.all }),
      ]),
  })
}
