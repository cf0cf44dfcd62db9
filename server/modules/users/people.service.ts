/**
 * Moving people: an administrator changes an account's role, office or whether it may sign in,
 * all in one transaction with what follows from it. A change of role or office (or a
 * deactivation) ends every session of the account; an investigator who leaves an office or the
 * investigator role hands back the open cases they held there, which return to that office's
 * triage ('triaged': priority kept, no investigator) with a timeline entry each; every change
 * is in the audit log. The last active administrator cannot be demoted or deactivated.
 */
import { ROLE_LABELS, type Role } from '../../../shared/domain/roles'
import type { UpdatePersonInput } from '../../../shared/schemas/people'
import { withTransaction, type Db } from '../../db/client'
import type { ServiceContext } from '../../context'
import { badRequest, conflict, forbidden, notFound } from '../../http/errors'
import { can, type Actor } from '../../policy/policy'
import { recordAudit } from '../audit/audit.repo'
import { appendEvent, updateCaseIfVersion } from '../cases/cases.repo'
import { findOffice } from '../offices/offices.repo'
import { endSessionsOfUser, lockActiveAdmins, lockOpenCasesAssignedTo, lockUser, setLastSignedIn, updateUserAccess } from './people.repo'
import { findUserById, type PublicUser } from './users.repo'

/** The timeline kind of a case handed back to triage because its investigator moved. */
export const RETURNED_TO_TRIAGE_KIND = 'returned_to_triage'

export interface PersonChanged {
  user: PublicUser
  sessionsEnded: number
  casesReturnedToTriage: number
}

const isStaff = (r: Role) => r === 'investigator' || r === 'supervisor'
const problems = (list: { path: string; message: string }[]) => badRequest('validation_failed', 'Some fields need attention.', list)

export const lastAdmin = () =>
  conflict('last_admin', 'This is the last active administrator: make another account an administrator first, then change or deactivate this one.')

/** Records a successful sign-in (any way of signing in) on the account. */
export function recordSignIn(db: Db, userId: string): Promise<void> {
  return setLastSignedIn(db, userId)
}

export async function updatePerson(ctx: ServiceContext, actor: Actor, userId: string, input: UpdatePersonInput): Promise<PersonChanged> {
  if (!can(actor, 'user.update')) throw forbidden()
  if (userId === actor.id && input.active === false) throw conflict('cannot_deactivate_self', 'You cannot deactivate your own account.')
  const result = await withTransaction(ctx.pool, async ({ db }) => {
    const seen = await findUserById(db, userId)
    if (!seen) throw notFound('user_not_found', 'No such user.')
    // administrators' rows are locked together, in id order, before the person's own row:
    // two administrators demoting each other at once run one after the other
    const activeAdmins = seen.role === 'admin' ? await lockActiveAdmins(db) : []
    const before = await lockUser(db, userId)
    if (!before) throw notFound('user_not_found', 'No such user.')

    const role = input.role ?? before.role
    const active = input.active ?? before.active
    const issues: { path: string; message: string }[] = []
    if (input.role !== undefined && input.role !== before.role) {
      if (before.role === 'complainant') issues.push({ path: 'role', message: 'A complainant account stays a complainant account; invite the person as staff with their work address.' })
      else if (input.role === 'complainant') issues.push({ path: 'role', message: 'A staff account cannot become a complainant account; the person can register one with another address.' })
    }
    let officeId: string | null
    if (isStaff(role)) {
      officeId = input.officeId !== undefined ? input.officeId : before.officeId
      if (officeId === null) issues.push({ path: 'officeId', message: `${ROLE_LABELS[role]}s belong to an office: choose one.` })
      else if (!(await findOffice(db, officeId))) issues.push({ path: 'officeId', message: 'No such office.' })
    } else {
      if (input.officeId) issues.push({ path: 'officeId', message: `${ROLE_LABELS[role]}s belong to no office.` })
      officeId = null
    }
    if (issues.length) throw problems(issues)

    const stillActiveAdmin = role === 'admin' && active
    if (before.role === 'admin' && before.active && !stillActiveAdmin && activeAdmins.filter((id) => id !== userId).length === 0) throw lastAdmin()

    const roleChanged = role !== before.role
    const officeChanged = officeId !== before.officeId
    const activeChanged = active !== before.active
    if (!roleChanged && !officeChanged && !activeChanged) return { sessionsEnded: 0, casesReturnedToTriage: 0 }

    await updateUserAccess(db, userId, { role, officeId, active })
    const sessionsEnded = roleChanged || officeChanged || !active ? await endSessionsOfUser(db, userId) : 0

    // an investigator who leaves the office or the role, or is deactivated, hands back the open cases held there
    let casesReturnedToTriage = 0
    if (before.role === 'investigator' && before.officeId && (role !== 'investigator' || officeChanged || (before.active && !active))) {
      const why = roleChanged ? `${before.name} is now ${ROLE_LABELS[role].toLowerCase()}` : officeChanged ? `${before.name} moved to another office` : `${before.name}'s account was deactivated`
      casesReturnedToTriage = await returnCasesToTriage(ctx, db, actor, before, why)
    }

    const audit = { actorUserId: actor.id, targetType: 'user', targetId: userId } as const
    if (roleChanged) {
      await recordAudit(db, { ...audit, action: 'user.role_changed', officeId: before.officeId ?? officeId, details: { fromRole: before.role, toRole: role, sessionsEnded, casesReturnedToTriage } })
    }
    if (officeChanged) {
      await recordAudit(db, { ...audit, action: 'user.office_changed', officeId: before.officeId ?? officeId, details: { fromOfficeId: before.officeId, toOfficeId: officeId, sessionsEnded, casesReturnedToTriage } })
    }
    if (activeChanged) {
      await recordAudit(db, { ...audit, action: active ? 'user.reactivated' : 'user.deactivated', officeId, details: { role, sessionsEnded, casesReturnedToTriage } })
    }
    return { sessionsEnded, casesReturnedToTriage }
  })
  return { user: (await findUserById(ctx.db, userId))!, ...result }
}

/** Returns the investigator's open cases of their old office to its triage, one timeline entry each; `why` is a clause naming them. */
async function returnCasesToTriage(
  ctx: ServiceContext,
  db: Db,
  actor: Actor,
  investigator: { id: string; name: string; officeId: string | null },
  why: string,
): Promise<number> {
  const held = await lockOpenCasesAssignedTo(db, investigator.officeId!, investigator.id)
  const actorName = (await findUserById(db, actor.id))?.name ?? 'Administrator'
  const at = ctx.now()
  for (const c of held) {
    // the rows are locked: the version read with the lock is the one to write over
    await updateCaseIfVersion(db, c.id, c.version, { status: 'triaged', investigatorId: null })
    await appendEvent(db, {
      caseId: c.id,
      at,
      actorUserId: actor.id,
      actorLabel: actorName,
      kind: RETURNED_TO_TRIAGE_KIND,
      fromState: c.status,
      toState: 'triaged',
      body: `Returned to triage: ${why}. The case awaits a new investigator.`,
      visibility: 'internal',
      data: { previousInvestigatorId: investigator.id, previousInvestigatorName: investigator.name },
    })
  }
  return held.length
}
