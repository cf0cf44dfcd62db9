/**
 * Unit conversions: power, voltage, field strength, power flux density, spectral densities.
 * Every conversion is an exact identity [D] except where a constant is named.
 * Losses are positive dB. Never add two absolute levels: use sumPowersDbm.
 */
import { DIPOLE_GAIN_DBI, FREE_SPACE_IMPEDANCE_OHM, RECEIVER_IMPEDANCE_OHM, SPEED_OF_LIGHT_M_PER_S } from './constants'
import { requireFinite, requireNonEmpty, requirePositive } from './guards'

const log10 = Math.log10

// ── Power ────────────────────────────────────────────────────────────────────
export const wattsToDbw = (powerW: number): number => 10 * log10(requirePositive('powerW', powerW))
export const dbwToWatts = (powerDbw: number): number => 10 ** (requireFinite('powerDbw', powerDbw) / 10)
export const wattsToDbm = (powerW: number): number => wattsToDbw(powerW) + 30
export const dbmToWatts = (powerDbm: number): number => dbwToWatts(requireFinite('powerDbm', powerDbm) - 30)
export const milliwattsToDbm = (powerMw: number): number => 10 * log10(requirePositive('powerMw', powerMw))
export const dbmToMilliwatts = (powerDbm: number): number => 10 ** (requireFinite('powerDbm', powerDbm) / 10)
export const dbmToDbw = (powerDbm: number): number => requireFinite('powerDbm', powerDbm) - 30
export const dbwToDbm = (powerDbw: number): number => requireFinite('powerDbw', powerDbw) + 30

/** Ratio in dB from a linear power ratio, and back. */
export const ratioToDb = (ratio: number): number => 10 * log10(requirePositive('ratio', ratio))
export const dbToRatio = (db: number): number => 10 ** (requireFinite('db', db) / 10)

/** Power sum of levels in dBm (incoherent addition). */
export function sumPowersDbm(levelsDbm: number[]): number {
  requireNonEmpty('levelsDbm', levelsDbm)
  let sumMw = 0
  for (const l of levelsDbm) sumMw += dbmToMilliwatts(l)
  return 10 * log10(sumMw)
}

/** Scales a spectral density or a noise-like power from one bandwidth to another [dB]. */
export function scaleToBandwidthDb(opts: { fromBandwidthHz: number; toBandwidthHz: number }): number {
  requirePositive('fromBandwidthHz', opts.fromBandwidthHz)
  requirePositive('toBandwidthHz', opts.toBandwidthHz)
  return 10 * log10(opts.toBandwidthHz / opts.fromBandwidthHz)
}

/** Density per reference bandwidth: dBm/Hz ↔ dBm/kHz ↔ dBm/MHz. */
export type DensityReference = 'Hz' | 'kHz' | 'MHz'
const REF_HZ: Record<DensityReference, number> = { Hz: 1, kHz: 1e3, MHz: 1e6 }
export function convertDensityDb(opts: { densityDb: number; from: DensityReference; to: DensityReference }): number {
  return requireFinite('densityDb', opts.densityDb) + 10 * log10(REF_HZ[opts.to] / REF_HZ[opts.from])
}
/** Total power in a bandwidth from a flat density [dBm]. */
export function densityToPowerDbm(opts: { densityDbmPerHz: number; bandwidthHz: number }): number {
  return requireFinite('densityDbmPerHz', opts.densityDbmPerHz) + 10 * log10(requirePositive('bandwidthHz', opts.bandwidthHz))
}
/** Flat density from a total power over a bandwidth [dBm/Hz]. */
export function powerToDensityDbmPerHz(opts: { powerDbm: number; bandwidthHz: number }): number {
  return requireFinite('powerDbm', opts.powerDbm) - 10 * log10(requirePositive('bandwidthHz', opts.bandwidthHz))
}

// ── Voltage at a receiver port (50 Ω unless given) ─────────────────────────────
/** dBµV = dBm + 10·log10(R) + 90; 106.99 dB at 50 Ω [D]. */
export function dbmToDbuv(opts: { powerDbm: number; impedanceOhm?: number }): number {
  const r = requirePositive('impedanceOhm', opts.impedanceOhm ?? RECEIVER_IMPEDANCE_OHM)
  return requireFinite('powerDbm', opts.powerDbm) + 10 * log10(r) + 90
}
export function dbuvToDbm(opts: { voltageDbuv: number; impedanceOhm?: number }): number {
  const r = requirePositive('impedanceOhm', opts.impedanceOhm ?? RECEIVER_IMPEDANCE_OHM)
  return requireFinite('voltageDbuv', opts.voltageDbuv) - 10 * log10(r) - 90
}

// ── Field strength and power flux density (far field, plane wave) ──────────────
export const vPerMToDbuvPerM = (fieldStrengthVPerM: number): number =>
  20 * log10(requirePositive('fieldStrengthVPerM', fieldStrengthVPerM)) + 120
export const dbuvPerMToVPerM = (fieldStrengthDbuvPerM: number): number =>
  10 ** ((requireFinite('fieldStrengthDbuvPerM', fieldStrengthDbuvPerM) - 120) / 20)
export const wPerM2ToDbwPerM2 = (pfdWPerM2: number): number => 10 * log10(requirePositive('pfdWPerM2', pfdWPerM2))
export const dbwPerM2ToWPerM2 = (pfdDbwPerM2: number): number => 10 ** (requireFinite('pfdDbwPerM2', pfdDbwPerM2) / 10)

/** S = E²/Z0; in logs S = E − 145.76 (ITU-R P.525 rounds to 145.8) [dBW/m²]. */
export function fieldToPfdDbwPerM2(fieldStrengthDbuvPerM: number): number {
  return requireFinite('fieldStrengthDbuvPerM', fieldStrengthDbuvPerM) - 120 - 10 * log10(FREE_SPACE_IMPEDANCE_OHM)
}
export function pfdToFieldDbuvPerM(pfdDbwPerM2: number): number {
  return requireFinite('pfdDbwPerM2', pfdDbwPerM2) + 120 + 10 * log10(FREE_SPACE_IMPEDANCE_OHM)
}
/** Power density [W/m²] from a field strength [V/m]: S = E²/Z0. */
export const vPerMToWPerM2 = (fieldStrengthVPerM: number): number =>
  requirePositive('fieldStrengthVPerM', fieldStrengthVPerM) ** 2 / FREE_SPACE_IMPEDANCE_OHM
export const wPerM2ToVPerM = (pfdWPerM2: number): number => Math.sqrt(requirePositive('pfdWPerM2', pfdWPerM2) * FREE_SPACE_IMPEDANCE_OHM)

// ── EIRP ↔ ERP ────────────────────────────────────────────────────────────────
/** ERP is referred to a half-wave dipole: EIRP = ERP + 2.15 dB (ITU RR Nos. 1.161, 1.162). */
export const erpToEirpDb = (erpDb: number): number => requireFinite('erpDb', erpDb) + DIPOLE_GAIN_DBI
export const eirpToErpDb = (eirpDb: number): number => requireFinite('eirpDb', eirpDb) - DIPOLE_GAIN_DBI

// ── Frequency and wavelength ─────────────────────────────────────────────────
/** Free-space wavelength λ = c/f [m]. */
export function wavelengthM(freqHz: number): number {
  return SPEED_OF_LIGHT_M_PER_S / requirePositive('freqHz', freqHz)
}
