import { describe, expect, it } from 'vitest'
import { cite } from '../../../fixtures/radio/check-row'
import { antennaFactorFromTableDbPerM, antennaFactorTableProblem, ANTENNA_FACTOR_TABLE_METHOD } from '../../../../shared/radio/chain'

/** An invented log-periodic antenna's calibration: 200–1000 MHz. */
const TABLE = [
  { freqHz: 200e6, antennaFactorDbPerM: 11.0 },
  { freqHz: 300e6, antennaFactorDbPerM: 13.5 },
  { freqHz: 500e6, antennaFactorDbPerM: 17.2 },
  { freqHz: 1000e6, antennaFactorDbPerM: 23.4 },
]

/**
 * Expected values from a general-purpose library: numpy 2.4.6,
 * `numpy.interp(numpy.log10(f), numpy.log10(table_f), table_af)` on the table above (linear
 * interpolation on a log10-frequency axis), printed with repr(). The 250 MHz row is also worked
 * by hand: x = log10(250/200)/log10(300/200) = 0.096910/0.176091 = 0.550340, 11 + 2.5·x = 12.3758.
 */
const NUMPY_INTERP_LOG10 = [
  { freqHz: 250e6, expected: 12.375849283033018 },
  { freqHz: 400e6, expected: 15.583731940117403 },
  { freqHz: 433.92e6, expected: 16.17329488947475 },
  { freqHz: 700e6, expected: 20.2096463284555 },
  { freqHz: 999e6, expected: 23.391050815408065 },
]

describe('antennaFactorFromTableDbPerM (linear in dB over log10 frequency)', () => {
  for (const row of NUMPY_INTERP_LOG10) {
    it(`matches ${cite('numpy 2.4.6 numpy.interp on log10 frequency', 'AF-1')} at ${row.freqHz / 1e6} MHz within 1e-9 dB/m`, () => {
      const r = antennaFactorFromTableDbPerM({ freqHz: row.freqHz, table: TABLE })
      expect(Math.abs(r.value - row.expected)).toBeLessThan(1e-9)
      expect(r.method).toEqual(ANTENNA_FACTOR_TABLE_METHOD)
    })
  }

  it(`matches the hand-worked 250 MHz value (12.3758 dB/m) within 1e-4 dB/m — ${cite('the interpolation equation', 'AF-2')}`, () => {
    expect(antennaFactorFromTableDbPerM({ freqHz: 250e6, table: TABLE }).value).toBeCloseTo(12.3758, 4)
  })

  it('differs from interpolation linear in frequency (numpy.interp on f itself gives 15.35 dB/m at 400 MHz)', () => {
    expect(Math.abs(antennaFactorFromTableDbPerM({ freqHz: 400e6, table: TABLE }).value - 15.35)).toBeGreaterThan(0.2)
  })

  it('returns the calibrated value exactly at a listed frequency, including both ends', () => {
    for (const p of TABLE) expect(antennaFactorFromTableDbPerM({ freqHz: p.freqHz, table: TABLE }).value).toBe(p.antennaFactorDbPerM)
  })

  it('refuses a frequency below or above the table, naming its range, and never extrapolates', () => {
    expect(() => antennaFactorFromTableDbPerM({ freqHz: 199e6, table: TABLE })).toThrow(/covers 200 MHz to 1000 MHz; 199 MHz is outside it/)
    expect(() => antennaFactorFromTableDbPerM({ freqHz: 1.2e9, table: TABLE })).toThrow(RangeError)
  })

  it('refuses a table that is too short or whose frequencies do not rise', () => {
    expect(antennaFactorTableProblem([TABLE[0]!])).toMatch(/at least two/)
    expect(antennaFactorTableProblem([TABLE[1]!, TABLE[0]!])).toMatch(/must rise/)
    expect(antennaFactorTableProblem(TABLE)).toBeNull()
    expect(() => antennaFactorFromTableDbPerM({ freqHz: 250e6, table: [TABLE[1]!, TABLE[0]!] })).toThrow(/must rise/)
  })

  it('refuses a frequency of zero', () => {
    expect(() => antennaFactorFromTableDbPerM({ freqHz: 0, table: TABLE })).toThrow(RangeError)
  })
})
