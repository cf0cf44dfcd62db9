import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import {
  antennaFactorFromGainDbPerM,
  antennaGainFromFactorDbi,
  channelPowerToRbwReadingDbm,
  effectiveApertureM2,
  fieldToReading,
  fieldToReceivedPowerDbm,
  fraunhoferDistanceM,
  gainFromEffectiveApertureDbi,
  GAUSSIAN_ENBW_RATIO,
  LINEAR_VOLTAGE_AVERAGE_NOISE_BIAS_DB,
  LOG_AVERAGE_NOISE_BIAS_DB,
  rbwReadingToChannelPowerDbm,
  readingToField,
  receivedPowerToFieldDbuvPerM,
  conductedFromEirpDbm,
  eirpAndErp,
  eirpFromConductedDbm,
} from '../../../../shared/radio/chain'

const freq = fc.double({ min: 9e3, max: 300e9, noNaN: true })
const gain = fc.double({ min: -20, max: 60, noNaN: true })
const level = fc.double({ min: -200, max: 200, noNaN: true })
const loss = fc.double({ min: 0, max: 60, noNaN: true })

describe('antenna factor and gain', () => {
  it('gain → AF → gain returns the gain at any frequency and impedance', () => {
    fc.assert(
      fc.property(freq, gain, fc.double({ min: 1, max: 600, noNaN: true }), (freqHz, antennaGainDbi, impedanceOhm) => {
        const af = antennaFactorFromGainDbPerM({ freqHz, antennaGainDbi, impedanceOhm })
        expect(antennaGainFromFactorDbi({ freqHz, antennaFactorDbPerM: af, impedanceOhm })).toBeCloseTo(antennaGainDbi, 9)
      }),
    )
  })
  it('gain → effective aperture → gain returns the gain', () => {
    fc.assert(
      fc.property(freq, gain, (freqHz, antennaGainDbi) => {
        const a = effectiveApertureM2({ freqHz, antennaGainDbi })
        expect(gainFromEffectiveApertureDbi({ freqHz, effectiveApertureM2: a })).toBeCloseTo(antennaGainDbi, 9)
      }),
    )
  })
  it('throws a RangeError naming freqHz for zero frequency', () => {
    expect(() => antennaFactorFromGainDbPerM({ freqHz: 0, antennaGainDbi: 0 })).toThrow(RangeError)
    expect(() => antennaFactorFromGainDbPerM({ freqHz: 0, antennaGainDbi: 0 })).toThrow(/freqHz/)
  })
  it('throws a RangeError naming effectiveApertureM2 for a negative aperture', () => {
    expect(() => gainFromEffectiveApertureDbi({ freqHz: 1e9, effectiveApertureM2: -1 })).toThrow(/effectiveApertureM2/)
  })
})

describe('isotropic received power', () => {
  it('field → received power → field returns the field', () => {
    fc.assert(
      fc.property(level, freq, gain, (e, freqHz, antennaGainDbi) => {
        const p = fieldToReceivedPowerDbm({ fieldStrengthDbuvPerM: e, freqHz, antennaGainDbi })
        expect(receivedPowerToFieldDbuvPerM({ receivedPowerDbm: p, freqHz, antennaGainDbi })).toBeCloseTo(e, 9)
      }),
    )
  })
  it('equals E − 20 log f(MHz) − 77.22 dBm within 0.01 dB at any frequency (ITU-R P.525-4 §3 dBm/MHz form, [D])', () => {
    fc.assert(
      fc.property(level, freq, (e, freqHz) => {
        const p = fieldToReceivedPowerDbm({ fieldStrengthDbuvPerM: e, freqHz })
        expect(Math.abs(p - (e - 20 * Math.log10(freqHz / 1e6) - 77.22))).toBeLessThanOrEqual(0.01)
      }),
    )
  })
})

describe('readingToField', () => {
  it('reading → field → reading returns the reading through any chain', () => {
    fc.assert(
      fc.property(level, freq, gain, loss, loss, loss, (readingDbm, freqHz, antennaGainDbi, cableLossDb, attenuatorDb, preampGainDb) => {
        const chain = { freqHz, antenna: { antennaGainDbi }, cableLossDb, attenuatorDb, preampGainDb }
        const e = readingToField({ ...chain, reading: { readingDbm } }).value.fieldStrengthDbuvPerM
        expect(fieldToReading({ ...chain, fieldStrengthDbuvPerM: e }).value.readingDbm).toBeCloseTo(readingDbm, 9)
      }),
    )
  })
  it('gives isotropic received power + antenna gain = power at the antenna port (AF and P_r are consistent)', () => {
    fc.assert(
      fc.property(level, freq, gain, loss, (readingDbm, freqHz, antennaGainDbi, cableLossDb) => {
        const v = readingToField({ reading: { readingDbm }, freqHz, antenna: { antennaGainDbi }, cableLossDb }).value
        expect(v.isotropicReceivedPowerDbm + antennaGainDbi).toBeCloseTo(v.antennaPortPowerDbm, 9)
      }),
    )
  })
  it('reads the same field from a dBm reading and the equal dBµV reading at 50 Ω (2-6: −50 dBm = 56.99 dBµV)', () => {
    const chain = { freqHz: 100e6, antenna: { antennaFactorDbPerM: 12 } }
    const a = readingToField({ ...chain, reading: { readingDbm: -50 } }).value.fieldStrengthDbuvPerM
    const b = readingToField({ ...chain, reading: { readingDbuv: -50 + 10 * Math.log10(50) + 90 } }).value.fieldStrengthDbuvPerM
    expect(a).toBeCloseTo(b, 12)
    expect(Math.abs(a - (56.99 + 12))).toBeLessThanOrEqual(0.01)
  })
  it('adds cable and attenuator losses back and takes the preamplifier gain off', () => {
    const base = { freqHz: 100e6, antenna: { antennaFactorDbPerM: 10 }, reading: { readingDbm: -60 } }
    const plain = readingToField(base).value.fieldStrengthDbuvPerM
    const withChain = readingToField({ ...base, cableLossDb: 2, attenuatorDb: 10, preampGainDb: 20 }).value.fieldStrengthDbuvPerM
    expect(withChain - plain).toBeCloseTo(2 + 10 - 20, 12)
  })
  it('gives the same field from an antenna gain as from the antenna factor derived from it', () => {
    const freqHz = 900e6
    const af = antennaFactorFromGainDbPerM({ freqHz, antennaGainDbi: 8 })
    const a = readingToField({ freqHz, reading: { readingDbm: -70 }, antenna: { antennaGainDbi: 8 } }).value
    const b = readingToField({ freqHz, reading: { readingDbm: -70 }, antenna: { antennaFactorDbPerM: af } }).value
    expect(a.fieldStrengthDbuvPerM).toBeCloseTo(b.fieldStrengthDbuvPerM, 12)
    expect(b.antennaGainDbi).toBeCloseTo(8, 9)
  })
  it('returns pfd consistent with S = E − 145.76 (1-8) and field in V/m', () => {
    const v = readingToField({ freqHz: 100e6, reading: { readingDbm: -50 }, antenna: { antennaFactorDbPerM: 3.01 } }).value
    expect(Math.abs(v.pfdDbwPerM2 - (v.fieldStrengthDbuvPerM - 145.76))).toBeLessThanOrEqual(0.01)
    expect(20 * Math.log10(v.fieldStrengthVPerM) + 120).toBeCloseTo(v.fieldStrengthDbuvPerM, 9)
    expect(10 * Math.log10(v.pfdWPerM2)).toBeCloseTo(v.pfdDbwPerM2, 9)
  })
  it('warns about the near field when the distance is inside 2D²/λ', () => {
    const r = readingToField({ freqHz: 10e9, reading: { readingDbm: -40 }, antenna: { antennaGainDbi: 20 }, distanceM: 5, antennaSizeM: 0.6 })
    expect(fraunhoferDistanceM({ freqHz: 10e9, antennaSizeM: 0.6 })).toBeCloseTo((2 * 0.36) / (299_792_458 / 10e9), 9)
    expect(r.warnings.some((w) => /2D²\/λ/.test(w))).toBe(true)
  })
  it('warns about the reactive near field when closer than one wavelength', () => {
    const r = readingToField({ freqHz: 30e6, reading: { readingDbm: -40 }, antenna: { antennaGainDbi: 0 }, distanceM: 5 })
    expect(r.warnings.some((w) => /wavelength/.test(w))).toBe(true)
  })
  it('gives no warning in the far field', () => {
    const r = readingToField({ freqHz: 1e9, reading: { readingDbm: -40 }, antenna: { antennaGainDbi: 0 }, distanceM: 100, antennaSizeM: 0.5 })
    expect(r.warnings).toEqual([])
  })
  it('throws a RangeError naming cableLossDb when the cable loss is negative', () => {
    expect(() => readingToField({ freqHz: 1e9, reading: { readingDbm: -40 }, antenna: { antennaGainDbi: 0 }, cableLossDb: -1 })).toThrow(/cableLossDb/)
  })
  it('throws a RangeError when both antenna factor and gain are given', () => {
    const antenna = { antennaGainDbi: 0, antennaFactorDbPerM: 10 } as unknown as { antennaGainDbi: number }
    expect(() => readingToField({ freqHz: 1e9, reading: { readingDbm: -40 }, antenna })).toThrow(/antenna/)
  })
  it('throws a RangeError naming readingDbm for a NaN reading', () => {
    expect(() => readingToField({ freqHz: 1e9, reading: { readingDbm: Number.NaN }, antenna: { antennaGainDbi: 0 } })).toThrow(/readingDbm/)
  })
  it('throws a RangeError naming distanceM for a zero distance', () => {
    expect(() => readingToField({ freqHz: 1e9, reading: { readingDbm: -40 }, antenna: { antennaGainDbi: 0 }, distanceM: 0 })).toThrow(/distanceM/)
  })
})

describe('rbwReadingToChannelPowerDbm', () => {
  it('reading → channel power → reading returns the reading for every detector and ENBW', () => {
    const detectors = ['rms', 'log-average', 'linear-voltage-average'] as const
    fc.assert(
      fc.property(
        level,
        fc.double({ min: 1, max: 1e7, noNaN: true }),
        fc.double({ min: 1, max: 1e9, noNaN: true }),
        fc.constantFrom(...detectors),
        fc.oneof(fc.constant<'gaussian'>('gaussian'), fc.double({ min: 0.5, max: 2, noNaN: true })),
        (readingDbm, rbwHz, channelBandwidthHz, detector, enbwRatio) => {
          const opts = { rbwHz, channelBandwidthHz, detector, enbwRatio }
          const p = rbwReadingToChannelPowerDbm({ ...opts, readingDbm }).value.channelPowerDbm
          expect(channelPowerToRbwReadingDbm({ ...opts, channelPowerDbm: p }).value.readingDbm).toBeCloseTo(readingDbm, 9)
        },
      ),
    )
  })
  it('uses the exact constants 1.0645, 2.5068 dB and 1.0491 dB (Keysight AN 150 ch. 5 rounds them to 1.06, 2.5 and 1.05 [V-S])', () => {
    expect(GAUSSIAN_ENBW_RATIO).toBeCloseTo(1.0645, 4)
    expect(LOG_AVERAGE_NOISE_BIAS_DB).toBeCloseTo(2.5068, 4)
    expect(LINEAR_VOLTAGE_AVERAGE_NOISE_BIAS_DB).toBeCloseTo(1.0491, 4)
  })
  it('states the ENBW it assumed when none is given', () => {
    const r = rbwReadingToChannelPowerDbm({ readingDbm: -60, rbwHz: 100e3, channelBandwidthHz: 1e6 })
    expect(r.value.enbwRatio).toBe(1)
    expect(r.warnings.some((w) => /ENBW taken as 1\.000/.test(w))).toBe(true)
  })
  it('warns when the channel is narrower than the RBW noise bandwidth', () => {
    const r = rbwReadingToChannelPowerDbm({ readingDbm: -60, rbwHz: 1e6, channelBandwidthHz: 100e3 })
    expect(r.warnings.some((w) => /narrower/.test(w))).toBe(true)
  })
  it('throws a RangeError naming rbwHz for a zero RBW', () => {
    expect(() => rbwReadingToChannelPowerDbm({ readingDbm: -60, rbwHz: 0, channelBandwidthHz: 1e6 })).toThrow(/rbwHz/)
  })
  it('throws a RangeError naming detector for an unknown detector', () => {
    const detector = 'peak' as unknown as 'rms'
    expect(() => rbwReadingToChannelPowerDbm({ readingDbm: -60, rbwHz: 1e3, channelBandwidthHz: 1e6, detector })).toThrow(/detector/)
  })
})

describe('EIRP helpers', () => {
  it('conducted → EIRP → conducted returns the conducted power', () => {
    fc.assert(
      fc.property(level, gain, loss, (p, g, l) => {
        const e = eirpFromConductedDbm({ conductedPowerDbm: p, antennaGainDbi: g, feederLossDb: l }).value.eirpDbm
        expect(conductedFromEirpDbm({ eirpDbm: e, antennaGainDbi: g, feederLossDb: l }).value.conductedPowerDbm).toBeCloseTo(p, 9)
      }),
    )
  })
  it('11-1: 12 dBm conducted into 24 dBi gives 36 dBm EIRP (47 CFR §15.247 worked check, [D])', () => {
    const r = eirpFromConductedDbm({ conductedPowerDbm: 12, antennaGainDbi: 24 })
    expect(r.value.eirpDbm).toBe(36)
    expect(r.method.id).toBe('eirp-from-conducted')
    expect(r.method.source).toContain('register 11-1')
  })
  it('warns that the feeder loss was taken as 0 dB when none is given, and not when it is', () => {
    expect(eirpFromConductedDbm({ conductedPowerDbm: 12, antennaGainDbi: 24 }).warnings.some((w) => /Feeder loss/.test(w))).toBe(true)
    expect(conductedFromEirpDbm({ eirpDbm: 36, antennaGainDbi: 24, feederLossDb: 1 }).warnings).toEqual([])
  })
  it('throws a RangeError when both EIRP and ERP are given', () => {
    const both = { eirpDbm: 20, erpDbm: 18 } as unknown as { eirpDbm: number }
    expect(() => eirpAndErp(both)).toThrow(/eirpDbm or erpDbm/)
  })
  it('states that the other quantity was derived with the 2.15 dBi dipole gain', () => {
    expect(eirpAndErp({ erpDbm: 30 }).warnings[0]).toMatch(/2\.15 dBi/)
  })
})
