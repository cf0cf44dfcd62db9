/**
 * Thermal noise kTB and a receiver's noise floor.
 *
 * Document: noise power kT0B referred to T0 = 290 K, as used by ITU-R P.372-16 §2 (F_a is
 * referred to kT0B) [M for the clause]; k = 1.380649e-23 J/K exact (SI brochure, 9th ed. 2019).
 * kT0 = −173.98 dBm/Hz; the familiar "−174" is that value rounded.
 *
 * Equations:
 *   (1) N0 = 10 log10(k·T) + 30                        [dBm/Hz]
 *   (2) N = N0 + 10 log10 B + NF                       [dBm]
 *   (3) B = 10^((N − N0 − NF)/10)                      [Hz]  inverse
 */
import { BOLTZMANN_J_PER_K, REFERENCE_TEMPERATURE_K } from '../constants'
import { requireFinite, requireNonNegative, requirePositive } from '../guards'
import type { MethodRef, RadioResult } from '../types'

const log10 = Math.log10

export const THERMAL_NOISE_METHOD: MethodRef = {
  id: 'thermal-noise-ktb',
  source: 'N = kT0B·F with k exact (SI 2019) and T0 = 290 K; ITU-R P.372-16 §2 refers noise to kT0B [M for the clause] — register 9-1…9-4',
}

/** Thermal noise density at temperatureK (default T0 = 290 K) [dBm/Hz]. */
export function thermalNoiseDensityDbmPerHz(opts: { temperatureK?: number } = {}): number {
  const t = requirePositive('temperatureK', opts.temperatureK ?? REFERENCE_TEMPERATURE_K)
  return 10 * log10(BOLTZMANN_J_PER_K * t) + 30 // Eq. (1) [dBm/Hz]
}

export interface NoiseFloorOptions {
  bandwidthHz: number
  /** Receiver noise figure [dB], ≥ 0; 0 dB gives bare kTB. */
  noiseFigureDb?: number
  /** Noise temperature of the reference [K]; 290 K unless given. */
  temperatureK?: number
}

/** Noise floor of a receiver: kTB plus noise figure [dBm]. */
export function noiseFloorDbm(opts: NoiseFloorOptions): RadioResult<{ noiseDbm: number; noiseDensityDbmPerHz: number }> {
  const b = requirePositive('bandwidthHz', opts.bandwidthHz)
  const nf = requireNonNegative('noiseFigureDb', opts.noiseFigureDb ?? 0)
  const n0 = thermalNoiseDensityDbmPerHz({ temperatureK: opts.temperatureK })
  const warnings = temperatureWarnings(opts.temperatureK)
  return {
    value: { noiseDbm: n0 + 10 * log10(b) + nf, noiseDensityDbmPerHz: n0 + nf }, // Eq. (2) [dBm]
    warnings,
    method: THERMAL_NOISE_METHOD,
  }
}

/** Bandwidth whose noise floor is noiseDbm (inverse of noiseFloorDbm) [Hz]. */
export function noiseBandwidthHz(opts: { noiseDbm: number; noiseFigureDb?: number; temperatureK?: number }): RadioResult<{ bandwidthHz: number }> {
  const n = requireFinite('noiseDbm', opts.noiseDbm)
  const nf = requireNonNegative('noiseFigureDb', opts.noiseFigureDb ?? 0)
  return {
    value: { bandwidthHz: 10 ** ((n - thermalNoiseDensityDbmPerHz({ temperatureK: opts.temperatureK }) - nf) / 10) }, // Eq. (3) [Hz]
    warnings: temperatureWarnings(opts.temperatureK),
    method: THERMAL_NOISE_METHOD,
  }
}

/** The victim's noise: given directly (a measured or stated noise floor), or from kTB, bandwidth and noise figure. */
export type VictimNoise = { noiseDbm: number } | NoiseFloorOptions

/** The victim's noise floor [dBm], with the warnings of its kTB computation when it was computed. */
export function resolveVictimNoise(noise: VictimNoise): { noiseDbm: number; warnings: string[] } {
  if (noise && 'noiseDbm' in noise) return { noiseDbm: requireFinite('victimNoise.noiseDbm', noise.noiseDbm), warnings: [] }
  if (!noise) throw new RangeError('victimNoise must give noiseDbm or bandwidthHz.')
  const r = noiseFloorDbm(noise)
  return { noiseDbm: r.value.noiseDbm, warnings: r.warnings }
}

function temperatureWarnings(temperatureK: number | undefined): string[] {
  return temperatureK !== undefined && temperatureK !== REFERENCE_TEMPERATURE_K
    ? [`Noise referred to ${temperatureK} K instead of the standard T0 = 290 K; noise figures are defined at 290 K.`]
    : []
}
