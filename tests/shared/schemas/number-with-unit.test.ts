import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { fromUnit, inUnit, MIN_NORMAL_DOUBLE, numberWithUnit, readNumberWithUnit, type NumberWithUnitSpec } from '../../../shared/schemas/number-with-unit'

// SI prefixes k = 10^3, M = 10^6, G = 10^9, T = 10^12: BIPM, SI Brochure, 9th edition 2019, Table 7.
const HZ_UNITS = { Hz: 1, kHz: 1e3, MHz: 1e6, GHz: 1e9, THz: 1e12 } as const
type HzUnit = keyof typeof HZ_UNITS
const frequency: NumberWithUnitSpec<HzUnit> = { units: HZ_UNITS, defaultUnit: 'MHz', min: 0, minExclusive: true, max: 3e12, label: 'the frequency' }
const unitless: NumberWithUnitSpec = { label: 'the count' }

const value = (input: unknown, spec: NumberWithUnitSpec<string> = frequency) => {
  const r = readNumberWithUnit(input, spec)
  return r.ok ? r.value : undefined
}
const refusal = (input: unknown, spec: NumberWithUnitSpec<string> = frequency) => {
  const r = readNumberWithUnit(input, spec)
  return r.ok ? undefined : r
}

/** Finite doubles that are normal (or zero): what a person can mean by a number. */
const normalDouble = fc.double({ noNaN: true, noDefaultInfinity: true }).filter((x) => x === 0 || Math.abs(x) >= MIN_NORMAL_DOUBLE)
const unitName = fc.constantFrom(...(Object.keys(HZ_UNITS) as HzUnit[]))

describe('readNumberWithUnit: what it refuses', () => {
  it('refuses every boolean, array and object, and never reads one as 0 or 1', () => {
    fc.assert(
      fc.property(fc.oneof(fc.boolean(), fc.array(fc.anything()), fc.object(), fc.constant(new Date(0))), (input) => {
        const r = refusal(input, unitless)
        expect(r).toMatchObject({ missing: false, message: 'Enter the count as a decimal number.' })
      }),
    )
  })

  it('refuses hexadecimal, octal and binary text that Number() would accept', () => {
    fc.assert(
      fc.property(fc.nat(), fc.constantFrom('0x', '0X', '0o', '0O', '0b', '0B'), (n, prefix) => {
        const text = prefix + n.toString(prefix[1]!.toLowerCase() === 'x' ? 16 : prefix[1]!.toLowerCase() === 'o' ? 8 : 2)
        expect(Number(text)).toBe(n) // the hole: JavaScript reads it as a number
        expect(refusal(text, unitless)?.message).toBe('Enter the count as a decimal number.')
        expect(refusal(text)?.message).toBe('Enter the frequency as a decimal number.')
      }),
    )
  })

  it('treats empty and whitespace-only strings, null and undefined as missing, never as 0', () => {
    fc.assert(
      fc.property(fc.stringMatching(/^[ \t\n\r]*$/), (blank) => {
        expect(refusal(blank)).toEqual({ ok: false, missing: true, message: 'Enter the frequency.' })
      }),
    )
    expect(refusal(null)?.missing).toBe(true)
    expect(refusal(undefined)?.missing).toBe(true)
  })

  it('refuses every subnormal number, as a JSON number and as text, whatever the unit', () => {
    const subnormal = fc.double({ min: -MIN_NORMAL_DOUBLE, max: MIN_NORMAL_DOUBLE, noNaN: true }).filter((x) => x !== 0 && Math.abs(x) < MIN_NORMAL_DOUBLE)
    fc.assert(
      fc.property(subnormal, unitName, (x, unit) => {
        expect(refusal(x)?.message).toMatch(/too close to zero/)
        expect(refusal(`${x} ${unit}`)?.message).toMatch(/too close to zero/)
      }),
    )
    expect(refusal('1e-320')?.message).toMatch(/too close to zero/)
    expect(refusal('1e-400', unitless)?.message, 'underflows to 0 but was not written as 0').toMatch(/too close to zero/)
  })

  it('refuses NaN, ±Infinity and text that overflows a double', () => {
    for (const x of [Number.NaN, Infinity, -Infinity, 'NaN', 'Infinity', '-Infinity', '1e400']) expect(refusal(x, unitless), String(x)).toBeDefined()
  })

  it('refuses any string that is not one decimal number followed by one allowed unit', () => {
    fc.assert(
      fc.property(fc.string({ maxLength: 20 }), (text) => {
        const decimal = /^\s*[+\-\u2212]?(\d+([.,]\d*)?|[.,]\d+)([eE][+\-\u2212]?\d{1,4})?\s*(Hz|kHz|MHz|GHz|THz|hz|khz|mhz|ghz|thz|HZ|KHZ|MHZ|GHZ|THZ)?\s*$/i
        if (!decimal.test(text) && text.trim() !== '') expect(refusal(text), JSON.stringify(text)).toBeDefined()
      }),
      { numRuns: 2000 },
    )
    for (const text of ['1.2.3', '12 34', '1,5,6', '1 000', '--5', '5-', 'e5', '.', '١٢٣', '4.3e', '433.92 furlongs', '433.92 Hz Hz']) expect(refusal(text), text).toBeDefined()
  })

  it('asks about a comma followed by exactly three digits instead of guessing one or a thousand', () => {
    expect(refusal('1,000')?.message).toBe('In “1,000”, is the comma a thousands separator or a decimal comma? Write 1000 or 1.000.')
    expect(value('1,5')).toBe(1_500_000)
  })

  it('refuses a unit the field does not take, naming the ones it does', () => {
    expect(refusal('5 m')?.message).toBe('Use one of these units for the frequency: Hz, kHz, MHz, GHz, THz.')
    expect(refusal('5 MHz', unitless)?.message).toBe('Enter the count as a decimal number.')
  })

  it('keeps every accepted value inside [min, max], and refuses the rest with the range message', () => {
    const spec = { label: 'the latitude', min: -90, max: 90, rangeMessage: 'Latitude is between −90 and 90.' }
    fc.assert(
      fc.property(normalDouble, (x) => {
        const r = readNumberWithUnit(x, spec)
        if (x >= -90 && x <= 90) expect(r).toEqual({ ok: true, value: x + 0 }) // −0 reads as 0
        else expect(r).toEqual({ ok: false, missing: false, message: 'Latitude is between −90 and 90.' })
      }),
    )
  })

  it('refuses a fraction where a whole number is asked for', () => {
    const page = { label: 'the page', min: 1, max: 100, integer: true }
    expect(refusal('2.5', page)?.message).toBe('The page must be a whole number.')
    expect(value('2', page)).toBe(2)
    expect(value('2.0', page)).toBe(2)
  })
})

describe('readNumberWithUnit: what it accepts', () => {
  it('reads any finite normal JSON number as itself in the default unit', () => {
    fc.assert(
      fc.property(normalDouble, (x) => {
        expect(value(x, unitless)).toBe(x + 0)
      }),
    )
  })

  it('reads the decimal text of a number as the same value as the number, with a point or a comma', () => {
    fc.assert(
      fc.property(normalDouble, (x) => {
        expect(value(String(x), unitless)).toBe(x + 0)
        const comma = String(x).replace('.', ',')
        if (!/,\d{3}$/.test(comma)) expect(value(comma, unitless)).toBe(x + 0)
      }),
    )
  })

  it('gives the same value for a bare number in the default unit and for the number with that unit written', () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-3, max: 3e3, noNaN: true }), unitName, (x, unit) => {
        const spec = { ...frequency, defaultUnit: unit }
        expect(value(`${x} ${unit}`, spec)).toBe(value(x, spec))
        expect(value(`${x}${unit}`, frequency)).toBe(value(x, spec))
      }),
    )
  })

  it('scales powers of ten in decimal: 433.92 MHz is exactly 433 920 000 Hz', () => {
    expect(1.005 * 1e3).not.toBe(1005) // binary floating point alone gets such figures wrong
    expect(value('1.005 kHz')).toBe(1005)
    expect(value(1.005, { ...frequency, defaultUnit: 'kHz' })).toBe(1005)
    expect(value('433.92 MHz')).toBe(433_920_000)
    expect(value('433,92')).toBe(433_920_000)
    expect(value(156.525)).toBe(156_525_000)
    expect(value('2.4835 GHz')).toBe(2_483_500_000)
    expect(value('0.1 kHz')).toBe(100)
  })

  it('takes a unit written all in one case, or starting with its own letter, when only one unit matches', () => {
    expect(value('433.92 mhz')).toBe(433_920_000)
    expect(value('1 GHZ')).toBe(1e9)
    expect(value('433.92 Mhz')).toBe(433_920_000)
  })

  it('never reads millihertz as megahertz: a prefix written in the other case is refused', () => {
    // SI: m is milli (10^-3), M is mega (10^6) — BIPM, The International System of Units (SI Brochure), 9th ed., §3 "Decimal multiples and submultiples of SI units"
    expect(refusal('433.92 mHz')?.message).toBe('Use one of these units for the frequency: Hz, kHz, MHz, GHz, THz.')
    expect(refusal('1 gHz')).toBeDefined()
  })

  it('understands the typographic minus, a leading plus, exponents and surrounding spaces', () => {
    const spec = { label: 'the longitude', min: -180, max: 180 }
    expect(value('\u221231.35', spec)).toBe(-31.35)
    expect(value('+31.35', spec)).toBe(31.35)
    expect(value('  -3.135e1  ', spec)).toBe(-31.35)
    expect(value('-0', spec)).toBe(0)
    expect(Object.is(value('-0', spec), -0)).toBe(false)
  })
})

describe('fromUnit / inUnit', () => {
  it('round-trip every figure of up to 9 significant digits through the base unit', () => {
    const figure = fc.integer({ min: 1, max: 999_999_999 }).chain((digits) => fc.integer({ min: 0, max: 8 }).map((places) => Number((digits / 10 ** places).toFixed(places))))
    fc.assert(
      fc.property(figure, unitName, (x, unit) => {
        expect(inUnit(fromUnit(x, unit, HZ_UNITS), unit, HZ_UNITS)).toBe(x)
      }),
    )
  })
})

describe('numberWithUnit as a zod field', () => {
  it('parses to the base unit and reports the refusal as a field issue', () => {
    const field = numberWithUnit(frequency)
    expect(field.parse('433.92 MHz')).toBe(433_920_000)
    const r = field.safeParse(true)
    expect(r.success).toBe(false)
    expect(r.error?.issues.map((i) => i.message)).toEqual(['Enter the frequency as a decimal number.'])
  })

  it('leaves an optional field undefined when blank, but still refuses a wrong value', () => {
    const field = numberWithUnit({ ...frequency, optional: true })
    expect(field.parse('  ')).toBeUndefined()
    expect(field.parse(undefined)).toBeUndefined()
    expect(field.safeParse([]).success).toBe(false)
  })
})
