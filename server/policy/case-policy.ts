/**
 * Who may do what with a case: pure functions of (actor, action, case). The state machine
 * (shared/domain/case-lifecycle.ts) says which moves exist from which state; this says who
 * may make them. A service refuses with 404 when the case is outside the actor's office,
 * 403 when the role or relation is wrong, and 409 when the state does not allow the move.
 */
import { calculationAllowedIn, mayStoreCalculation } from './calculation-policy'
import { mayIssueCaseFile } from './case-file-policy'
import { CASE_MOVES, moveAllowedFrom, MOVES_REFUSED_WHILE_HOLDING_MERGED_REPORTS, type CaseMoveName, type CaseState, type Mover } from '../../shared/domain/case-lifecycle'
import type { CaseAbilities } from '../../shared/schemas/views'
import type { Actor } from './policy'

/** The parts of a case that authorization looks at. */
export interface CaseAccess {
  id: string
  officeId: string
  status: CaseState
  investigatorId: string | null
  complainantUserId: string | null
  /** Reports have been merged into the case (some moves are then refused; see the lifecycle). */
  holdsMergedReports?: boolean
}

/** Whoever holds a case's private tracking link acts as its complainant, for that case only. */
export interface TrackingLinkHolder {
  role: 'tracking_link'
  caseId: string
}
export type CaseActor = Actor | TrackingLinkHolder

/** Whether the actor may see the case at all (else it is "not found" to them). */
export function canSeeCase(actor: CaseActor, c: CaseAccess): boolean {
  if (actor.role === 'tracking_link') return actor.caseId === c.id
  if (actor.role === 'admin') return true
  if (actor.role === 'investigator' || actor.role === 'supervisor') return actor.officeId === c.officeId
  return actor.role === 'complainant' && c.complainantUserId === actor.id
}

function isMover(actor: CaseActor, mover: Mover, c: CaseAccess): boolean {
  if (actor.role === 'tracking_link') return mover === 'complainant' && actor.caseId === c.id
  switch (mover) {
    case 'office_supervisor':
      return actor.role === 'supervisor' && actor.officeId === c.officeId
    case 'assigned_investigator':
      return actor.role === 'investigator' && actor.officeId === c.officeId && c.investigatorId === actor.id
    case 'complainant':
      return actor.role === 'complainant' && c.complainantUserId === actor.id
  }
}

/** Adding information to a report: its complainant, at any time (a closed case can come back). */
export function mayAddComplainantInformation(actor: CaseActor, c: CaseAccess): boolean {
  return isMover(actor, 'complainant', c)
}

/** Whether the actor's role and relation to the case allow the move (ignoring its state). */
export function mayMakeMove(actor: CaseActor, move: CaseMoveName, c: CaseAccess): boolean {
  return CASE_MOVES[move].by.some((m) => isMover(actor, m, c))
}

/** Internal notes: any staff member of the office. */
export function mayAddInternalNote(actor: CaseActor, c: CaseAccess): boolean {
  if (actor.role === 'tracking_link') return false
  return (actor.role === 'supervisor' || actor.role === 'investigator') && actor.officeId === c.officeId
}

/** Messages to the complainant: the office's supervisor or the assigned investigator, while open. */
export function mayMessageComplainant(actor: CaseActor, c: CaseAccess): boolean {
  if (c.status === 'closed') return false
  return isMover(actor, 'office_supervisor', c) || isMover(actor, 'assigned_investigator', c)
}


/**
 * Closing every private tracking link of a case (a link forwarded to the wrong person, say): a
 * supervisor of the case's office, in any state. Investigators work the case but do not decide
 * who may follow it; a complainant's own account is not a link and keeps working.
 */
export function mayRevokeTrackingLinks(actor: CaseActor, c: CaseAccess): boolean {
  return isMover(actor, 'office_supervisor', c)
}

/** What the actor can do now: role, relation and state together. Sent with every case. */
export function caseAbilities(actor: CaseActor, c: CaseAccess): CaseAbilities {
  const moves = Object.fromEntries(
    (Object.keys(CASE_MOVES) as CaseMoveName[]).map((m) => [m, mayMakeMove(actor, m, c) && moveAllowedFrom(m, c.status) && !(c.holdsMergedReports && MOVES_REFUSED_WHILE_HOLDING_MERGED_REPORTS.includes(m))]),
  ) as Record<CaseMoveName, boolean>
  return {
    ...moves,
    addInternalNote: mayAddInternalNote(actor, c),
    messageComplainant: mayMessageComplainant(actor, c),
    storeCalculation: mayStoreCalculation(actor, c) && calculationAllowedIn(c.status),
    issueCaseFile: mayIssueCaseFile(actor, c),
    revokeTrackingLinks: mayRevokeTrackingLinks(actor, c),
  }
}
