/** The licence register's rows as the API answers them (shared/schemas/stations.ts). */
import type { RegisterVersionView, StationDraftView, StationView, StoredFileView } from '../../../shared/schemas/stations'
import type { StationDraft } from '../../../shared/stations/register-rows'
import type { AuthorisedStationRow } from '../../db/schema'
import type { StoredFileWithUploader } from '../../storage/stored-files.repo'
import type { RegisterVersionWithImporter } from './stations.repo'

export function presentStoredFile(f: StoredFileWithUploader): StoredFileView {
  return {
    id: f.id,
    originalName: f.originalName,
    sizeBytes: f.sizeBytes,
    sha256: f.sha256,
    contentType: f.contentType,
    contentTypeSource: f.contentTypeSource,
    purpose: f.purpose,
    uploadedAt: f.uploadedAt.toISOString(),
    uploadedBy: f.uploadedByName,
  }
}

export function presentStation(r: AuthorisedStationRow): StationView {
  return {
    id: r.id,
    registerVersion: r.registerVersion,
    line: r.line,
    stationCode: r.stationCode,
    licensee: r.licensee,
    service: r.service,
    latitudeDeg: r.latitudeDeg,
    longitudeDeg: r.longitudeDeg,
    antennaHeightM: r.antennaHeightM,
    lowFreqHz: r.lowFreqHz,
    highFreqHz: r.highFreqHz,
    limit: r.limit,
    antennaGainDbi: r.antennaGainDbi,
    feederLossDb: r.feederLossDb,
    authorisedEirpDbm: r.authorisedEirpDbm,
    validFrom: r.validFrom,
    validUntil: r.validUntil,
  }
}

export function presentDraft(d: StationDraft): StationDraftView {
  return { ...d }
}

export function presentRegisterVersion(v: RegisterVersionWithImporter, current: number | null): RegisterVersionView {
  return {
    version: v.version,
    importedAt: v.importedAt.toISOString(),
    importedBy: v.importedByName,
    fileId: v.storedFileId,
    fileName: v.fileName,
    sha256: v.sha256,
    acceptedCount: v.acceptedCount,
    rejectedCount: v.rejectedCount,
    delimiter: v.delimiter,
    mapping: v.columnMapping,
    current: v.version === current,
  }
}
