/**
 * Pure helpers of the spectrum chart: two traces on one frequency axis, the MHz ticks, and the
 * spectrogram's bytes as colours of the project's palette.
 */

/** Two traces on the union of their frequencies (uPlot wants one x array); a trace is null where it has no point. */
export function alignTraces(a: { freqHz: number[]; level: number[] }, b?: { freqHz: number[]; level: number[] } | null): { x: number[]; a: (number | null)[]; b: (number | null)[] } {
  if (!b) return { x: a.freqHz.slice(), a: a.level.slice(), b: a.freqHz.map(() => null) }
  const x: number[] = []
  const ya: (number | null)[] = []
  const yb: (number | null)[] = []
  let i = 0
  let j = 0
  while (i < a.freqHz.length || j < b.freqHz.length) {
    const fa = i < a.freqHz.length ? a.freqHz[i]! : Infinity
    const fb = j < b.freqHz.length ? b.freqHz[j]! : Infinity
    if (fa === fb) {
      x.push(fa)
      ya.push(a.level[i++]!)
      yb.push(b.level[j++]!)
    } else if (fa < fb) {
      x.push(fa)
      ya.push(a.level[i++]!)
      yb.push(null)
    } else {
      x.push(fb)
      ya.push(null)
      yb.push(b.level[j++]!)
    }
  }
  return { x, a: ya, b: yb }
}

/** Tick labels in MHz with as many decimals as the tick spacing needs. */
export function mhzTicks(splitsHz: number[]): string[] {
  const stepMhz = (splitsHz.length > 1 ? Math.abs(splitsHz[1]! - splitsHz[0]!) : 1e6) / 1e6
  // the fewest decimals that write the step exactly (0.025 MHz needs 3, not 2)
  let decimals = 0
  while (decimals < 6 && Math.abs(Math.round(stepMhz * 10 ** decimals) - stepMhz * 10 ** decimals) > 1e-6) decimals++
  return splitsHz.map((f) => (f / 1e6).toFixed(decimals))
}

/** A frequency in MHz for readouts, to the hertz. */
export const formatMhz = (hz: number) => `${(hz / 1e6).toFixed(6)} MHz`

/** The colour ramp of the spectrogram, low to high: paper, signal-soft, signal, ink (styles.css). */
export const SPECTROGRAM_RAMP = ['#f6f4ee', '#dcebef', '#0e5a6e', '#18212b'] as const

const rgb = (hex: string) => [1, 3, 5].map((k) => parseInt(hex.slice(k, k + 2), 16)) as [number, number, number]

/** The ramp's colour for a byte 0–255 (linear between the stops). */
export function rampColour(byte: number): [number, number, number] {
  const stops = SPECTROGRAM_RAMP.map(rgb)
  const t = (Math.min(255, Math.max(0, byte)) / 255) * (stops.length - 1)
  const k = Math.min(stops.length - 2, Math.floor(t))
  const f = t - k
  const [a, b] = [stops[k]!, stops[k + 1]!]
  return [0, 1, 2].map((c) => Math.round(a[c]! + f * (b[c]! - a[c]!))) as [number, number, number]
}

/** Base64 cells (row-major, one byte each) as RGBA pixels of the ramp. */
export function spectrogramPixels(cellsBase64: string, rowCount: number, columnCount: number): Uint8ClampedArray<ArrayBuffer> {
  const bin = atob(cellsBase64)
  const px = new Uint8ClampedArray(rowCount * columnCount * 4)
  const lut = Array.from({ length: 256 }, (_, b) => rampColour(b))
  for (let k = 0; k < rowCount * columnCount; k++) {
    const [r, g, b] = lut[k < bin.length ? bin.charCodeAt(k) : 0]!
    px[4 * k] = r
    px[4 * k + 1] = g
    px[4 * k + 2] = b
    px[4 * k + 3] = 255
  }
  return px
}
