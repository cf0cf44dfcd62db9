/**
 * Coexistence assessment: I/N at the victim against a protection criterion, the EIRP
 * reduction that would meet it, and the separation distance at which it is met.
 *
 * Document: I/N protection-criterion method of ITU-R sharing studies (criteria in
 * protection-criteria.ts, values [M]); the separation distance inverts the propagation model
 * (its distanceM), so it is exactly as good as that model. Link budget in interference.ts.
 *
 * Equations:
 *   (1) m = I/N − (I/N)_crit                                   [dB]  positive = criterion exceeded
 *   (2) ΔEIRP = max(0, m)                                      [dB]  reduction needed
 *   (2b) EIRP_max = EIRP − m                                   [dBm] highest EIRP meeting the criterion
 *   (3) L_req = (EIRP + G_r − L_f − L_bw − FDR) − (N + (I/N)_crit)   [dB]  path loss that meets it
 *   (4) d_sep = L_b⁻¹(L_req)                                   [m]
 */
import { requirePositive } from '../guards'
import type { MethodRef, RadioResult } from '../types'
import { interferenceBeforePathLossDbm, interferencePowerDbm, interferenceToNoiseDb, type InterferencePath } from './interference'
import { resolveCriterion, desensitisationDb, type CriterionChoice } from './protection-criteria'
import { resolveVictimNoise, type VictimNoise } from './thermal-noise'

export const COEXISTENCE_METHOD: MethodRef = {
  id: 'coexistence-i-over-n',
  source:
    'I/N against a protection criterion (ITU-R sharing-study method, criteria [M]); Δ = 10 log10(1 + 10^(I/N/10)) [D]; separation through the model inverse — register CX-1',
}

export interface CoexistenceOptions extends InterferencePath {
  victimNoise: VictimNoise
  /** Preset id or a custom I/N; default 'i-n-minus-6'. */
  criterion?: CriterionChoice
}

export interface CoexistenceAssessment {
  interferenceDbm: number
  noiseDbm: number
  inrDb: number
  desensitisationDb: number
  criterionInrDb: number
  criterionDescription: string
  /** I/N minus the criterion [dB]; positive means the criterion is exceeded. */
  marginDb: number
  meetsCriterion: boolean
  /** EIRP reduction that would meet the criterion at this distance [dB] (0 when already met). */
  eirpReductionDb: number
  /** Highest interferer EIRP that meets the criterion at this distance [dBm]. */
  maxEirpDbm: number
  /** Path loss at which the criterion is met exactly [dB]. */
  requiredPathLossDb: number
  /** Distance at which the criterion is met exactly [m]. */
  separationDistanceM: number
}

/** Path loss and distance at which the interference meets the criterion exactly. */
export function separationDistanceM(
  opts: InterferencePath & { victimNoise: VictimNoise; criterion?: CriterionChoice },
): RadioResult<{ separationDistanceM: number; requiredPathLossDb: number }> {
  const noise = resolveVictimNoise(opts.victimNoise)
  const crit = resolveCriterion(opts.criterion)
  const requiredPathLossDb = interferenceBeforePathLossDbm(opts) - (noise.noiseDbm + crit.inrDb) // Eq. (3) [dB]
  const inverse = opts.model.distanceM(requiredPathLossDb) // Eq. (4) [m]
  return {
    value: { separationDistanceM: inverse.value.distanceM, requiredPathLossDb },
    warnings: [...noise.warnings, ...inverse.warnings],
    method: { id: COEXISTENCE_METHOD.id, source: `${COEXISTENCE_METHOD.source}; model: ${inverse.method.source}` },
  }
}

/** I/N, desensitisation, margin, EIRP reduction and separation distance for one interferer. */
export function assessCoexistence(opts: CoexistenceOptions & { distanceM: number }): RadioResult<CoexistenceAssessment> {
  requirePositive('distanceM', opts.distanceM)
  const noise = resolveVictimNoise(opts.victimNoise)
  const crit = resolveCriterion(opts.criterion)
  const i = interferencePowerDbm(opts)
  const inrDb = interferenceToNoiseDb({ interferenceDbm: i.value.interferenceDbm, noiseDbm: noise.noiseDbm }).value.inrDb
  const marginDb = inrDb - crit.inrDb // Eq. (1) [dB]
  const sep = separationDistanceM({ ...opts, victimNoise: { noiseDbm: noise.noiseDbm } })
  return {
    value: {
      interferenceDbm: i.value.interferenceDbm,
      noiseDbm: noise.noiseDbm,
      inrDb,
      desensitisationDb: desensitisationDb({ inrDb }).value.desensitisationDb,
      criterionInrDb: crit.inrDb,
      criterionDescription: crit.description,
      marginDb,
      meetsCriterion: marginDb <= 0,
      eirpReductionDb: Math.max(0, marginDb), // Eq. (2) [dB]
      maxEirpDbm: opts.interfererEirpDbm - marginDb, // Eq. (2b) [dBm]
      requiredPathLossDb: sep.value.requiredPathLossDb,
      separationDistanceM: sep.value.separationDistanceM,
    },
    warnings: dedupe([...noise.warnings, ...i.warnings, ...sep.warnings]),
    method: { id: COEXISTENCE_METHOD.id, source: `${COEXISTENCE_METHOD.source}; ${i.method.source}` },
  }
}

function dedupe(list: string[]): string[] {
  return [...new Set(list)]
}
