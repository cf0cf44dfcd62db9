/**
 * The kinds of calculation an investigator can store on a case. Each kind has a strict input
 * schema (every typed number through the strict parser, unknown keys refused), the reference
 * copies it keeps (a limit from the band-limit reference, later a licence row or a calibration),
 * and a pure `run` that calls shared/radio and returns what the record stores: outputs, the
 * coverage interval, warnings and the method of every step. The server runs it; nothing a
 * browser computed is ever stored. `run` is deterministic, so a stored record can be recomputed
 * from its inputs and its reference copies alone.
 */
import { z } from 'zod'
import {
  APPLIED_LIMIT_METHOD,
  assessCompliance,
  BAND_LIMITS,
  createPropagationModel,
  eirpFromMeasurement,
  type CitedLimit,
  type CoverageInterval,
  type LimitSpec,
  type MethodRef,
  type PointMeasurement,
} from '../radio'
import type { ReferenceLookup } from './references'
export type { BandLimitReference, ReferenceLookup } from './references'
import { dbi, dbm, dbuvPerM, dbwPerM2, distanceM, distanceUncertainty, freqHz, plain, positiveDb, propagationModelSpec, text, uncertaintyContribution } from './inputs'

export const CALCULATION_KINDS = ['eirp_single_point', 'compliance_verdict'] as const
export type CalculationKind = (typeof CALCULATION_KINDS)[number]

export const CALCULATION_KIND_LABELS: Record<CalculationKind, string> = {
  eirp_single_point: 'EIRP from one measured level',
  compliance_verdict: 'Compliance verdict against a limit',
}

/** JSON as stored in a record's jsonb columns. */
export type Json = null | boolean | number | string | Json[] | { [key: string]: Json }

/** What a run gives: stored as the record's outputs, warnings and methods. */
export interface CalculationRun {
  /** The result's value (and its interval, when there is one), JSON only. */
  outputs: { value: Json; interval?: CoverageInterval }
  warnings: string[]
  /** The method of every step, main method first. */
  methods: MethodRef[]
  /** One line for the case's timeline. */
  summary: string
}

/** Thrown for input that passes the schema but that the library refuses (its RangeError's words). */
export class CalculationRefused extends Error {}

const toJson = (x: unknown): Json => JSON.parse(JSON.stringify(x)) as Json
const f2 = (v: number) => v.toFixed(2)

function runLibrary<T>(work: () => T): T {
  try {
    return work()
  } catch (e) {
    if (e instanceof RangeError) throw new CalculationRefused(e.message)
    throw e
  }
}

// ── eirp_single_point ────────────────────────────────────────────────────────

const pointMeasurement = z.discriminatedUnion('kind', [
  z.strictObject({ kind: z.literal('field-strength'), fieldStrengthDbuvPerM: dbuvPerM('the field strength'), freqHz: freqHz('the measured frequency') }),
  z.strictObject({ kind: z.literal('pfd'), pfdDbwPerM2: dbwPerM2('the power flux-density'), freqHz: freqHz('the measured frequency') }),
  z.strictObject({ kind: z.literal('isotropic-power'), receivedPowerDbm: dbm('the isotropic received power') }),
  z.strictObject({ kind: z.literal('received-power'), receivedPowerDbm: dbm('the received power'), antennaGainDbi: dbi('the receiving antenna gain') }),
])

export const eirpSinglePointInputSchema = z.strictObject({
  /** One level, already corrected for the measuring chain. */
  measurement: pointMeasurement,
  distanceM: distanceM('the distance to the source'),
  model: propagationModelSpec,
  measurementContributions: z.array(uncertaintyContribution).max(30).optional(),
  distanceUncertainty: distanceUncertainty.optional(),
})
export type EirpSinglePointInputs = z.infer<typeof eirpSinglePointInputSchema>

function runEirpSinglePoint(inputs: EirpSinglePointInputs): CalculationRun {
  const r = runLibrary(() =>
    eirpFromMeasurement({
      measurement: inputs.measurement as PointMeasurement,
      distanceM: inputs.distanceM,
      model: createPropagationModel(inputs.model),
      measurementContributions: inputs.measurementContributions?.map((c) => ({ ...c, unit: 'dB' })),
      distanceUncertainty: inputs.distanceUncertainty,
    }),
  )
  const { modelMethod, ...value } = r.value
  const interval = r.interval ? ` (interval ${f2(r.interval.low)} to ${f2(r.interval.high)} dBm)` : ''
  return {
    outputs: { value: toJson({ ...value, modelMethodId: modelMethod.id }), ...(r.interval ? { interval: r.interval } : {}) },
    warnings: r.warnings,
    methods: [r.method, modelMethod],
    summary: `EIRP ${f2(r.value.eirpDbm)} dBm${interval} from one level at ${r.value.distanceM} m, ${modelMethod.id}`,
  }
}

// ── compliance_verdict ───────────────────────────────────────────────────────

const conductedGainRule = z.discriminatedUnion('kind', [
  z.strictObject({ kind: z.literal('no-reduction'), citation: text('the gain rule citation').optional() }),
  z.strictObject({
    kind: z.literal('reduce-conducted-above'),
    thresholdGainDbi: dbi('the gain threshold'),
    reductionDbPerDb: plain('the reduction per dB of gain', 0, 10),
    citation: text('the gain rule citation').optional(),
  }),
])

const referenceBandwidthHz = freqHz('the reference bandwidth')

/** A limit as written (the library's LimitSpec), strictly. */
export const limitSpecSchema: z.ZodType<LimitSpec, unknown> = z.lazy(() =>
  z.discriminatedUnion('kind', [
    z.strictObject({
      kind: z.literal('eirp'),
      eirpDbm: dbm('the EIRP limit'),
      gainRule: z
        .strictObject({ kind: z.literal('reduce-eirp-below'), thresholdGainDbi: dbi('the gain threshold'), reductionDbPerDb: plain('the reduction per dB of gain', 0, 10), citation: text('the gain rule citation').optional() })
        .optional(),
    }),
    z.strictObject({ kind: z.literal('erp'), erpDbm: dbm('the ERP limit') }),
    z.strictObject({ kind: z.literal('eirp-density'), eirpDensityDbm: dbm('the EIRP density limit'), referenceBandwidthHz }),
    z.strictObject({ kind: z.literal('conducted'), conductedPowerDbm: dbm('the conducted power limit'), gainRule: conductedGainRule }),
    z.strictObject({ kind: z.literal('conducted-density'), conductedDensityDbm: dbm('the conducted density limit'), referenceBandwidthHz, gainRule: conductedGainRule }),
    z.strictObject({ kind: z.literal('lesser-of'), limits: z.array(limitSpecSchema).min(1).max(5) }),
  ]),
) as z.ZodType<LimitSpec, unknown>

export const complianceVerdictInputSchema = z.strictObject({
  eirpDbm: dbm('the estimated EIRP'),
  /** 95 % interval of the EIRP as absolute levels. */
  eirpIntervalDbm: z.strictObject({ lowDbm: dbm('the low end of the EIRP interval'), highDbm: dbm('the high end of the EIRP interval') }).optional(),
  /** The limit: an entry of the band-limit reference by id, or one stated with its citation (e.g. from a licence). */
  limit: z.discriminatedUnion('source', [
    z.strictObject({ source: z.literal('band-limit'), bandLimitId: text('the band-limit entry', 120) }),
    z.strictObject({ source: z.literal('stated'), spec: limitSpecSchema, citation: text('the citation of the limit'), status: text('the status of the limit', 40).optional() }),
  ]),
  antennaGainDbi: dbi('the antenna gain').optional(),
  emissionBandwidthHz: freqHz('the emission bandwidth').optional(),
  feederLossDb: positiveDb('the feeder loss').optional(),
})
export type ComplianceVerdictInputs = z.infer<typeof complianceVerdictInputSchema>

/** The library's own list, for pure use without a database (tests, the quick calculator). */
export const LIBRARY_REFERENCES: ReferenceLookup = {
  bandLimit(key) {
    const e = BAND_LIMITS.find((b) => b.id === key)
    return e && { key: e.id, title: e.title, spec: e.spec, citation: e.citation, verified: !e.status.includes('[M]'), statusNote: e.statusNote }
  },
}

export interface LimitCopy extends CitedLimit {
  /** Where it came from: the band-limit reference (with the entry's id and title) or stated by the investigator. */
  from: 'band-limit-reference' | 'stated'
  entryId?: string
  title?: string
  statusNote?: string
  /** The register row's version that was copied. */
  entryVersion?: number
}

const limitCopySchema = z.object({
  from: z.enum(['band-limit-reference', 'stated']),
  entryId: z.string().optional(),
  entryVersion: z.number().optional(),
  title: z.string().optional(),
  statusNote: z.string().optional(),
  spec: limitSpecSchema,
  citation: z.string(),
  status: z.string().optional(),
})

function complianceReferences(inputs: ComplianceVerdictInputs, lookup: ReferenceLookup): { limit: LimitCopy } {
  if (inputs.limit.source === 'stated') {
    return { limit: { from: 'stated', spec: inputs.limit.spec, citation: inputs.limit.citation, ...(inputs.limit.status ? { status: inputs.limit.status } : {}) } }
  }
  const id = inputs.limit.bandLimitId
  const entry = lookup.bandLimit(id)
  if (!entry) throw new CalculationRefused(`There is no band-limit entry "${id}".`)
  return {
    limit: {
      from: 'band-limit-reference',
      entryId: entry.key,
      ...(entry.version !== undefined ? { entryVersion: entry.version } : {}),
      title: entry.title,
      statusNote: entry.statusNote,
      spec: entry.spec,
      citation: entry.citation,
      // an unverified value carries the library's [M] mark, so the verdict warns about it
      status: entry.verified ? 'verified' : '[M] not verified',
    },
  }
}

function runComplianceVerdict(inputs: ComplianceVerdictInputs, references: Record<string, unknown>): CalculationRun {
  const copy = limitCopySchema.safeParse(references.limit)
  if (!copy.success) throw new CalculationRefused('The record has no usable copy of its limit.')
  const limit = copy.data
  const r = runLibrary(() =>
    assessCompliance({
      eirpDbm: inputs.eirpDbm,
      eirpIntervalDbm: inputs.eirpIntervalDbm,
      limit: { spec: limit.spec, citation: limit.citation, ...(limit.status ? { status: limit.status } : {}) },
      antennaGainDbi: inputs.antennaGainDbi,
      emissionBandwidthHz: inputs.emissionBandwidthHz,
      feederLossDb: inputs.feederLossDb,
    }),
  )
  return {
    outputs: { value: toJson(r.value), ...(r.interval ? { interval: r.interval } : {}) },
    warnings: r.warnings,
    methods: [r.method, APPLIED_LIMIT_METHOD],
    summary: `${r.value.verdict}: margin ${f2(r.value.marginDb)} dB against ${f2(r.value.appliedLimitEirpDbm)} dBm EIRP (${limit.citation})`,
  }
}

// ── the registry ─────────────────────────────────────────────────────────────

export interface CalculationKindDef<S extends z.ZodType = z.ZodType> {
  kind: CalculationKind
  label: string
  inputSchema: S
  /** Copies of every reference the inputs name, taken when the record is stored. */
  references(inputs: z.infer<S>, lookup: ReferenceLookup): Record<string, Json>
  run(inputs: z.infer<S>, references: Record<string, unknown>): CalculationRun
}

const define = <S extends z.ZodType>(d: CalculationKindDef<S>) => d

export const CALCULATION_KIND_DEFS = {
  eirp_single_point: define({
    kind: 'eirp_single_point',
    label: CALCULATION_KIND_LABELS.eirp_single_point,
    inputSchema: eirpSinglePointInputSchema,
    references: () => ({}),
    run: (inputs) => runEirpSinglePoint(inputs),
  }),
  compliance_verdict: define({
    kind: 'compliance_verdict',
    label: CALCULATION_KIND_LABELS.compliance_verdict,
    inputSchema: complianceVerdictInputSchema,
    references: (inputs, lookup) => toJson(complianceReferences(inputs, lookup)) as Record<string, Json>,
    run: (inputs, references) => runComplianceVerdict(inputs, references),
  }),
} as const satisfies Record<CalculationKind, CalculationKindDef<z.ZodType>>

/**
 * A request to store a calculation: its kind and the inputs as typed. Strict: a client that
 * sends outputs, a result, an author or a time is refused, whatever it sends them as.
 */
export const newCalculationSchema = z.discriminatedUnion('kind', [
  z.strictObject({ kind: z.literal('eirp_single_point'), inputs: eirpSinglePointInputSchema }),
  z.strictObject({ kind: z.literal('compliance_verdict'), inputs: complianceVerdictInputSchema }),
])
export type NewCalculation = z.infer<typeof newCalculationSchema>

/** Takes the reference copies and runs a calculation of its kind (inputs already parsed). */
export function runNewCalculation(c: NewCalculation, lookup: ReferenceLookup = LIBRARY_REFERENCES): { references: Record<string, Json>; run: CalculationRun } {
  switch (c.kind) {
    case 'eirp_single_point': {
      const references = CALCULATION_KIND_DEFS.eirp_single_point.references(c.inputs, lookup)
      return { references, run: CALCULATION_KIND_DEFS.eirp_single_point.run(c.inputs, references) }
    }
    case 'compliance_verdict': {
      const references = CALCULATION_KIND_DEFS.compliance_verdict.references(c.inputs, lookup)
      return { references, run: CALCULATION_KIND_DEFS.compliance_verdict.run(c.inputs, references) }
    }
  }
}

/**
 * Runs a stored record again with the current library: its stored (normalised) inputs are read
 * with the kind's schema once more, and its own reference copies are used, never the registers
 * as they are now.
 */
export function rerunStored(stored: { kind: CalculationKind; inputs: unknown; references: Record<string, unknown> }): CalculationRun {
  const parsed = newCalculationSchema.safeParse({ kind: stored.kind, inputs: stored.inputs })
  if (!parsed.success) throw new CalculationRefused(`The stored inputs no longer read as ${stored.kind}: ${parsed.error.issues.map((i) => i.message).join(' ')}`)
  const c = parsed.data
  return c.kind === 'eirp_single_point'
    ? CALCULATION_KIND_DEFS.eirp_single_point.run(c.inputs, stored.references)
    : CALCULATION_KIND_DEFS.compliance_verdict.run(c.inputs, stored.references)
}
