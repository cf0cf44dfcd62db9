/**
 * `compliance_verdict`: an EIRP (and its interval) against a limit, with the applied limit and
 * margin. The EIRP is typed, or taken from a stored calculation of the same case (the record keeps
 * a copy of it); the limit is an entry of the band-limit register, stated with its citation, or
 * the licence of an authorised station (a copy of the station's row and register version).
 */
import { z } from 'zod'
import { APPLIED_LIMIT_METHOD, assessCompliance, type CitedLimit, type LimitSpec } from '../../radio'
import type { ReferenceLookup } from '../references'
import { bandwidthHz, dbi, dbm, plain, positiveDb, recordId, text } from '../inputs'
import { CalculationRefused, defineKind, f2, runLibrary, toJson, type CalculationRun, type Json } from './common'
import { copyCalculation, copyStation, exactlyOne, readCalculation, readStation } from './copies'
import { coverageIntervalSchema } from './output-pieces'

const conductedGainRule = z.discriminatedUnion('kind', [
  z.strictObject({ kind: z.literal('no-reduction'), citation: text('the gain rule citation').optional() }),
  z.strictObject({
    kind: z.literal('reduce-conducted-above'),
    thresholdGainDbi: dbi('the gain threshold'),
    reductionDbPerDb: plain('the reduction per dB of gain', 0, 10),
    citation: text('the gain rule citation').optional(),
  }),
])

const referenceBandwidthHz = bandwidthHz('the reference bandwidth')

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
).meta({ id: 'StatedLimitSpec', description: 'A limit stated in the calculation itself (as the radio library writes it), levels as numbers or text with a unit.' }) as z.ZodType<LimitSpec, unknown>

export const complianceVerdictInputSchema = z
  .strictObject({
    /** The EIRP typed… */
    eirpDbm: dbm('the estimated EIRP').optional(),
    /** 95 % interval of the typed EIRP as absolute levels. */
    eirpIntervalDbm: z.strictObject({ lowDbm: dbm('the low end of the EIRP interval'), highDbm: dbm('the high end of the EIRP interval') }).optional(),
    /** …or the EIRP (and its interval) of a stored calculation of the same case. */
    eirpCalculationId: recordId('the calculation').optional(),
    /** The limit: an entry of the band-limit register, one stated with its citation, or an authorised station's licence. */
    limit: z.discriminatedUnion('source', [
      z.strictObject({ source: z.literal('band-limit'), bandLimitId: text('the band-limit entry', 120) }),
      z.strictObject({ source: z.literal('stated'), spec: limitSpecSchema, citation: text('the citation of the limit'), status: text('the status of the limit', 40).optional() }),
      z.strictObject({ source: z.literal('station'), stationId: recordId('the station') }),
    ]),
    antennaGainDbi: dbi('the antenna gain').optional(),
    emissionBandwidthHz: bandwidthHz('the emission bandwidth').optional(),
    feederLossDb: positiveDb('the feeder loss').optional(),
  })
  .superRefine((v, ctx) => {
    exactlyOne(ctx, v, ['eirpDbm', 'eirpCalculationId'], 'Give either the EIRP or a stored calculation that gives it, not both.')
    if (v.eirpIntervalDbm && v.eirpCalculationId) ctx.addIssue({ code: 'custom', path: ['eirpIntervalDbm'], message: 'The interval comes with the stored calculation; do not type one.' })
  })
export type ComplianceVerdictInputs = z.infer<typeof complianceVerdictInputSchema>

export interface LimitCopy extends CitedLimit {
  /** Where it came from: the band-limit reference (with the entry's id and title) or stated by the investigator. */
  from: 'band-limit-reference' | 'stated' | 'station-licence'
  entryId?: string
  title?: string
  statusNote?: string
  /** The register row's version that was copied. */
  entryVersion?: number
}

const limitCopySchema = z.object({
  from: z.enum(['band-limit-reference', 'stated', 'station-licence']),
  entryId: z.string().optional(),
  entryVersion: z.number().optional(),
  title: z.string().optional(),
  statusNote: z.string().optional(),
  spec: limitSpecSchema,
  citation: z.string(),
  status: z.string().optional(),
})

function limitReference(inputs: ComplianceVerdictInputs, lookup: ReferenceLookup): Record<string, Json> {
  if (inputs.limit.source === 'stated') {
    return { limit: toJson({ from: 'stated', spec: inputs.limit.spec, citation: inputs.limit.citation, ...(inputs.limit.status ? { status: inputs.limit.status } : {}) } satisfies LimitCopy) }
  }
  if (inputs.limit.source === 'station') return { station: copyStation(inputs.limit.stationId, lookup) }
  const id = inputs.limit.bandLimitId
  const entry = lookup.bandLimit(id)
  if (!entry) throw new CalculationRefused(`There is no band-limit entry "${id}".`)
  return {
    limit: toJson({
      from: 'band-limit-reference',
      entryId: entry.key,
      ...(entry.version !== undefined ? { entryVersion: entry.version } : {}),
      title: entry.title,
      statusNote: entry.statusNote,
      spec: entry.spec,
      citation: entry.citation,
      // an unverified value carries the library's [M] mark, so the verdict warns about it
      status: entry.verified ? 'verified' : '[M] not verified',
    } satisfies LimitCopy),
  }
}

function complianceReferences(inputs: ComplianceVerdictInputs, lookup: ReferenceLookup): Record<string, Json> {
  return { ...limitReference(inputs, lookup), ...(inputs.eirpCalculationId ? { eirpCalculation: copyCalculation(inputs.eirpCalculationId, lookup) } : {}) }
}

/** The limit the record judges against, from its own copy (a band-limit entry, a stated limit, or a station's licence). */
function limitOf(references: Record<string, unknown>): LimitCopy {
  if (references.station !== undefined) {
    const st = readStation(references)
    const spec = limitSpecSchema.safeParse(st.limit)
    if (!spec.success) throw new CalculationRefused(`The licence of station ${st.stationCode} states no limit the verdict can use.`)
    return {
      from: 'station-licence',
      entryId: st.id,
      entryVersion: st.registerVersion,
      title: `${st.stationCode} — ${st.licensee} (${st.service})`,
      spec: spec.data,
      citation: `Licence of station ${st.stationCode} (${st.licensee}), licence register version ${st.registerVersion}`,
      status: 'as licensed',
    }
  }
  const copy = limitCopySchema.safeParse(references.limit)
  if (!copy.success) throw new CalculationRefused('The record has no usable copy of its limit.')
  return copy.data
}

function runComplianceVerdict(inputs: ComplianceVerdictInputs, references: Record<string, unknown>): CalculationRun {
  const limit = limitOf(references)
  const station = references.station !== undefined ? readStation(references) : undefined
  const fromCalculation = inputs.eirpCalculationId ? readCalculation(references, 'eirpCalculation') : undefined
  const eirpDbm = fromCalculation ? fromCalculation.eirpDbm : inputs.eirpDbm!
  const eirpIntervalDbm = fromCalculation ? fromCalculation.eirpIntervalDbm : inputs.eirpIntervalDbm
  const r = runLibrary(() =>
    assessCompliance({
      eirpDbm,
      eirpIntervalDbm,
      limit: { spec: limit.spec, citation: limit.citation, ...(limit.status ? { status: limit.status } : {}) },
      // a licence that states its antenna gain and feeder loss gives them unless typed
      antennaGainDbi: inputs.antennaGainDbi ?? station?.antennaGainDbi,
      emissionBandwidthHz: inputs.emissionBandwidthHz,
      feederLossDb: inputs.feederLossDb ?? station?.feederLossDb,
    }),
  )
  return {
    outputs: {
      value: toJson({ ...r.value, eirpDbm, ...(eirpIntervalDbm ? { eirpIntervalDbm } : {}), eirpFrom: fromCalculation ? 'calculation' : 'typed', limitFrom: limit.from }),
      ...(r.interval ? { interval: r.interval } : {}),
    },
    warnings: r.warnings,
    methods: [r.method, APPLIED_LIMIT_METHOD],
    summary: `${r.value.verdict}: margin ${f2(r.value.marginDb)} dB against ${f2(r.value.appliedLimitEirpDbm)} dBm EIRP (${limit.citation})`,
  }
}

/** What `outputs.value` of a `compliance_verdict` record holds; `outputs.interval` bounds `marginDb`. */
export const complianceVerdictOutputSchema = z.object({
  verdict: z.enum(['exceeds', 'within', 'inconclusive']),
  /** EIRP minus the applied limit [dB]; positive = over the limit. */
  marginDb: z.number(),
  marginIntervalDb: z.object({ lowDb: z.number(), highDb: z.number() }).optional(),
  appliedLimitEirpDbm: z.number(),
  citation: z.string(),
  limitStatus: z.string().optional(),
  derivation: z.array(z.string()),
  /** The EIRP judged, typed or from the stored calculation, and its interval. */
  eirpDbm: z.number().optional(),
  eirpIntervalDbm: z.object({ lowDbm: z.number(), highDbm: z.number() }).optional(),
  eirpFrom: z.enum(['typed', 'calculation']).optional(),
  limitFrom: z.enum(['band-limit-reference', 'stated', 'station-licence']).optional(),
})
export type ComplianceVerdictOutput = z.infer<typeof complianceVerdictOutputSchema>
export const complianceVerdictIntervalSchema = coverageIntervalSchema

export const complianceVerdictKind = defineKind({
  kind: 'compliance_verdict',
  label: 'Compliance verdict against a limit',
  inputSchema: complianceVerdictInputSchema,
  outputSchema: complianceVerdictOutputSchema,
  named: (inputs) => ({
    ...(inputs.limit.source === 'band-limit' ? { bandLimitKeys: [inputs.limit.bandLimitId] } : {}),
    ...(inputs.limit.source === 'station' ? { stationIds: [inputs.limit.stationId] } : {}),
    ...(inputs.eirpCalculationId ? { calculationIds: [inputs.eirpCalculationId] } : {}),
  }),
  references: (inputs, lookup) => complianceReferences(inputs, lookup),
  run: (inputs, references) => runComplianceVerdict(inputs, references),
})
