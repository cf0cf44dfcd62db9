/**
 * Limits as data, and the EIRP limit each one comes to for a given installation.
 *
 * Document: the forms in which licence-exempt and licence limits are written — e.i.r.p.,
 * e.r.p. (ITU RR Nos. 1.161/1.162, EIRP = ERP + 2.15 dB), e.i.r.p. spectral density, or
 * conducted power with an antenna-gain rule. Gain rules: 47 CFR §15.247(b)(4) dB-for-dB above
 * 6 dBi [V-S; paragraph numbering M]; §15.247(c)(1)(i) 2.4 GHz fixed point-to-point 1 dB per
 * 3 dB above 6 dBi [V-S; numbering M]; §15.407(a)(1)(iii) point-to-point 1 dB per dB above
 * 23 dBi [V-S]; §15.255(c) 57–71 GHz fixed point-to-point EIRP reduced 2 dB per dB below
 * 51 dBi [M; same wording verified in §15.258(b)].
 *
 * Equations:
 *   (1) ΔP = max(0, G − G_T)·r                         [dB]  conducted-power reduction above G_T
 *   (2) EIRP_lim = P_lim − ΔP − L_f + G                [dBm]
 *   (3) ΔE = max(0, G_T − G)·r                         [dB]  EIRP reduction below G_T
 *   (4) EIRP_lim = ERP_lim + 2.15                      [dBm]
 *   (5) P_lim = D_lim + 10 log10(max(B_e, B_ref)/B_ref) [dBm]  density limit over the emission
 */
import { DIPOLE_GAIN_DBI } from '../constants'
import { requireFinite, requireNonEmpty, requireNonNegative, requirePositive } from '../guards'
import type { MethodRef, RadioResult } from '../types'

const log10 = Math.log10

/** Reduction of the conducted-power limit when the antenna gain exceeds a threshold. */
export type ConductedGainRule =
  | { kind: 'no-reduction'; citation?: string }
  | { kind: 'reduce-conducted-above'; thresholdGainDbi: number; reductionDbPerDb: number; citation?: string }

/** Reduction of an EIRP limit when the antenna gain falls below a threshold. */
export type EirpGainRule = { kind: 'reduce-eirp-below'; thresholdGainDbi: number; reductionDbPerDb: number; citation?: string }

/** A limit as written in a regulation or an authorisation. Powers in dBm, densities in dBm per referenceBandwidthHz. */
export type LimitSpec =
  | { kind: 'eirp'; eirpDbm: number; gainRule?: EirpGainRule }
  | { kind: 'erp'; erpDbm: number }
  | { kind: 'eirp-density'; eirpDensityDbm: number; referenceBandwidthHz: number }
  | { kind: 'conducted'; conductedPowerDbm: number; gainRule: ConductedGainRule }
  | { kind: 'conducted-density'; conductedDensityDbm: number; referenceBandwidthHz: number; gainRule: ConductedGainRule }
  /** The lowest of several limits applies (e.g. "250 mW or 11 dBm + 10 log B, whichever is less"). */
  | { kind: 'lesser-of'; limits: LimitSpec[] }

/** Named gain rules of the regulations in the band-limit reference. */
export const GAIN_RULES = {
  noReduction: { kind: 'no-reduction', citation: 'no antenna-gain reduction' },
  dbForDbAbove6Dbi: {
    kind: 'reduce-conducted-above',
    thresholdGainDbi: 6,
    reductionDbPerDb: 1,
    citation: '47 CFR §15.247(b)(4): conducted power reduced dB for dB of gain above 6 dBi [V-S; paragraph numbering M]',
  },
  onePerThreeAbove6DbiPointToPoint: {
    kind: 'reduce-conducted-above',
    thresholdGainDbi: 6,
    reductionDbPerDb: 1 / 3,
    citation: '47 CFR §15.247(c)(1)(i): 2.4 GHz fixed point-to-point, 1 dB per 3 dB of gain above 6 dBi [V-S; numbering M]',
  },
  dbForDbAbove23DbiPointToPoint: {
    kind: 'reduce-conducted-above',
    thresholdGainDbi: 23,
    reductionDbPerDb: 1,
    citation: '47 CFR §15.407(a)(1)(iii): fixed point-to-point up to 23 dBi without reduction, then 1 dB per dB [V-S]',
  },
  twoPerDbBelow51Dbi: {
    kind: 'reduce-eirp-below',
    thresholdGainDbi: 51,
    reductionDbPerDb: 2,
    citation: '47 CFR §15.255(c): 57–71 GHz outdoor fixed point-to-point, EIRP reduced 2 dB per dB of gain below 51 dBi [M; same wording verified in §15.258(b)]',
  },
} as const satisfies Record<string, ConductedGainRule | EirpGainRule>

/** What the installation brings to the limit: needed by gain rules and density limits. */
export interface InstallationFacts {
  /** Maximum antenna gain of the installation [dBi]: needed for conducted limits and EIRP gain rules. */
  antennaGainDbi?: number
  /** Emission bandwidth [Hz]: needed for density limits. */
  emissionBandwidthHz?: number
  /** Feeder loss between transmitter and antenna [dB]: used with conducted limits, 0 if omitted. */
  feederLossDb?: number
}

export const APPLIED_LIMIT_METHOD: MethodRef = {
  id: 'applied-limit-eirp',
  source:
    'Limit as written turned into an EIRP: ERP + 2.15 dB (ITU RR Nos. 1.161/1.162 [M for the wording]); density × emission bandwidth [D]; ' +
    'conducted − gain-rule reduction − feeder + gain, gain rules of 47 CFR §§15.247(b)(4), 15.247(c)(1)(i), 15.407(a)(1)(iii) [V-S], 15.255(c) [M] — register 11-1, 11-3, 11-4, 11-5',
}

export interface AppliedLimit {
  limitEirpDbm: number
  /** One plain line per step, e.g. "conducted 30 dBm − 18 dB (gain rule) + 24 dBi = 36 dBm EIRP". */
  derivation: string[]
}

export interface AppliedLimitOptions extends InstallationFacts {
  /** The limit as written in the regulation or authorisation. */
  spec: LimitSpec
}

const f2 = (v: number): string => String(+v.toFixed(2))

function needGain(facts: InstallationFacts, what: string): number {
  if (facts.antennaGainDbi === undefined) throw new RangeError(`antennaGainDbi is required for ${what}.`)
  return requireFinite('antennaGainDbi', facts.antennaGainDbi)
}

function densityToTotalDbm(densityDbm: number, refHz: number, facts: InstallationFacts, warnings: string[]): number {
  requirePositive('referenceBandwidthHz', refHz)
  if (facts.emissionBandwidthHz === undefined) throw new RangeError('emissionBandwidthHz is required for a spectral-density limit.')
  const be = requirePositive('emissionBandwidthHz', facts.emissionBandwidthHz)
  if (be < refHz) warnings.push('Emission narrower than the density reference bandwidth: the whole emission counts against one reference bandwidth.')
  warnings.push('Density limit turned into a total power assuming the emission is flat across its bandwidth; a peaked spectrum needs a density measurement.')
  return requireFinite('densityDbm', densityDbm) + 10 * log10(Math.max(be, refHz) / refHz) // Eq. (5) [dBm]
}

function conductedToEirp(pLimDbm: number, rule: ConductedGainRule, facts: InstallationFacts, lines: string[], warnings: string[]): number {
  const g = needGain(facts, 'a conducted-power limit')
  let reduction = 0
  if (rule.kind === 'reduce-conducted-above') {
    const rate = requireNonNegative('gainRule.reductionDbPerDb', rule.reductionDbPerDb)
    reduction = Math.max(0, g - requireFinite('gainRule.thresholdGainDbi', rule.thresholdGainDbi)) * rate // Eq. (1) [dB]
  } else if (rule.kind !== 'no-reduction') {
    throw new RangeError(`gainRule.kind '${String((rule as { kind: unknown }).kind)}' is not a conducted-power gain rule.`)
  }
  const lf = requireNonNegative('feederLossDb', facts.feederLossDb ?? 0)
  if (facts.feederLossDb === undefined) {
    warnings.push('Feeder loss taken as 0 dB: the EIRP-equivalent of a conducted limit is then at its highest; give feederLossDb when known.')
  }
  const eirp = pLimDbm - reduction - lf + g // Eq. (2) [dBm]
  lines.push(
    `conducted ${f2(pLimDbm)} dBm − ${f2(reduction)} dB (gain rule) − ${f2(lf)} dB feeder + ${f2(g)} dBi = ${f2(eirp)} dBm EIRP` +
      (rule.citation ? ` (${rule.citation})` : ''),
  )
  return eirp
}

/** The EIRP limit [dBm] that a limit comes to for this installation, with its derivation. */
export function appliedLimitEirpDbm(opts: AppliedLimitOptions): RadioResult<AppliedLimit> {
  if (!opts || typeof opts !== 'object') throw new RangeError('appliedLimitEirpDbm needs an options object with spec.')
  const { spec, ...facts } = opts
  const lines: string[] = []
  const warnings: string[] = []
  const limitEirpDbm = apply(spec, facts, lines, warnings)
  return { value: { limitEirpDbm, derivation: lines }, warnings: [...new Set(warnings)], method: APPLIED_LIMIT_METHOD }
}

function apply(spec: LimitSpec, facts: InstallationFacts, lines: string[], warnings: string[]): number {
  switch (spec?.kind) {
    case 'eirp': {
      const e = requireFinite('eirpDbm', spec.eirpDbm)
      if (!spec.gainRule) {
        lines.push(`EIRP limit ${f2(e)} dBm`)
        return e
      }
      const g = needGain(facts, 'an EIRP limit with a gain rule')
      const rate = requireNonNegative('gainRule.reductionDbPerDb', spec.gainRule.reductionDbPerDb)
      const reduction = Math.max(0, requireFinite('gainRule.thresholdGainDbi', spec.gainRule.thresholdGainDbi) - g) * rate // Eq. (3) [dB]
      lines.push(`EIRP ${f2(e)} dBm − ${f2(reduction)} dB for ${f2(g)} dBi = ${f2(e - reduction)} dBm (${spec.gainRule.citation ?? 'gain rule'})`)
      return e - reduction
    }
    case 'erp': {
      const e = requireFinite('erpDbm', spec.erpDbm) + DIPOLE_GAIN_DBI // Eq. (4) [dBm]
      lines.push(`ERP limit ${f2(spec.erpDbm)} dBm + ${DIPOLE_GAIN_DBI} dB = ${f2(e)} dBm EIRP`)
      return e
    }
    case 'eirp-density': {
      const e = densityToTotalDbm(spec.eirpDensityDbm, spec.referenceBandwidthHz, facts, warnings)
      lines.push(`EIRP density ${f2(spec.eirpDensityDbm)} dBm per ${spec.referenceBandwidthHz} Hz over ${facts.emissionBandwidthHz} Hz = ${f2(e)} dBm EIRP`)
      return e
    }
    case 'conducted':
      return conductedToEirp(requireFinite('conductedPowerDbm', spec.conductedPowerDbm), spec.gainRule, facts, lines, warnings)
    case 'conducted-density': {
      const p = densityToTotalDbm(spec.conductedDensityDbm, spec.referenceBandwidthHz, facts, warnings)
      lines.push(`conducted density ${f2(spec.conductedDensityDbm)} dBm per ${spec.referenceBandwidthHz} Hz over ${facts.emissionBandwidthHz} Hz = ${f2(p)} dBm`)
      return conductedToEirp(p, spec.gainRule, facts, lines, warnings)
    }
    case 'lesser-of': {
      requireNonEmpty('limits', spec.limits)
      const values = spec.limits.map((s) => apply(s, facts, lines, warnings))
      const min = Math.min(...values)
      lines.push(`lesser of ${values.map(f2).join(', ')} dBm = ${f2(min)} dBm EIRP`)
      return min
    }
    default:
      throw new RangeError(`limit kind '${String((spec as { kind?: unknown })?.kind)}' is not known.`)
  }
}
