/**
 * Power received by an antenna in a plane-wave field, from the field strength or the power
 * flux density, and back. The one place in the library where E or S becomes a received power.
 *
 * Document: ITU-R P.525-4 §3 (power available from an isotropic antenna in a field E),
 * P_r = E − 20 log f − 167.2 dBW with f in GHz [clause number M]. Implemented exactly as
 * P_r = S·A_e with S = E²/Z0 (Z0 = 120π, constants.ts) and A_e = G·λ²/(4π), which gives
 * 167.22 dB for f in GHz and 77.22 dB for f in MHz and P_r in dBm. The two constants differ by
 * 60 dB: f in MHz with 167.2 is a 60 dB error, which is why this file takes the frequency in Hz
 * only. Far field, matched polarisation and load.
 *
 * Equations:
 *   (1) A_iso = 10 log10(λ²/(4π))                                    [dB(m²)]
 *   (2) P_r = S + A_iso + G + 30                                     [dBm]
 *   (3) S = P_r − 30 − A_iso − G                                     [dBW/m²]  inverse of (2)
 *   (4) P_r = E − 120 − 10 log10 Z0 + A_iso + G + 30                 [dBm]     (2) with S = E²/Z0
 *   (5) E = P_r + 120 + 10 log10 Z0 − A_iso − G − 30                 [dBµV/m]  inverse of (4)
 */
import { requireFinite } from '../guards'
import { fieldToPfdDbwPerM2, pfdToFieldDbuvPerM, wavelengthM } from '../units'

/** Effective aperture of an isotropic antenna, 10·log10(λ²/4π) [dB(m²)]. */
function isotropicApertureDbM2(freqHz: number): number {
  return 20 * Math.log10(wavelengthM(freqHz)) - 10 * Math.log10(4 * Math.PI) // Eq. (1) [dB(m²)]
}

/** Power received by an antenna of gain antennaGainDbi (0 dBi = isotropic) from a power flux density [dBm]. */
export function pfdToReceivedPowerDbm(opts: { pfdDbwPerM2: number; freqHz: number; antennaGainDbi?: number }): number {
  const s = requireFinite('pfdDbwPerM2', opts.pfdDbwPerM2)
  const g = requireFinite('antennaGainDbi', opts.antennaGainDbi ?? 0)
  return s + isotropicApertureDbM2(opts.freqHz) + g + 30 // Eq. (2) [dBm]
}

/** Power flux density that delivers receivedPowerDbm to an antenna of the given gain [dBW/m²] (inverse). */
export function receivedPowerToPfdDbwPerM2(opts: { receivedPowerDbm: number; freqHz: number; antennaGainDbi?: number }): number {
  const p = requireFinite('receivedPowerDbm', opts.receivedPowerDbm)
  const g = requireFinite('antennaGainDbi', opts.antennaGainDbi ?? 0)
  return p - 30 - isotropicApertureDbM2(opts.freqHz) - g // Eq. (3) [dBW/m²]
}

/**
 * Power received by an antenna of gain antennaGainDbi (0 dBi = isotropic) in a plane-wave
 * field [dBm]: E − 20 log f(MHz) − 77.22 + G.
 */
export function fieldToReceivedPowerDbm(opts: { fieldStrengthDbuvPerM: number; freqHz: number; antennaGainDbi?: number }): number {
  const s = fieldToPfdDbwPerM2(requireFinite('fieldStrengthDbuvPerM', opts.fieldStrengthDbuvPerM))
  return pfdToReceivedPowerDbm({ pfdDbwPerM2: s, freqHz: opts.freqHz, antennaGainDbi: opts.antennaGainDbi }) // Eq. (4) [dBm]
}

/** Field strength that delivers receivedPowerDbm to an antenna of the given gain [dBµV/m] (inverse). */
export function receivedPowerToFieldDbuvPerM(opts: { receivedPowerDbm: number; freqHz: number; antennaGainDbi?: number }): number {
  return pfdToFieldDbuvPerM(receivedPowerToPfdDbwPerM2(opts)) // Eq. (5) [dBµV/m]
}
