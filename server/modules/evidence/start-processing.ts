/**
 * Starting the background processing of an evidence file once its row is committed (the upload,
 * and the sweep that finds files left unprocessed by a crash): one half of a two-file SigMF
 * recording (sigmf-pairs.ts) waits for the other, or queues the pair's analysis on the dataset;
 * any other file of a processed kind is queued itself; other kinds are left alone. An image
 * (JPEG, PNG, WebP as decided from its content) also gets its thumbnail made.
 */
import { PROCESSED_EVIDENCE_KINDS, THUMBNAIL_SOURCE_TYPES, type EvidenceKind } from '../../../shared/domain/evidence'
import type { ServiceContext } from '../../context'
import { queueEvidenceProcessing, queueEvidenceThumbnail } from './processing-queue'
import { readWithDataset, sigmfMemberOf, sigmfPartnerOf, waitingForPartner } from './sigmf-pairs'
import { setProcessingNote } from './sigmf-pairs.repo'

/** Starts the background work on a file just recorded: its thumbnail (an image) and its analysis (startAnalysis). */
export async function startEvidenceProcessing(ctx: Pick<ServiceContext, 'db' | 'boss'>, file: EvidenceToProcess & { contentType: string }): Promise<void> {
  if (THUMBNAIL_SOURCE_TYPES.includes(file.contentType)) await queueEvidenceThumbnail(ctx, file.id)
  await startAnalysis(ctx, file)
}

export interface EvidenceToProcess {
  id: string
  caseId: string
  kind: EvidenceKind
  displayName: string
}

/**
 * Queues the analysis of a file (also used by the sweep for a file left unprocessed): one half
 * of a SigMF recording waits for the other ('waiting') or queues the pair's analysis on the
 * dataset; any other file of a processed kind is queued itself; other kinds are left alone.
 */
export async function startAnalysis(ctx: Pick<ServiceContext, 'db' | 'boss'>, file: EvidenceToProcess): Promise<'queued' | 'waiting' | 'not_processed'> {
  if (!PROCESSED_EVIDENCE_KINDS.includes(file.kind)) return 'not_processed'
  const member = sigmfMemberOf(file.displayName)
  if (!member) {
    await queueEvidenceProcessing(ctx, file.id)
    return 'queued'
  }
  const partner = await sigmfPartnerOf(ctx.db, file.caseId, member)
  if (!partner) {
    await setProcessingNote(ctx.db, file.id, { state: 'none', progress: 0, message: waitingForPartner(member) })
    return 'waiting'
  }
  const [metaId, dataId] = member.part === 'meta' ? [file.id, partner] : [partner, file.id]
  await setProcessingNote(ctx.db, metaId, { state: 'none', progress: 0, message: readWithDataset(member.base) })
  await queueEvidenceProcessing(ctx, dataId)
  return 'queued'
}
