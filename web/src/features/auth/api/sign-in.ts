/** POST /api/auth/sign-in */
import { useMutation, useQueryClient } from '@tanstack/react-query'
import type { SessionUser, SignInInput } from '../../../../../shared/schemas/auth'
import { api } from '../../../lib/api-client'
import { rememberUser } from './remember-user'

export const signIn = (input: SignInInput) => api.post<{ user: SessionUser }>('/api/auth/sign-in', input)

export function useSignIn() {
  const queryClient = useQueryClient()
  return useMutation({
    mutationFn: signIn,
    onSuccess: ({ user }) => rememberUser(queryClient, user),
  })
}
