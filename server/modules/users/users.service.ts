/** Staff accounts, managed by an administrator. */
import { withTransaction } from '../../db/client'
import type { ServiceContext } from '../../context'
import { badRequest, conflict, forbidden, notFound } from '../../http/errors'
import { queueMail } from '../../jobs/boss'
import { staffInvitationMail } from '../../mail/templates'
import { can, officeScope, type Actor } from '../../policy/policy'
import type { CreateStaffInput } from '../../../shared/schemas/auth'
import { insertPasswordToken } from '../auth/auth.repo'
import { newToken } from '../auth/passwords'
import { recordAudit } from '../audit/audit.repo'
import { findOffice } from '../offices/offices.repo'
import { findUserById, insertUser, listUsers, type PublicUser } from './users.repo'

export const INVITE_TOKEN_HOURS = 72

export async function listAllUsers(ctx: ServiceContext, actor: Actor): Promise<PublicUser[]> {
  if (!can(actor, 'user.list')) throw forbidden()
  return listUsers(ctx.db)
}

/** Creates a staff account without a password and e-mails a single-use set-password link. */
export async function createStaffUser(ctx: ServiceContext, actor: Actor, input: CreateStaffInput): Promise<PublicUser> {
  if (!can(actor, 'user.create')) throw forbidden()
  const officeId = input.role === 'admin' ? null : input.officeId
  if (officeId) {
    if (!(await findOffice(ctx.db, officeId))) throw badRequest('validation_failed', 'Some fields need attention.', [{ path: 'officeId', message: 'No such office.' }])
  }
  const id = await withTransaction(ctx.pool, async ({ db, client }) => {
    const userId = await insertUser(db, { email: input.email, name: input.name, role: input.role, officeId })
    if (!userId) throw conflict('email_taken', 'An account with this e-mail address already exists.')
    const { token, tokenHash } = newToken()
    await insertPasswordToken(db, { userId, tokenHash, purpose: 'invite', hours: INVITE_TOKEN_HOURS })
    const link = `${ctx.publicUrl}/set-password?token=${encodeURIComponent(token)}`
    await queueMail(ctx.boss, client, staffInvitationMail({ to: input.email, name: input.name, link, expiresHours: INVITE_TOKEN_HOURS }), ctx.mailQueue)
    await recordAudit(db, { actorUserId: actor.id, action: 'user.invited', targetType: 'user', targetId: userId, officeId, details: { role: input.role } })
    return userId
  })
  return (await findUserById(ctx.db, id))!
}

/** Staff of the actor's office (all offices for an administrator). */
export async function listStaff(ctx: ServiceContext, actor: Actor): Promise<PublicUser[]> {
  if (!can(actor, 'staff.list')) throw forbidden()
  const scope = officeScope(actor)
  if ('none' in scope) return []
  const staff = await listUsers(ctx.db, { staffOnly: true, ...('officeId' in scope ? { officeId: scope.officeId } : {}) })
  return staff.map((u) => signInsFor(actor, u))
}

/** When colleagues last signed in is for administrators (the users page) only. */
const signInsFor = (actor: Actor, u: PublicUser): PublicUser => (can(actor, 'user.list') ? u : { ...u, lastSignedInAt: null })

/** One staff member; another office's staff member is not found (404), not forbidden. */
export async function getStaffMember(ctx: ServiceContext, actor: Actor, userId: string): Promise<PublicUser> {
  if (!can(actor, 'staff.list')) throw forbidden()
  const u = await findUserById(ctx.db, userId)
  if (!u || (u.role !== 'investigator' && u.role !== 'supervisor') || !can(actor, 'staff.read', u)) {
    throw notFound('user_not_found', 'No such staff member.')
  }
  return signInsFor(actor, u)
}
