/** Who may set or lift a legal hold, change an office's retention period, or see a retention run. */
import type { CaseActor } from './case-policy'
import type { Actor } from './policy'

/** A legal hold: the supervisors of the case's office and administrators. */
export function mayManageLegalHold(actor: CaseActor, c: { officeId: string }): boolean {
  if (actor.role === 'admin') return true
  return actor.role === 'supervisor' && actor.officeId === c.officeId
}

/** Staff of the office (and administrators) see a case's legal hold. */
export function mayReadLegalHold(actor: CaseActor, c: { officeId: string }): boolean {
  if (actor.role === 'admin') return true
  return (actor.role === 'supervisor' || actor.role === 'investigator') && actor.officeId === c.officeId
}

/** An office's retention period: read by its staff, set by administrators only. */
export function mayReadRetention(actor: Actor, officeId: string): boolean {
  if (actor.role === 'admin') return true
  return (actor.role === 'supervisor' || actor.role === 'investigator') && actor.officeId === officeId
}
export function maySetRetention(actor: Actor): boolean {
  return actor.role === 'admin'
}

/** What a retention run would erase: administrators. */
export function mayPreviewRetention(actor: Actor): boolean {
  return actor.role === 'admin'
}
