/**
 * The kinds of calculation an investigator can store on a case. Each kind lives in its own file
 * with a strict input schema (every typed number through the strict parser, unknown keys
 * refused), the references it names and the copies it keeps, and a pure `run` that calls
 * shared/radio and returns what the record stores: outputs, the coverage interval, warnings and
 * the method of every step. The server runs it; nothing a browser computed is ever stored. `run`
 * is deterministic, so a stored record can be recomputed from its inputs and its copies alone.
 *
 * Adding a kind: a new file exporting its `defineKind(…)`, and one line in each list below.
 */
import { z } from 'zod'
import { BAND_LIMITS } from '../../radio'
import type { ReferenceLookup } from '../references'
import { CalculationRefused, type CalculationKindDef, type CalculationRun, type Json, type NamedReferences } from './common'
import { coexistenceKind } from './coexistence'
import { complianceVerdictKind } from './compliance-verdict'
import { eirpFitKind } from './eirp-fit'
import { eirpSinglePointKind } from './eirp-single-point'
import { exposureScreeningKind } from './exposure-screening'
import { sourceLocateKind } from './source-locate'
import { candidateSourcesKind } from './candidate-sources'

export * from './common'
export * from './eirp-single-point'
export * from './compliance-verdict'
export * from './eirp-fit'
export * from './source-locate'
export * from './coexistence'
export * from './exposure-screening'
export * from './copies'
export * from './output-pieces'
export * from './candidate-sources'
export type { BandLimitReference, ReferenceLookup } from '../references'

export const CALCULATION_KINDS = [
  'eirp_single_point',
  'compliance_verdict',
  'eirp_fit',
  'source_locate',
  'coexistence',
  'exposure_screening',
  'candidate_sources',
] as const
export type CalculationKind = (typeof CALCULATION_KINDS)[number]

export const CALCULATION_KIND_DEFS = {
  eirp_single_point: eirpSinglePointKind,
  compliance_verdict: complianceVerdictKind,
  eirp_fit: eirpFitKind,
  source_locate: sourceLocateKind,
  coexistence: coexistenceKind,
  exposure_screening: exposureScreeningKind,
  candidate_sources: candidateSourcesKind,
} as const satisfies { [K in CalculationKind]: CalculationKindDef<z.ZodType, K> }

/** The request to store one kind: its key and its inputs, strictly. */
const requestOf = <K extends CalculationKind, S extends z.ZodType>(d: CalculationKindDef<S, K>) => z.strictObject({ kind: z.literal(d.kind), inputs: d.inputSchema })

/**
 * A request to store a calculation: its kind and the inputs as typed. Strict: a client that
 * sends outputs, a result, an author or a time is refused, whatever it sends them as.
 */
export const newCalculationSchema = z.discriminatedUnion('kind', [
  requestOf(CALCULATION_KIND_DEFS.eirp_single_point),
  requestOf(CALCULATION_KIND_DEFS.compliance_verdict),
  requestOf(CALCULATION_KIND_DEFS.eirp_fit),
  requestOf(CALCULATION_KIND_DEFS.source_locate),
  requestOf(CALCULATION_KIND_DEFS.coexistence),
  requestOf(CALCULATION_KIND_DEFS.exposure_screening),
  requestOf(CALCULATION_KIND_DEFS.candidate_sources),
])
export type NewCalculation = z.infer<typeof newCalculationSchema>

export const CALCULATION_KIND_LABELS = Object.fromEntries(CALCULATION_KINDS.map((k) => [k, CALCULATION_KIND_DEFS[k].label])) as Record<CalculationKind, string>

/** The definition of a kind, its inputs read as unknown (each kind's run re-reads nothing: inputs are already parsed). */
const defOf = (kind: CalculationKind): CalculationKindDef => CALCULATION_KIND_DEFS[kind]

/** The kinds whose records estimate a source's EIRP (`outputs.value.eirpDbm`): what a verdict, a coexistence or an exposure screening may build on. */
export const EIRP_ESTIMATE_KINDS: readonly CalculationKind[] = ['eirp_single_point', 'eirp_fit', 'source_locate']

/** The zod schema of `outputs.value` for a kind's records (undefined for a kind that declares none). */
export function outputSchemaOf(kind: CalculationKind): z.ZodType | undefined {
  return defOf(kind).outputSchema
}

/** The library's own list, for pure use without a database (tests, the quick calculator). */
export const LIBRARY_REFERENCES: ReferenceLookup = {
  bandLimit(key) {
    const e = BAND_LIMITS.find((b) => b.id === key)
    return e && { key: e.id, title: e.title, spec: e.spec, citation: e.citation, verified: !e.status.includes('[M]'), statusNote: e.statusNote }
  },
}

/** The stored things a request names (band limits, measurements, stations, calculations). */
export function namedReferences(c: NewCalculation): NamedReferences {
  return defOf(c.kind).named(c.inputs)
}

/** Takes the reference copies and runs a calculation of its kind (inputs already parsed). */
export function runNewCalculation(c: NewCalculation, lookup: ReferenceLookup = LIBRARY_REFERENCES): { references: Record<string, Json>; run: CalculationRun } {
  const def = defOf(c.kind)
  const references = def.references(c.inputs, lookup)
  return { references, run: def.run(c.inputs, references) }
}

/**
 * Runs a stored record again with the current library: its stored (normalised) inputs are read
 * with the kind's schema once more, and its own reference copies are used, never the registers
 * as they are now.
 */
export function rerunStored(stored: { kind: CalculationKind; inputs: unknown; references: Record<string, unknown> }): CalculationRun {
  const parsed = newCalculationSchema.safeParse({ kind: stored.kind, inputs: stored.inputs })
  if (!parsed.success) throw new CalculationRefused(`The stored inputs no longer read as ${stored.kind}: ${parsed.error.issues.map((i) => i.message).join(' ')}`)
  return defOf(parsed.data.kind).run(parsed.data.inputs, stored.references)
}
