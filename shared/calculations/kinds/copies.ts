/**
 * Reading the reference copies a record keeps: measurements, stations and stored calculations.
 * Copies are taken once, when the record is stored (`copy…` with the server's lookup); a run
 * reads them back (`read…`) and never the registers, so a record recomputes from itself alone.
 */
import { z } from 'zod'
import { fieldToReceivedPowerDbm, geodesicInverse, pfdToReceivedPowerDbm, type GeoPoint, type LimitSpec } from '../../radio'
import type { CalculationReference, MeasurementReference, ReferenceLookup, StationReference } from '../references'
import { CalculationRefused, toJson, type Json } from './common'

const finite = z.number().refine(Number.isFinite)

/** A measurement copy as a record keeps it (shared/calculations/references.ts `MeasurementReference`). */
export const measurementCopySchema = z.object({
  id: z.string(),
  takenAt: z.string(),
  latitudeDeg: finite,
  longitudeDeg: finite,
  heightM: finite.optional(),
  freqHz: finite,
  measurementBandwidthHz: finite.optional(),
  resolutionBandwidthHz: finite.optional(),
  detector: z.string().optional(),
  derived: z.object({ fieldStrengthDbuvPerM: finite.optional(), pfdDbwPerM2: finite.optional(), isotropicReceivedPowerDbm: finite.optional() }),
  bearingDeg: finite.optional(),
  bearingSigmaDeg: finite.optional(),
  equipment: z.array(z.looseObject({ equipmentId: z.string(), name: z.string() })),
  warnings: z.array(z.string()),
  version: z.number(),
})

/** A stored-calculation copy (`CalculationReference`). */
export const calculationCopySchema = z.object({
  id: z.string(),
  kind: z.string(),
  eirpDbm: finite,
  eirpIntervalDbm: z.object({ lowDbm: finite, highDbm: finite }).optional(),
  libraryVersion: z.string(),
  at: z.string(),
})

/** A station copy (`StationReference`); the limit is read again with the kind's strict limit schema. */
export const stationCopySchema = z.object({
  id: z.string(),
  registerVersion: z.number(),
  stationCode: z.string(),
  licensee: z.string(),
  service: z.string(),
  latitudeDeg: finite,
  longitudeDeg: finite,
  antennaHeightM: finite.optional(),
  lowFreqHz: finite,
  highFreqHz: finite,
  limit: z.unknown(),
  antennaGainDbi: finite.optional(),
  feederLossDb: finite.optional(),
  authorisedEirpDbm: finite,
  validFrom: z.string().nullable(),
  validUntil: z.string().nullable(),
})

/** Copies of the measurements named, in the order named; one that is not there is refused by id. */
export function copyMeasurements(ids: readonly string[], lookup: ReferenceLookup): Json {
  const missing = ids.filter((id) => !lookup.measurement?.(id))
  if (missing.length) throw new CalculationRefused(`There is no measurement ${missing.map((m) => `"${m}"`).join(', ')} on this case.`)
  return toJson(ids.map((id) => lookup.measurement!(id) as MeasurementReference))
}

export function copyCalculation(id: string, lookup: ReferenceLookup): Json {
  const c = lookup.calculation?.(id)
  if (!c) throw new CalculationRefused(`There is no stored calculation "${id}" with an EIRP on this case.`)
  return toJson(c satisfies CalculationReference)
}

export function copyStation(id: string, lookup: ReferenceLookup): Json {
  const s = lookup.station?.(id)
  if (!s) throw new CalculationRefused(`There is no authorised station "${id}" in the licence register.`)
  return toJson(s satisfies StationReference)
}

export type MeasurementCopy = z.infer<typeof measurementCopySchema>

export function readMeasurements(references: Record<string, unknown>, ids: readonly string[]): MeasurementCopy[] {
  const r = z.array(measurementCopySchema).safeParse(references.measurements)
  if (!r.success || r.data.length !== ids.length || r.data.some((m, i) => m.id !== ids[i])) {
    throw new CalculationRefused('The record has no usable copy of its measurements.')
  }
  return r.data
}

export function readCalculation(references: Record<string, unknown>, key: string): z.infer<typeof calculationCopySchema> {
  const r = calculationCopySchema.safeParse(references[key])
  if (!r.success) throw new CalculationRefused('The record has no usable copy of the calculation it builds on.')
  return r.data
}

export function readStation(references: Record<string, unknown>): z.infer<typeof stationCopySchema> & { limit: LimitSpec } {
  const r = stationCopySchema.safeParse(references.station)
  if (!r.success) throw new CalculationRefused('The record has no usable copy of the station it names.')
  return r.data as z.infer<typeof stationCopySchema> & { limit: LimitSpec }
}

/** The warnings the measurements carry (expired calibration…), each once, naming its measurement. */
export function measurementWarnings(ms: readonly MeasurementCopy[]): string[] {
  const out = new Set<string>()
  for (const m of ms) for (const w of m.warnings) out.add(`Measurement taken ${m.takenAt}: ${w}`)
  return [...out]
}

export const positionOf = (m: MeasurementCopy): GeoPoint => ({ latDeg: m.latitudeDeg, lonDeg: m.longitudeDeg })

/** Geodesic distance from a measurement to a source position [m]; refused when they coincide. */
export function distanceToSourceM(m: MeasurementCopy, source: GeoPoint): number {
  const d = geodesicInverse({ from: positionOf(m), to: source }).distanceM
  if (!(d > 0)) throw new CalculationRefused(`The measurement taken ${m.takenAt} is at the source position: its distance is zero.`)
  return d
}

/**
 * The isotropic received power a measurement gives [dBm]: its derived isotropic power, else
 * from its field strength or power flux-density at its own frequency (ITU-R P.525-4 §3, the
 * library's received-power conversion).
 */
export function isotropicPowerOfDbm(m: MeasurementCopy): number {
  const d = m.derived
  if (d.isotropicReceivedPowerDbm !== undefined) return d.isotropicReceivedPowerDbm
  if (d.fieldStrengthDbuvPerM !== undefined) return fieldToReceivedPowerDbm({ fieldStrengthDbuvPerM: d.fieldStrengthDbuvPerM, freqHz: m.freqHz })
  if (d.pfdDbwPerM2 !== undefined) return pfdToReceivedPowerDbm({ pfdDbwPerM2: d.pfdDbwPerM2, freqHz: m.freqHz })
  throw new CalculationRefused(`The measurement taken ${m.takenAt} has no level (no field strength, power flux-density or received power).`)
}

/**
 * "Exactly one of" for flat alternative inputs: the issue goes at the first key. `both` says to
 * give only one ("Give either X or Y, not both."); with neither given, the same words without
 * "either" and "not both" ask for one ("Give X or Y.").
 */
export function exactlyOne(ctx: z.core.$RefinementCtx<unknown>, value: Record<string, unknown>, keys: string[], both: string): void {
  const given = keys.filter((k) => value[k] !== undefined)
  if (given.length === 1) return
  const message = given.length === 0 ? both.replace(/^Give either /, 'Give ').replace(/, not both\.$/, '.') : both
  ctx.addIssue({ code: 'custom', path: [given[1] ?? keys[0]!], message })
}
