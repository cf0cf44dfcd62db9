/**
 * Spectrum-analyser reading in a resolution bandwidth → power in a channel, for noise-like
 * signals that are flat across the channel; and the inverse.
 *
 * Document: Keysight (Agilent) Application Note 150 "Spectrum Analysis Basics", ch. 5
 * (noise measurements: equivalent noise bandwidth of the RBW filter, and the under-read of
 * noise by log averaging ≈ 2.5 dB and by linear-voltage averaging ≈ 1.05 dB). The exact
 * values used here are derived [D]: ideal Gaussian filter B_N/RBW = √(π/(4 ln 2)) = 1.064;
 * log-averaging bias 10 log10(e)·γ = 2.507 dB (γ = Euler–Mascheroni constant);
 * Rayleigh-mean bias −20 log10(√π/2) = 1.049 dB.
 *
 * Equations:
 *   (1) B_N = r·RBW                                  [Hz]  r = ENBW / RBW
 *   (2) P_ch = P_read + b − 10 log10 B_N + 10 log10 B_ch   [dBm]  b = detector bias
 *   (3) P_read = P_ch − b + 10 log10 B_N − 10 log10 B_ch   [dBm]  inverse
 *   (4) b_log = 10 log10(e)·γ                        [dB]
 *   (5) b_lin = −20 log10(√π/2)                      [dB]
 */
import { requireFinite, requirePositive } from '../guards'
import type { MethodRef, RadioResult } from '../types'
import { scaleToBandwidthDb } from '../units'

const log10 = Math.log10
const EULER_MASCHERONI = 0.5772156649015329

/** ENBW / RBW(3 dB) of an ideal Gaussian filter, √(π/(4 ln 2)) ≈ 1.0645 [D]. */
export const GAUSSIAN_ENBW_RATIO = Math.sqrt(Math.PI / (4 * Math.LN2))
/** Under-read of noise by a log-averaging (video-averaged log) detector, ≈ 2.507 dB [D]. */
export const LOG_AVERAGE_NOISE_BIAS_DB = 10 * log10(Math.E) * EULER_MASCHERONI // Eq. (4) [dB]
/** Under-read of noise by averaging the linear envelope voltage, ≈ 1.049 dB [D]. */
export const LINEAR_VOLTAGE_AVERAGE_NOISE_BIAS_DB = -20 * log10(Math.sqrt(Math.PI) / 2) // Eq. (5) [dB]

export const RBW_CHANNEL_POWER_METHOD: MethodRef = {
  id: 'rbw-to-channel-power',
  source:
    'Keysight AN 150 "Spectrum Analysis Basics" ch. 5 (ENBW, noise detector bias) [V-S]; exact Gaussian ENBW, ' +
    '10 log10(e)·γ and −20 log10(√π/2) derived [D]',
}

/** How the reading of noise was averaged; 'rms' needs no bias correction. */
export type NoiseDetector = 'rms' | 'log-average' | 'linear-voltage-average'

export interface RbwCorrection {
  rbwHz: number
  channelBandwidthHz: number
  /**
   * ENBW / RBW of the analyser's filter: a number, 'gaussian' (1.064), or omitted for 1.000
   * (ENBW taken equal to RBW: right when the analyser already corrects, and the choice behind
   * the usual "10 log(B_ch/RBW)" rule). The result always states which was used.
   */
  enbwRatio?: number | 'gaussian'
  /** Detector / averaging mode of the reading; default 'rms' (no bias). */
  detector?: NoiseDetector
}

export interface ChannelPowerResult {
  channelPowerDbm: number
  /** Correction added to the reading [dB]: bias − 10 log B_N + 10 log B_ch. */
  correctionDb: number
  enbwHz: number
  enbwRatio: number
  detectorBiasDb: number
}

function detectorBiasDb(detector: NoiseDetector): number {
  if (detector === 'log-average') return LOG_AVERAGE_NOISE_BIAS_DB
  if (detector === 'linear-voltage-average') return LINEAR_VOLTAGE_AVERAGE_NOISE_BIAS_DB
  if (detector === 'rms') return 0
  throw new RangeError(`detector must be 'rms', 'log-average' or 'linear-voltage-average' (got ${String(detector)}).`)
}

function resolve(opts: RbwCorrection): { correctionDb: number; enbwHz: number; ratio: number; biasDb: number; warnings: string[] } {
  const rbwHz = requirePositive('rbwHz', opts.rbwHz)
  const bChHz = requirePositive('channelBandwidthHz', opts.channelBandwidthHz)
  const ratio = opts.enbwRatio === 'gaussian' ? GAUSSIAN_ENBW_RATIO : requirePositive('enbwRatio', opts.enbwRatio ?? 1)
  const biasDb = detectorBiasDb(opts.detector ?? 'rms')
  const enbwHz = ratio * rbwHz // Eq. (1) [Hz]
  const warnings: string[] = [
    `ENBW taken as ${ratio.toFixed(3)} × RBW` +
      (opts.enbwRatio === undefined ? ' (ENBW = RBW; a near-Gaussian RBW filter has about 1.064, −0.27 dB).' : '.'),
    'Valid for noise-like signals flat across the channel; a CW carrier needs no bandwidth correction.',
  ]
  if (bChHz < enbwHz) {
    warnings.push('Channel bandwidth is narrower than the noise bandwidth of the RBW filter: the reading already spans more than the channel.')
  }
  const correctionDb = biasDb + scaleToBandwidthDb({ fromBandwidthHz: enbwHz, toBandwidthHz: bChHz }) // Eq. (2) b − 10 log B_N + 10 log B_ch [dB]
  return { correctionDb, enbwHz, ratio, biasDb, warnings }
}

/** Channel power of a noise-like signal from a reading in one RBW [dBm]. */
export function rbwReadingToChannelPowerDbm(opts: RbwCorrection & { readingDbm: number }): RadioResult<ChannelPowerResult> {
  const reading = requireFinite('readingDbm', opts.readingDbm)
  const c = resolve(opts)
  return {
    value: {
      channelPowerDbm: reading + c.correctionDb, // Eq. (2) [dBm]
      correctionDb: c.correctionDb,
      enbwHz: c.enbwHz,
      enbwRatio: c.ratio,
      detectorBiasDb: c.biasDb,
    },
    warnings: c.warnings,
    method: RBW_CHANNEL_POWER_METHOD,
  }
}

/** The reading in one RBW that a noise-like channel power would produce [dBm] (inverse). */
export function channelPowerToRbwReadingDbm(opts: RbwCorrection & { channelPowerDbm: number }): RadioResult<{ readingDbm: number }> {
  const p = requireFinite('channelPowerDbm', opts.channelPowerDbm)
  const c = resolve(opts)
  return { value: { readingDbm: p - c.correctionDb }, warnings: c.warnings, method: RBW_CHANNEL_POWER_METHOD } // Eq. (3) [dBm]
}
