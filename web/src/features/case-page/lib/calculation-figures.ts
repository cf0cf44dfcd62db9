/**
 * The main figure of a stored calculation, read generically from its outputs (whatever its
 * kind): the quantity its interval bounds, else the value itself, else the first level in
 * decibels of the value, else its first number. The unit comes from the quantity's name
 * (`eirpDbm` → dBm, `marginDb` → dB).
 */
import type { CalculationView } from '@shared/schemas/views'

/** Name endings and their units, longest first so `DbuvPerM` wins over `M`. */
const UNIT_ENDINGS: readonly [string, string][] = [
  ['DbuvPerM', 'dBµV/m'],
  ['DbwPerM2', 'dBW/m²'],
  ['DbmPerMhz', 'dBm/MHz'],
  ['DbmPerHz', 'dBm/Hz'],
  ['VPerM', 'V/m'],
  ['WPerM2', 'W/m²'],
  ['Dbm', 'dBm'],
  ['Dbw', 'dBW'],
  ['Dbi', 'dBi'],
  ['Dbd', 'dBd'],
  ['Db', 'dB'],
  ['Hz', 'Hz'],
  ['Deg', '°'],
  ['Km', 'km'],
  ['M', 'm'],
  ['W', 'W'],
]

/** The unit named at the end of a quantity's key, or '' when it names none. */
export function unitOfKey(key: string): string {
  for (const [ending, unit] of UNIT_ENDINGS) {
    if (key.endsWith(ending) && key.length > ending.length && /[a-z0-9]/.test(key[key.length - ending.length - 1]!)) return unit
  }
  return ''
}

/** Words the trade writes in capitals (or its own way), whatever their place in a key. */
const TRADE_WORDS: Record<string, string> = { eirp: 'EIRP', erp: 'ERP', inr: 'I/N', rbw: 'RBW', pfd: 'pfd' }

/** The quantity's name in words: `eirpDbm` → "EIRP", `marginDb` → "margin". */
export function nameOfKey(key: string): string {
  const unit = UNIT_ENDINGS.find(([ending]) => key.endsWith(ending) && key.length > ending.length)
  const stem = unit ? key.slice(0, -unit[0].length) : key
  return stem
    .replace(/([a-z0-9])([A-Z])/g, '$1 $2')
    .toLowerCase()
    .split(' ')
    .map((w) => TRADE_WORDS[w] ?? w)
    .join(' ')
}

export interface MainFigure {
  key: string
  name: string
  value: number
  unit: string
  interval?: { low: number; high: number; basis: string }
  /** A verdict or other word the value carries, when it has one. */
  verdict?: string
}

const isRecord = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v)

export function mainFigure(calc: Pick<CalculationView, 'outputs'>): MainFigure | null {
  const { value, interval } = calc.outputs
  const verdict = isRecord(value) && typeof value.verdict === 'string' ? value.verdict : undefined
  const withInterval = (key: string, v: number): MainFigure => ({
    key,
    name: nameOfKey(key),
    value: v,
    unit: unitOfKey(key),
    ...(interval && interval.quantity === key ? { interval: { low: interval.low, high: interval.high, basis: interval.basis } } : {}),
    ...(verdict ? { verdict } : {}),
  })
  if (typeof value === 'number') return withInterval(interval?.quantity ?? '', value)
  if (!isRecord(value)) return null
  if (interval && typeof value[interval.quantity] === 'number') return withInterval(interval.quantity, value[interval.quantity] as number)
  // no interval: the first level (dBm, dBW, dB…) the value holds, else its first number
  const numbers = Object.entries(value).filter((e): e is [string, number] => typeof e[1] === 'number')
  const pick = numbers.find(([k]) => unitOfKey(k).startsWith('dB')) ?? numbers[0]
  return pick ? withInterval(pick[0], pick[1]) : null
}

/** A figure as shown: at most two decimals, the typographic minus. */
export function formatFigure(v: number): string {
  return v.toLocaleString('en-GB', { maximumFractionDigits: 2, minimumFractionDigits: 0 }).replace('-', '\u2212')
}
