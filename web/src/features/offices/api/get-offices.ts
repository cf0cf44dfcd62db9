/** GET /api/offices — staff see their own office; an administrator sees all. */
import { queryOptions, useQuery } from '@tanstack/react-query'
import type { OfficeView } from '@shared/schemas/views'
import { api } from '@/lib/api-client'
import { officeKeys } from '@/lib/query-keys'

/** An office as the API answers it. */
export type Office = OfficeView

export const getOffices = (signal?: AbortSignal) => api.get<{ offices: Office[] }>('/api/offices', signal)

export const officesQueryOptions = () =>
  queryOptions({ queryKey: officeKeys.all, queryFn: ({ signal }) => getOffices(signal), staleTime: 5 * 60_000 })

export const useOffices = () => useQuery(officesQueryOptions())
