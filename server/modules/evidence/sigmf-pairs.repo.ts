/** The queries that pair the two files of a SigMF recording uploaded apart (sigmf-pairs.ts). */
import { and, desc, eq, inArray, isNull } from 'drizzle-orm'
import { PROCESSED_EVIDENCE_KINDS, type EvidenceProcessing } from '../../../shared/domain/evidence'
import type { Db } from '../../db/client'
import { evidenceFiles } from '../../db/schema'

/** The newest file of the case shown under exactly this name, of a processed kind and not removed. */
export async function newestProcessedFileNamed(db: Db, caseId: string, displayName: string): Promise<string | undefined> {
  const [r] = await db
    .select({ id: evidenceFiles.id })
    .from(evidenceFiles)
    .where(and(eq(evidenceFiles.caseId, caseId), eq(evidenceFiles.displayName, displayName), inArray(evidenceFiles.kind, [...PROCESSED_EVIDENCE_KINDS]), isNull(evidenceFiles.removedAt)))
    .orderBy(desc(evidenceFiles.uploadedAt), desc(evidenceFiles.id))
    .limit(1)
  return r?.id
}

/** Sets the processing state shown on a file that is not analysed itself (waiting for its partner, or read with it). */
export async function setProcessingNote(db: Db, evidenceId: string, processing: EvidenceProcessing): Promise<void> {
  await db.update(evidenceFiles).set({ processing }).where(eq(evidenceFiles.id, evidenceId))
}
