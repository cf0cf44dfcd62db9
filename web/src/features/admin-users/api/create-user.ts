/** POST /api/admin/users — a new staff account; the server e-mails a set-password link. */
import { useMutation, useQueryClient } from '@tanstack/react-query'
import type { CreateStaffInput } from '@shared/schemas/auth'
import { api } from '@/lib/api-client'
import { userKeys } from '@/lib/query-keys'
import type { AdminUser } from './get-users'

export const createUser = (input: CreateStaffInput) => api.post<{ user: AdminUser }>('/api/admin/users', input)

export function useCreateUser() {
  const queryClient = useQueryClient()
  return useMutation({
    mutationFn: createUser,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: userKeys.all }),
  })
}
