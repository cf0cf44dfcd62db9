/** POST /api/auth/confirm-email — confirms the address from the e-mailed link and signs in. */
import type { ConfirmEmailInput, SignedIn } from '@shared/schemas/auth'
import { api } from '@/lib/api-client'
import { useSigningInMutation } from './remember-user'

export const confirmEmail = (input: ConfirmEmailInput) => api.post<SignedIn>('/api/auth/confirm-email', input)

export const useConfirmEmail = () => useSigningInMutation(confirmEmail)
