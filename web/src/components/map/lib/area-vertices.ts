/**
 * The area editor's vertex steps (a click adds a corner at the end, a drag or an arrow key moves
 * one, Delete removes one). Each returns a new list and leaves the given one as it was, so the
 * form's state and its undo stay plain arrays. Positions are rounded to 4 decimals (≈ 11 m), as
 * a picked point is. Pure: no DOM, no Leaflet.
 */
import type { MapPoint } from '../map-types'
import { round4 } from './map-geometry'

const at = (p: MapPoint): MapPoint => ({ latDeg: round4(p.latDeg), lonDeg: round4(p.lonDeg) })

/** The corners with `p` added after the last one. */
export function addVertex(vertices: readonly MapPoint[], p: MapPoint): MapPoint[] {
  return [...vertices, at(p)]
}

/** The corners with corner `index` at `p` (an index outside the list changes nothing). */
export function moveVertex(vertices: readonly MapPoint[], index: number, p: MapPoint): MapPoint[] {
  return vertices.map((v, i) => (i === index ? at(p) : v))
}

/** The corners without corner `index`. */
export function removeVertex(vertices: readonly MapPoint[], index: number): MapPoint[] {
  return vertices.filter((_, i) => i !== index)
}

/** The corners without the last one ("Undo last point"). */
export function withoutLastVertex(vertices: readonly MapPoint[]): MapPoint[] {
  return vertices.slice(0, -1)
}

/** How an arrow key moves a focused corner: north, south, east or west by one step. */
const ARROWS: Record<string, { north: number; east: number }> = {
  ArrowUp: { north: 1, east: 0 },
  ArrowDown: { north: -1, east: 0 },
  ArrowRight: { north: 0, east: 1 },
  ArrowLeft: { north: 0, east: -1 },
}

/**
 * The corners after a key pressed on corner `index`: an arrow moves it one step (`stepDeg`, of
 * latitude and of longitude; the map gives a step of a few screen pixels at its zoom), Delete or
 * Backspace removes it. Null for any other key, which the map then leaves to the browser.
 * Latitude stays within ±90°, longitude wraps into −180…180°.
 */
export function verticesAfterKey(vertices: readonly MapPoint[], index: number, key: string, step: { latDeg: number; lonDeg: number }): MapPoint[] | null {
  const v = vertices[index]
  if (!v) return null
  if (key === 'Delete' || key === 'Backspace') return removeVertex(vertices, index)
  const arrow = ARROWS[key]
  if (!arrow) return null
  const latDeg = Math.max(-90, Math.min(90, v.latDeg + arrow.north * step.latDeg))
  let lonDeg = v.lonDeg + arrow.east * step.lonDeg
  if (lonDeg > 180) lonDeg -= 360
  if (lonDeg < -180) lonDeg += 360
  return moveVertex(vertices, index, { latDeg, lonDeg })
}
