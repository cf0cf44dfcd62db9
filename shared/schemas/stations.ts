/**
 * The licence register's contract (/api/station-register/…): the column mapping an
 * administrator sends with an import, the search of the current register, and the answers.
 * Every number of a register row is read by the strict parser (shared/stations/register-rows.ts)
 * in the unit chosen for its column; the answers carry base units named in their keys.
 */
import { z } from 'zod'
import { CSV_DELIMITERS, STATION_FIELD_INFO, STATION_FIELDS, STATION_UNITS, isNumberField, type StationField } from '../domain/station-register'
import { CONTENT_TYPE_SOURCES, STORED_FILE_PURPOSES } from '../domain/stored-files'
import { FREQUENCY_UNITS } from './band-limits'
import { numberWithUnit } from './number-with-unit'
import { storableString } from './text'
import { limitSpecViewSchema } from './views'
import { candidateSourcesOutputSchema } from '../calculations/kinds/candidate-sources'

const instant = z.iso.datetime()
const id = z.uuid()
const isoDate = z.iso.date()

// ── the column mapping ───────────────────────────────────────────────────────

export const fieldMappingSchema = z.strictObject({
  /** The CSV header the field is read from, exactly as the file writes it. */
  column: storableString().min(1, 'Choose a column.').max(200, 'A column name is at most 200 characters.'),
  /** For a number field: the unit of the column's numbers (a cell may also write its own). */
  unit: z.string().max(20).optional(),
})

const fieldsSchema = z.partialRecord(z.enum(STATION_FIELDS), fieldMappingSchema)
export type ColumnMappingFields = z.infer<typeof fieldsSchema>

const label = (f: StationField) => STATION_FIELD_INFO[f].label

/** Every problem of a mapping, each with the field it concerns ('fields.<field>' or 'fields'). */
export function mappingProblems(fields: ColumnMappingFields): { path: string; message: string }[] {
  const problems: { path: string; message: string }[] = []
  const has = (f: StationField) => fields[f] !== undefined
  for (const f of ['stationCode', 'licensee', 'latitude', 'longitude'] as const) {
    if (!has(f)) problems.push({ path: `fields.${f}`, message: `Choose the column that holds the ${label(f).toLowerCase()}.` })
  }
  const range = has('lowFreq') || has('highFreq')
  const centred = has('centreFreq') || has('bandwidth')
  if (range && centred) {
    problems.push({ path: 'fields', message: 'Map the frequencies either as low and high frequency or as centre frequency and bandwidth, not both.' })
  } else if (range && !(has('lowFreq') && has('highFreq'))) {
    problems.push({ path: has('lowFreq') ? 'fields.highFreq' : 'fields.lowFreq', message: 'Map both the low and the high frequency.' })
  } else if (centred && !(has('centreFreq') && has('bandwidth'))) {
    problems.push({ path: has('centreFreq') ? 'fields.bandwidth' : 'fields.centreFreq', message: 'Map both the centre frequency and the bandwidth.' })
  } else if (!range && !centred) {
    problems.push({ path: 'fields', message: 'Map the frequencies: low and high frequency, or centre frequency and bandwidth.' })
  }
  // several power columns may be mapped (a register mixes EIRP, ERP and conducted licences): each row fills one
  const powers = (['eirp', 'erp', 'conductedPower'] as const).filter(has)
  if (powers.length === 0) problems.push({ path: 'fields', message: 'Map the authorised power: EIRP, ERP, or conducted power with the antenna gain.' })
  if (has('conductedPower') && !has('antennaGain')) problems.push({ path: 'fields.antennaGain', message: 'A conducted power needs the antenna gain column.' })
  if (!has('conductedPower')) {
    for (const f of ['antennaGain', 'feederLoss'] as const) {
      if (has(f)) problems.push({ path: `fields.${f}`, message: `The ${label(f).toLowerCase()} counts only with a conducted power: leave it unmapped.` })
    }
  }
  const byColumn = new Map<string, StationField[]>()
  for (const f of STATION_FIELDS) {
    const m = fields[f]
    if (!m) continue
    byColumn.set(m.column, [...(byColumn.get(m.column) ?? []), f])
    const kind = STATION_FIELD_INFO[f].kind
    if (isNumberField(kind)) {
      const units: readonly string[] = STATION_UNITS[kind]
      if (m.unit !== undefined && !units.includes(m.unit)) problems.push({ path: `fields.${f}.unit`, message: `Unknown unit '${m.unit}' for the ${label(f).toLowerCase()}: use one of ${units.join(', ')}.` })
    } else if (m.unit !== undefined) {
      problems.push({ path: `fields.${f}.unit`, message: `The ${label(f).toLowerCase()} has no unit.` })
    }
  }
  for (const [column, fs] of byColumn) {
    if (fs.length > 1) problems.push({ path: 'fields', message: `Column "${column}" is mapped to ${fs.map(label).join(' and ')}: map each column to one field.` })
  }
  return problems
}

/** How the columns of a register CSV are read: each field from one column, numbers in a unit. */
export const columnMappingSchema = z.strictObject({ fields: fieldsSchema }).superRefine((m, ctx) => {
  for (const p of mappingProblems(m.fields)) ctx.addIssue({ code: 'custom', path: p.path.split('.'), message: p.message })
})
export type ColumnMapping = z.infer<typeof columnMappingSchema>

export const csvDelimiterSchema = z.enum(CSV_DELIMITERS, { error: 'Choose the delimiter: comma, semicolon, tab or vertical bar.' })

/** POST /api/station-register/uploads: the form's text field beside the file (field `file`); other fields are ignored. */
export const registerUploadFieldsSchema = z.object({ delimiter: csvDelimiterSchema.optional() })

/** POST /api/station-register/uploads/:id/inspect: read the file again with another delimiter. */
export const inspectUploadSchema = z.strictObject({ delimiter: csvDelimiterSchema.optional() })

/** POST /api/station-register/uploads/:id/preview and …/confirm. */
export const registerImportSchema = z.strictObject({ delimiter: csvDelimiterSchema, mapping: columnMappingSchema })
export type RegisterImport = z.infer<typeof registerImportSchema>

/** GET /api/station-register/stations: search of the current register (or of one version). */
export const stationSearchSchema = z.strictObject({
  /** Part of a licensee's name or of a station code. */
  q: storableString().trim().max(100, 'Search with at most 100 characters.').optional(),
  /** A frequency the station's authorised range holds ("446.1 MHz"). */
  freq: numberWithUnit({ units: FREQUENCY_UNITS, defaultUnit: 'MHz', min: 0, minExclusive: true, max: 3e12, label: 'the frequency', example: '446.1 MHz', optional: true }),
  page: numberWithUnit({ min: 1, max: 100_000, integer: true, label: 'the page', optional: true }),
  version: numberWithUnit({ min: 1, max: 1e9, integer: true, label: 'the register version', optional: true }),
})
export type StationSearch = z.infer<typeof stationSearchSchema>

export const STATION_PAGE_SIZE = 50

/** A version's path parameter. */
export const registerVersionParamSchema = z.object({ version: numberWithUnit({ min: 1, max: 1e9, integer: true, label: 'the register version' }) })

// ── answers ──────────────────────────────────────────────────────────────────

/** A file kept in the object store. */
export const storedFileViewSchema = z.object({
  id,
  originalName: z.string(),
  sizeBytes: z.number().int().min(0),
  /** Lowercase hex SHA-256 of the bytes as stored, computed while they streamed in. */
  sha256: z.string().regex(/^[0-9a-f]{64}$/),
  contentType: z.string(),
  contentTypeSource: z.enum(CONTENT_TYPE_SOURCES),
  purpose: z.enum(STORED_FILE_PURPOSES),
  uploadedAt: instant,
  uploadedBy: z.string(),
})
export type StoredFileView = z.infer<typeof storedFileViewSchema>

const mappingViewSchema = z.object({ fields: z.partialRecord(z.enum(STATION_FIELDS), z.object({ column: z.string(), unit: z.string().optional() })) })

/** What the server read at the top of an uploaded CSV, and the mapping it suggests. */
export const csvInspectionViewSchema = z.object({
  file: storedFileViewSchema,
  delimiter: z.enum(CSV_DELIMITERS),
  /** True when the server chose the delimiter (none was sent). */
  delimiterDetected: z.boolean(),
  headers: z.array(z.string()),
  /** The first rows as written (at most 10). */
  sampleRows: z.array(z.object({ line: z.number().int(), cells: z.array(z.string()) })),
  suggestedMapping: mappingViewSchema,
  /** Why a column was or was not suggested (units guessed from the header, …). */
  notes: z.array(z.string()),
})
export type CsvInspectionView = z.infer<typeof csvInspectionViewSchema>

/** A rejected row: its line in the file and every problem in it. */
export const rowProblemsSchema = z.object({ line: z.number().int().min(1), problems: z.array(z.string()).min(1) })
export type RowProblems = z.infer<typeof rowProblemsSchema>

/** A register row as the import reads it (base units). */
export const stationDraftViewSchema = z.object({
  line: z.number().int(),
  stationCode: z.string(),
  licensee: z.string(),
  service: z.string(),
  latitudeDeg: z.number(),
  longitudeDeg: z.number(),
  antennaHeightM: z.number().nullable(),
  lowFreqHz: z.number(),
  highFreqHz: z.number(),
  limit: limitSpecViewSchema,
  /** With a conducted-power limit: the antenna gain and feeder loss the licence states. */
  antennaGainDbi: z.number().nullable(),
  feederLossDb: z.number().nullable(),
  authorisedEirpDbm: z.number(),
  validFrom: isoDate.nullable(),
  validUntil: isoDate.nullable(),
})
export type StationDraftView = z.infer<typeof stationDraftViewSchema>

/** Most rejected rows a report lists (the counts are always complete). */
export const MAX_REPORTED_ROWS = 1000

/** The check of every row of an upload with a mapping (preview, and kept with a confirmed version). */
export const importReportViewSchema = z.object({
  fileId: id,
  delimiter: z.enum(CSV_DELIMITERS),
  rowCount: z.number().int().min(0),
  acceptedCount: z.number().int().min(0),
  rejectedCount: z.number().int().min(0),
  /** Rejected rows by line, at most MAX_REPORTED_ROWS of them. */
  rejected: z.array(rowProblemsSchema),
  /** The first accepted rows as they will be stored (at most 10). */
  sample: z.array(stationDraftViewSchema),
})
export type ImportReportView = z.infer<typeof importReportViewSchema>

/** A version of the register: one import. */
export const registerVersionViewSchema = z.object({
  version: z.number().int().min(1),
  importedAt: instant,
  importedBy: z.string(),
  fileId: id,
  fileName: z.string(),
  sha256: z.string(),
  acceptedCount: z.number().int(),
  rejectedCount: z.number().int(),
  delimiter: z.enum(CSV_DELIMITERS),
  mapping: mappingViewSchema,
  /** The newest version is the register in force. */
  current: z.boolean(),
})
export type RegisterVersionView = z.infer<typeof registerVersionViewSchema>

/** An authorised station of a register version: the row as imported, with its id and version. */
export const stationViewSchema = stationDraftViewSchema.extend({
  id,
  registerVersion: z.number().int().min(1),
})
export type StationView = z.infer<typeof stationViewSchema>

export const csvInspectionResponseSchema = z.object({ inspection: csvInspectionViewSchema })
export const importPreviewResponseSchema = z.object({ report: importReportViewSchema })
export const importConfirmResponseSchema = z.object({ version: registerVersionViewSchema, report: importReportViewSchema })
export const registerVersionsResponseSchema = z.object({ versions: z.array(registerVersionViewSchema) })
export const registerVersionResponseSchema = z.object({ version: registerVersionViewSchema, rejected: z.array(rowProblemsSchema) })
export const stationsPageResponseSchema = z.object({
  /** The version searched (the current one unless asked); null before the first import. */
  registerVersion: z.number().int().nullable(),
  total: z.number().int().min(0),
  page: z.number().int().min(1),
  pageSize: z.number().int(),
  stations: z.array(stationViewSchema),
})
export type StationsPage = z.infer<typeof stationsPageResponseSchema>
export const stationResponseSchema = z.object({ station: stationViewSchema })

/** POST /api/station-register/candidates: the ranking of the register in force, nothing stored. */
export const candidateRankingResponseSchema = z.object({ ranking: candidateSourcesOutputSchema.extend({ warnings: z.array(z.string()) }) })
