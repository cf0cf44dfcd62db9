/**
 * The licence register: one for the whole regulator, versioned. Staff read the version in force
 * (and older ones); administrators import a new version from a CSV in steps — upload (the file
 * is kept in the object store) → inspect (headers, first rows, a suggested mapping) → preview
 * (every row checked with the mapping, rejected rows reported by line) → confirm (a new version
 * with the accepted rows and the report, in one transaction). The server reads the stored file
 * again at every step: nothing the browser says about the file's content is trusted.
 */
import type { Request, Response } from 'express'
import { candidateQueryOf, type CandidateSourcesInputs, type CandidateSourcesOutput } from '../../../shared/calculations/kinds'
import type { CsvDelimiter } from '../../../shared/domain/station-register'
import { detectDelimiter, suggestMapping } from '../../../shared/stations/csv-columns'
import { rankCandidateStations } from '../../../shared/stations/candidate-ranking'
import { createStationRowReader, type StationDraft } from '../../../shared/stations/register-rows'
import {
  MAX_REPORTED_ROWS,
  registerUploadFieldsSchema,
  STATION_PAGE_SIZE,
  type ColumnMapping,
  type CsvInspectionView,
  type ImportReportView,
  type RegisterImport,
  type RegisterVersionView,
  type RowProblems,
  type StationSearch,
  type StationsPage,
  type StationView,
} from '../../../shared/schemas/stations'
import type { ServiceContext } from '../../context'
import { withTransaction, type Db } from '../../db/client'
import type { NewAuthorisedStation } from '../../db/schema'
import { badRequest, forbidden, notFound } from '../../http/errors'
import { parseWith } from '../../http/validate'
import { can, type Actor } from '../../policy/policy'
import { findStoredFile, type StoredFileWithUploader } from '../../storage/stored-files.repo'
import { readStoredObject, storeStream, storeUpload } from '../../storage/stored-files'
import { firstLine, readCsv, type CsvRow } from './register-csv'
import { presentDraft, presentRegisterVersion, presentStation, presentStoredFile } from './stations.present'
import {
  currentRegisterVersion,
  findRegisterVersion,
  findStationRow,
  insertRegisterVersion,
  insertStations,
  listRegisterVersions,
  lockNextRegisterVersion,
  overlappingRankableRows,
  searchStationRows,
} from './stations.repo'
import { recordAudit } from '../audit/audit.repo'

const SAMPLE_ROWS = 10

const uploadNotFound = () => notFound('upload_not_found', 'No such register upload.')
const stationNotFound = () => notFound('station_not_found', 'No such station in the licence register.')
const versionNotFound = () => notFound('register_version_not_found', 'No such version of the licence register.')

function mayRead(actor: Actor) {
  if (!can(actor, 'stationRegister.read')) throw forbidden('Only staff can read the licence register.')
}
function mayImport(actor: Actor) {
  if (!can(actor, 'stationRegister.import')) throw forbidden('Only an administrator can import the licence register.')
}

type StoreDeps = Pick<ServiceContext, 'db' | 'objectStore'>
const storeDeps = (ctx: StoreDeps) => ({ db: ctx.db, store: ctx.objectStore })

async function registerUpload(db: Db, fileId: string): Promise<StoredFileWithUploader> {
  const f = await findStoredFile(db, fileId)
  if (!f || f.purpose !== 'station_register_import') throw uploadNotFound()
  return f
}

/** The top of a stored CSV: delimiter (chosen or detected), headers, first rows, a suggested mapping. */
async function inspectFile(ctx: StoreDeps, file: StoredFileWithUploader, chosen?: CsvDelimiter): Promise<CsvInspectionView> {
  const delimiter = chosen ?? detectDelimiter(await firstLine(await readStoredObject(ctx.objectStore, file.objectKey)))
  const rows: CsvRow[] = []
  const { headers } = await readCsv(await readStoredObject(ctx.objectStore, file.objectKey), delimiter, (r) => rows.push(r), { maxRows: SAMPLE_ROWS })
  const suggested = suggestMapping(
    headers,
    rows.map((r) => r.cells),
  )
  return {
    file: presentStoredFile(file),
    delimiter,
    delimiterDetected: chosen === undefined,
    headers,
    sampleRows: rows,
    suggestedMapping: { fields: suggested.fields },
    notes: suggested.notes,
  }
}

/** POST /uploads: stores the CSV (multipart field `file`, optional field `delimiter`) and inspects it. */
export async function uploadRegisterFile(ctx: ServiceContext, actor: Actor, req: Request, res: Response): Promise<CsvInspectionView> {
  mayImport(actor)
  const { file, fields } = await storeUpload(storeDeps(ctx), req, res, { purpose: 'station_register_import', uploadedBy: actor.id })
  const { delimiter } = parseWith(registerUploadFieldsSchema, fields)
  return inspectFile(ctx, await registerUpload(ctx.db, file.id), delimiter)
}

export async function inspectRegisterFile(ctx: ServiceContext, actor: Actor, fileId: string, delimiter?: CsvDelimiter): Promise<CsvInspectionView> {
  mayImport(actor)
  return inspectFile(ctx, await registerUpload(ctx.db, fileId), delimiter)
}

/** Columns the mapping names that the file's header does not have. */
function checkColumns(headers: string[], mapping: ColumnMapping) {
  const details = Object.entries(mapping.fields)
    .filter(([, m]) => m && !headers.includes(m.column))
    .map(([field, m]) => ({ path: `mapping.fields.${field}.column`, message: `The file has no column "${m!.column}".` }))
  if (details.length > 0) throw badRequest('mapping_mismatch', `The mapping names columns the file does not have: ${details.map((d) => d.message).join(' ')}`, details)
}

interface CheckedFile {
  file: StoredFileWithUploader
  report: ImportReportView
  accepted: StationDraft[]
}

export async function previewRegisterImport(ctx: ServiceContext, actor: Actor, fileId: string, imp: RegisterImport): Promise<ImportReportView> {
  mayImport(actor)
  return (await checkFileWithHeader(ctx, fileId, imp)).report
}

/** Reads every row of the stored file with the mapping (checked against the header first). */
async function checkFileWithHeader(ctx: StoreDeps, fileId: string, imp: RegisterImport): Promise<CheckedFile> {
  const file = await registerUpload(ctx.db, fileId)
  const accepted: StationDraft[] = []
  const rejected: RowProblems[] = []
  let rejectedCount = 0
  let read: ReturnType<typeof createStationRowReader> | undefined
  const { rowCount } = await readCsv(
    await readStoredObject(ctx.objectStore, file.objectKey),
    imp.delimiter,
    (row) => {
      const r = read!(row.cells, row.line)
      if (r.ok) accepted.push(r.station)
      else {
        rejectedCount++
        if (rejected.length < MAX_REPORTED_ROWS) rejected.push({ line: row.line, problems: r.problems })
      }
    },
    {
      onHeader: (headers) => {
        checkColumns(headers, imp.mapping)
        read = createStationRowReader(headers, imp.mapping.fields)
      },
    },
  )
  return {
    file,
    accepted,
    report: { fileId: file.id, delimiter: imp.delimiter, rowCount, acceptedCount: accepted.length, rejectedCount, rejected, sample: accepted.slice(0, SAMPLE_ROWS).map(presentDraft) },
  }
}

const stationRowOf = (version: number, d: StationDraft): NewAuthorisedStation => ({
  registerVersion: version,
  line: d.line,
  stationCode: d.stationCode,
  licensee: d.licensee,
  service: d.service,
  latitudeDeg: d.latitudeDeg,
  longitudeDeg: d.longitudeDeg,
  antennaHeightM: d.antennaHeightM,
  lowFreqHz: d.lowFreqHz,
  highFreqHz: d.highFreqHz,
  limit: d.limit,
  antennaGainDbi: d.antennaGainDbi,
  feederLossDb: d.feederLossDb,
  authorisedEirpDbm: d.authorisedEirpDbm,
  validFrom: d.validFrom,
  validUntil: d.validUntil,
})

/** Makes the new register version from the stored file's accepted rows (importer from the session). */
async function importChecked(ctx: StoreDeps & Pick<ServiceContext, 'pool'>, importedBy: string, checked: CheckedFile, imp: RegisterImport): Promise<RegisterVersionView> {
  const { file, report, accepted } = checked
  if (accepted.length === 0) {
    const details = report.rejected.slice(0, 100).map((r) => ({ path: `line ${r.line}`, message: r.problems.join('; ') }))
    throw badRequest('no_rows_accepted', `No row of the file can be imported (${report.rejectedCount} rejected): the register is unchanged.`, details)
  }
  const version = await withTransaction(ctx.pool, async ({ db }) => {
    const next = await lockNextRegisterVersion(db)
    await insertRegisterVersion(db, {
      version: next,
      importedBy,
      storedFileId: file.id,
      fileName: file.originalName,
      sha256: file.sha256,
      delimiter: imp.delimiter,
      acceptedCount: report.acceptedCount,
      rejectedCount: report.rejectedCount,
      columnMapping: { fields: imp.mapping.fields },
      rejectedRows: report.rejected,
    })
    await insertStations(
      db,
      accepted.map((d) => stationRowOf(next, d)),
    )
    await recordAudit(db, {
      actorUserId: importedBy,
      action: 'station_register.imported',
      targetType: 'station_register',
      targetId: String(next),
      officeId: null,
      details: { version: next, fileName: file.originalName, sha256: file.sha256, acceptedCount: report.acceptedCount, rejectedCount: report.rejectedCount },
    })
    return next
  })
  return presentRegisterVersion((await findRegisterVersion(ctx.db, version))!, await currentRegisterVersion(ctx.db))
}

export async function confirmRegisterImport(ctx: ServiceContext, actor: Actor, fileId: string, imp: RegisterImport): Promise<{ version: RegisterVersionView; report: ImportReportView }> {
  mayImport(actor)
  const checked = await checkFileWithHeader(ctx, fileId, imp)
  return { version: await importChecked(ctx, actor.id, checked, imp), report: checked.report }
}

/**
 * Imports a register file from a stream through the same steps as an administrator's upload
 * (the demo seeder): stored in the object store, read with the mapping, a new version made.
 */
export async function importRegisterStream(
  ctx: StoreDeps & Pick<ServiceContext, 'pool'>,
  importedBy: string,
  body: import('node:stream').Readable,
  meta: { fileName: string; delimiter: CsvDelimiter; mapping: ColumnMapping },
): Promise<{ version: RegisterVersionView; report: ImportReportView }> {
  const file = await storeStream(storeDeps(ctx), body, { originalName: meta.fileName, contentType: 'text/csv', purpose: 'station_register_import', uploadedBy: importedBy })
  const imp = { delimiter: meta.delimiter, mapping: meta.mapping }
  const checked = await checkFileWithHeader(ctx, file.id, imp)
  return { version: await importChecked(ctx, importedBy, checked, imp), report: checked.report }
}

// ── reading ──────────────────────────────────────────────────────────────────

export async function searchStations(ctx: ServiceContext, actor: Actor, s: StationSearch): Promise<StationsPage> {
  mayRead(actor)
  const current = await currentRegisterVersion(ctx.db)
  const version = s.version ?? current
  const page = s.page ?? 1
  if (version === null) return { registerVersion: null, total: 0, page, pageSize: STATION_PAGE_SIZE, stations: [] }
  if (s.version !== undefined && !(await findRegisterVersion(ctx.db, s.version))) throw versionNotFound()
  const { total, rows } = await searchStationRows(ctx.db, { version, text: s.q || undefined, freqHz: s.freq, limit: STATION_PAGE_SIZE, offset: (page - 1) * STATION_PAGE_SIZE })
  return { registerVersion: version, total, page, pageSize: STATION_PAGE_SIZE, stations: rows.map(presentStation) }
}

export async function getStation(ctx: ServiceContext, actor: Actor, id: string): Promise<StationView> {
  mayRead(actor)
  const r = await findStationRow(ctx.db, id)
  if (!r) throw stationNotFound()
  return presentStation(r)
}

export async function listVersions(ctx: ServiceContext, actor: Actor): Promise<RegisterVersionView[]> {
  mayRead(actor)
  const current = await currentRegisterVersion(ctx.db)
  return (await listRegisterVersions(ctx.db)).map((v) => presentRegisterVersion(v, current))
}

export async function getVersion(ctx: ServiceContext, actor: Actor, version: number): Promise<{ version: RegisterVersionView; rejected: RowProblems[] }> {
  mayRead(actor)
  const v = await findRegisterVersion(ctx.db, version)
  if (!v) throw versionNotFound()
  return { version: presentRegisterVersion(v, await currentRegisterVersion(ctx.db)), rejected: v.rejectedRows }
}

/** Ranks the register in force for an interference without storing anything (the workbench's look before it stores). */
export async function rankCandidatesNow(ctx: ServiceContext, actor: Actor, inputs: CandidateSourcesInputs): Promise<CandidateSourcesOutput & { warnings: string[] }> {
  mayRead(actor)
  const q = candidateQueryOf(inputs)
  // the columns the ranking reads only (a stored record reads the whole rows, for its copies)
  const [stations, version] = await Promise.all([overlappingRankableRows(ctx.db, { lowFreqHz: q.lowFreqHz, highFreqHz: q.highFreqHz }), currentRegisterVersion(ctx.db)])
  let r
  try {
    r = rankCandidateStations(stations, q)
  } catch (e) {
    if (e instanceof RangeError) throw badRequest('calculation_refused', e.message)
    throw e
  }
  return {
    registerVersion: stations[0]?.registerVersion ?? version,
    overlappingCount: r.overlappingCount,
    candidates: r.candidates,
    order: q.order!,
    victimAntennaGainDbi: q.victimAntennaGainDbi!,
    modelKind: r.model.kind,
    warnings: r.warnings,
  }
}
