import { describe, expect, it } from 'vitest'
import {
  ANTENNA_FACTOR_ROWS,
  CHANNEL_POWER_ROWS,
  EFFECTIVE_APERTURE_ROWS,
  EIRP_ERP_ROWS,
  FREE_SPACE_FIELD_FROM_ERP_ROWS,
  FREE_SPACE_FIELD_ROWS,
  MEASUREMENT_CHAIN_ROWS,
  RECEIVED_POWER_ROWS,
} from '../../../fixtures/radio/chain-checks'
import {
  antennaFactorFromGainDbPerM,
  effectiveApertureM2,
  eirpAndErp,
  fieldToReceivedPowerDbm,
  rbwReadingToChannelPowerDbm,
  readingToField,
  type NoiseDetector,
} from '../../../../shared/radio/chain'
import { freeSpaceFieldStrengthDbuvPerM, freeSpacePfdDbwPerM2 } from '../../../../shared/radio/propagation'

const within = (actual: number, expected: number, tol: number) => expect(Math.abs(actual - expected)).toBeLessThanOrEqual(tol)

describe('free-space field and pfd of an EIRP given in dBm (propagation/free-space-p525)', () => {
  for (const row of FREE_SPACE_FIELD_ROWS) {
    it(`${row.id}: matches ${row.source} within ${row.tolerance} dB ${row.status}`, () => {
      const opts = { eirpDbm: row.inputs.eirpDbm, distanceM: row.inputs.distanceM }
      within(freeSpaceFieldStrengthDbuvPerM(opts), row.expected.fieldStrengthDbuvPerM, row.tolerance)
      if (row.expected.pfdDbwPerM2 !== undefined) within(freeSpacePfdDbwPerM2(opts), row.expected.pfdDbwPerM2, row.tolerance)
    })
  }
  for (const row of FREE_SPACE_FIELD_FROM_ERP_ROWS) {
    it(`${row.id}: matches ${row.source} within ${row.tolerance} dB ${row.status}`, () => {
      const eirpDbm = eirpAndErp({ erpDbm: row.inputs.erpDbm }).value.eirpDbm
      within(freeSpaceFieldStrengthDbuvPerM({ eirpDbm, distanceM: row.inputs.distanceM }), row.expected.fieldStrengthDbuvPerM, row.tolerance)
    })
  }
})

describe('fieldToReceivedPowerDbm', () => {
  for (const row of RECEIVED_POWER_ROWS) {
    it(`${row.id}: matches ${row.source} within ${row.tolerance} dB ${row.status}`, () => {
      within(fieldToReceivedPowerDbm(row.inputs), row.expected.receivedPowerDbm, row.tolerance)
    })
  }
  it('1-9: is not the −147.2 dBW that mixing f in MHz with 167.2 would give (60 dB unit trap)', () => {
    const dbw = fieldToReceivedPowerDbm({ fieldStrengthDbuvPerM: 60, freqHz: 100e6 }) - 30
    within(dbw, -87.22, 0.01)
    expect(Math.abs(dbw - -147.2)).toBeGreaterThan(59)
  })
})

describe('effectiveApertureM2', () => {
  for (const row of EFFECTIVE_APERTURE_ROWS) {
    it(`${row.id}: matches ${row.source} within ${row.tolerance} dB ${row.status}`, () => {
      const a = effectiveApertureM2(row.inputs)
      within(10 * Math.log10(a), row.expected.effectiveApertureDbM2, row.tolerance)
      within(10 * Math.log10(a), 10 * Math.log10(row.expected.effectiveApertureM2), row.tolerance)
    })
  }
})

describe('antennaFactorFromGainDbPerM', () => {
  for (const row of ANTENNA_FACTOR_ROWS) {
    it(`${row.id}: matches ${row.source} within ${row.tolerance} dB ${row.status}`, () => {
      within(antennaFactorFromGainDbPerM(row.inputs), row.expected.antennaFactorDbPerM, row.tolerance)
    })
  }
  it('uses the constant 29.77 dB of AF = 20 log f(MHz) − G − 29.77 within 0.01 dB (ITU Handbook on Spectrum Monitoring [M]; 9.73/(λ√G) [V-S])', () => {
    const af = antennaFactorFromGainDbPerM({ freqHz: 1e6, antennaGainDbi: 0 })
    within(af, -29.77, 0.01)
  })
  it('agrees with 9.73/(λ√G) at 50 Ω within 0.01 dB (Antenna factor, 50 Ω form [V-S])', () => {
    const freqHz = 433e6
    const lambdaM = 299_792_458 / freqHz
    const g = 10 ** (5 / 10)
    within(antennaFactorFromGainDbPerM({ freqHz, antennaGainDbi: 5 }), 20 * Math.log10(9.73 / (lambdaM * Math.sqrt(g))), 0.01)
  })
})

describe('readingToField', () => {
  for (const row of MEASUREMENT_CHAIN_ROWS) {
    it(`${row.id}: matches ${row.source} ${row.status}`, () => {
      const { readingDbuv, antennaFactorDbPerM, cableLossDb, freqHz } = row.inputs
      const r = readingToField({ reading: { readingDbuv }, antenna: { antennaFactorDbPerM }, cableLossDb, freqHz })
      within(r.value.fieldStrengthDbuvPerM, row.expected.fieldStrengthDbuvPerM, row.tolerance)
    })
  }
})

describe('eirpAndErp', () => {
  for (const row of EIRP_ERP_ROWS) {
    it(`${row.id}: matches ${row.source} within ${row.tolerance.db} dB ${row.status}`, () => {
      const input = 'erpMw' in row.inputs ? { erpDbm: 10 * Math.log10(row.inputs.erpMw) } : { eirpDbm: 10 * Math.log10(row.inputs.eirpMw) }
      const r = eirpAndErp(input).value
      const e = row.expected
      if (e.eirpDbm !== undefined) within(r.eirpDbm, e.eirpDbm, row.tolerance.db)
      if (e.erpDbm !== undefined) within(r.erpDbm, e.erpDbm, row.tolerance.db)
      if (e.eirpMw !== undefined) within(r.eirpW * 1000, e.eirpMw, row.tolerance.mw!)
      if (e.erpMw !== undefined) within(r.erpW * 1000, e.erpMw, row.tolerance.mw!)
    })
  }
})

describe('rbwReadingToChannelPowerDbm', () => {
  for (const row of CHANNEL_POWER_ROWS) {
    it(`${row.id}: matches ${row.source} within ${row.tolerance} dB ${row.status}`, () => {
      const i: { readingDbm: number; rbwHz: number; channelBandwidthHz: number; detector?: NoiseDetector; enbwRatio?: 'gaussian' } = row.inputs
      within(rbwReadingToChannelPowerDbm(i).value.channelPowerDbm, row.expected.channelPowerDbm, row.tolerance)
    })
  }
})
