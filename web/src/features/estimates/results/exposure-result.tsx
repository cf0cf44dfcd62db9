/** RF exposure screening: each point's power density as a fraction of the reference level, with the caution where it applies. */
import type { ExposureScreeningOutput } from '@shared/calculations'
import { CAUTION_LINES } from '@/components/cautions/estimate-caution'
import { Notice } from '@/components/ui/notice'
import { fmt, fmtHz, fmtM } from '../lib/units'
import { Figure } from './result-parts'

const CAUTION_WORDS = { none: 'below the caution threshold', approaching: 'approaching the reference level', above: 'above the reference level' } as const

export function ExposureResult({ value }: { value: ExposureScreeningOutput }) {
  return (
    <div className="flex min-w-0 flex-col gap-4">
      <Notice tone={value.worstCaution === 'none' ? 'info' : 'danger'} title={`RF exposure: worst point ${CAUTION_WORDS[value.worstCaution]}`}>
        <p>{value.notice}</p>
        <p>{CAUTION_LINES[2]}</p>
      </Notice>
      <dl className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
        <Figure label="Reference level">{fmt(value.referenceLevelWPerM2, 'W/m²', 3)}</Figure>
        <Figure label="Reached at (same assumptions)">{fmtM(value.complianceDistanceM)}</Figure>
        <Figure label="EIRP and frequency">
          {fmt(value.eirpDbm, 'dBm')} at {fmtHz(value.freqHz)}
        </Figure>
      </dl>
      <p className="text-sm break-words text-ink-muted">
        Reference level: {value.referenceLevelBasis}; {value.referenceLevelFormula} ({value.referenceLevelStatus})
      </p>
      <ol aria-label="Points screened" className="flex flex-col gap-2">
        {value.points.map((p, k) => (
          <li key={k} className={`rounded-control border-l-4 px-3 py-2 ${p.caution === 'none' ? 'border-rule' : 'border-danger bg-danger-soft'}`}>
            <p className="font-semibold">
              Point {k + 1} at {fmtM(p.distanceM)}: {fmt(p.fractionOfLevel * 100, '%', 1)} of the reference level
            </p>
            <p className="text-sm">Power density {fmt(p.powerDensityWPerM2, 'W/m²', 4)}</p>
            {p.cautionText && <p className="text-sm font-semibold">{p.cautionText}</p>}
          </li>
        ))}
      </ol>
    </div>
  )
}
