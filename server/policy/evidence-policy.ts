/**
 * Who may do what with a case's evidence files: pure functions of (actor, action, file, case).
 * Seeing the case comes first (case-policy's canSeeCase: another office's or another
 * complainant's case is not found). Staff of the case's office upload, list, download and
 * verify; only the office's supervisor removes a file (a soft delete, with a reason). A
 * complainant uploads to their own report and sees their own uploads and the staff files the
 * office shared with them, until removed; they download only what the office shared (their own
 * uploads they already have). Staff of the office share a staff file, or stop sharing it, while
 * it is on the case and in the store. A removed file stays downloadable by staff, for the record,
 * and is marked.
 */
import type { EvidenceAbilities } from '../../shared/schemas/evidence'
import { canSeeCase, type CaseAccess, type CaseActor } from './case-policy'

/** The parts of an evidence file that authorization looks at. */
export interface EvidenceAccess {
  caseId: string
  uploaderRole: 'staff' | 'complainant'
  removedAt: Date | null
  /** Whether the complainant sees the file (their own uploads always; a staff file once shared). */
  sharedWithComplainant: boolean
  /** When the retention run deleted the file's object from the store. */
  disposedAt: Date | null
}

/** Staff of the case's office (an administrator manages accounts, not casework). */
export function isCaseStaff(actor: CaseActor, c: CaseAccess): boolean {
  return (actor.role === 'investigator' || actor.role === 'supervisor') && actor.officeId === c.officeId
}

/** The case's complainant: the tracking link's holder or the signed-in owner of the report. */
export function isCaseComplainant(actor: CaseActor, c: CaseAccess): boolean {
  if (actor.role === 'tracking_link') return actor.caseId === c.id
  return actor.role === 'complainant' && c.complainantUserId === actor.id
}

/** Adding a file to the case. */
export function mayUploadEvidence(actor: CaseActor, c: CaseAccess): boolean {
  return canSeeCase(actor, c) && (isCaseStaff(actor, c) || isCaseComplainant(actor, c))
}

/** Whether the file exists for the actor at all (else 404). */
export function maySeeEvidence(actor: CaseActor, c: CaseAccess, e: EvidenceAccess): boolean {
  if (e.caseId !== c.id || !canSeeCase(actor, c)) return false
  if (isCaseStaff(actor, c)) return true
  return isCaseComplainant(actor, c) && e.removedAt === null && (e.uploaderRole === 'complainant' || sharedByOffice(e))
}

/** A staff file the office shared with the complainant. */
function sharedByOffice(e: EvidenceAccess): boolean {
  return e.uploaderRole === 'staff' && e.sharedWithComplainant
}

/** Staff download (the staff route; analysis and measurements rest on it too). */
export function mayDownloadEvidence(actor: CaseActor, c: CaseAccess, e: EvidenceAccess): boolean {
  return maySeeEvidence(actor, c, e) && isCaseStaff(actor, c)
}

/** The complainant downloads a file the office shared with them (not their own uploads). */
export function mayComplainantDownloadEvidence(actor: CaseActor, c: CaseAccess, e: EvidenceAccess): boolean {
  return maySeeEvidence(actor, c, e) && isCaseComplainant(actor, c) && sharedByOffice(e)
}

/** Sharing a staff file with the complainant, or stopping: staff of the office, while the file is on the case and in the store. */
export function mayShareEvidence(actor: CaseActor, c: CaseAccess, e: EvidenceAccess): boolean {
  return maySeeEvidence(actor, c, e) && isCaseStaff(actor, c) && e.uploaderRole === 'staff' && e.removedAt === null && e.disposedAt === null
}

export function mayVerifyEvidence(actor: CaseActor, c: CaseAccess, e: EvidenceAccess): boolean {
  return maySeeEvidence(actor, c, e) && isCaseStaff(actor, c)
}

export function mayRemoveEvidence(actor: CaseActor, c: CaseAccess, e: EvidenceAccess): boolean {
  return maySeeEvidence(actor, c, e) && actor.role === 'supervisor' && actor.officeId === c.officeId && e.removedAt === null
}

/** The custody log: staff of the office. */
export function mayReadCustody(actor: CaseActor, c: CaseAccess, e: EvidenceAccess): boolean {
  return maySeeEvidence(actor, c, e) && isCaseStaff(actor, c)
}

export function evidenceAbilities(actor: CaseActor, c: CaseAccess, e: EvidenceAccess): EvidenceAbilities {
  return {
    download: mayDownloadEvidence(actor, c, e) || (mayComplainantDownloadEvidence(actor, c, e) && e.disposedAt === null),
    verify: mayVerifyEvidence(actor, c, e),
    remove: mayRemoveEvidence(actor, c, e),
    share: mayShareEvidence(actor, c, e),
  }
}
