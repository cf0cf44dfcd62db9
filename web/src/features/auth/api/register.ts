/**
 * POST /api/auth/register — a complainant account. The answer is the same whether or not the
 * address has an account already; the e-mail tells the rest, and nobody is signed in yet.
 */
import { useMutation } from '@tanstack/react-query'
import type { AccountRequestResponse, RegisterInput } from '@shared/schemas/auth'
import { api } from '@/lib/api-client'

export const register = (input: RegisterInput) => api.post<AccountRequestResponse>('/api/auth/register', input)

export const useRegister = () => useMutation({ mutationFn: register })
