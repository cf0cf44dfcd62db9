/** POST /api/auth/sign-out, then leave for the home page and forget everything cached. */
import { useMutation, useQueryClient } from '@tanstack/react-query'
import { useNavigate } from 'react-router-dom'
import { api } from '@/lib/api-client'
import { meKeys } from '@/lib/query-keys'
import { paths } from '@/lib/paths'
import { ANONYMOUS } from './get-me'

export const signOut = () => api.post<void>('/api/auth/sign-out')

export function useSignOut() {
  const queryClient = useQueryClient()
  const navigate = useNavigate()
  return useMutation({
    mutationFn: signOut,
    onSuccess: async () => {
      // Leave the signed-in page first, so its guard does not bounce to sign-in mid-way.
      await navigate(paths.home.href(), { replace: true })
      queryClient.clear()
      queryClient.setQueryData(meKeys.all, ANONYMOUS)
    },
  })
}
