/** POST /api/auth/sign-in */
import type { SignedIn, SignInInput } from '@shared/schemas/auth'
import { api } from '@/lib/api-client'
import { useSigningInMutation } from './remember-user'

export const signIn = (input: SignInInput) => api.post<SignedIn>('/api/auth/sign-in', input)

export const useSignIn = () => useSigningInMutation(signIn)
