/** A stored measurement as the API shows it (shared/schemas/measurements.ts). */
import type { MeasurementView } from '../../../shared/schemas/measurements'
import type { MeasurementWithAuthor } from './measurements.repo'

export function antennaOf(m: Pick<MeasurementWithAuthor, 'antennaId' | 'antennaGainDbi' | 'antennaFactorDbPerM'>): MeasurementView['antenna'] {
  if (m.antennaId) return { source: 'register', equipmentId: m.antennaId }
  if (m.antennaGainDbi !== null) return { source: 'gain', antennaGainDbi: m.antennaGainDbi }
  if (m.antennaFactorDbPerM !== null) return { source: 'factor', antennaFactorDbPerM: m.antennaFactorDbPerM }
  return { source: 'none' }
}

export function presentMeasurement(m: MeasurementWithAuthor, abilities: MeasurementView['abilities']): MeasurementView {
  return {
    id: m.id,
    caseId: m.caseId,
    officeId: m.officeId,
    author: m.authorName,
    createdAt: m.createdAt.toISOString(),
    updatedAt: m.updatedAt.toISOString(),
    takenAt: m.takenAt.toISOString(),
    latDeg: m.latDeg,
    lonDeg: m.lonDeg,
    heightM: m.heightM,
    freqHz: m.freqHz,
    measurementBandwidthHz: m.measurementBandwidthHz,
    rbwHz: m.rbwHz,
    detector: m.detector,
    reading: { value: m.readingValue, unit: m.readingUnit },
    antenna: antennaOf(m),
    instrumentId: m.instrumentId,
    cableLossDb: m.cableLossDb,
    preampGainDb: m.preampGainDb,
    polarisation: m.polarisation,
    bearingDeg: m.bearingDeg,
    bearingSigmaDeg: m.bearingSigmaDeg,
    notes: m.notes,
    evidenceFileId: m.evidenceFileId,
    derived: m.derived,
    methods: m.methods as MeasurementView['methods'],
    warnings: m.warnings,
    equipment: m.equipmentCopies,
    libraryVersion: m.libraryVersion,
    version: m.version,
    supersedesId: m.supersedesId,
    supersededById: m.supersededById,
    usedByCalculations: m.usedByCalculations,
    abilities,
  }
}
