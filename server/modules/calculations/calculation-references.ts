/**
 * Everything a calculation's inputs name, read before it runs into one ReferenceLookup: band-limit
 * entries, the case's measurements, authorised stations, and stored calculations of the same case
 * that give an EIRP. The kind's `references` then copies what it uses into the record, so a later
 * edit of a register never changes the record. A name that is not found (or is another case's)
 * is a 400 naming each.
 */
import { EIRP_ESTIMATE_KINDS, namedReferences, type BandLimitReference, type NewCalculation, type ReferenceLookup } from '../../../shared/calculations/kinds'
import type { CalculationReference } from '../../../shared/calculations/references'
import type { Json } from '../../../shared/calculations/kinds'
import type { Db } from '../../db/client'
import type { CalculationRow } from '../../db/schema'
import { badRequest } from '../../http/errors'
import { findBandLimitByKey } from '../band-limits/band-limits.repo'
import { measurementReferencesWithEvidence } from '../measurements/measurement-references'
import { stationReferences } from '../stations/station-references'
import { calculationsOfCaseByIds } from './calculations.repo'

const num = (x: Json | undefined): number | undefined => (typeof x === 'number' && Number.isFinite(x) ? x : undefined)

/** A stored record as another calculation's EIRP: its central value and its EIRP interval, when it gives them. */
export function calculationReferenceOf(r: Pick<CalculationRow, 'id' | 'kind' | 'outputs' | 'libraryVersion' | 'at'>): CalculationReference | undefined {
  if (!EIRP_ESTIMATE_KINDS.includes(r.kind)) return undefined
  const value = r.outputs.value
  if (value === null || typeof value !== 'object' || Array.isArray(value)) return undefined
  const eirpDbm = num(value.eirpDbm)
  if (eirpDbm === undefined) return undefined
  const i = r.outputs.interval
  const interval = i && i.quantity === 'eirpDbm' ? { lowDbm: i.low, highDbm: i.high } : undefined
  return { id: r.id, kind: r.kind, eirpDbm, ...(interval ? { eirpIntervalDbm: interval } : {}), libraryVersion: r.libraryVersion, at: r.at.toISOString() }
}

const unique = (xs: readonly string[] | undefined) => [...new Set(xs ?? [])]

/**
 * Reads every reference the request names; refuses (400 `calculation_refused`, as a kind refuses)
 * naming each one missing. `evidenceIds` are the evidence files the named measurements were taken from.
 */
export async function prefetchReferences(db: Db, caseId: string, input: NewCalculation): Promise<{ lookup: ReferenceLookup; measurementIds: string[]; evidenceIds: string[] }> {
  const named = namedReferences(input)
  const bandKeys = unique(named.bandLimitKeys)
  const measurementIds = unique(named.measurementIds)
  const stationIds = unique(named.stationIds)
  const calculationIds = unique(named.calculationIds)

  const [bandRows, measured, stations, calcRows] = await Promise.all([
    Promise.all(bandKeys.map((k) => findBandLimitByKey(db, k))),
    measurementIds.length ? measurementReferencesWithEvidence(db, caseId, measurementIds) : Promise.resolve({ references: [], evidenceIds: [] }),
    stationIds.length ? stationReferences(db, stationIds) : Promise.resolve([]),
    calculationsOfCaseByIds(db, caseId, calculationIds),
  ])
  const bandLimits = new Map<string, BandLimitReference>()
  for (const row of bandRows) {
    if (row) bandLimits.set(row.key, { key: row.key, title: row.title, spec: row.spec, citation: row.citation, verified: row.verified, statusNote: row.statusNote, version: row.version })
  }
  const measurementById = new Map(measured.references.map((m) => [m.id, m]))
  const stationById = new Map(stations.map((s) => [s.id, s]))
  const calcById = new Map(calcRows.map((r) => [r.id, r]))

  const problems: { path: string; message: string }[] = []
  for (const k of bandKeys) if (!bandLimits.has(k)) problems.push({ path: 'inputs.limit.bandLimitId', message: `There is no band-limit entry "${k}".` })
  for (const id of measurementIds) if (!measurementById.has(id)) problems.push({ path: 'inputs', message: `There is no measurement ${id} on this case.` })
  for (const id of stationIds) if (!stationById.has(id)) problems.push({ path: 'inputs.limit.stationId', message: `There is no authorised station ${id} in the licence register.` })
  const calculations = new Map<string, CalculationReference>()
  for (const id of calculationIds) {
    const row = calcById.get(id)
    const ref = row && calculationReferenceOf(row)
    if (!row) problems.push({ path: 'inputs.eirpCalculationId', message: `There is no stored calculation ${id} on this case.` })
    else if (!ref) problems.push({ path: 'inputs.eirpCalculationId', message: `The stored calculation ${id} (${row.kind}) gives no EIRP estimate.` })
    else calculations.set(id, ref)
  }
  if (problems.length) throw badRequest('calculation_refused', problems.map((p) => p.message).join(' '), problems)

  return {
    measurementIds,
    evidenceIds: measured.evidenceIds,
    lookup: {
      bandLimit: (key) => bandLimits.get(key),
      measurement: (id) => measurementById.get(id),
      station: (id) => stationById.get(id),
      calculation: (id) => calculations.get(id),
    },
  }
}
