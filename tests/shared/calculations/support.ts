/**
 * Helpers for the calculation-kind tests: reference copies as the server would give them, and a
 * run that goes through the request schema, then again from the stored (JSON) inputs and copies.
 */
import geographiclib from 'geographiclib-geodesic'
import { expect } from 'vitest'
import { LIBRARY_REFERENCES, newCalculationSchema, outputSchemaOf, rerunStored, runNewCalculation, type CalculationRun, type Json, type ReferenceLookup } from '../../../shared/calculations/kinds'
import type { CalculationReference, MeasurementReference, StationReference } from '../../../shared/calculations/references'

/** WGS84 geodesics from GeographicLib itself (Karney 2013), independent of the project's wrapper. */
export const WGS84 = geographiclib.Geodesic.WGS84

export function pointFrom(from: { latDeg: number; lonDeg: number }, bearingDeg: number, distanceM: number): { latDeg: number; lonDeg: number } {
  const r = WGS84.Direct(from.latDeg, from.lonDeg, bearingDeg, distanceM)
  return { latDeg: r.lat2 as number, lonDeg: r.lon2 as number }
}

export const distanceBetweenM = (a: { latDeg: number; lonDeg: number }, b: { latDeg: number; lonDeg: number }) => WGS84.Inverse(a.latDeg, a.lonDeg, b.latDeg, b.lonDeg).s12 as number
export const azimuthDeg = (from: { latDeg: number; lonDeg: number }, to: { latDeg: number; lonDeg: number }) => WGS84.Inverse(from.latDeg, from.lonDeg, to.latDeg, to.lonDeg).azi1 as number

let seq = 0
/** A fresh uuid-shaped id (version 4 layout), deterministic per test run. */
export function testId(): string {
  seq += 1
  return `00000000-0000-4000-8000-${seq.toString(16).padStart(12, '0')}`
}

export function measurementRef(p: { latDeg: number; lonDeg: number; freqHz?: number; derived: MeasurementReference['derived']; bearingDeg?: number; bearingSigmaDeg?: number; warnings?: string[] }): MeasurementReference {
  return {
    id: testId(),
    takenAt: '2026-11-30T10:00:00.000Z',
    latitudeDeg: p.latDeg,
    longitudeDeg: p.lonDeg,
    freqHz: p.freqHz ?? 100e6,
    derived: p.derived,
    ...(p.bearingDeg !== undefined ? { bearingDeg: p.bearingDeg } : {}),
    ...(p.bearingSigmaDeg !== undefined ? { bearingSigmaDeg: p.bearingSigmaDeg } : {}),
    equipment: [],
    warnings: p.warnings ?? [],
    version: 1,
  }
}

export function lookupOf(x: { measurements?: MeasurementReference[]; calculations?: CalculationReference[]; stations?: StationReference[] }): ReferenceLookup {
  return {
    bandLimit: LIBRARY_REFERENCES.bandLimit,
    measurement: (id) => x.measurements?.find((m) => m.id === id),
    calculation: (id) => x.calculations?.find((c) => c.id === id),
    station: (id) => x.stations?.find((s) => s.id === id),
  }
}

/**
 * Parses the request as the API does, runs it, and checks that the stored form (inputs as JSON,
 * the copies as JSON) runs again to the same outputs (a record recomputes from itself alone) and
 * that the kind's output schema reads all of the value.
 */
export function run(kind: string, inputs: unknown, lookup: ReferenceLookup = LIBRARY_REFERENCES): CalculationRun & { references: Record<string, Json> } {
  const parsed = newCalculationSchema.parse({ kind, inputs })
  const r = runNewCalculation(parsed, lookup)
  const stored = JSON.parse(JSON.stringify({ inputs: parsed.inputs, references: r.references })) as { inputs: unknown; references: Record<string, unknown> }
  const again = rerunStored({ kind: parsed.kind, inputs: stored.inputs, references: stored.references })
  expect(JSON.stringify(again.outputs)).toBe(JSON.stringify(r.run.outputs))
  // the kind's output schema reads the value and declares all of it (the web reads records with it)
  const schema = outputSchemaOf(parsed.kind)
  expect(schema, `${kind} declares its output schema`).toBeDefined()
  expect(schema!.parse(r.run.outputs.value)).toEqual(r.run.outputs.value)
  return { ...r.run, references: r.references }
}

/** The issues' messages of a request the schema refuses. */
export function refusals(kind: string, inputs: unknown): string[] {
  const r = newCalculationSchema.safeParse({ kind, inputs })
  if (r.success) throw new Error('expected the request to be refused')
  return r.error.issues.map((i) => i.message)
}
