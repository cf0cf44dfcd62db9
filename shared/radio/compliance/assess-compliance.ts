/**
 * Compliance verdict: an EIRP (and optionally its 95 % interval) against a limit.
 *
 * Document: a limit is "not to be exceeded": at the limit is within, above it exceeds. With an
 * interval (JCGM 100:2008 expanded uncertainty, k = 2), the verdict is 'exceeds' only when the
 * whole interval is above the limit, 'within' only when the whole interval is at or below it,
 * and 'inconclusive' when it straddles the limit (a decision rule of the trade; the office's
 * own procedure governs). The limit is turned into an EIRP by limit-spec.ts.
 *
 * Equations:
 *   (1) m = EIRP − EIRP_lim              [dB]  positive = over the limit
 *   (2) m_low = EIRP_low − EIRP_lim, m_high = EIRP_high − EIRP_lim   [dB]
 */
import { requireFinite } from '../guards'
import type { CoverageInterval, MethodRef, RadioResult } from '../types'
import { appliedLimitEirpDbm, type InstallationFacts, type LimitSpec } from './limit-spec'

export const COMPLIANCE_METHOD: MethodRef = {
  id: 'eirp-limit-verdict',
  source:
    'EIRP against the limit as written (cited per limit); interval decision with the 95 % interval of JCGM 100:2008 (k = 2); limit applied as in applied-limit-eirp — register 11-1…11-5',
}

export type ComplianceVerdict = 'exceeds' | 'within' | 'inconclusive'

/** A limit and the regulation or authorisation it comes from. Band-limit entries fit this shape. */
export interface CitedLimit {
  spec: LimitSpec
  citation: string
  /** Status tag of the limit value ([V-S], [M]…), carried into the result. */
  status?: string
}

export interface ComplianceOptions extends InstallationFacts {
  eirpDbm: number
  /** 95 % interval of the EIRP as absolute levels [dBm]; must contain eirpDbm. */
  eirpIntervalDbm?: { lowDbm: number; highDbm: number }
  limit: CitedLimit
}

export interface ComplianceAssessment {
  verdict: ComplianceVerdict
  /** EIRP minus the applied limit [dB]; positive = over the limit. */
  marginDb: number
  /** The margin at the ends of the EIRP interval [dB], when an interval was given. */
  marginIntervalDb?: { lowDb: number; highDb: number }
  appliedLimitEirpDbm: number
  citation: string
  limitStatus?: string
  derivation: string[]
}

/**
 * Verdict of an EIRP against a limit. The result's `interval` bounds the margin (quantity
 * 'marginDb', absolute margins in dB), so a finding reads "exceeds by X dB (95 % interval Y–Z dB)".
 */
export function assessCompliance(opts: ComplianceOptions): RadioResult<ComplianceAssessment> {
  const eirp = requireFinite('eirpDbm', opts.eirpDbm)
  if (!opts.limit || typeof opts.limit.citation !== 'string' || opts.limit.citation.trim() === '') {
    throw new RangeError('limit.citation must name the regulation or authorisation the limit comes from.')
  }
  const applied = appliedLimitEirpDbm({
    spec: opts.limit.spec,
    antennaGainDbi: opts.antennaGainDbi,
    emissionBandwidthHz: opts.emissionBandwidthHz,
    feederLossDb: opts.feederLossDb,
  })
  const lim = applied.value.limitEirpDbm
  const marginDb = eirp - lim // Eq. (1) [dB]
  let verdict: ComplianceVerdict = marginDb > 0 ? 'exceeds' : 'within'
  let marginIntervalDb: { lowDb: number; highDb: number } | undefined
  const warnings = [...applied.warnings]
  if (opts.eirpIntervalDbm) {
    const low = requireFinite('eirpIntervalDbm.lowDbm', opts.eirpIntervalDbm.lowDbm)
    const high = requireFinite('eirpIntervalDbm.highDbm', opts.eirpIntervalDbm.highDbm)
    if (!(low <= eirp && eirp <= high)) {
      throw new RangeError(`eirpIntervalDbm (${low} to ${high} dBm) must contain eirpDbm (${eirp} dBm).`)
    }
    marginIntervalDb = { lowDb: low - lim, highDb: high - lim } // Eq. (2) [dB]
    verdict = marginIntervalDb.lowDb > 0 ? 'exceeds' : marginIntervalDb.highDb <= 0 ? 'within' : 'inconclusive'
  } else {
    warnings.push('No uncertainty interval given: the verdict rests on the central value alone.')
  }
  if (opts.limit.status?.includes('[M]')) {
    warnings.push(`The limit value is marked ${opts.limit.status}: recalled, not verified in the regulation text. Check it before relying on it.`)
  }
  return {
    value: {
      verdict,
      marginDb,
      marginIntervalDb,
      appliedLimitEirpDbm: lim,
      citation: opts.limit.citation,
      limitStatus: opts.limit.status,
      derivation: applied.value.derivation,
    },
    ...(marginIntervalDb ? { interval: marginInterval(marginIntervalDb) } : {}),
    warnings,
    method: COMPLIANCE_METHOD,
  }
}

function marginInterval(m: { lowDb: number; highDb: number }): CoverageInterval {
  return { quantity: 'marginDb', low: m.lowDb, high: m.highDb, basis: 'margin at the ends of the 95 % interval of the EIRP judged' }
}
