/**
 * What the import can guess from the top of a register CSV: its delimiter (from the header
 * line) and a mapping of its columns to the register's fields with the unit of each number
 * column (from the header's words and brackets, else from the numbers written). A guess only:
 * the administrator checks and adjusts it before any row is read.
 */
import { CSV_DELIMITER_CHARS, CSV_DELIMITERS, STATION_FIELD_INFO, STATION_UNITS, isNumberField, type CsvDelimiter, type StationField } from '../domain/station-register'
import type { ColumnMappingFields } from '../schemas/stations'

/** The delimiter the header line uses most (outside quotes); a comma when it holds none. */
export function detectDelimiter(headerLine: string): CsvDelimiter {
  let best: CsvDelimiter = 'comma'
  let bestCount = 0
  for (const d of CSV_DELIMITERS) {
    const ch = CSV_DELIMITER_CHARS[d]
    let n = 0
    let quoted = false
    for (const c of headerLine) {
      if (c === '"') quoted = !quoted
      else if (!quoted && c === ch) n++
    }
    if (n > bestCount) {
      best = d
      bestCount = n
    }
  }
  return best
}

/** Header words for each field, tried in this order (EIRP before ERP, the range before the centre). */
const HEADER_PATTERNS: [StationField, RegExp][] = [
  ['stationCode', /(station|site|transmitter|tx)\s*(code|id|no|number|ref)|call\s*sign|^code$|^id$|licen[cs]e\s*(no|number|id|ref)/],
  ['licensee', /licensee|holder|owner|company|operator|organi[sz]ation/],
  ['service', /service|usage|category|class/],
  ['latitude', /^lat|latitude/],
  ['longitude', /^lon|^lng|longitude/],
  ['antennaHeight', /height|agl|\bhgt\b/],
  ['lowFreq', /(low|lower|start|min|from)\w*\s*(freq|frequency)|(freq|frequency)\s*(low|lower|start|min|from)|^f\s*low|^f\s*min/],
  ['highFreq', /(high|upper|end|stop|max|to)\w*\s*(freq|frequency)|(freq|frequency)\s*(high|upper|end|stop|max|to)|^f\s*high|^f\s*max/],
  ['centreFreq', /cent(re|er)|^(freq|frequency)$|^f$|carrier/],
  ['bandwidth', /bandwidth|^bw$|^bw\b|necessary/],
  ['eirp', /e\.?i\.?r\.?p/],
  ['erp', /(^|[^i.])e\.?r\.?p/],
  ['conductedPower', /(tx|transmit\w*|conducted|output)\s*power|^power$/],
  ['antennaGain', /gain/],
  ['feederLoss', /feeder|cable\s*loss|line\s*loss/],
  ['validFrom', /valid\s*from|start\s*date|issued|effective/],
  ['validUntil', /valid\s*(until|to)|expir|end\s*date/],
]

/** The header without its unit: "Low frequency (MHz)" → "low frequency". */
const words = (header: string) =>
  header
    .replace(/[([{].*?[)\]}]/g, ' ')
    .replace(/[_\-/]+/g, ' ')
    .replace(/\s+/g, ' ')
    .trim()
    .toLowerCase()

/** A unit written in the header, in brackets or as its last word ("EIRP (dBW)", "freq_mhz"). */
function unitInHeader(header: string, units: readonly string[]): string | undefined {
  const candidates = [...header.matchAll(/[([{]\s*([^)\]}]+?)\s*[)\]}]/g)].map((m) => m[1]!)
  const last = /[\s_-]([A-Za-z°]+)\s*$/.exec(header)?.[1]
  if (last) candidates.push(last)
  for (const c of candidates) {
    const exact = units.find((u) => u === c)
    if (exact) return exact
    // a unit's case can carry meaning (mW, MW): fold only a word written all in one case
    if (c === c.toLowerCase() || c === c.toUpperCase()) {
      const folded = units.filter((u) => u.toLowerCase() === c.toLowerCase())
      if (folded.length === 1) return folded[0]
    }
  }
  return undefined
}

/** A unit the cells write after their numbers ("446.1 MHz"), when the column's cells agree on one. */
function unitInCells(cells: string[], units: readonly string[]): string | undefined {
  const found = new Set<string>()
  for (const c of cells) {
    const m = /^[+\-\u2212]?[\d.,]+(?:[eE][+\-\u2212]?\d+)?\s*(\S+)$/.exec(c.trim())
    if (m && units.includes(m[1]!)) found.add(m[1]!)
  }
  return found.size === 1 ? [...found][0] : undefined
}

/** For frequencies without a unit, from the size of the numbers: Hz from 10 million, kHz from 100 thousand, else MHz. */
function frequencyUnitFromValues(cells: string[]): string | undefined {
  const values = cells.map((c) => Number(c.trim())).filter((v) => Number.isFinite(v) && v > 0)
  if (values.length === 0) return undefined
  const sorted = values.sort((a, b) => a - b)
  const median = sorted[Math.floor(sorted.length / 2)]!
  return median >= 1e7 ? 'Hz' : median >= 1e5 ? 'kHz' : 'MHz'
}

/**
 * A suggested mapping: each field to the first column whose header names it, each column used
 * once, numbers with the unit the header or the cells write (frequencies without one: guessed
 * from the size of the numbers, said in the notes).
 */
export function suggestMapping(headers: readonly string[], sampleRows: readonly (readonly string[])[]): { fields: ColumnMappingFields; notes: string[] } {
  const fields: ColumnMappingFields = {}
  const notes: string[] = []
  const used = new Set<number>()
  for (const [field, pattern] of HEADER_PATTERNS) {
    const i = headers.findIndex((h, j) => !used.has(j) && pattern.test(words(h)))
    if (i < 0) continue
    used.add(i)
    const column = headers[i]!
    const info = STATION_FIELD_INFO[field]
    if (!isNumberField(info.kind)) {
      fields[field] = { column }
      continue
    }
    const units = STATION_UNITS[info.kind]
    const cells = sampleRows.map((r) => r[i] ?? '')
    let unit = unitInHeader(column, units) ?? unitInCells(cells, units)
    if (!unit && info.kind === 'frequency') {
      unit = frequencyUnitFromValues(cells)
      if (unit) notes.push(`Column "${column}" names no unit: ${unit} guessed from the size of its numbers. Check it.`)
    }
    if (!unit && units.length > 1) notes.push(`Column "${column}" names no unit: ${info.defaultUnit} assumed. Check it.`)
    fields[field] = { column, unit: unit ?? info.defaultUnit }
  }
  // one way of giving the frequencies: the range when both edges were found
  if (fields.lowFreq && fields.highFreq) {
    delete fields.centreFreq
    delete fields.bandwidth
  }
  // the gain and the feeder loss count only with a conducted power
  if (!fields.conductedPower) {
    delete fields.antennaGain
    delete fields.feederLoss
  }
  const unmatched = headers.filter((_h, j) => !used.has(j))
  if (unmatched.length > 0) notes.push(`Not mapped: ${unmatched.map((h) => `"${h}"`).join(', ')}.`)
  return { fields, notes }
}
