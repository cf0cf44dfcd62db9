/**
 * The report form's map: the configured region, or — while none is set up, or when it cannot
 * be loaded — a plain line saying so; the typed latitude and longitude work either way.
 */
import { useMemo } from 'react'
import { Loading } from '@/components/ui/loading'
import { useRegionMap } from '../api/get-region-map'
import type { LatLonDeg } from '../lib/projection'
import { regionMapData } from '../lib/region-data'
import { RegionMap } from './region-map'

export function LocationPicker({ value, onPick }: { value: LatLonDeg | null; onPick: (p: LatLonDeg) => void }) {
  const query = useRegionMap()
  const data = useMemo(() => (query.data ? regionMapData(query.data) : null), [query.data])
  if (query.isPending) return <Loading label="Loading the map…" />
  if (query.isError) return <p className="text-sm text-ink-muted">The map could not be loaded just now. Type the latitude and longitude above; the report works without the map.</p>
  if (!data) return <p className="text-sm text-ink-muted">No map is set up for this service yet. Type the latitude and longitude above (decimal degrees).</p>
  return <RegionMap data={data} value={value} onPick={onPick} label={`Map of ${data.name}: pick where it happens`} />
}
