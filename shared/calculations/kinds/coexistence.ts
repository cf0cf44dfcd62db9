/**
 * `coexistence`: an interferer's effect at a victim receiver (the library's assessCoexistence):
 * I/N, desensitisation, the margin against an I/N criterion, the EIRP reduction that would meet
 * it and the separation distance at which it is met. The interferer's EIRP is typed or taken from
 * a stored calculation of the case; the distance is typed or the geodesic distance between the
 * victim's and the source's positions.
 */
import { z } from 'zod'
import { assessCoexistence, createPropagationModel, GEODESIC_METHOD, geodesicInverse, PROTECTION_CRITERIA, type MethodRef, type ProtectionCriterionId } from '../../radio'
import { bandwidthHz, db, dbi, dbm, distanceM, geoPoint, positiveDb, propagationModelSpec, recordId, text } from '../inputs'
import { CalculationRefused, defineKind, f2, runLibrary, toJson, type CalculationRun, type Json } from './common'
import { copyCalculation, exactlyOne, readCalculation } from './copies'

const CRITERION_IDS = Object.keys(PROTECTION_CRITERIA) as [ProtectionCriterionId, ...ProtectionCriterionId[]]

export const coexistenceInputSchema = z
  .strictObject({
    /** The interferer's EIRP typed… */
    interfererEirpDbm: dbm("the interferer's EIRP").optional(),
    /** …or from a stored calculation of the case. */
    eirpCalculationId: recordId('the calculation').optional(),
    /** The distance typed… */
    distanceM: distanceM('the distance from the interferer to the victim').optional(),
    /** …or both positions (geodesic distance). */
    victimPosition: geoPoint('the victim receiver').optional(),
    sourcePosition: geoPoint('the interferer').optional(),
    model: propagationModelSpec,
    victimAntennaGainDbi: dbi("the victim antenna's gain toward the interferer").optional(),
    victimFeederLossDb: positiveDb("the victim's feeder loss").optional(),
    /** Part of the interferer's power in the victim's channel: by bandwidths, or as a loss. Omitted: all of it. */
    bandwidthOverlap: z
      .discriminatedUnion('kind', [
        z.strictObject({ kind: z.literal('bandwidths'), overlapBandwidthHz: bandwidthHz('the overlapping bandwidth'), interfererBandwidthHz: bandwidthHz("the interferer's bandwidth") }),
        z.strictObject({ kind: z.literal('loss'), overlapLossDb: positiveDb('the bandwidth-overlap loss') }),
      ])
      .optional(),
    frequencyDependentRejectionDb: positiveDb('the frequency-dependent rejection').optional(),
    /** The victim's noise: from its bandwidth and noise figure (kTB + NF), or a noise power. */
    victimNoise: z.discriminatedUnion('kind', [
      z.strictObject({ kind: z.literal('noise-figure'), bandwidthHz: bandwidthHz("the victim's noise bandwidth"), noiseFigureDb: positiveDb("the victim's noise figure") }),
      z.strictObject({ kind: z.literal('noise-power'), noiseDbm: dbm("the victim's noise power") }),
    ]),
    /** The protection criterion: one of the library's named criteria, or an I/N value. */
    criterion: z.discriminatedUnion('kind', [
      z.strictObject({ kind: z.literal('named'), id: z.enum(CRITERION_IDS) }),
      z.strictObject({ kind: z.literal('inr'), inrDb: db('the I/N criterion', -100, 100), description: text('the description of the criterion', 300).optional() }),
    ]),
  })
  .superRefine((v, ctx) => {
    exactlyOne(ctx, v, ['interfererEirpDbm', 'eirpCalculationId'], "Give either the interferer's EIRP or a stored calculation that gives it, not both.")
    const byPositions = v.victimPosition !== undefined || v.sourcePosition !== undefined
    if ((v.distanceM === undefined) === !byPositions) ctx.addIssue({ code: 'custom', path: ['distanceM'], message: 'Give either the distance or both positions, not both.' })
    if (byPositions && (v.victimPosition === undefined || v.sourcePosition === undefined)) ctx.addIssue({ code: 'custom', path: [v.victimPosition ? 'sourcePosition' : 'victimPosition'], message: 'Give both positions, the victim’s and the interferer’s.' })
  })
export type CoexistenceInputs = z.infer<typeof coexistenceInputSchema>

/** What `outputs.value` of a `coexistence` record holds. */
export const coexistenceOutputSchema = z.object({
  interfererEirpDbm: z.number(),
  distanceM: z.number(),
  distanceFrom: z.enum(['typed', 'positions']),
  eirpFrom: z.enum(['typed', 'calculation']),
  interferenceDbm: z.number(),
  noiseDbm: z.number(),
  inrDb: z.number(),
  desensitisationDb: z.number(),
  criterionInrDb: z.number(),
  criterionDescription: z.string(),
  /** I/N minus the criterion [dB]; positive = criterion exceeded. */
  marginDb: z.number(),
  meetsCriterion: z.boolean(),
  eirpReductionDb: z.number(),
  maxEirpDbm: z.number(),
  requiredPathLossDb: z.number(),
  separationDistanceM: z.number(),
  modelMethodId: z.string(),
})
export type CoexistenceOutput = z.infer<typeof coexistenceOutputSchema>

function runCoexistence(inputs: CoexistenceInputs, references: Record<string, unknown>): CalculationRun {
  const fromCalc = inputs.eirpCalculationId ? readCalculation(references, 'eirpCalculation') : undefined
  const eirpDbm = fromCalc ? fromCalc.eirpDbm : inputs.interfererEirpDbm!
  const methods: MethodRef[] = []
  let d = inputs.distanceM
  if (d === undefined) {
    d = runLibrary(() => geodesicInverse({ from: inputs.sourcePosition!, to: inputs.victimPosition! }).distanceM)
    if (!(d > 0)) throw new CalculationRefused('The victim and the interferer are at the same position: the distance is zero.')
    methods.push(GEODESIC_METHOD)
  }
  const model = runLibrary(() => createPropagationModel(inputs.model))
  const o = inputs.bandwidthOverlap
  const n = inputs.victimNoise
  const c = inputs.criterion
  const distance = d
  const r = runLibrary(() =>
    assessCoexistence({
      interfererEirpDbm: eirpDbm,
      model,
      distanceM: distance,
      victimAntennaGainDbi: inputs.victimAntennaGainDbi,
      victimFeederLossDb: inputs.victimFeederLossDb,
      bandwidthOverlap: o === undefined ? undefined : o.kind === 'loss' ? { overlapLossDb: o.overlapLossDb } : { overlapBandwidthHz: o.overlapBandwidthHz, interfererBandwidthHz: o.interfererBandwidthHz },
      frequencyDependentRejectionDb: inputs.frequencyDependentRejectionDb,
      victimNoise: n.kind === 'noise-power' ? { noiseDbm: n.noiseDbm } : { bandwidthHz: n.bandwidthHz, noiseFigureDb: n.noiseFigureDb },
      criterion: c.kind === 'named' ? c.id : { inrDb: c.inrDb, ...(c.description ? { description: c.description } : {}) },
    }),
  )
  const v = r.value
  const value = {
    interfererEirpDbm: eirpDbm,
    distanceM: distance,
    distanceFrom: inputs.distanceM === undefined ? 'positions' : 'typed',
    eirpFrom: fromCalc ? 'calculation' : 'typed',
    ...v,
    modelMethodId: model.method.id,
  } satisfies CoexistenceOutput
  return {
    outputs: { value: toJson(value) },
    warnings: [
      ...(fromCalc?.eirpIntervalDbm ? [`The interferer's EIRP is the stored estimate's central value; its 95 % interval reaches ${f2(fromCalc.eirpIntervalDbm.highDbm)} dBm.`] : []),
      ...r.warnings,
    ],
    methods: [r.method, model.method, ...methods],
    summary: `I/N ${f2(v.inrDb)} dB at ${f2(distance)} m against ${f2(v.criterionInrDb)} dB: ${v.meetsCriterion ? 'criterion met' : `${f2(v.eirpReductionDb)} dB EIRP reduction needed`}; separation ${f2(v.separationDistanceM)} m`,
  }
}

export const coexistenceKind = defineKind({
  kind: 'coexistence',
  label: 'Interference at a victim receiver (I/N)',
  inputSchema: coexistenceInputSchema,
  outputSchema: coexistenceOutputSchema,
  named: (inputs) => (inputs.eirpCalculationId ? { calculationIds: [inputs.eirpCalculationId] } : {}),
  references: (inputs, lookup): Record<string, Json> => (inputs.eirpCalculationId ? { eirpCalculation: copyCalculation(inputs.eirpCalculationId, lookup) } : {}),
  run: (inputs, references) => runCoexistence(inputs, references),
})
