/** The spectrum chart's pure helpers: two traces on one axis, MHz ticks, the spectrogram's colours. */
import { describe, expect, it } from 'vitest'
import { SPECTROGRAM_RAMP, alignTraces, mhzTicks, rampColour, spectrogramPixels } from '@/components/charts/lib/spectrum-data'

describe('alignTraces', () => {
  it('puts two traces on the union of their frequencies, null where a trace has no point', () => {
    const a = { freqHz: [1, 2, 4], level: [-10, -20, -40] }
    const b = { freqHz: [2, 3, 5], level: [-21, -31, -51] }
    expect(alignTraces(a, b)).toEqual({ x: [1, 2, 3, 4, 5], a: [-10, -20, null, -40, null], b: [null, -21, -31, null, -51] })
    expect(alignTraces(a)).toEqual({ x: [1, 2, 4], a: [-10, -20, -40], b: [null, null, null] })
  })
})

describe('mhzTicks', () => {
  it('writes as many decimals as the tick spacing needs', () => {
    expect(mhzTicks([433.9e6, 433.95e6, 434e6])).toEqual(['433.90', '433.95', '434.00'])
    expect(mhzTicks([100e6, 200e6])).toEqual(['100', '200'])
    expect(mhzTicks([433_920_000, 433_920_500])).toEqual(['433.9200', '433.9205'])
    expect(mhzTicks([433.875e6, 433.9e6, 433.925e6])).toEqual(['433.875', '433.900', '433.925'])
  })
})

describe('the spectrogram colours', () => {
  it('run from the first stop of the ramp at byte 0 to the last at byte 255', () => {
    const hex = (c: number[]) => `#${c.map((v) => v.toString(16).padStart(2, '0')).join('')}`
    expect(hex(rampColour(0))).toBe(SPECTROGRAM_RAMP[0])
    expect(hex(rampColour(255))).toBe(SPECTROGRAM_RAMP[3])
    expect(hex(rampColour(85))).toBe(SPECTROGRAM_RAMP[1])
  })

  it('decode base64 cells row by row into opaque pixels', () => {
    const px = spectrogramPixels(btoa(String.fromCharCode(0, 255)), 1, 2)
    expect(Array.from(px)).toEqual([0xf6, 0xf4, 0xee, 255, 0x18, 0x21, 0x2b, 255])
  })
})
