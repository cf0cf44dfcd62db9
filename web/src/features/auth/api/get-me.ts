/** GET /api/me — who is signed in: the user, or null for an anonymous visitor (200 either way). */
import { queryOptions, useQuery } from '@tanstack/react-query'
import type { MeResponse, SessionUser } from '../../../../../shared/schemas/auth'
import { ApiError, api } from '../../../lib/api-client'
import { ME_QUERY_KEY } from '../../../lib/query-client'

export const meQueryKey = ME_QUERY_KEY

export async function getMe(signal?: AbortSignal): Promise<SessionUser | null> {
  const { user } = await api.get<MeResponse>('/api/me', signal)
  return user
}

export const meQueryOptions = () =>
  queryOptions({
    queryKey: meQueryKey,
    queryFn: ({ signal }) => getMe(signal),
    staleTime: 5 * 60_000,
    // An unreachable server should not hold the page for long: one quick retry, then anonymous.
    retry: (failureCount, error) => !(error instanceof ApiError && error.status < 500 && error.status > 0) && failureCount < 1,
    retryDelay: 500,
  })

/** The signed-in user: `data` is the user, null when anonymous, undefined while loading. */
export const useMe = () => useQuery(meQueryOptions())
