/** POST /api/auth/register — a complainant account; the server signs the person in. */
import { useMutation, useQueryClient } from '@tanstack/react-query'
import type { RegisterInput, SessionUser } from '../../../../../shared/schemas/auth'
import { api } from '../../../lib/api-client'
import { rememberUser } from './remember-user'

export const register = (input: RegisterInput) => api.post<{ user: SessionUser }>('/api/auth/register', input)

export function useRegister() {
  const queryClient = useQueryClient()
  return useMutation({
    mutationFn: register,
    onSuccess: ({ user }) => rememberUser(queryClient, user),
  })
}
