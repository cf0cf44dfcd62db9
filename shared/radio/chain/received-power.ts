/**
 * Isotropically received power from field strength, and back.
 *
 * Document: ITU-R P.525-4 §3 (power available from an isotropic antenna in a field E),
 * P_r = E − 20 log f − 167.2 dBW with f in GHz [clause number M]. Implemented exactly as
 * P_r = S·A_e with S = E²/Z0 and A_e = λ²/(4π), which gives 167.22 dB for f in GHz and
 * 77.22 dB for f in MHz and P_r in dBm. The two constants differ by 60 dB: f in MHz with
 * 167.2 is a 60 dB error, which is why this file takes the frequency in Hz only.
 *
 * Equations:
 *   (1) P_iso = E − 120 − 10 log10 Z0 + 10 log10(λ²/(4π)) + 30      [dBm]
 *   (2) E = P_iso + 120 + 10 log10 Z0 − 10 log10(λ²/(4π)) − 30      [dBµV/m]
 */
import { FREE_SPACE_IMPEDANCE_OHM } from '../constants'
import { requireFinite } from '../guards'
import { wavelengthM } from '../units'

const log10 = Math.log10

/** Field-independent part of eq. (1) [dB]: equals −20 log f(MHz) − 77.22. */
function fieldToIsotropicDb(freqHz: number): number {
  const lambdaM = wavelengthM(freqHz)
  return -120 - 10 * log10(FREE_SPACE_IMPEDANCE_OHM) + 10 * log10(lambdaM ** 2 / (4 * Math.PI)) + 30
}

/**
 * Power received by an antenna of gain antennaGainDbi (0 dBi = isotropic) in a plane-wave
 * field [dBm]. Far field, matched polarisation and load.
 */
export function fieldToReceivedPowerDbm(opts: { fieldStrengthDbuvPerM: number; freqHz: number; antennaGainDbi?: number }): number {
  const e = requireFinite('fieldStrengthDbuvPerM', opts.fieldStrengthDbuvPerM)
  const g = requireFinite('antennaGainDbi', opts.antennaGainDbi ?? 0)
  return e + fieldToIsotropicDb(opts.freqHz) + g // Eq. (1) [dBm]
}

/** Field strength that delivers receivedPowerDbm to an antenna of the given gain [dBµV/m]. */
export function receivedPowerToFieldDbuvPerM(opts: { receivedPowerDbm: number; freqHz: number; antennaGainDbi?: number }): number {
  const p = requireFinite('receivedPowerDbm', opts.receivedPowerDbm)
  const g = requireFinite('antennaGainDbi', opts.antennaGainDbi ?? 0)
  return p - g - fieldToIsotropicDb(opts.freqHz) // Eq. (2) [dBµV/m]
}
