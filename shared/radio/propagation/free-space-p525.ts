/**
 * Free-space basic transmission loss, and the free-space field and power flux density of an
 * e.i.r.p., each with its inverse.
 *
 * Document: Recommendation ITU-R P.525-4 (08/2019), "Calculation of free-space attenuation",
 * §2.1 (point-to-area: field from e.i.r.p.) and §2.2 (point-to-point: basic transmission loss).
 * The Recommendation's own equation numbers were not verified [M]; the `Eq. (n)` tags in this
 * file refer to the list below.
 *
 *  (1) L_bf = 20·log10(4π·d·f / c)                     exact, d [m], f [Hz] — derived [D]
 *  (2) L_bf = 32.4 + 20·log10 f + 20·log10 d           P.525 practical form, f [MHz], d [km]
 *  (3) E = P_eirp − 20·log10 d + 74.77                 E [dBµV/m], P [dBW], d [km]; P.525 rounds to 74.8.
 *      74.77 = 10·log10(30) + 60 from e = √(30·p)/d, i.e. Z0 = 120π [D]
 *  (4) S = P_eirp − 10·log10(4π·d²)                    pfd [dBW/m²], P [dBW], d [m] — inverse-square law [D]
 *  (5) P_eirp = E + 20·log10 d − 74.77                 inverse of (3)
 *  (6) P_eirp = S + 10·log10(4π·d²)                    inverse of (4)
 *  (7) P[dBW] = P[dBm] − 30                            exact [D]
 *
 * The public face takes and returns powers in dBm (eq. (7) at the boundary); only the pfd
 * stays in dBW/m², as ITU-R texts state it.
 *
 * The exact constant of (2) is 20·log10(4π·10⁹/c) = 32.4478; the rounded 32.4 reads 0.048 dB low.
 * Valid in the far field only, with no ground, clutter or gaseous absorption.
 */
import { FAR_FIELD_VALIDITY } from '../chain/far-field'
import { SPEED_OF_LIGHT_M_PER_S } from '../constants'
import { requireFinite, requirePositive } from '../guards'
import { checkValidity, type MethodRef, type ValidityRange } from '../types'
import type { PathDistanceResult, PathLossResult } from './model'

export type FreeSpaceForm = 'exact' | 'p525-rounded'

export const FREE_SPACE_METHOD: MethodRef = {
  id: 'free-space-p525',
  source: 'ITU-R P.525-4 (08/2019) §2.2, free-space basic transmission loss 20·log10(4πd/λ)',
}
export const FREE_SPACE_ROUNDED_METHOD: MethodRef = {
  id: 'free-space-p525-rounded',
  source: 'ITU-R P.525-4 (08/2019) §2.2, practical form 32.4 + 20·log f(MHz) + 20·log d(km)',
}

const methodOf = (form: FreeSpaceForm | undefined): MethodRef => (form === 'p525-rounded' ? FREE_SPACE_ROUNDED_METHOD : FREE_SPACE_METHOD)

/** Constant of the P.525 practical form, f in MHz and d in km [dB]. */
export const P525_ROUNDED_CONSTANT_DB = 32.4
/** Exact constant of the same form, 20·log10(4π·10⁹/c) = 32.4478 dB [D]. */
export const FREE_SPACE_EXACT_CONSTANT_DB = 20 * Math.log10((4 * Math.PI * 1e9) / SPEED_OF_LIGHT_M_PER_S)
/** Field constant of eq. (3): 10·log10(30) + 60 = 74.77 dB (P.525 rounds to 74.8) [D]. */
export const P525_FIELD_CONSTANT_DB = 10 * Math.log10(30) + 60

/**
 * Far-field condition as data (chain/far-field.ts): ten wavelengths is a floor for small
 * antennas; large antennas also need d > 2D²/λ, which depends on the antenna and is not checked here.
 */
export const FREE_SPACE_VALIDITY: ValidityRange[] = FAR_FIELD_VALIDITY

function wavelengthWarnings(freqHz: number, distanceM: number): string[] {
  const wavelengths = (distanceM * freqHz) / SPEED_OF_LIGHT_M_PER_S
  return checkValidity(FREE_SPACE_VALIDITY, { distanceInWavelengths: wavelengths })
}

/** Free-space basic transmission loss between isotropic antennas [dB]. */
export function freeSpaceLossDb(opts: { freqHz: number; distanceM: number; form?: FreeSpaceForm }): PathLossResult {
  const freqHz = requirePositive('freqHz', opts.freqHz)
  const distanceM = requirePositive('distanceM', opts.distanceM)
  const lossDb =
    opts.form === 'p525-rounded'
      ? P525_ROUNDED_CONSTANT_DB + 20 * Math.log10(freqHz / 1e6) + 20 * Math.log10(distanceM / 1e3) // Eq. (2) [dB]
      : 20 * Math.log10((4 * Math.PI * distanceM * freqHz) / SPEED_OF_LIGHT_M_PER_S) // Eq. (1) [dB]
  return { value: { lossDb }, warnings: wavelengthWarnings(freqHz, distanceM), method: methodOf(opts.form) }
}

/** Distance at which the free-space loss equals lossDb [m]; exact inverse of freeSpaceLossDb. */
export function freeSpaceDistanceM(opts: { freqHz: number; lossDb: number; form?: FreeSpaceForm }): PathDistanceResult {
  const freqHz = requirePositive('freqHz', opts.freqHz)
  const lossDb = requireFinite('lossDb', opts.lossDb)
  const distanceM =
    opts.form === 'p525-rounded'
      ? 1e3 * 10 ** ((lossDb - P525_ROUNDED_CONSTANT_DB - 20 * Math.log10(freqHz / 1e6)) / 20) // Eq. (2) inverted [m]
      : (SPEED_OF_LIGHT_M_PER_S / (4 * Math.PI * freqHz)) * 10 ** (lossDb / 20) // Eq. (1) inverted [m]
  return { value: { distanceM }, warnings: wavelengthWarnings(freqHz, distanceM), method: methodOf(opts.form) }
}

/** dBm → dBW at the boundary, eq. (7). */
const dbmToDbwExact = (dbm: number): number => dbm - 30 // Eq. (7) [dBW]

/** Free-space field strength at a distance from an e.i.r.p. in dBm [dBµV/m]. */
export function freeSpaceFieldStrengthDbuvPerM(opts: { eirpDbm: number; distanceM: number }): number {
  const eirpDbw = dbmToDbwExact(requireFinite('eirpDbm', opts.eirpDbm))
  const distanceM = requirePositive('distanceM', opts.distanceM)
  return eirpDbw - 20 * Math.log10(distanceM / 1e3) + P525_FIELD_CONSTANT_DB // Eq. (3) [dBµV/m]
}

/** Free-space power flux density at a distance from an e.i.r.p. in dBm [dBW/m²]. */
export function freeSpacePfdDbwPerM2(opts: { eirpDbm: number; distanceM: number }): number {
  const eirpDbw = dbmToDbwExact(requireFinite('eirpDbm', opts.eirpDbm))
  const distanceM = requirePositive('distanceM', opts.distanceM)
  return eirpDbw - 10 * Math.log10(4 * Math.PI * distanceM ** 2) // Eq. (4) [dBW/m²]
}

/** E.i.r.p. that gives a field strength at a distance in free space [dBm] (inverse of freeSpaceFieldStrengthDbuvPerM). */
export function freeSpaceEirpFromFieldDbm(opts: { fieldStrengthDbuvPerM: number; distanceM: number }): number {
  const fieldStrengthDbuvPerM = requireFinite('fieldStrengthDbuvPerM', opts.fieldStrengthDbuvPerM)
  const distanceM = requirePositive('distanceM', opts.distanceM)
  const eirpDbw = fieldStrengthDbuvPerM + 20 * Math.log10(distanceM / 1e3) - P525_FIELD_CONSTANT_DB // Eq. (5) [dBW]
  return eirpDbw + 30 // Eq. (7) [dBm]
}

/** E.i.r.p. that gives a power flux density at a distance in free space [dBm] (inverse of freeSpacePfdDbwPerM2). */
export function freeSpaceEirpFromPfdDbm(opts: { pfdDbwPerM2: number; distanceM: number }): number {
  const pfdDbwPerM2 = requireFinite('pfdDbwPerM2', opts.pfdDbwPerM2)
  const distanceM = requirePositive('distanceM', opts.distanceM)
  const eirpDbw = pfdDbwPerM2 + 10 * Math.log10(4 * Math.PI * distanceM ** 2) // Eq. (6) [dBW]
  return eirpDbw + 30 // Eq. (7) [dBm]
}
