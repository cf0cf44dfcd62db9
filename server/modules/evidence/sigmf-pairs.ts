/**
 * A SigMF recording uploaded as its two files, `<name>.sigmf-meta` (JSON) and
 * `<name>.sigmf-data` (raw samples), in one batch or one after the other, in either order.
 * The two files of one case are paired by their name as shown (cleaned by file-names.ts) less
 * the extension; the newest file of each name that is not removed counts. The analysis is
 * queued on the dataset once both are there and is recorded on the dataset's row; the
 * metadata's row says where to look. A file whose partner is missing says so on the list
 * (processing state `none`, with a message): start-processing.ts.
 */
import type { Db } from '../../db/client'
import { newestProcessedFileNamed } from './sigmf-pairs.repo'

const META_EXT = '.sigmf-meta'
const DATA_EXT = '.sigmf-data'

export interface SigmfMember {
  /** The recording's name: the file's shown name less its extension. */
  base: string
  part: 'meta' | 'data'
}

/** Whether a file (by its shown name) is one half of a two-file SigMF recording. */
export function sigmfMemberOf(displayName: string): SigmfMember | undefined {
  const lower = displayName.toLowerCase()
  for (const [ext, part] of [[META_EXT, 'meta'], [DATA_EXT, 'data']] as const) {
    if (lower.endsWith(ext) && displayName.length > ext.length) return { base: displayName.slice(0, -ext.length), part }
  }
  return undefined
}

/** The file of the same recording holding the other half (its id), if the case has one. */
export async function sigmfPartnerOf(db: Db, caseId: string, member: SigmfMember): Promise<string | undefined> {
  return newestProcessedFileNamed(db, caseId, member.base + (member.part === 'meta' ? DATA_EXT : META_EXT))
}

export const waitingForPartner = (member: SigmfMember) =>
  member.part === 'meta'
    ? `Waiting for its dataset "${member.base}${DATA_EXT}": add it to this case as an I/Q recording and the two are read together.`
    : `Waiting for its metadata "${member.base}${META_EXT}": add it to this case as an I/Q recording and the two are read together.`

export const readWithDataset = (base: string) => `Read together with its dataset "${base}${DATA_EXT}"; the spectrum is shown on that file.`
