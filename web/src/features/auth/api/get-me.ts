/**
 * GET /api/me — who is signed in and what their account may do; `{ user: null }` for an
 * anonymous visitor (200 either way). Pages, links and start pages follow the abilities.
 */
import { queryOptions, useQuery } from '@tanstack/react-query'
import { meResponseSchema, NO_ACCOUNT_ABILITIES, type AccountAbilities, type MeResponse } from '@shared/schemas/auth'
import { ApiError, api } from '@/lib/api-client'
import { meKeys } from '@/lib/query-keys'

/** The answer for an anonymous visitor (also what the cache holds after signing out). */
export const ANONYMOUS: MeResponse = { user: null }

export const getMe = (signal?: AbortSignal): Promise<MeResponse> => api.read(meResponseSchema, '/api/me', signal)

export const meQueryOptions = () =>
  queryOptions({
    queryKey: meKeys.all,
    queryFn: ({ signal }) => getMe(signal),
    staleTime: 5 * 60_000,
    // An unreachable server should not hold the page for long: one quick retry, then anonymous.
    retry: (failureCount, error) => !(error instanceof ApiError && error.status < 500 && error.status > 0) && failureCount < 1,
    retryDelay: 500,
  })

/** What the account may do: nothing for an anonymous visitor. */
export const abilitiesOf = (me: MeResponse | null | undefined): AccountAbilities => (me?.user ? me.abilities : NO_ACCOUNT_ABILITIES)

/** The signed-in user: `data` is the user, null when anonymous, undefined while loading. */
export const useMe = () => useQuery({ ...meQueryOptions(), select: (me: MeResponse) => me.user })

/** What the signed-in account may do: `data` is undefined while loading, all false when anonymous. */
export const useAbilities = () => useQuery({ ...meQueryOptions(), select: abilitiesOf })
