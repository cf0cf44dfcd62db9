/** PATCH /api/admin/users/:id {active} — let an account sign in again, or stop it. */
import { useMutation, useQueryClient } from '@tanstack/react-query'
import { api } from '@/lib/api-client'
import { userKeys } from '@/lib/query-keys'
import type { PersonChangedResponse } from '@shared/schemas/people'
import type { AdminUser } from './get-users'

/** Answers the account and what followed: sessions ended, open cases returned to triage. */
export const setUserActive = (options: { userId: string; active: boolean }) =>
  api.patch<PersonChangedResponse>(`/api/admin/users/${encodeURIComponent(options.userId)}`, { active: options.active })

export function useSetUserActive() {
  const queryClient = useQueryClient()
  return useMutation({
    mutationFn: setUserActive,
    onSuccess: ({ user }) => {
      queryClient.setQueryData(userKeys.all, (old: { users: AdminUser[] } | undefined) =>
        old ? { users: old.users.map((u) => (u.id === user.id ? user : u)) } : old,
      )
      return queryClient.invalidateQueries({ queryKey: userKeys.all })
    },
  })
}
