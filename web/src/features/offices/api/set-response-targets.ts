/** PUT /api/offices/:id/response-targets — an office's response target per priority, in hours. */
import { useMutation, useQueryClient } from '@tanstack/react-query'
import type { z } from 'zod'
import type { responseTargetsSchema } from '@shared/schemas/auth'
import { api } from '@/lib/api-client'
import { caseKeys, officeKeys } from '@/lib/query-keys'
import type { Office } from './get-offices'

export type ResponseTargets = z.infer<typeof responseTargetsSchema>

export const setResponseTargets = (options: { officeId: string; targets: ResponseTargets }) =>
  api.put<{ office: Office }>(`/api/offices/${encodeURIComponent(options.officeId)}/response-targets`, options.targets)

export function useSetResponseTargets() {
  const queryClient = useQueryClient()
  return useMutation({
    mutationFn: setResponseTargets,
    // due times of open cases follow the new targets: lists and case pages refresh too
    onSuccess: () => Promise.all([queryClient.invalidateQueries({ queryKey: officeKeys.all }), queryClient.invalidateQueries({ queryKey: caseKeys.all })]),
  })
}
