/**
 * Who may read and store a case's calculations: pure functions of (actor, case).
 * Read: staff of the case's office, and administrators (who read every case). Store: the assigned investigator or the office's
 * supervisor, while the case is being worked (the states from which a finding can be
 * proposed: assigned, field work, sent back). Another office's case is 404 before this is asked.
 */
import { CASE_MOVES, type CaseState } from '../../shared/domain/case-lifecycle'
import type { CaseAccess, CaseActor } from './case-policy'

/** The working states: those from which the investigator can still propose a finding. */
export const CALCULATION_STATES: readonly CaseState[] = CASE_MOVES.proposeFinding.from

export function mayReadCalculations(actor: CaseActor, c: CaseAccess): boolean {
  if (actor.role === 'tracking_link') return false
  if (actor.role === 'admin') return true
  return (actor.role === 'investigator' || actor.role === 'supervisor') && actor.officeId === c.officeId
}

/** Role and relation only (the state is asked separately: a wrong role is 403, a wrong state 409). */
export function mayStoreCalculation(actor: CaseActor, c: CaseAccess): boolean {
  if (actor.role === 'tracking_link' || actor.officeId !== c.officeId) return false
  return actor.role === 'supervisor' || (actor.role === 'investigator' && c.investigatorId === actor.id)
}

export function calculationAllowedIn(state: CaseState): boolean {
  return CALCULATION_STATES.includes(state)
}
