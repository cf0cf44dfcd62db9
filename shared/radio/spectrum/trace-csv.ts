/**
 * Parses a trace exported as plain CSV: two columns, frequency and level.
 *
 * Document: a generic format of the library's own (no standard): one optional header line
 * that may carry units ('Hz', 'kHz', 'MHz', 'GHz'; 'dBm', 'dBuV', 'dBµV'), comma or semicolon
 * separators, decimal point, blank lines and '#' comment lines ignored. Levels in dBµV are
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
  warnings: string[]
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

/** Parses trace CSV text into frequencies [Hz] and levels [dBm]; throws TraceCsvError with the line number. */
export function parseTraceCsv(opts: ParseTraceCsvOptions): ParsedTrace {
  const text = opts?.csvText
  if (typeof text !== 'string') throw new TraceCsvError('trace CSV must be text.')
  const impedanceOhm = requirePositive('impedanceOhm', opts.impedanceOhm ?? 50)
  const lines = text.replace(/^\uFEFF/, '').split(/\r\n|\n|\r/)
  const content = lines.map((raw, idx) => ({ text: raw.trim(), lineNumber: idx + 1 })).filter((l) => l.text !== '' && !l.text.startsWith('#'))
  if (content.length === 0) throw new TraceCsvError('the trace CSV is empty.')

  const separator: ',' | ';' = content[0].text.includes(';') ? ';' : ','
  const firstFields = splitRow(content[0].text, separator)
  const hasHeader = !NUMBER.test(firstFields[0] ?? '')
  const warnings: string[] = []
  let freqUnit: FreqUnit | undefined = opts.defaultFreqUnit
  let levelUnit: LevelUnit | undefined = opts.defaultLevelUnit
  let headerLine: number | undefined
  if (hasHeader) {
    headerLine = content[0].lineNumber
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

  const freqHz: number[] = []
  const levelDbm: number[] = []
  for (const line of hasHeader ? content.slice(1) : content) {
    const fields = splitRow(line.text, separator)
    if (separator === ';' && fields.some((f) => /^[+-]?\d+,\d+$/.test(f))) {
      throw new TraceCsvError('decimal commas are not supported; use a decimal point.', line.lineNumber)
    }
    if (fields.length !== 2) {
      throw new TraceCsvError(`expected 2 columns (frequency${separator} level), found ${fields.length}: '${line.text}'.`, line.lineNumber)
    }
    const [f, l] = fields
    if (!NUMBER.test(f)) throw new TraceCsvError(`frequency '${f}' is not a number.`, line.lineNumber)
    if (!NUMBER.test(l)) throw new TraceCsvError(`level '${l}' is not a number.`, line.lineNumber)
    const fHz = Number(f) * FREQ_SCALE[freqUnit] // Eq. (1) [Hz]
    const lDbm = levelUnit === 'dBm' ? Number(l) : dbuvToDbm({ voltageDbuv: Number(l), impedanceOhm }) // Eq. (2) [dBm]
    if (!Number.isFinite(fHz) || !Number.isFinite(lDbm)) throw new TraceCsvError('value out of range.', line.lineNumber)
    if (fHz < 0) throw new TraceCsvError(`frequency ${f} ${freqUnit} is negative.`, line.lineNumber)
    if (freqHz.length > 0 && !(fHz > freqHz[freqHz.length - 1])) {
      throw new TraceCsvError(`frequency ${f} ${freqUnit} does not increase on the row before; rows must be in ascending frequency.`, line.lineNumber)
    }
    freqHz.push(fHz)
    levelDbm.push(lDbm)
  }
  if (freqHz.length === 0) throw new TraceCsvError('the trace CSV has a header but no data rows.')
  return { freqHz, levelDbm, freqUnit, levelUnit, separator, headerLine, warnings }
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
