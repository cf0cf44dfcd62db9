/**
 * The one way a number typed by a person (or sent by a client) is read: strictly, with its
 * unit, normalised to the base unit. Every numeric field of a form uses it, so `"0x10"`,
 * `true`, `[]` or `1e-320` can never slip through as a quantity.
 *
 * What is accepted:
 * - a finite JSON number (e.g. `433.92`), in the unit given beside it or the field's default;
 * - a decimal string: optional sign (`-`, `+` or the typographic minus `−`), digits with at
 *   most one decimal separator (`.` or `,`), an optional exponent (`4.3392e2`), and an optional
 *   unit from the field's list after it (`"433.92 MHz"`, `"433,92"`, `"48.1°"`).
 *   Units match exactly; a case-insensitive match is also taken when it names one unit only
 *   and the text is written all in one case or starts with the unit's own letter (`"mhz"` and
 *   `"Mhz"` are MHz; `"mHz"` — millihertz — is refused, never read as MHz).
 *
 * What is refused, each with a plain message: booleans, arrays, objects, NaN and ±Infinity;
 * hexadecimal, octal and binary (`0x10`, `0o17`, `0b101`) and every other non-decimal text;
 * thousands separators, and a comma followed by exactly three digits (`"1,000"`: one or a
 * thousand? — the writer is asked to say); values too small to be stored as an ordinary
 * double (subnormal, or underflowing to zero) and values that overflow; units the field does
 * not take. An empty or blank string, `null` or `undefined` is missing, never 0.
 *
 * Scaling by a power of ten (kHz, MHz, GHz) is done in decimal, so 433.92 MHz is exactly
 * 433 920 000 Hz and not 433 920 000.00000006.
 */
import { z } from 'zod'

/** The smallest positive normal double, 2^−1022; anything nearer zero (but not zero) is subnormal. */
export const MIN_NORMAL_DOUBLE = 2 ** -1022
/** Longest text read as a number (a guard, not a limit anyone meets by typing). */
export const MAX_NUMBER_TEXT_LENGTH = 64

export type UnitTable<U extends string = string> = Readonly<Record<U, number>>

export interface NumberWithUnitSpec<U extends string = string> {
  /** The units the field takes, each with its factor to the base unit. None: a bare number only. */
  units?: UnitTable<U>
  /** The unit of a number written without one (for `numberWithUnit`; default: the base unit, factor 1). */
  defaultUnit?: U
  /** Bounds in the base unit. */
  min?: number
  max?: number
  /** The value must be above `min`, not equal to it. */
  minExclusive?: boolean
  /** Only whole numbers (in the base unit). */
  integer?: boolean
  /** How messages name the quantity, in a sentence: "the frequency", "the latitude". */
  label: string
  /** An example of a good value for messages: "433.92". */
  example?: string
  /** Message when the field is missing. */
  requiredMessage?: string
  /** Message when the value is outside [min, max]. */
  rangeMessage?: string
  /** Message when the value is not above an exclusive min. */
  minExclusiveMessage?: string
}

/** A number as written: its amount and the unit written after it, if any. */
export interface WrittenNumber<U extends string = string> {
  amount: number
  unit: U | null
  /** Sign, digits and exponent as read (decimal scaling works on these). */
  decimal: { negative: boolean; digits: string; exponent: number }
}

export type Read<T> = { ok: true; value: T } | { ok: false; missing: boolean; message: string }

const fail = (message: string, missing = false): { ok: false; missing: boolean; message: string } => ({ ok: false, missing, message })
const cap = (s: string) => s.charAt(0).toUpperCase() + s.slice(1)

// sign · integer part · separator · fraction · exponent · unit (anything after, checked against the list)
const GRAMMAR = /^([+\-\u2212])?(\d*)(?:([.,])(\d*))?(?:[eE]([+\-\u2212]?\d{1,4}))?(?:\s*(\S.*))?$/

function notANumber<U extends string>(spec: NumberWithUnitSpec<U>): string {
  return `Enter ${spec.label} as a decimal number${spec.example ? `, like ${spec.example}` : ''}.`
}

function unitList(units: UnitTable): string {
  return Object.keys(units).join(', ')
}

function findUnit<U extends string>(written: string, units: UnitTable<U> | undefined): U | undefined {
  if (!units) return undefined
  const keys = Object.keys(units) as U[]
  const exact = keys.find((k) => k === written)
  if (exact) return exact
  // a prefix's case can carry meaning (mHz is millihertz, MHz megahertz): fold only text written
  // all in one case ("mhz", "MHZ") or whose first letter matches exactly ("Mhz")
  const uniform = written === written.toLowerCase() || written === written.toUpperCase()
  const folded = keys.filter((k) => k.toLowerCase() === written.toLowerCase() && (uniform || k[0] === written[0]))
  return folded.length === 1 ? folded[0] : undefined
}

/** A number whose nonzero digits vanished or overflowed in the double, or became subnormal. */
function unstorable(x: number, digits: string): boolean {
  if (!Number.isFinite(x)) return true
  if (x === 0) return /[1-9]/.test(digits)
  return Math.abs(x) < MIN_NORMAL_DOUBLE
}

/**
 * Reads the number and the unit written with it, without range checks. Missing input
 * (undefined, null, blank) is reported as `missing`.
 */
export function readWrittenNumber<U extends string>(input: unknown, spec: NumberWithUnitSpec<U>): Read<WrittenNumber<U>> {
  if (input === undefined || input === null) return fail(spec.requiredMessage ?? `Enter ${spec.label}.`, true)
  let text: string
  if (typeof input === 'number') {
    if (!Number.isFinite(input)) return fail(notANumber(spec))
    text = String(input) // JavaScript writes every finite double in this grammar ("1.5e-7", "433.92")
  } else if (typeof input === 'string') {
    text = input.trim()
    if (text === '') return fail(spec.requiredMessage ?? `Enter ${spec.label}.`, true)
    if (text.length > MAX_NUMBER_TEXT_LENGTH) return fail(notANumber(spec))
  } else {
    return fail(notANumber(spec))
  }
  const m = GRAMMAR.exec(text)
  if (!m) return fail(notANumber(spec))
  const [, sign, intPart = '', separator, fracPart = '', exponentText, unitText] = m
  if (intPart === '' && fracPart === '') return fail(notANumber(spec))
  if (separator === ',' && fracPart.length === 3 && exponentText === undefined) {
    return fail(`In “${intPart},${fracPart}”, is the comma a thousands separator or a decimal comma? Write ${intPart}${fracPart} or ${intPart}.${fracPart}.`)
  }
  let unit: U | null = null
  if (unitText !== undefined) {
    // a leftover that continues the number ("0x10" leaves "x10", "1.2.3" leaves ".3", "1e99999"
    // leaves "e99999") is a number written wrongly, not a unit
    const found = findUnit(unitText.trim(), spec.units)
    if (!found) {
      const numberLike = /^([\d.,+\-\u2212]|[eE][+\-\u2212]?\d)/.test(unitText) || (intPart === '0' && separator === undefined && /^[xob]/i.test(unitText))
      if (!spec.units || Object.keys(spec.units).length === 0 || numberLike) return fail(notANumber(spec))
      return fail(`Use one of these units for ${spec.label}: ${unitList(spec.units)}.`)
    }
    unit = found
  }
  const negative = sign === '-' || sign === '\u2212'
  const exponent = exponentText === undefined ? 0 : Number(exponentText.replace('\u2212', '-'))
  const digits = `${intPart || '0'}.${fracPart || '0'}`
  const amount = Number(`${negative ? '-' : ''}${digits}e${exponent}`) + 0 // + 0 turns −0 into 0
  if (unstorable(amount, digits)) return fail(Math.abs(amount) === Infinity ? tooLarge(spec) : tooSmall(spec))
  return { ok: true, value: { amount, unit, decimal: { negative, digits, exponent } } }
}

function tooLarge(spec: NumberWithUnitSpec): string {
  return spec.rangeMessage ?? `${cap(spec.label)} is too large.`
}
function tooSmall(spec: NumberWithUnitSpec): string {
  return `${cap(spec.label)} is too close to zero to be a real value.`
}

/** The power of ten a factor is (1e6 → 6), or undefined when it is not one. */
function powerOfTen(factor: number): number | undefined {
  if (!(factor > 0)) return undefined
  const k = Math.round(Math.log10(factor))
  return Number(`1e${k}`) === factor ? k : undefined
}

/**
 * The written number in the base unit: its own unit if one was written, else `unit`.
 * Powers of ten are applied in decimal (exact to the double nearest the decimal value).
 */
export function inBaseUnit<U extends string>(n: WrittenNumber<U>, unit: U | undefined, units: UnitTable<U> | undefined): number {
  const u = n.unit ?? unit
  const factor = u === undefined || !units ? 1 : units[u]
  const k = powerOfTen(factor)
  if (k === undefined) return n.amount * factor + 0
  return Number(`${n.decimal.negative ? '-' : ''}${n.decimal.digits}e${n.decimal.exponent + k}`) + 0
}

/** Range and kind checks of a value in the base unit; the message, or undefined when it passes. */
export function checkNumber(value: number, digits: string, spec: NumberWithUnitSpec): string | undefined {
  if (unstorable(value, digits)) return Math.abs(value) === Infinity ? tooLarge(spec) : tooSmall(spec)
  if (spec.min !== undefined && (spec.minExclusive ? !(value > spec.min) : value < spec.min)) {
    return spec.minExclusive ? (spec.minExclusiveMessage ?? spec.rangeMessage ?? `${cap(spec.label)} must be above ${spec.min}.`) : rangeText(spec)
  }
  if (spec.max !== undefined && value > spec.max) return rangeText(spec)
  if (spec.integer && !Number.isInteger(value)) return `${cap(spec.label)} must be a whole number.`
  return undefined
}

function rangeText(spec: NumberWithUnitSpec): string {
  if (spec.rangeMessage) return spec.rangeMessage
  if (spec.min !== undefined && spec.max !== undefined) return `${cap(spec.label)} must be from ${spec.min} to ${spec.max}.`
  if (spec.min !== undefined) return `${cap(spec.label)} must be at least ${spec.min}.`
  return `${cap(spec.label)} must be at most ${spec.max}.`
}

/** Reads a number with its unit and checks it: the value in the base unit, or why not. */
export function readNumberWithUnit<U extends string>(input: unknown, spec: NumberWithUnitSpec<U>, unitIfNoneWritten: U | undefined = spec.defaultUnit): Read<number> {
  const written = readWrittenNumber(input, spec)
  if (!written.ok) return written
  const value = inBaseUnit(written.value, unitIfNoneWritten, spec.units)
  const problem = checkNumber(value, written.value.decimal.digits, spec)
  return problem ? fail(problem) : { ok: true, value }
}

type Optional = { optional: true }
type Field<T> = z.ZodPipe<z.ZodUnknown, z.ZodTransform<T, unknown>>
/** An optional field: the key may be left out of the object (its input type says so too). */
type OptionalField<T> = z.ZodPipe<z.ZodOptional<z.ZodUnknown>, z.ZodTransform<T | undefined, unknown>>

/**
 * The input of such a field as the API document shows it: the parser reads any JSON value, so
 * words, not a type, tell a client what to send. `plainUnit`: the unit of a bare number, if fixed.
 */
export function documentedNumberInput(words: { label: string; units: readonly string[]; plainUnit?: string; example?: string }): z.ZodUnknown {
  const written = words.units.length ? `, or decimal text with one of its units (${words.units.join(', ')})` : ', or its decimal text'
  const example = words.example ? `, e.g. "${words.example}"` : ''
  return z.unknown().meta({ description: `${cap(words.label)}: a number${words.plainUnit ? ` in ${words.plainUnit}` : ''}${written}${example}.` })
}

const inputOf = (spec: NumberWithUnitSpec, plainUnit?: string) =>
  documentedNumberInput({ label: spec.label, units: spec.units ? Object.keys(spec.units) : [], plainUnit, example: spec.example })

/**
 * A zod field for a number with a unit: strict, checked, normalised to the base unit.
 * With `optional: true`, a missing or blank value is `undefined` instead of an error.
 */
export function numberWithUnit<U extends string>(spec: NumberWithUnitSpec<U> & Optional): OptionalField<number>
export function numberWithUnit<U extends string>(spec: NumberWithUnitSpec<U> & { optional?: false }): Field<number>
export function numberWithUnit<U extends string>(spec: NumberWithUnitSpec<U> & { optional?: boolean }): Field<number> | OptionalField<number> {
  const read = (input: unknown, ctx: z.core.$RefinementCtx<unknown>) => {
    const r = readNumberWithUnit(input, spec)
    if (r.ok) return r.value
    if (r.missing && spec.optional) return undefined
    ctx.addIssue({ code: 'custom', message: r.message })
    return z.NEVER
  }
  const input = inputOf(spec, spec.defaultUnit ?? (spec.units ? Object.keys(spec.units).find((u) => spec.units![u as U] === 1) : undefined))
  return spec.optional ? input.optional().transform(read) : input.transform((value, ctx) => read(value, ctx)!)
}

/**
 * A zod field for a number whose unit may be chosen in another field (a unit select beside
 * it): reads the amount and any unit written with it, and checks the sign, which no unit
 * changes. The form converts it with `inBaseUnit` once the unit beside it is known, and checks
 * the range there with `checkNumber`.
 */
export function writtenNumber<U extends string>(spec: NumberWithUnitSpec<U> & Optional): OptionalField<WrittenNumber<U>>
export function writtenNumber<U extends string>(spec: NumberWithUnitSpec<U> & { optional?: false }): Field<WrittenNumber<U>>
export function writtenNumber<U extends string>(spec: NumberWithUnitSpec<U> & { optional?: boolean }): Field<WrittenNumber<U>> | OptionalField<WrittenNumber<U>> {
  const read = (input: unknown, ctx: z.core.$RefinementCtx<unknown>) => {
    const r = readWrittenNumber(input, spec)
    if (!r.ok) {
      if (r.missing && spec.optional) return undefined
      ctx.addIssue({ code: 'custom', message: r.message })
      return z.NEVER
    }
    const a = r.value.amount
    if (spec.min === 0 && (spec.minExclusive ? !(a > 0) : a < 0)) {
      ctx.addIssue({ code: 'custom', message: spec.minExclusive ? (spec.minExclusiveMessage ?? `${cap(spec.label)} must be above zero.`) : rangeText(spec) })
      return z.NEVER
    }
    return r.value
  }
  const input = inputOf(spec)
  return spec.optional ? input.optional().transform(read) : input.transform((value, ctx) => read(value, ctx)!)
}

/** x × 10^k, worked on the decimal digits so that 433.92 × 10^6 is exactly 433 920 000. */
function shiftDecimal(x: number, k: number): number {
  const m = /^(-?[\d.]+)(?:e([+-]?\d+))?$/.exec(String(x))
  if (!m) return x * Number(`1e${k}`) // not reached for finite x
  return Number(`${m[1]}e${Number(m[2] ?? 0) + k}`) + 0
}

/** A figure in a unit → the base unit (exact for powers of ten): 433.92 MHz → 433 920 000 Hz. */
export function fromUnit<U extends string>(figure: number, unit: U, units: UnitTable<U>): number {
  const k = powerOfTen(units[unit])
  return k === undefined ? figure * units[unit] + 0 : shiftDecimal(figure, k)
}

/** A value in the base unit → the figure in a unit (exact for powers of ten): 433 920 000 Hz → 433.92 MHz. */
export function inUnit<U extends string>(valueInBase: number, unit: U, units: UnitTable<U>): number {
  const k = powerOfTen(units[unit])
  return k === undefined ? valueInBase / units[unit] + 0 : shiftDecimal(valueInBase, -k)
}
