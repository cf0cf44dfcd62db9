/**
 * `exposure_screening`: a worst-case far-field RF exposure screening (the library's screenExposure
 * against ICNIRP (2020) reference levels) at each measurement position or typed distance: the
 * power density, the reference level, the fraction of it and the caution, and the distance at
 * which the level is reached. The output carries the library's SCREENING_NOTICE: these are
 * screening values, and local codes govern.
 */
import { z } from 'zod'
import { exposureComplianceDistanceM, GEODESIC_METHOD, screenExposure, SCREENING_NOTICE, type ExposureCaution, type MethodRef } from '../../radio'
import { dbm, distanceM, freqHz, geoPoint, plain, recordId } from '../inputs'
import { defineKind, f2, runLibrary, toJson, type CalculationRun, type Json } from './common'
import { copyCalculation, copyMeasurements, distanceToSourceM, exactlyOne, measurementWarnings, readCalculation, readMeasurements } from './copies'

export const MAX_EXPOSURE_POINTS = 200

export const exposureScreeningInputSchema = z
  .strictObject({
    /** The source's EIRP (time-averaged, toward the points) typed… */
    eirpDbm: dbm('the EIRP').optional(),
    /** …or from a stored calculation of the case (its central value). */
    eirpCalculationId: recordId('the calculation').optional(),
    freqHz: freqHz('the frequency'),
    population: z.enum(['general-public', 'occupational']),
    averaging: z.enum(['whole-body-30min', 'local-6min']).optional(),
    /** Multiply the power density by 2.56 for a ground reflection adding in phase. */
    groundReflection: z.boolean(),
    /** Fraction of the averaging time the transmitter is on, 0 < δ ≤ 1; omitted: 1 (continuous). */
    dutyCycle: plain('the duty cycle', 0, 1).refine((x) => x > 0, 'The duty cycle must be above 0.').optional(),
    /** Where: at stored measurements' positions (with the source position), or at typed distances. */
    points: z.discriminatedUnion('source', [
      z.strictObject({ source: z.literal('measurements'), measurementIds: z.array(recordId('the measurement')).min(1, 'Choose at least one measurement.').max(MAX_EXPOSURE_POINTS), sourcePosition: geoPoint('the source') }),
      z.strictObject({ source: z.literal('typed'), distancesM: z.array(distanceM('the distance from the antenna')).min(1, 'Enter at least one distance.').max(MAX_EXPOSURE_POINTS) }),
    ]),
  })
  .superRefine((v, ctx) => exactlyOne(ctx, v, ['eirpDbm', 'eirpCalculationId'], 'Give either the EIRP or a stored calculation that gives it, not both.'))
export type ExposureScreeningInputs = z.infer<typeof exposureScreeningInputSchema>

const CAUTIONS = ['none', 'approaching', 'above'] as const satisfies readonly ExposureCaution[]

/** What `outputs.value` of an `exposure_screening` record holds. */
export const exposureScreeningOutputSchema = z.object({
  /** The library's notice: show it beside the results. */
  notice: z.string(),
  eirpDbm: z.number(),
  eirpFrom: z.enum(['typed', 'calculation']),
  freqHz: z.number(),
  referenceLevelWPerM2: z.number(),
  /** The reference level's basis and the table row it comes from, as written. */
  referenceLevelBasis: z.string(),
  referenceLevelFormula: z.string(),
  referenceLevelStatus: z.string(),
  /** Distance at which the reference level is reached under the same assumptions [m]. */
  complianceDistanceM: z.number(),
  /** The worst caution over the points. */
  worstCaution: z.enum(CAUTIONS),
  points: z.array(
    z.object({
      measurementId: z.string().nullable(),
      distanceM: z.number(),
      powerDensityWPerM2: z.number(),
      referenceLevelWPerM2: z.number(),
      fractionOfLevel: z.number(),
      caution: z.enum(CAUTIONS),
      cautionText: z.string().nullable(),
    }),
  ),
})
export type ExposureScreeningOutput = z.infer<typeof exposureScreeningOutputSchema>

function runExposureScreening(inputs: ExposureScreeningInputs, references: Record<string, unknown>): CalculationRun {
  const fromCalc = inputs.eirpCalculationId ? readCalculation(references, 'eirpCalculation') : undefined
  const eirpDbm = fromCalc ? fromCalc.eirpDbm : inputs.eirpDbm!
  const warnings: string[] = []
  const methods: MethodRef[] = []
  let at: { id: string | null; distanceM: number }[]
  if (inputs.points.source === 'measurements') {
    const ms = readMeasurements(references, inputs.points.measurementIds)
    const source = inputs.points.sourcePosition
    at = runLibrary(() => ms.map((m) => ({ id: m.id, distanceM: distanceToSourceM(m, source) })))
    warnings.push(...measurementWarnings(ms))
    methods.push(GEODESIC_METHOD)
  } else {
    at = inputs.points.distancesM.map((d) => ({ id: null, distanceM: d }))
  }
  if (fromCalc?.eirpIntervalDbm) warnings.push(`The EIRP is the stored estimate's central value; its 95 % interval reaches ${f2(fromCalc.eirpIntervalDbm.highDbm)} dBm.`)
  const source = { eirpDbm, freqHz: inputs.freqHz, population: inputs.population, averaging: inputs.averaging, groundReflection: inputs.groundReflection, dutyCycle: inputs.dutyCycle }
  const overall = runLibrary(() => exposureComplianceDistanceM(source))
  const each = runLibrary(() => at.map((p) => screenExposure({ ...source, distanceM: p.distanceM })))
  const points = each.map((r, i) => ({
    measurementId: at[i]!.id,
    distanceM: at[i]!.distanceM,
    powerDensityWPerM2: r.value.powerDensityWPerM2,
    referenceLevelWPerM2: r.value.referenceLevelWPerM2,
    fractionOfLevel: r.value.fractionOfLevel,
    caution: r.value.caution,
    cautionText: r.value.cautionText,
  }))
  const worstCaution = CAUTIONS[Math.max(...points.map((p) => CAUTIONS.indexOf(p.caution)))]!
  const level = each[0]!.value.referenceLevel
  const value = {
    notice: SCREENING_NOTICE,
    eirpDbm,
    eirpFrom: fromCalc ? 'calculation' : 'typed',
    freqHz: inputs.freqHz,
    referenceLevelWPerM2: overall.value.referenceLevelWPerM2,
    referenceLevelBasis: level.basis,
    referenceLevelFormula: level.row.formula,
    referenceLevelStatus: level.row.status,
    complianceDistanceM: overall.value.complianceDistanceM,
    worstCaution,
    points,
  } satisfies ExposureScreeningOutput
  const allWarnings = [...new Set([...warnings, ...overall.warnings, ...each.flatMap((r) => r.warnings)])]
  return {
    outputs: { value: toJson(value) },
    warnings: allWarnings,
    methods: [overall.method, ...methods],
    summary: `Exposure screening at ${points.length} point(s): worst ${worstCaution === 'none' ? 'below the caution threshold' : worstCaution === 'above' ? 'above the reference level' : 'approaching the reference level'}; reference level reached at ${f2(value.complianceDistanceM)} m (screening values only)`,
  }
}

export const exposureScreeningKind = defineKind({
  kind: 'exposure_screening',
  label: 'RF exposure screening',
  inputSchema: exposureScreeningInputSchema,
  outputSchema: exposureScreeningOutputSchema,
  named: (inputs) => ({
    ...(inputs.points.source === 'measurements' ? { measurementIds: inputs.points.measurementIds } : {}),
    ...(inputs.eirpCalculationId ? { calculationIds: [inputs.eirpCalculationId] } : {}),
  }),
  references: (inputs, lookup): Record<string, Json> => ({
    ...(inputs.points.source === 'measurements' ? { measurements: copyMeasurements(inputs.points.measurementIds, lookup) } : {}),
    ...(inputs.eirpCalculationId ? { eirpCalculation: copyCalculation(inputs.eirpCalculationId, lookup) } : {}),
  }),
  run: (inputs, references) => runExposureScreening(inputs, references),
})
