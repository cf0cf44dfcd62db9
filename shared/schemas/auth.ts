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

/** The signed-in user as the session and /api/me give it. */
export const sessionUserSchema = z.object({
  id: z.uuid(),
  email: z.string(),
  name: z.string(),
  role: z.enum(ROLES),
  officeId: z.uuid().nullable(),
  officeName: z.string().nullable(),
})
export type SessionUser = z.infer<typeof sessionUserSchema>

/**
 * What an account may do across the product, computed by the server's policies. The web shows
 * pages, links and start pages from these and never reads the role to decide anything.
 */
export const accountAbilitiesSchema = z.object({
  /** Reports filed while signed in belong to the account (the report form fills in its name and address). */
  reportAsAccount: z.boolean(),
  /** Lists and follows the account's own reports. */
  followOwnReports: z.boolean(),
  /** Works the cases assigned to them (field work, findings). */
  workAssignedCases: z.boolean(),
  /** Runs the office's queue: triage, assignment, review of findings. */
  runOfficeQueue: z.boolean(),
  /** Reads the case list and case pages (of their office, or of every office). */
  readCases: z.boolean(),
  /** Lists, creates and deactivates accounts. */
  manageUsers: z.boolean(),
  /** Sets every office's response targets. */
  manageOffices: z.boolean(),
  /** Reads the national band-limit list and its history. */
  readBandLimits: z.boolean(),
  /** Edits band limits (with a reason; every change is kept). */
  manageBandLimits: z.boolean(),
  /** Reads the licence register (authorised stations) and its versions. */
  readStationRegister: z.boolean(),
  /** Imports a new version of the licence register from a CSV file. */
  importStationRegister: z.boolean(),
  /** Reads their office's antennas-and-instruments register (an administrator: every office's). */
  readEquipment: z.boolean(),
  /** Adds and edits items of that register (every change is kept). */
  manageEquipment: z.boolean(),
  /** Reads the dashboard: their office's (a supervisor) or every office's (an administrator). */
  readDashboard: z.boolean(),
  /** Reads the audit log of administrative changes, exports and openings of personal details. */
  readAudit: z.boolean(),
})
export type AccountAbilities = z.infer<typeof accountAbilitiesSchema>
export type AccountAbility = keyof AccountAbilities

/** What an anonymous visitor may do as an account: nothing (the public pages need none). */
export const NO_ACCOUNT_ABILITIES: AccountAbilities = {
  reportAsAccount: false,
  followOwnReports: false,
  workAssignedCases: false,
  runOfficeQueue: false,
  readCases: false,
  manageUsers: false,
  manageOffices: false,
  readBandLimits: false,
  manageBandLimits: false,
  readStationRegister: false,
  importStationRegister: false,
  readEquipment: false,
  manageEquipment: false,
  readDashboard: false,
  readAudit: false,
}

/** A signed-in session: the user and what the account may do (sign-in, confirmation, password, /api/me). */
export const signedInSchema = z.object({ user: sessionUserSchema, abilities: accountAbilitiesSchema })
export type SignedIn = z.infer<typeof signedInSchema>

/** GET /api/me: the signed-in user with their abilities, or `{ user: null }` for an anonymous visitor (200 either way). */
export const meResponseSchema = z.union([signedInSchema, z.object({ user: z.null() })])
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
