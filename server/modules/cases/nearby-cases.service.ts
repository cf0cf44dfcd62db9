/** The other open cases around a case, for its map. */
import { CASE_STATE_LABELS, type CaseState } from '../../../shared/domain/case-lifecycle'
import { geodesicInverse } from '../../../shared/radio/geo'
import { NEARBY_CASES_MAX, NEARBY_CASES_RADIUS_M, type NearbyCase } from '../../../shared/schemas/nearby-cases'
import type { ServiceContext } from '../../context'
import type { Actor } from '../../policy/policy'
import { loadVisibleCase } from './case-access'
import { openCasesInBox } from './cases.repo'

/** Metres in one degree of latitude, rounded down (the least is 110 574 m at the equator): the box is never too small. */
const M_PER_DEG_LAT_AT_LEAST = 110_000
/** Rows read from the box, nearest first by a flat-earth distance, before the geodesic sorts them: room to spare over the answer's 50. */
const BOX_ROWS = 4 * NEARBY_CASES_MAX

/**
 * The other open cases of the case's office within 10 km of its position, nearest first, at
 * most 50. A latitude/longitude box picks the rows (the repo), the geodesic distance on WGS 84
 * (GeographicLib, through shared/radio/geo) decides and orders. Whoever may see the case may
 * see these: they are of the same office (another office's case is not found).
 */
export async function nearbyOpenCases(ctx: ServiceContext, actor: Actor, caseId: string): Promise<NearbyCase[]> {
  const c = await loadVisibleCase(ctx.db, actor, caseId)
  const centre = { latDeg: c.latDeg, lonDeg: c.lonDeg }
  const dLatDeg = NEARBY_CASES_RADIUS_M / M_PER_DEG_LAT_AT_LEAST
  const latDeg: [number, number] = [Math.max(-90, c.latDeg - dLatDeg), Math.min(90, c.latDeg + dLatDeg)]
  // the box's widest parallel is the one nearest a pole; near a pole every longitude is in it
  const cosLat = Math.cos((Math.max(Math.abs(latDeg[0]), Math.abs(latDeg[1])) * Math.PI) / 180)
  const dLonDeg = cosLat > 0.05 ? dLatDeg / cosLat : Infinity
  const rows = await openCasesInBox(ctx.db, {
    officeId: c.officeId,
    exceptCaseId: c.id,
    centre,
    latDeg,
    lonDeg: dLonDeg < 180 ? [c.lonDeg - dLonDeg, c.lonDeg + dLonDeg] : null,
    limit: BOX_ROWS,
  })
  return rows
    .filter((o): o is typeof o & { status: Exclude<CaseState, 'closed'> } => o.status !== 'closed')
    .map((o) => ({ o, distanceM: geodesicInverse({ from: centre, to: { latDeg: o.latDeg, lonDeg: o.lonDeg } }).distanceM }))
    .filter((x) => x.distanceM <= NEARBY_CASES_RADIUS_M)
    .sort((a, b) => a.distanceM - b.distanceM)
    .slice(0, NEARBY_CASES_MAX)
    .map(({ o, distanceM }) => ({
      id: o.id,
      reference: o.reference,
      status: o.status,
      statusLabel: CASE_STATE_LABELS[o.status],
      latDeg: o.latDeg,
      lonDeg: o.lonDeg,
      distanceM: Math.round(distanceM),
      freqLowHz: o.freqLowHz,
      freqHighHz: o.freqHighHz,
    }))
}

