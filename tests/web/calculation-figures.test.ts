/** The main figure of any stored calculation, read from its outputs alone (the kinds keep growing). */
import { describe, expect, it } from 'vitest'
import { formatFigure, mainFigure, nameOfKey, unitOfKey } from '@/features/case-page/lib/calculation-figures'

describe('unitOfKey and nameOfKey', () => {
  it.each([
    ['eirpDbm', 'dBm', 'EIRP'],
    ['marginDb', 'dB', 'margin'],
    ['fieldStrengthDbuvPerM', 'dBµV/m', 'field strength'],
    ['pfdDbwPerM2', 'dBW/m²', 'pfd'],
    ['distanceM', 'm', 'distance'],
    ['freqHz', 'Hz', 'freq'],
    ['eirpW', 'W', 'EIRP'],
    ['verdict', '', 'verdict'],
  ])('%s is in %s, named "%s"', (key, unit, name) => {
    expect(unitOfKey(key)).toBe(unit)
    expect(nameOfKey(key)).toBe(name)
  })
})

describe('mainFigure', () => {
  it('takes the quantity the interval bounds, with the interval', () => {
    const f = mainFigure({ outputs: { value: { eirpW: 0.2, eirpDbm: 23.4 }, interval: { quantity: 'eirpDbm', low: 21.9, high: 24.9, basis: 'k = 2' } } })
    expect(f).toEqual({ key: 'eirpDbm', name: 'EIRP', value: 23.4, unit: 'dBm', interval: { low: 21.9, high: 24.9, basis: 'k = 2' } })
  })

  it('without an interval, prefers the first level in decibels to the first number', () => {
    expect(mainFigure({ outputs: { value: { eirpW: 0.61, eirpDbm: 27.85, distanceM: 1000 } } })).toMatchObject({ key: 'eirpDbm', value: 27.85, unit: 'dBm' })
    expect(mainFigure({ outputs: { value: { distanceM: 1000, count: 3 } } })).toMatchObject({ key: 'distanceM', unit: 'm' })
  })

  it('carries a verdict word, reads a bare number, and gives up on a value with no number', () => {
    expect(mainFigure({ outputs: { value: { verdict: 'exceeds', marginDb: 3.2 } } })).toMatchObject({ key: 'marginDb', verdict: 'exceeds' })
    expect(mainFigure({ outputs: { value: 12.5, interval: { quantity: 'lossDb', low: 11, high: 14, basis: 'k = 2' } } })).toMatchObject({ key: 'lossDb', value: 12.5, unit: 'dB', interval: { low: 11, high: 14 } })
    expect(mainFigure({ outputs: { value: { note: 'none' } } })).toBeNull()
  })

  it('formats with at most two decimals and a true minus sign', () => {
    expect(formatFigure(-3.14159)).toBe('\u22123.14')
    expect(formatFigure(24.93)).toBe('24.93')
  })
})
