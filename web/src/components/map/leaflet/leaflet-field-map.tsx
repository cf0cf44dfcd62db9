/**
 * The field map drawn with Leaflet (this file is the lazy chunk: Leaflet, its CSS and ours).
 * Basemap: the configured tile server, or the offline one from the region's data (sea as the
 * background, the land, the boundary, place names). Layers as FieldMapProps gives them; symbols
 * differ in shape and colour (lib/symbols.ts); a key below names them.
 */
import 'leaflet/dist/leaflet.css'
import './field-map.css'
import { Fragment, useEffect, useId, useMemo, useRef, useState } from 'react'
import L from 'leaflet'
import { MapContainer, Marker, Pane, Polygon, Polyline, ScaleControl, TileLayer, Tooltip, useMap, useMapEvents } from 'react-leaflet'
import { geodesicDirect, normalizeLonDeg } from '@shared/radio/geo'
import { formatLatLonDeg } from '@/lib/coordinates'
import { MapLegend, legendEntries } from '../map-legend'
import type { FieldMapProps, MapAreaEditor, MapPoint } from '../map-types'
import { addVertex, moveVertex, verticesAfterKey } from '../lib/area-vertices'
import { boxOfGeometries, type GeoBox } from '../lib/map-box'
import { areaLatLngs, bearingLine, contentBox, densifyRing, ellipseRing, round4 } from '../lib/map-geometry'
import type { RegionMapData } from '../lib/region-data'
import { MAP_COLOURS as C, escapeHtml, symbolSvg, type SymbolKind } from '../lib/symbols'

type Props = FieldMapProps & { data: RegionMapData | null }

const ll = (p: MapPoint): [number, number] => [p.latDeg, p.lonDeg]
const boundsOf = (b: GeoBox): L.LatLngBoundsExpression => [
  [b.southDeg, b.westDeg],
  [b.northDeg, b.eastDeg],
]

/** A symbol as a Leaflet icon, named for screen readers. */
function icon(kind: SymbolKind, label: string, size = 24): L.DivIcon {
  return L.divIcon({
    className: 'qb-map-icon',
    html: `<span role="img" aria-label="${escapeHtml(label)}">${symbolSvg(kind, size)}</span>`,
    iconSize: [size, size],
    iconAnchor: [size / 2, size / 2],
    tooltipAnchor: [size / 2, 0],
  })
}

/** Gives a vector layer's SVG element an accessible name once it is on the map. */
const named = (label: string) => ({
  add: (e: L.LeafletEvent) => {
    const el = (e.target as L.Path).getElement?.()
    el?.setAttribute('role', 'img')
    el?.setAttribute('aria-label', label)
  },
})

export default function LeafletFieldMap(props: Props) {
  const { data, label, onPick, areaEditor, heightPx = 420 } = props
  const helpId = useId()
  const given = props.offices === 'region' ? (data?.offices ?? []) : (props.offices ?? [])
  // the office being edited is drawn once, from the form: its point where the form puts it, its area by the editor
  const edited = areaEditor?.office
  const offices = edited ? [...given.filter((o) => o.name !== edited.name), ...(edited.at ? [{ name: edited.name, at: edited.at, area: null }] : [])] : given
  const drawing = !!areaEditor && !onPick && !areaEditor.fixedArea
  const region = data?.region ?? null
  const tiles = data?.basemap.kind === 'tiles' ? data.basemap : null
  const regionBox = useMemo(() => (region ? boxOfGeometries([region.outline]) : null), [region])

  // What the map frames: the case's layers; the region (or, without one, the offices) is context,
  // framed only in pick mode or when there is nothing else — an office set up far off does not
  // shrink the region to a speck. A picked point is kept in view by panning, not by a new fit, so
  // a click never jumps the map.
  const { victim, measurements, bearings, estimatedSource, candidateStations, nearbyCases } = props
  // the area being edited as it was on first show is framed too (later corners do not refit the map)
  const [editedAtFirst] = useState(() => (areaEditor ? [...(areaEditor.fixedArea ? [areaEditor.fixedArea] : []), ...areaEditor.vertices.map((v) => ({ type: 'Point', coordinates: [v.lonDeg, v.latDeg] }))] : []))
  const fitBox = useMemo(() => {
    const content = onPick ? null : contentBox({ victim, measurements, bearings, estimatedSource, candidateStations, nearbyCases })
    return content ?? (region ? contentBox({}, [region.outline, ...editedAtFirst]) : contentBox({ offices }, editedAtFirst))
  }, [onPick, victim, measurements, bearings, estimatedSource, candidateStations, nearbyCases, offices, region, editedAtFirst])

  const caseLayers = !!(victim && !onPick) || !!(measurements?.length || bearings?.length || estimatedSource || candidateStations?.length || nearbyCases?.length)
  const entries = legendEntries({ ...props, officeCount: offices.length, officeAreas: offices.some((o) => o.area), region: !!region && !tiles })
  const picked = victim?.at ?? (areaEditor && onPick ? (edited?.at ?? null) : null)
  const inRegion = (p: MapPoint) => !regionBox || (p.latDeg >= regionBox.southDeg && p.latDeg <= regionBox.northDeg && p.lonDeg >= regionBox.westDeg && p.lonDeg <= regionBox.eastDeg)
  const interactive = !onPick && !drawing
  const help = onPick
    ? areaEditor
      ? 'Click or tap the map where the office is, or type the latitude and longitude: each follows the other. Drag to move the map; zoom with the + and − buttons.'
      : 'Click or tap the map where it happens, or type the latitude and longitude above: each follows the other. Drag to move the map; zoom with the + and − buttons.'
    : drawing
      ? 'Click the map to add the corners of the area in order. Drag a corner to move it; or Tab to a corner, move it with the arrow keys, remove it with Delete.'
      : null

  return (
    <div className="flex flex-col gap-2">
      {help && (
        <p id={helpId} className="text-sm text-ink-muted">
          {help}
        </p>
      )}
      <div className={`qb-map relative overflow-hidden rounded-control border border-field ${onPick || drawing ? 'qb-map-pick' : ''}`} style={{ height: heightPx }}>
        <MapContainer
          bounds={fitBox ? boundsOf(fitBox) : undefined}
          center={fitBox ? undefined : [0, 0]}
          zoom={fitBox ? undefined : 2}
          zoomSnap={0.25}
          scrollWheelZoom={false}
          style={{ height: '100%', width: '100%' }}
        >
          <MapSetup label={label} describedBy={help ? helpId : undefined} attribution={tiles ? null : region ? 'Offline map, region data' : ''} />
          {tiles && <TileLayer url={tiles.urlTemplate} attribution={escapeHtml(tiles.attribution)} />}
          {region && (
            <Pane name="qb-basemap" style={{ zIndex: 250 }}>
              {!tiles &&
                region.coast.map((area, i) => (
                  <Polygon key={i} positions={areaLatLngs(area)} pathOptions={{ color: C.field, weight: 1.5, fillColor: C.paper, fillOpacity: 1, interactive: false }} />
                ))}
              <Polygon positions={areaLatLngs(region.outline)} pathOptions={{ color: C.ink, weight: 2.5, fill: false, interactive: false }} eventHandlers={named(`Boundary of ${region.name}`)} />
              {!tiles &&
                region.places.map((p) => (
                  <Marker
                    key={p.name}
                    position={ll(p.at)}
                    interactive={false}
                    keyboard={false}
                    icon={L.divIcon({ className: `qb-map-place qb-map-place-${p.kind}`, html: escapeHtml(p.name), iconSize: undefined, iconAnchor: [0, 8] })}
                  />
                ))}
            </Pane>
          )}
          {offices.map((o) =>
            o.area ? (
              <Polygon
                key={`area-${o.name}`}
                positions={areaLatLngs(o.area)}
                pathOptions={{ color: C.office, weight: 2, dashArray: '8 6', fillColor: C.office, fillOpacity: 0.04, interactive: false }}
                eventHandlers={named(`Area of the ${o.name} office`)}
              />
            ) : null,
          )}
          {estimatedSource?.ellipse && (
            <Polygon
              positions={ellipseRing({ centre: estimatedSource.at, ellipse: estimatedSource.ellipse }).map(ll)}
              pathOptions={{ color: C.source, weight: 2, fillColor: C.source, fillOpacity: 0.12, interactive: false }}
              eventHandlers={named(`95 % confidence ellipse: ${Math.round(estimatedSource.ellipse.semiMajorM)} m by ${Math.round(estimatedSource.ellipse.semiMinorM)} m (semi-axes)`)}
            />
          )}
          {bearings?.map((b) => {
            const name = b.label ?? `Bearing ${b.bearingDeg.toFixed(0)}° from ${formatLatLonDeg(b.from)}`
            const end = geodesicDirect({ from: b.from, bearingDeg: b.bearingDeg, distanceM: b.lengthM })
            return (
              <Fragment key={b.id}>
                <Polyline positions={bearingLine(b).map(ll)} pathOptions={{ color: C.measurement, weight: 2.5, dashArray: '10 6', interactive: false }} eventHandlers={named(name)} />
                <Marker
                  position={[end.latDeg, end.lonDeg]}
                  interactive={false}
                  keyboard={false}
                  icon={L.divIcon({
                    className: 'qb-map-icon',
                    html: `<span aria-hidden="true" style="transform: rotate(${end.finalBearingDeg}deg)"><svg width="16" height="16" viewBox="-8 -8 16 16"><path d="M0 -7L5 5L0 2L-5 5Z" fill="${C.measurement}"/></svg></span>`,
                    iconSize: [16, 16],
                    iconAnchor: [8, 8],
                  })}
                />
              </Fragment>
            )
          })}
          {offices.map((o) => (
            <Marker key={`office-${o.name}`} position={ll(o.at)} icon={icon('office', `${o.name} office`, 20)} interactive={interactive} keyboard={false}>
              {/* offices are context: named at all times only where nothing of a case competes */}
              <Tooltip permanent={!caseLayers} direction="auto" className="qb-map-label">{`${o.name} office`}</Tooltip>
            </Marker>
          ))}
          {nearbyCases?.map((c) => (
            <Marker key={c.id} position={ll(c.at)} icon={icon(c.priority ? `harm${c.priority}` : 'nearbyCase', c.label, 20)} interactive={interactive} keyboard={false}>
              <Tooltip direction="top" className="qb-map-label">{c.label}</Tooltip>
            </Marker>
          ))}
          {candidateStations?.map((s) => (
            <Marker key={s.id} position={ll(s.at)} icon={icon('station', s.label)} interactive={interactive} keyboard={false}>
              <Tooltip permanent direction="auto" className="qb-map-label">{s.label}</Tooltip>
            </Marker>
          ))}
          {measurements?.map((m) => (
            <Marker key={m.id} position={ll(m.at)} icon={icon('measurement', m.label, 20)} interactive={interactive} keyboard={false}>
              <Tooltip permanent direction="auto" className="qb-map-label">{m.label}</Tooltip>
            </Marker>
          ))}
          {estimatedSource && (
            <Marker position={ll(estimatedSource.at)} icon={icon('source', estimatedSource.label ?? 'Estimated source', 26)} interactive={interactive} keyboard={false} zIndexOffset={500}>
              <Tooltip permanent direction="auto" className="qb-map-label">{estimatedSource.label ?? 'Estimated source'}</Tooltip>
            </Marker>
          )}
          {victim && <Marker position={ll(victim.at)} icon={icon('victim', victim.label ?? 'Complainant’s position', 28)} interactive={false} keyboard={false} zIndexOffset={1000} />}
          <ScaleControl position="bottomleft" imperial={false} />
          {areaEditor && <AreaEditorLayer editor={areaEditor} drawing={drawing} />}
          {onPick && <PickOnClick onPick={onPick} />}
          <FitToContent box={fitBox} keepInView={onPick ? picked : null} />
        </MapContainer>
        <NorthArrow />
      </div>
      <MapLegend entries={entries} label={`Key to the map`} />
      {onPick && (
        <p aria-live="polite" className="font-mono text-sm">
          {picked
            ? inRegion(picked)
              ? `Marker at ${formatLatLonDeg(picked)}`
              : `${formatLatLonDeg(picked)} is outside ${region?.name ?? 'the region'}. It is still accepted.`
            : 'No place picked on the map yet.'}
        </p>
      )}
    </div>
  )
}

/** Names the map for assistive technology, and sets the attribution line's text. */
function MapSetup({ label, describedBy, attribution }: { label: string; describedBy?: string; attribution: string | null }) {
  const map = useMap()
  useEffect(() => {
    const el = map.getContainer()
    el.setAttribute('role', 'region')
    el.setAttribute('aria-roledescription', 'map')
    el.setAttribute('aria-label', label)
    if (describedBy) el.setAttribute('aria-describedby', describedBy)
    else el.removeAttribute('aria-describedby')
  }, [map, label, describedBy])
  useEffect(() => {
    map.attributionControl?.setPrefix('Leaflet')
    if (attribution) {
      map.attributionControl?.addAttribution(attribution)
      return () => void map.attributionControl?.removeAttribution(attribution)
    }
  }, [map, attribution])
  return null
}

/**
 * The area being edited: its outline (a line until it has three corners), its corners as
 * draggable, focusable markers, and where its edges cross. A click on the map adds a corner
 * while `drawing`; an area that is not one ring (`fixedArea`) is only drawn.
 */
function AreaEditorLayer({ editor, drawing }: { editor: MapAreaEditor; drawing: boolean }) {
  const { vertices, onChange, crossings, fixedArea } = editor
  const line = densifyRing(vertices.map(ll))
  const style = { color: C.office, weight: 3, fillColor: C.office, fillOpacity: 0.15, interactive: false }
  return (
    <>
      {drawing && <AddOnClick onAdd={(p) => onChange(addVertex(vertices, p))} />}
      {fixedArea ? (
        <Polygon positions={areaLatLngs(fixedArea)} pathOptions={style} eventHandlers={named('The area being edited')} />
      ) : vertices.length >= 3 ? (
        <Polygon positions={densifyRing([...vertices, vertices[0]!].map(ll))} pathOptions={style} eventHandlers={named(`The area being edited: ${vertices.length} corners`)} />
      ) : vertices.length === 2 ? (
        <Polyline positions={line} pathOptions={style} />
      ) : null}
      {!fixedArea && vertices.map((_, i) => <VertexMarker key={i} index={i} vertices={vertices} onChange={onChange} />)}
      {crossings?.map((c, i) => (
        <Marker key={`crossing-${i}`} position={ll(c)} icon={icon('crossing', `The outline crosses itself near ${formatLatLonDeg({ ...c, decimals: 2 })}`, 22)} interactive={false} keyboard={false} zIndexOffset={800} />
      ))}
    </>
  )
}

function AddOnClick({ onAdd }: { onAdd: (p: MapPoint) => void }) {
  useMapEvents({ click: (e) => onAdd({ latDeg: e.latlng.lat, lonDeg: normalizeLonDeg(e.latlng.lng) }) })
  return null
}

const VERTEX_ICON = L.divIcon({ className: 'qb-map-icon qb-map-vertex', html: `<span aria-hidden="true">${symbolSvg('vertex', 20)}</span>`, iconSize: [20, 20], iconAnchor: [10, 10] })

/** One corner: dragged with a pointer, or focused with Tab and moved by arrow keys (a step of a few pixels at the map's zoom). */
function VertexMarker({ index, vertices, onChange }: { index: number; vertices: MapPoint[]; onChange: (vertices: MapPoint[]) => void }) {
  const map = useMap()
  const marker = useRef<L.Marker>(null)
  const latest = useRef({ vertices, onChange })
  latest.current = { vertices, onChange }
  const v = vertices[index]!
  const name = `Corner ${index + 1} of ${vertices.length}, ${formatLatLonDeg(v)}. Arrow keys move it; Delete removes it.`
  useEffect(() => {
    const el = marker.current?.getElement()
    if (!el) return
    el.setAttribute('aria-label', name)
  }, [name])
  useEffect(() => {
    const el = marker.current?.getElement()
    if (!el) return
    const onKey = (e: KeyboardEvent) => {
      const { vertices: now, onChange: change } = latest.current
      const at = now[index]
      if (!at) return
      const c = map.latLngToContainerPoint([at.latDeg, at.lonDeg])
      const off = map.containerPointToLatLng([c.x + 6, c.y - 6])
      const step = { latDeg: Math.max(1e-4, Math.abs(off.lat - at.latDeg)), lonDeg: Math.max(1e-4, Math.abs(off.lng - at.lonDeg)) }
      const next = verticesAfterKey(now, index, e.key, step)
      if (!next) return
      e.preventDefault()
      e.stopPropagation()
      change(next)
    }
    el.addEventListener('keydown', onKey)
    return () => el.removeEventListener('keydown', onKey)
  }, [map, index])
  return (
    <Marker
      ref={marker}
      position={ll(v)}
      icon={VERTEX_ICON}
      draggable
      keyboard
      zIndexOffset={600}
      eventHandlers={{
        // a click on a corner is not a new corner
        click: () => undefined,
        dragend: (e) => {
          const p = (e.target as L.Marker).getLatLng()
          onChange(moveVertex(vertices, index, { latDeg: p.lat, lonDeg: normalizeLonDeg(p.lng) }))
        },
      }}
    />
  )
}

function PickOnClick({ onPick }: { onPick: (latDeg: number, lonDeg: number) => void }) {
  useMapEvents({ click: (e) => onPick(round4(e.latlng.lat), round4(normalizeLonDeg(e.latlng.lng))) })
  return null
}

/** Fits the map to the box when the content changes; pans to keep a picked point in view. */
function FitToContent({ box, keepInView }: { box: GeoBox | null; keepInView: MapPoint | null }) {
  const map = useMap()
  const key = box ? [box.southDeg, box.westDeg, box.northDeg, box.eastDeg].join() : ''
  useEffect(() => {
    if (!box) return
    const fit = () => {
      const size = map.getSize()
      if (size.x > 0 && size.y > 0) map.fitBounds(boundsOf(box))
    }
    fit()
    if (typeof ResizeObserver === 'undefined') return
    // a new width (a turned phone, a resized window) frames the content again
    let width = map.getContainer().clientWidth
    const observer = new ResizeObserver(() => {
      const w = map.getContainer().clientWidth
      if (w === width) return
      width = w
      map.invalidateSize()
      fit()
    })
    observer.observe(map.getContainer())
    return () => observer.disconnect()
    // the key stands for the box: a new array of the same content does not refit
  }, [map, key])
  const lat = keepInView?.latDeg
  const lon = keepInView?.lonDeg
  useEffect(() => {
    if (lat === undefined || lon === undefined || map.getSize().x === 0) return
    if (!map.getBounds().contains([lat, lon])) map.panTo([lat, lon])
  }, [map, lat, lon])
  return null
}

function NorthArrow() {
  return (
    <div role="img" aria-label="North arrow: north is up" className="pointer-events-none absolute top-2 right-2 z-[1000] flex flex-col items-center rounded-control border border-field bg-surface px-1.5 pt-1 pb-0.5 text-ink">
      <svg width="14" height="20" viewBox="0 0 14 20" aria-hidden="true">
        <path d="M7 1L13 19L7 14Z" fill="currentColor" />
        <path d="M7 1L1 19L7 14Z" fill="none" stroke="currentColor" strokeWidth="1.2" strokeLinejoin="round" />
      </svg>
      <span className="text-xs leading-none font-bold">N</span>
    </div>
  )
}
