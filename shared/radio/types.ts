/**
 * Shapes shared by every method of the radio library.
 *
 * Every result that can feed a finding says which method produced it and where that method
 * is published, so a stored result can be recomputed and defended later.
 */

/** Identifies a method and the published text it implements. */
export interface MethodRef {
  /** Stable id, e.g. 'free-space-p525'. Stored with results: never rename. */
  id: string
  /** Document, revision and section, e.g. 'ITU-R P.525-4 §2.2 eq. (8)'. */
  source: string
}

/**
 * Coverage interval of a result's main quantity: ABSOLUTE bounds in that quantity's own unit
 * (dBm for an EIRP in dBm, dB for a margin in dB), never a ± half-width. `quantity` names the
 * key in `value` that the bounds belong to, so its unit is in its name.
 */
export interface CoverageInterval {
  /** Key of the bounded quantity in the result's value, e.g. 'eirpDbm' or 'marginDb'. */
  quantity: string
  /** Lower bound, in the unit of `quantity`. */
  low: number
  /** Upper bound, in the unit of `quantity`. */
  high: number
  /** How the interval was formed, e.g. 'GUM U = k·u_c, k = 2 (about 95 %)'. */
  basis: string
}

/** A result that a finding can rest on. */
export interface RadioResult<T> {
  value: T
  /** Coverage interval (about 95 % unless `basis` says otherwise), when an uncertainty was given. */
  interval?: CoverageInterval
  /** Plain-language warnings: outside a validity range, assumptions that matter. Never silent. */
  warnings: string[]
  method: MethodRef
}

/** A validity range stated as data, so the UI and the tests can read it. */
export interface ValidityRange {
  quantity: string
  min?: number
  max?: number
  unit: string
  source: string
}

/** Returns warnings for every value outside its range (inclusive bounds). */
export function checkValidity(ranges: ValidityRange[], values: Record<string, number>): string[] {
  const warnings: string[] = []
  for (const r of ranges) {
    const v = values[r.quantity]
    if (v === undefined) continue
    if ((r.min !== undefined && v < r.min) || (r.max !== undefined && v > r.max)) {
      const span = `${r.min ?? '−∞'}–${r.max ?? '∞'} ${r.unit}`
      warnings.push(`${r.quantity} = ${formatNumber(v)} ${r.unit} is outside the validity range ${span} (${r.source}).`)
    }
  }
  return warnings
}

function formatNumber(v: number): string {
  return Math.abs(v) >= 1e4 || (Math.abs(v) < 1e-2 && v !== 0) ? v.toExponential(3) : String(+v.toFixed(3))
}
