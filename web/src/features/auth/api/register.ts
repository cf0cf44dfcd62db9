/** POST /api/auth/register — a complainant account; the server signs the person in. */
import type { RegisterInput, SessionUser } from '../../../../../shared/schemas/auth'
import { api } from '../../../lib/api-client'
import { useSigningInMutation } from './remember-user'

export const register = (input: RegisterInput) => api.post<{ user: SessionUser }>('/api/auth/register', input)

export const useRegister = () => useSigningInMutation(register)
