/**
 * Power spectrum of complex (I/Q) samples by Welch's method of averaged, windowed periodograms.
 *
 * Document: P. D. Welch, "The use of the fast Fourier transform for the estimation of power
 * spectra: a method based on time averaging over short, modified periodograms",
 * IEEE Trans. Audio Electroacoust. AU-15(2):70–73, June 1967 (journal, volume and pages
 * confirmed in the scipy.signal.welch reference list [V-S]; issue and month [M]).
 * Window ENBW: F. J. Harris, Proc. IEEE 66(1), 1978, §IV (see windows.ts).
 * The `Eq. (n)` tags in this file refer to the list below; the scaling conventions are those
 * of scipy.signal.welch (scaling 'density' / 'spectrum', two-sided for complex input), which
 * the tests use as the reference implementation.
 *
 *  (1) segment m starts at sample m·(N − overlap); K = ⌊(L − overlap)/(N − overlap)⌋ segments
 *  (2) X_m[k] = Σ_n w[n]·(x[m·step + n] − μ_m)·e^(−j2πkn/N)      μ_m = segment mean or 0
 *  (3) 'density':  P[k] = Σ_m |X_m[k]|² / (K · fs · Σw²)         [FS²/Hz]
 *  (4) 'spectrum': P[k] = Σ_m |X_m[k]|² / (K · (Σw)²)            [FS² per bin]
 *  (5) f[j] = f_c + (j − N/2)·fs/N,  j = 0 … N−1  (k = (j + N/2) mod N, i.e. fft-shifted)  [Hz]
 *  (6) ENBW_Hz = ENBW_bins · fs/N                                  [Hz]
 *  (7) L[j] = 10·log10 P[k] + reference offset (0 for dBFS, fullScaleDbm for dBm)   [dB]
 *
 * 'density' integrates to the mean power (Σ P·fs/N = mean |x|², Parseval); 'spectrum' reads a
 * bin-centred tone's power directly at its peak. A density peak times ENBW_Hz is also the tone
 * power. Frequencies are absolute when a centre frequency is given.
 */
import FFT from 'fft.js'
import { requireFinite, requireInRange, requirePositive } from '../guards'
import type { MethodRef, RadioResult } from '../types'
import { firstNonFiniteSample, iqSampleCount, levelReference, referenceOffsetDb, type IqSamples, type LevelReference } from './iq'
import { windowSamples, windowSums, type WindowKind } from './windows'

export const WELCH_METHOD: MethodRef = {
  id: 'welch-psd',
  source:
    'P. D. Welch, IEEE Trans. Audio Electroacoust. AU-15(2):70–73 (1967); window ENBW per F. J. Harris, Proc. IEEE 66(1):51–83 (1978) §IV',
}

export type PsdScaling = 'density' | 'spectrum'
export type Detrend = 'none' | 'mean'
export type PsdLevelUnit = 'dBFS/Hz' | 'dBm/Hz' | 'dBFS' | 'dBm'

export interface WelchPsdOptions {
  /** Complex samples: interleaved I,Q,I,Q…, or { i, q }. Full scale is |I + jQ| = 1. */
  iq: IqSamples
  sampleRateHz: number
  /** Centre (tuned) frequency; frequencies are absolute when given, baseband offsets when not [Hz]. */
  centerFreqHz?: number
  /** Segment (FFT) length N: a power of two, 2 … 2^24. */
  segmentLength: number
  /** Overlap between segments as a fraction of N, 0 ≤ f < 1; default 0.5. */
  overlapFraction?: number
  /** Default 'hann'. */
  window?: WindowKind
  /**
   * Default 'none': removing the mean would also remove a carrier sitting exactly on the
   * centre frequency, which is a real signal in an I/Q capture.
   */
  detrend?: Detrend
  /** Default 'density' (per Hz); 'spectrum' gives power per bin. */
  scaling?: PsdScaling
  /** Calibration: a full-scale complex tone (|I + jQ| = 1) is this many dBm at the receiver input. */
  fullScaleDbm?: number
}

export interface WelchPsd {
  /** Bin centre frequencies, ascending (fft-shifted) [Hz]. */
  freqHz: Float64Array
  /** Level of each bin in `levelUnit`: a density per Hz ('density') or a power per bin ('spectrum') [dB]. */
  levelDb: Float64Array
  levelUnit: PsdLevelUnit
  reference: LevelReference
  scaling: PsdScaling
  window: WindowKind
  detrend: Detrend
  segmentLength: number
  overlapSamples: number
  segmentCount: number
  samplesUsed: number
  binSpacingHz: number
  /** Equivalent noise bandwidth of the window [bins] and [Hz]. */
  enbwBins: number
  enbwHz: number
}

const MAX_SEGMENT_LENGTH = 2 ** 24

/** The checked settings of a Welch estimate (shared by `welchPsd` and the block-wise accumulator). */
export interface WelchSettings {
  sampleRateHz: number
  centerFreqHz: number
  segmentLength: number
  overlapSamples: number
  windowKind: WindowKind
  detrend: Detrend
  scaling: PsdScaling
}

/** Checks the options common to every Welch estimate; RangeError names the offending one. */
export function welchSettings(opts: Omit<WelchPsdOptions, 'iq'>): WelchSettings {
  const sampleRateHz = requirePositive('sampleRateHz', opts.sampleRateHz)
  const centerFreqHz = requireFinite('centerFreqHz', opts.centerFreqHz ?? 0)
  const n = opts.segmentLength
  if (!Number.isInteger(n) || n < 2 || n > MAX_SEGMENT_LENGTH || (n & (n - 1)) !== 0) {
    throw new RangeError(`segmentLength must be a power of two from 2 to 2^24 (got ${String(n)}).`)
  }
  const overlapFraction = requireInRange('overlapFraction', opts.overlapFraction ?? 0.5, 0, 0.999999)
  const windowKind = opts.window ?? 'hann'
  const detrend = opts.detrend ?? 'none'
  if (detrend !== 'none' && detrend !== 'mean') throw new RangeError(`detrend must be 'none' or 'mean' (got ${String(detrend)}).`)
  const scaling = opts.scaling ?? 'density'
  if (scaling !== 'density' && scaling !== 'spectrum') {
    throw new RangeError(`scaling must be 'density' or 'spectrum' (got ${String(scaling)}).`)
  }
  return { sampleRateHz, centerFreqHz, segmentLength: n, overlapSamples: Math.floor(overlapFraction * n), windowKind, detrend, scaling }
}

/** Welch power spectrum of complex samples (see the file header for the equations). */
export function welchPsd(opts: WelchPsdOptions): RadioResult<WelchPsd> {
  const { sampleRateHz, centerFreqHz, segmentLength: n, overlapSamples, windowKind, detrend, scaling } = welchSettings(opts)
  const reference = levelReference(opts.fullScaleDbm)
  const sampleCount = iqSampleCount(opts.iq)
  if (sampleCount === 0) throw new RangeError('iq must not be empty.')
  if (sampleCount < n) {
    throw new RangeError(`segmentLength ${n} is longer than the recording (${sampleCount} complex samples).`)
  }

  const step = n - overlapSamples
  const segmentCount = Math.floor((sampleCount - overlapSamples) / step) // Eq. (1) [1]
  const samplesUsed = (segmentCount - 1) * step + n

  const win = windowSamples({ kind: windowKind, length: n })
  const { sumW, sumW2 } = windowSums(win)
  const acc = accumulatePeriodograms(opts.iq, win, n, step, segmentCount, detrend === 'mean')

  for (let k = 0; k < n; k++) {
    if (!Number.isFinite(acc[k])) {
      const at = firstNonFiniteSample({ iq: opts.iq })
      throw new RangeError(`iq samples contain NaN or Infinity (first at complex sample ${at}).`)
    }
  }
  const tailBad = firstNonFiniteSample({ iq: opts.iq, fromSample: samplesUsed })
  if (tailBad >= 0) throw new RangeError(`iq samples contain NaN or Infinity (first at complex sample ${tailBad}).`)

  return welchFromSums({ acc, sampleRateHz, centerFreqHz, segmentLength: n, overlapSamples, segmentCount, samplesUsed, windowKind, detrend, scaling, reference, sumW, sumW2 })
}

/**
 * The Welch result from the summed periodograms Σ_m |X_m[k]|² (natural FFT order): eq. (3)–(7).
 * Shared by the one-shot `welchPsd` and the block-wise accumulator so both scale identically.
 */
export function welchFromSums(opts: {
  acc: Float64Array
  sampleRateHz: number
  centerFreqHz: number
  segmentLength: number
  overlapSamples: number
  segmentCount: number
  samplesUsed: number
  windowKind: WindowKind
  detrend: Detrend
  scaling: PsdScaling
  reference: LevelReference
  sumW: number
  sumW2: number
}): RadioResult<WelchPsd> {
  const { acc, sampleRateHz, centerFreqHz, overlapSamples, segmentCount, samplesUsed, windowKind, detrend, scaling, reference, sumW, sumW2 } = opts
  const n = opts.segmentLength
  const scale =
    scaling === 'density'
      ? 1 / (segmentCount * sampleRateHz * sumW2) // Eq. (3) [1/Hz]
      : 1 / (segmentCount * sumW * sumW) // Eq. (4) [1]
  const offsetDb = referenceOffsetDb(reference)
  const binSpacingHz = sampleRateHz / n
  const freqHz = new Float64Array(n)
  const levelDb = new Float64Array(n)
  const half = n >> 1
  let zeroBins = 0
  for (let j = 0; j < n; j++) {
    const k = (j + half) & (n - 1)
    freqHz[j] = centerFreqHz + (j - half) * binSpacingHz // Eq. (5) [Hz]
    const p = acc[k] * scale
    if (p <= 0) zeroBins++
    levelDb[j] = 10 * Math.log10(p) + offsetDb // Eq. (7) [dB]
  }
  const enbwBins = (n * sumW2) / (sumW * sumW)

  const warnings: string[] = []
  if (reference.kind === 'dBFS') warnings.push(reference.note)
  if (segmentCount < 10) {
    warnings.push(
      `Only ${segmentCount} segment(s) averaged: each bin's estimate is noisy; use a longer recording or shorter segments (fewer than 10 averages; common practice, no source).`,
    )
  }
  if (detrend === 'mean') warnings.push('Mean removal also removes any carrier exactly at the centre frequency.')
  if (zeroBins > 0) warnings.push(`${zeroBins} bin(s) hold exactly zero power; their level is −∞ dB.`)

  const unitBase = reference.kind === 'dBm' ? 'dBm' : 'dBFS'
  return {
    value: {
      freqHz,
      levelDb,
      levelUnit: scaling === 'density' ? `${unitBase}/Hz` : unitBase,
      reference,
      scaling,
      window: windowKind,
      detrend,
      segmentLength: n,
      overlapSamples,
      segmentCount,
      samplesUsed,
      binSpacingHz,
      enbwBins,
      enbwHz: enbwBins * binSpacingHz, // Eq. (6) [Hz]
    },
    warnings,
    method: WELCH_METHOD,
  }
}

/** Σ_m |X_m[k]|² in natural (unshifted) FFT order: eq. (2) summed over segments. */
function accumulatePeriodograms(
  iq: IqSamples,
  win: Float64Array,
  n: number,
  step: number,
  segmentCount: number,
  removeMean: boolean,
): Float64Array {
  const fft = new FFT(n)
  const buf = new Float64Array(2 * n)
  const out = new Float64Array(2 * n)
  const acc = new Float64Array(n)
  const interleaved = ArrayBuffer.isView(iq) ? iq : null
  const sep = interleaved ? null : (iq as { i: ArrayLike<number>; q: ArrayLike<number> })

  for (let m = 0; m < segmentCount; m++) {
    const start = m * step
    let meanI = 0
    let meanQ = 0
    if (interleaved) {
      const base = 2 * start
      if (removeMean) {
        for (let j = 0; j < 2 * n; j += 2) {
          meanI += interleaved[base + j]
          meanQ += interleaved[base + j + 1]
        }
        meanI /= n
        meanQ /= n
      }
      for (let j = 0, t = 0; t < n; j += 2, t++) {
        const w = win[t]
        buf[j] = (interleaved[base + j] - meanI) * w // Eq. (2) [FS]
        buf[j + 1] = (interleaved[base + j + 1] - meanQ) * w // Eq. (2) [FS]
      }
    } else if (sep) {
      if (removeMean) {
        for (let t = 0; t < n; t++) {
          meanI += sep.i[start + t]
          meanQ += sep.q[start + t]
        }
        meanI /= n
        meanQ /= n
      }
      for (let t = 0; t < n; t++) {
        const w = win[t]
        buf[2 * t] = (sep.i[start + t] - meanI) * w // Eq. (2) [FS]
        buf[2 * t + 1] = (sep.q[start + t] - meanQ) * w // Eq. (2) [FS]
      }
    }
    fft.transform(out, buf)
    for (let k = 0, j = 0; k < n; k++, j += 2) {
      const re = out[j]
      const im = out[j + 1]
      acc[k] += re * re + im * im // Eq. (3)/(4) numerator [FS²]
    }
  }
  return acc
}
