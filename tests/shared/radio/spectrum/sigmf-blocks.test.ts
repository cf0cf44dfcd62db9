import { describe, expect, it } from 'vitest'
import { checkSigmfDataLength, createSigmfBlockDecoder, decodeSigmfSamples, parseSigmfMetadata, SigmfError } from '../../../../shared/radio/spectrum'

const meta = (datatype: string, extra: Record<string, unknown> = {}) =>
  parseSigmfMetadata({ global: { 'core:datatype': datatype, 'core:version': '1.2.6', 'core:sample_rate': 1e6 }, captures: [{ 'core:sample_start': 0, 'core:frequency': 1e8 }], annotations: [], ...extra })

function decodeInBlocks(datatype: string, bytes: Uint8Array, blockBytes: number): Float32Array {
  const dec = createSigmfBlockDecoder({ metadata: meta(datatype) })
  const parts: number[] = []
  for (let at = 0; at < bytes.length; at += blockBytes) parts.push(...dec.decode(bytes.subarray(at, at + blockBytes)))
  dec.finish()
  return Float32Array.from(parts)
}

describe('createSigmfBlockDecoder (SigMF v1.2.6 dataset format: interleaved I then Q, little-endian)', () => {
  // byte layouts per the specification; the scalings are the library's convention (sigmf.ts eq. (1)–(3))
  const i16 = new Int16Array([-32768, 0, 16384, 32767, -1, 100])
  const ci16 = new Uint8Array(i16.buffer)
  const cu8 = Uint8Array.from([0, 128, 255, 64, 1, 200])
  const f32 = new Float32Array([0.5, -0.25, 1e-3, -1, 0.125, 3])
  const cf32 = new Uint8Array(f32.buffer)

  it('decodes ci16_le as v/32768 whatever the block split', () => {
    const want = [-1, 0, 0.5, 32767 / 32768, -1 / 32768, 100 / 32768]
    for (const block of [1, 2, 3, 5, 7, 100]) expect(Array.from(decodeInBlocks('ci16_le', ci16, block))).toEqual(want.map((v) => Math.fround(v)))
  })
  it('decodes cu8 as (v − 128)/128 whatever the block split', () => {
    const want = [-1, 0, 127 / 128, -0.5, -127 / 128, 72 / 128]
    for (const block of [1, 2, 3, 4]) expect(Array.from(decodeInBlocks('cu8', cu8, block))).toEqual(want.map((v) => Math.fround(v)))
  })
  it('decodes cf32_le unchanged whatever the block split, as the one-shot decoder does', () => {
    const whole = decodeSigmfSamples({ metadata: meta('cf32_le'), data: cf32 }).iq
    for (const block of [1, 3, 8, 9, 24]) expect(Array.from(decodeInBlocks('cf32_le', cf32, block))).toEqual(Array.from(whole))
    expect(Array.from(whole)).toEqual(Array.from(f32))
  })
  it('counts decoded samples and refuses a dataset cut inside a sample', () => {
    const dec = createSigmfBlockDecoder({ metadata: meta('cf32_le') })
    dec.decode(cf32.subarray(0, 13))
    expect(dec.samplesDecoded).toBe(1)
    expect(() => dec.finish()).toThrow(SigmfError)
    expect(() => dec.finish()).toThrow(/not a whole number of cf32_le samples \(8 bytes each\): 5 byte\(s\) left after 1 samples/)
  })
  it('refuses other datatypes by name, and an unknown datatype', () => {
    expect(() => createSigmfBlockDecoder({ metadata: meta('ci32_be') })).toThrow(/'ci32_be' is not read here: recordings must be cf32_le, ci16_le, cu8/)
    expect(() => createSigmfBlockDecoder({ metadata: meta('rf32_le') })).toThrow(/not read here/)
    expect(() => meta('cq15_le')).toThrow(/global.core:datatype: 'cq15_le' is not a SigMF dataset format/)
  })
})

describe('checkSigmfDataLength', () => {
  it('gives the sample count of a consistent dataset', () => {
    expect(checkSigmfDataLength({ metadata: meta('ci16_le'), dataBytes: 4000 })).toBe(1000)
  })
  it('refuses a length that is not a whole number of samples, and an empty dataset', () => {
    expect(() => checkSigmfDataLength({ metadata: meta('cf32_le'), dataBytes: 8001 })).toThrow(/8001 bytes is not a whole number of cf32_le samples/)
    expect(() => checkSigmfDataLength({ metadata: meta('cu8'), dataBytes: 0 })).toThrow(/empty/)
  })
  it('refuses captures and annotations beyond the data', () => {
    const m = meta('cu8', { captures: [{ 'core:sample_start': 0 }, { 'core:sample_start': 500 }] })
    expect(() => checkSigmfDataLength({ metadata: m, dataBytes: 800 })).toThrow(/captures\[1\]\.core:sample_start: starts at sample 500, but the dataset holds only 400 samples/)
    const a = meta('cu8', { annotations: [{ 'core:sample_start': 100, 'core:sample_count': 400 }] })
    expect(() => checkSigmfDataLength({ metadata: a, dataBytes: 800 })).toThrow(/annotations\[0\]: covers samples up to 500/)
    expect(checkSigmfDataLength({ metadata: a, dataBytes: 1000 })).toBe(500)
  })
})
