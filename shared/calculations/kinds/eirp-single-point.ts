/**
 * `eirp_single_point`: the EIRP (and ERP) of a source from one level measured at a known
 * distance, with the GUM interval and its budget. The level is typed, or taken from a stored
 * measurement's copy (its derived field strength, pfd or isotropic power); the distance is typed,
 * or the geodesic distance from the measurement's position to a stated source position.
 */
import { z } from 'zod'
import { createPropagationModel, eirpFromMeasurement, GEODESIC_METHOD, type MethodRef, type PointMeasurement } from '../../radio'
import { dbi, dbm, dbuvPerM, dbwPerM2, distanceM, distanceUncertainty, freqHz, geoPoint, propagationModelSpec, recordId, uncertaintyContribution } from '../inputs'
import { coverageIntervalSchema, uncertaintyBudgetSchema } from './output-pieces'
import { CalculationRefused, defineKind, f2, runLibrary, toJson, type CalculationRun, type Json } from './common'
import { copyMeasurements, distanceToSourceM, exactlyOne, measurementWarnings, readMeasurements, type MeasurementCopy } from './copies'

const pointMeasurement = z.discriminatedUnion('kind', [
  z.strictObject({ kind: z.literal('field-strength'), fieldStrengthDbuvPerM: dbuvPerM('the field strength'), freqHz: freqHz('the measured frequency') }),
  z.strictObject({ kind: z.literal('pfd'), pfdDbwPerM2: dbwPerM2('the power flux-density'), freqHz: freqHz('the measured frequency') }),
  z.strictObject({ kind: z.literal('isotropic-power'), receivedPowerDbm: dbm('the isotropic received power') }),
  z.strictObject({ kind: z.literal('received-power'), receivedPowerDbm: dbm('the received power'), antennaGainDbi: dbi('the receiving antenna gain') }),
])

/** Which derived level of a stored measurement to use. */
export const MEASUREMENT_LEVELS = ['field-strength', 'pfd', 'isotropic-power'] as const

export const eirpSinglePointInputSchema = z
  .strictObject({
    /** One typed level, already corrected for the measuring chain… */
    measurement: pointMeasurement.optional(),
    /** …or a stored measurement of the case. */
    measurementId: recordId('the measurement').optional(),
    /** The measurement's level to use (default: field strength, else pfd, else isotropic power). */
    measurementLevel: z.enum(MEASUREMENT_LEVELS).optional(),
    /** The distance typed… */
    distanceM: distanceM('the distance to the source').optional(),
    /** …or the source's position (with a stored measurement: the geodesic distance between them). */
    sourcePosition: geoPoint('the source').optional(),
    model: propagationModelSpec,
    measurementContributions: z.array(uncertaintyContribution).max(30).optional(),
    distanceUncertainty: distanceUncertainty.optional(),
  })
  .superRefine((v, ctx) => {
    exactlyOne(ctx, v, ['measurement', 'measurementId'], 'Give either a typed level or a stored measurement, not both.')
    exactlyOne(ctx, v, ['distanceM', 'sourcePosition'], 'Give either the distance or the source position, not both.')
    if (v.sourcePosition && !v.measurementId) ctx.addIssue({ code: 'custom', path: ['sourcePosition'], message: 'A source position needs a stored measurement (its position); type the distance instead.' })
    if (v.measurementLevel && !v.measurementId) ctx.addIssue({ code: 'custom', path: ['measurementLevel'], message: 'Choose a measurement level only with a stored measurement.' })
  })
export type EirpSinglePointInputs = z.infer<typeof eirpSinglePointInputSchema>

/** What `outputs.value` of an `eirp_single_point` record holds. */
export const eirpSinglePointOutputSchema = z.object({
  eirpDbm: z.number(),
  eirpW: z.number(),
  erpDbm: z.number(),
  erpW: z.number(),
  isotropicReceivedPowerDbm: z.number(),
  pathLossDb: z.number(),
  distanceM: z.number(),
  /** 'typed', or 'positions' (geodesic from the measurement to the source position). */
  distanceFrom: z.enum(['typed', 'positions']).optional(),
  measurementId: z.string().optional(),
  /** The level of the measurement used, when a stored measurement gave it. */
  measurementLevel: z.enum(MEASUREMENT_LEVELS).optional(),
  expandedUncertaintyDb: z.number().optional(),
  eirpIntervalDbm: z.object({ lowDbm: z.number(), highDbm: z.number() }).optional(),
  /** ERP interval: the EIRP interval less 2.15 dB. */
  erpIntervalDbm: z.object({ lowDbm: z.number(), highDbm: z.number() }).optional(),
  /** Each contribution with its standard uncertainty and share of the combined variance. */
  budget: uncertaintyBudgetSchema.optional(),
  modelMethodId: z.string(),
})
export type EirpSinglePointOutput = z.infer<typeof eirpSinglePointOutputSchema>
export const eirpSinglePointIntervalSchema = coverageIntervalSchema

function levelOf(m: MeasurementCopy, wanted: EirpSinglePointInputs['measurementLevel']): { level: (typeof MEASUREMENT_LEVELS)[number]; measurement: PointMeasurement } {
  const d = m.derived
  const order = wanted ? [wanted] : MEASUREMENT_LEVELS
  for (const level of order) {
    if (level === 'field-strength' && d.fieldStrengthDbuvPerM !== undefined) return { level, measurement: { kind: 'field-strength', fieldStrengthDbuvPerM: d.fieldStrengthDbuvPerM, freqHz: m.freqHz } }
    if (level === 'pfd' && d.pfdDbwPerM2 !== undefined) return { level, measurement: { kind: 'pfd', pfdDbwPerM2: d.pfdDbwPerM2, freqHz: m.freqHz } }
    if (level === 'isotropic-power' && d.isotropicReceivedPowerDbm !== undefined) return { level, measurement: { kind: 'isotropic-power', receivedPowerDbm: d.isotropicReceivedPowerDbm } }
  }
  throw new CalculationRefused(wanted ? `The measurement taken ${m.takenAt} has no ${wanted} level.` : `The measurement taken ${m.takenAt} has no level to use.`)
}

function runEirpSinglePoint(inputs: EirpSinglePointInputs, references: Record<string, unknown>): CalculationRun {
  const stored = inputs.measurementId ? readMeasurements(references, [inputs.measurementId])[0]! : undefined
  const picked = stored ? levelOf(stored, inputs.measurementLevel) : undefined
  const measurement = picked?.measurement ?? (inputs.measurement as PointMeasurement)
  const fromPositions = stored !== undefined && inputs.sourcePosition !== undefined
  const d = fromPositions ? runLibrary(() => distanceToSourceM(stored, inputs.sourcePosition!)) : inputs.distanceM!
  const r = runLibrary(() =>
    eirpFromMeasurement({
      measurement,
      distanceM: d,
      model: createPropagationModel(inputs.model),
      measurementContributions: inputs.measurementContributions?.map((c) => ({ ...c, unit: 'dB' })),
      distanceUncertainty: inputs.distanceUncertainty,
    }),
  )
  const { modelMethod, ...value } = r.value
  const interval = r.interval ? ` (interval ${f2(r.interval.low)} to ${f2(r.interval.high)} dBm)` : ''
  const erpIntervalDbm = value.eirpIntervalDbm && { lowDbm: value.eirpIntervalDbm.lowDbm - (value.eirpDbm - value.erpDbm), highDbm: value.eirpIntervalDbm.highDbm - (value.eirpDbm - value.erpDbm) }
  const extra = stored ? { distanceFrom: fromPositions ? 'positions' : 'typed', measurementId: stored.id, measurementLevel: picked!.level } : {}
  const methods: MethodRef[] = [r.method, modelMethod, ...(fromPositions ? [GEODESIC_METHOD] : [])]
  return {
    outputs: { value: toJson({ ...value, ...extra, ...(erpIntervalDbm ? { erpIntervalDbm } : {}), modelMethodId: modelMethod.id }), ...(r.interval ? { interval: r.interval } : {}) },
    warnings: [...(stored ? measurementWarnings([stored]) : []), ...r.warnings],
    methods,
    summary: `EIRP ${f2(r.value.eirpDbm)} dBm${interval} from one level at ${f2(r.value.distanceM)} m, ${modelMethod.id}`,
  }
}

export const eirpSinglePointKind = defineKind({
  kind: 'eirp_single_point',
  label: 'EIRP from one measured level',
  inputSchema: eirpSinglePointInputSchema,
  outputSchema: eirpSinglePointOutputSchema,
  named: (inputs) => (inputs.measurementId ? { measurementIds: [inputs.measurementId] } : {}),
  references: (inputs, lookup): Record<string, Json> => (inputs.measurementId ? { measurements: copyMeasurements([inputs.measurementId], lookup) } : {}),
  run: (inputs, references) => runEirpSinglePoint(inputs, references),
})
