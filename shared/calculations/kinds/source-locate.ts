/**
 * `source_locate`: where a transmitter is, from levels and/or direction-finding bearings at known
 * points, by the library's weighted non-linear least squares (locateSource): the position, its
 * 95 % ellipse, the EIRP and exponent when levels are used, and the residual of every observation.
 *
 * Observations are stored measurements (their positions, isotropic received powers and bearings,
 * from the record's copies) or typed. σ is an input per kind of observation; a stored bearing
 * keeps its own σ unless one is given for all.
 */
import { z } from 'zod'
import { DIPOLE_GAIN_DBI, locateSource, type BearingObservation, type LevelObservation } from '../../radio'
import { angleDeg, db, dbm, distanceM, freqHz, latDeg, lonDeg, plain, positiveDb, recordId } from '../inputs'
import { CalculationRefused, defineKind, f2, runLibrary, toJson, type CalculationRun, type Json } from './common'
import { copyMeasurements, isotropicPowerOfDbm, measurementWarnings, readMeasurements } from './copies'
import { coverageIntervalSchema } from './output-pieces'

export const MAX_LOCATE_OBSERVATIONS = 500

const sigmaDeg = (label: string) => angleDeg(label, 0, 180).refine((x) => x > 0, `${label.charAt(0).toUpperCase()}${label.slice(1)} must be above 0.`)

export const sourceLocateInputSchema = z
  .strictObject({
    observations: z.discriminatedUnion('source', [
      z.strictObject({
        source: z.literal('measurements'),
        measurementIds: z.array(recordId('the measurement')).min(1, 'Choose at least one measurement.').max(MAX_LOCATE_OBSERVATIONS),
        /** Use the measurements' levels, their bearings, or both. */
        use: z.enum(['levels', 'bearings', 'levels-and-bearings']),
      }),
      z.strictObject({
        source: z.literal('typed'),
        levels: z.array(z.strictObject({ latDeg: latDeg(), lonDeg: lonDeg(), receivedPowerDbm: dbm('the isotropic received power') })).max(MAX_LOCATE_OBSERVATIONS).optional(),
        bearings: z.array(z.strictObject({ latDeg: latDeg(), lonDeg: lonDeg(), bearingDeg: angleDeg('the bearing', -360, 360) })).max(MAX_LOCATE_OBSERVATIONS).optional(),
      }),
    ]),
    /** σ of a level about the model (measurement and shadowing). */
    levelSigmaDb: positiveDb('the standard deviation of a level').refine((x) => x > 0, 'The standard deviation of a level must be above 0 dB.').optional(),
    /** σ of a bearing; a stored measurement's own σ is used when this is not given. */
    bearingSigmaDeg: sigmaDeg('the standard deviation of a bearing').optional(),
    /** Path loss for levels: exponent fixed (else fitted), reference distance, L(d0) or the frequency for free space at d0. */
    pathLoss: z
      .strictObject({
        exponent: plain('the path-loss exponent', 0.1, 10).optional(),
        refDistanceM: distanceM('the reference distance'),
        refLossDb: db('the loss at the reference distance', 0, 400).optional(),
        freqHz: freqHz('the frequency').optional(),
      })
      .optional(),
  })
  .superRefine((v, ctx) => {
    const o = v.observations
    const levels = o.source === 'measurements' ? o.use !== 'bearings' : (o.levels?.length ?? 0) > 0
    const bearings = o.source === 'measurements' ? o.use !== 'levels' : (o.bearings?.length ?? 0) > 0
    if (!levels && !bearings) ctx.addIssue({ code: 'custom', path: ['observations'], message: 'Enter at least one level or bearing.' })
    if (levels && v.levelSigmaDb === undefined) ctx.addIssue({ code: 'custom', path: ['levelSigmaDb'], message: 'Enter the standard deviation of a level (e.g. 6 dB).' })
    if (levels && v.pathLoss === undefined) ctx.addIssue({ code: 'custom', path: ['pathLoss'], message: 'Levels need the path loss: a reference distance, and the loss there or the frequency.' })
    if (bearings && o.source === 'typed' && v.bearingSigmaDeg === undefined) ctx.addIssue({ code: 'custom', path: ['bearingSigmaDeg'], message: 'Enter the standard deviation of a bearing (e.g. 5°).' })
    if (o.source === 'measurements' && new Set(o.measurementIds).size !== o.measurementIds.length) ctx.addIssue({ code: 'custom', path: ['observations', 'measurementIds'], message: 'A measurement is named twice.' })
  })
export type SourceLocateInputs = z.infer<typeof sourceLocateInputSchema>

const residualOf = { measurementId: z.string().nullable(), latDeg: z.number(), lonDeg: z.number() }

/** What `outputs.value` of a `source_locate` record holds; `outputs.interval` bounds the EIRP when levels were used. */
export const sourceLocateOutputSchema = z.object({
  latDeg: z.number(),
  lonDeg: z.number(),
  /** The estimate on the local plane about `origin` (the centroid of the observation points) [m]. */
  eastM: z.number(),
  northM: z.number(),
  origin: z.object({ latDeg: z.number(), lonDeg: z.number() }),
  ellipse95: z.object({ semiMajorM: z.number(), semiMinorM: z.number(), orientationDeg: z.number(), chiSquareQuantile: z.number(), coverage: z.number() }),
  eirpDbm: z.number().nullable(),
  erpDbm: z.number().nullable(),
  eirpStandardErrorDb: z.number().nullable(),
  exponent: z.number().nullable(),
  exponentStandardError: z.number().nullable(),
  exponentFitted: z.boolean(),
  levelResiduals: z.array(z.object({ ...residualOf, receivedPowerDbm: z.number(), residualDb: z.number() })),
  bearingResiduals: z.array(z.object({ ...residualOf, bearingDeg: z.number(), residualDeg: z.number() })),
  chiSquare: z.number(),
  degreesOfFreedom: z.number(),
  reducedChiSquare: z.number().nullable(),
  iterations: z.number(),
  converged: z.boolean(),
  stopReason: z.string(),
  startedFrom: z.string(),
})
export type SourceLocateOutput = z.infer<typeof sourceLocateOutputSchema>
export const sourceLocateIntervalSchema = coverageIntervalSchema

/** Normal 97.5 % quantile (NIST/SEMATECH e-Handbook §1.3.6.7.1; register 12-Z). */
const Z_975 = 1.959963984540054

function runSourceLocate(inputs: SourceLocateInputs, references: Record<string, unknown>): CalculationRun {
  const o = inputs.observations
  const warnings: string[] = []
  let levels: (LevelObservation & { id: string | null })[] = []
  let bearings: (BearingObservation & { id: string | null })[] = []
  let freq = inputs.pathLoss?.freqHz
  if (o.source === 'measurements') {
    const ms = readMeasurements(references, o.measurementIds)
    warnings.push(...measurementWarnings(ms))
    if (o.use !== 'bearings') {
      levels = runLibrary(() => ms.map((m) => ({ id: m.id, latDeg: m.latitudeDeg, lonDeg: m.longitudeDeg, receivedPowerDbm: isotropicPowerOfDbm(m), sigmaDb: inputs.levelSigmaDb! })))
      if (freq === undefined && inputs.pathLoss?.refLossDb === undefined) freq = ms[0]!.freqHz
    }
    if (o.use !== 'levels') {
      const withBearing = ms.filter((m) => m.bearingDeg !== undefined)
      if (withBearing.length === 0) throw new CalculationRefused('None of the measurements has a bearing: locate from their levels, or choose measurements with bearings.')
      const skipped = ms.length - withBearing.length
      if (skipped > 0) warnings.push(`${skipped} of the ${ms.length} measurements have no bearing: ${o.use === 'bearings' ? 'they are not used' : 'they give their level only'}.`)
      const noSigma = withBearing.filter((m) => inputs.bearingSigmaDeg === undefined && !(m.bearingSigmaDeg! > 0))
      if (noSigma.length) throw new CalculationRefused(`${noSigma.length} bearing(s) have no standard deviation: enter one for all bearings.`)
      bearings = withBearing.map((m) => ({ id: m.id, latDeg: m.latitudeDeg, lonDeg: m.longitudeDeg, bearingDeg: m.bearingDeg!, sigmaDeg: inputs.bearingSigmaDeg ?? m.bearingSigmaDeg! }))
    }
  } else {
    levels = (o.levels ?? []).map((l) => ({ ...l, id: null, sigmaDb: inputs.levelSigmaDb! }))
    bearings = (o.bearings ?? []).map((b) => ({ ...b, id: null, sigmaDeg: inputs.bearingSigmaDeg! }))
  }
  const pathLoss = levels.length ? { exponent: inputs.pathLoss?.exponent, refDistanceM: inputs.pathLoss?.refDistanceM, refLossDb: inputs.pathLoss?.refLossDb, freqHz: freq } : undefined
  const r = runLibrary(() => locateSource({ levels, bearings, pathLoss }))
  const v = r.value
  const value = {
    latDeg: v.latDeg,
    lonDeg: v.lonDeg,
    eastM: v.eastM,
    northM: v.northM,
    origin: { latDeg: v.origin.latDeg, lonDeg: v.origin.lonDeg },
    ellipse95: v.ellipse95,
    eirpDbm: v.eirpDbm ?? null,
    erpDbm: v.eirpDbm !== undefined ? v.eirpDbm - DIPOLE_GAIN_DBI : null, // ERP = EIRP − 2.15 dB (ITU RR Nos. 1.161–1.162)
    eirpStandardErrorDb: v.eirpStandardErrorDb ?? null,
    exponent: v.exponent ?? null,
    exponentStandardError: v.exponentStandardError ?? null,
    exponentFitted: v.exponentFitted,
    levelResiduals: levels.map((l, i) => ({ measurementId: l.id, latDeg: l.latDeg, lonDeg: l.lonDeg, receivedPowerDbm: l.receivedPowerDbm, residualDb: v.levelResidualsDb[i]! })),
    bearingResiduals: bearings.map((b, i) => ({ measurementId: b.id, latDeg: b.latDeg, lonDeg: b.lonDeg, bearingDeg: b.bearingDeg, residualDeg: v.bearingResidualsDeg[i]! })),
    chiSquare: v.chiSquare,
    degreesOfFreedom: v.degreesOfFreedom,
    reducedChiSquare: v.reducedChiSquare,
    iterations: v.iterations,
    converged: v.converged,
    stopReason: v.stopReason,
    startedFrom: v.startedFrom,
  } satisfies SourceLocateOutput
  const interval =
    v.eirpDbm !== undefined && v.eirpStandardErrorDb !== undefined
      ? { quantity: 'eirpDbm', low: v.eirpDbm - Z_975 * v.eirpStandardErrorDb, high: v.eirpDbm + Z_975 * v.eirpStandardErrorDb, basis: 'normal 97.5 % quantile 1.960 × standard error from (JᵀJ)⁻¹ with the stated σ (95 %)' }
      : undefined
  const e = v.ellipse95
  return {
    outputs: { value: toJson(value), ...(interval ? { interval } : {}) },
    warnings: [...warnings, ...r.warnings],
    methods: [r.method],
    summary: `Source at ${v.latDeg.toFixed(5)}, ${v.lonDeg.toFixed(5)} (95 % ellipse ${e.semiMajorM.toFixed(0)} × ${e.semiMinorM.toFixed(0)} m)${v.eirpDbm !== undefined ? `, EIRP ${f2(v.eirpDbm)} dBm` : ''} from ${levels.length} level(s) and ${bearings.length} bearing(s)`,
  }
}

export const sourceLocateKind = defineKind({
  kind: 'source_locate',
  label: 'Source position from levels and bearings',
  inputSchema: sourceLocateInputSchema,
  outputSchema: sourceLocateOutputSchema,
  named: (inputs) => (inputs.observations.source === 'measurements' ? { measurementIds: inputs.observations.measurementIds } : {}),
  references: (inputs, lookup): Record<string, Json> => (inputs.observations.source === 'measurements' ? { measurements: copyMeasurements(inputs.observations.measurementIds, lookup) } : {}),
  run: (inputs, references) => runSourceLocate(inputs, references),
})
