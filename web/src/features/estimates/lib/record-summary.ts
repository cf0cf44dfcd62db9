/** One line for a stored record in the case's list: its main figure with its unit and interval. */
import {
  candidateSourcesOutputSchema,
  coexistenceOutputSchema,
  complianceVerdictOutputSchema,
  eirpFitOutputSchema,
  eirpSinglePointOutputSchema,
  exposureScreeningOutputSchema,
  sourceLocateOutputSchema,
} from '@shared/calculations'
import type { CalculationView } from '@shared/schemas/views'
import { fmt, fmtM } from './units'

export function recordSummary(r: Pick<CalculationView, 'kind' | 'outputs'>): string {
  const v = r.outputs.value
  if (r.kind === 'eirp_single_point') {
    const p = eirpSinglePointOutputSchema.safeParse(v)
    if (p.success) {
      const i = p.data.eirpIntervalDbm
      return `EIRP ${fmt(p.data.eirpDbm, 'dBm')}${i ? ` (95 %: ${fmt(i.lowDbm, 'dBm')} to ${fmt(i.highDbm, 'dBm')})` : ''}, ERP ${fmt(p.data.erpDbm, 'dBm')}`
    }
  }
  if (r.kind === 'compliance_verdict') {
    const p = complianceVerdictOutputSchema.safeParse(v)
    if (p.success) {
      const i = p.data.marginIntervalDb
      return `${p.data.verdict}: margin ${fmt(p.data.marginDb, 'dB')}${i ? ` (95 %: ${fmt(i.lowDb, 'dB')} to ${fmt(i.highDb, 'dB')})` : ''} against ${fmt(p.data.appliedLimitEirpDbm, 'dBm')} EIRP`
    }
  }
  if (r.kind === 'candidate_sources') {
    const p = candidateSourcesOutputSchema.safeParse(v)
    if (p.success) {
      const top = p.data.candidates[0]
      return `${p.data.overlappingCount} authorised station(s) overlap${top ? `; first ${top.stationCode} (${top.licensee})` : ''}`
    }
  }
  if (r.kind === 'eirp_fit') {
    const p = eirpFitOutputSchema.safeParse(v)
    if (p.success) {
      const i = p.data.eirpInterval95Dbm
      return `EIRP ${fmt(p.data.eirpDbm, 'dBm')}${i ? ` (95 %: ${fmt(i.lowDbm, 'dBm')} to ${fmt(i.highDbm, 'dBm')})` : ''}, n = ${p.data.exponent.toFixed(2)}, ${p.data.pointCount} readings`
    }
  }
  if (r.kind === 'source_locate') {
    const p = sourceLocateOutputSchema.safeParse(v)
    if (p.success) return `Source at ${p.data.latDeg.toFixed(5)}°, ${p.data.lonDeg.toFixed(5)}°; 95 % ellipse ${fmtM(p.data.ellipse95.semiMajorM)} by ${fmtM(p.data.ellipse95.semiMinorM)}`
  }
  if (r.kind === 'coexistence') {
    const p = coexistenceOutputSchema.safeParse(v)
    if (p.success) return `I/N ${fmt(p.data.inrDb, 'dB')} against ${fmt(p.data.criterionInrDb, 'dB')}; ${p.data.meetsCriterion ? 'meets it' : `reduce the EIRP by ${fmt(p.data.eirpReductionDb, 'dB')}`}`
  }
  if (r.kind === 'exposure_screening') {
    const p = exposureScreeningOutputSchema.safeParse(v)
    if (p.success) return `RF exposure screening at ${p.data.points.length} point(s): worst ${p.data.worstCaution === 'none' ? 'below the caution threshold' : p.data.worstCaution === 'above' ? 'above the reference level' : 'approaching the reference level'}`
  }
  return 'Open the record to read its figures.'
}
