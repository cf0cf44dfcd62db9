/**
 * The drawn region, from its data: sea (the frame's background), land, the region's boundary,
 * the offices' areas, a graticule and place names.
 */
import type { AreaGeometry } from '@shared/schemas/region'
import { graticule, type Projection } from '../lib/projection'
import type { MapPlace, RegionMapData } from '../lib/region-data'

/** An SVG path of a Polygon or MultiPolygon: one closed sub-path per ring (holes by even-odd). */
export function areaPath(area: AreaGeometry, projection: Projection): string {
  const polygons = area.type === 'Polygon' ? [area.coordinates] : area.coordinates
  return polygons
    .flatMap((rings) => rings)
    .map(
      (ring) =>
        ring
          .map(([lonDeg, latDeg], i) => {
            const { x, y } = projection.project({ latDeg: latDeg!, lonDeg: lonDeg! })
            return `${i === 0 ? 'M' : 'L'}${x.toFixed(1)} ${y.toFixed(1)}`
          })
          .join('') + 'Z',
    )
    .join('')
}

export function MapBackdrop({ data, projection }: { data: RegionMapData; projection: Projection }) {
  return (
    <g>
      {data.coast.map((area, i) => (
        <path key={i} d={areaPath(area, projection)} fillRule="evenodd" className="fill-paper stroke-field" strokeWidth="2.5" strokeLinejoin="round" />
      ))}
      {data.offices.map((o) =>
        o.area ? (
          <path key={o.name} d={areaPath(o.area, projection)} fillRule="evenodd" fill="none" className="stroke-signal" strokeWidth="2" strokeDasharray="10 6" opacity="0.8" />
        ) : null,
      )}
      <path d={areaPath(data.outline, projection)} fillRule="evenodd" fill="none" className="stroke-ink" strokeWidth="3" />
      <Graticule projection={projection} />
      {data.places.map((p) => (
        <Place key={p.name} place={p} projection={projection} />
      ))}
    </g>
  )
}

const hemisphere = (deg: number, positive: string, negative: string, decimals: number) => `${Math.abs(deg).toFixed(decimals)}° ${deg < 0 ? negative : positive}`

function Graticule({ projection }: { projection: Projection }) {
  const { latsDeg, lonsDeg, stepDeg } = graticule(projection.box)
  const decimals = Math.max(0, Math.ceil(-Math.log10(stepDeg) - 1e-9))
  return (
    <g className="stroke-ink-muted fill-ink-muted" strokeWidth="1" strokeDasharray="4 8" opacity="0.55">
      {latsDeg.map((lat) => {
        const { y } = projection.project({ latDeg: lat, lonDeg: projection.box.westDeg })
        return (
          <g key={`lat${lat}`}>
            <line x1="0" x2={projection.width} y1={y} y2={y} />
            <text x="6" y={y - 6} fontSize="18" stroke="none" className="font-mono">
              {hemisphere(lat, 'N', 'S', decimals)}
            </text>
          </g>
        )
      })}
      {lonsDeg.map((lon) => {
        const { x } = projection.project({ latDeg: projection.box.southDeg, lonDeg: lon })
        return (
          <g key={`lon${lon}`}>
            <line x1={x} x2={x} y1="0" y2={projection.height} />
            <text x={x + 6} y={projection.height - 8} fontSize="18" stroke="none" className="font-mono">
              {hemisphere(lon, 'E', 'W', decimals)}
            </text>
          </g>
        )
      })}
    </g>
  )
}

function Place({ place, projection }: { place: MapPlace; projection: Projection }) {
  const { x, y } = projection.project(place.at)
  if (place.kind === 'sea') {
    return (
      <text x={x} y={y} fontSize="26" fontStyle="italic" letterSpacing="4" textAnchor="middle" className="fill-signal-strong">
        {place.name}
      </text>
    )
  }
  return (
    <g transform={`translate(${x} ${y})`} className="fill-ink">
      {place.kind === 'town' && <circle r="5" />}
      <text x={place.kind === 'town' ? 10 : 0} y="6" fontSize="21" fontWeight={place.kind === 'town' ? 600 : 400} fontStyle={place.kind === 'land' ? 'italic' : undefined} textAnchor={place.kind === 'town' ? 'start' : 'middle'}>
        {place.name}
      </text>
    </g>
  )
}
