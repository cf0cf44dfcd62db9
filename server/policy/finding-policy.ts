/**
 * Who may read a case's findings: pure functions of (actor, case). Staff of the case's office
 * read them, and administrators (who read every case); a complainant never does (a finding is
 * the office's internal record until the case is closed with its own summary). Proposing one
 * is the `proposeFinding` move, decided by the case policy (the assigned investigator).
 * Another office's case is 404 before this is asked.
 */
import type { CaseAccess, CaseActor } from './case-policy'

export function mayReadFindings(actor: CaseActor, c: CaseAccess): boolean {
  if (actor.role === 'tracking_link') return false
  if (actor.role === 'admin') return true
  return (actor.role === 'investigator' || actor.role === 'supervisor') && actor.officeId === c.officeId
}
