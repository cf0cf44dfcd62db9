/** GET /api/admin/users — every account (administrators only). */
import { queryOptions, useQuery } from '@tanstack/react-query'
import type { UserRow } from '@shared/schemas/views'
import { api } from '@/lib/api-client'
import { userKeys } from '@/lib/query-keys'

export type AdminUser = UserRow

export const getUsers = (signal?: AbortSignal) => api.get<{ users: AdminUser[] }>('/api/admin/users', signal)

export const usersQueryOptions = () => queryOptions({ queryKey: userKeys.all, queryFn: ({ signal }) => getUsers(signal) })

export const useUsers = () => useQuery(usersQueryOptions())
