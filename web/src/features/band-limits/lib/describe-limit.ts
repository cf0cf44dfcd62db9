/** Band limits in words and figures, for the list, the form and the history. Pure. */
import type { LimitSpec } from '@shared/radio/compliance/limit-spec'
import { FREQUENCY_UNITS, type FrequencyBandHz } from '@shared/schemas/band-limits'
import { inUnit } from '@shared/schemas/number-with-unit'
import { bestUnitFor, formatFrequencyHz, formatFrequencyRangeHz } from '@/lib/frequency'

/** Two decimals at most, no trailing zeros: 13.979400086720377 → "13.98". */
const figure = (x: number) => String(Number.parseFloat(x.toFixed(2)))
/** A power in dBm with its value in mW or W beside it: "20 dBm (100 mW)". */
export function formatDbm(dbm: number): string {
  const mw = 10 ** (dbm / 10)
  const linear = mw >= 1000 ? `${figure(mw / 1000)} W` : `${figure(mw)} mW`
  return `${figure(dbm)} dBm (${linear})`
}

/** A frequency as the form writes it back, exact: "2400 MHz", "3 kHz". */
export function frequencyText(freqHz: number): string {
  const best = bestUnitFor(freqHz).unit
  const unit = (best in FREQUENCY_UNITS ? best : 'GHz') as keyof typeof FREQUENCY_UNITS
  return `${inUnit(freqHz, unit, FREQUENCY_UNITS)} ${unit}`
}

export const formatBands = (bands: FrequencyBandHz[]) => bands.map((b) => formatFrequencyRangeHz(b)).join(', ')

function gainRuleText(rule: { kind: string; thresholdGainDbi?: number; reductionDbPerDb?: number }): string | null {
  if (rule.kind === 'reduce-conducted-above') return `reduced ${figure(rule.reductionDbPerDb!)} dB per dB of antenna gain above ${figure(rule.thresholdGainDbi!)} dBi`
  if (rule.kind === 'reduce-eirp-below') return `reduced ${figure(rule.reductionDbPerDb!)} dB per dB of antenna gain below ${figure(rule.thresholdGainDbi!)} dBi`
  return null
}

/** One line per limit: "EIRP 20 dBm (100 mW)", "conducted density 8 dBm per 3 kHz". */
export function describeLimit(spec: LimitSpec): string[] {
  switch (spec.kind) {
    case 'eirp':
      return [[`EIRP ${formatDbm(spec.eirpDbm)}`, spec.gainRule && gainRuleText(spec.gainRule)].filter(Boolean).join(', ')]
    case 'erp':
      return [`ERP ${formatDbm(spec.erpDbm)}`]
    case 'eirp-density':
      return [`EIRP density ${figure(spec.eirpDensityDbm)} dBm per ${formatFrequencyHz(spec.referenceBandwidthHz)}`]
    case 'conducted':
      return [[`conducted ${formatDbm(spec.conductedPowerDbm)}`, gainRuleText(spec.gainRule)].filter(Boolean).join(', ')]
    case 'conducted-density':
      return [[`conducted density ${figure(spec.conductedDensityDbm)} dBm per ${formatFrequencyHz(spec.referenceBandwidthHz)}`, gainRuleText(spec.gainRule)].filter(Boolean).join(', ')]
    case 'lesser-of':
      return ['the lesser of:', ...spec.limits.flatMap((l) => describeLimit(l).map((line) => `• ${line}`))]
  }
}

/** The number fields of a limit the form edits: where each sits in the spec, its label and unit. */
export interface LimitNumberField {
  /** Path inside the spec, e.g. "limits.1.eirpDensityDbm". */
  path: string
  label: string
  value: number
  kind: 'power' | 'bandwidth' | 'gain' | 'rate'
}

/** A limit's antenna-gain rule, if it has one with figures (threshold and reduction). */
function gainRuleFields(spec: LimitSpec, prefix: string, labelPrefix: string): LimitNumberField[] {
  const rule = 'gainRule' in spec ? spec.gainRule : undefined
  if (!rule || rule.kind === 'no-reduction') return []
  const side = rule.kind === 'reduce-eirp-below' ? 'below' : 'above'
  return [
    { path: `${prefix}gainRule.thresholdGainDbi`, label: `${labelPrefix}Antenna gain ${side} which the limit is reduced (dBi)`, value: rule.thresholdGainDbi, kind: 'gain' },
    { path: `${prefix}gainRule.reductionDbPerDb`, label: `${labelPrefix}Reduction per dB of gain (dB/dB)`, value: rule.reductionDbPerDb, kind: 'rate' },
  ]
}

const POWER_KEY = { eirp: 'eirpDbm', erp: 'erpDbm', 'eirp-density': 'eirpDensityDbm', conducted: 'conductedPowerDbm', 'conducted-density': 'conductedDensityDbm' } as const
const POWER_LABEL = { eirp: 'EIRP', erp: 'ERP', 'eirp-density': 'EIRP density', conducted: 'Conducted power', 'conducted-density': 'Conducted density' } as const

export function limitNumberFields(spec: LimitSpec, prefix = '', labelPrefix = ''): LimitNumberField[] {
  if (spec.kind === 'lesser-of') return spec.limits.flatMap((l, i) => limitNumberFields(l, `${prefix}limits.${i}.`, `Limit ${i + 1}: `))
  const key = POWER_KEY[spec.kind]
  const fields: LimitNumberField[] = [{ path: `${prefix}${key}`, label: `${labelPrefix}${POWER_LABEL[spec.kind]} (dBm)`, value: (spec as unknown as Record<string, number>)[key]!, kind: 'power' }]
  if (spec.kind === 'eirp-density' || spec.kind === 'conducted-density') {
    fields.push({ path: `${prefix}referenceBandwidthHz`, label: `${labelPrefix}Reference bandwidth`, value: spec.referenceBandwidthHz, kind: 'bandwidth' })
  }
  return [...fields, ...gainRuleFields(spec, prefix, labelPrefix)]
}

/** A limit figure as the form writes it back, with its unit. */
export function limitFieldText(f: LimitNumberField): string {
  switch (f.kind) {
    case 'power':
      return `${f.value} dBm`
    case 'bandwidth':
      return frequencyText(f.value)
    case 'gain':
      return `${f.value} dBi`
    case 'rate':
      return `${f.value} dB/dB`
  }
}

/** The hint beside a limit figure: the units it takes. */
export const LIMIT_FIELD_HINT: Record<LimitNumberField['kind'], string> = {
  power: 'In dBm',
  bandwidth: 'With its unit: Hz, kHz, MHz or GHz',
  gain: 'In dBi',
  rate: 'dB of reduction per dB of gain',
}

/** The spec with the values at `paths` replaced by what the form holds (text, read by the strict parser). */
export function specWithTexts(spec: LimitSpec, texts: Record<string, string>): unknown {
  const copy = structuredClone(spec) as unknown as Record<string, unknown>
  for (const [path, text] of Object.entries(texts)) {
    const parts = path.split('.')
    let at: Record<string, unknown> = copy
    for (const part of parts.slice(0, -1)) at = at[part] as Record<string, unknown>
    at[parts[parts.length - 1]!] = text
  }
  return copy
}
