import { describe, expect, it } from 'vitest'
import { channelPowerToRbwReadingDbm, rbwReadingToChannelPowerDbm } from '../../../../shared/radio/chain'
import { channelPower } from '../../../../shared/radio/spectrum'

/** The flat-channel formula of chain/channel-power.ts with ENBW = the given noise bandwidth (ratio 1). */
const flatChannelPowerDbm = (o: { levelDbm: number; enbwHz: number; channelBandwidthHz: number }) =>
  rbwReadingToChannelPowerDbm({ readingDbm: o.levelDbm, rbwHz: o.enbwHz, channelBandwidthHz: o.channelBandwidthHz }).value.channelPowerDbm
const flatChannelLevelDbm = (o: { channelPowerDbm: number; enbwHz: number; channelBandwidthHz: number }) =>
  channelPowerToRbwReadingDbm({ channelPowerDbm: o.channelPowerDbm, rbwHz: o.enbwHz, channelBandwidthHz: o.channelBandwidthHz }).value.readingDbm

/** A flat trace: points every spacingHz from startHz, count points, all at levelDbm. */
function flatTrace(opts: { startHz: number; spacingHz: number; count: number; levelDbm: number }) {
  const freqHz = Array.from({ length: opts.count }, (_, i) => opts.startHz + i * opts.spacingHz)
  return { freqHz, levelDbm: freqHz.map(() => opts.levelDbm) }
}

describe('channelPower from a trace read in an RBW, with the ENBW correction', () => {
  it('matches Keysight AN 150 ch. 5, register 14-1: PSD −100 dBm/Hz over 20 MHz is −26.99 dBm within 0.01 dB [D]', () => {
    // Read in ENBW = spacing = 100 kHz: each point is −100 + 50 = −50 dBm.
    const trace = flatTrace({ startHz: 2390e6, spacingHz: 100e3, count: 401, levelDbm: -50 })
    const r = channelPower({ ...trace, startHz: 2400e6, stopHz: 2420e6, enbwHz: 100e3 })
    expect(r.value.channelPowerDbm).toBeCloseTo(-26.99, 2)
    expect(Math.abs(r.value.channelPowerDbm - -26.99)).toBeLessThan(0.01)
    expect(r.value.cellsCounted).toBeCloseTo(200, 9)
    expect(r.warnings).toEqual([])
  })

  it('matches Keysight AN 150 ch. 5, register 14-1 from a density trace in dBm/Hz (level + 10·log Δf, ENBW = Δf) within 0.01 dB [D]', () => {
    const spacingHz = 250e3
    const trace = flatTrace({ startHz: 2390e6 + spacingHz / 2, spacingHz, count: 160, levelDbm: -100 + 10 * Math.log10(spacingHz) })
    const r = channelPower({ ...trace, startHz: 2400e6, stopHz: 2420e6, enbwHz: spacingHz })
    expect(Math.abs(r.value.channelPowerDbm - -26.99)).toBeLessThan(0.01)
  })

  it('matches Keysight AN 150 ch. 5, register 14-3: −60 dBm in RBW 100 kHz over a 1 MHz channel is −50.00 dBm (trace at 10 kHz spacing) [D]', () => {
    const trace = flatTrace({ startHz: 99e6, spacingHz: 10e3, count: 201, levelDbm: -60 })
    const r = channelPower({ ...trace, startHz: 99.5e6, stopHz: 100.5e6, enbwHz: 100e3 })
    expect(Math.abs(r.value.channelPowerDbm - -50)).toBeLessThan(1e-9)
    expect(r.value.enbwCorrectionDb).toBeCloseTo(-10, 9)
  })

  it('matches Keysight AN 150 ch. 5, register 14-3 with the flat-channel formula and round-trips through its inverse [D]', () => {
    expect(flatChannelPowerDbm({ levelDbm: -60, enbwHz: 100e3, channelBandwidthHz: 1e6 })).toBeCloseTo(-50, 12)
    expect(flatChannelLevelDbm({ channelPowerDbm: -50, enbwHz: 100e3, channelBandwidthHz: 1e6 })).toBeCloseTo(-60, 12)
    for (const levelDbm of [-120, -73.4, 5]) {
      const p = flatChannelPowerDbm({ levelDbm, enbwHz: 30e3, channelBandwidthHz: 4.5e6 })
      expect(flatChannelLevelDbm({ channelPowerDbm: p, enbwHz: 30e3, channelBandwidthHz: 4.5e6 })).toBeCloseTo(levelDbm, 12)
    }
  })

  it('gives the same power whether points sit on the band edges or at cell centres [D]', () => {
    const onEdges = flatTrace({ startHz: 99e6, spacingHz: 10e3, count: 201, levelDbm: -60 })
    const centred = flatTrace({ startHz: 99e6 + 5e3, spacingHz: 10e3, count: 200, levelDbm: -60 })
    const a = channelPower({ ...onEdges, startHz: 99.5e6, stopHz: 100.5e6, enbwHz: 100e3 })
    const b = channelPower({ ...centred, startHz: 99.5e6, stopHz: 100.5e6, enbwHz: 100e3 })
    expect(a.value.channelPowerDbm).toBeCloseTo(b.value.channelPowerDbm, 9)
  })

  it('sums a tone and noise as powers: a −40 dBm tone on −90 dBm/RBW noise over 100 points reads 10·log(10^−4 + 100·10^−9·Δf/ENBW) [D]', () => {
    const trace = flatTrace({ startHz: 0.5e6, spacingHz: 10e3, count: 100, levelDbm: -90 })
    trace.levelDbm[50] = -40
    const r = channelPower({ ...trace, startHz: 0.495e6, stopHz: 1.495e6, enbwHz: 10e3 })
    const expected = 10 * Math.log10(1e-4 + 99 * 1e-9)
    expect(r.value.channelPowerDbm).toBeCloseTo(expected, 9)
  })

  it('warns when the band runs past the trace, when points are sparser than the ENBW, or when few cells count', () => {
    const trace = flatTrace({ startHz: 99e6, spacingHz: 100e3, count: 11, levelDbm: -60 })
    const r = channelPower({ ...trace, startHz: 99.9e6, stopHz: 100.4e6, enbwHz: 30e3 })
    const text = r.warnings.join(' ')
    expect(text).toMatch(/beyond the trace/)
    expect(text).toMatch(/wider than the noise bandwidth/)
    expect(text).toMatch(/trace cells fall in the band/)
  })

  it('throws RangeError for a band outside the trace, an inverted band, a zero ENBW or a bad trace', () => {
    const trace = flatTrace({ startHz: 99e6, spacingHz: 10e3, count: 201, levelDbm: -60 })
    expect(() => channelPower({ ...trace, startHz: 200e6, stopHz: 201e6, enbwHz: 1e3 })).toThrow(/outside the trace/)
    expect(() => channelPower({ ...trace, startHz: 100e6, stopHz: 99.9e6, enbwHz: 1e3 })).toThrow(RangeError)
    expect(() => channelPower({ ...trace, startHz: 99.5e6, stopHz: 100e6, enbwHz: 0 })).toThrow(RangeError)
    expect(() => channelPower({ freqHz: [], levelDbm: [], startHz: 1, stopHz: 2, enbwHz: 1 })).toThrow(RangeError)
    expect(() => channelPower({ freqHz: [1, 2], levelDbm: [NaN, 1], startHz: 1, stopHz: 2, enbwHz: 1 })).toThrow(RangeError)
  })
})
