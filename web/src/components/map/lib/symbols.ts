/**
 * The map's symbols: each layer has its own colour from the project's palette (styles.css;
 * SVG presentation attributes cannot read CSS variables, so the values are repeated here) AND
 * its own shape, so layers stay apart without colour vision. Markup strings, shared by the
 * Leaflet icons and the legend. Pure.
 */
export const MAP_COLOURS = {
  ink: '#18212b',
  paper: '#f6f4ee',
  surface: '#ffffff',
  sea: '#dcebef', // signal-soft
  office: '#0e5a6e', // signal
  measurement: '#a84b00', // a map-only amber
  source: '#a3201a', // danger
  station: '#2b5ca6', // a map-only blue
  nearby: '#586270', // a map-only slate
  field: '#7a838d',
  // a case's harm class, as its badge draws it (styles.css --color-priority-1…4)
  harm1: '#7a1f45',
  harm2: '#18212b',
  harm3: '#0e5a6e',
  harm4: '#4a5562',
} as const

export type SymbolKind = 'victim' | 'measurement' | 'bearing' | 'source' | 'ellipse' | 'station' | 'office' | 'officeArea' | 'nearbyCase' | 'region' | 'harm1' | 'harm2' | 'harm3' | 'harm4' | 'areaDraft' | 'vertex' | 'crossing'

const C = MAP_COLOURS
const svg = (size: number, body: string) => `<svg xmlns="http://www.w3.org/2000/svg" width="${size}" height="${size}" viewBox="-12 -12 24 24" aria-hidden="true" focusable="false">${body}</svg>`

/** SVG markup of a layer's symbol, `size` CSS px square, centred on its point. */
export function symbolSvg(kind: SymbolKind, size = 24): string {
  switch (kind) {
    case 'victim': // a target: ring, dot and ticks
      return svg(size, `<circle r="7" fill="${C.surface}" fill-opacity="0.85" stroke="${C.ink}" stroke-width="2.5"/><circle r="2.2" fill="${C.ink}"/><path d="M0 -11.5V-7M0 7V11.5M-11.5 0H-7M7 0H11.5" stroke="${C.ink}" stroke-width="2.5"/>`)
    case 'measurement': // a filled circle
      return svg(size, `<circle r="6" fill="${C.measurement}" stroke="${C.surface}" stroke-width="2"/>`)
    case 'bearing': // a dashed line with an arrow head
      return svg(size, `<path d="M-10 6L8 -6" stroke="${C.measurement}" stroke-width="2.5" stroke-dasharray="4 3"/><path d="M9.5 -7L2 -6.5L6 -1Z" fill="${C.measurement}"/>`)
    case 'source': // a diamond
      return svg(size, `<path d="M0 -9L9 0L0 9L-9 0Z" fill="${C.source}" stroke="${C.surface}" stroke-width="2"/>`)
    case 'ellipse':
      return svg(size, `<ellipse rx="10" ry="6" transform="rotate(-30)" fill="${C.source}" fill-opacity="0.15" stroke="${C.source}" stroke-width="2"/>`)
    case 'station': // a triangle
      return svg(size, `<path d="M0 -9L8.5 7H-8.5Z" fill="${C.station}" stroke="${C.surface}" stroke-width="2" stroke-linejoin="round"/>`)
    case 'office': // a square
      return svg(size, `<rect x="-7" y="-7" width="14" height="14" fill="${C.office}" stroke="${C.surface}" stroke-width="2"/>`)
    case 'officeArea':
      return svg(size, `<rect x="-9" y="-7" width="18" height="14" fill="${C.office}" fill-opacity="0.06" stroke="${C.office}" stroke-width="2" stroke-dasharray="4 3"/>`)
    case 'nearbyCase': // a hollow ring
      return svg(size, `<circle r="6" fill="${C.surface}" stroke="${C.nearby}" stroke-width="3"/>`)
    // a case by harm class: the badge's shapes, heavier for greater harm (components/ui/priority-badge)
    case 'harm1': // a filled diamond
      return svg(size, `<path d="M0 -9L9 0L0 9L-9 0Z" fill="${C.harm1}" stroke="${C.surface}" stroke-width="2"/>`)
    case 'harm2': // a filled triangle
      return svg(size, `<path d="M0 -8.5L8.5 7H-8.5Z" fill="${C.harm2}" stroke="${C.surface}" stroke-width="2" stroke-linejoin="round"/>`)
    case 'harm3': // an open square
      return svg(size, `<rect x="-6" y="-6" width="12" height="12" fill="${C.surface}" stroke="${C.harm3}" stroke-width="3"/>`)
    case 'harm4': // an open circle
      return svg(size, `<circle r="6" fill="${C.surface}" stroke="${C.harm4}" stroke-width="2.5"/>`)
    case 'region':
      return svg(size, `<path d="M-10 -6H10V6H-10Z" fill="${C.paper}" stroke="${C.ink}" stroke-width="2.5"/>`)
    // the area editor: the outline being drawn (solid, unlike the dashed areas on record), its corners, where it crosses itself
    case 'areaDraft':
      return svg(size, `<path d="M-9 7L-6 -8L9 -3L6 8Z" fill="${C.office}" fill-opacity="0.15" stroke="${C.office}" stroke-width="2.5" stroke-linejoin="round"/>`)
    case 'vertex': // an open square, a handle
      return svg(size, `<rect x="-7" y="-7" width="14" height="14" fill="${C.surface}" stroke="${C.office}" stroke-width="3"/>`)
    case 'crossing': // a cross in a ring
      return svg(size, `<circle r="9" fill="${C.surface}" stroke="${C.source}" stroke-width="2.5"/><path d="M-4.5 -4.5L4.5 4.5M4.5 -4.5L-4.5 4.5" stroke="${C.source}" stroke-width="3"/>`)
  }
}

/** Text for Leaflet's attribution box, which takes HTML: the tile server's credit as plain text. */
export function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!)
}
