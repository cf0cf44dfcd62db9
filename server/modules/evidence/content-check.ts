/**
 * What an evidence file holds, decided from its first bytes (never from the name or the type
 * the uploader's computer declared): file-type's signatures for binary formats, then a text
 * check for CSV, JSON (a SigMF metadata file is JSON) and plain text. Anything else is refused
 * (415) — except for an I/Q recording, whose raw samples carry no signature at all.
 */
import { fileTypeFromBuffer } from 'file-type'
import type { EvidenceKind } from '../../../shared/domain/evidence'
import { badRequest, HttpError } from '../../http/errors'

/** The binary types evidence may be (photos, documents, recordings, SigMF archives). */
export const ACCEPTED_BINARY_TYPES: ReadonlySet<string> = new Set([
  'image/jpeg',
  'image/png',
  'image/gif',
  'image/webp',
  'image/tiff',
  'image/heic',
  'image/heif',
  'image/avif',
  'application/pdf',
  'application/vnd.openxmlformats-officedocument.wordprocessingml.document',
  'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet',
  'application/vnd.oasis.opendocument.text',
  'application/vnd.oasis.opendocument.spreadsheet',
  'audio/mpeg',
  'audio/wav',
  'audio/x-wav',
  'audio/flac',
  'audio/x-flac',
  'audio/ogg',
  'audio/opus',
  'audio/mp4',
  'audio/x-m4a',
  'audio/aac',
  'video/mp4',
  'video/quicktime',
  'application/x-tar',
])

/** The type kept for raw I/Q samples, which have no signature. */
export const RAW_SAMPLES_TYPE = 'application/octet-stream'

export const unsupportedType = (what: string) =>
  new HttpError(
    415,
    'unsupported_file_type',
    `This file cannot be added as evidence: ${what}. Accepted are photos (JPEG, PNG, TIFF, HEIC, WebP), PDF and office documents, audio and video recordings, CSV, JSON or SigMF files, plain text, and raw I/Q recordings (as "I/Q recording").`,
  )

export const emptyFile = () => badRequest('file_empty', 'The file is empty (0 bytes): choose the file again.')

/** Whether the bytes are UTF-8 text without NULs (the last, possibly cut, character aside). */
function textOf(head: Buffer): string | undefined {
  if (head.includes(0)) return undefined
  let bytes = head
  // a multi-byte character may be cut at the end of the head: drop its first bytes
  for (let i = 1; i <= 3 && i <= head.length; i++) {
    const b = head[head.length - i]!
    if ((b & 0xc0) === 0xc0) {
      bytes = head.subarray(0, head.length - i)
      break
    }
    if ((b & 0x80) === 0) break
  }
  try {
    const text = new TextDecoder('utf-8', { fatal: true }).decode(bytes)
    // control characters other than tab, line feed, carriage return and form feed: not text
    // eslint-disable-next-line no-control-regex
    return /[\u0001-\u0008\u000b\u000e-\u001f\u007f]/.test(text) ? undefined : text
  } catch {
    return undefined
  }
}

/** CSV: at least two lines, each with the same (non-zero) count of one delimiter. */
function looksLikeCsv(text: string, whole: boolean): boolean {
  const lines = text.split(/\r?\n/)
  if (!whole) lines.pop() // the last line may be cut
  const filled = lines.filter((l) => l.trim() !== '')
  if (filled.length < 2) return false
  return [',', ';', '\t'].some((d) => {
    const counts = filled.map((l) => l.split(d).length - 1)
    return counts[0]! > 0 && counts.every((c) => c === counts[0])
  })
}

/**
 * The content type of a file from its first bytes (`whole`: the head is the entire file), or
 * a thrown 415 (400 for an empty file).
 */
export async function contentTypeOf(head: Buffer, whole: boolean, kind: EvidenceKind): Promise<string> {
  if (head.length === 0) throw emptyFile()
  const sniffed = await fileTypeFromBuffer(head)
  if (sniffed) {
    if (ACCEPTED_BINARY_TYPES.has(sniffed.mime)) return sniffed.mime
    throw unsupportedType(`its content is ${sniffed.mime} (.${sniffed.ext})`)
  }
  const text = textOf(head)
  if (text !== undefined) {
    const body = text.replace(/^\uFEFF/, '').trimStart()
    if (body.startsWith('{') || body.startsWith('[')) {
      if (!whole) return 'application/json'
      try {
        JSON.parse(body)
        return 'application/json'
      } catch {
        // text that opens like JSON but is not: kept as text
        return 'text/plain'
      }
    }
    if (looksLikeCsv(body, whole)) return 'text/csv'
    return 'text/plain'
  }
  if (kind === 'iq_recording') return RAW_SAMPLES_TYPE
  throw unsupportedType('its content is not a recognised format')
}
