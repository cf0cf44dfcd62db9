import { describe, expect, it } from 'vitest'
import { ANTENNA_FACTOR_ROWS, MEASUREMENT_CHAIN_ROWS, RECEIVED_POWER_ROWS } from '../../fixtures/radio/chain-checks'
import { DBM_TO_DBUV_ROWS, FIELD_TO_PFD_ROWS } from '../../fixtures/radio/units-checks'
import { cite } from '../../fixtures/radio/check-row'
import { calibrationWarning, deriveMeasurement, type DeriveEquipment, type DeriveInputs } from '../../../shared/measurements/derive'
import { ANTENNA_FACTOR_TABLE_METHOD, MEASUREMENT_CHAIN_METHOD } from '../../../shared/radio'

const within = (actual: number | undefined, expected: number, tol: number) => {
  expect(actual).toBeTypeOf('number')
  expect(Math.abs(actual! - expected)).toBeLessThanOrEqual(tol)
}
const TAKEN = '2026-11-20T10:15:00Z'
const base: Omit<DeriveInputs, 'reading' | 'antenna' | 'freqHz'> = { takenAt: TAKEN }

const item = (over: Partial<DeriveEquipment>): DeriveEquipment => ({
  id: '00000000-0000-4000-8000-0000000000e1',
  version: 3,
  name: 'Log-periodic LP-1',
  type: 'antenna',
  serial: 'LP-0001',
  antennaGainDbi: null,
  antennaFactorTable: null,
  minFreqHz: null,
  maxFreqHz: null,
  maxInputDbm: null,
  calibrationDueOn: '2027-06-30',
  ...over,
})

describe('deriveMeasurement: checks against the project register of published values', () => {
  const chain = MEASUREMENT_CHAIN_ROWS.find((r) => r.id === '2-5')!
  it(`a dBµV reading through an antenna factor and a cable gives E: ${chain.source}`, () => {
    const d = deriveMeasurement({
      ...base,
      freqHz: chain.inputs.freqHz,
      reading: { value: chain.inputs.readingDbuv, unit: 'dBµV' },
      antenna: { source: 'factor', antennaFactorDbPerM: chain.inputs.antennaFactorDbPerM },
      cableLossDb: chain.inputs.cableLossDb,
    })
    within(d.derived.fieldStrengthDbuvPerM, chain.expected.fieldStrengthDbuvPerM, chain.tolerance)
    expect(d.methods.fieldStrengthDbuvPerM).toEqual(MEASUREMENT_CHAIN_METHOD)
    expect(d.problems).toEqual([])
  })

  const pfd = FIELD_TO_PFD_ROWS.find((r) => r.id === '1-8' && r.tolerance === 0.01)!
  it(`a field-strength reading gives its pfd: ${pfd.source}`, () => {
    const d = deriveMeasurement({ ...base, freqHz: 100e6, reading: { value: pfd.inputs.fieldStrengthDbuvPerM, unit: 'dBµV/m' }, antenna: { source: 'none' } })
    within(d.derived.pfdDbwPerM2, pfd.expected.pfdDbwPerM2, pfd.tolerance)
    expect(d.derived.fieldStrengthDbuvPerM).toBe(pfd.inputs.fieldStrengthDbuvPerM)
    expect(d.methods.pfdDbwPerM2?.source).toMatch(/Z0/)
  })

  const rp = RECEIVED_POWER_ROWS.find((r) => r.id === '1-9')!
  it(`a field-strength reading gives the isotropic received power: ${rp.source}`, () => {
    const d = deriveMeasurement({ ...base, freqHz: rp.inputs.freqHz, reading: { value: rp.inputs.fieldStrengthDbuvPerM, unit: 'dBµV/m' }, antenna: { source: 'none' } })
    within(d.derived.isotropicReceivedPowerDbm, rp.expected.receivedPowerDbm, rp.tolerance)
  })

  it(`a pfd reading gives back the field of register 1-8 (${pfd.source})`, () => {
    const d = deriveMeasurement({ ...base, freqHz: 100e6, reading: { value: pfd.expected.pfdDbwPerM2, unit: 'dBW/m²' }, antenna: { source: 'none' } })
    within(d.derived.fieldStrengthDbuvPerM, pfd.inputs.fieldStrengthDbuvPerM, pfd.tolerance)
  })

  const rp10 = RECEIVED_POWER_ROWS.find((r) => r.id === '1-10')!
  it(`a dBm reading through a 6 dBi antenna gives the field of ${rp10.source}`, () => {
    // P_r = −58.82 dBm into 6 dBi at 2400 MHz is E = 80 dBµV/m; an isotropic antenna gets 6 dB less
    const d = deriveMeasurement({
      ...base,
      freqHz: rp10.inputs.freqHz,
      reading: { value: rp10.expected.receivedPowerDbm, unit: 'dBm' },
      antenna: { source: 'gain', antennaGainDbi: rp10.inputs.antennaGainDbi },
    })
    within(d.derived.fieldStrengthDbuvPerM, rp10.inputs.fieldStrengthDbuvPerM, rp10.tolerance)
    within(d.derived.isotropicReceivedPowerDbm, rp10.expected.receivedPowerDbm - rp10.inputs.antennaGainDbi, rp10.tolerance)
  })

  const af = ANTENNA_FACTOR_ROWS.find((r) => r.id === '2-1')!
  it(`an antenna of 0 dBi at 100 MHz is used with the factor of ${af.source}`, () => {
    const d = deriveMeasurement({ ...base, freqHz: af.inputs.freqHz, reading: { value: -60, unit: 'dBm' }, antenna: { source: 'gain', antennaGainDbi: af.inputs.antennaGainDbi } })
    within(d.derived.antennaFactorDbPerM, af.expected.antennaFactorDbPerM, af.tolerance)
  })

  it(`a preamplifier's gain is taken off and a cable's loss added back (E = V + AF + L_cable − G_preamp, ${cite('ITU Handbook on Spectrum Monitoring (2011), field-strength measurement', '2-5')})`, () => {
    const common = { ...base, freqHz: 100e6, antenna: { source: 'factor' as const, antennaFactorDbPerM: 20 } }
    const plain = deriveMeasurement({ ...common, reading: { value: 40, unit: 'dBµV' } })
    const chain2 = deriveMeasurement({ ...common, reading: { value: 40, unit: 'dBµV' }, cableLossDb: 3, preampGainDb: 20 })
    within(chain2.derived.fieldStrengthDbuvPerM, plain.derived.fieldStrengthDbuvPerM! + 3 - 20, 1e-9)
  })
})

describe('deriveMeasurement: the register', () => {
  const TABLE = [
    { freqHz: 200e6, antennaFactorDbPerM: 11.0 },
    { freqHz: 300e6, antennaFactorDbPerM: 13.5 },
    { freqHz: 500e6, antennaFactorDbPerM: 17.2 },
    { freqHz: 1000e6, antennaFactorDbPerM: 23.4 },
  ]
  const lpda = item({ antennaFactorTable: TABLE })

  it('takes the antenna factor from the register’s table at the frequency (numpy.interp on log10 f: 16.1733 dB/m at 433.92 MHz)', () => {
    const d = deriveMeasurement({ ...base, freqHz: 433.92e6, reading: { value: 40, unit: 'dBµV' }, antenna: { source: 'register', item: lpda } })
    within(d.derived.antennaFactorDbPerM, 16.17329488947475, 1e-9)
    within(d.derived.fieldStrengthDbuvPerM, 40 + 16.17329488947475, 1e-9)
    expect(d.methods.antennaFactorDbPerM).toEqual(ANTENNA_FACTOR_TABLE_METHOD)
    expect(d.equipmentCopies).toEqual([{ equipmentId: lpda.id, name: lpda.name, type: 'antenna', calibrationDueOn: '2027-06-30', version: 3 }])
    expect(d.warnings).toEqual([])
  })

  it('refuses a frequency outside the antenna’s table as a problem of the frequency, with no levels', () => {
    const d = deriveMeasurement({ ...base, freqHz: 150e6, reading: { value: 40, unit: 'dBµV' }, antenna: { source: 'register', item: lpda } })
    expect(d.problems).toEqual([{ path: 'freqHz', message: expect.stringMatching(/covers 200 MHz to 1000 MHz; 150 MHz is outside it/) }])
    expect(d.derived).toEqual({})
  })

  it('refuses a reading above what the instrument can take (dBµV converted at 50 Ω: 137 dBµV is 30 dBm)', () => {
    const analyser = item({ id: '00000000-0000-4000-8000-0000000000e2', name: 'Handheld analyser HA-9', type: 'analyser', maxInputDbm: 20, minFreqHz: 9e3, maxFreqHz: 6e9 })
    const over = deriveMeasurement({ ...base, freqHz: 433.92e6, reading: { value: 137, unit: 'dBµV' }, antenna: { source: 'gain', antennaGainDbi: 0 }, instrument: analyser })
    expect(over.problems).toEqual([{ path: 'reading.value', message: expect.stringMatching(/\(30\.0 dBm\) is above what Handheld analyser HA-9 can take \(20 dBm/) }])
    const outside = deriveMeasurement({ ...base, freqHz: 7e9, reading: { value: -40, unit: 'dBm' }, antenna: { source: 'gain', antennaGainDbi: 0 }, instrument: analyser })
    expect(outside.problems.map((p) => p.path)).toEqual(['freqHz'])
    const fine = deriveMeasurement({ ...base, freqHz: 433.92e6, reading: { value: 19.9, unit: 'dBm' }, antenna: { source: 'gain', antennaGainDbi: 0 }, instrument: analyser })
    expect(fine.problems).toEqual([])
  })

  const dbuv = DBM_TO_DBUV_ROWS.find((r) => r.id === '2-6' && r.tolerance === 0.01)!
  it(`compares a dBµV reading with the instrument's largest input in dBm at 50 Ω: ${dbuv.source}`, () => {
    const reading = { value: dbuv.expected.voltageDbuv, unit: 'dBµV' as const } // −50 dBm
    const at = (maxInputDbm: number) =>
      deriveMeasurement({ ...base, freqHz: 100e6, reading, antenna: { source: 'gain', antennaGainDbi: 0 }, instrument: item({ type: 'receiver', maxInputDbm }) }).problems
    expect(at(dbuv.inputs.powerDbm - 0.1)).toHaveLength(1)
    expect(at(dbuv.inputs.powerDbm + 0.1)).toEqual([])
  })

  it('warns of an expired calibration, judged at the time of the measurement', () => {
    const expired = item({ calibrationDueOn: '2026-11-19' })
    const d = deriveMeasurement({ ...base, freqHz: 433.92e6, reading: { value: 40, unit: 'dBµV' }, antenna: { source: 'register', item: { ...expired, antennaGainDbi: 6 } } })
    expect(d.warnings).toEqual(['Log-periodic LP-1: calibration ran out on 2026-11-19, before this measurement (2026-11-20).'])
    expect(d.derived.fieldStrengthDbuvPerM).toBeTypeOf('number')
    // the same item was in date for a measurement taken on its due date
    expect(calibrationWarning(expired, '2026-11-19T23:00:00Z')).toBeNull()
  })

  it('warns when the register has no calibration date', () => {
    const d = deriveMeasurement({ ...base, freqHz: 433.92e6, reading: { value: 40, unit: 'dBµV/m' }, antenna: { source: 'none' }, instrument: item({ type: 'receiver', calibrationDueOn: null, name: 'Receiver R-2' }) })
    expect(d.warnings).toEqual([expect.stringMatching(/^Receiver R-2: the register has no calibration date/)])
  })

  it('warns when a reading at the input has no antenna, and derives nothing', () => {
    const d = deriveMeasurement({ ...base, freqHz: 433.92e6, reading: { value: -60, unit: 'dBm' }, antenna: { source: 'none' } })
    expect(d.derived).toEqual({})
    expect(d.warnings).toEqual([expect.stringMatching(/No antenna given/)])
    const noData = deriveMeasurement({ ...base, freqHz: 433.92e6, reading: { value: -60, unit: 'dBm' }, antenna: { source: 'register', item: item({}) } })
    expect(noData.warnings).toEqual([expect.stringMatching(/neither a gain nor an antenna-factor table/)])
  })

  it('refuses a register item that is not an antenna as the antenna, and one that is not an instrument as the instrument', () => {
    const cable = item({ type: 'cable', name: 'Cable C-5' })
    const d = deriveMeasurement({ ...base, freqHz: 433.92e6, reading: { value: -60, unit: 'dBm' }, antenna: { source: 'register', item: cable }, instrument: cable })
    expect(d.problems.map((p) => p.path).sort()).toEqual(['antenna.equipmentId', 'instrumentId'])
  })

  it('warns that cable and preamplifier are not applied to a reading already in the field', () => {
    const d = deriveMeasurement({ ...base, freqHz: 100e6, reading: { value: 60, unit: 'dBµV/m' }, antenna: { source: 'none' }, cableLossDb: 2 })
    expect(d.warnings).toEqual([expect.stringMatching(/not applied/)])
    expect(d.derived.fieldStrengthDbuvPerM).toBe(60)
  })
})
