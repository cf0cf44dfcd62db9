/**
 * The quantities a person types on the workbench, each with the units the unit selector offers
 * and how each unit reaches the base unit named in the field's key (`…Hz`, `…Dbm`, `…M`…).
 *
 * Linear units scale (433.92 MHz → 433 920 000 Hz, exact in decimal). Power and level units
 * convert logarithmically: 1 W is 30 dBm, 1 V/m is 120 dBµV/m. These are the definitions of
 * the units (decibel references: dBm re 1 mW, dBW re 1 W, dBµV/m re 1 µV/m; dBd = dBi − 2.15,
 * the half-wave dipole's gain, as in ERP = EIRP − 2.15 dB — common practice, no source).
 *
 * A number written with its unit ("2 W") or a number and the unit chosen beside it reads the
 * same; a number written bare is read in the field's default unit.
 */
import { z } from 'zod'
import { checkNumber, documentedNumberInput, readWrittenNumber, type NumberWithUnitSpec, type Read, type WrittenNumber } from './number-with-unit'

/** How one unit reaches the base unit: a factor (linear) or a conversion that needs a positive amount. */
export type UnitRule = { factor: number } | { toBase: (amount: number) => number; positiveOnly?: boolean }

export interface QuantityDef {
  /** The base unit values are stored in (named in the field's key). */
  base: string
  /** Units offered, in the order the selector lists them; the first is the usual one. */
  units: Record<string, UnitRule>
  /** Other spellings read as a unit (typed by hand): 'dBuV/m' for 'dBµV/m'. */
  aliases?: Record<string, string>
}

const log10 = Math.log10
const lin = (factor: number): UnitRule => ({ factor })

export const QUANTITIES = {
  frequency: { base: 'Hz', units: { MHz: lin(1e6), kHz: lin(1e3), GHz: lin(1e9), Hz: lin(1) } },
  bandwidth: { base: 'Hz', units: { kHz: lin(1e3), MHz: lin(1e6), Hz: lin(1) } },
  distance: { base: 'm', units: { m: lin(1), km: lin(1e3) } },
  height: { base: 'm', units: { m: lin(1) } },
  /** Powers (EIRP, ERP, conducted, received) in dBm. */
  power: {
    base: 'dBm',
    units: {
      dBm: lin(1),
      dBW: { toBase: (x) => x + 30 },
      W: { toBase: (x) => 10 * log10(x) + 30, positiveOnly: true },
      mW: { toBase: (x) => 10 * log10(x), positiveOnly: true },
    },
  },
  fieldStrength: {
    base: 'dBµV/m',
    units: {
      'dBµV/m': lin(1),
      'V/m': { toBase: (x) => 20 * log10(x) + 120, positiveOnly: true },
      'mV/m': { toBase: (x) => 20 * log10(x) + 60, positiveOnly: true },
      'µV/m': { toBase: (x) => 20 * log10(x), positiveOnly: true },
    },
    aliases: { 'dBuV/m': 'dBµV/m', 'uV/m': 'µV/m' },
  },
  pfd: {
    base: 'dBW/m²',
    units: { 'dBW/m²': lin(1), 'W/m²': { toBase: (x) => 10 * log10(x), positiveOnly: true }, 'dBm/m²': { toBase: (x) => x - 30 } },
    aliases: { 'dBW/m2': 'dBW/m²', 'W/m2': 'W/m²', 'dBm/m2': 'dBm/m²' },
  },
  /** A voltage at an instrument's input (dBµV re 1 µV). */
  voltage: {
    base: 'dBµV',
    units: { 'dBµV': lin(1), 'µV': { toBase: (x) => 20 * log10(x), positiveOnly: true }, mV: { toBase: (x) => 20 * log10(x) + 60, positiveOnly: true } },
    aliases: { dBuV: 'dBµV', uV: 'µV' },
  },
  antennaFactor: { base: 'dB/m', units: { 'dB/m': lin(1) }, aliases: { 'dB(1/m)': 'dB/m', 'dB/m⁻¹': 'dB/m' } },
  gain: { base: 'dBi', units: { dBi: lin(1), dBd: { toBase: (x) => x + 2.15 } } },
  loss: { base: 'dB', units: { dB: lin(1) } },
  specificAttenuation: { base: 'dB/km', units: { 'dB/km': lin(1) } },
  angle: { base: '°', units: { '°': lin(1) }, aliases: { deg: '°' } },
} as const satisfies Record<string, QuantityDef>

export type QuantityKind = keyof typeof QUANTITIES
export type UnitOf<K extends QuantityKind> = Extract<keyof (typeof QUANTITIES)[K]['units'], string>

/** The units the selector offers for a quantity, usual first. */
export function unitsOf(kind: QuantityKind): string[] {
  return Object.keys(QUANTITIES[kind].units)
}

export interface QuantitySpec extends Omit<NumberWithUnitSpec, 'units' | 'defaultUnit'> {
  /** Unit of a number written bare (default: the first unit offered). */
  defaultUnit?: string
}

function canonicalUnit(def: QuantityDef, written: string): string | undefined {
  if (written in def.units) return written
  const alias = def.aliases?.[written]
  if (alias) return alias
  // the strict parser's case folding, for the linear units it knows ("mhz" → MHz, never mHz)
  return undefined
}

/** Reads a typed quantity: the value in the base unit, or why not. Range checks are in the base unit. */
export function readQuantity(input: unknown, kind: QuantityKind, spec: QuantitySpec): Read<number> {
  const def: QuantityDef = QUANTITIES[kind]
  const unitNames = [...Object.keys(def.units), ...Object.keys(def.aliases ?? {})]
  const written = readWrittenNumber(input, { ...spec, units: Object.fromEntries(unitNames.map((u) => [u, 1])) })
  if (!written.ok) return written
  const n: WrittenNumber = written.value
  const unit = canonicalUnit(def, n.unit ?? spec.defaultUnit ?? Object.keys(def.units)[0]!)
  if (!unit) return { ok: false, missing: false, message: `Use one of these units for ${spec.label}: ${unitsOf(kind).join(', ')}.` }
  const rule = def.units[unit]!
  let value: number
  // the digits the range check judges: as written for a scaled unit, of the result for a converted one
  // (1 mW is 0 dBm: a value of zero that is no underflow of the written digits)
  let digits = n.decimal.digits
  if ('factor' in rule) {
    // decimal shift for powers of ten, as the strict parser does (433.92 MHz is exactly 433 920 000 Hz)
    const k = Math.round(Math.log10(rule.factor))
    value = Number(`${n.decimal.negative ? '-' : ''}${n.decimal.digits}e${n.decimal.exponent + k}`) + 0
  } else {
    if (rule.positiveOnly && !(n.amount > 0)) return { ok: false, missing: false, message: `${cap(spec.label)} in ${unit} must be above zero.` }
    value = rule.toBase(n.amount)
    digits = String(Math.abs(value))
  }
  const problem = checkNumber(value, digits, { ...spec, label: spec.label })
  return problem ? { ok: false, missing: false, message: inBaseWords(problem, def.base) } : { ok: true, value }
}

/** Range messages are in the base unit: say so ("must be from -400 to 400 dBm"). */
function inBaseWords(message: string, base: string): string {
  return /\d\.$/.test(message) ? `${message.slice(0, -1)} ${base}.` : message
}

const cap = (s: string) => s.charAt(0).toUpperCase() + s.slice(1)

type Field = z.ZodPipe<z.ZodUnknown, z.ZodTransform<number, unknown>>
type OptionalField = z.ZodPipe<z.ZodOptional<z.ZodUnknown>, z.ZodTransform<number | undefined, unknown>>

/**
 * A zod field for a typed quantity: strict, in any unit its selector offers, normalised to the
 * base unit. With `optional: true` a missing or blank value is `undefined`.
 */
export function quantity(kind: QuantityKind, spec: QuantitySpec & { optional: true }): OptionalField
export function quantity(kind: QuantityKind, spec: QuantitySpec & { optional?: false }): Field
export function quantity(kind: QuantityKind, spec: QuantitySpec & { optional?: boolean }): Field | OptionalField {
  const read = (input: unknown, ctx: z.core.$RefinementCtx<unknown>) => {
    const r = readQuantity(input, kind, spec)
    if (r.ok) return r.value
    if (r.missing && spec.optional) return undefined
    ctx.addIssue({ code: 'custom', message: r.message })
    return z.NEVER
  }
  const input = documentedNumberInput({ label: spec.label, units: unitsOf(kind), plainUnit: spec.defaultUnit ?? unitsOf(kind)[0], example: spec.example })
  return spec.optional ? input.optional().transform(read) : input.transform((value, ctx) => read(value, ctx)!)
}

/** What a quantity field sends: the figure as typed and the unit chosen beside it ("2 W"). */
export function withUnit(figure: string, unit: string): string {
  const t = figure.trim()
  return t === '' ? '' : `${t} ${unit}`
}
