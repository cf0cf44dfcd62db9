/**
 * Moving people and closing a case's tracking links: the requests an administrator and an
 * office supervisor send, and the answers they get.
 */
import { z } from 'zod'
import { ROLES } from '../domain/roles'
import { storableString } from './text'
import { userRowSchema } from './views'

/**
 * PATCH /api/admin/users/:id — any of role, office and whether the account may sign in. Which
 * combinations make sense depends on the account (staff belong to an office, administrators and
 * complainants to none; staff never become complainants nor the reverse): the server checks
 * those against the stored account and names the field.
 */
export const updatePersonSchema = z
  .object({
    role: z.enum(ROLES, { message: 'Choose a role.' }).optional(),
    officeId: z.uuid({ message: 'Choose an office.' }).nullable().optional(),
    active: z.boolean({ message: 'Say whether the account may sign in.' }).optional(),
  })
  .refine((v) => v.role !== undefined || v.officeId !== undefined || v.active !== undefined, {
    message: 'Say what to change: role, office or whether the account may sign in.',
    path: ['role'],
  })
export type UpdatePersonInput = z.infer<typeof updatePersonSchema>

/** The answer to PATCH /api/admin/users/:id: the account as it now stands, and what followed. */
export const personChangedResponseSchema = z.object({
  user: userRowSchema,
  /** Sessions of the account that were ended (a change of role, office or a deactivation ends them all). */
  sessionsEnded: z.number().int().min(0),
  /** Open cases assigned to the person in their old office that went back to that office's triage. */
  casesReturnedToTriage: z.number().int().min(0),
})
export type PersonChangedResponse = z.infer<typeof personChangedResponseSchema>

/** POST /api/cases/:id/tracking-links/revoke — why every link to the case stops working. */
export const revokeTrackingLinksSchema = z.object({
  reason: storableString().trim().min(3, { message: 'Say why the links are closed (at least 3 characters).' }).max(2000, { message: 'At most 2000 characters.' }),
})
export type RevokeTrackingLinksInput = z.infer<typeof revokeTrackingLinksSchema>

/** The answer: how many links stopped working (0 when none was open). */
export const trackingLinksRevokedResponseSchema = z.object({ revokedCount: z.number().int().min(0) })
export type TrackingLinksRevokedResponse = z.infer<typeof trackingLinksRevokedResponseSchema>
