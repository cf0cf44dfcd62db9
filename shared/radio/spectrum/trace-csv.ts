/**
 * Parses a trace exported as plain CSV: two columns, frequency and level.
 *
 * Document: a generic format of the library's own (no standard): one optional header line
 * that may carry units ('Hz', 'kHz', 'MHz', 'GHz'; 'dBm', 'dBuV', 'dBµV'), comma or semicolon
 * separators, decimal point, blank lines and '#' comment lines ignored, except one comment line
 * before the data that states the bandwidth the levels were read in: `# ENBW: 10 kHz` (the noise
 * bandwidth) or `# RBW: 10 kHz` (the analyser's resolution bandwidth, then taken as the noise
 * bandwidth with a warning). Levels in dBµV are
 * converted to dBm across the receiver impedance (default 50 Ω) with units.ts (register 2-6, 2-7 in CHECK-VALUES.md).
 * The `Eq. (n)` tags refer to the list below.
 *
 *  (1) f[Hz] = value · {1, 10³, 10⁶, 10⁹} for Hz, kHz, MHz, GHz   [Hz]
 *  (2) L[dBm] = L[dBµV] − 10·log10(R) − 90                          [dBm]
 */
import { requirePositive } from '../guards'
import { dbuvToDbm } from '../units'

export type FreqUnit = 'Hz' | 'kHz' | 'MHz' | 'GHz'
export type LevelUnit = 'dBm' | 'dBµV'

const FREQ_SCALE: Record<FreqUnit, number> = { Hz: 1, kHz: 1e3, MHz: 1e6, GHz: 1e9 }

/** A parse failure; lineNumber is 1-based when the failure belongs to a line. */
export class TraceCsvError extends RangeError {
  readonly lineNumber?: number
  constructor(message: string, lineNumber?: number) {
    super(lineNumber === undefined ? message : `line ${lineNumber}: ${message}`)
    this.name = 'TraceCsvError'
    this.lineNumber = lineNumber
  }
}

export interface ParsedTrace {
  freqHz: number[]
  levelDbm: number[]
  freqUnit: FreqUnit
  levelUnit: LevelUnit
  separator: ',' | ';'
  /** 1-based line number of the header, when there is one. */
  headerLine?: number
  /** The noise bandwidth the levels were read in, from an `# ENBW:` or `# RBW:` line [Hz]; null when none. */
  noiseBandwidthHz: number | null
  /** Which line stated it: 'ENBW' exactly, or 'RBW' taken as the noise bandwidth. */
  noiseBandwidthFrom: 'ENBW' | 'RBW' | null
  warnings: string[]
}

const BANDWIDTH_LINE = /^#\s*(ENBW|RBW)\b/i
const BANDWIDTH_VALUE = /^#\s*(ENBW|RBW)\s*[:=]\s*([+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?)\s*(Hz|kHz|MHz|GHz)\s*$/i

/**
 * The bandwidth stated by a comment line before the first data row (`# ENBW: 10 kHz`,
 * `# RBW = 9.1 kHz`). A line that names ENBW or RBW but cannot be read, a second one, or a
 * bandwidth that is not positive is an error naming its line: a wrong bandwidth would scale
 * every channel power computed from the trace.
 */
export function readTraceBandwidth(text: string): { hz: number; from: 'ENBW' | 'RBW'; lineNumber: number } | null {
  const lines = new Lines(text)
  let found: { hz: number; from: 'ENBW' | 'RBW'; lineNumber: number } | null = null
  while (lines.nextRaw()) {
    const line = text.slice(lines.start, lines.end).trim()
    if (line === '') continue
    if (line.charCodeAt(0) !== 35) break // the first content line ends the preamble
    if (!BANDWIDTH_LINE.test(line)) continue
    const m = BANDWIDTH_VALUE.exec(line)
    if (!m) throw new TraceCsvError(`'${line}' does not read as a bandwidth; write e.g. '# RBW: 10 kHz' (Hz, kHz, MHz or GHz).`, lines.lineNumber)
    if (found) throw new TraceCsvError(`a second bandwidth line; line ${found.lineNumber} already states one.`, lines.lineNumber)
    const hz = Number(m[2]) * FREQ_SCALE[({ hz: 'Hz', khz: 'kHz', mhz: 'MHz', ghz: 'GHz' } as const)[m[3]!.toLowerCase() as 'hz' | 'khz' | 'mhz' | 'ghz']] // Eq. (1) [Hz]
    if (!(hz > 0) || !Number.isFinite(hz)) throw new TraceCsvError(`the bandwidth must be a positive number of hertz.`, lines.lineNumber)
    found = { hz, from: m[1]!.toUpperCase() as 'ENBW' | 'RBW', lineNumber: lines.lineNumber }
  }
  return found
}

export interface ParseTraceCsvOptions {
  /** The file's text. */
  csvText: string
  /** Units to use when the header does not state them (or there is no header). */
  defaultFreqUnit?: FreqUnit
  defaultLevelUnit?: LevelUnit
  /** Receiver impedance for dBµV → dBm; default 50 Ω. */
  impedanceOhm?: number
}

const NUMBER = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/

/**
 * The lines of a text one at a time, with 1-based line numbers; lines end at CRLF, LF or CR.
 * One pass over the text, no array of lines (a trace of a million points is read without a
 * second copy of it). `next()` gives content lines only: trimmed, blank lines and '#' comments
 * skipped; `nextRaw()` gives every line as a range [start, end) of the text.
 */
class Lines {
  private at: number
  lineNumber = 0
  start = 0
  end = 0
  constructor(readonly text: string) {
    this.at = text.charCodeAt(0) === 0xfeff ? 1 : 0 // a byte-order mark is not content
  }

  nextRaw(): boolean {
    const t = this.text
    const len = t.length
    // what follows the last line break, if anything, is the last line
    if (this.at >= len) return false
    let end = this.at
    let c = 0
    while (end < len) {
      c = t.charCodeAt(end)
      if (c === 10 || c === 13) break
      end++
    }
    this.start = this.at
    this.end = end
    this.lineNumber++
    this.at = end < len ? end + (c === 13 && t.charCodeAt(end + 1) === 10 ? 2 : 1) : len
    return true
  }

  /** The line just read by nextRaw, trimmed; undefined for a blank or comment line. */
  content(): { text: string; lineNumber: number } | undefined {
    const line = this.text.slice(this.start, this.end).trim()
    return line !== '' && line.charCodeAt(0) !== 35 ? { text: line, lineNumber: this.lineNumber } : undefined // 35 = '#'
  }

  next(): { text: string; lineNumber: number } | undefined {
    while (this.nextRaw()) {
      const c = this.content()
      if (c) return c
    }
    return undefined
  }
}

const isAsciiSpace = (c: number) => c === 32 || c === 9 || c === 11 || c === 12
const isDigit = (c: number) => c >= 48 && c <= 57

/** 10^0 … 10^22: every one exactly representable as a double. */
const POW10 = Array.from({ length: 23 }, (_, k) => 10 ** k)
/** The value of the last number `numberEnd` read, or NaN when it must be converted from its text. */
let quickValue = NaN

/**
 * End of a number matching NUMBER that starts at `i` (before `end`), or −1 when the text there
 * is not one — the same grammar as the NUMBER pattern, read character by character. Sets
 * `quickValue` to its value when the digits form an integer below 2^53 and the decimal
 * exponent is within ±22: then mantissa × or ÷ 10^k is one correctly rounded operation on
 * exact doubles, so it equals Number(text) (W. D. Clinger, "How to read floating point
 * numbers accurately", PLDI 1990 [M] — the fast path, common practice); otherwise NaN.
 */
function numberEnd(t: string, i: number, end: number): number {
  let c = t.charCodeAt(i)
  const negative = c === 45
  if (c === 43 || c === 45) c = t.charCodeAt(++i) // + −
  let digits = 0
  let mantissa = 0
  let scale = 0
  while (i < end && isDigit(c)) {
    digits++
    mantissa = mantissa * 10 + (c - 48)
    c = t.charCodeAt(++i)
  }
  if (i < end && c === 46) {
    // '.'
    c = t.charCodeAt(++i)
    while (i < end && isDigit(c)) {
      digits++
      mantissa = mantissa * 10 + (c - 48)
      scale--
      c = t.charCodeAt(++i)
    }
  }
  if (digits === 0) return -1
  if (i < end && (c === 101 || c === 69)) {
    // e E
    c = t.charCodeAt(++i)
    const expNegative = c === 45
    if (i < end && (c === 43 || c === 45)) c = t.charCodeAt(++i)
    let expDigits = 0
    let exp = 0
    while (i < end && isDigit(c)) {
      expDigits++
      if (exp < 1e6) exp = exp * 10 + (c - 48)
      c = t.charCodeAt(++i)
    }
    if (expDigits === 0) return -1
    scale += expNegative ? -exp : exp
  }
  if (mantissa <= Number.MAX_SAFE_INTEGER && scale >= -22 && scale <= 22) {
    const v = scale >= 0 ? mantissa * POW10[scale] : mantissa / POW10[-scale]
    quickValue = negative ? -v : v
  } else {
    quickValue = NaN
  }
  return i
}

/** A row read by the quick path: where its two numbers are in the text. */
const plain = { f0: 0, f1: 0, l0: 0, l1: 0, fValue: NaN, lValue: NaN }

/**
 * The common row, `number<sep>number` with ASCII spaces around the fields and nothing else,
 * read in place (fills `plain`); false for anything else — blank, comment, quoted, a third
 * field, a trailing separator, an error — which the general path then reads, so every row
 * gives the same numbers and the same errors either way.
 */
function readPlainRow(t: string, start: number, end: number, sep: number): boolean {
  let i = start
  while (i < end && isAsciiSpace(t.charCodeAt(i))) i++
  const f1 = i < end ? numberEnd(t, i, end) : -1
  if (f1 < 0) return false
  plain.f0 = i
  plain.f1 = f1
  plain.fValue = quickValue
  i = f1
  while (i < end && isAsciiSpace(t.charCodeAt(i))) i++
  if (i >= end || t.charCodeAt(i) !== sep) return false
  i++
  while (i < end && isAsciiSpace(t.charCodeAt(i))) i++
  const l1 = i < end ? numberEnd(t, i, end) : -1
  if (l1 < 0) return false
  plain.l0 = i
  plain.l1 = l1
  plain.lValue = quickValue
  i = l1
  while (i < end && isAsciiSpace(t.charCodeAt(i))) i++
  return i === end
}

/** Parses trace CSV text into frequencies [Hz] and levels [dBm]; throws TraceCsvError with the line number. */
export function parseTraceCsv(opts: ParseTraceCsvOptions): ParsedTrace {
  const text = opts?.csvText
  if (typeof text !== 'string') throw new TraceCsvError('trace CSV must be text.')
  const impedanceOhm = requirePositive('impedanceOhm', opts.impedanceOhm ?? 50)
  const lines = new Lines(text)
  const first = lines.next()
  if (!first) throw new TraceCsvError('the trace CSV is empty.')

  const separator: ',' | ';' = first.text.includes(';') ? ';' : ','
  const firstFields = splitRow(first.text, separator)
  const hasHeader = !NUMBER.test(firstFields[0] ?? '')
  const warnings: string[] = []
  const bandwidth = readTraceBandwidth(text)
  if (bandwidth?.from === 'RBW') {
    warnings.push(
      `The resolution bandwidth on line ${bandwidth.lineNumber} is taken as the noise bandwidth; an analyser's RBW filter usually passes a few per cent more noise power than its RBW (see its data sheet), so a channel power may read slightly high.`,
    )
  }
  let freqUnit: FreqUnit | undefined = opts.defaultFreqUnit
  let levelUnit: LevelUnit | undefined = opts.defaultLevelUnit
  let headerLine: number | undefined
  if (hasHeader) {
    headerLine = first.lineNumber
    if (firstFields.length !== 2) {
      throw new TraceCsvError(`the header has ${firstFields.length} columns; expected 2 (frequency, level).`, headerLine)
    }
    freqUnit = freqUnitFromHeader(firstFields[0], headerLine) ?? freqUnit
    levelUnit = levelUnitFromHeader(firstFields[1], headerLine) ?? levelUnit
  }
  if (!freqUnit) {
    freqUnit = 'Hz'
    warnings.push('No frequency unit in the header or options: Hz assumed.')
  }
  if (!levelUnit) {
    levelUnit = 'dBm'
    warnings.push('No level unit in the header or options: dBm assumed.')
  }

  const unit = freqUnit
  const freqScale = FREQ_SCALE[unit]
  const levelsInDbm = levelUnit === 'dBm'
  const sepCode = separator.charCodeAt(0)
  const freqHz: number[] = []
  const levelDbm: number[] = []
  let prevHz = -Infinity
  const addRow = (f: string, fValue: number, lValue: number, lineNumber: number) => {
    const fHz = fValue * freqScale // Eq. (1) [Hz]
    const lDbm = levelsInDbm ? lValue : dbuvToDbm({ voltageDbuv: lValue, impedanceOhm }) // Eq. (2) [dBm]
    if (!Number.isFinite(fHz) || !Number.isFinite(lDbm)) throw new TraceCsvError('value out of range.', lineNumber)
    if (fHz < 0) throw new TraceCsvError(`frequency ${f} ${unit} is negative.`, lineNumber)
    if (freqHz.length > 0 && !(fHz > prevHz)) {
      throw new TraceCsvError(`frequency ${f} ${unit} does not increase on the row before; rows must be in ascending frequency.`, lineNumber)
    }
    freqHz.push(fHz)
    levelDbm.push(lDbm)
    prevHz = fHz
  }
  const readRow = (row: string, lineNumber: number) => {
    const fields = splitRow(row, separator)
    if (separator === ';' && fields.some((x) => /^[+-]?\d+,\d+$/.test(x))) {
      throw new TraceCsvError('decimal commas are not supported; use a decimal point.', lineNumber)
    }
    if (fields.length !== 2) {
      throw new TraceCsvError(`expected 2 columns (frequency${separator} level), found ${fields.length}: '${row}'.`, lineNumber)
    }
    const [f, l] = fields
    if (!NUMBER.test(f)) throw new TraceCsvError(`frequency '${f}' is not a number.`, lineNumber)
    if (!NUMBER.test(l)) throw new TraceCsvError(`level '${l}' is not a number.`, lineNumber)
    addRow(f, Number(f), Number(l), lineNumber)
  }

  if (!hasHeader) readRow(first.text, first.lineNumber)
  while (lines.nextRaw()) {
    if (readPlainRow(text, lines.start, lines.end, sepCode)) {
      const fValue = Number.isNaN(plain.fValue) ? Number(text.slice(plain.f0, plain.f1)) : plain.fValue
      const lValue = Number.isNaN(plain.lValue) ? Number(text.slice(plain.l0, plain.l1)) : plain.lValue
      const fHz = fValue * freqScale
      // the quick path adds in line; anything to refuse goes through addRow for its message
      if (levelsInDbm && fHz >= 0 && fHz > prevHz && Number.isFinite(fHz) && Number.isFinite(lValue)) {
        freqHz.push(fHz) // Eq. (1) [Hz]
        levelDbm.push(lValue)
        prevHz = fHz
      } else {
        addRow(text.slice(plain.f0, plain.f1), fValue, lValue, lines.lineNumber)
      }
      continue
    }
    const row = lines.content()
    if (row) readRow(row.text, row.lineNumber)
  }
  if (freqHz.length === 0) throw new TraceCsvError('the trace CSV has a header but no data rows.')
  return { freqHz, levelDbm, freqUnit, levelUnit, separator, headerLine, noiseBandwidthHz: bandwidth?.hz ?? null, noiseBandwidthFrom: bandwidth?.from ?? null, warnings }
}

function splitRow(text: string, separator: string): string[] {
  const fields = text.split(separator).map((f) => f.trim().replace(/^"(.*)"$/, '$1').trim())
  if (fields.length > 1 && fields[fields.length - 1] === '') fields.pop() // tolerate one trailing separator
  return fields
}

function freqUnitFromHeader(field: string, lineNumber: number): FreqUnit | undefined {
  const m = field.toLowerCase().match(/(?:^|[^a-z])([gmk]?hz)(?![a-z])/)
  if (m) return ({ hz: 'Hz', khz: 'kHz', mhz: 'MHz', ghz: 'GHz' } as const)[m[1] as 'hz' | 'khz' | 'mhz' | 'ghz']
  if (/[[(]/.test(field)) throw new TraceCsvError(`frequency unit in '${field}' is not one of Hz, kHz, MHz, GHz.`, lineNumber)
  return undefined
}

function levelUnitFromHeader(field: string, lineNumber: number): LevelUnit | undefined {
  const f = field.toLowerCase().replace(/[\s()[\]]/g, '')
  if (/dbm(?![a-z])/.test(f)) return 'dBm'
  if (/db[uµμ]v(?![a-z/])/.test(f)) return 'dBµV'
  if (/db|watt|(?:^|[^a-z])[mµu]?w$|v\/m/.test(f)) {
    throw new TraceCsvError(`level unit in '${field}' is not supported; use dBm or dBµV.`, lineNumber)
  }
  return undefined
}
