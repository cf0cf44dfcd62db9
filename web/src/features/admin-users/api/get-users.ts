/** GET /api/admin/users — every account (administrators only). */
import { queryOptions, useQuery } from '@tanstack/react-query'
import type { Role } from '../../../../../shared/domain/roles'
import { api } from '../../../lib/api-client'

export interface AdminUser {
  id: string
  email: string
  name: string
  role: Role
  officeId: string | null
  officeName: string | null
  active: boolean
  /** ISO 8601 */
  createdAt: string
}

export const usersQueryKey = ['admin', 'users'] as const

export const getUsers = (signal?: AbortSignal) => api.get<{ users: AdminUser[] }>('/api/admin/users', signal)

export const usersQueryOptions = () => queryOptions({ queryKey: usersQueryKey, queryFn: ({ signal }) => getUsers(signal) })

export const useUsers = () => useQuery(usersQueryOptions())
