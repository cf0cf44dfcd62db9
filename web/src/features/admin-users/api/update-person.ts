/**
 * PATCH /api/admin/users/:id {role, officeId} — move a person to another role or office. Their
 * sessions end, and the open cases they held in the old office go back to its triage.
 */
import { useMutation, useQueryClient } from '@tanstack/react-query'
import type { PersonChangedResponse, UpdatePersonInput } from '@shared/schemas/people'
import { api } from '@/lib/api-client'
import { caseKeys, userKeys } from '@/lib/query-keys'

export const updatePerson = (options: { userId: string; changes: UpdatePersonInput }) =>
  api.patch<PersonChangedResponse>(`/api/admin/users/${encodeURIComponent(options.userId)}`, options.changes)

export function useUpdatePerson() {
  const queryClient = useQueryClient()
  return useMutation({
    mutationFn: updatePerson,
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: userKeys.all })
      // cases may have gone back to triage
      await queryClient.invalidateQueries({ queryKey: caseKeys.all })
    },
  })
}
