/**
 * The units each estimate input takes, as its strict schema reads them (shared/calculations/inputs.ts),
 * and plain formatting of results: every figure with its unit.
 */
import { unitsOf } from '@shared/schemas/quantities'

export const U = {
  freq: unitsOf('frequency'),
  bandwidth: unitsOf('bandwidth'),
  distance: unitsOf('distance'),
  height: unitsOf('height'),
  dbm: unitsOf('power'),
  db: ['dB'],
  dbi: unitsOf('gain'),
  fieldStrength: unitsOf('fieldStrength'),
  pfd: unitsOf('pfd'),
  angle: unitsOf('angle'),
  plain: ['no unit'],
} as const

const nf = (digits: number) => new Intl.NumberFormat('en-GB', { minimumFractionDigits: digits, maximumFractionDigits: digits })

/** A level or a dB figure: two decimals and the unit, with a true minus sign. */
export function fmt(value: number | undefined | null, unit: string, digits = 2): string {
  if (value === undefined || value === null || !Number.isFinite(value)) return '—'
  return `${nf(digits).format(value).replace('-', '−')} ${unit}`
}

/** A power in watts in a readable prefix (µW, mW, W, kW). */
export function fmtWatts(w: number | undefined): string {
  if (w === undefined || !Number.isFinite(w)) return '—'
  const a = Math.abs(w)
  if (a >= 1e3) return fmt(w / 1e3, 'kW', 3)
  if (a >= 1) return fmt(w, 'W', 3)
  if (a >= 1e-3) return fmt(w * 1e3, 'mW', 3)
  return fmt(w * 1e6, 'µW', 3)
}

/** A frequency in its natural prefix. */
export function fmtHz(hz: number | undefined): string {
  if (hz === undefined || !Number.isFinite(hz)) return '—'
  if (hz >= 1e9) return `${+(hz / 1e9).toPrecision(6)} GHz`
  if (hz >= 1e6) return `${+(hz / 1e6).toPrecision(6)} MHz`
  if (hz >= 1e3) return `${+(hz / 1e3).toPrecision(6)} kHz`
  return `${hz} Hz`
}

/** A distance in m below 10 km, else km. */
export function fmtM(m: number | undefined): string {
  if (m === undefined || !Number.isFinite(m)) return '—'
  return m >= 10_000 ? fmt(m / 1000, 'km', 2) : fmt(m, 'm', m < 10 ? 2 : 0)
}

/** A bound of a validity range in readable units. */
export function fmtBound(value: number, unit: string): string {
  if (unit === 'Hz') return fmtHz(value)
  if (unit === 'm') return fmtM(value)
  return `${value} ${unit}`
}
