/** A compliance verdict in plain words: exceeds / within / inconclusive, the margin and its 95 % interval, the limit and its citation. */
import { EnforcementCaution } from '@/components/cautions/enforcement-caution'
import { fmt } from '../lib/units'
import type { ComplianceVerdictOutput as VerdictOutput } from '@shared/calculations'
import { Figure } from './result-parts'

const TONE: Record<VerdictOutput['verdict'], string> = {
  exceeds: 'border-danger bg-danger-soft',
  within: 'border-ok bg-ok-soft',
  inconclusive: 'border-caution bg-caution-soft',
}

export function verdictWords(v: VerdictOutput): string {
  const i = v.marginIntervalDb
  const interval = i ? ` (95 % interval of the margin ${fmt(i.lowDb, 'dB')} to ${fmt(i.highDb, 'dB')})` : ' (no interval given: this rests on the central value alone)'
  if (v.verdict === 'exceeds') return `Exceeds the limit by ${fmt(v.marginDb, 'dB')}${interval}.`
  if (v.verdict === 'within') return `Within the limit: ${fmt(-v.marginDb, 'dB')} below it${interval}.`
  return `Inconclusive: the interval of the margin reaches both sides of the limit${interval}; the central estimate is ${fmt(v.marginDb, 'dB')} from it.`
}

export function VerdictResult({ value }: { value: VerdictOutput }) {
  return (
    <div className="flex min-w-0 flex-col gap-4">
      <div className={`rounded-control border-l-4 px-4 py-3 ${TONE[value.verdict]}`}>
        <p className="text-2xl font-bold capitalize">{value.verdict}</p>
        <p>{verdictWords(value)}</p>
      </div>
      <dl className="grid gap-3 sm:grid-cols-2">
        {value.eirpDbm !== undefined && (
          <Figure label={value.eirpFrom === 'calculation' ? 'EIRP judged (from the stored estimate)' : 'EIRP judged'}>
            {fmt(value.eirpDbm, 'dBm')}
            {value.eirpIntervalDbm ? ` (${fmt(value.eirpIntervalDbm.lowDbm, 'dBm')} to ${fmt(value.eirpIntervalDbm.highDbm, 'dBm')})` : ''}
          </Figure>
        )}
        <Figure label="Margin (EIRP − limit)">{fmt(value.marginDb, 'dB')}</Figure>
        <Figure label="Limit applied, as EIRP">{fmt(value.appliedLimitEirpDbm, 'dBm')}</Figure>
      </dl>
      <p className="text-sm break-words">
        <span className="font-semibold">Limit from:</span> {value.citation}
        {value.limitStatus ? ` — ${value.limitStatus}` : ''}
      </p>
      <EnforcementCaution />
      {value.derivation && value.derivation.length > 0 && (
        <ul aria-label="How the limit was applied" className="list-disc pl-5 text-sm">
          {value.derivation.map((d) => (
            <li key={d}>{d}</li>
          ))}
        </ul>
      )}
    </div>
  )
}
