/**
 * Antenna factor ↔ gain, and effective aperture, for a receiving antenna loaded by R_L.
 *
 * Document: antenna-factor definition AF = E/V = (1/λ)·√(4π·Z0/(R_L·G)), which is 9.73/(λ√G) at
 * R_L = 50 Ω, and in logs AF = 20 log f(MHz) − G − 29.77 (ITU Handbook on Spectrum Monitoring,
 * edition 2011, antenna-factor relation — clause number [M]). Effective aperture A_e = G·λ²/(4π)
 * (exact identity [D]). The constant is not rounded here: it is computed from Z0 = 120π and the
 * exact speed of light (29.771 dB), so 29.77-based tables agree within 0.01 dB.
 *
 * Equations:
 *   (1) AF = −20 log10 λ + 10 log10(4π·Z0/R_L) − G            [dB/m]
 *   (2) G  = −20 log10 λ + 10 log10(4π·Z0/R_L) − AF           [dBi]
 *   (3) A_e = 10^(G/10)·λ²/(4π)                                [m²]
 *   (4) G  = 10 log10(4π·A_e/λ²)                               [dBi]
 */
import { FREE_SPACE_IMPEDANCE_OHM, RECEIVER_IMPEDANCE_OHM } from '../constants'
import { requireFinite, requirePositive } from '../guards'
import { wavelengthM } from '../units'

const log10 = Math.log10

/** Terms of eqs. (1)–(2) that do not depend on the antenna [dB/m]. */
function factorPlusGainDb(freqHz: number, impedanceOhm: number): number {
  const lambdaM = wavelengthM(freqHz)
  return -20 * log10(lambdaM) + 10 * log10((4 * Math.PI * FREE_SPACE_IMPEDANCE_OHM) / impedanceOhm)
}

/** Antenna factor from antenna gain [dB/m]; matched load of impedanceOhm (default 50 Ω). */
export function antennaFactorFromGainDbPerM(opts: { freqHz: number; antennaGainDbi: number; impedanceOhm?: number }): number {
  const r = requirePositive('impedanceOhm', opts.impedanceOhm ?? RECEIVER_IMPEDANCE_OHM)
  const g = requireFinite('antennaGainDbi', opts.antennaGainDbi)
  return factorPlusGainDb(requirePositive('freqHz', opts.freqHz), r) - g // Eq. (1) [dB/m]
}

/** Antenna gain from antenna factor [dBi]; the inverse of antennaFactorFromGainDbPerM. */
export function antennaGainFromFactorDbi(opts: { freqHz: number; antennaFactorDbPerM: number; impedanceOhm?: number }): number {
  const r = requirePositive('impedanceOhm', opts.impedanceOhm ?? RECEIVER_IMPEDANCE_OHM)
  const af = requireFinite('antennaFactorDbPerM', opts.antennaFactorDbPerM)
  return factorPlusGainDb(requirePositive('freqHz', opts.freqHz), r) - af // Eq. (2) [dBi]
}

/** Effective aperture of an antenna of the given gain [m²]. */
export function effectiveApertureM2(opts: { freqHz: number; antennaGainDbi: number }): number {
  const lambdaM = wavelengthM(opts.freqHz)
  const g = 10 ** (requireFinite('antennaGainDbi', opts.antennaGainDbi) / 10)
  return (g * lambdaM ** 2) / (4 * Math.PI) // Eq. (3) [m²]
}

/** Antenna gain from an effective aperture [dBi]; the inverse of effectiveApertureM2. */
export function gainFromEffectiveApertureDbi(opts: { freqHz: number; effectiveApertureM2: number }): number {
  const lambdaM = wavelengthM(opts.freqHz)
  const a = requirePositive('effectiveApertureM2', opts.effectiveApertureM2)
  return 10 * log10((4 * Math.PI * a) / lambdaM ** 2) // Eq. (4) [dBi]
}
