import { describe, expect, it } from 'vitest'
import { equipmentContentSchema, measurementContentSchema, newMeasurementSchema } from '../../../shared/schemas/measurements'
import { readQuantity } from '../../../shared/schemas/quantities'

const GOOD = {
  takenAt: '2026-11-20T10:15:00Z',
  latDeg: '48.1172',
  lonDeg: '−31.3921',
  freqHz: '433.92 MHz',
  reading: { unit: 'dBµV', value: '40' },
  antenna: { source: 'gain', antennaGainDbi: '2.15 dBi' },
}
const paths = (r: { success: boolean; error?: { issues: { path: PropertyKey[] }[] } }) => (r.error?.issues ?? []).map((i) => i.path.join('.')).sort()

describe('measurementContentSchema', () => {
  it('reads every figure in its unit to the base unit named in its key', () => {
    const m = measurementContentSchema.parse({ ...GOOD, rbwHz: '120 kHz', heightM: '1.5', bearingDeg: '48°', bearingSigmaDeg: '5' })
    expect(m).toMatchObject({ latDeg: 48.1172, lonDeg: -31.3921, freqHz: 433_920_000, rbwHz: 120_000, heightM: 1.5, bearingDeg: 48, bearingSigmaDeg: 5, reading: { unit: 'dBµV', value: 40 }, antenna: { source: 'gain', antennaGainDbi: 2.15 } })
    // a reading in mV at the input is 20·log10(mV) + 60 dBµV (the unit's definition)
    expect(measurementContentSchema.parse({ ...GOOD, reading: { unit: 'dBµV', value: '1 mV' } }).reading.value).toBeCloseTo(60, 12)
    // a gain in dBd is 2.15 dB above dBi (common practice, no source)
    expect(measurementContentSchema.parse({ ...GOOD, antenna: { source: 'gain', antennaGainDbi: '0 dBd' } }).antenna).toEqual({ source: 'gain', antennaGainDbi: 2.15 })
  })

  it('lists every impossible value at once', () => {
    const r = measurementContentSchema.safeParse({ ...GOOD, freqHz: '0', heightM: '-1', takenAt: '2999-01-01T00:00:00Z', bearingDeg: '360', bearingSigmaDeg: '0' })
    expect(paths(r)).toEqual(['bearingDeg', 'bearingSigmaDeg', 'freqHz', 'heightM', 'takenAt'])
  })

  it('refuses derived levels and unknown keys sent by a client', () => {
    expect(newMeasurementSchema.safeParse({ measurement: { ...GOOD, derived: { fieldStrengthDbuvPerM: 60 } } }).success).toBe(false)
    expect(newMeasurementSchema.safeParse({ measurement: GOOD, warnings: [] }).success).toBe(false)
  })

  it('refuses a unit the reading’s kind does not take, and a σ without a bearing', () => {
    expect(paths(measurementContentSchema.safeParse({ ...GOOD, reading: { unit: 'dBm', value: '40 dBµV/m' } }))).toEqual(['reading.value'])
    expect(paths(measurementContentSchema.safeParse({ ...GOOD, bearingSigmaDeg: '5' }))).toEqual(['bearingSigmaDeg'])
  })
})

describe('equipmentContentSchema', () => {
  it('reads an antenna-factor table and refuses one whose frequencies do not rise', () => {
    const table = [
      { freqHz: '30 MHz', antennaFactorDbPerM: '13.4 dB/m' },
      { freqHz: '300 MHz', antennaFactorDbPerM: '18.1' },
    ]
    expect(equipmentContentSchema.parse({ name: 'BC', type: 'antenna', antennaFactorTable: table }).antennaFactorTable).toEqual([
      { freqHz: 30e6, antennaFactorDbPerM: 13.4 },
      { freqHz: 300e6, antennaFactorDbPerM: 18.1 },
    ])
    expect(paths(equipmentContentSchema.safeParse({ name: 'BC', type: 'antenna', antennaFactorTable: [table[1], table[0]] }))).toEqual(['antennaFactorTable.1.freqHz'])
  })

  it('reads a voltage quantity by definition: 1 µV is 0 dBµV, 1 mV 60 dBµV', () => {
    expect(readQuantity('1 µV', 'voltage', { label: 'v' })).toEqual({ ok: true, value: 0 })
    expect(readQuantity('1 uV', 'voltage', { label: 'v' })).toEqual({ ok: true, value: 0 })
    const mv = readQuantity('1 mV', 'voltage', { label: 'v' })
    expect(mv.ok && mv.value).toBeCloseTo(60, 12)
    // a converted value of exactly zero is a real value, not an underflow of what was typed
    expect(readQuantity('1 mW', 'power', { label: 'p' })).toEqual({ ok: true, value: 0 })
    expect(readQuantity('1 µV/m', 'fieldStrength', { label: 'e' })).toEqual({ ok: true, value: 0 })
  })
})
