/**
 * The area as the office editor holds it while the administrator works: nothing, corners drawn
 * on the map (a single-ring Polygon, also what an uploaded Polygon becomes so it can be edited
 * further), or an area that is shown but changed only by another upload (a MultiPolygon, or a
 * Polygon with holes). What it amounts to — the GeoJSON to send, its size, where it crosses
 * itself, what keeps it from being saved — is worked out here with the shared area functions,
 * the same ones the server checks with. Pure.
 */
import { areaFromVertices, areaKm2, selfCrossingMessage, selfCrossings, verticesOfArea, type AreaPoint } from '@shared/domain/office-areas'
import type { AreaGeometry } from '@shared/schemas/region'

export type AreaDraft = { kind: 'none' } | { kind: 'corners'; vertices: AreaPoint[] } | { kind: 'fixed'; area: AreaGeometry }

export const NO_AREA: AreaDraft = { kind: 'none' }

/** A saved or read area as a draft: corners when it is one ring, fixed otherwise. */
export function draftOfArea(area: AreaGeometry | null): AreaDraft {
  if (!area) return NO_AREA
  const vertices = verticesOfArea(area)
  return vertices ? { kind: 'corners', vertices } : { kind: 'fixed', area }
}

export interface DraftState {
  /** The area to send (null: none), or undefined while the draft cannot be sent. */
  area: AreaGeometry | null | undefined
  /** Why it cannot be saved as it is (too few corners, a self-crossing outline); null when it can. */
  problem: string | null
  /** Where the outline crosses itself. */
  crossings: AreaPoint[]
  /** Its size [km²], when it is an area whose outline does not cross itself. */
  km2: number | null
}

export const TOO_FEW_CORNERS = 'An area needs at least three corners: add more on the map, or clear it to save the office without an area.'

/** What the draft amounts to (see DraftState). */
export function draftState(draft: AreaDraft): DraftState {
  if (draft.kind === 'none' || (draft.kind === 'corners' && draft.vertices.length === 0)) return { area: null, problem: null, crossings: [], km2: null }
  if (draft.kind === 'corners' && draft.vertices.length < 3) return { area: undefined, problem: TOO_FEW_CORNERS, crossings: [], km2: null }
  const area = draft.kind === 'corners' ? areaFromVertices(draft.vertices) : draft.area
  const crossings = selfCrossings(area)
  return {
    area: crossings.length ? undefined : area,
    problem: crossings.length ? selfCrossingMessage(crossings) : null,
    crossings,
    // a crossing outline has no meaningful size (its lobes cancel out)
    km2: crossings.length ? null : areaKm2(area),
  }
}

/** The corners of the draft, for the map (none for a fixed area). */
export const cornersOf = (draft: AreaDraft): AreaPoint[] => (draft.kind === 'corners' ? draft.vertices : [])
