/**
 * Who may read and keep an office's antennas-and-instruments register, and who may record,
 * edit and correct a case's measurements: pure functions of (actor, office or case).
 *
 * Register: staff of the office read it; the office's supervisor and administrators add and
 * edit items. Another office's register is 404 to staff (asked before this).
 * Measurements: staff of the case's office (and administrators, who read every case) read them;
 * the assigned investigator or the office's supervisor record, edit and correct them while the
 * case is being worked (the same rule as calculations: calculation-policy.ts).
 */
import type { CaseAccess, CaseActor } from './case-policy'
import { calculationAllowedIn, mayReadCalculations, mayStoreCalculation } from './calculation-policy'

export function mayReadEquipment(actor: CaseActor, officeId: string): boolean {
  if (actor.role === 'admin') return true
  return (actor.role === 'investigator' || actor.role === 'supervisor') && actor.officeId === officeId
}

export function mayManageEquipment(actor: CaseActor, officeId: string): boolean {
  if (actor.role === 'admin') return true
  return actor.role === 'supervisor' && actor.officeId === officeId
}

export function mayReadMeasurements(actor: CaseActor, c: CaseAccess): boolean {
  return mayReadCalculations(actor, c)
}

/** Role and relation only (the state is asked separately: a wrong role is 403, a wrong state 409). */
export function mayWriteMeasurements(actor: CaseActor, c: CaseAccess): boolean {
  return mayStoreCalculation(actor, c)
}

/** The states in which measurements are recorded, edited and corrected. */
export function measurementsAllowedIn(state: CaseAccess['status']): boolean {
  return calculationAllowedIn(state)
}
