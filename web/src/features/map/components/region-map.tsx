/**
 * An offline map of the configured region (no tile server): click or use the arrow keys to
 * set a position. Its box comes from the region's outline. Positions typed elsewhere may lie
 * outside the box; the map then says so and shows no marker, and the position still counts.
 */
import { useId, useMemo, useRef, type KeyboardEvent, type MouseEvent } from 'react'
import { formatLatLonDeg } from '@/lib/coordinates'
import { createProjection, nudge, round4, type Direction, type LatLonDeg, type Projection } from '../lib/projection'
import type { MapOffice, RegionMapData } from '../lib/region-data'
import { MapBackdrop } from './map-backdrop'

export interface RegionMapProps {
  data: RegionMapData
  /** The current position, or null when none is set (or the typed values are not numbers). */
  value: LatLonDeg | null
  onPick: (p: LatLonDeg) => void
  label?: string
}

const KEY_DIRECTIONS: Record<string, Direction> = { ArrowUp: 'north', ArrowDown: 'south', ArrowLeft: 'west', ArrowRight: 'east' }

export function RegionMap({ data, value, onPick, label = `Map of ${data.name}` }: RegionMapProps) {
  const svgRef = useRef<SVGSVGElement>(null)
  const helpId = useId()
  const projection = useMemo(() => createProjection(data.box), [data.box])
  const inside = value !== null && projection.contains(value)

  const onClick = (e: MouseEvent<SVGSVGElement>) => {
    const box = svgRef.current?.getBoundingClientRect()
    if (!box || box.width === 0) return
    const x = ((e.clientX - box.left) / box.width) * projection.width
    const y = ((e.clientY - box.top) / box.height) * projection.height
    const p = projection.unproject({ x, y })
    onPick({ latDeg: round4(p.latDeg), lonDeg: round4(p.lonDeg) })
  }

  const onKeyDown = (e: KeyboardEvent<HTMLDivElement>) => {
    const direction = KEY_DIRECTIONS[e.key]
    if (!direction) return
    e.preventDefault()
    const from = inside && value ? value : projection.centre
    // The first key press puts the marker in the middle; later ones move it.
    onPick(inside ? nudge({ projection, from, direction, stepDeg: e.shiftKey ? 0.1 : 0.01 }) : { latDeg: round4(from.latDeg), lonDeg: round4(from.lonDeg) })
  }

  const marker = inside && value ? projection.project(value) : null

  return (
    <div className="flex flex-col gap-2">
      <p id={helpId} className="text-sm text-ink-muted">
        Click the map where it happens, or focus the map and use the arrow keys (hold Shift for larger steps). The latitude and
        longitude fields follow.
      </p>
      <div
        role="application"
        aria-roledescription="map"
        aria-label={label}
        aria-describedby={helpId}
        tabIndex={0}
        onKeyDown={onKeyDown}
        className="overflow-hidden rounded-control border border-field bg-signal-soft"
      >
        <svg ref={svgRef} viewBox={`0 0 ${projection.width} ${projection.height.toFixed(1)}`} className="block h-auto w-full cursor-crosshair" onClick={onClick} aria-hidden="true">
          <MapBackdrop data={data} projection={projection} />
          {data.offices.map((o) => (
            <OfficeMark key={o.name} office={o} projection={projection} />
          ))}
          {marker && (
            <g transform={`translate(${marker.x} ${marker.y})`} className="text-ink">
              <circle r="17" fill="none" stroke="currentColor" strokeWidth="3" />
              <circle r="4" fill="currentColor" />
              <path d="M0 -30V-19M0 19V30M-30 0H-19M19 0H30" stroke="currentColor" strokeWidth="3" />
            </g>
          )}
        </svg>
      </div>
      <p aria-live="polite" className="font-mono text-sm">
        {inside && value
          ? `Marker at ${formatLatLonDeg(value)}`
          : value
            ? `${formatLatLonDeg(value)} is outside this map. It is still accepted.`
            : 'No place picked on the map yet.'}
      </p>
    </div>
  )
}

function OfficeMark({ office, projection }: { office: MapOffice; projection: Projection }) {
  if (!projection.contains(office.at)) return null
  const { x, y } = projection.project(office.at)
  return (
    <g transform={`translate(${x} ${y})`}>
      <rect x="-8" y="-8" width="16" height="16" className="fill-signal stroke-surface" strokeWidth="2" />
      <text x="14" y="6" fontSize="22" fontWeight="700" className="fill-signal-strong stroke-surface" paintOrder="stroke" strokeWidth="4">
        {office.name} office
      </text>
    </g>
  )
}
