/** GET /api/dashboard?officeId= — the office at a glance (refreshed every minute while open). */
import { queryOptions, useQuery } from '@tanstack/react-query'
import type { DashboardView } from '@shared/schemas/dashboard'
import { api } from '@/lib/api-client'
import { dashboardKeys } from '@/lib/query-keys'
export type { DashboardView }

export const getDashboard = (officeId: string | null, signal?: AbortSignal) =>
  api.get<DashboardView>(`/api/dashboard${officeId ? `?${new URLSearchParams({ officeId })}` : ''}`, signal)

export const dashboardQueryOptions = (officeId: string | null) =>
  queryOptions({ queryKey: dashboardKeys.view(officeId), queryFn: ({ signal }) => getDashboard(officeId, signal), staleTime: 30_000, refetchInterval: 60_000 })

export const useDashboard = (officeId: string | null) => useQuery(dashboardQueryOptions(officeId))
