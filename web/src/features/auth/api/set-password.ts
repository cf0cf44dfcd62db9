/** POST /api/auth/set-password — finishes a reset or a new-staff invitation and signs in. */
import { useMutation, useQueryClient } from '@tanstack/react-query'
import type { SessionUser, SetPasswordInput } from '../../../../../shared/schemas/auth'
import { api } from '../../../lib/api-client'
import { rememberUser } from './remember-user'

export const setPassword = (input: SetPasswordInput) => api.post<{ user: SessionUser }>('/api/auth/set-password', input)

export function useSetPassword() {
  const queryClient = useQueryClient()
  return useMutation({
    mutationFn: setPassword,
    onSuccess: ({ user }) => rememberUser(queryClient, user),
  })
}
