/**
 * The band-limit list's contract: what a limit holds, and the edit a supervisor or an
 * administrator sends (PATCH /api/band-limits/:id). Every number goes through the strict
 * number parser with its unit: frequencies in Hz, kHz, MHz or GHz (stored in Hz), powers and
 * densities in dBm, gains in dBi, reduction rates in dB per dB.
 */
import { z } from 'zod'
import type { LimitSpec } from '../radio/compliance/limit-spec'
import { numberWithUnit } from './number-with-unit'
import { storableString } from './text'

/** A frequency range, inclusive edges [Hz]. */
export interface FrequencyBandHz {
  lowHz: number
  highHz: number
}

/** What an entry of the list says (everything but its identity, version and last change). */
export interface BandLimitContent {
  title: string
  bandsHz: FrequencyBandHz[]
  spec: LimitSpec
  citation: string
  /** False for a value recalled but not checked against the regulation's text (the library's [M]). */
  verified: boolean
  statusNote: string
  conditions: string | null
}

export const BAND_LIMIT_FIELDS = ['title', 'bandsHz', 'spec', 'citation', 'verified', 'statusNote', 'conditions'] as const satisfies readonly (keyof BandLimitContent)[]
export type BandLimitField = (typeof BAND_LIMIT_FIELDS)[number]

/** How the history and the form name each field. */
export const BAND_LIMIT_FIELD_LABELS: Record<BandLimitField, string> = {
  title: 'Title',
  bandsHz: 'Frequency ranges',
  spec: 'Limit',
  citation: 'Citation',
  verified: 'Verified',
  statusNote: 'Verification note',
  conditions: 'Conditions',
}

export const FREQUENCY_UNITS = { Hz: 1, kHz: 1e3, MHz: 1e6, GHz: 1e9 } as const
export const POWER_UNITS = { dBm: 1 } as const
export const GAIN_UNITS = { dBi: 1 } as const
export const RATE_UNITS = { 'dB/dB': 1 } as const

/** Highest frequency the list may hold: 3 THz, the top of the radio spectrum. */
export const MAX_FREQUENCY_HZ = 3e12

const frequencyHz = (label: string) =>
  numberWithUnit({ units: FREQUENCY_UNITS, defaultUnit: 'Hz', min: 0, minExclusive: true, max: MAX_FREQUENCY_HZ, label, example: '2400 MHz', minExclusiveMessage: `Enter ${label} above 0 Hz.`, rangeMessage: `Enter ${label} from above 0 Hz up to 3000 GHz.` })
const powerDbm = (label: string) => numberWithUnit({ units: POWER_UNITS, defaultUnit: 'dBm', min: -150, max: 120, label, example: '20 dBm' })
const gainDbi = numberWithUnit({ units: GAIN_UNITS, defaultUnit: 'dBi', min: -30, max: 80, label: 'the gain threshold', example: '6 dBi' })
const rateDbPerDb = numberWithUnit({ units: RATE_UNITS, defaultUnit: 'dB/dB', min: 0, max: 10, label: 'the reduction per dB of gain', example: '1' })
const referenceBandwidthHz = frequencyHz('the reference bandwidth')

const requiredText = (what: string, max: number) =>
  storableString()
    .trim()
    .min(1, { message: `Enter ${what}.` })
    .max(max, { message: `Keep ${what} to ${max} characters.` })
const ruleCitation = requiredText('the rule’s citation', 500).optional()

const conductedGainRule = z.discriminatedUnion('kind', [
  z.strictObject({ kind: z.literal('no-reduction'), citation: ruleCitation }),
  z.strictObject({ kind: z.literal('reduce-conducted-above'), thresholdGainDbi: gainDbi, reductionDbPerDb: rateDbPerDb, citation: ruleCitation }),
])
const eirpGainRule = z.strictObject({ kind: z.literal('reduce-eirp-below'), thresholdGainDbi: gainDbi, reductionDbPerDb: rateDbPerDb, citation: ruleCitation })

/** One limit as written (every kind but lesser-of). */
const SINGLE_LIMIT_OPTIONS = [
  z.strictObject({ kind: z.literal('eirp'), eirpDbm: powerDbm('the EIRP'), gainRule: eirpGainRule.optional() }),
  z.strictObject({ kind: z.literal('erp'), erpDbm: powerDbm('the ERP') }),
  z.strictObject({ kind: z.literal('eirp-density'), eirpDensityDbm: powerDbm('the EIRP density'), referenceBandwidthHz }),
  z.strictObject({ kind: z.literal('conducted'), conductedPowerDbm: powerDbm('the conducted power'), gainRule: conductedGainRule }),
  z.strictObject({ kind: z.literal('conducted-density'), conductedDensityDbm: powerDbm('the conducted density'), referenceBandwidthHz, gainRule: conductedGainRule }),
] as const
const singleLimitSpec = z.discriminatedUnion('kind', [...SINGLE_LIMIT_OPTIONS]).meta({ id: 'SingleLimitSpecInput' })

/** A limit as the library writes it: one limit, or the lesser of several single limits. */
export const limitSpecInputSchema = z.discriminatedUnion('kind', [
  ...SINGLE_LIMIT_OPTIONS,
  z.strictObject({
    kind: z.literal('lesser-of'),
    limits: z.array(singleLimitSpec).min(2, { message: 'A “lesser of” limit needs at least two limits.' }).max(8),
  }),
]).meta({ id: 'LimitSpecInput', description: 'A limit as an editor sends it: levels as numbers in dBm or as text with a unit.' })

export const frequencyBandsInputSchema = z
  .array(z.strictObject({ lowHz: frequencyHz('the lower edge'), highHz: frequencyHz('the upper edge') }))
  .min(1, { message: 'Give at least one frequency range.' })
  .max(16)
  .superRefine((bands, ctx) => {
    bands.forEach((b, i) => {
      if (b.highHz <= b.lowHz) ctx.addIssue({ code: 'custom', path: [i, 'highHz'], message: 'The upper edge must be above the lower edge.' })
    })
  })

/** The fields an edit may change; at least one. */
export const bandLimitChangesSchema = z
  .strictObject({
    title: requiredText('a title', 200).optional(),
    bandsHz: frequencyBandsInputSchema.optional(),
    spec: limitSpecInputSchema.optional(),
    citation: requiredText('the citation', 1000).optional(),
    verified: z.boolean({ message: 'Say whether the value is verified (true or false).' }).optional(),
    statusNote: requiredText('what is verified and what is not', 1000).optional(),
    /** Empty text clears the conditions. */
    conditions: storableString()
      .trim()
      .max(1000, { message: 'Keep the conditions to 1000 characters.' })
      .nullable()
      .optional()
      .transform((c) => (c === '' ? null : c)),
  })
  .refine((c) => Object.values(c).some((v) => v !== undefined), { message: 'Change at least one field.' })

/** PATCH /api/band-limits/:id: the changes, why, and the version they were made on. */
export const bandLimitPatchSchema = z.strictObject({
  changes: bandLimitChangesSchema,
  reason: requiredText('why the limit changes', 1000),
  /** The version the editor saw; a newer one on the server is 409 stale_version. */
  version: z.number({ message: 'Send the version you edited.' }).int().min(1),
})
export type BandLimitPatchInput = z.input<typeof bandLimitPatchSchema>
export type BandLimitPatch = z.output<typeof bandLimitPatchSchema>
export type BandLimitChanges = BandLimitPatch['changes']
