/**
 * An office's settings beyond its targets (those are responseTargetsSchema in ./auth): its time
 * zone, an IANA name the platform's time-zone data knows (checked with Intl.DateTimeFormat, in
 * the browser and on the server alike) and stored in its canonical spelling.
 */
import { z } from 'zod'
import { selfCrossingMessage, selfCrossings } from '../domain/office-areas'
import { areaSchema, type AreaGeometry } from './region'
import { storableString } from './text'
import { officeViewSchema } from './views'

/** The shape the database's CHECK accepts (offices_time_zone_shape): "Area/Place", "UTC". */
const ZONE_SHAPE = /^[A-Za-z_]+(\/[A-Za-z0-9_+-]+)*$/

/** The canonical IANA name of a time zone, or null when the platform does not know it. */
export function canonicalTimeZone(name: string): string | null {
  try {
    const canonical = new Intl.DateTimeFormat('en-GB', { timeZone: name }).resolvedOptions().timeZone
    return ZONE_SHAPE.test(canonical) ? canonical : null
  } catch {
    return null
  }
}

export const officeTimeZoneSchema = z.object({
  timeZone: z
    .string({ message: 'Choose a time zone.' })
    .trim()
    .min(1, { message: 'Choose a time zone.' })
    .max(64)
    .transform((v, ctx) => {
      const canonical = canonicalTimeZone(v)
      if (!canonical) {
        ctx.addIssue({ code: 'custom', message: 'Choose a time zone from the list (a name such as Atlantic/Azores).' })
        return z.NEVER
      }
      return canonical
    }),
})
export type OfficeTimeZone = z.infer<typeof officeTimeZoneSchema>

const timeZoneField = officeTimeZoneSchema.shape.timeZone

/** Corners an office area may have, all rings together (a coastline simplified to ~100 m needs far fewer). */
export const MAX_AREA_CORNERS = 2000
const cornerCount = (area: AreaGeometry) => (area.type === 'Polygon' ? area.coordinates.flat().length : area.coordinates.flat(2).length)

/** An office's area as the editor sends it: a GeoJSON Polygon or MultiPolygon whose outline does not cross itself. */
export const officeAreaSchema = areaSchema.superRefine((area, ctx) => {
  // the crossing check grows faster than the corners: a bound keeps one request from holding the server
  if (cornerCount(area) > MAX_AREA_CORNERS) {
    ctx.addIssue({ code: 'custom', message: `An office area has at most ${MAX_AREA_CORNERS.toLocaleString('en-GB')} corners; simplify the outline (e.g. to about 100 m) and try again.` })
    return
  }
  const crossings = selfCrossings(area)
  if (crossings.length > 0) ctx.addIssue({ code: 'custom', message: selfCrossingMessage(crossings) })
})

/** A new office, or all of an office's details at once (PUT replaces them). */
export const officeInputSchema = z.object({
  name: storableString().trim().min(1, { message: 'Give the office a name.' }).max(80),
  /** What the area is called, e.g. "Vellmark Coast — north"; may be empty. */
  regionName: storableString().trim().max(120).default(''),
  /** Postal address of the office; may be empty. */
  address: storableString().trim().max(300).default(''),
  latDeg: z.number({ message: 'Give the latitude in decimal degrees.' }).min(-90, { message: 'Latitude is between −90 and 90°.' }).max(90, { message: 'Latitude is between −90 and 90°.' }),
  lonDeg: z.number({ message: 'Give the longitude in decimal degrees.' }).min(-180, { message: 'Longitude is between −180 and 180°.' }).max(180, { message: 'Longitude is between −180 and 180°.' }),
  timeZone: timeZoneField,
  /** None: reports are routed to this office only when it is the nearest and the place is in no area. */
  area: officeAreaSchema.nullable(),
})
export type OfficeInput = z.infer<typeof officeInputSchema>

/** An edit: the details plus the version the editor read (409 stale_version when someone saved since). */
export const officeUpdateSchema = officeInputSchema.extend({ version: z.number().int().min(1) })
export type OfficeUpdate = z.infer<typeof officeUpdateSchema>

/** A check of an area before saving: its size and what it overlaps. */
export const areaCheckRequestSchema = z.object({
  area: officeAreaSchema,
  latDeg: z.number().min(-90).max(90).optional(),
  lonDeg: z.number().min(-180).max(180).optional(),
  /** The office being edited (its own saved area is not an overlap). */
  officeId: z.uuid().optional(),
})
export type AreaCheckRequest = z.infer<typeof areaCheckRequestSchema>

export const AREA_WARNING_CODES = ['area_overlaps', 'position_outside_area'] as const
/** Saved all the same, but worth a look: an overlap (says which report goes where) or a position outside the area. */
export const areaWarningSchema = z.object({
  code: z.enum(AREA_WARNING_CODES),
  message: z.string(),
  otherOfficeId: z.uuid().optional(),
  otherOfficeName: z.string().optional(),
  overlapKm2: z.number().optional(),
})
export type AreaWarning = z.infer<typeof areaWarningSchema>

export const officeSavedResponseSchema = z.object({ office: officeViewSchema, warnings: z.array(areaWarningSchema) })
export const areaCheckResponseSchema = z.object({ areaKm2: z.number(), warnings: z.array(areaWarningSchema) })
