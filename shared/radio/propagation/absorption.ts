/**
 * Extra absorption term added to any base propagation model: L(d) = L_base(d) + γ·d.
 *
 * γ is a specific attenuation [dB/km], e.g. oxygen near 60 GHz from ITU-R P.676-13 Annex 1
 * eq. (1) (see gaseous-p676.ts), which P.676 applies over a terrestrial path as A = γ·r.
 * When an attenuation is quoted as a field amplitude coefficient α in e^(−α·r), the power
 * falls as e^(−2α·r) and γ = 2α·10·log10(e) = 8.686·α dB/km [D]. The `Eq. (n)` tags refer to:
 *
 *  (1) A = γ·d_km                                 [dB]
 *  (2) γ = 20·log10(e)·α                          [dB/km], α in 1/km (field coefficient)
 *  (3) dL/d(log10 d) = slope_base + γ·d_km·ln 10  [dB/decade]
 */
import { requireFinite, requireNonNegative, requirePositive } from '../guards'
import type { MethodRef } from '../types'
import type { PathDistanceResult, PathLossResult, PropagationModel } from './model'
import { bisectIncreasing, bracketIncreasing } from './numeric'

/** 20·log10(e) = 8.6859 dB per neper of field amplitude [D]. */
export const DB_PER_NEPER = 20 * Math.LOG10E

/** Method of a base model with the absorption term added; the id derives from the base id. */
export function absorbingMethod(opts: { base: MethodRef }): MethodRef {
  const { base } = opts
  return {
    id: `${base.id}+absorption`,
    source: `${base.source}; plus absorption γ·d (specific attenuation, ITU-R P.676-13 Annex 1 eq. (1) for gases)`,
  }
}

/** Specific attenuation [dB/km] from a field amplitude coefficient α [1/km] in e^(−α·r). */
export function specificAttenuationFromFieldCoefficientDbPerKm(opts: { fieldAttenuationPerKm: number }): number {
  const alpha = requireNonNegative('fieldAttenuationPerKm', opts.fieldAttenuationPerKm)
  return DB_PER_NEPER * alpha // Eq. (2) [dB/km]
}

/** Absorption over a path [dB]. */
export function absorptionLossDb(opts: { absorptionDbPerKm: number; distanceM: number }): number {
  const gamma = requireNonNegative('absorptionDbPerKm', opts.absorptionDbPerKm)
  const distanceM = requirePositive('distanceM', opts.distanceM)
  return (gamma * distanceM) / 1e3 // Eq. (1) [dB]
}

/**
 * Resolves the two ways of stating the absorption into dB/km. Exactly one must be given.
 * A field coefficient carries a warning: a power coefficient of the same value gives half.
 */
export function resolveAbsorptionDbPerKm(opts: { absorptionDbPerKm?: number; fieldAttenuationPerKm?: number }): {
  absorptionDbPerKm: number
  warnings: string[]
} {
  const hasGamma = opts.absorptionDbPerKm !== undefined
  const hasAlpha = opts.fieldAttenuationPerKm !== undefined
  if (hasGamma === hasAlpha) {
    throw new RangeError('Give exactly one of absorptionDbPerKm or fieldAttenuationPerKm.')
  }
  if (hasGamma) return { absorptionDbPerKm: requireNonNegative('absorptionDbPerKm', opts.absorptionDbPerKm!), warnings: [] }
  const absorptionDbPerKm = specificAttenuationFromFieldCoefficientDbPerKm({ fieldAttenuationPerKm: opts.fieldAttenuationPerKm! })
  return {
    absorptionDbPerKm,
    warnings: [
      `Absorption ${+absorptionDbPerKm.toFixed(2)} dB/km derived from a field coefficient α = ${opts.fieldAttenuationPerKm} km⁻¹ ` +
        '(power falls as e^(−2αr)); if α was a power coefficient the absorption is half. Prefer a specific attenuation from ITU-R P.676.',
    ],
  }
}

/** Base loss plus absorption at a distance [dB]. */
export function absorbingLossDb(opts: { base: PropagationModel; absorptionDbPerKm: number; distanceM: number }): PathLossResult {
  const baseLoss = opts.base.lossDb(opts.distanceM)
  const extraDb = absorptionLossDb({ absorptionDbPerKm: opts.absorptionDbPerKm, distanceM: opts.distanceM })
  return { ...baseLoss, value: { ...baseLoss.value, lossDb: baseLoss.value.lossDb + extraDb }, method: absorbingMethod({ base: opts.base.method }) } // Eq. (1) [dB]
}

/**
 * Distance at which base loss plus absorption equals lossDb [m], by bisection: the base alone
 * reaches lossDb at d_base, so the answer lies below d_base. For a base whose loss oscillates
 * (exact two-ray) the root found is one of several; the base's warnings say so.
 */
export function absorbingDistanceM(opts: { base: PropagationModel; absorptionDbPerKm: number; lossDb: number }): PathDistanceResult {
  const lossDb = requireFinite('lossDb', opts.lossDb)
  const gamma = requireNonNegative('absorptionDbPerKm', opts.absorptionDbPerKm)
  const method = absorbingMethod({ base: opts.base.method })
  const baseOnly = opts.base.distanceM(lossDb)
  if (gamma === 0) return { ...baseOnly, method }
  const total = (d: number): number => opts.base.lossDb(d).value.lossDb + (gamma * d) / 1e3 // Eq. (1) [dB]
  const bracket = bracketIncreasing({ fn: total, target: lossDb, startX: baseOnly.value.distanceM, minX: 1e-9, maxX: baseOnly.value.distanceM })
  if (!bracket) throw new RangeError(`lossDb = ${lossDb} dB is not reached by the base model plus absorption.`)
  const distanceM = bisectIncreasing({ fn: total, target: lossDb, ...bracket })
  return { value: { distanceM }, warnings: opts.base.lossDb(distanceM).warnings, method }
}

/** Local slope of base plus absorption [dB per decade]. */
export function absorbingSlopeDbPerDecade(opts: { base: PropagationModel; absorptionDbPerKm: number; distanceM: number }): number {
  const gamma = requireNonNegative('absorptionDbPerKm', opts.absorptionDbPerKm)
  const distanceM = requirePositive('distanceM', opts.distanceM)
  return opts.base.slopeDbPerDecade(distanceM) + ((gamma * distanceM) / 1e3) * Math.LN10 // Eq. (3) [dB/decade]
}
