/** The drawn region: sea (the frame's background), mainland, islands, a graticule and place names. */
import { ISLANDS, MAINLAND, PLACES, type PlaceLabel } from '../lib/vellmark-coast'
import { MAP_HEIGHT, MAP_WIDTH, REGION_BOX, projectToMap, type LatLonDeg } from '../lib/projection'

const toPoints = (outline: LatLonDeg[]) =>
  outline
    .map((p) => {
      const { x, y } = projectToMap(p)
      return `${x.toFixed(1)},${y.toFixed(1)}`
    })
    .join(' ')

const LATS = [47.4, 47.6, 47.8, 48.0, 48.2, 48.4]
const LONS = [-31.8, -31.4, -31.0, -30.6, -30.2]

export function MapBackdrop() {
  return (
    <g>
      <polygon points={toPoints(MAINLAND)} className="fill-paper stroke-field" strokeWidth="2.5" strokeLinejoin="round" />
      {ISLANDS.map((i) => (
        <polygon key={i.name} points={toPoints(i.outline)} className="fill-paper stroke-field" strokeWidth="2.5" strokeLinejoin="round" />
      ))}
      <Graticule />
      {PLACES.map((p) => (
        <Place key={p.name} place={p} />
      ))}
    </g>
  )
}

function Graticule() {
  return (
    <g className="stroke-ink-muted fill-ink-muted" strokeWidth="1" strokeDasharray="4 8" opacity="0.55">
      {LATS.map((lat) => {
        const { y } = projectToMap({ latDeg: lat, lonDeg: REGION_BOX.westDeg })
        return (
          <g key={`lat${lat}`}>
            <line x1="0" x2={MAP_WIDTH} y1={y} y2={y} />
            <text x="6" y={y - 6} fontSize="18" stroke="none" className="font-mono">
              {lat.toFixed(1)}° N
            </text>
          </g>
        )
      })}
      {LONS.map((lon) => {
        const { x } = projectToMap({ latDeg: REGION_BOX.southDeg, lonDeg: lon })
        return (
          <g key={`lon${lon}`}>
            <line x1={x} x2={x} y1="0" y2={MAP_HEIGHT} />
            <text x={x + 6} y={MAP_HEIGHT - 8} fontSize="18" stroke="none" className="font-mono">
              {Math.abs(lon).toFixed(1)}° W
            </text>
          </g>
        )
      })}
    </g>
  )
}

function Place({ place }: { place: PlaceLabel }) {
  const { x, y } = projectToMap(place.at)
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
