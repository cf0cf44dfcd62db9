/**
 * The analysis of a SigMF recording uploaded as its two files: the metadata (`.sigmf-meta`,
 * JSON, at most 4 MB) is read whole, then the dataset (`.sigmf-data`) is streamed block by block
 * through the same accumulators as an archive's data member, never held whole in memory. The
 * same refusals as the archive: an unknown datatype, metadata contradicting the dataset's length,
 * a length that is not a whole number of samples; and a stored dataset whose length differs
 * from the one recorded at upload.
 */
import type { Readable } from 'node:stream'
import { parseSigmfMetadata } from '../../../../shared/radio/spectrum'
import type { Db } from '../../../db/client'
import type { ObjectStore } from '../../../storage/object-store'
import { readStoredObject } from '../../../storage/stored-files'
import { findEvidence, type EvidenceRecord } from '../evidence.repo'
import { sigmfMemberOf, sigmfPartnerOf, waitingForPartner } from '../sigmf-pairs'
import { EvidenceProcessingError, recordingSink, type SpectrumAnalysis } from './analyse-spectrum'

const MAX_META_BYTES = 4 * 1024 * 1024

export interface SigmfPairSource {
  openMeta: () => Promise<AsyncIterable<Uint8Array>>
  openData: () => Promise<AsyncIterable<Uint8Array>>
  metaName: string
  dataName: string
  /** The dataset's length recorded at upload [bytes]. */
  dataBytes: number
  /** 0 … 1, awaited: the caller records it. */
  onProgress?: (progress: number) => Promise<void>
}

async function readMetaText(source: AsyncIterable<Uint8Array>, name: string): Promise<string> {
  const chunks: Uint8Array[] = []
  let size = 0
  for await (const c of source) {
    size += c.length
    if (size > MAX_META_BYTES) throw new EvidenceProcessingError(`The metadata file "${name}" is larger than ${MAX_META_BYTES / (1024 * 1024)} MB; SigMF metadata is expected to be a few kilobytes.`)
    chunks.push(c)
  }
  return new TextDecoder('utf-8').decode(Buffer.concat(chunks))
}

export async function analyseSigmfPair(src: SigmfPairSource): Promise<SpectrumAnalysis> {
  const metadata = parseSigmfMetadata(await readMetaText(await src.openMeta(), src.metaName))
  let result: SpectrumAnalysis | undefined
  // checks the metadata against the recorded length before a byte of the dataset is read
  const sink = recordingSink(metadata, src.dataBytes, src.onProgress, (r) => (result = r), 'sigmf_files')
  let readBytes = 0
  for await (const chunk of await src.openData()) {
    readBytes += chunk.length
    if (readBytes > src.dataBytes) break
    await sink.write(chunk)
  }
  if (readBytes !== src.dataBytes) {
    throw new EvidenceProcessingError(`The stored dataset "${src.dataName}" does not have the ${src.dataBytes} bytes recorded at upload (read ${readBytes > src.dataBytes ? 'more' : readBytes}); check its integrity.`)
  }
  await sink.end()
  if (!result) throw new EvidenceProcessingError(`The dataset "${src.dataName}" could not be read to its end.`)
  return result
}

/**
 * The dataset half of a two-file recording, read with its metadata file on the same case
 * (sigmf-pairs.ts); without one, a refusal saying what to add.
 */
export async function analyseSigmfDataset(
  deps: { db: Db; objectStore?: ObjectStore },
  dataset: EvidenceRecord,
  onProgress?: (progress: number) => Promise<void>,
): Promise<SpectrumAnalysis> {
  const member = sigmfMemberOf(dataset.displayName)
  const metaId = member && (await sigmfPartnerOf(deps.db, dataset.caseId, member))
  const meta = metaId ? await findEvidence(deps.db, metaId) : undefined
  if (!member || !meta) throw new EvidenceProcessingError(`This SigMF dataset has no metadata file on the case: ${member ? waitingForPartner(member) : 'add its .sigmf-meta file.'}`)
  return analyseSigmfPair({
    openMeta: async () => (await readStoredObject(deps.objectStore, meta.file.objectKey)) as Readable & AsyncIterable<Uint8Array>,
    openData: async () => (await readStoredObject(deps.objectStore, dataset.file.objectKey)) as Readable & AsyncIterable<Uint8Array>,
    metaName: meta.displayName,
    dataName: dataset.displayName,
    dataBytes: dataset.file.sizeBytes,
    onProgress,
  })
}
