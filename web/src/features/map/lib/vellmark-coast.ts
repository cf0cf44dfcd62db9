/**
 * The invented demo region "Vellmark Coast": a coastline with the sea to the west, two
 * islands and a few place names. Nothing here is a real place. Offices are not drawn from
 * this file; they come from the server (staff only).
 */
import type { LatLonDeg } from './projection'

const pt = (latDeg: number, lonDeg: number): LatLonDeg => ({ latDeg, lonDeg })

/** The mainland, clockwise from the north-east corner; its west edge is the coast. */
export const MAINLAND: LatLonDeg[] = [
  pt(48.6, -29.8),
  pt(47.2, -29.8),
  pt(47.2, -30.46),
  pt(47.25, -30.5),
  pt(47.32, -30.58),
  pt(47.4, -30.66),
  pt(47.47, -30.74),
  pt(47.53, -30.84),
  pt(47.57, -30.86),
  pt(47.6, -30.78),
  pt(47.63, -30.74),
  pt(47.66, -30.78),
  pt(47.68, -30.86),
  pt(47.71, -30.92),
  pt(47.75, -30.98),
  pt(47.8, -31.06),
  pt(47.86, -31.18),
  pt(47.92, -31.3),
  pt(47.98, -31.42),
  pt(48.04, -31.52),
  pt(48.08, -31.6),
  pt(48.12, -31.62),
  pt(48.16, -31.58),
  pt(48.22, -31.6),
  pt(48.3, -31.66),
  pt(48.38, -31.7),
  pt(48.45, -31.78),
  pt(48.52, -31.74),
  pt(48.6, -31.8),
]

export const ISLANDS: { name: string; outline: LatLonDeg[] }[] = [
  { name: 'Sella Isle', outline: [pt(47.99, -31.8), pt(47.975, -31.7), pt(47.935, -31.68), pt(47.91, -31.76), pt(47.94, -31.83)] },
  { name: 'The Brannocks', outline: [pt(47.47, -31.13), pt(47.46, -31.08), pt(47.43, -31.09), pt(47.44, -31.14)] },
]

export interface PlaceLabel {
  name: string
  at: LatLonDeg
  kind: 'town' | 'land' | 'sea'
}

export const PLACES: PlaceLabel[] = [
  { name: 'Corran Point', at: pt(48.47, -31.6), kind: 'town' },
  { name: 'Wyndle', at: pt(48.34, -30.75), kind: 'town' },
  { name: 'Ostby Fells', at: pt(47.98, -30.35), kind: 'land' },
  { name: 'Lantry', at: pt(47.33, -30.25), kind: 'town' },
  { name: 'Sella Isle', at: pt(48.02, -31.9), kind: 'land' },
  { name: 'Marrow Sound', at: pt(47.62, -31.7), kind: 'sea' },
]
