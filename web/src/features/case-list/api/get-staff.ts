/** GET /api/staff — the office's staff (all offices for an administrator), for the investigator filter. */
import { queryOptions, useQuery } from '@tanstack/react-query'
import type { UserRow } from '@shared/schemas/views'
import { api } from '@/lib/api-client'
import { staffKeys } from '@/lib/query-keys'

export type StaffMember = UserRow

export const getStaff = (signal?: AbortSignal) => api.get<{ staff: StaffMember[] }>('/api/staff', signal).then((r) => r.staff)

export const staffQueryOptions = () => queryOptions({ queryKey: staffKeys.all, queryFn: ({ signal }) => getStaff(signal), staleTime: 5 * 60_000 })

export const useStaff = () => useQuery(staffQueryOptions())
