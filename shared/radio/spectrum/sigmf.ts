/**
 * SigMF recordings: the metadata (plain validation, no schema library) and the decoding of a
 * dataset into interleaved Float32 I/Q at ±1 full scale.
 *
 * Document: The Signal Metadata Format (SigMF) specification v1.2.6 — "SigMF Dataset Format"
 * (ABNF of core:datatype; complex samples interleaved I then Q), "Global Object"
 * (core:datatype and core:version required; core:sample_rate, core:num_channels, core:offset),
 * "Captures Array" (core:sample_start required, sorted ascending; core:frequency; an empty array
 * implies one capture at sample 0; core:header_bytes marks a non-conforming dataset),
 * "Annotations Array" (core:sample_start required; core:sample_count, core:freq_lower_edge,
 * core:freq_upper_edge, core:label, core:comment, core:generator). [V-P, specification text read]
 * The `Eq. (n)` tags in this file refer to the list below.
 *
 *  (1) signed integers of b bits: x = v / 2^(b−1)                  [FS]  (−2^(b−1) ↦ −1)
 *  (2) unsigned integers of b bits: x = (v − 2^(b−1)) / 2^(b−1)   [FS]  mid-scale taken as zero
 *  (3) floating point: x = v                                        [FS]
 * The integer scalings are the library's convention (common practice, no source): SigMF
 * defines the storage, not the analogue meaning of full scale, and not the zero of unsigned data.
 */

export type SigmfComponent = 'f32' | 'f64' | 'i32' | 'i16' | 'u32' | 'u16' | 'i8' | 'u8'

export interface SigmfDatatype {
  text: string
  complex: boolean
  component: SigmfComponent
  bytesPerComponent: number
  littleEndian: boolean
}

export interface SigmfCapture {
  sampleStart: number
  frequencyHz?: number
  datetime?: string
  globalIndex?: number
  headerBytes?: number
}

export interface SigmfAnnotation {
  sampleStart: number
  sampleCount?: number
  freqLowerEdgeHz?: number
  freqUpperEdgeHz?: number
  label?: string
  comment?: string
  generator?: string
}

export interface SigmfMetadata {
  datatype: SigmfDatatype
  version?: string
  sampleRateHz?: number
  numChannels: number
  offset: number
  description?: string
  author?: string
  hw?: string
  recorder?: string
  captures: SigmfCapture[]
  annotations: SigmfAnnotation[]
  warnings: string[]
}

/** A metadata or dataset problem; path names the offending field, e.g. 'global.core:sample_rate'. */
export class SigmfError extends RangeError {
  readonly path?: string
  constructor(message: string, path?: string) {
    super(path ? `${path}: ${message}` : message)
    this.name = 'SigmfError'
    this.path = path
  }
}

const DATATYPE = /^([rc])(?:(f32|f64|i32|i16|u32|u16)_(le|be)|(i8|u8))$/

/** Parses a core:datatype string per the SigMF dataset-format ABNF. */
export function parseSigmfDatatype(text: string): SigmfDatatype {
  const m = typeof text === 'string' ? DATATYPE.exec(text) : null
  if (!m) {
    throw new SigmfError(
      `'${String(text)}' is not a SigMF dataset format (e.g. cf32_le, ci16_le, cf64_le, ci8, cu8).`,
      'global.core:datatype',
    )
  }
  const component = (m[2] ?? m[4]) as SigmfComponent
  return {
    text,
    complex: m[1] === 'c',
    component,
    bytesPerComponent: Number(component.slice(1)) / 8,
    littleEndian: m[3] !== 'be',
  }
}

/** Parses and checks SigMF metadata given as JSON text or as an already parsed object. */
export function parseSigmfMetadata(input: string | unknown): SigmfMetadata {
  let doc: unknown = input
  if (typeof input === 'string') {
    try {
      doc = JSON.parse(input)
    } catch (e) {
      throw new SigmfError(`metadata is not valid JSON (${(e as Error).message}).`)
    }
  }
  if (!isObject(doc)) throw new SigmfError('metadata must be a JSON object with global, captures and annotations.')
  const warnings: string[] = []
  const g = doc.global
  if (!isObject(g)) throw new SigmfError('is required and must be an object.', 'global')
  const datatype = parseSigmfDatatype(g['core:datatype'] as string)
  const version = optString(g, 'core:version', 'global')
  if (version === undefined) warnings.push('global.core:version is missing (the specification requires it).')
  const sampleRateHz = optNumber(g, 'core:sample_rate', 'global')
  if (sampleRateHz !== undefined && !(sampleRateHz > 0)) {
    throw new SigmfError(`must be greater than zero (got ${sampleRateHz}).`, 'global.core:sample_rate')
  }
  const numChannels = optCount(g, 'core:num_channels', 'global') ?? 1
  if (numChannels < 1) throw new SigmfError('must be at least 1.', 'global.core:num_channels')
  const offset = optCount(g, 'core:offset', 'global') ?? 0

  const capturesRaw = doc.captures === undefined ? [] : doc.captures
  if (doc.captures === undefined) warnings.push('captures is missing (the specification requires it): one capture at sample 0 assumed.')
  if (!Array.isArray(capturesRaw)) throw new SigmfError('must be an array.', 'captures')
  const captures: SigmfCapture[] = capturesRaw.map((c, i) => {
    const path = `captures[${i}]`
    if (!isObject(c)) throw new SigmfError('must be an object.', path)
    const sampleStart = optCount(c, 'core:sample_start', path)
    if (sampleStart === undefined) throw new SigmfError('is required.', `${path}.core:sample_start`)
    return {
      sampleStart,
      frequencyHz: optNumber(c, 'core:frequency', path),
      datetime: optString(c, 'core:datetime', path),
      globalIndex: optCount(c, 'core:global_index', path),
      headerBytes: optCount(c, 'core:header_bytes', path),
    }
  })
  if (captures.length === 0) captures.push({ sampleStart: 0 })
  for (let i = 1; i < captures.length; i++) {
    if (captures[i].sampleStart < captures[i - 1].sampleStart) {
      throw new SigmfError('captures must be sorted by core:sample_start, ascending.', `captures[${i}].core:sample_start`)
    }
  }

  const annotationsRaw = doc.annotations === undefined ? [] : doc.annotations
  if (doc.annotations === undefined) warnings.push('annotations is missing (the specification requires it, possibly empty).')
  if (!Array.isArray(annotationsRaw)) throw new SigmfError('must be an array.', 'annotations')
  const annotations: SigmfAnnotation[] = annotationsRaw.map((a, i) => {
    const path = `annotations[${i}]`
    if (!isObject(a)) throw new SigmfError('must be an object.', path)
    const sampleStart = optCount(a, 'core:sample_start', path)
    if (sampleStart === undefined) throw new SigmfError('is required.', `${path}.core:sample_start`)
    return {
      sampleStart,
      sampleCount: optCount(a, 'core:sample_count', path),
      freqLowerEdgeHz: optNumber(a, 'core:freq_lower_edge', path),
      freqUpperEdgeHz: optNumber(a, 'core:freq_upper_edge', path),
      label: optString(a, 'core:label', path),
      comment: optString(a, 'core:comment', path),
      generator: optString(a, 'core:generator', path),
    }
  })

  return {
    datatype,
    version,
    sampleRateHz,
    numChannels,
    offset,
    description: optString(g, 'core:description', 'global'),
    author: optString(g, 'core:author', 'global'),
    hw: optString(g, 'core:hw', 'global'),
    recorder: optString(g, 'core:recorder', 'global'),
    captures,
    annotations,
    warnings,
  }
}

export interface DecodedSigmf {
  /** Interleaved I,Q,I,Q… at ±1 full scale. */
  iq: Float32Array
  firstSample: number
  sampleCount: number
  sampleRateHz?: number
  /** Centre frequency of the capture holding the first decoded sample [Hz]. */
  centerFreqHz?: number
  warnings: string[]
}

/** Decodes complex samples of a SigMF dataset into interleaved Float32 I/Q at ±1 full scale. */
export function decodeSigmfSamples(opts: {
  metadata: SigmfMetadata
  data: ArrayBuffer | ArrayBufferView
  /** First complex sample to decode (default 0) and how many (default all that follow). */
  firstSample?: number
  sampleCount?: number
}): DecodedSigmf {
  const { metadata } = opts
  const dt = metadata.datatype
  if (!dt.complex) {
    throw new SigmfError(`real-valued data ('${dt.text}') is not supported: spectrum analysis needs complex I/Q samples (a 'c…' datatype).`, 'global.core:datatype')
  }
  if (metadata.numChannels !== 1) {
    throw new SigmfError(`${metadata.numChannels} interleaved channels are not supported; split the recording into one channel per dataset.`, 'global.core:num_channels')
  }
  if (metadata.captures.some((c) => (c.headerBytes ?? 0) > 0)) {
    throw new SigmfError('non-conforming datasets with header bytes are not supported.', 'captures[].core:header_bytes')
  }
  const bytes = toBytes(opts.data)
  const bytesPerSample = 2 * dt.bytesPerComponent
  if (bytes.byteLength % bytesPerSample !== 0) {
    throw new SigmfError(`dataset of ${bytes.byteLength} bytes is not a whole number of ${dt.text} samples (${bytesPerSample} bytes each).`)
  }
  const available = bytes.byteLength / bytesPerSample
  if (available === 0) throw new SigmfError('dataset is empty.')
  const firstSample = opts.firstSample ?? 0
  if (!Number.isInteger(firstSample) || firstSample < 0 || firstSample >= available) {
    throw new SigmfError(`firstSample must be an integer from 0 to ${available - 1} (got ${firstSample}).`)
  }
  const sampleCount = opts.sampleCount ?? available - firstSample
  if (!Number.isInteger(sampleCount) || sampleCount < 1 || firstSample + sampleCount > available) {
    throw new SigmfError(`sampleCount must be an integer from 1 to ${available - firstSample} (got ${sampleCount}).`)
  }
  const warnings: string[] = []
  const iq = decodeComponents(bytes, dt, firstSample * 2, sampleCount * 2)
  if (dt.component.startsWith('u')) {
    warnings.push(`Unsigned samples (${dt.text}): mid-scale is taken as zero; SigMF does not define the zero of unsigned data.`)
  }
  const capture = captureAt({ metadata, sampleIndex: firstSample })
  const lastCapture = captureAt({ metadata, sampleIndex: firstSample + sampleCount - 1 })
  if (capture !== lastCapture && capture.frequencyHz !== lastCapture.frequencyHz) {
    warnings.push('The decoded samples span captures with different centre frequencies; analyse each capture separately.')
  }
  if (capture.frequencyHz === undefined) warnings.push('The capture gives no core:frequency: frequencies stay relative to the centre.')
  if (metadata.sampleRateHz === undefined) warnings.push('global.core:sample_rate is missing: a sample rate must be supplied for spectrum analysis.')
  return { iq, firstSample, sampleCount, sampleRateHz: metadata.sampleRateHz, centerFreqHz: capture.frequencyHz, warnings }
}

/** The capture segment in force at a sample index (the last one starting at or before it). */
export function captureAt(opts: { metadata: SigmfMetadata; sampleIndex: number }): SigmfCapture {
  const { metadata, sampleIndex } = opts
  let found = metadata.captures[0]
  for (const c of metadata.captures) if (c.sampleStart <= sampleIndex) found = c
  return found
}

function decodeComponents(bytes: Uint8Array, dt: SigmfDatatype, firstComponent: number, count: number): Float32Array {
  const out = new Float32Array(count)
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength)
  const le = dt.littleEndian
  const size = dt.bytesPerComponent
  let at = firstComponent * size
  switch (dt.component) {
    case 'f32':
      for (let k = 0; k < count; k++, at += 4) out[k] = view.getFloat32(at, le) // Eq. (3) [FS]
      break
    case 'f64':
      for (let k = 0; k < count; k++, at += 8) out[k] = view.getFloat64(at, le) // Eq. (3) [FS]
      break
    case 'i32':
      for (let k = 0; k < count; k++, at += 4) out[k] = view.getInt32(at, le) / 2147483648 // Eq. (1) [FS]
      break
    case 'i16':
      for (let k = 0; k < count; k++, at += 2) out[k] = view.getInt16(at, le) / 32768 // Eq. (1) [FS]
      break
    case 'i8':
      for (let k = 0; k < count; k++, at += 1) out[k] = view.getInt8(at) / 128 // Eq. (1) [FS]
      break
    case 'u32':
      for (let k = 0; k < count; k++, at += 4) out[k] = (view.getUint32(at, le) - 2147483648) / 2147483648 // Eq. (2) [FS]
      break
    case 'u16':
      for (let k = 0; k < count; k++, at += 2) out[k] = (view.getUint16(at, le) - 32768) / 32768 // Eq. (2) [FS]
      break
    case 'u8':
      for (let k = 0; k < count; k++, at += 1) out[k] = (view.getUint8(at) - 128) / 128 // Eq. (2) [FS]
      break
  }
  return out
}

function toBytes(data: ArrayBuffer | ArrayBufferView): Uint8Array {
  if (data instanceof ArrayBuffer) return new Uint8Array(data)
  if (ArrayBuffer.isView(data)) return new Uint8Array(data.buffer, data.byteOffset, data.byteLength)
  throw new SigmfError('dataset must be an ArrayBuffer or a typed array.')
}

function isObject(v: unknown): v is Record<string, unknown> {
  return typeof v === 'object' && v !== null && !Array.isArray(v)
}

function optNumber(o: Record<string, unknown>, key: string, path: string): number | undefined {
  const v = o[key]
  if (v === undefined) return undefined
  if (typeof v !== 'number' || !Number.isFinite(v)) throw new SigmfError(`must be a finite number (got ${JSON.stringify(v)}).`, `${path}.${key}`)
  return v
}

function optCount(o: Record<string, unknown>, key: string, path: string): number | undefined {
  const v = optNumber(o, key, path)
  if (v !== undefined && (!Number.isInteger(v) || v < 0)) throw new SigmfError(`must be a non-negative integer (got ${v}).`, `${path}.${key}`)
  return v
}

function optString(o: Record<string, unknown>, key: string, path: string): string | undefined {
  const v = o[key]
  if (v === undefined) return undefined
  if (typeof v !== 'string') throw new SigmfError(`must be a string (got ${JSON.stringify(v)}).`, `${path}.${key}`)
  return v
}

/** The datatypes the block decoder reads (the common receiver formats). */
export const SIGMF_BLOCK_DATATYPES = ['cf32_le', 'ci16_le', 'cu8'] as const

export interface SigmfBlockDecoder {
  /** Bytes per complex sample. */
  readonly bytesPerSample: number
  /** Complex samples decoded so far. */
  readonly samplesDecoded: number
  /**
   * Decodes a block of the dataset (any length, split anywhere) into interleaved Float32 I/Q
   * at ±1 full scale; bytes of a sample cut by the block's end wait for the next block.
   */
  decode(block: Uint8Array): Float32Array
  /** Ends the dataset: SigmfError when it did not end on a whole sample. */
  finish(): void
}

/**
 * A dataset decoder that takes the data block by block (as it streams from storage), for
 * `cf32_le`, `ci16_le` and `cu8` (eq. (1)–(3)); other datatypes are refused by name.
 */
export function createSigmfBlockDecoder(opts: { metadata: SigmfMetadata }): SigmfBlockDecoder {
  const { metadata } = opts
  const dt = metadata.datatype
  if (!(SIGMF_BLOCK_DATATYPES as readonly string[]).includes(dt.text)) {
    throw new SigmfError(
      `'${dt.text}' is not read here: recordings must be ${SIGMF_BLOCK_DATATYPES.join(', ')} (complex, one channel).`,
      'global.core:datatype',
    )
  }
  if (metadata.numChannels !== 1) {
    throw new SigmfError(`${metadata.numChannels} interleaved channels are not supported; split the recording into one channel per dataset.`, 'global.core:num_channels')
  }
  if (metadata.captures.some((c) => (c.headerBytes ?? 0) > 0)) {
    throw new SigmfError('non-conforming datasets with header bytes are not supported.', 'captures[].core:header_bytes')
  }
  const bytesPerSample = 2 * dt.bytesPerComponent
  const carry = new Uint8Array(bytesPerSample)
  let carried = 0
  let samplesDecoded = 0
  return {
    bytesPerSample,
    get samplesDecoded() {
      return samplesDecoded
    },
    decode(block) {
      let start = 0
      const parts: Float32Array[] = []
      if (carried > 0) {
        const need = Math.min(bytesPerSample - carried, block.byteLength)
        carry.set(block.subarray(0, need), carried)
        carried += need
        start = need
        if (carried < bytesPerSample) return new Float32Array(0)
        parts.push(decodeComponents(carry, dt, 0, 2))
        carried = 0
      }
      const whole = Math.floor((block.byteLength - start) / bytesPerSample)
      const body = block.subarray(start, start + whole * bytesPerSample)
      parts.push(decodeComponents(body, dt, 0, 2 * whole))
      const rest = block.byteLength - start - whole * bytesPerSample
      if (rest > 0) {
        carry.set(block.subarray(block.byteLength - rest), 0)
        carried = rest
      }
      const count = parts.reduce((s, p) => s + p.length, 0)
      samplesDecoded += count / 2
      if (parts.length === 1) return parts[0]
      const out = new Float32Array(count)
      let at = 0
      for (const p of parts) {
        out.set(p, at)
        at += p.length
      }
      return out
    },
    finish() {
      if (carried > 0) {
        throw new SigmfError(
          `dataset is not a whole number of ${dt.text} samples (${bytesPerSample} bytes each): ${carried} byte(s) left after ${samplesDecoded} samples; the file may be truncated.`,
        )
      }
    },
  }
}

/**
 * Checks a dataset's length against its metadata before decoding: a whole number of samples,
 * not empty, and every capture and annotation starting (and annotations ending) inside it.
 * Returns the number of complex samples; SigmfError names the contradicting field.
 */
export function checkSigmfDataLength(opts: { metadata: SigmfMetadata; dataBytes: number }): number {
  const { metadata, dataBytes } = opts
  const bytesPerSample = 2 * metadata.datatype.bytesPerComponent * metadata.numChannels
  if (!Number.isInteger(dataBytes) || dataBytes < 0) throw new SigmfError(`dataset length must be a whole number of bytes (got ${dataBytes}).`)
  if (dataBytes % bytesPerSample !== 0) {
    throw new SigmfError(`dataset of ${dataBytes} bytes is not a whole number of ${metadata.datatype.text} samples (${bytesPerSample} bytes each); the file may be truncated.`)
  }
  const sampleCount = dataBytes / bytesPerSample
  if (sampleCount === 0) throw new SigmfError('dataset is empty.')
  metadata.captures.forEach((c, i) => {
    if (c.sampleStart >= sampleCount) {
      throw new SigmfError(`starts at sample ${c.sampleStart}, but the dataset holds only ${sampleCount} samples: the metadata does not match the data.`, `captures[${i}].core:sample_start`)
    }
  })
  metadata.annotations.forEach((a, i) => {
    const end = a.sampleStart + (a.sampleCount ?? 0)
    if (a.sampleStart >= sampleCount || end > sampleCount) {
      throw new SigmfError(`covers samples up to ${end}, but the dataset holds only ${sampleCount} samples: the metadata does not match the data.`, `annotations[${i}]`)
    }
  })
  return sampleCount
}
