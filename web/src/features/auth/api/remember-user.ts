/**
 * Calls whose answer is a signed-in session (sign-in, address confirmation, set password): on
 * success the previous person's cached data is dropped and the new user and abilities kept.
 */
import { useMutation, useQueryClient } from '@tanstack/react-query'
import type { MeResponse, SignedIn } from '@shared/schemas/auth'
import { meKeys } from '@/lib/query-keys'

export function useSigningInMutation<I>(mutationFn: (input: I) => Promise<SignedIn>) {
  const queryClient = useQueryClient()
  return useMutation({
    mutationFn,
    onSuccess: (session) => {
      queryClient.removeQueries({ predicate: (q) => q.queryKey[0] !== meKeys.all[0] })
      queryClient.setQueryData<MeResponse>(meKeys.all, session)
    },
  })
}
