/** GET /api/admin/users — every account (administrators only). */
import { queryOptions, useQuery } from '@tanstack/react-query'
import type { UserRow } from '../../../../../shared/schemas/views'
import { api } from '../../../lib/api-client'

export type AdminUser = UserRow

export const usersQueryKey = ['admin', 'users'] as const

export const getUsers = (signal?: AbortSignal) => api.get<{ users: AdminUser[] }>('/api/admin/users', signal)

export const usersQueryOptions = () => queryOptions({ queryKey: usersQueryKey, queryFn: ({ signal }) => getUsers(signal) })

export const useUsers = () => useQuery(usersQueryOptions())
