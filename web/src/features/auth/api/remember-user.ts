/** After any call that signs someone in: drop the previous person's cached data, keep the new user. */
import type { QueryClient } from '@tanstack/react-query'
import type { SessionUser } from '../../../../../shared/schemas/auth'
import { meQueryKey } from './get-me'

export function rememberUser(queryClient: QueryClient, user: SessionUser) {
  queryClient.removeQueries({ predicate: (q) => q.queryKey[0] !== meQueryKey[0] })
  queryClient.setQueryData(meQueryKey, user)
}
