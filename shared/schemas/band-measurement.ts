/**
 * A band of a processed spectrum trace kept as a measurement of the case
 * (POST /api/evidence/:id/band-measurement). The client sends the band's edges and when and
 * where the file was recorded (which a trace does not hold); the server computes the channel
 * power itself from the stored trace and stores it as the reading. Keys the route does not read
 * (a level, a centre frequency, a method a page might send) are dropped by the parse and never
 * reach the service: the stored level is always the server's own.
 */
import { z } from 'zod'
import { measurementContentSchema, measurementViewSchema } from './measurements'
import { bandRequestSchema, evidenceBandViewSchema } from './spectrum'
import { storableString } from './text'

/** Room left in the measurement's notes for the server's own line on how the level was computed. */
export const BAND_MEASUREMENT_NOTES_MAX = 2000

export const bandMeasurementRequestSchema = z
  .object({
    // the band's edges as the band route reads them (a number of hertz, or text with its unit)
    lowFreqHz: bandRequestSchema.shape.lowFreqHz,
    highFreqHz: bandRequestSchema.shape.highFreqHz,
    // when and where, as the measurement form reads them (strict parser, units checked)
    takenAt: measurementContentSchema.shape.takenAt,
    latDeg: measurementContentSchema.shape.latDeg,
    lonDeg: measurementContentSchema.shape.lonDeg,
    notes: storableString()
      .trim()
      .max(BAND_MEASUREMENT_NOTES_MAX, { message: `Keep the notes to ${BAND_MEASUREMENT_NOTES_MAX} characters.` })
      .nullable()
      .optional()
      .transform((s) => (s === '' || s === undefined ? null : s)),
  })
  .superRefine((b, ctx) => {
    if (typeof b.lowFreqHz === 'number' && typeof b.highFreqHz === 'number' && !(b.highFreqHz > b.lowFreqHz)) {
      ctx.addIssue({ code: 'custom', path: ['highFreqHz'], message: 'The high edge of the band must be above its low edge.' })
    }
  })
export type BandMeasurementRequestInput = z.input<typeof bandMeasurementRequestSchema>
export type BandMeasurementRequest = z.output<typeof bandMeasurementRequestSchema>

/** The stored measurement and the band it was computed from (the same numbers). */
export const bandMeasurementResponseSchema = z.object({ measurement: measurementViewSchema, band: evidenceBandViewSchema })
export type BandMeasurementResponse = z.infer<typeof bandMeasurementResponseSchema>
