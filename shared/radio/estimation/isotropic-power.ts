/**
 * Field strength or power flux-density at a point ↔ the power an isotropic antenna there would
 * receive. ITU-R P.525-4 §3 [M for the section]: P_r = S·A_e with A_e = λ²/(4π) for G = 1
 * (effective aperture, exact [D]); S = E²/Z0 with Z0 = 120π (constants.ts). In logs
 * P_r(dBm) = E(dBµV/m) − 20·log10 f(MHz) − 77.22, and S(dBW/m²) = E − 145.76.
 * Far field (plane wave) only.
 */
import { requireFinite } from '../guards'
import { fieldToPfdDbwPerM2, pfdToFieldDbuvPerM, wavelengthM } from '../units'

/** 10·log10(λ²/4π): effective aperture of an isotropic antenna [dB(m²)]. */
export function isotropicApertureDbM2(freqHz: number): number {
  return 20 * Math.log10(wavelengthM(freqHz)) - 10 * Math.log10(4 * Math.PI) // Eq. (P.525 A_e = λ²/4π) [dB(m²)]
}

/** Isotropic received power from power flux-density [dBm]. */
export function isotropicPowerFromPfdDbm(opts: { pfdDbwPerM2: number; freqHz: number }): number {
  return requireFinite('pfdDbwPerM2', opts.pfdDbwPerM2) + isotropicApertureDbM2(opts.freqHz) + 30 // Eq. (P.525 P_r = S·A_e) [dBm]
}

/** Power flux-density from isotropic received power [dBW/m²] (inverse of isotropicPowerFromPfdDbm). */
export function pfdFromIsotropicPowerDbwPerM2(opts: { receivedPowerDbm: number; freqHz: number }): number {
  return requireFinite('receivedPowerDbm', opts.receivedPowerDbm) - 30 - isotropicApertureDbM2(opts.freqHz) // Eq. (P.525 S = P_r/A_e) [dBW/m²]
}

/** Isotropic received power from field strength [dBm]: E − 20 log f(MHz) − 77.22. */
export function isotropicPowerFromFieldDbm(opts: { fieldStrengthDbuvPerM: number; freqHz: number }): number {
  return isotropicPowerFromPfdDbm({ pfdDbwPerM2: fieldToPfdDbwPerM2(opts.fieldStrengthDbuvPerM), freqHz: opts.freqHz }) // Eq. (P.525 §3) [dBm]
}

/** Field strength from isotropic received power [dBµV/m] (inverse of isotropicPowerFromFieldDbm). */
export function fieldFromIsotropicPowerDbuvPerM(opts: { receivedPowerDbm: number; freqHz: number }): number {
  return pfdToFieldDbuvPerM(pfdFromIsotropicPowerDbwPerM2(opts)) // Eq. (P.525 §3) [dBµV/m]
}
