/**
 * Runs the analysis of one evidence file and records every outcome on its analysis row: the
 * state and progress as it goes, then the results, or the reason it failed in words a person
 * can act on. A bad file is a recorded failure, never a thrown error; only a failure to record
 * (the database away) is thrown, for the job queue to see.
 */
import type { Readable } from 'node:stream'
import { RADIO_LIBRARY_VERSION } from '../../../../shared/radio'
import { SigmfError, TraceCsvError } from '../../../../shared/radio/spectrum'
import type { Db } from '../../../db/client'
import { HttpError } from '../../../http/errors'
import { log } from '../../../log/logger'
import type { ObjectStore } from '../../../storage/object-store'
import { readStoredObject } from '../../../storage/stored-files'
import { findEvidence } from '../evidence.repo'
import { markAnalysisRunning, recordAnalysisDone, recordAnalysisFailed, recordAnalysisProgress } from './analyses.repo'
import { analyseSpectrumFile, EvidenceProcessingError } from './analyse-spectrum'
import { TarError } from './tar-reader'
import { sigmfMemberOf, sigmfPartnerOf } from '../sigmf-pairs'
import { analyseSigmfDataset } from './sigmf-pair-analysis'

export interface ProcessingDeps {
  db: Db
  objectStore?: ObjectStore
}

/** The message recorded for a failure: the file's own problem as stated, anything else named as ours. */
export function failureMessage(err: unknown): string {
  if (err instanceof SigmfError) return `The SigMF recording cannot be read: ${err.message}`
  if (err instanceof TraceCsvError) return `The CSV trace cannot be read: ${err.message}`
  if (err instanceof TarError || err instanceof EvidenceProcessingError) return err.message
  if (err instanceof HttpError && err.code === 'stored_object_missing') return 'The stored copy of the file is missing from the file store, so it was not analysed. Its checksum is on record; an administrator should check the store.'
  if (err instanceof HttpError && err.status === 503) return 'The file store could not be reached; the file was not analysed. Queue it again later.'
  if (err instanceof RangeError) return `The file cannot be analysed: ${err.message}`
  return `The analysis stopped on an unexpected error (${(err as Error)?.message ?? String(err)}); the file itself may be fine.`
}

/** Analyses the evidence file and records the result or the failure. */
export async function runEvidenceProcessing(deps: ProcessingDeps, evidenceId: string): Promise<void> {
  const evidence = await findEvidence(deps.db, evidenceId)
  if (!evidence) {
    log().warn(`evidence processing: no evidence file ${evidenceId}`)
    return
  }
  // one half of a two-file SigMF recording: the analysis is the dataset's (sigmf-pairs.ts)
  const member = sigmfMemberOf(evidence.displayName)
  const datasetId = member?.part === 'meta' ? await sigmfPartnerOf(deps.db, evidence.caseId, member) : undefined
  if (datasetId) return runEvidenceProcessing(deps, datasetId)
  await markAnalysisRunning(deps.db, evidenceId)
  try {
    const onProgress = (p: number) => recordAnalysisProgress(deps.db, evidenceId, Math.min(1, Math.max(0, p)))
    const result =
      member?.part === 'data'
        ? await analyseSigmfDataset(deps, evidence, onProgress)
        : await analyseSpectrumFile({
            open: async () => (await readStoredObject(deps.objectStore, evidence.file.objectKey)) as Readable & AsyncIterable<Uint8Array>,
            originalName: evidence.file.originalName,
            contentType: evidence.file.contentType,
            onProgress,
          })
    await recordAnalysisDone(deps.db, evidenceId, { ...result, libraryVersion: RADIO_LIBRARY_VERSION })
  } catch (err) {
    const message = failureMessage(err)
    if (err instanceof HttpError && err.code === 'stored_object_missing') {
      log().warn({ evidenceId }, 'evidence processing: the stored object is missing')
    } else if (!(err instanceof SigmfError || err instanceof TraceCsvError || err instanceof TarError || err instanceof EvidenceProcessingError)) {
      log().error({ err, evidenceId }, 'evidence processing failed')
    }
    await recordAnalysisFailed(deps.db, evidenceId, message, RADIO_LIBRARY_VERSION)
  }
}
