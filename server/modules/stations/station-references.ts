/**
 * Licence-register rows as the copies calculations keep (shared/calculations/references.ts).
 * A copy names its register version, so a record says which register it was judged against,
 * and a later re-import (a new version with new rows) never changes it.
 */
import type { ReferenceLookup, StationReference } from '../../../shared/calculations/references'
import { idSchema } from '../../../shared/schemas/ids'
import type { Db } from '../../db/client'
import type { AuthorisedStationRow } from '../../db/schema'
import { currentRegisterVersion, overlappingStationRows, stationRowsByIds } from './stations.repo'

export function stationReferenceOf(r: AuthorisedStationRow): StationReference {
  return {
    id: r.id,
    registerVersion: r.registerVersion,
    stationCode: r.stationCode,
    licensee: r.licensee,
    service: r.service,
    latitudeDeg: r.latitudeDeg,
    longitudeDeg: r.longitudeDeg,
    ...(r.antennaHeightM !== null ? { antennaHeightM: r.antennaHeightM } : {}),
    lowFreqHz: r.lowFreqHz,
    highFreqHz: r.highFreqHz,
    limit: r.limit,
    ...(r.antennaGainDbi !== null ? { antennaGainDbi: r.antennaGainDbi } : {}),
    ...(r.feederLossDb !== null ? { feederLossDb: r.feederLossDb } : {}),
    authorisedEirpDbm: r.authorisedEirpDbm,
    validFrom: r.validFrom,
    validUntil: r.validUntil,
  }
}

/**
 * The stations with these ids, of whatever register version they belong to (an id names one
 * row of one version), in the order of `ids`; unknown ids are left out.
 */
export async function stationReferences(db: Db, ids: readonly string[]): Promise<StationReference[]> {
  // a string that is not a uuid names no row (and must not reach the query as one)
  const wellFormed = [...new Set(ids)].filter((id) => idSchema.safeParse(id).success)
  const byId = new Map((await stationRowsByIds(db, wellFormed)).map((r) => [r.id, stationReferenceOf(r)]))
  return ids.flatMap((id) => byId.get(id) ?? [])
}

/**
 * The stations of the register in force whose authorised range meets the interference's
 * [lowFreqHz, highFreqHz], edges included (the candidate ranking weighs the overlap).
 */
export async function candidateStationReferences(db: Db, q: { lowFreqHz: number; highFreqHz: number }): Promise<StationReference[]> {
  return (await overlappingStationRows(db, q)).map(stationReferenceOf)
}

/** The register version in force, or null before the first import. */
export function currentStationRegisterVersion(db: Db): Promise<number | null> {
  return currentRegisterVersion(db)
}

/**
 * What a `candidate_sources` calculation needs from the register, read before it runs (the
 * kind's `references` is synchronous): the overlapping stations of the version in force and
 * that version.
 */
export async function candidateSourcesLookup(db: Db, q: { lowFreqHz: number; highFreqHz: number }): Promise<Required<Pick<ReferenceLookup, 'candidateStations' | 'stationRegisterVersion'>>> {
  const [stations, current] = await Promise.all([candidateStationReferences(db, q), currentRegisterVersion(db)])
  // the stations carry the version they were read from (a re-import between the two reads changes nothing)
  const version = stations[0]?.registerVersion ?? current
  return {
    candidateStations: (asked) => stations.filter((s) => s.highFreqHz >= asked.lowFreqHz && s.lowFreqHz <= asked.highFreqHz),
    stationRegisterVersion: () => version,
  }
}
