/**
 * Far-field conditions for plane-wave conversions (field ↔ power density ↔ received power).
 *
 * Document: far-field (Fraunhofer) distance d_F = 2D²/λ for an antenna of largest dimension D,
 * and d ≫ λ, as stated with the validity of ITU-R P.525-4 (free space, far field) [M for the
 * wording]. Both are conditions of the trade for plane-wave formulas; they never throw, they warn.
 *
 * Equations:
 *   (1) d_F = 2·D²/λ      [m]
 */
import { requireNonNegative, requirePositive } from '../guards'
import type { ValidityRange } from '../types'
import { wavelengthM } from '../units'

/**
 * Floor of the far-field (plane-wave) assumption as data: at least ten wavelengths from a small
 * antenna (common practice, no source). Used by free-space loss and by EIRP back-calculation;
 * large antennas also need d > 2D²/λ (farFieldWarnings).
 */
export const FAR_FIELD_VALIDITY: ValidityRange[] = [
  { quantity: 'distanceInWavelengths', min: 10, unit: 'λ', source: 'far-field (plane-wave) assumption, common practice (no source)' },
]

/** Fraunhofer distance of an antenna of largest dimension antennaSizeM [m]. */
export function fraunhoferDistanceM(opts: { freqHz: number; antennaSizeM: number }): number {
  const d = requireNonNegative('antennaSizeM', opts.antennaSizeM)
  return (2 * d ** 2) / wavelengthM(opts.freqHz) // Eq. (1) [m]
}

/**
 * Warnings when a distance is too short for plane-wave formulas: shorter than one wavelength,
 * or (when the antenna size is known) shorter than 2D²/λ.
 */
export function farFieldWarnings(opts: { freqHz: number; distanceM: number; antennaSizeM?: number }): string[] {
  const warnings: string[] = []
  const distanceM = requirePositive('distanceM', opts.distanceM)
  const lambdaM = wavelengthM(opts.freqHz)
  if (distanceM < lambdaM) {
    warnings.push(
      `Distance ${fmt(distanceM)} m is shorter than one wavelength (${fmt(lambdaM)} m): reactive near field, ` +
        'plane-wave relations between field, power density and received power do not hold.',
    )
  }
  if (opts.antennaSizeM !== undefined) {
    const dF = fraunhoferDistanceM({ freqHz: opts.freqHz, antennaSizeM: opts.antennaSizeM })
    if (distanceM < dF) {
      warnings.push(
        `Distance ${fmt(distanceM)} m is inside the far-field distance 2D²/λ = ${fmt(dF)} m for an antenna of ` +
          `${fmt(opts.antennaSizeM)} m: near field, plane-wave results are approximate.`,
      )
    }
  }
  return warnings
}

function fmt(v: number): string {
  return String(+v.toPrecision(4))
}
