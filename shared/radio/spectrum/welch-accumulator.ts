/**
 * Welch's power spectrum built block by block, so a recording never has to sit in one array:
 * samples are pushed as they are decoded and each segment is transformed as soon as it is
 * complete. The arithmetic is that of `welchPsd` (welch-psd.ts, eq. (1)–(7)): the same
 * segments in the same order, the same window, the same sums and the same scaling, so the
 * result equals the one-shot estimate on the same samples.
 *
 * Document: P. D. Welch, IEEE Trans. Audio Electroacoust. AU-15(2):70–73 (1967) (see
 * welch-psd.ts). The `Eq. (n)` tags refer to welch-psd.ts.
 *
 * The pending buffer holds at most one segment (N complex samples); after a segment is
 * transformed the last `overlapSamples` of it stay for the next one.
 */
import FFT from 'fft.js'
import { requireFinite } from '../guards'
import type { RadioResult } from '../types'
import { levelReference, type LevelReference } from './iq'
import { welchFromSums, welchSettings, type Detrend, type PsdScaling, type WelchPsd } from './welch-psd'
import { windowSamples, windowSums, type WindowKind } from './windows'

export interface WelchAccumulatorOptions {
  sampleRateHz: number
  /** Centre (tuned) frequency; frequencies are absolute when given [Hz]. */
  centerFreqHz?: number
  /** Segment (FFT) length N: a power of two, 2 … 2^24. */
  segmentLength: number
  /** Overlap between segments as a fraction of N, 0 ≤ f < 1; default 0.5. */
  overlapFraction?: number
  /** Default 'hann'. */
  window?: WindowKind
  /** Default 'none' (keeps a carrier on the centre frequency). */
  detrend?: Detrend
  /** Default 'density'. */
  scaling?: PsdScaling
  /** Calibration: a full-scale complex tone is this many dBm at the receiver input. */
  fullScaleDbm?: number
}

/** One segment's |X[k]|² (natural FFT order), computed from a segment of interleaved samples. */
export class SegmentTransformer {
  readonly n: number
  readonly window: Float64Array
  private readonly fft: FFT
  private readonly buf: Float64Array
  private readonly out: Float64Array

  constructor(opts: { segmentLength: number; window: WindowKind }) {
    this.n = opts.segmentLength
    this.window = windowSamples({ kind: opts.window, length: this.n })
    this.fft = new FFT(this.n)
    this.buf = new Float64Array(2 * this.n)
    this.out = new Float64Array(2 * this.n)
  }

  /** Adds |X[k]|² of the segment at `seg[2·start …]` into `acc` (eq. (2) and the numerators of (3)/(4)). */
  addPeriodogram(seg: Float64Array, acc: Float64Array, removeMean: boolean): void {
    const n = this.n
    const win = this.window
    const buf = this.buf
    let meanI = 0
    let meanQ = 0
    if (removeMean) {
      for (let j = 0; j < 2 * n; j += 2) {
        meanI += seg[j]
        meanQ += seg[j + 1]
      }
      meanI /= n
      meanQ /= n
    }
    for (let j = 0, t = 0; t < n; j += 2, t++) {
      const w = win[t]
      buf[j] = (seg[j] - meanI) * w // Eq. (2) [FS]
      buf[j + 1] = (seg[j + 1] - meanQ) * w // Eq. (2) [FS]
    }
    this.fft.transform(this.out, buf)
    const out = this.out
    for (let k = 0, j = 0; k < n; k++, j += 2) {
      const re = out[j]
      const im = out[j + 1]
      acc[k] += re * re + im * im // Eq. (3)/(4) numerator [FS²]
    }
  }
}

/**
 * Cuts pushed interleaved I/Q blocks into overlapping segments of N samples and hands each
 * complete segment (interleaved, Float64) to `onSegment`. Non-finite samples are refused with
 * their index in the whole stream.
 */
export class SegmentCutter {
  private readonly pending: Float64Array
  private fill = 0
  /** Complex samples pushed so far. */
  samplesPushed = 0
  segmentCount = 0

  constructor(
    private readonly n: number,
    private readonly overlapSamples: number,
    private readonly onSegment: (segment: Float64Array, startSample: number) => void,
  ) {
    this.pending = new Float64Array(2 * n)
  }

  push(iq: Float32Array | Float64Array): void {
    if (iq.length % 2 !== 0) throw new RangeError(`interleaved I/Q blocks must have an even length (got ${iq.length}).`)
    const n = this.n
    const step = n - this.overlapSamples
    let at = 0
    while (at < iq.length) {
      const take = Math.min(iq.length - at, 2 * (n - this.fill))
      for (let j = 0; j < take; j++) {
        const v = iq[at + j]
        if (!Number.isFinite(v)) {
          throw new RangeError(`iq samples contain NaN or Infinity (first at complex sample ${this.samplesPushed + ((at + j) >> 1)}).`)
        }
        this.pending[2 * this.fill + j] = v
      }
      this.fill += take >> 1
      at += take
      if (this.fill === n) {
        const startSample = this.segmentCount * step
        this.onSegment(this.pending, startSample)
        this.segmentCount++
        // keep the overlap for the next segment (Eq. (1): segments start every N − overlap samples)
        this.pending.copyWithin(0, 2 * step, 2 * n)
        this.fill = n - step
      }
    }
    this.samplesPushed += iq.length >> 1
  }
}

export interface WelchAccumulator {
  /** Adds a block of interleaved I,Q,I,Q… samples (any length, any split). */
  push(iq: Float32Array | Float64Array): void
  /** Complex samples pushed so far. */
  readonly samplesPushed: number
  readonly segmentCount: number
  /** The Welch estimate of everything pushed so far (RangeError before the first whole segment). */
  result(): RadioResult<WelchPsd>
}

/** A block-wise Welch estimate equal to `welchPsd` on the concatenated samples. */
export function createWelchAccumulator(opts: WelchAccumulatorOptions): WelchAccumulator {
  const settings = welchSettings(opts)
  if (opts.fullScaleDbm !== undefined) requireFinite('fullScaleDbm', opts.fullScaleDbm)
  const reference: LevelReference = levelReference(opts.fullScaleDbm)
  const n = settings.segmentLength
  const transformer = new SegmentTransformer({ segmentLength: n, window: settings.windowKind })
  const { sumW, sumW2 } = windowSums(transformer.window)
  const acc = new Float64Array(n)
  const removeMean = settings.detrend === 'mean'
  const cutter = new SegmentCutter(n, settings.overlapSamples, (seg) => transformer.addPeriodogram(seg, acc, removeMean))

  return {
    push: (iq) => cutter.push(iq),
    get samplesPushed() {
      return cutter.samplesPushed
    },
    get segmentCount() {
      return cutter.segmentCount
    },
    result() {
      if (cutter.samplesPushed === 0) throw new RangeError('iq must not be empty.')
      if (cutter.segmentCount === 0) {
        throw new RangeError(`segmentLength ${n} is longer than the recording (${cutter.samplesPushed} complex samples).`)
      }
      const step = n - settings.overlapSamples
      return welchFromSums({
        acc: Float64Array.from(acc),
        sampleRateHz: settings.sampleRateHz,
        centerFreqHz: settings.centerFreqHz,
        segmentLength: n,
        overlapSamples: settings.overlapSamples,
        segmentCount: cutter.segmentCount,
        samplesUsed: (cutter.segmentCount - 1) * step + n,
        windowKind: settings.windowKind,
        detrend: settings.detrend,
        scaling: settings.scaling,
        reference,
        sumW,
        sumW2,
      })
    },
  }
}
