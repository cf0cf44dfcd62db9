/**
 * What an account may do across the product (sent with /api/me and every sign-in): pure,
 * built from the same rules the services enforce, so the web's pages and links follow them.
 * The case abilities come from the case lifecycle: an account works assigned cases when it
 * could start field work on a case of its office assigned to it, and runs the office's queue
 * when it could triage a new report of its office.
 */
import type { AccountAbilities } from '../../shared/schemas/auth'
import { mayMakeMove, type CaseAccess } from './case-policy'
import { can, officeScope, type Actor } from './policy'
import { mayManageEquipment, mayReadEquipment } from './equipment-policy'

/** A new report of the actor's own office, assigned to the actor (no such case need exist). */
function caseOfOwnOffice(actor: Actor): CaseAccess | null {
  if (!actor.officeId) return null
  return { id: '', officeId: actor.officeId, status: 'received', investigatorId: actor.id, complainantUserId: null }
}

export function accountAbilities(actor: Actor): AccountAbilities {
  const own = caseOfOwnOffice(actor)
  const scope = officeScope(actor)
  const mayFileOwnReports = mayMakeMove(actor, 'withdraw', { id: '', officeId: '', status: 'received', investigatorId: null, complainantUserId: actor.id })
  return {
    reportAsAccount: mayFileOwnReports,
    followOwnReports: mayFileOwnReports,
    workAssignedCases: own !== null && mayMakeMove(actor, 'startFieldWork', own),
    runOfficeQueue: own !== null && mayMakeMove(actor, 'triage', own),
    readCases: !('none' in scope),
    manageUsers: can(actor, 'user.list'),
    manageOffices: 'all' in scope && can(actor, 'office.configure'),
    readBandLimits: can(actor, 'bandLimit.read'),
    manageBandLimits: can(actor, 'bandLimit.edit'),
    readStationRegister: can(actor, 'stationRegister.read'),
    importStationRegister: can(actor, 'stationRegister.import'),
    // the register of the actor's own office (an administrator keeps every office's)
    readEquipment: actor.role === 'admin' || (actor.officeId !== null && mayReadEquipment(actor, actor.officeId)),
    manageEquipment: actor.role === 'admin' || (actor.officeId !== null && mayManageEquipment(actor, actor.officeId)),
    readDashboard: can(actor, 'dashboard.read'),
    readAudit: can(actor, 'audit.read'),
  }
}
