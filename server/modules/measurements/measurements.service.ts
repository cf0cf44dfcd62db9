/**
 * A case's measurements: recorded, listed, edited and corrected. The server derives the levels
 * itself from what was typed (shared/measurements/derive.ts, the same code the form runs live)
 * and stores them with the method of each step, the warnings and copies of the register entries
 * used. A measurement is edited in place (with its version) only until a calculation names it;
 * afterwards a correction is a new measurement that supersedes it, and the old one stays.
 */
import { deriveMeasurement, type DeriveAntenna, type DeriveEquipment } from '../../../shared/measurements/derive'
import { RADIO_LIBRARY_VERSION, type MethodRef } from '../../../shared/radio'
import type { MeasurementContent, MeasurementView } from '../../../shared/schemas/measurements'
import type { ServiceContext } from '../../context'
import { isUniqueViolation, withTransaction, type Db } from '../../db/client'
import type { CaseRow } from '../../db/schema'
import { badRequest, conflict, forbidden, HttpError, notFound } from '../../http/errors'
import { mayReadMeasurements, mayWriteMeasurements, measurementsAllowedIn } from '../../policy/equipment-policy'
import type { Actor } from '../../policy/policy'
import { loadVisibleCase } from '../cases/case-access'
import { appendEvent } from '../cases/cases.repo'
import { equipmentOfOfficeByIds } from '../equipment/equipment.repo'
import { findEvidence } from '../evidence/evidence.repo'
import { findUserById } from '../users/users.repo'
import {
  calculationsUsingMeasurement,
  findMeasurement,
  insertMeasurement,
  measurementsOfCase,
  updateMeasurementIfVersion,
  type MeasurementWithAuthor,
  type NewMeasurementRow,
} from './measurements.repo'
import { presentMeasurement } from './measurements.present'

export const measurementNotFound = () => notFound('measurement_not_found', 'No such measurement in your office.')
const staleMeasurement = () => conflict('stale_version', 'Someone else changed this measurement a moment ago. Reload it to see their change, then edit again.')
const inUse = () =>
  conflict(
    'measurement_in_use',
    'A calculation already uses this measurement, so it can no longer be edited. Record a correction instead: the original stays on the case, marked as superseded.',
  )
const superseded = () => conflict('measurement_superseded', 'This measurement has already been corrected. Edit or correct the newest version instead.')
const mayNotWrite = () => forbidden('Only the assigned investigator or the office supervisor can record measurements on this case.')
const wrongState = () => conflict('invalid_state', 'Measurements are recorded while the case is being worked (assigned, in field work or sent back).')

type Abilities = MeasurementView['abilities']

function abilitiesFor(actor: Actor, c: CaseRow, m: Pick<MeasurementWithAuthor, 'supersededById' | 'usedByCalculations'>): Abilities {
  const writable = mayWriteMeasurements(actor, c) && measurementsAllowedIn(c.status) && m.supersededById === null
  return { edit: writable && m.usedByCalculations === 0, correct: writable }
}

/**
 * How the server itself obtained the reading (a band's channel power computed from an evidence
 * file's trace): the method is kept beside the derived levels' methods, under `reading`, and
 * the warnings of that computation go first in the measurement's warnings.
 */
export interface ComputedReading {
  method: MethodRef
  warnings: string[]
}

/**
 * Whether the named evidence file may be linked: a file of the same case that was not removed.
 * A link the measurement already had stays allowed on an edit or a correction, even when the
 * file has since been removed (the record keeps what it was made from).
 */
async function evidenceProblem(db: Db, c: CaseRow, evidenceFileId: string | undefined, alreadyLinked: string | null): Promise<string | null> {
  if (evidenceFileId === undefined || evidenceFileId === alreadyLinked) return null
  const e = await findEvidence(db, evidenceFileId)
  if (!e || e.caseId !== c.id) return `There is no evidence file ${evidenceFileId} on this case.`
  if (e.removedAt) return `The evidence file ${e.displayName} was removed from the case and cannot be linked.`
  return null
}

/** The register items the measurement names, and the derived levels; a 400 lists every problem. */
async function derivedRow(
  db: Db,
  c: CaseRow,
  m: MeasurementContent,
  opts: { linkedEvidenceId?: string | null; computed?: ComputedReading } = {},
): Promise<Omit<NewMeasurementRow, 'caseId' | 'officeId' | 'authorUserId' | 'supersedesId'>> {
  const antennaId = m.antenna.source === 'register' ? m.antenna.equipmentId : undefined
  const wanted = [antennaId, m.instrumentId].filter((x): x is string => x !== undefined)
  const items = new Map((await equipmentOfOfficeByIds(db, c.officeId, wanted)).map((e) => [e.id, e as DeriveEquipment]))
  const problems: { path: string; message: string }[] = []
  if (antennaId && !items.has(antennaId)) problems.push({ path: 'measurement.antenna.equipmentId', message: 'No such antenna in the office’s register.' })
  if (m.instrumentId && !items.has(m.instrumentId)) problems.push({ path: 'measurement.instrumentId', message: 'No such instrument in the office’s register.' })
  const evidence = await evidenceProblem(db, c, m.evidenceFileId, opts.linkedEvidenceId ?? null)
  if (evidence) problems.push({ path: 'measurement.evidenceFileId', message: evidence })
  if (problems.length > 0) throw badRequest('validation_failed', 'Some fields need attention.', problems)

  const antenna: DeriveAntenna = m.antenna.source === 'register' ? { source: 'register', item: items.get(m.antenna.equipmentId)! } : m.antenna
  const d = deriveMeasurement({
    takenAt: m.takenAt,
    freqHz: m.freqHz,
    reading: m.reading,
    antenna,
    instrument: m.instrumentId ? items.get(m.instrumentId) : undefined,
    cableLossDb: m.cableLossDb,
    preampGainDb: m.preampGainDb,
  })
  if (d.problems.length > 0) {
    throw badRequest('validation_failed', 'Some fields need attention.', d.problems.map((p) => ({ path: `measurement.${p.path}`, message: p.message })))
  }
  return {
    takenAt: new Date(m.takenAt),
    latDeg: m.latDeg,
    lonDeg: m.lonDeg,
    heightM: m.heightM ?? null,
    freqHz: m.freqHz,
    measurementBandwidthHz: m.measurementBandwidthHz ?? null,
    rbwHz: m.rbwHz ?? null,
    detector: m.detector ?? null,
    readingValue: m.reading.value,
    readingUnit: m.reading.unit,
    antennaId: antennaId ?? null,
    antennaGainDbi: m.antenna.source === 'gain' ? m.antenna.antennaGainDbi : null,
    antennaFactorDbPerM: m.antenna.source === 'factor' ? m.antenna.antennaFactorDbPerM : null,
    instrumentId: m.instrumentId ?? null,
    cableLossDb: m.cableLossDb ?? null,
    preampGainDb: m.preampGainDb ?? null,
    polarisation: m.polarisation ?? null,
    bearingDeg: m.bearingDeg ?? null,
    bearingSigmaDeg: m.bearingSigmaDeg ?? null,
    notes: m.notes,
    evidenceFileId: m.evidenceFileId ?? null,
    derived: d.derived,
    methods: opts.computed ? { reading: opts.computed.method, ...d.methods } : d.methods,
    warnings: opts.computed ? [...opts.computed.warnings, ...d.warnings] : d.warnings,
    equipmentCopies: d.equipmentCopies,
    libraryVersion: RADIO_LIBRARY_VERSION,
  }
}

async function authorName(db: Db, actor: Actor): Promise<string> {
  return (await findUserById(db, actor.id))?.name ?? 'Unknown user'
}

/** A case the actor may write measurements on now (403 wrong role, 409 wrong state). */
async function writableCase(db: Db, actor: Actor, caseId: string): Promise<CaseRow> {
  const c = await loadVisibleCase(db, actor, caseId)
  if (!mayWriteMeasurements(actor, c)) throw mayNotWrite()
  if (!measurementsAllowedIn(c.status)) throw wrongState()
  return c
}

/** A measurement and its case, if the actor may see them (another office's is 404). */
async function visibleMeasurement(db: Db, actor: Actor, measurementId: string): Promise<{ m: MeasurementWithAuthor; c: CaseRow }> {
  const m = await findMeasurement(db, measurementId)
  if (!m) throw measurementNotFound()
  const c = await loadVisibleCase(db, actor, m.caseId).catch((e: unknown) => {
    throw e instanceof HttpError && e.status === 404 ? measurementNotFound() : e
  })
  return { m, c }
}

async function presentOne(db: Db, actor: Actor, c: CaseRow, id: string): Promise<MeasurementView> {
  const m = (await findMeasurement(db, id))!
  return presentMeasurement(m, abilitiesFor(actor, c, m))
}

export async function listMeasurements(ctx: ServiceContext, actor: Actor, caseId: string): Promise<{ measurements: MeasurementView[]; abilities: { record: boolean } }> {
  const c = await loadVisibleCase(ctx.db, actor, caseId)
  if (!mayReadMeasurements(actor, c)) throw forbidden('Only staff of the case’s office can read its measurements.')
  const rows = await measurementsOfCase(ctx.db, c.id)
  return {
    measurements: rows.map((m) => presentMeasurement(m, abilitiesFor(actor, c, m))),
    abilities: { record: mayWriteMeasurements(actor, c) && measurementsAllowedIn(c.status) },
  }
}

/**
 * Records a measurement on the case; the author is the session's user, the times the database's.
 * `computed` is given when the server computed the reading itself (see ComputedReading).
 */
export async function recordMeasurement(ctx: ServiceContext, actor: Actor, caseId: string, content: MeasurementContent, computed?: ComputedReading): Promise<MeasurementView> {
  return withTransaction(ctx.pool, async ({ db }) => {
    const c = await writableCase(db, actor, caseId)
    const values = await derivedRow(db, c, content, computed ? { computed } : {})
    const row = await insertMeasurement(db, { ...values, caseId: c.id, officeId: c.officeId, authorUserId: actor.id, supersedesId: null })
    await appendEvent(db, {
      caseId: c.id,
      actorUserId: actor.id,
      actorLabel: await authorName(db, actor),
      kind: 'measurement_recorded',
      body: computed ? 'Recorded a measurement computed from an evidence file.' : 'Recorded a measurement.',
      visibility: 'internal',
      data: { measurementId: row.id },
    })
    return presentOne(db, actor, c, row.id)
  })
}

/** Edits a measurement no calculation uses yet, on the version the editor saw. */
export async function editMeasurement(ctx: ServiceContext, actor: Actor, measurementId: string, patch: { measurement: MeasurementContent; version: number }): Promise<MeasurementView> {
  return withTransaction(ctx.pool, async ({ db }) => {
    const { m } = await visibleMeasurement(db, actor, measurementId)
    const c = await writableCase(db, actor, m.caseId)
    if (m.supersededById) throw superseded()
    if (m.usedByCalculations > 0) throw inUse()
    if (m.version !== patch.version) throw staleMeasurement()
    const values = await derivedRow(db, c, patch.measurement, { linkedEvidenceId: m.evidenceFileId })
    const row = await updateMeasurementIfVersion(db, m.id, patch.version, values)
    if (!row) throw (await calculationsUsingMeasurement(db, m.id)) > 0 ? inUse() : staleMeasurement()
    return presentOne(db, actor, c, row.id)
  })
}

/** Records a correction: a new measurement that supersedes the given one, which stays as it was. */
export async function correctMeasurement(ctx: ServiceContext, actor: Actor, measurementId: string, content: MeasurementContent): Promise<MeasurementView> {
  return withTransaction(ctx.pool, async ({ db }) => {
    const { m } = await visibleMeasurement(db, actor, measurementId)
    const c = await writableCase(db, actor, m.caseId)
    if (m.supersededById) throw superseded()
    const values = await derivedRow(db, c, content, { linkedEvidenceId: m.evidenceFileId })
    let row
    try {
      row = await insertMeasurement(db, { ...values, caseId: c.id, officeId: c.officeId, authorUserId: actor.id, supersedesId: m.id })
    } catch (e) {
      // a correction recorded a moment ago by someone else (one successor per measurement)
      if (isUniqueViolation(e, 'measurements_supersedes_once')) throw superseded()
      throw e
    }
    await appendEvent(db, {
      caseId: c.id,
      actorUserId: actor.id,
      actorLabel: await authorName(db, actor),
      kind: 'measurement_corrected',
      body: 'Recorded a correction of a measurement; the original stays on the case, marked as superseded.',
      visibility: 'internal',
      data: { measurementId: row.id, supersedesId: m.id },
    })
    return presentOne(db, actor, c, row.id)
  })
}
