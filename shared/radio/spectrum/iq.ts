/**
 * Complex baseband (I/Q) sample input and its level reference.
 *
 * Samples are unitless numbers where full scale is |I + jQ| = 1. The level reference says what
 * that means in power: without a calibration, levels are dB relative to full scale (dBFS),
 * where 0 dBFS is the power of a complex tone of magnitude 1 (mean |x|² = 1). With a
 * calibration, that same full-scale tone corresponds to `fullScaleDbm` at the receiver input,
 * so dBm = dBFS + fullScaleDbm. The convention is the library's own (common practice, no source).
 *
 *  (1) P[dBFS] = 10·log10(mean |x|²)     [dBFS]
 *  (2) P[dBm] = P[dBFS] + fullScaleDbm   [dBm]
 */
import { requireFinite } from '../guards'

/** Interleaved I,Q,I,Q… samples, or separate I and Q arrays of equal length. */
export type IqSamples = Float32Array | Float64Array | { i: ArrayLike<number>; q: ArrayLike<number> }

export type LevelReference =
  | { kind: 'dBFS'; note: string }
  | { kind: 'dBm'; fullScaleDbm: number; note: string }

/** Number of complex samples, after checking the shape of the input. */
export function iqSampleCount(iq: IqSamples): number {
  if (ArrayBuffer.isView(iq)) {
    if (iq.length % 2 !== 0) {
      throw new RangeError(`interleaved I/Q samples must have an even length (got ${iq.length}).`)
    }
    return iq.length / 2
  }
  if (!iq || !iq.i || !iq.q) throw new RangeError('iq must be interleaved samples or an object { i, q }.')
  if (iq.i.length !== iq.q.length) {
    throw new RangeError(`I and Q arrays must have the same length (got ${iq.i.length} and ${iq.q.length}).`)
  }
  return iq.i.length
}

/** Index of the first complex sample with a non-finite part, or −1. */
export function firstNonFiniteSample(opts: { iq: IqSamples; fromSample?: number }): number {
  const { iq } = opts
  const fromSample = opts.fromSample ?? 0
  if (ArrayBuffer.isView(iq)) {
    for (let k = 2 * fromSample; k < iq.length; k++) if (!Number.isFinite(iq[k])) return k >> 1
    return -1
  }
  for (let k = fromSample; k < iq.i.length; k++) {
    if (!Number.isFinite(iq.i[k]) || !Number.isFinite(iq.q[k])) return k
  }
  return -1
}

/** The level reference for an optional calibration. */
export function levelReference(fullScaleDbm?: number): LevelReference {
  if (fullScaleDbm === undefined) {
    return {
      kind: 'dBFS',
      note: 'No calibration given: levels are dB relative to full scale (0 dBFS = a complex tone with |I + jQ| = 1), not dBm.',
    }
  }
  requireFinite('fullScaleDbm', fullScaleDbm)
  return {
    kind: 'dBm',
    fullScaleDbm,
    note: `Calibrated: a full-scale complex tone (|I + jQ| = 1) is ${fullScaleDbm} dBm at the receiver input.`,
  }
}

/** Offset from dBFS to the reference's unit [dB]. */
export function referenceOffsetDb(ref: LevelReference): number {
  return ref.kind === 'dBm' ? ref.fullScaleDbm : 0 // Eq. (2) [dB]
}

/** Mean power of the samples in the reference's unit: dBFS, or dBm when calibrated. */
export function meanPowerDb(opts: { iq: IqSamples; fullScaleDbm?: number }): number {
  const n = iqSampleCount(opts.iq)
  if (n === 0) throw new RangeError('iq must not be empty.')
  let sum = 0
  const iq = opts.iq
  if (ArrayBuffer.isView(iq)) {
    for (let k = 0; k < iq.length; k++) sum += iq[k] * iq[k]
  } else {
    for (let k = 0; k < n; k++) sum += iq.i[k] * iq.i[k] + iq.q[k] * iq.q[k]
  }
  if (!Number.isFinite(sum)) throw new RangeError('iq samples contain NaN or Infinity.')
  return 10 * Math.log10(sum / n) + referenceOffsetDb(levelReference(opts.fullScaleDbm)) // Eq. (1) [dBFS or dBm]
}
