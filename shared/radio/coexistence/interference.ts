/**
 * Interference power at a victim receiver from an interferer's EIRP through any propagation
 * model, and I/N against the victim's noise.
 *
 * Document: interference link budget I = EIRP − L_b(d) + G_r − L_f − FDR, with the
 * frequency-dependent rejection (FDR) and on-tune/off-tune bandwidth terms of
 * ITU-R SM.337-6 §2 [M for the clause]; the bandwidth-overlap term 10 log10(B_overlap/B_i)
 * assumes the interferer's power is spread evenly over its bandwidth (common practice, no source).
 *
 * Equations:
 *   (1) L_bw = −10 log10(B_overlap / B_i)                          [dB]  ≥ 0
 *   (2) I = EIRP − L_b(d) + G_r − L_f − L_bw − FDR                 [dBm]
 *   (3) I/N = I − N                                                [dB]
 *   (4) I_max = N + (I/N)_crit                                     [dBm] inverse of (3): largest interference meeting the criterion
 */
import { requireFinite, requireNonNegative, requirePositive } from '../guards'
import type { PropagationModel } from '../propagation/model'
import type { MethodRef, RadioResult } from '../types'
import { resolveCriterion, type CriterionChoice } from './protection-criteria'
import { resolveVictimNoise, type VictimNoise } from './thermal-noise'

const log10 = Math.log10

export const INTERFERENCE_METHOD: MethodRef = {
  id: 'interference-link-budget',
  source:
    'I = EIRP − L_b(d) + G_r − L_f − L_bw − FDR; FDR and bandwidth terms after ITU-R SM.337-6 §2 [M]; path loss from the stated propagation model — register CX-1, CX-2',
}

export const INR_METHOD: MethodRef = {
  id: 'interference-to-noise-ratio',
  source:
    'I/N = I − N with both powers in dBm, and its inverse I_max = N + (I/N)_crit, exact [D]; noise kT0B·F (ITU-R P.372 [M for the clause]) — register CX-1, CX-3',
}

/** Share of the interferer's bandwidth that falls in the victim's channel. */
export type BandwidthOverlap = { overlapBandwidthHz: number; interfererBandwidthHz: number } | { overlapLossDb: number }

/** The interfering path, without the distance. */
export interface InterferencePath {
  interfererEirpDbm: number
  model: PropagationModel
  /** Victim antenna gain toward the interferer [dBi]. */
  victimAntennaGainDbi?: number
  /** Victim feeder loss [dB], positive. */
  victimFeederLossDb?: number
  /** Omitted: the whole interferer power falls in the victim channel (0 dB). */
  bandwidthOverlap?: BandwidthOverlap
  /** Frequency-dependent rejection of the victim receiver toward this interferer [dB], positive. */
  frequencyDependentRejectionDb?: number
}

/** Bandwidth-overlap loss [dB], ≥ 0. */
export function bandwidthOverlapLossDb(overlap: BandwidthOverlap | undefined): number {
  if (overlap === undefined) return 0
  if ('overlapLossDb' in overlap) return requireNonNegative('overlapLossDb', overlap.overlapLossDb)
  const bo = requirePositive('overlapBandwidthHz', overlap.overlapBandwidthHz)
  const bi = requirePositive('interfererBandwidthHz', overlap.interfererBandwidthHz)
  if (bo > bi) {
    throw new RangeError(`overlapBandwidthHz (${bo}) must not exceed interfererBandwidthHz (${bi}).`)
  }
  return -10 * log10(bo / bi) // Eq. (1) [dB]
}

/** Sum of every term of eq. (2) except the path loss [dBm]: I = this − L_b(d). */
export function interferenceBeforePathLossDbm(path: InterferencePath): number {
  const eirp = requireFinite('interfererEirpDbm', path.interfererEirpDbm)
  const g = requireFinite('victimAntennaGainDbi', path.victimAntennaGainDbi ?? 0)
  const lf = requireNonNegative('victimFeederLossDb', path.victimFeederLossDb ?? 0)
  const fdr = requireNonNegative('frequencyDependentRejectionDb', path.frequencyDependentRejectionDb ?? 0)
  if (!path.model || typeof path.model.lossDb !== 'function') throw new RangeError('model must be a PropagationModel.')
  return eirp + g - lf - bandwidthOverlapLossDb(path.bandwidthOverlap) - fdr // Eq. (2) without L_b(d) [dBm]
}

export interface InterferencePower {
  interferenceDbm: number
  pathLossDb: number
  bandwidthOverlapLossDb: number
}

/** Interference power at the victim receiver input at a distance [dBm]. */
export function interferencePowerDbm(opts: InterferencePath & { distanceM: number }): RadioResult<InterferencePower> {
  const distanceM = requirePositive('distanceM', opts.distanceM)
  const before = interferenceBeforePathLossDbm(opts)
  const loss = opts.model.lossDb(distanceM)
  return {
    value: {
      interferenceDbm: before - loss.value.lossDb, // Eq. (2) [dBm]
      pathLossDb: loss.value.lossDb,
      bandwidthOverlapLossDb: bandwidthOverlapLossDb(opts.bandwidthOverlap),
    },
    warnings: [...loss.warnings],
    method: { id: INTERFERENCE_METHOD.id, source: `${INTERFERENCE_METHOD.source}; model: ${loss.method.source}` },
  }
}

/** Interference-to-noise ratio [dB]. */
export function interferenceToNoiseDb(opts: { interferenceDbm: number; noiseDbm: number }): RadioResult<{ inrDb: number }> {
  const inrDb = requireFinite('interferenceDbm', opts.interferenceDbm) - requireFinite('noiseDbm', opts.noiseDbm) // Eq. (3) [dB]
  return { value: { inrDb }, warnings: [], method: INR_METHOD }
}

/**
 * Largest interference power at the victim receiver input that meets an I/N criterion [dBm]
 * (inverse of interferenceToNoiseDb). The victim's noise is given directly or from kTB,
 * bandwidth and noise figure; the criterion is a preset id or a custom `{ inrDb }` (default −6 dB).
 */
export function maxInterferencePowerDbmForInr(opts: {
  victimNoise: VictimNoise
  criterion?: CriterionChoice
}): RadioResult<{ maxInterferenceDbm: number; noiseDbm: number; criterionInrDb: number; criterionDescription: string }> {
  const noise = resolveVictimNoise(opts.victimNoise)
  const crit = resolveCriterion(opts.criterion)
  return {
    value: {
      maxInterferenceDbm: noise.noiseDbm + crit.inrDb, // Eq. (4) [dBm]
      noiseDbm: noise.noiseDbm,
      criterionInrDb: crit.inrDb,
      criterionDescription: crit.description,
    },
    warnings: noise.warnings,
    method: INR_METHOD,
  }
}
