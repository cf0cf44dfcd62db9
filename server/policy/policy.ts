/**
 * Authorization in one place: pure functions of (actor, action, resource).
 * Services load a record scoped to the actor's office first (another office's record is
 * then simply not found → 404), and call `can` for what the role may do with it.
 * Responses carry `abilities` computed here; the web shows actions from them.
 */
import type { Role } from '../../shared/domain/roles'

export interface Actor {
  id: string
  role: Role
  officeId: string | null
}

/** A record that belongs to an office (an office itself, a staff member, later a case). */
export interface OfficeScoped {
  officeId: string | null
}

export type Action =
  | 'office.list'
  | 'office.read'
  | 'office.configure'
  | 'office.manage'
  | 'staff.list'
  | 'staff.read'
  | 'user.list'
  | 'user.create'
  | 'user.update'
  | 'audit.read'
  | 'bandLimit.read'
  | 'bandLimit.edit'
  | 'stationRegister.read'
  | 'stationRegister.import'
  | 'dashboard.read'

const STAFF: Role[] = ['investigator', 'supervisor']

const rules: Record<Action, (actor: Actor, resource?: OfficeScoped) => boolean> = {
  'office.list': (a) => a.role === 'admin' || STAFF.includes(a.role),
  'office.read': (a, r) => a.role === 'admin' || (STAFF.includes(a.role) && sameOffice(a, r)),
  'office.configure': (a, r) => a.role === 'admin' || (a.role === 'supervisor' && sameOffice(a, r)),
  /** Create offices, change their details and areas: administrators only (areas route every report). */
  'office.manage': (a) => a.role === 'admin',
  'staff.list': (a) => a.role === 'admin' || STAFF.includes(a.role),
  'staff.read': (a, r) => a.role === 'admin' || (STAFF.includes(a.role) && sameOffice(a, r)),
  'user.list': (a) => a.role === 'admin',
  'user.create': (a) => a.role === 'admin',
  'user.update': (a) => a.role === 'admin',
  'audit.read': (a) => a.role === 'admin',
  // the band-limit list is national: every office's staff read it, supervisors and administrators edit it
  'bandLimit.read': (a) => a.role === 'admin' || STAFF.includes(a.role),
  'bandLimit.edit': (a) => a.role === 'admin' || a.role === 'supervisor',
  // the licence register is national: every office's staff read it, administrators import new versions
  'stationRegister.read': (a) => a.role === 'admin' || STAFF.includes(a.role),
  'stationRegister.import': (a) => a.role === 'admin',
  // the office as a whole: its supervisor; every office: an administrator
  'dashboard.read': (a, r) => a.role === 'admin' || (a.role === 'supervisor' && (!r || sameOffice(a, r))),
}

function sameOffice(actor: Actor, resource?: OfficeScoped): boolean {
  return !!resource && actor.officeId !== null && resource.officeId === actor.officeId
}

/** Whether the actor may take the action on the resource (or on the collection, without one). */
export function can(actor: Actor, action: Action, resource?: OfficeScoped): boolean {
  return rules[action](actor, resource)
}

/**
 * The office filter a query must apply for this actor: null means every office (admin);
 * a staff member sees their own office only.
 */
export function officeScope(actor: Actor): { all: true } | { officeId: string } | { none: true } {
  if (actor.role === 'admin') return { all: true }
  if (actor.officeId && STAFF.includes(actor.role)) return { officeId: actor.officeId }
  return { none: true }
}
