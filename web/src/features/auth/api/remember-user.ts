/**
 * Calls whose answer is a signed-in user (sign-in, register, set password): on success the
 * previous person's cached data is dropped and the new user kept.
 */
import { useMutation, useQueryClient } from '@tanstack/react-query'
import type { SessionUser } from '../../../../../shared/schemas/auth'
import { meQueryKey } from './get-me'

export function useSigningInMutation<I>(mutationFn: (input: I) => Promise<{ user: SessionUser }>) {
  const queryClient = useQueryClient()
  return useMutation({
    mutationFn,
    onSuccess: ({ user }) => {
      queryClient.removeQueries({ predicate: (q) => q.queryKey[0] !== meQueryKey[0] })
      queryClient.setQueryData(meQueryKey, user)
    },
  })
}
