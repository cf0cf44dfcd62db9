/**
 * Protection criteria as I/N, and the desensitisation they imply.
 *
 * Document: interference-to-noise criteria of ITU-R sharing studies — I/N = −6 dB
 * (ITU-R M.1461 §3.3 and related radiodetermination texts), −10 dB (ITU-R M.1849, M.1464,
 * F.758 §4.1 long-term) — values recalled and NOT verified in the texts [M]; −20 dB is common
 * practice only [M]. The desensitisation Δ = 10 log10(1 + 10^(I/N/10)) is exact [D].
 *
 * Equations:
 *   (1) Δ = 10 log10(1 + 10^(I/N / 10))             [dB]
 *   (2) I/N = 10 log10(10^(Δ/10) − 1)               [dB]  inverse, Δ > 0
 */
import { requireFinite, requirePositive } from '../guards'
import type { MethodRef, RadioResult } from '../types'

export const DESENSITISATION_METHOD: MethodRef = {
  id: 'desensitisation-from-inr',
  source: 'Δ = 10 log10(1 + 10^(I/N/10)) and its inverse, exact [D] (noise and interference add in power) — register 10-1…10-4',
}

/** A named I/N criterion; the status tag says how far its value is verified. */
export interface ProtectionCriterion {
  id: string
  inrDb: number
  description: string
  status: '[M]' | '[V-S]' | '[D]'
}

export const PROTECTION_CRITERIA = {
  'i-n-minus-6': {
    id: 'i-n-minus-6',
    inrDb: -6,
    description:
      'I/N = −6 dB: radiolocation receivers and generic mobile/fixed sharing studies (ITU-R M.1461 §3.3, M.1464, M.1638) [M] — value recalled, not verified in the texts.',
    status: '[M]',
  },
  'i-n-minus-10': {
    id: 'i-n-minus-10',
    inrDb: -10,
    description:
      'I/N = −10 dB: meteorological and aeronautical radionavigation radars, fixed-service long-term criterion (ITU-R M.1849, M.1464, F.758 §4.1) [M] — value recalled, not verified in the texts.',
    status: '[M]',
  },
  'i-n-minus-20': {
    id: 'i-n-minus-20',
    inrDb: -20,
    description: 'I/N = −20 dB: sometimes used for the most sensitive or safety systems; common practice only, no published source confirmed [M].',
    status: '[M]',
  },
} as const satisfies Record<string, ProtectionCriterion>

export type ProtectionCriterionId = keyof typeof PROTECTION_CRITERIA
export const DEFAULT_PROTECTION_CRITERION: ProtectionCriterionId = 'i-n-minus-6'

/** A criterion by preset id, or a custom I/N in dB. */
export type CriterionChoice = ProtectionCriterionId | { inrDb: number; description?: string }

export function resolveCriterion(choice: CriterionChoice | undefined): { inrDb: number; description: string } {
  const c = choice ?? DEFAULT_PROTECTION_CRITERION
  if (typeof c === 'string') {
    const preset = (PROTECTION_CRITERIA as Record<string, ProtectionCriterion>)[c]
    if (!preset) throw new RangeError(`criterion '${c}' is not a known preset (${Object.keys(PROTECTION_CRITERIA).join(', ')}).`)
    return { inrDb: preset.inrDb, description: preset.description }
  }
  const inrDb = requireFinite('criterion.inrDb', c.inrDb)
  return { inrDb, description: c.description ?? `I/N = ${inrDb} dB (given by the user).` }
}

/** Rise of the noise floor caused by interference at a given I/N [dB]. */
export function desensitisationDb(opts: { inrDb: number }): RadioResult<{ desensitisationDb: number }> {
  const inr = requireFinite('inrDb', opts.inrDb)
  return {
    value: { desensitisationDb: 10 * Math.log10(1 + 10 ** (inr / 10)) }, // Eq. (1) [dB]
    warnings: [],
    method: DESENSITISATION_METHOD,
  }
}

/** I/N that causes a given desensitisation [dB] (inverse; desensitisation must be > 0). */
export function inrForDesensitisationDb(opts: { desensitisationDb: number }): RadioResult<{ inrDb: number }> {
  const d = requirePositive('desensitisationDb', opts.desensitisationDb)
  return { value: { inrDb: 10 * Math.log10(10 ** (d / 10) - 1) }, warnings: [], method: DESENSITISATION_METHOD } // Eq. (2) [dB]
}
