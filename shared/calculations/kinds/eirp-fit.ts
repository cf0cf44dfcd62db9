/**
 * `eirp_fit`: the EIRP (and ERP) of a source from several levels at known distances, by a
 * least-squares fit of the log-distance law P_r(d) = EIRP − L(d0) − 10·n·log10(d/d0), the
 * exponent n fitted with it or fixed (the library's fitEirpAndExponent / fitEirpFixedExponent).
 *
 * Readings are stored measurements (each its isotropic received power, the distance the geodesic
 * one from its position to a stated source position) or typed (distance and level).
 */
import { z } from 'zod'
import {
  DIPOLE_GAIN_DBI,
  fieldToReceivedPowerDbm,
  fitEirpAndExponent,
  fitEirpFixedExponent,
  GEODESIC_METHOD,
  studentTQuantile,
  type MethodRef,
  type ReadingAtDistance,
} from '../../radio'
import { db, dbm, dbuvPerM, distanceM, freqHz, geoPoint, plain, recordId } from '../inputs'
import { defineKind, f2, runLibrary, toJson, type CalculationRun, type Json } from './common'
import { copyMeasurements, distanceToSourceM, isotropicPowerOfDbm, measurementWarnings, readMeasurements } from './copies'
import { coverageIntervalSchema, lowHighDbm } from './output-pieces'

/** Most readings one fit takes. */
export const MAX_FIT_READINGS = 500

const typedReading = z
  .strictObject({
    distanceM: distanceM('the distance of the reading'),
    /** The isotropic received power… */
    receivedPowerDbm: dbm('the isotropic received power').optional(),
    /** …or the field strength (needs the frequency). */
    fieldStrengthDbuvPerM: dbuvPerM('the field strength').optional(),
  })
  .superRefine((v, ctx) => {
    if ((v.receivedPowerDbm === undefined) === (v.fieldStrengthDbuvPerM === undefined)) {
      ctx.addIssue({ code: 'custom', path: ['receivedPowerDbm'], message: 'Give each reading either a received power or a field strength.' })
    }
  })

export const eirpFitInputSchema = z
  .strictObject({
    readings: z.discriminatedUnion('source', [
      z.strictObject({
        source: z.literal('measurements'),
        measurementIds: z.array(recordId('the measurement')).min(1, 'Choose at least one measurement.').max(MAX_FIT_READINGS),
        /** Where the source is: each reading's distance is the geodesic distance to it. */
        sourcePosition: geoPoint('the source'),
      }),
      z.strictObject({
        source: z.literal('typed'),
        points: z.array(typedReading).min(1, 'Enter at least one reading.').max(MAX_FIT_READINGS),
      }),
    ]),
    /** Fit the exponent with the EIRP, or fix it. */
    exponent: z.discriminatedUnion('kind', [z.strictObject({ kind: z.literal('free') }), z.strictObject({ kind: z.literal('fixed'), exponent: plain('the path-loss exponent', 0.1, 10) })]),
    /** Reference distance d0: the EIRP is referred to the loss at d0. */
    refDistanceM: distanceM('the reference distance'),
    /** L(d0); free space at d0 unless given (then the frequency is needed). */
    refLossDb: db('the loss at the reference distance', 0, 400).optional(),
    /** Needed for typed field strengths and for free space at d0; stored measurements give their own. */
    freqHz: freqHz('the frequency').optional(),
  })
  .superRefine((v, ctx) => {
    if (v.readings.source === 'measurements' && new Set(v.readings.measurementIds).size !== v.readings.measurementIds.length) {
      ctx.addIssue({ code: 'custom', path: ['readings', 'measurementIds'], message: 'A measurement is named twice: each reading counts once in the fit.' })
    }
    if (v.readings.source === 'typed' && v.freqHz === undefined && (v.refLossDb === undefined || v.readings.points.some((p) => p.fieldStrengthDbuvPerM !== undefined))) {
      ctx.addIssue({ code: 'custom', path: ['freqHz'], message: 'Enter the frequency: field strengths and the free-space loss at the reference distance need it.' })
    }
  })
export type EirpFitInputs = z.infer<typeof eirpFitInputSchema>

const point = z.object({
  /** The stored measurement, or null for a typed reading. */
  measurementId: z.string().nullable(),
  distanceM: z.number(),
  /** The level fitted: isotropic received power [dBm]. */
  receivedPowerDbm: z.number(),
  /** The fitted line at this distance [dBm]. */
  fittedPowerDbm: z.number(),
  /** Observed − fitted [dB]. */
  residualDb: z.number(),
})

/** What `outputs.value` of an `eirp_fit` record holds; `outputs.interval` is the EIRP's 95 % (Student t) interval. */
export const eirpFitOutputSchema = z.object({
  eirpDbm: z.number(),
  erpDbm: z.number(),
  eirpStandardErrorDb: z.number().nullable(),
  eirpInterval95Dbm: lowHighDbm.nullable(),
  erpInterval95Dbm: lowHighDbm.nullable(),
  exponent: z.number(),
  exponentFixed: z.boolean(),
  exponentStandardError: z.number().nullable(),
  /** 95 % interval of the exponent (Student t, free fit only). */
  exponentInterval95: z.object({ low: z.number(), high: z.number() }).nullable(),
  eirpExponentCorrelation: z.number().nullable(),
  rSquared: z.number().nullable(),
  residualStandardDeviationDb: z.number().nullable(),
  degreesOfFreedom: z.number(),
  pointCount: z.number(),
  distanceSpanRatio: z.number(),
  /** Each reading with its distance, level, fitted level and residual, in input order. */
  points: z.array(point),
  /** The fitted curve: P_r(d) = eirpDbm − refLossDb − 10·exponent·log10(d / refDistanceM). */
  curve: z.object({ eirpDbm: z.number(), exponent: z.number(), refDistanceM: z.number(), refLossDb: z.number(), formula: z.string() }),
  /** The frequency used (free space at d0, field strengths), when one was. */
  freqHz: z.number().nullable(),
})
export type EirpFitOutput = z.infer<typeof eirpFitOutputSchema>
export const eirpFitIntervalSchema = coverageIntervalSchema

const CURVE_FORMULA = 'P_r(d) = EIRP − L(d0) − 10·n·log10(d/d0)'

function runEirpFit(inputs: EirpFitInputs, references: Record<string, unknown>): CalculationRun {
  const warnings: string[] = []
  const methods: MethodRef[] = []
  let readings: ReadingAtDistance[]
  let ids: (string | null)[]
  let freq = inputs.freqHz
  if (inputs.readings.source === 'measurements') {
    const ms = readMeasurements(references, inputs.readings.measurementIds)
    const source = inputs.readings.sourcePosition
    readings = runLibrary(() => ms.map((m) => ({ distanceM: distanceToSourceM(m, source), receivedPowerDbm: isotropicPowerOfDbm(m) })))
    ids = ms.map((m) => m.id)
    warnings.push(...measurementWarnings(ms))
    methods.push(GEODESIC_METHOD)
    if (freq === undefined) {
      freq = ms[0]!.freqHz
      if (ms.some((m) => Math.abs(m.freqHz - freq!) > 0.01 * freq!)) warnings.push(`The measurements are at different frequencies; the loss at the reference distance uses ${freq} Hz.`)
    }
  } else {
    readings = inputs.readings.points.map((p) => ({ distanceM: p.distanceM, receivedPowerDbm: p.receivedPowerDbm ?? fieldToReceivedPowerDbm({ fieldStrengthDbuvPerM: p.fieldStrengthDbuvPerM!, freqHz: freq! }) }))
    ids = readings.map(() => null)
  }
  const opts = { readings, refDistanceM: inputs.refDistanceM, refLossDb: inputs.refLossDb, freqHz: freq }
  const fixed = inputs.exponent.kind === 'fixed' ? inputs.exponent.exponent : undefined
  const r = runLibrary(() => (fixed === undefined ? fitEirpAndExponent(opts) : fitEirpFixedExponent({ ...opts, exponent: fixed })))
  const v = r.value
  const erp = (x: { lowDbm: number; highDbm: number } | null) => x && { lowDbm: x.lowDbm - DIPOLE_GAIN_DBI, highDbm: x.highDbm - DIPOLE_GAIN_DBI }
  const t = v.exponentStandardError !== null && v.degreesOfFreedom > 0 ? studentTQuantile({ probability: 0.975, degreesOfFreedom: v.degreesOfFreedom }) : null
  const points = readings.map((rd, i) => ({
    measurementId: ids[i] ?? null,
    distanceM: rd.distanceM,
    receivedPowerDbm: rd.receivedPowerDbm!,
    fittedPowerDbm: rd.receivedPowerDbm! - v.residualsDb[i]!,
    residualDb: v.residualsDb[i]!,
  }))
  const value = {
    eirpDbm: v.eirpDbm,
    erpDbm: v.eirpDbm - DIPOLE_GAIN_DBI, // ERP = EIRP − 2.15 dB (ITU RR Nos. 1.161–1.162)
    eirpStandardErrorDb: v.eirpStandardErrorDb,
    eirpInterval95Dbm: v.eirpInterval95Dbm,
    erpInterval95Dbm: erp(v.eirpInterval95Dbm),
    exponent: v.exponent,
    exponentFixed: v.exponentFixed,
    exponentStandardError: v.exponentStandardError,
    exponentInterval95: t !== null ? { low: v.exponent - t * v.exponentStandardError!, high: v.exponent + t * v.exponentStandardError! } : null,
    eirpExponentCorrelation: v.eirpExponentCorrelation,
    rSquared: v.rSquared,
    residualStandardDeviationDb: v.residualStandardDeviationDb,
    degreesOfFreedom: v.degreesOfFreedom,
    pointCount: v.pointCount,
    distanceSpanRatio: v.distanceSpanRatio,
    points,
    curve: { eirpDbm: v.eirpDbm, exponent: v.exponent, refDistanceM: v.refDistanceM, refLossDb: v.refLossDb, formula: CURVE_FORMULA },
    freqHz: freq ?? null,
  } satisfies EirpFitOutput
  const interval = r.interval ? ` (interval ${f2(r.interval.low)} to ${f2(r.interval.high)} dBm)` : ''
  return {
    outputs: { value: toJson(value), ...(r.interval ? { interval: r.interval } : {}) },
    warnings: [...warnings, ...r.warnings],
    methods: [r.method, ...methods],
    summary: `EIRP ${f2(v.eirpDbm)} dBm${interval}, exponent ${f2(v.exponent)}${v.exponentFixed ? ' (fixed)' : ''}, fitted to ${v.pointCount} readings`,
  }
}

export const eirpFitKind = defineKind({
  kind: 'eirp_fit',
  label: 'EIRP and path-loss exponent fitted to several levels',
  inputSchema: eirpFitInputSchema,
  outputSchema: eirpFitOutputSchema,
  named: (inputs) => (inputs.readings.source === 'measurements' ? { measurementIds: inputs.readings.measurementIds } : {}),
  references: (inputs, lookup): Record<string, Json> => (inputs.readings.source === 'measurements' ? { measurements: copyMeasurements(inputs.readings.measurementIds, lookup) } : {}),
  run: (inputs, references) => runEirpFit(inputs, references),
})
