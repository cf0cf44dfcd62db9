import { describe, expect, it } from 'vitest'
import { decodeSigmfSamples, parseSigmfDatatype, parseSigmfMetadata, SigmfError } from '../../../../shared/radio/spectrum'

/** Metadata of a small recording; datatype and extras vary per test. */
function meta(datatype: string, extra: Record<string, unknown> = {}) {
  return {
    global: { 'core:datatype': datatype, 'core:version': '1.2.6', 'core:sample_rate': 2.4e6, ...extra },
    captures: [
      { 'core:sample_start': 0, 'core:frequency': 156.8e6, 'core:datetime': '2026-11-30T09:15:00.000Z' },
      { 'core:sample_start': 2, 'core:frequency': 156.825e6 },
    ],
    annotations: [{ 'core:sample_start': 0, 'core:sample_count': 3, 'core:freq_lower_edge': 156.79e6, 'core:freq_upper_edge': 156.81e6, 'core:label': 'carrier' }],
  }
}

/** Packs 16-bit integers in the given byte order. */
function int16Bytes(values: number[], littleEndian: boolean): ArrayBuffer {
  const buf = new ArrayBuffer(values.length * 2)
  const view = new DataView(buf)
  values.forEach((v, k) => view.setInt16(2 * k, v, littleEndian))
  return buf
}

// SigMF v1.2.6 "Dataset Format": complex samples interleaved, I first; '_le' little-endian.
// Full scale: a 16-bit integer v maps to v/32768 (the library's convention; common practice, no source).
const I16 = [16384, -32768, 32767, 0, -1, 1]
const I16_EXPECTED = [0.5, -1, 0.999969482421875, 0, -3.0517578125e-5, 3.0517578125e-5]

describe('SigMF metadata (SigMF specification v1.2.6)', () => {
  it('reads datatype, sample rate, captures and annotations from JSON text', () => {
    const m = parseSigmfMetadata(JSON.stringify(meta('ci16_le')))
    expect(m.datatype).toEqual({ text: 'ci16_le', complex: true, component: 'i16', bytesPerComponent: 2, littleEndian: true })
    expect(m.sampleRateHz).toBe(2.4e6)
    expect(m.version).toBe('1.2.6')
    expect(m.numChannels).toBe(1)
    expect(m.captures.map((c) => c.frequencyHz)).toEqual([156.8e6, 156.825e6])
    expect(m.captures[0].datetime).toBe('2026-11-30T09:15:00.000Z')
    expect(m.annotations[0]).toMatchObject({ sampleStart: 0, sampleCount: 3, freqLowerEdgeHz: 156.79e6, label: 'carrier' })
    expect(m.warnings).toEqual([])
  })
  it('parses every dataset format of the ABNF: (r|c)(f32|f64|i32|i16|u32|u16)_(le|be) and (r|c)(i8|u8)', () => {
    expect(parseSigmfDatatype('cf64_be')).toMatchObject({ complex: true, component: 'f64', bytesPerComponent: 8, littleEndian: false })
    expect(parseSigmfDatatype('ci8')).toMatchObject({ complex: true, component: 'i8', bytesPerComponent: 1 })
    expect(parseSigmfDatatype('ru16_le')).toMatchObject({ complex: false, component: 'u16' })
    for (const bad of ['cf16_le', 'ci16', 'ci8_le', 'CF32_LE', 'xf32_le', '']) expect(() => parseSigmfDatatype(bad)).toThrow(SigmfError)
  })
  it('implies one capture at sample 0 when captures is empty', () => {
    const m = parseSigmfMetadata({ ...meta('cf32_le'), captures: [] })
    expect(m.captures).toEqual([{ sampleStart: 0 }])
  })
  it('names the field of each metadata error', () => {
    expect(() => parseSigmfMetadata('{not json')).toThrow(/not valid JSON/)
    expect(() => parseSigmfMetadata({ captures: [] })).toThrow(/^global: /)
    expect(() => parseSigmfMetadata(meta('cf32_le', { 'core:sample_rate': 0 }))).toThrow(/global\.core:sample_rate: must be greater than zero/)
    expect(() => parseSigmfMetadata(meta('cf32_le', { 'core:sample_rate': '2.4e6' }))).toThrow(/global\.core:sample_rate: must be a finite number/)
    expect(() => parseSigmfMetadata({ ...meta('cf32_le'), captures: [{ 'core:frequency': 1e6 }] })).toThrow(/captures\[0\]\.core:sample_start: is required/)
    expect(() =>
      parseSigmfMetadata({ ...meta('cf32_le'), captures: [{ 'core:sample_start': 5 }, { 'core:sample_start': 2 }] }),
    ).toThrow(/sorted/)
    expect(() => parseSigmfMetadata({ ...meta('cf32_le'), annotations: [{ 'core:sample_start': -1 }] })).toThrow(/non-negative integer/)
  })
  it('warns about missing required parts it can do without', () => {
    const m = parseSigmfMetadata({ global: { 'core:datatype': 'cf32_le' } })
    expect(m.warnings.join(' ')).toMatch(/core:version is missing/)
    expect(m.warnings.join(' ')).toMatch(/captures is missing/)
    expect(m.warnings.join(' ')).toMatch(/annotations is missing/)
  })
})

describe('SigMF dataset decoding to interleaved Float32 I/Q', () => {
  it('decodes ci16_le samples to the expected floats (±1 full scale)', () => {
    const d = decodeSigmfSamples({ metadata: parseSigmfMetadata(meta('ci16_le')), data: int16Bytes(I16, true) })
    expect(d.iq).toBeInstanceOf(Float32Array)
    expect(Array.from(d.iq)).toEqual(I16_EXPECTED)
    expect(d.sampleCount).toBe(3)
    expect(d.sampleRateHz).toBe(2.4e6)
    expect(d.centerFreqHz).toBe(156.8e6)
    expect(d.warnings.join(' ')).toMatch(/different centre frequencies/)
  })
  it('decodes ci16_be the same from big-endian bytes', () => {
    const d = decodeSigmfSamples({ metadata: parseSigmfMetadata(meta('ci16_be')), data: int16Bytes(I16, false) })
    expect(Array.from(d.iq)).toEqual(I16_EXPECTED)
  })
  it('decodes a window of samples and takes the centre frequency of the capture in force', () => {
    const d = decodeSigmfSamples({ metadata: parseSigmfMetadata(meta('ci16_le')), data: int16Bytes(I16, true), firstSample: 2, sampleCount: 1 })
    expect(Array.from(d.iq)).toEqual(I16_EXPECTED.slice(4))
    expect(d.centerFreqHz).toBe(156.825e6)
    expect(d.warnings).toEqual([])
  })
  it('decodes cf32_le and cf64_le floats unchanged, and ci8 as v/128', () => {
    const f32 = new Float32Array([0.25, -0.5, 1.5, -2])
    expect(Array.from(decodeSigmfSamples({ metadata: parseSigmfMetadata(meta('cf32_le')), data: f32 }).iq)).toEqual([0.25, -0.5, 1.5, -2])
    const f64 = new Float64Array([0.125, -0.75])
    expect(Array.from(decodeSigmfSamples({ metadata: parseSigmfMetadata(meta('cf64_le')), data: f64.buffer }).iq)).toEqual([0.125, -0.75])
    const i8 = new Int8Array([-128, 127, 64, -1])
    expect(Array.from(decodeSigmfSamples({ metadata: parseSigmfMetadata(meta('ci8')), data: i8 }).iq)).toEqual([-1, 127 / 128, 0.5, -1 / 128])
  })
  it('decodes cu8 about mid-scale and warns that SigMF does not define the zero', () => {
    const d = decodeSigmfSamples({ metadata: parseSigmfMetadata(meta('cu8')), data: new Uint8Array([128, 0, 255, 192]) })
    expect(Array.from(d.iq)).toEqual([0, -1, 127 / 128, 0.5])
    expect(d.warnings.join(' ')).toMatch(/mid-scale/)
  })
  it('rejects unsupported datatypes and layouts with clear errors', () => {
    expect(() => decodeSigmfSamples({ metadata: parseSigmfMetadata(meta('ri16_le')), data: new ArrayBuffer(4) })).toThrow(/real-valued data \('ri16_le'\) is not supported/)
    expect(() => parseSigmfMetadata(meta('cf16_le'))).toThrow(/'cf16_le' is not a SigMF dataset format/)
    expect(() =>
      decodeSigmfSamples({ metadata: parseSigmfMetadata(meta('ci16_le', { 'core:num_channels': 2 })), data: new ArrayBuffer(8) }),
    ).toThrow(/2 interleaved channels are not supported/)
    const ncd = { ...meta('ci16_le'), captures: [{ 'core:sample_start': 0, 'core:header_bytes': 4 }] }
    expect(() => decodeSigmfSamples({ metadata: parseSigmfMetadata(ncd), data: new ArrayBuffer(8) })).toThrow(/header bytes/)
  })
  it('rejects a dataset that is empty or not a whole number of samples, and bad sample windows', () => {
    const m = parseSigmfMetadata(meta('ci16_le'))
    expect(() => decodeSigmfSamples({ metadata: m, data: new ArrayBuffer(0) })).toThrow(/empty/)
    expect(() => decodeSigmfSamples({ metadata: m, data: new ArrayBuffer(6) })).toThrow(/not a whole number of ci16_le samples \(4 bytes each\)/)
    expect(() => decodeSigmfSamples({ metadata: m, data: new ArrayBuffer(12), firstSample: 3 })).toThrow(SigmfError)
    expect(() => decodeSigmfSamples({ metadata: m, data: new ArrayBuffer(12), sampleCount: 4 })).toThrow(SigmfError)
  })
})
