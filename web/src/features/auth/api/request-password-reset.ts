/** POST /api/auth/password-reset — always 202, whether or not the address has an account (the e-mail says which). */
import { useMutation } from '@tanstack/react-query'
import type { ResetRequestInput } from '@shared/schemas/auth'
import { api } from '@/lib/api-client'

export const requestPasswordReset = (input: ResetRequestInput) => api.post<{ ok: true }>('/api/auth/password-reset', input)

export const useRequestPasswordReset = () => useMutation({ mutationFn: requestPasswordReset })
