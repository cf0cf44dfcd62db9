/** Request and response contracts for sign-in, accounts and passwords (server and forms). */
import { z } from 'zod'
import { ROLES } from '../domain/roles'
import { storableString } from './text'

export const emailSchema = z.string().trim().toLowerCase().max(254).pipe(z.email({ message: 'Enter a valid e-mail address.' }))

/** At least 10 characters; long passphrases welcome (up to 200). */
export const passwordSchema = z
  .string()
  .min(10, { message: 'Use at least 10 characters.' })
  .max(200, { message: 'Use at most 200 characters.' })

export const signInSchema = z.object({
  email: emailSchema,
  password: z.string().min(1, { message: 'Enter your password.' }).max(200),
})
export type SignInInput = z.infer<typeof signInSchema>

export const registerSchema = z.object({
  name: storableString().trim().min(1, { message: 'Enter your name.' }).max(120),
  email: emailSchema,
  password: passwordSchema,
})
export type RegisterInput = z.infer<typeof registerSchema>

export const resetRequestSchema = z.object({ email: emailSchema })
export type ResetRequestInput = z.infer<typeof resetRequestSchema>

export const setPasswordSchema = z.object({
  token: z.string().min(20).max(200),
  password: passwordSchema,
})
export type SetPasswordInput = z.infer<typeof setPasswordSchema>

/** The token of an e-mailed confirmation link (/confirm-email?token=…). */
export const confirmEmailSchema = z.object({ token: z.string().min(20).max(200) })
export type ConfirmEmailInput = z.infer<typeof confirmEmailSchema>

export const createStaffSchema = z.object({
  name: storableString().trim().min(1, { message: 'Enter a name.' }).max(120),
  email: emailSchema,
  role: z.enum(['investigator', 'supervisor', 'admin']),
  officeId: z.uuid().nullable(),
}).refine((v) => v.role === 'admin' || v.officeId !== null, {
  message: 'Investigators and supervisors belong to an office.',
  path: ['officeId'],
})
export type CreateStaffInput = z.infer<typeof createStaffSchema>

export const sessionUserSchema = z.object({
  id: z.uuid(),
  email: z.string(),
  name: z.string(),
  role: z.enum(ROLES),
  officeId: z.uuid().nullable(),
  officeName: z.string().nullable(),
})
export type SessionUser = z.infer<typeof sessionUserSchema>

/** GET /api/me: the signed-in user, or null for an anonymous visitor (200 either way). */
export const meResponseSchema = z.object({ user: sessionUserSchema.nullable() })
export type MeResponse = z.infer<typeof meResponseSchema>

/** Registration and reset requests: one answer whether or not the address has an account. */
export const accountRequestResponseSchema = z.object({ ok: z.literal(true) })
export type AccountRequestResponse = z.infer<typeof accountRequestResponseSchema>

/** Response targets of an office, in hours per priority. */
export const responseTargetsSchema = z.object({
  p1: z.number().int().min(1, { message: 'At least 1 hour.' }).max(24 * 90),
  p2: z.number().int().min(1, { message: 'At least 1 hour.' }).max(24 * 90),
  p3: z.number().int().min(1, { message: 'At least 1 hour.' }).max(24 * 90),
  p4: z.number().int().min(1, { message: 'At least 1 hour.' }).max(24 * 90),
})
