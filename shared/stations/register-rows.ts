/**
 * Reading one row of a licence-register CSV with a column mapping: every number through the
 * strict parser (shared/schemas/number-with-unit.ts) in its column's unit (a cell may write its
 * own unit from the same list), every problem of the row collected, never only the first.
 * Frequencies given as centre and bandwidth become the range centre ± bandwidth/2; the
 * authorised limit is kept as the licence states it (a LimitSpec) and as an EIRP through the
 * radio library's appliedLimitEirpDbm.
 */
import { appliedLimitEirpDbm, type LimitSpec } from '../radio'
import { STATION_FIELD_INFO, STATION_FIELDS, STATION_UNITS, isNumberField, type NumberFieldKind, type StationField } from '../domain/station-register'
import { readWrittenNumber, inBaseUnit, checkNumber, type NumberWithUnitSpec } from '../schemas/number-with-unit'
import type { ColumnMappingFields } from '../schemas/stations'

/** A register row as read (base units), ready to store. */
export interface StationDraft {
  line: number
  stationCode: string
  licensee: string
  service: string
  latitudeDeg: number
  longitudeDeg: number
  antennaHeightM: number | null
  lowFreqHz: number
  highFreqHz: number
  limit: LimitSpec
  /** With a conducted-power limit: the gain and feeder loss the licence states. */
  antennaGainDbi: number | null
  feederLossDb: number | null
  authorisedEirpDbm: number
  validFrom: string | null
  validUntil: string | null
}

export type RowRead = { ok: true; station: StationDraft } | { ok: false; problems: string[] }

/**
 * The numeric range each field may take, in its base unit (Hz, degrees, metres, dBm, dBi, dB).
 * Powers from −100 dBm (0.1 pW) to 100 dBm (10 MW) cover every licence; heights up to 2 km
 * above ground (the tallest masts are about 600 m).
 */
const NUMBER_RANGES: Partial<Record<StationField, { min: number; max: number; minExclusive?: boolean }>> = {
  latitude: { min: -90, max: 90 },
  longitude: { min: -180, max: 180 },
  antennaHeight: { min: 0, max: 2000 },
  lowFreq: { min: 0, max: 3e12, minExclusive: true },
  highFreq: { min: 0, max: 3e12, minExclusive: true },
  centreFreq: { min: 0, max: 3e12, minExclusive: true },
  bandwidth: { min: 0, max: 1e11, minExclusive: true },
  eirp: { min: -100, max: 100 },
  erp: { min: -100, max: 100 },
  conductedPower: { min: -100, max: 100 },
  antennaGain: { min: -30, max: 80 },
  feederLoss: { min: 0, max: 100 },
}

/** Factors of the units that scale (frequency, angle, length, watts to milliwatts). */
const FACTORS: Record<string, number> = { Hz: 1, kHz: 1e3, MHz: 1e6, GHz: 1e9, deg: 1, m: 1, km: 1e3, mW: 1, W: 1e3, kW: 1e6 }
/** Offsets of the logarithmic units to the base unit: dBW = dBm + 30, dBd = dBi + 2.15 (a half-wave dipole's gain). */
const OFFSETS: Record<string, number> = { dBm: 0, dBW: 30, dBi: 0, dBd: 2.15, dB: 0 }
const LINEAR_POWER = new Set(['W', 'mW', 'kW'])

const unitsOf = (kind: NumberFieldKind): Record<string, number> => {
  const units: Record<string, number> = {}
  for (const u of STATION_UNITS[kind]) units[u] = 1
  if (kind === 'angle') units['°'] = 1
  return units
}

const fmt = (v: number) => String(+v.toPrecision(10))

/** Reads one number cell of a field in the column's unit; the value in the base unit, or the problem. */
export function readNumberCell(field: StationField, cell: string, columnUnit: string | undefined, column: string): { value: number } | { problem: string } {
  const info = STATION_FIELD_INFO[field]
  const kind = info.kind as NumberFieldKind
  const units = unitsOf(kind)
  const name = info.label
  const spec: NumberWithUnitSpec = { units, label: `the ${name.toLowerCase()}` }
  const written = readWrittenNumber(cell, spec)
  const quoted = `'${cell.trim()}'`
  if (!written.ok) {
    if (/^Use one of these units/.test(written.message)) {
      const unitText = cell.trim().replace(/^[+\-\u2212]?[\d.,]*(?:[eE][+\-\u2212]?\d+)?\s*/, '')
      return { problem: `unknown unit '${unitText}' in column ${column} (${name}): use ${STATION_UNITS[kind].join(', ')}` }
    }
    if (/comma/.test(written.message)) return { problem: `${quoted} in column ${column} (${name}): ${written.message}` }
    return { problem: `text ${quoted} in column ${column} (${name}): not a number` }
  }
  const unit = written.value.unit === '°' ? 'deg' : (written.value.unit ?? columnUnit ?? info.defaultUnit ?? '')
  let value: number
  if (kind === 'power' && LINEAR_POWER.has(unit)) {
    const mw = inBaseUnit(written.value, unit, FACTORS)
    if (!(mw > 0)) return { problem: `${quoted} in column ${column} (${name}): a power in ${unit} must be above zero` }
    value = 10 * Math.log10(mw) // dBm = 10·log10(P / 1 mW)
  } else if (unit in OFFSETS) {
    value = written.value.amount + OFFSETS[unit]!
  } else {
    value = inBaseUnit(written.value, unit, FACTORS)
  }
  const range = NUMBER_RANGES[field]
  if (range) {
    const problem = checkNumber(value, written.value.decimal.digits, { ...range, label: name.toLowerCase() })
    if (problem) {
      const base = { frequency: 'Hz', angle: '°', length: 'm', power: 'dBm', gain: 'dBi', loss: 'dB' }[kind]
      const bounds = range.minExclusive ? `above ${fmt(range.min)} and at most ${fmt(range.max)} ${base}` : `from ${fmt(range.min)} to ${fmt(range.max)} ${base}`
      return { problem: `${quoted} in column ${column} (${name}) is impossible: it must be ${bounds}` }
    }
  }
  return { value }
}

const ISO_DATE = /^(\d{4})-(\d{2})-(\d{2})$/

/** A calendar date written yyyy-mm-dd, or the problem. */
export function readDateCell(cell: string, column: string, label: string): { value: string } | { problem: string } {
  const t = cell.trim()
  const m = ISO_DATE.exec(t)
  if (m) {
    const d = new Date(Date.UTC(Number(m[1]), Number(m[2]) - 1, Number(m[3])))
    if (d.getUTCFullYear() === Number(m[1]) && d.getUTCMonth() === Number(m[2]) - 1 && d.getUTCDate() === Number(m[3])) return { value: t }
  }
  return { problem: `'${t}' in column ${column} (${label}) is not a date: write it as yyyy-mm-dd, e.g. 2026-03-31` }
}

const MAX_TEXT = 200
const POWER_FIELDS = ['eirp', 'erp', 'conductedPower'] as const
/** Cells that may be blank: the optional fields, and the powers and gain (one kind of power per row). */
const OPTIONAL_CELLS = new Set<StationField>(['antennaHeight', 'service', 'feederLoss', 'validFrom', 'validUntil', 'eirp', 'erp', 'conductedPower', 'antennaGain'])

/**
 * Reads one data row. `cells` are the row's fields as the CSV parser gave them, `headers` the
 * header row; `line` is the row's line in the file (the header is line 1).
 */
export function readStationRow(cells: readonly string[], line: number, headers: readonly string[], fields: ColumnMappingFields): RowRead {
  const problems: string[] = []
  if (cells.length !== headers.length) problems.push(`${cells.length} fields where the header has ${headers.length}`)
  const cellOf = (f: StationField): { cell: string; column: string } | undefined => {
    const m = fields[f]
    if (!m) return undefined
    const i = headers.indexOf(m.column)
    return i < 0 ? undefined : { cell: cells[i] ?? '', column: m.column }
  }
  const texts: Partial<Record<StationField, string>> = {}
  const numbers: Partial<Record<StationField, number>> = {}
  const dates: Partial<Record<StationField, string>> = {}
  for (const f of STATION_FIELDS) {
    const c = cellOf(f)
    if (!c) continue
    const info = STATION_FIELD_INFO[f]
    const blank = c.cell.trim() === ''
    if (blank) {
      // required fields: the codes, the position, the frequencies and the power the mapping names
      // the powers and the gain are checked together below (a row fills one kind of power)
      if (!OPTIONAL_CELLS.has(f)) problems.push(`no ${info.label.toLowerCase()} in column ${c.column}`)
      continue
    }
    if (info.kind === 'text') {
      const t = c.cell.trim()
      if (t.length > MAX_TEXT) problems.push(`the ${info.label.toLowerCase()} in column ${c.column} is longer than ${MAX_TEXT} characters`)
      else if (t.includes('\u0000')) problems.push(`the ${info.label.toLowerCase()} in column ${c.column} holds a control character (U+0000)`)
      else texts[f] = t
    } else if (info.kind === 'date') {
      const r = readDateCell(c.cell, c.column, info.label)
      if ('problem' in r) problems.push(r.problem)
      else dates[f] = r.value
    } else if (isNumberField(info.kind)) {
      const r = readNumberCell(f, c.cell, fields[f]?.unit, c.column)
      if ('problem' in r) problems.push(r.problem)
      else numbers[f] = r.value
    }
  }

  let lowFreqHz: number | undefined
  let highFreqHz: number | undefined
  if (fields.lowFreq && numbers.lowFreq !== undefined && numbers.highFreq !== undefined) {
    lowFreqHz = numbers.lowFreq
    highFreqHz = numbers.highFreq
    if (!(highFreqHz > lowFreqHz)) {
      problems.push(`the low frequency ${fmt(lowFreqHz / 1e6)} MHz is not below the high frequency ${fmt(highFreqHz / 1e6)} MHz`)
      lowFreqHz = highFreqHz = undefined
    }
  } else if (fields.centreFreq && numbers.centreFreq !== undefined && numbers.bandwidth !== undefined) {
    lowFreqHz = numbers.centreFreq - numbers.bandwidth / 2
    highFreqHz = numbers.centreFreq + numbers.bandwidth / 2
    if (!(lowFreqHz > 0)) {
      problems.push(`the bandwidth ${fmt(numbers.bandwidth / 1e6)} MHz reaches below 0 Hz around the centre frequency ${fmt(numbers.centreFreq / 1e6)} MHz`)
      lowFreqHz = highFreqHz = undefined
    }
  }
  if (dates.validFrom && dates.validUntil && dates.validUntil < dates.validFrom) problems.push(`valid until ${dates.validUntil} is before valid from ${dates.validFrom}`)

  const filled = POWER_FIELDS.filter((f) => cellOf(f) && cellOf(f)!.cell.trim() !== '')
  if (filled.length === 0) problems.push(`no authorised power: fill one of ${POWER_FIELDS.filter((f) => fields[f]).map((f) => `${STATION_FIELD_INFO[f].label} (column ${fields[f]!.column})`).join(', ')}`)
  if (filled.length > 1) problems.push(`more than one authorised power (${filled.map((f) => STATION_FIELD_INFO[f].label).join(' and ')}): fill one`)
  const gainCell = cellOf('antennaGain')
  if (filled.length === 1 && filled[0] === 'conductedPower' && (!gainCell || gainCell.cell.trim() === '')) {
    problems.push(`a conducted power needs the antenna gain${gainCell ? ` in column ${gainCell.column}` : ''}`)
  }
  let limit: LimitSpec | undefined
  if (filled.length === 1) {
    if (numbers.eirp !== undefined) limit = { kind: 'eirp', eirpDbm: numbers.eirp }
    else if (numbers.erp !== undefined) limit = { kind: 'erp', erpDbm: numbers.erp }
    else if (numbers.conductedPower !== undefined) limit = { kind: 'conducted', conductedPowerDbm: numbers.conductedPower, gainRule: { kind: 'no-reduction' } }
  }
  let authorisedEirpDbm: number | undefined
  if (limit && (limit.kind !== 'conducted' || numbers.antennaGain !== undefined)) {
    try {
      authorisedEirpDbm = appliedLimitEirpDbm({
        spec: limit,
        ...(limit.kind === 'conducted' ? { antennaGainDbi: numbers.antennaGain, feederLossDb: numbers.feederLoss ?? 0 } : {}),
      }).value.limitEirpDbm
    } catch (e) {
      if (!(e instanceof RangeError)) throw e
      problems.push(`the authorised limit cannot be read as an EIRP: ${e.message}`)
    }
  }

  if (problems.length > 0) return { ok: false, problems }
  const conducted = limit?.kind === 'conducted'
  return {
    ok: true,
    station: {
      line,
      stationCode: texts.stationCode!,
      licensee: texts.licensee!,
      service: texts.service ?? '',
      latitudeDeg: numbers.latitude!,
      longitudeDeg: numbers.longitude!,
      antennaHeightM: numbers.antennaHeight ?? null,
      lowFreqHz: lowFreqHz!,
      highFreqHz: highFreqHz!,
      limit: limit!,
      antennaGainDbi: conducted ? numbers.antennaGain! : null,
      feederLossDb: conducted ? (numbers.feederLoss ?? 0) : null,
      authorisedEirpDbm: authorisedEirpDbm!,
      validFrom: dates.validFrom ?? null,
      validUntil: dates.validUntil ?? null,
    },
  }
}

/**
 * A reader of the data rows of one file: each row read with `readStationRow`, and a station
 * code met before in the file refused (the register holds one row per station).
 */
export function createStationRowReader(headers: readonly string[], fields: ColumnMappingFields): (cells: readonly string[], line: number) => RowRead {
  const firstLine = new Map<string, number>()
  return (cells, line) => {
    const r = readStationRow(cells, line, headers, fields)
    if (!r.ok) return r
    const seen = firstLine.get(r.station.stationCode)
    if (seen !== undefined) return { ok: false, problems: [`station code ${r.station.stationCode} is already on line ${seen}`] }
    firstLine.set(r.station.stationCode, line)
    return r
  }
}

/** Reads every row: the accepted rows and the rejected ones by line with every problem. */
export function readStationRows(rows: Iterable<{ line: number; cells: readonly string[] }>, headers: readonly string[], fields: ColumnMappingFields) {
  const read = createStationRowReader(headers, fields)
  const accepted: StationDraft[] = []
  const rejected: { line: number; problems: string[] }[] = []
  for (const { line, cells } of rows) {
    const r = read(cells, line)
    if (r.ok) accepted.push(r.station)
    else rejected.push({ line, problems: r.problems })
  }
  return { accepted, rejected }
}
