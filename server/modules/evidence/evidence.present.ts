/** Evidence files and custody entries as the API answers them (shared/schemas/evidence.ts). */
import type { CustodyEntryView, EvidenceAbilities, EvidenceView } from '../../../shared/schemas/evidence'
import type { EvidenceCustodyRow } from '../../db/schema'
import type { EvidenceRecord } from './evidence.repo'

export function presentEvidence(e: EvidenceRecord, abilities: EvidenceAbilities): EvidenceView {
  return {
    id: e.id,
    caseId: e.caseId,
    kind: e.kind,
    originalName: e.displayName,
    sizeBytes: e.file.sizeBytes,
    contentType: e.file.contentType,
    sha256: e.file.sha256,
    uploadedBy: {
      id: e.uploaderUserId,
      name: e.uploaderRole === 'complainant' ? 'Complainant' : (e.uploaderName ?? 'Unknown user'),
      role: e.uploaderRole,
    },
    uploadedAt: e.uploadedAt.toISOString(),
    removed: e.removedAt ? { at: e.removedAt.toISOString(), by: e.removedByName ?? 'Unknown user', reason: e.removedReason ?? '' } : null,
    verification: e.verifiedAt && e.verificationOutcome ? { at: e.verifiedAt.toISOString(), by: e.verifiedByName ?? 'Unknown user', outcome: e.verificationOutcome } : null,
    processing: { state: e.processing.state, progress: Math.min(1, Math.max(0, e.processing.progress)), ...(e.processing.message !== undefined ? { message: e.processing.message } : {}) },
    abilities,
  }
}

export function presentCustody(c: EvidenceCustodyRow): CustodyEntryView {
  return { at: c.at.toISOString(), actor: c.actorLabel, action: c.action, from: c.clientAddress, ...(c.detail ? { detail: c.detail } : {}) }
}
