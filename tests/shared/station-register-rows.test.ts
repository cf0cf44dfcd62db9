/**
 * Reading licence-register CSV rows with a column mapping: units, impossible values, every
 * problem of a row listed; the mapping's own checks; the delimiter and mapping suggestions.
 */
import fs from 'node:fs'
import { parse } from 'csv-parse/sync'
import { describe, expect, it } from 'vitest'
import { columnMappingSchema, mappingProblems, type ColumnMappingFields } from '../../shared/schemas/stations'
import { readStationRow, readStationRows } from '../../shared/stations/register-rows'
import { detectDelimiter, suggestMapping } from '../../shared/stations/csv-columns'
import { DEMO_REGISTER_FILE, DEMO_REGISTER_HEADERS, DEMO_REGISTER_MAPPING, DEMO_SCENARIO_STATION } from '../../ops/demo-data/station-register'

const HEADERS = ['code', 'holder', 'lat', 'lon', 'height', 'low', 'high', 'centre', 'bw', 'eirp', 'erp', 'tx', 'gain', 'feeder', 'from', 'until']
const RANGE: ColumnMappingFields = {
  stationCode: { column: 'code' },
  licensee: { column: 'holder' },
  latitude: { column: 'lat', unit: 'deg' },
  longitude: { column: 'lon', unit: 'deg' },
  antennaHeight: { column: 'height', unit: 'm' },
  lowFreq: { column: 'low', unit: 'MHz' },
  highFreq: { column: 'high', unit: 'MHz' },
  eirp: { column: 'eirp', unit: 'dBm' },
  erp: { column: 'erp', unit: 'W' },
  conductedPower: { column: 'tx', unit: 'dBW' },
  antennaGain: { column: 'gain', unit: 'dBd' },
  feederLoss: { column: 'feeder', unit: 'dB' },
  validFrom: { column: 'from' },
  validUntil: { column: 'until' },
}
const CENTRED: ColumnMappingFields = { ...RANGE, lowFreq: undefined, highFreq: undefined, centreFreq: { column: 'centre', unit: 'MHz' }, bandwidth: { column: 'bw', unit: 'kHz' } }
delete CENTRED.lowFreq
delete CENTRED.highFreq

type Cells = Partial<Record<(typeof HEADERS)[number], string>>
const row = (c: Cells) => HEADERS.map((h) => c[h as keyof Cells] ?? '')
const base: Cells = { code: 'A-1', holder: 'Alder Radio Club', lat: '47.7', lon: '-30.6', low: '446.0', high: '446.2', eirp: '30' }

describe('a register row', () => {
  it('reads a good row into base units, the limit kept as written and as an EIRP', () => {
    const r = readStationRow(row({ ...base, height: '12', from: '2024-04-01', until: '2034-03-31' }), 2, HEADERS, RANGE)
    expect(r).toEqual({
      ok: true,
      station: {
        line: 2,
        stationCode: 'A-1',
        licensee: 'Alder Radio Club',
        service: '',
        latitudeDeg: 47.7,
        longitudeDeg: -30.6,
        antennaHeightM: 12,
        lowFreqHz: 446_000_000,
        highFreqHz: 446_200_000,
        limit: { kind: 'eirp', eirpDbm: 30 },
        antennaGainDbi: null,
        feederLossDb: null,
        authorisedEirpDbm: 30,
        validFrom: '2024-04-01',
        validUntil: '2034-03-31',
      },
    })
  })

  it('takes a unit written in a cell over the column unit (7.1 GHz in a MHz column)', () => {
    const r = readStationRow(row({ ...base, low: '7.1 GHz', high: '7128' }), 2, HEADERS, RANGE)
    expect(r.ok && [r.station.lowFreqHz, r.station.highFreqHz]).toEqual([7_100_000_000, 7_128_000_000])
  })

  it('turns powers into dBm: W by 10·log10(P/1 mW), dBW by +30; ERP into EIRP by +2.15 dB; dBd gain by +2.15 dB', () => {
    // 25 W = 10·log10(25 000) = 43.9794 dBm ERP → 46.1294 dBm EIRP (EIRP = ERP + 2.15 dB, ITU RR 1.161/1.162)
    const erp = readStationRow(row({ ...base, eirp: '', erp: '25' }), 2, HEADERS, RANGE)
    expect(erp.ok && erp.station.limit).toEqual({ kind: 'erp', erpDbm: 10 * Math.log10(25_000) })
    expect(erp.ok && erp.station.authorisedEirpDbm).toBeCloseTo(43.9794 + 2.15, 4)
    // conducted 10 dBW = 40 dBm; gain 3.85 dBd = 6 dBi; feeder 1 dB → 40 − 1 + 6 = 45 dBm EIRP
    const conducted = readStationRow(row({ ...base, eirp: '', tx: '10', gain: '3.85', feeder: '1' }), 2, HEADERS, RANGE)
    expect(conducted.ok && conducted.station).toMatchObject({ limit: { kind: 'conducted', conductedPowerDbm: 40 }, antennaGainDbi: 6, feederLossDb: 1 })
    expect(conducted.ok && conducted.station.authorisedEirpDbm).toBeCloseTo(45, 12)
    // no feeder loss written: 0 dB
    const noFeeder = readStationRow(row({ ...base, eirp: '', tx: '10', gain: '3.85' }), 2, HEADERS, RANGE)
    expect(noFeeder.ok && noFeeder.station.authorisedEirpDbm).toBeCloseTo(46, 12)
    // a cell may write its own power unit: 500 mW = 10·log10(500) = 26.9897 dBm
    const mw = readStationRow(row({ ...base, eirp: '500 mW' }), 2, HEADERS, RANGE)
    expect(mw.ok && mw.station.authorisedEirpDbm).toBeCloseTo(26.9897, 4)
  })

  it('normalises centre and bandwidth to a range (446.1 MHz ± 200 kHz / 2)', () => {
    const r = readStationRow(row({ ...base, centre: '446.1', bw: '200' }), 2, HEADERS, CENTRED)
    expect(r.ok && [r.station.lowFreqHz, r.station.highFreqHz]).toEqual([446_000_000, 446_200_000])
  })

  it('lists every problem of a row, each naming its column and the value', () => {
    const r = readStationRow(row({ code: 'A-2', holder: '', lat: '95', lon: '-30.6', height: '-5', low: '446.3', high: '446.1', eirp: 'abc', from: '2026-02-30', until: '' }), 14, HEADERS, RANGE)
    expect(r.ok).toBe(false)
    const problems = r.ok ? [] : r.problems
    expect(problems).toEqual([
      'no licensee in column holder',
      "'95' in column lat (Latitude) is impossible: it must be from -90 to 90 °",
      "'-5' in column height (Antenna height) is impossible: it must be from 0 to 2000 m",
      "text 'abc' in column eirp (EIRP): not a number",
      "'2026-02-30' in column from (Valid from) is not a date: write it as yyyy-mm-dd, e.g. 2026-03-31",
      'the low frequency 446.3 MHz is not below the high frequency 446.1 MHz',
    ])
  })

  it('names an unknown unit, a thousands comma, and a row with the wrong number of fields', () => {
    const unit = readStationRow(row({ ...base, eirp: '20 dBx' }), 5, HEADERS, RANGE)
    expect(!unit.ok && unit.problems).toEqual(["unknown unit 'dBx' in column eirp (EIRP): use dBm, dBW, W, mW, kW"])
    const comma = readStationRow(row({ ...base, low: '1,000' }), 5, HEADERS, RANGE)
    expect(!comma.ok && comma.problems[0]).toMatch(/'1,000' in column low \(Low frequency\): .*thousands separator or a decimal comma/)
    const short = readStationRow(row(base).slice(0, 10), 5, HEADERS, RANGE)
    expect(!short.ok && short.problems[0]).toBe('10 fields where the header has 16')
  })

  it('needs exactly one authorised power per row, and a gain with a conducted power', () => {
    const none = readStationRow(row({ ...base, eirp: '' }), 3, HEADERS, RANGE)
    expect(!none.ok && none.problems).toEqual(['no authorised power: fill one of EIRP (column eirp), ERP (column erp), Conducted power (column tx)'])
    const two = readStationRow(row({ ...base, erp: '10' }), 3, HEADERS, RANGE)
    expect(!two.ok && two.problems).toEqual(['more than one authorised power (EIRP and ERP): fill one'])
    const noGain = readStationRow(row({ ...base, eirp: '', tx: '10' }), 3, HEADERS, RANGE)
    expect(!noGain.ok && noGain.problems).toEqual(['a conducted power needs the antenna gain in column gain'])
  })

  it('refuses a bandwidth reaching below 0 Hz, and an end of validity before its start', () => {
    const r = readStationRow(row({ ...base, centre: '0.05', bw: '200', from: '2030-01-01', until: '2029-12-31' }), 7, HEADERS, CENTRED)
    expect(!r.ok && r.problems).toEqual(['the bandwidth 0.2 MHz reaches below 0 Hz around the centre frequency 0.05 MHz', 'valid until 2029-12-31 is before valid from 2030-01-01'])
  })

  it('refuses a station code met before in the file, naming the line it was first on', () => {
    const { accepted, rejected } = readStationRows(
      [
        { line: 2, cells: row(base) },
        { line: 3, cells: row({ ...base, holder: 'Someone else' }) },
      ],
      HEADERS,
      RANGE,
    )
    expect(accepted.map((a) => a.line)).toEqual([2])
    expect(rejected).toEqual([{ line: 3, problems: ['station code A-1 is already on line 2'] }])
  })
})

describe('a column mapping', () => {
  it('accepts a complete mapping', () => {
    expect(mappingProblems(RANGE)).toEqual([])
    expect(columnMappingSchema.safeParse({ fields: CENTRED }).success).toBe(true)
  })
  it('lists every problem: missing fields, mixed frequency forms, no power, gain without a conducted power, bad units, a column used twice', () => {
    const problems = mappingProblems({
      stationCode: { column: 'code' },
      lowFreq: { column: 'low', unit: 'MHz' },
      centreFreq: { column: 'centre', unit: 'mhz' },
      bandwidth: { column: 'low', unit: 'kHz' },
      antennaGain: { column: 'gain' },
      service: { column: 'svc', unit: 'm' },
    }).map((p) => p.message)
    expect(problems).toEqual([
      'Choose the column that holds the licensee.',
      'Choose the column that holds the latitude.',
      'Choose the column that holds the longitude.',
      'Map the frequencies either as low and high frequency or as centre frequency and bandwidth, not both.',
      'Map the authorised power: EIRP, ERP, or conducted power with the antenna gain.',
      'The antenna gain counts only with a conducted power: leave it unmapped.',
      'The service has no unit.',
      "Unknown unit 'mhz' for the centre frequency: use one of Hz, kHz, MHz, GHz.",
      'Column "low" is mapped to Low frequency and Bandwidth: map each column to one field.',
    ])
  })
})

describe('suggestions from the top of a file', () => {
  it('detects the delimiter from the header line, ignoring delimiters inside quotes', () => {
    expect(detectDelimiter('a;b;c')).toBe('semicolon')
    expect(detectDelimiter('a\tb\tc')).toBe('tab')
    expect(detectDelimiter('"x;y;z",b,c')).toBe('comma')
    expect(detectDelimiter('a|b')).toBe('bar')
    expect(detectDelimiter('single')).toBe('comma')
  })

  it("suggests the demo register's mapping from its headers (units from the brackets)", () => {
    expect(suggestMapping(DEMO_REGISTER_HEADERS, []).fields).toEqual(DEMO_REGISTER_MAPPING.fields)
  })

  it('guesses a frequency unit from the numbers when the header names none, and says so', () => {
    const s = suggestMapping(['Call sign', 'Owner', 'Freq', 'Notes'], [['X', 'Y', '446100000', '']])
    expect(s.fields).toEqual({ stationCode: { column: 'Call sign' }, licensee: { column: 'Owner' }, centreFreq: { column: 'Freq', unit: 'Hz' } })
    expect(s.notes).toEqual(['Column "Freq" names no unit: Hz guessed from the size of its numbers. Check it.', 'Not mapped: "Notes".'])
  })
})

describe('the demo register file', () => {
  it('reads with its mapping without a rejected row, and holds the scenario station', () => {
    const records: string[][] = parse(fs.readFileSync(DEMO_REGISTER_FILE), { delimiter: ',' })
    const [headers, ...data] = records
    const { accepted, rejected } = readStationRows(
      data.map((cells, i) => ({ line: i + 2, cells })),
      headers!,
      DEMO_REGISTER_MAPPING.fields,
    )
    expect(rejected).toEqual([])
    expect(accepted.length).toBeGreaterThanOrEqual(300)
    expect(new Set(accepted.map((a) => a.service)).size).toBeGreaterThanOrEqual(6)
    const scenario = accepted.find((a) => a.stationCode === DEMO_SCENARIO_STATION.stationCode)
    expect(scenario).toMatchObject({ ...DEMO_SCENARIO_STATION, limit: { kind: 'eirp', eirpDbm: 30 } })
    // nothing else authorised on 446.0–446.2 MHz: the scenario's station is the one candidate there
    expect(accepted.filter((a) => a.highFreqHz > 446e6 && a.lowFreqHz < 446.2e6).map((a) => a.stationCode)).toEqual([DEMO_SCENARIO_STATION.stationCode])
  })
})
