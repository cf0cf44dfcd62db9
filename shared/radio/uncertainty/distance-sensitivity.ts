/**
 * Sensitivity of a back-calculated EIRP to the distance, for any propagation model.
 *
 * EIRP = P_r + L(d), so c_d = ∂EIRP/∂d = dL/dd = S(d)/(d·ln 10), where S = dL/d(log10 d) is
 * the model's local slope in dB per decade (10·n for a power law, giving 4.343·n/d).
 * Linearisation per JCGM 100:2008 §5.1.3 (sensitivity coefficients) [M for the clause];
 * the derivative is exact calculus [D]. The finite form L(d + Δd) − L(d) shows how far the
 * linearisation holds (10·n·log10(1 + Δd/d) for a power law).
 */
import { requireFinite, requirePositive } from '../guards'
import type { PropagationModel } from '../propagation/model'
import type { UncertaintyContribution, UncertaintyDistribution } from './gum-budget'

/** ∂EIRP/∂d [dB per m] at a distance, from the model's local slope. */
export function eirpDistanceSensitivityDbPerM(opts: { model: PropagationModel; distanceM: number }): number {
  const d = requirePositive('distanceM', opts.distanceM)
  const slopeDbPerDecade = requireFinite('slopeDbPerDecade', opts.model.slopeDbPerDecade(d))
  return slopeDbPerDecade / (d * Math.LN10) // Eq. (JCGM 100:2008 §5.1.3, register 12-2) c_d = S/(d ln 10) [dB/m]
}

/** Linearised EIRP uncertainty from a distance standard uncertainty: |c_d|·u_d [dB]. */
export function eirpUncertaintyFromDistanceDb(opts: { model: PropagationModel; distanceM: number; distanceUncertaintyM: number }): number {
  const ud = requireFinite('distanceUncertaintyM', opts.distanceUncertaintyM)
  if (ud < 0) throw new RangeError(`distanceUncertaintyM must not be negative (got ${ud}).`)
  return Math.abs(eirpDistanceSensitivityDbPerM(opts)) * ud // Eq. (JCGM 100:2008 §5.1.2, register 12-2) u_EIRP = |c_d| u_d [dB]
}

/**
 * Exact change of EIRP when the distance is off by Δd: L(d + Δd) − L(d) [dB].
 * The inverse question (which Δd gives a dB change) is answered by model.distanceM.
 */
export function eirpChangeFromDistanceErrorDb(opts: { model: PropagationModel; distanceM: number; distanceErrorM: number }): number {
  const d = requirePositive('distanceM', opts.distanceM)
  const dd = requireFinite('distanceErrorM', opts.distanceErrorM)
  requirePositive('distanceM + distanceErrorM', d + dd)
  return opts.model.lossDb(d + dd).value.lossDb - opts.model.lossDb(d).value.lossDb // Eq. (register 12-2) exact finite form [dB]
}

/** The distance row of an EIRP budget: the distance's own distribution [m] with c_d [dB/m]. */
export function distanceContribution(opts: {
  model: PropagationModel
  distanceM: number
  distance: UncertaintyDistribution
}): UncertaintyContribution {
  return {
    name: 'distance',
    value: opts.distanceM,
    unit: 'm',
    distribution: opts.distance,
    sensitivity: eirpDistanceSensitivityDbPerM(opts),
  }
}
