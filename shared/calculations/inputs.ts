/**
 * Strict input pieces shared by the calculation kinds. Every number a person types goes through
 * the typed quantities (shared/schemas/quantities.ts, on the one strict parser): it may be written
 * in any unit its selector offers (a power in dBm, dBW, W or mW; a frequency in Hz…GHz; a field
 * in dBµV/m or V/m…), and is normalised to the base unit named in its key. A number written
 * without a unit is read in that base unit, so a stored input parses again to the same value.
 */
import { z } from 'zod'
import { numberWithUnit } from '../schemas/number-with-unit'
import { quantity, type QuantityKind, type QuantitySpec } from '../schemas/quantities'

/** A quantity field whose bare numbers are read in the base unit (what records store). */
const q = (kind: QuantityKind, base: string, spec: Omit<QuantitySpec, 'defaultUnit'>) => quantity(kind, { ...spec, defaultUnit: base })

export const freqHz = (label = 'the frequency') => q('frequency', 'Hz', { min: 0, minExclusive: true, max: 3e12, label, example: '433.92 MHz' })
export const bandwidthHz = (label = 'the bandwidth') => q('bandwidth', 'Hz', { min: 0, minExclusive: true, max: 3e12, label, example: '200 kHz' })
export const distanceM = (label = 'the distance') => q('distance', 'm', { min: 0, minExclusive: true, max: 1e8, label, example: '250 m' })
export const heightM = (label: string) => q('height', 'm', { min: 0, minExclusive: true, max: 1e5, label, example: '1.5' })
/** A power (EIRP, ERP, conducted, received) in dBm; typed in dBm, dBW, W or mW. */
export const dbm = (label: string) => q('power', 'dBm', { min: -400, max: 400, label, example: '30 dBm' })
export const db = (label: string, min = -400, max = 400) => q('loss', 'dB', { min, max, label, example: '3' })
export const dbi = (label: string) => q('gain', 'dBi', { min: -100, max: 100, label, example: '6 dBi' })
export const dbuvPerM = (label: string) => q('fieldStrength', 'dBµV/m', { min: -400, max: 400, label, example: '74.77 dBµV/m' })
export const dbwPerM2 = (label: string) => q('pfd', 'dBW/m²', { min: -400, max: 400, label, example: '-85.76' })
export const positiveDb = (label: string) => q('loss', 'dB', { min: 0, max: 400, label, example: '1.5' })
export const dbPerKm = (label: string) => q('specificAttenuation', 'dB/km', { min: 0, max: 1e4, label, example: '15 dB/km' })
export const angleDeg = (label: string, min: number, max: number) => q('angle', '°', { min, max, label, example: '45' })
export const latDeg = (label = 'the latitude') => angleDeg(label, -90, 90)
export const lonDeg = (label = 'the longitude') => angleDeg(label, -180, 180)
export const plain = (label: string, min: number, max: number) => numberWithUnit({ min, max, label })

/** A point on the earth (WGS84 degrees). */
export const geoPoint = (what: string) => z.strictObject({ latDeg: latDeg(`the latitude of ${what}`), lonDeg: lonDeg(`the longitude of ${what}`) })

/** An id of a stored record (a measurement, a station, a calculation). */
export const recordId = (label: string) => z.uuid({ error: `${label.charAt(0).toUpperCase()}${label.slice(1)} is not a valid id.` })

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
  z.strictObject({ kind: z.literal('normal'), expandedUncertainty: q('distance', 'm', { min: 0, max: 1e6, label: 'the expanded uncertainty of the distance' }), coverageFactor: plain('the coverage factor', 0.5, 10) }),
  z.strictObject({ kind: z.literal('rectangular'), halfWidth: q('distance', 'm', { min: 0, max: 1e6, label: 'the half-width of the distance' }) }),
])

const baseModels = [
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
  z.strictObject({
    kind: z.literal('cost231-hata'),
    freqHz: freqHz('the model frequency'),
    txHeightM: heightM('the base-station antenna height'),
    rxHeightM: heightM('the mobile antenna height'),
    /** C_m by name (0 dB medium city or suburban, 3 dB metropolitan centre), or as a number. */
    environment: z.enum(['medium-city', 'metropolitan']).optional(),
    cityCorrectionDb: db('the city correction C_m', -50, 50).optional(),
  }),
  z.strictObject({
    kind: z.literal('tr38901'),
    freqHz: freqHz('the model frequency'),
    scenario: z.enum(['RMa', 'UMa', 'UMi-street-canyon', 'InH-office']),
    condition: z.enum(['LOS', 'NLOS']),
    txHeightM: heightM('the base-station antenna height'),
    rxHeightM: heightM('the user-terminal antenna height'),
    buildingHeightM: heightM('the average building height').optional(),
    streetWidthM: heightM('the street width').optional(),
  }),
] as const

/** Every model but absorbing: what absorption can be added to. */
export const basePropagationModelSpec = z.discriminatedUnion('kind', [...baseModels])

/**
 * The propagation models a calculation may name: strict schemas of the library's serialisable
 * specs (shared/radio/propagation/model.ts), every model createPropagationModel builds. TR 38.901
 * works on the 3D distance from the antenna heights; absorbing adds a specific attenuation (dB/km,
 * or a field coefficient α in 1/km) to a base model.
 */
export const propagationModelSpec = z.discriminatedUnion('kind', [
  ...baseModels,
  z.strictObject({
    kind: z.literal('absorbing'),
    base: basePropagationModelSpec,
    absorptionDbPerKm: dbPerKm('the specific attenuation').optional(),
    fieldAttenuationPerKm: plain('the field attenuation coefficient (1/km)', 0, 1e4).optional(),
  }),
])
export type PropagationModelInput = z.infer<typeof propagationModelSpec>
