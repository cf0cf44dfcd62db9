/** One QueryClient for the app: no retries on 4xx (they will not change), a short retry otherwise. */
import { MutationCache, QueryCache, QueryClient } from '@tanstack/react-query'
import { isApiError } from './api-client'
import { meKeys } from './query-keys'

export function shouldRetry(failureCount: number, error: unknown): boolean {
  if (isApiError(error) && error.status >= 400 && error.status < 500) return false
  return failureCount < 2
}

export function createQueryClient(): QueryClient {
  const client: QueryClient = new QueryClient({
    // A 401 anywhere means the session is gone: forget the user so guards send them to sign-in.
    queryCache: new QueryCache({ onError: (error) => forgetUserOn401(client, error) }),
    mutationCache: new MutationCache({ onError: (error) => forgetUserOn401(client, error) }),
    defaultOptions: {
      queries: { retry: shouldRetry, staleTime: 30_000 },
      mutations: { retry: false },
    },
  })
  return client
}

function forgetUserOn401(client: QueryClient, error: unknown) {
  if (isApiError(error) && error.status === 401 && error.code === 'unauthenticated') {
    client.setQueryData(meKeys.all, { user: null })
  }
}
