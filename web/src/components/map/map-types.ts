/**
 * The props of the field map (components/map): each layer optional, positions in degrees
 * (WGS 84), lengths in metres, bearings in degrees clockwise from true north.
 */
import type { AreaGeometry } from '@shared/schemas/region'
import type { Priority } from '@shared/domain/services'

/** A position in decimal degrees (WGS 84), north and east positive. */
export interface MapPoint {
  latDeg: number
  lonDeg: number
}

/** Where the complainant suffers the interference. */
export interface MapVictim {
  at: MapPoint
  /** Default "Complainant's position". */
  label?: string
}

/** A measurement site; the label is written beside it ("M3 −71.2 dBm"). */
export interface MapMeasurement {
  id: string
  at: MapPoint
  label: string
}

/** A bearing line: from a point along a true bearing for a length, drawn on the geodesic. */
export interface MapBearing {
  id: string
  from: MapPoint
  /** Degrees clockwise from true north. */
  bearingDeg: number
  /** How far the line is drawn [m]. */
  lengthM: number
  label?: string
}

/** A 95 % confidence ellipse on the ground (as the radio library's `ConfidenceEllipse`). */
export interface MapEllipse {
  semiMajorM: number
  semiMinorM: number
  /** Direction of the major axis, degrees clockwise from true north. */
  orientationDeg: number
}

/** The estimated source position and its 95 % ellipse. */
export interface MapEstimatedSource {
  at: MapPoint
  ellipse?: MapEllipse | null
  /** Default "Estimated source". */
  label?: string
}

/** A licensed station that may be the source. */
export interface MapCandidateStation {
  id: string
  at: MapPoint
  label: string
}

/** A field office: its point and, when it has one, its area. */
export interface MapOffice {
  name: string
  at: MapPoint
  area?: AreaGeometry | null
}

/** Another case near this one (or, with `priority`, a case drawn by its harm class). */
export interface MapNearbyCase {
  id: string
  at: MapPoint
  label: string
  /** Draw the case with its harm class's shape (the priority badge's) instead of a plain ring. */
  priority?: Priority
}

/**
 * Area drawing: the corners of an office's area in order (the ring closes itself). A click on
 * the map adds a corner at the end (unless `onPick` is set: the click then picks a position);
 * corners are draggable markers, reachable with Tab (arrow keys move one, Delete removes it).
 */
export interface MapAreaEditor {
  vertices: MapPoint[]
  onChange: (vertices: MapPoint[]) => void
  /** Where two edges of the outline cross: each is marked. */
  crossings?: MapPoint[]
  /** An area that cannot be edited corner by corner (several polygons, or holes): drawn only. */
  fixedArea?: AreaGeometry | null
  /**
   * The office whose area this is: its own point and area from the region map are left out (the
   * editor draws the area; the point is drawn at `at`, the position in the form, when there is one).
   */
  office?: { name: string; at: MapPoint | null }
}

export interface FieldMapProps {
  /** The map's accessible name, e.g. "Map of case QB-2026-0042". */
  label: string
  victim?: MapVictim | null
  measurements?: MapMeasurement[]
  bearings?: MapBearing[]
  estimatedSource?: MapEstimatedSource | null
  candidateStations?: MapCandidateStation[]
  /** Offices with their areas; 'region' takes the offices of the public region map (GET /api/region). */
  offices?: MapOffice[] | 'region'
  nearbyCases?: MapNearbyCase[]
  /** What the legend calls the cases; default "nearby case(s)". */
  casesNoun?: { one: string; many: string }
  /**
   * Pick mode: a click or tap on the map calls this with the position, rounded to 4 decimals
   * (≈ 11 m). Typed coordinates stay the keyboard way to set a position; show them as `victim`.
   */
  onPick?: (latDeg: number, lonDeg: number) => void
  /** Draw an office's area (see MapAreaEditor). */
  areaEditor?: MapAreaEditor
  /** Height of the map [CSS px]; default 420. The width follows the container. */
  heightPx?: number
}
