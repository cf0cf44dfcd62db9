/**
 * The answer of GET /api/cases/:id/nearby-cases: the other open cases of the case's office
 * around its position, nearest first, for the case map.
 */
import { z } from 'zod'
import { caseStateSchema } from './views'

/** How far around a case its office's other open cases are shown on its map [m] (a display choice). */
export const NEARBY_CASES_RADIUS_M = 10_000
/** At most this many nearby cases are answered (the nearest). */
export const NEARBY_CASES_MAX = 50

export const nearbyCaseSchema = z.object({
  id: z.uuid(),
  reference: z.string(),
  /** Open cases only: never 'closed'. */
  status: caseStateSchema.exclude(['closed']),
  statusLabel: z.string(),
  latDeg: z.number().min(-90).max(90),
  lonDeg: z.number().min(-180).max(180),
  /** Geodesic distance (WGS 84) from the case's position, rounded to the metre. */
  distanceM: z.number().int().min(0).max(NEARBY_CASES_RADIUS_M),
  freqLowHz: z.number(),
  freqHighHz: z.number(),
})
export type NearbyCase = z.infer<typeof nearbyCaseSchema>

export const nearbyCasesResponseSchema = z.object({ cases: z.array(nearbyCaseSchema).max(NEARBY_CASES_MAX) })
export type NearbyCasesResponse = z.infer<typeof nearbyCasesResponseSchema>
