/** POST /api/auth/set-password — finishes a reset or a new-staff invitation and signs in. */
import type { SetPasswordInput, SignedIn } from '@shared/schemas/auth'
import { api } from '@/lib/api-client'
import { useSigningInMutation } from './remember-user'

export const setPassword = (input: SetPasswordInput) => api.post<SignedIn>('/api/auth/set-password', input)

export const useSetPassword = () => useSigningInMutation(setPassword)
