/**
 * An estimate form's state: one flat record of strings keyed by the input's path
 * (`measurement.freqHz`, `measurementContributions.0.name`), so it round-trips through a URL's
 * search params unchanged. A quantity keeps its figure under its path and its chosen unit
 * under `<path>~unit`; the inputs sent are "figure unit" strings, read strictly by the schema.
 */
import { withUnit } from '@shared/schemas/quantities'
import type { QuantityValue } from '@/components/ui/quantity-field'

export type FormState = Record<string, string>

export const unitKey = (path: string) => `${path}~unit`

/** The quantity at a path, in its chosen unit (the first offered when none was chosen). */
export function quantityAt(state: FormState, path: string, units: readonly string[]): QuantityValue {
  const unit = state[unitKey(path)]
  return { figure: state[path] ?? '', unit: unit && units.includes(unit) ? unit : units[0]! }
}

export function withQuantity(state: FormState, path: string, v: QuantityValue): FormState {
  return { ...state, [path]: v.figure, [unitKey(path)]: v.unit }
}

/** The text to send for a quantity: "figure unit", or undefined when nothing was typed. */
export function quantityInput(state: FormState, path: string, units: readonly string[]): string | undefined {
  const v = quantityAt(state, path, units)
  if (v.figure.trim() === '') return undefined
  // a unit-less number (an exponent, a coverage factor) is sent as typed
  return units[0] === NO_UNIT ? v.figure.trim() : withUnit(v.figure, v.unit)
}

/** The unit shown beside a number that has none (an exponent, a coverage factor). */
export const NO_UNIT = 'no unit'

/** A text or choice at a path, undefined when blank. */
export function textInput(state: FormState, path: string): string | undefined {
  const t = (state[path] ?? '').trim()
  return t === '' ? undefined : t
}

/** Drops every key under a path (a list row, a branch no longer chosen). */
export function withoutBranch(state: FormState, prefix: string): FormState {
  return Object.fromEntries(Object.entries(state).filter(([k]) => k !== prefix && !k.startsWith(`${prefix}.`) && !k.startsWith(`${prefix}~`)))
}

/** Leaves out keys whose value is undefined, so an optional input is simply absent. */
export function compact<T extends Record<string, unknown>>(o: T): Partial<T> {
  return Object.fromEntries(Object.entries(o).filter(([, v]) => v !== undefined)) as Partial<T>
}

/** Errors by input path, as the schema (or the server's 400 details) names them. */
export type FieldErrors = Record<string, string>
