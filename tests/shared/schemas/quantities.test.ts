import { describe, expect, it } from 'vitest'
import { quantity, readQuantity, unitsOf, withUnit } from '../../../shared/schemas/quantities'

const power = quantity('power', { label: 'the EIRP', min: -400, max: 400 })
const freq = quantity('frequency', { label: 'the frequency', min: 0, minExclusive: true, max: 3e12 })
const field = quantity('fieldStrength', { label: 'the field strength', min: -400, max: 400 })

describe('a typed quantity', () => {
  it('reads a frequency in MHz exactly, in decimal', () => {
    expect(freq.parse('433.92 MHz')).toBe(433_920_000)
    expect(freq.parse(withUnit('433.92', 'MHz'))).toBe(433_920_000)
    expect(freq.parse('12.5 kHz')).toBe(12_500)
  })

  it('reads a bare number in the first unit offered', () => {
    expect(freq.parse('446')).toBe(446_000_000) // MHz is the usual unit for a frequency
    expect(power.parse('30')).toBe(30)
  })

  // Definitions of the decibel units: dBm re 1 mW, dBW re 1 W (common practice, no source)
  it('converts watts, milliwatts and dBW to dBm', () => {
    expect(power.parse('1 W')).toBeCloseTo(30, 12)
    expect(power.parse('2 W')).toBeCloseTo(33.010299956639813, 12) // 10·log10(2000)
    expect(power.parse('100 mW')).toBeCloseTo(20, 12)
    expect(power.parse('-10 dBW')).toBe(20)
  })

  // dBµV/m re 1 µV/m: 1 V/m = 10^6 µV/m = 120 dBµV/m (common practice, no source)
  it('converts volts per metre to dBµV/m', () => {
    expect(field.parse('1 V/m')).toBeCloseTo(120, 12)
    expect(field.parse('5 mV/m')).toBeCloseTo(73.979400086720375, 12) // 20·log10(5000)
    expect(field.parse('74 dBuV/m')).toBe(74)
  })

  it('reads dBd as dBi less the half-wave dipole gain', () => {
    expect(quantity('gain', { label: 'the gain', min: -100, max: 100 }).parse('0 dBd')).toBeCloseTo(2.15, 12)
  })

  it('refuses a non-positive amount in a linear power unit, a unit of another quantity, and text', () => {
    expect(readQuantity('0 W', 'power', { label: 'the EIRP' })).toEqual({ ok: false, missing: false, message: 'The EIRP in W must be above zero.' })
    expect(readQuantity('3 MHz', 'power', { label: 'the EIRP' })).toMatchObject({ ok: false, message: 'Use one of these units for the EIRP: dBm, dBW, W, mW.' })
    expect(readQuantity('0x10', 'power', { label: 'the EIRP' })).toMatchObject({ ok: false })
  })

  it('checks the range in the base unit after converting, and says the unit', () => {
    // 1e40 W is 430 dBm: above the 400 dBm bound although the figure typed was small in W
    expect(readQuantity('1e40 W', 'power', { label: 'the EIRP', min: -400, max: 400 })).toEqual({ ok: false, missing: false, message: 'The EIRP must be from -400 to 400 dBm.' })
  })

  it('treats a blank optional field as missing, never 0', () => {
    expect(quantity('distance', { label: 'the distance', optional: true }).parse('')).toBeUndefined()
    expect(() => quantity('distance', { label: 'the distance' }).parse('')).toThrow('Enter the distance.')
  })

  it('lists the usual unit first for the unit selector', () => {
    expect(unitsOf('power')).toEqual(['dBm', 'dBW', 'W', 'mW'])
    expect(unitsOf('frequency')[0]).toBe('MHz')
  })
})
