/**
 * The field map, as callers use it: loads the region map (basemap, outline, offices), then the
 * Leaflet chunk (lazy: Leaflet and its CSS load only where a map shows). Without a tile server
 * and without a region there is nothing to draw behind the layers; a map with no layers then
 * says so instead of showing an empty frame.
 */
import { Suspense, lazy, useMemo } from 'react'
import { Loading } from '@/components/ui/loading'
import { useRegionMap } from './api/get-region-map'
import { regionMapData } from './lib/region-data'
import type { FieldMapProps } from './map-types'

const LeafletFieldMap = lazy(() => import('./leaflet/leaflet-field-map'))

function hasLayers(p: FieldMapProps): boolean {
  return !!(p.victim || p.measurements?.length || p.bearings?.length || p.estimatedSource || p.candidateStations?.length || p.nearbyCases?.length || (Array.isArray(p.offices) && p.offices.length))
}

export function FieldMap(props: FieldMapProps) {
  const query = useRegionMap()
  const data = useMemo(() => (query.data ? regionMapData(query.data) : null), [query.data])
  const typeInstead = props.areaEditor
    ? ' Type the position and upload or paste the area as GeoJSON instead; they work without the map.'
    : props.onPick
      ? ' Type the latitude and longitude instead (decimal degrees); they work without the map.'
      : ''
  if (query.isPending) return <Loading label="Loading the map…" />
  if (query.isError && !hasLayers(props)) return <p className="text-sm text-ink-muted">The map could not be loaded just now.{typeInstead}</p>
  // picking and drawing need something to aim at: the region or the tiles
  const drawable = data?.region || data?.basemap.kind === 'tiles' || (!props.onPick && !props.areaEditor && hasLayers(props))
  if (!drawable) return <p className="text-sm text-ink-muted">No map is set up for this service yet.{typeInstead}</p>
  return (
    <Suspense fallback={<Loading label="Loading the map…" />}>
      <LeafletFieldMap {...props} data={data} />
    </Suspense>
  )
}
