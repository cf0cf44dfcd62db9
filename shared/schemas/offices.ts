/**
 * An office's settings beyond its targets (those are responseTargetsSchema in ./auth): its time
 * zone, an IANA name the platform's time-zone data knows (checked with Intl.DateTimeFormat, in
 * the browser and on the server alike) and stored in its canonical spelling.
 */
import { z } from 'zod'

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
