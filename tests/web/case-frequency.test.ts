import { describe, expect, it } from 'vitest'
import { bestUnitFor, formatFrequencyHz, formatFrequencyRangeHz, frequencyFromHz, frequencyToHz } from '@/lib/frequency'

// SI prefixes k = 10^3, M = 10^6, G = 10^9, T = 10^12: BIPM, The International System of Units
// (SI Brochure), 9th edition 2019, Table 7.
describe('frequencyToHz / frequencyFromHz', () => {
  it('applies the SI prefixes kilo, mega and giga (SI Brochure 9th ed., Table 7)', () => {
    expect(frequencyToHz({ value: 1, unit: 'kHz' })).toBe(1e3)
    expect(frequencyToHz({ value: 1, unit: 'MHz' })).toBe(1e6)
    expect(frequencyToHz({ value: 1, unit: 'GHz' })).toBe(1e9)
  })

  it('gives exact Hz for typical channel figures despite binary floating point', () => {
    expect(frequencyToHz({ value: 156.8, unit: 'MHz' })).toBe(156_800_000)
    expect(frequencyToHz({ value: 5.8, unit: 'GHz' })).toBe(5_800_000_000)
    expect(frequencyToHz({ value: 0.1, unit: 'kHz' })).toBe(100)
  })

  it('round-trips a figure through Hz and back', () => {
    for (const [value, unit] of [[156.525, 'MHz'], [2.4835, 'GHz'], [1_710, 'MHz'], [7.1, 'kHz']] as const) {
      expect(frequencyFromHz({ freqHz: frequencyToHz({ value, unit }), unit })).toBe(value)
    }
  })
})

describe('formatFrequencyHz', () => {
  it('uses kHz below 1 MHz, MHz up to the top of UHF at 3 GHz (ITU RR No. 2.1), GHz above', () => {
    expect(bestUnitFor(999).unit).toBe('Hz')
    expect(bestUnitFor(1_000).unit).toBe('kHz')
    expect(bestUnitFor(999_999).unit).toBe('kHz')
    expect(bestUnitFor(1e6).unit).toBe('MHz')
    expect(bestUnitFor(1e9).unit).toBe('MHz')
    expect(bestUnitFor(2_999_999_999).unit).toBe('MHz')
    expect(bestUnitFor(3e9).unit).toBe('GHz')
    expect(bestUnitFor(3e12).unit).toBe('THz')
  })

  it('writes marine channel 16, a broadcast carrier and a fixed link as people say them', () => {
    expect(formatFrequencyHz(156_800_000)).toBe('156.8 MHz')
    expect(formatFrequencyHz(990_000)).toBe('990 kHz')
    expect(formatFrequencyHz(5_800_000_000)).toBe('5.8 GHz')
    expect(formatFrequencyHz(121_500_000)).toBe('121.5 MHz')
  })

  it('shows a dash for a value that is not a number', () => {
    expect(formatFrequencyHz(Number.NaN)).toBe('—')
  })
})

describe('formatFrequencyRangeHz', () => {
  it('writes one unit when both ends share it', () => {
    expect(formatFrequencyRangeHz({ lowHz: 156e6, highHz: 162.05e6 })).toBe('156–162.05 MHz')
    expect(formatFrequencyRangeHz({ lowHz: 1_710e6, highHz: 1_785e6 })).toBe('1710–1785 MHz')
    expect(formatFrequencyRangeHz({ lowHz: 2_400e6, highHz: 2_483.5e6 })).toBe('2400–2483.5 MHz')
  })

  it('writes both units when the ends differ', () => {
    expect(formatFrequencyRangeHz({ lowHz: 990e3, highHz: 1.2e6 })).toBe('990 kHz – 1.2 MHz')
  })

  it('writes a single frequency when both ends are equal', () => {
    expect(formatFrequencyRangeHz({ lowHz: 156.8e6, highHz: 156.8e6 })).toBe('156.8 MHz')
  })
})
