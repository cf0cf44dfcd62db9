/**
 * The queries of the evidence bundle: a case's files still on it (with their stored objects
 * and uploaders) and their custody logs. The 'bundled' custody entries go through the evidence
 * module's own appendCustody. No authorization here.
 */
import { and, asc, eq, inArray, isNull } from 'drizzle-orm'
import type { EvidenceKind, EvidenceUploaderRole } from '../../../shared/domain/evidence'
import type { Db } from '../../db/client'
import { evidenceCustody, evidenceFiles, storedFiles, users, type EvidenceCustodyRow } from '../../db/schema'

export interface BundledFileRow {
  evidenceId: string
  kind: EvidenceKind
  displayName: string
  uploaderRole: EvidenceUploaderRole
  uploaderName: string | null
  uploadedAt: Date
  objectKey: string
  sizeBytes: number
  sha256: string
  contentType: string
}

/** The case's evidence files that were not removed, oldest first. */
export async function keptEvidenceOfCase(db: Db, caseId: string): Promise<BundledFileRow[]> {
  return db
    .select({
      evidenceId: evidenceFiles.id,
      kind: evidenceFiles.kind,
      displayName: evidenceFiles.displayName,
      uploaderRole: evidenceFiles.uploaderRole,
      uploaderName: users.name,
      uploadedAt: evidenceFiles.uploadedAt,
      objectKey: storedFiles.objectKey,
      sizeBytes: storedFiles.sizeBytes,
      sha256: storedFiles.sha256,
      contentType: storedFiles.contentType,
    })
    .from(evidenceFiles)
    .innerJoin(storedFiles, eq(storedFiles.id, evidenceFiles.storedFileId))
    .leftJoin(users, eq(users.id, evidenceFiles.uploaderUserId))
    .where(and(eq(evidenceFiles.caseId, caseId), isNull(evidenceFiles.removedAt)))
    .orderBy(asc(evidenceFiles.uploadedAt), asc(evidenceFiles.id))
}

/** The custody entries of these files, in the order they were written. */
export async function custodyOfEvidence(db: Db, evidenceIds: string[]): Promise<EvidenceCustodyRow[]> {
  if (evidenceIds.length === 0) return []
  return db.select().from(evidenceCustody).where(inArray(evidenceCustody.evidenceId, evidenceIds)).orderBy(asc(evidenceCustody.at), asc(evidenceCustody.id))
}
