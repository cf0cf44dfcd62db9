import { describe, expect, it } from 'vitest'
import checks from '../../../fixtures/radio/chain-checks.json'
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
import { dbmToDbw } from '../../../../shared/radio/units'

const within = (actual: number, expected: number, tol: number) => expect(Math.abs(actual - expected)).toBeLessThanOrEqual(tol)

describe('free-space field and pfd of an EIRP given in dBm (propagation/free-space-p525)', () => {
  for (const row of checks.freeSpaceField) {
    it(`${row.id}: matches ${row.source} within ${row.toleranceDb} dB ${row.status}`, () => {
      const opts = { eirpDbw: dbmToDbw(row.inputs.eirpDbm), distanceM: row.inputs.distanceM }
      within(freeSpaceFieldStrengthDbuvPerM(opts), row.expected.fieldStrengthDbuvPerM, row.toleranceDb)
      if ('pfdDbwPerM2' in row.expected) within(freeSpacePfdDbwPerM2(opts), row.expected.pfdDbwPerM2 as number, row.toleranceDb)
    })
  }
  for (const row of checks.freeSpaceFieldFromErp) {
    it(`${row.id}: matches ${row.source} within ${row.toleranceDb} dB ${row.status}`, () => {
      const eirpDbm = eirpAndErp({ erpDbm: row.inputs.erpDbm }).value.eirpDbm
      within(freeSpaceFieldStrengthDbuvPerM({ eirpDbw: dbmToDbw(eirpDbm), distanceM: row.inputs.distanceM }), row.expected.fieldStrengthDbuvPerM, row.toleranceDb)
    })
  }
})

describe('fieldToReceivedPowerDbm', () => {
  for (const row of checks.receivedPower) {
    it(`${row.id}: matches ${row.source} within ${row.toleranceDb} dB ${row.status}`, () => {
      within(fieldToReceivedPowerDbm(row.inputs), row.expected.receivedPowerDbm, row.toleranceDb)
    })
  }
  it('1-9: is not the −147.2 dBW that mixing f in MHz with 167.2 would give (60 dB unit trap)', () => {
    const dbw = fieldToReceivedPowerDbm({ fieldStrengthDbuvPerM: 60, freqHz: 100e6 }) - 30
    within(dbw, -87.22, 0.01)
    expect(Math.abs(dbw - -147.2)).toBeGreaterThan(59)
  })
})

describe('effectiveApertureM2', () => {
  for (const row of checks.effectiveAperture) {
    it(`${row.id}: matches ${row.source} within ${row.toleranceDb} dB ${row.status}`, () => {
      const a = effectiveApertureM2(row.inputs)
      within(10 * Math.log10(a), row.expected.effectiveApertureDbM2, row.toleranceDb)
      within(10 * Math.log10(a), 10 * Math.log10(row.expected.effectiveApertureM2), row.toleranceDb)
    })
  }
})

describe('antennaFactorFromGainDbPerM', () => {
  for (const row of checks.antennaFactor) {
    it(`${row.id}: matches ${row.source} within ${row.toleranceDb} dB ${row.status}`, () => {
      within(antennaFactorFromGainDbPerM(row.inputs), row.expected.antennaFactorDbPerM, row.toleranceDb)
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
  for (const row of checks.measurementChain) {
    it(`${row.id}: matches ${row.source} ${row.status}`, () => {
      const { readingDbuv, antennaFactorDbPerM, cableLossDb, freqHz } = row.inputs
      const r = readingToField({ reading: { readingDbuv }, antenna: { antennaFactorDbPerM }, cableLossDb, freqHz })
      within(r.value.fieldStrengthDbuvPerM, row.expected.fieldStrengthDbuvPerM, row.toleranceDb)
    })
  }
})

describe('eirpAndErp', () => {
  for (const row of checks.eirpErp) {
    it(`${row.id}: matches ${row.source} within ${row.toleranceDb} dB ${row.status}`, () => {
      const input = 'erpMw' in row.inputs ? { erpDbm: 10 * Math.log10(row.inputs.erpMw as number) } : { eirpDbm: 10 * Math.log10(row.inputs.eirpMw as number) }
      const r = eirpAndErp(input).value
      const e = row.expected as unknown as Record<string, number>
      if (e.eirpDbm !== undefined) within(r.eirpDbm, e.eirpDbm, row.toleranceDb)
      if (e.erpDbm !== undefined) within(r.erpDbm, e.erpDbm, row.toleranceDb)
      if (e.eirpMw !== undefined) within(r.eirpW * 1000, e.eirpMw, e.eirpMwTolerance)
      if (e.erpMw !== undefined) within(r.erpW * 1000, e.erpMw, e.erpMwTolerance)
    })
  }
})

describe('rbwReadingToChannelPowerDbm', () => {
  for (const row of checks.channelPower) {
    it(`${row.id}: matches ${row.source} within ${row.toleranceDb} dB ${row.status}`, () => {
      const i = row.inputs as { readingDbm: number; rbwHz: number; channelBandwidthHz: number; detector?: NoiseDetector; enbwRatio?: 'gaussian' }
      within(rbwReadingToChannelPowerDbm(i).value.channelPowerDbm, row.expected.channelPowerDbm, row.toleranceDb)
    })
  }
})
