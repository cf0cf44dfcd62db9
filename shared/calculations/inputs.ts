/**
 * Strict input pieces shared by the calculation kinds: every number a person types goes through
 * the one strict parser (shared/schemas/number-with-unit.ts), is normalised to the base unit
 * named in its key, and a number written without a unit is read in that base unit, so a stored
 * input parses again to the same value.
 */
import { z } from 'zod'
import { numberWithUnit } from '../schemas/number-with-unit'

export const FREQ_UNITS = { Hz: 1, kHz: 1e3, MHz: 1e6, GHz: 1e9 } as const
export const DISTANCE_UNITS = { m: 1, km: 1e3 } as const

export const freqHz = (label = 'the frequency') => numberWithUnit({ units: FREQ_UNITS, min: 0, minExclusive: true, max: 3e12, label, example: '433.92 MHz' })
export const distanceM = (label = 'the distance') => numberWithUnit({ units: DISTANCE_UNITS, min: 0, minExclusive: true, max: 1e8, label, example: '250 m' })
export const heightM = (label: string) => numberWithUnit({ units: { m: 1 }, min: 0, minExclusive: true, max: 1e5, label, example: '1.5' })
export const dbm = (label: string) => numberWithUnit({ units: { dBm: 1 }, min: -400, max: 400, label, example: '30 dBm' })
export const db = (label: string, min = -400, max = 400) => numberWithUnit({ units: { dB: 1 }, min, max, label, example: '3' })
export const dbi = (label: string) => numberWithUnit({ units: { dBi: 1 }, min: -100, max: 100, label, example: '6 dBi' })
export const dbuvPerM = (label: string) => numberWithUnit({ units: { 'dBµV/m': 1, dBuV_per_m: 1 }, min: -400, max: 400, label, example: '74.77 dBµV/m' })
export const dbwPerM2 = (label: string) => numberWithUnit({ units: { 'dBW/m²': 1 }, min: -400, max: 400, label, example: '-85.76' })
export const positiveDb = (label: string) => numberWithUnit({ units: { dB: 1 }, min: 0, max: 400, label, example: '1.5' })
export const plain = (label: string, min: number, max: number) => numberWithUnit({ min, max, label })

/** A short text (a citation, a contribution's name): trimmed, not empty, bounded. */
export const text = (label: string, max = 500) => z.string({ error: `Enter ${label}.` }).trim().min(1, `Enter ${label}.`).max(max, `${label} is too long.`)

/** One contribution to an uncertainty budget in dB (sensitivity 1). */
export const uncertaintyContribution = z.strictObject({
  name: text('the name of the contribution', 120),
  distribution: z.discriminatedUnion('kind', [
    z.strictObject({ kind: z.literal('normal'), expandedUncertainty: positiveDb('the expanded uncertainty'), coverageFactor: plain('the coverage factor', 0.5, 10) }),
    z.strictObject({ kind: z.literal('rectangular'), halfWidth: positiveDb('the half-width') }),
    z.strictObject({ kind: z.literal('u-shaped'), halfWidth: positiveDb('the half-width') }),
    z.strictObject({ kind: z.literal('standard'), standardUncertainty: positiveDb('the standard uncertainty') }),
  ]),
})

/** Uncertainty of a distance in metres. */
export const distanceUncertainty = z.discriminatedUnion('kind', [
  z.strictObject({ kind: z.literal('normal'), expandedUncertainty: numberWithUnit({ units: DISTANCE_UNITS, min: 0, max: 1e6, label: 'the expanded uncertainty of the distance' }), coverageFactor: plain('the coverage factor', 0.5, 10) }),
  z.strictObject({ kind: z.literal('rectangular'), halfWidth: numberWithUnit({ units: DISTANCE_UNITS, min: 0, max: 1e6, label: 'the half-width of the distance' }) }),
])

/**
 * The propagation models a calculation may name, as strict schemas of the library's serialisable
 * specs (shared/radio/propagation/model.ts). Absorbing, COST-231 and TR 38.901 are not offered yet.
 */
export const propagationModelSpec = z.discriminatedUnion('kind', [
  z.strictObject({ kind: z.literal('free-space'), freqHz: freqHz('the model frequency'), form: z.enum(['exact', 'p525-rounded']).optional() }),
  z.strictObject({
    kind: z.literal('log-distance'),
    freqHz: freqHz('the model frequency').optional(),
    refDistanceM: distanceM('the reference distance'),
    refLossDb: db('the loss at the reference distance', 0, 400).optional(),
    exponent: plain('the path-loss exponent', 0.1, 10),
    exponentChanges: z.array(z.strictObject({ fromDistanceM: distanceM('the distance of the exponent change'), exponent: plain('the path-loss exponent', 0.1, 10) })).max(10).optional(),
    shadowSigmaDb: positiveDb('the shadow-fading standard deviation').optional(),
  }),
  z.strictObject({ kind: z.literal('two-ray'), freqHz: freqHz('the model frequency'), txHeightM: heightM('the transmitter height'), rxHeightM: heightM('the receiver height'), form: z.enum(['exact', 'asymptote', 'breakpoint']).optional() }),
  z.strictObject({
    kind: z.literal('hata'),
    freqHz: freqHz('the model frequency'),
    txHeightM: heightM('the base-station antenna height'),
    rxHeightM: heightM('the mobile antenna height'),
    environment: z.enum(['urban-small-medium', 'urban-large', 'suburban', 'open']),
  }),
])
