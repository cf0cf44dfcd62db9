/**
 * Measurements as a calculation names them: the rows of one case, copied into the shape a
 * calculation record keeps (shared/calculations/references.ts). A calculation's lookup is
 * filled from this before it runs; ids of other cases (or unknown ids) are simply not returned.
 */
import type { MeasurementReference } from '../../../shared/calculations/references'
import type { Db } from '../../db/client'
import type { MeasurementRow } from '../../db/schema'
import { measurementRowsOfCase } from './measurements.repo'

/** A stored measurement as a calculation's reference copy. */
export function toMeasurementReference(m: MeasurementRow): MeasurementReference {
  const derived: MeasurementReference['derived'] = {}
  if (m.derived.fieldStrengthDbuvPerM !== undefined) derived.fieldStrengthDbuvPerM = m.derived.fieldStrengthDbuvPerM
  if (m.derived.pfdDbwPerM2 !== undefined) derived.pfdDbwPerM2 = m.derived.pfdDbwPerM2
  if (m.derived.isotropicReceivedPowerDbm !== undefined) derived.isotropicReceivedPowerDbm = m.derived.isotropicReceivedPowerDbm
  const ref: MeasurementReference = {
    id: m.id,
    takenAt: m.takenAt.toISOString(),
    latitudeDeg: m.latDeg,
    longitudeDeg: m.lonDeg,
    freqHz: m.freqHz,
    derived,
    equipment: m.equipmentCopies,
    warnings: m.warnings,
    version: m.version,
  }
  if (m.heightM !== null) ref.heightM = m.heightM
  if (m.measurementBandwidthHz !== null) ref.measurementBandwidthHz = m.measurementBandwidthHz
  if (m.rbwHz !== null) ref.resolutionBandwidthHz = m.rbwHz
  if (m.detector !== null) ref.detector = m.detector
  if (m.bearingDeg !== null) ref.bearingDeg = m.bearingDeg
  if (m.bearingSigmaDeg !== null) ref.bearingSigmaDeg = m.bearingSigmaDeg
  return ref
}

/**
 * The named measurements of the case, as reference copies, in the order of `ids` (ids that are
 * not measurements of this case are left out: the caller reports them as unknown).
 */
export async function measurementReferencesForCase(db: Db, caseId: string, ids: readonly string[]): Promise<MeasurementReference[]> {
  return (await measurementReferencesWithEvidence(db, caseId, ids)).references
}

/** The same reference copies, and the evidence files those measurements were taken from (each once, in the same order). */
export async function measurementReferencesWithEvidence(db: Db, caseId: string, ids: readonly string[]): Promise<{ references: MeasurementReference[]; evidenceIds: string[] }> {
  const rows = await measurementRowsOfCase(db, caseId, ids)
  const byId = new Map(rows.map((r) => [r.id, r]))
  const found = ids.flatMap((id) => byId.get(id) ?? [])
  return {
    references: found.map(toMeasurementReference),
    evidenceIds: [...new Set(found.flatMap((r) => (r.evidenceFileId ? [r.evidenceFileId] : [])))],
  }
}
