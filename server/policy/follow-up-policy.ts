/**
 * Who may keep a case's enforcement records: pure functions of (actor, case[, follow-up]).
 * Staff of the case's office read and record the responsible party, its notices and replies,
 * and add follow-ups; administrators read them. A follow-up's moves follow
 * FOLLOW_UP_MOVES (shared/domain/follow-ups.ts): confirming or escalating is for the office's
 * supervisor or the case's investigator, reopening for the supervisor. A complainant never
 * sees these records. Another office's case is 404 before any of this is asked.
 */
import { FOLLOW_UP_MOVE_NAMES, FOLLOW_UP_MOVES, followUpMoveAllowedFrom, type FollowUpMoveName, type FollowUpMover, type FollowUpState } from '../../shared/domain/follow-ups'
import type { CaseAccess, CaseActor } from './case-policy'

const isOfficeStaff = (actor: CaseActor, c: CaseAccess) =>
  actor.role !== 'tracking_link' && (actor.role === 'investigator' || actor.role === 'supervisor') && actor.officeId === c.officeId

/** Reading the responsible party, notices, replies and follow-ups. */
export function mayReadEnforcement(actor: CaseActor, c: CaseAccess): boolean {
  if (actor.role === 'tracking_link') return false
  return actor.role === 'admin' || isOfficeStaff(actor, c)
}

/** Recording the party, a notice, a reply, or adding a follow-up. */
export function mayRecordEnforcement(actor: CaseActor, c: CaseAccess): boolean {
  return isOfficeStaff(actor, c)
}

function isFollowUpMover(actor: CaseActor, mover: FollowUpMover, c: CaseAccess): boolean {
  if (actor.role === 'tracking_link') return false
  if (mover === 'office_supervisor') return actor.role === 'supervisor' && actor.officeId === c.officeId
  return actor.role === 'investigator' && actor.officeId === c.officeId && c.investigatorId === actor.id
}

/** Whether the actor's role and relation allow the move (ignoring the follow-up's state). */
export function mayMoveFollowUp(actor: CaseActor, move: FollowUpMoveName, c: CaseAccess): boolean {
  return FOLLOW_UP_MOVES[move].by.some((m) => isFollowUpMover(actor, m, c))
}

/** The moves the actor can make on the follow-up now. */
export function followUpAbilities(actor: CaseActor, c: CaseAccess, f: { state: FollowUpState }): Record<FollowUpMoveName, boolean> {
  return Object.fromEntries(FOLLOW_UP_MOVE_NAMES.map((m) => [m, mayMoveFollowUp(actor, m, c) && followUpMoveAllowedFrom(m, f.state)])) as Record<FollowUpMoveName, boolean>
}
