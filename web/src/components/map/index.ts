/**
 * The field map: Leaflet, loaded only where a map shows (the Leaflet chunk and its CSS are
 * lazy). Import from here; never from ./leaflet, which would pull Leaflet into the caller's chunk.
 */
export { FieldMap } from './field-map'
export type {
  FieldMapProps,
  MapAreaEditor,
  MapBearing,
  MapCandidateStation,
  MapEllipse,
  MapEstimatedSource,
  MapMeasurement,
  MapNearbyCase,
  MapOffice,
  MapPoint,
  MapVictim,
} from './map-types'
