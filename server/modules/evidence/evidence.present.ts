/** Evidence files and custody entries as the API answers them (shared/schemas/evidence.ts). */
import { THUMBNAIL_SOURCE_TYPES } from '../../../shared/domain/evidence'
import type { CustodyEntryView, EvidenceAbilities, EvidenceView } from '../../../shared/schemas/evidence'
import type { EvidenceCustodyRow, EvidenceThumbnailRow } from '../../db/schema'
import type { EvidenceRecord } from './evidence.repo'

function presentThumbnail(e: EvidenceRecord, t: EvidenceThumbnailRow | undefined): EvidenceView['thumbnail'] {
  if (!THUMBNAIL_SOURCE_TYPES.includes(e.file.contentType)) return null
  if (t?.state === 'done' && t.widthPx && t.heightPx) return { state: 'done', widthPx: t.widthPx, heightPx: t.heightPx }
  if (t?.state === 'failed') return { state: 'failed', message: t.message ?? 'No thumbnail could be made.' }
  // a removed file is not swept for a lost job: it is not shown as waiting for one
  return e.removedAt ? null : { state: 'pending' }
}

/** `thumbnail`: the file's thumbnail row, if one was looked up (an image without one is shown as pending). */
export function presentEvidence(e: EvidenceRecord, abilities: EvidenceAbilities, thumbnail?: EvidenceThumbnailRow): EvidenceView {
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
    thumbnail: presentThumbnail(e, thumbnail),
    sharedWithComplainant: e.sharedWithComplainant,
    abilities,
  }
}

/**
 * The complainant's view of a file: staff names and ids never appear (a shared office file is
 * "The office"'s, and so is an integrity check).
 */
export function presentEvidenceForComplainant(e: EvidenceRecord, abilities: EvidenceAbilities, thumbnail?: EvidenceThumbnailRow): EvidenceView {
  const v = presentEvidence(e, abilities, thumbnail)
  return {
    ...v,
    uploadedBy: e.uploaderRole === 'staff' ? { id: null, name: 'The office', role: 'staff' } : v.uploadedBy,
    verification: v.verification ? { ...v.verification, by: 'The office' } : null,
  }
}

export function presentCustody(c: EvidenceCustodyRow): CustodyEntryView {
  return { at: c.at.toISOString(), actor: c.actorLabel, action: c.action, from: c.clientAddress, ...(c.detail ? { detail: c.detail } : {}) }
}
