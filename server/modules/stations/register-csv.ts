/**
 * Reading a register CSV as it streams from the object store (csv-parse, never the whole file
 * in memory): the header row, then each data row with the line it starts on. A file that is
 * not a CSV (binary content, broken quoting, no header) is a 400 listing what is wrong.
 */
import type { Readable } from 'node:stream'
import { parse, CsvError } from 'csv-parse'
import { CSV_DELIMITER_CHARS, type CsvDelimiter } from '../../../shared/domain/station-register'
import { badRequest } from '../../http/errors'

/** Most data rows a register file may hold. */
export const MAX_REGISTER_ROWS = 200_000
/** Longest row (bytes) before the file counts as not a CSV. */
const MAX_RECORD_BYTES = 64 * 1024

export interface CsvRow {
  /** The line the row starts on (the header is line 1 when the file starts with it). */
  line: number
  cells: string[]
}

const notCsv = (problems: string[]) =>
  badRequest(
    'not_csv',
    `This file cannot be read as a CSV register: ${problems.join('; ')}.`,
    problems.map((message) => ({ path: 'file', message })),
  )

/** Binary content (a NUL byte) or text that is not UTF-8 in the first chunk. */
function checkText(chunk: Buffer): string[] {
  if (chunk.includes(0)) return ['it holds binary data (a NUL byte), not text']
  const text = chunk.toString('utf8')
  // a multi-byte character cut at the chunk's end decodes as U+FFFD too: look before the last 3 bytes
  if (text.slice(0, Math.max(0, text.length - 3)).includes('\uFFFD')) return ['it is not UTF-8 text (save it as CSV UTF-8)']
  return []
}

/** Every problem of a header row: empty names, names that are numbers (no header), repeated names. */
export function headerProblems(headers: string[]): string[] {
  const problems: string[] = []
  if (headers.length < 2) problems.push(`the header row has ${headers.length} column${headers.length === 1 ? '' : 's'}: check the delimiter`)
  if (headers.every((h) => h.trim() === '' || /^[+-]?[\d.,]+(e[+-]?\d+)?$/i.test(h.trim()))) problems.push('the first line holds no column names (the file needs a header row)')
  else {
    headers.forEach((h, i) => {
      if (h.trim() === '') problems.push(`column ${i + 1} of the header row has no name`)
    })
  }
  const seen = new Set<string>()
  for (const h of headers) {
    if (h.trim() !== '' && seen.has(h)) problems.push(`the header row names "${h}" twice`)
    seen.add(h)
  }
  return problems
}

/**
 * The file's rows: the header first (`onHeader`), then each data row; stops after `maxRows`
 * data rows when given (the inspection reads only the top of the file).
 */
export async function readCsv(
  body: Readable,
  delimiter: CsvDelimiter,
  onRow: (row: CsvRow) => void,
  opts: { maxRows?: number; onHeader?: (headers: string[]) => void } = {},
): Promise<{ headers: string[]; rowCount: number }> {
  let firstChunk = true
  const problems: string[] = []
  const parser = parse({
    delimiter: CSV_DELIMITER_CHARS[delimiter],
    relax_column_count: true,
    skip_empty_lines: true,
    bom: true,
    info: true,
    raw: true,
    max_record_size: MAX_RECORD_BYTES,
  })
  body.on('data', (chunk: Buffer) => {
    if (!firstChunk) return
    firstChunk = false
    problems.push(...checkText(chunk))
    if (problems.length > 0) parser.destroy()
  })
  body.on('error', (e) => parser.destroy(e))
  body.pipe(parser)
  let headers: string[] | undefined
  let rowCount = 0
  try {
    for await (const r of parser as AsyncIterable<{ record: string[]; info: { lines: number }; raw: string }>) {
      const inner = r.raw.replace(/^[\r\n]+/, '').replace(/\r?\n$/, '')
      const line = r.info.lines - (inner.match(/\n/g)?.length ?? 0)
      if (!headers) {
        headers = r.record.map((h) => h.trim())
        const hp = headerProblems(headers)
        if (hp.length > 0) throw notCsv(hp)
        opts.onHeader?.(headers)
        continue
      }
      rowCount++
      if (rowCount > MAX_REGISTER_ROWS) throw badRequest('too_many_rows', `The file holds more than ${MAX_REGISTER_ROWS} rows; split it or ask for a larger limit.`)
      onRow({ line, cells: r.record })
      if (opts.maxRows !== undefined && rowCount >= opts.maxRows) break
    }
  } catch (e) {
    if (problems.length > 0) throw notCsv(problems)
    if (e instanceof CsvError) throw notCsv([`${e.message.replace(/^Invalid (Opening|Closing) Quote: /, '').replace(/\.$/, '')}`])
    throw e
  } finally {
    body.unpipe(parser)
    body.destroy()
  }
  if (problems.length > 0) throw notCsv(problems)
  if (!headers) throw notCsv(['the file is empty'])
  return { headers, rowCount }
}

/** The first line of the file's text (for detecting the delimiter). */
export async function firstLine(body: Readable): Promise<string> {
  let text = ''
  try {
    for await (const chunk of body as AsyncIterable<Buffer>) {
      text += chunk.toString('utf8')
      const end = text.search(/\r?\n/)
      if (end >= 0) return text.slice(0, end).replace(/^\uFEFF/, '')
      if (text.length > MAX_RECORD_BYTES) break
    }
  } finally {
    body.destroy()
  }
  return text.replace(/^\uFEFF/, '')
}
