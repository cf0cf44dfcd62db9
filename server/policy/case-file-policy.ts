/**
 * Who may issue a case's signed case file (PDF): the staff of the case's office (investigators
 * and supervisors — an investigator hands the file of a closed case to a lawyer as often as a
 * supervisor does) and administrators; never a complainant. In any state: a file of an open
 * case says where the case stands.
 */
import type { CaseAccess, CaseActor } from './case-policy'

export function mayIssueCaseFile(actor: CaseActor, c: Pick<CaseAccess, 'officeId'>): boolean {
  if (actor.role === 'tracking_link') return false
  if (actor.role === 'admin') return true
  return (actor.role === 'investigator' || actor.role === 'supervisor') && actor.officeId === c.officeId
}
