import { readFileSync } from 'node:fs'
import { describe, expect, it } from 'vitest'
import { parseTraceCsv, TraceCsvError } from '../../../../shared/radio/spectrum'

const fixture = (name: string) => readFileSync(new URL(`../../../fixtures/radio/${name}`, import.meta.url), 'utf8')

/** Expects parseTraceCsv to throw a TraceCsvError on a given line. */
function expectLineError(text: string, lineNumber: number, message: RegExp) {
  try {
    parseTraceCsv({ csvText: text })
  } catch (e) {
    expect(e).toBeInstanceOf(TraceCsvError)
    expect(e).toBeInstanceOf(RangeError)
    expect((e as TraceCsvError).lineNumber).toBe(lineNumber)
    expect((e as Error).message).toMatch(new RegExp(`^line ${lineNumber}: `))
    expect((e as Error).message).toMatch(message)
    return
  }
  throw new Error('expected a TraceCsvError')
}

describe('parseTraceCsv with good files', () => {
  it('reads MHz and dBm from a comma-separated file with a header', () => {
    const r = parseTraceCsv({ csvText: fixture('spectrum-trace-mhz-dbm.csv') })
    expect(r.freqUnit).toBe('MHz')
    expect(r.levelUnit).toBe('dBm')
    expect(r.separator).toBe(',')
    expect(r.headerLine).toBe(1)
    expect(r.freqHz).toEqual([156.75e6, 156.7625e6, 156.775e6, 156.7875e6, 156.8e6])
    expect(r.levelDbm).toEqual([-92.5, -91.0, -47.25, -90.8, -92.1])
    expect(r.warnings).toEqual([])
  })

  it('reads kHz and dBµV from a semicolon file with BOM and CRLF, converting at 50 Ω (50 Ω dBµV identity, register 2-6, 2-7: 56.99 dBµV = −50.00 dBm, 0 dBµV = −106.99 dBm, within 0.01 dB)', () => {
    const r = parseTraceCsv({ csvText: fixture('spectrum-trace-khz-dbuv-semicolon.csv') })
    expect(r.separator).toBe(';')
    expect(r.freqUnit).toBe('kHz')
    expect(r.levelUnit).toBe('dBµV')
    expect(r.freqHz).toEqual([96e6, 96.025e6, 96.05e6])
    expect(Math.abs(r.levelDbm[0] - -50)).toBeLessThan(0.01)
    expect(Math.abs(r.levelDbm[1] - (-106.99 - 0.01))).toBeLessThan(0.01)
    expect(Math.abs(r.levelDbm[2] - 0)).toBeLessThan(0.01)
  })

  it('reads GHz and dBuV from snake-case headers and tolerates a trailing separator (50 Ω dBµV identity, register §2: dBm = dBµV − 106.99)', () => {
    const r = parseTraceCsv({ csvText: fixture('spectrum-trace-ghz-dbuv.csv') })
    expect(r.freqUnit).toBe('GHz')
    expect(r.freqHz).toEqual([5.785e9, 5.786e9])
    expect(Math.abs(r.levelDbm[0] - (40 - 106.99))).toBeLessThan(0.01)
    expect(Math.abs(r.levelDbm[1] - (46.02 - 106.99))).toBeLessThan(0.01)
  })

  it('reads a headerless file in Hz and dBm, skipping comments, and warns that the units were assumed', () => {
    const r = parseTraceCsv({ csvText: fixture('spectrum-trace-noheader-hz.csv') })
    expect(r.headerLine).toBeUndefined()
    expect(r.freqHz).toEqual([2.4e9, 2.4005e9, 2.401e9])
    expect(r.levelDbm).toEqual([-71.2, -70.9, -35.4])
    expect(r.warnings.join(' ')).toMatch(/Hz assumed/)
    expect(r.warnings.join(' ')).toMatch(/dBm assumed/)
  })

  it('takes units from the options when the file has none, without warnings', () => {
    const r = parseTraceCsv({ csvText: '100.5,20\n100.6,21\n', defaultFreqUnit: 'MHz', defaultLevelUnit: 'dBµV', impedanceOhm: 75 })
    expect(r.freqHz).toEqual([100.5e6, 100.6e6])
    expect(r.levelDbm[0]).toBeCloseTo(20 - 10 * Math.log10(75) - 90, 12)
    expect(r.warnings).toEqual([])
  })

  it('accepts exponents, signs and quoted fields', () => {
    const r = parseTraceCsv({ csvText: '"Frequency (Hz)","Level (dBm)"\n"1.5e6","-8.0E1"\n+2e6,-.5\n' })
    expect(r.freqHz).toEqual([1.5e6, 2e6])
    expect(r.levelDbm).toEqual([-80, -0.5])
  })
})

describe('parseTraceCsv with bad input', () => {
  it('rejects an empty file, or one with only blank and comment lines', () => {
    expect(() => parseTraceCsv({ csvText: '' })).toThrow(TraceCsvError)
    expect(() => parseTraceCsv({ csvText: '\n# nothing\n\n' })).toThrow(/empty/)
  })
  it('rejects a header with no data rows', () => {
    expect(() => parseTraceCsv({ csvText: 'Frequency (MHz),Level (dBm)\n' })).toThrow(/no data rows/)
  })
  it('names the line of a non-numeric level', () => {
    expectLineError('Frequency (MHz),Level (dBm)\n100,-50\n\n100.1,abc\n', 4, /level 'abc' is not a number/)
  })
  it('names the line of a row with the wrong number of columns', () => {
    expectLineError('100,-50\n101,-51,7\n', 2, /expected 2 columns/)
    expectLineError('100,-50\n101\n', 2, /expected 2 columns/)
  })
  it('names the line of a frequency that does not increase, or is negative', () => {
    expectLineError('100,-50\n100,-51\n', 2, /ascending/)
    expectLineError('-5,-50\n', 1, /negative/)
  })
  it('names the line of a decimal comma in a semicolon file', () => {
    expectLineError('Freq (MHz);Level (dBm)\n100;-50\n100,5;-51,2\n', 3, /decimal commas/)
  })
  it('names the header line of an unsupported unit', () => {
    expectLineError('Frequency (MHz),Level (dBW)\n100,-50\n', 1, /not supported; use dBm or dBµV/)
    expectLineError('Frequency (MHz),Field (dBµV/m)\n100,-50\n', 1, /not supported/)
    expectLineError('Frequency (THz),Level (dBm)\n100,-50\n', 1, /not one of Hz, kHz, MHz, GHz/)
  })
  it('rejects a non-positive impedance', () => {
    expect(() => parseTraceCsv({ csvText: '1,2\n', impedanceOhm: 0 })).toThrow(RangeError)
  })
})

describe('parseTraceCsv: the bandwidth a trace states', () => {
  const rows = 'Frequency (MHz),Level (dBm)\n446.000,-90\n446.010,-60\n446.020,-90\n'

  it('reads an ENBW line before the data as the noise bandwidth, in the unit it names', () => {
    const parsed = parseTraceCsv({ csvText: `# exported 2026-12-01\n# ENBW: 9.5 kHz\n${rows}` })
    expect(parsed.noiseBandwidthHz).toBe(9500)
    expect(parsed.noiseBandwidthFrom).toBe('ENBW')
    expect(parsed.warnings.join(' ')).not.toMatch(/resolution bandwidth/)
    expect(parsed.freqHz).toEqual([446e6, 446.01e6, 446.02e6])
  })

  it('takes an RBW line as the noise bandwidth, and says so', () => {
    const parsed = parseTraceCsv({ csvText: `#RBW = 10 kHz\n${rows}` })
    expect(parsed.noiseBandwidthHz).toBe(10_000)
    expect(parsed.noiseBandwidthFrom).toBe('RBW')
    expect(parsed.warnings.join(' ')).toMatch(/resolution bandwidth on line 1 is taken as the noise bandwidth/)
  })

  it('states no bandwidth when the file has none, and ignores one written after the data starts', () => {
    expect(parseTraceCsv({ csvText: rows }).noiseBandwidthHz).toBeNull()
    expect(parseTraceCsv({ csvText: `${rows}# RBW: 10 kHz\n` }).noiseBandwidthHz).toBeNull()
  })

  it.each([
    ['# RBW: ten kHz', /line 1: .*does not read as a bandwidth/],
    ['# RBW: 10', /line 1: .*does not read as a bandwidth/],
    ['# ENBW: 0 Hz', /line 1: the bandwidth must be a positive number/],
    ['# RBW: 10 kHz\n# ENBW: 9 kHz', /line 2: a second bandwidth line; line 1 already states one/],
  ])('refuses %j with the line named', (preamble, message) => {
    expect(() => parseTraceCsv({ csvText: `${preamble}\n${rows}` })).toThrow(TraceCsvError)
    expect(() => parseTraceCsv({ csvText: `${preamble}\n${rows}` })).toThrow(message)
  })
})
