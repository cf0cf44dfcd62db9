/**
 * An uncertainty budget as horizontal bars: each contribution's share of the combined variance
 * u_c² (so the bars add up to 100 %), with its |c_i|·u(x_i) in dB. Plain HTML, no chart library.
 */
import { useId } from 'react'
import type { BudgetBarsProps } from './chart-types'
import { budgetBars } from './lib/chart-data'

const dB = (v: number) => `${v.toFixed(2)} dB`

export function BudgetBars({ title, rows, combinedStandardUncertaintyDb, expandedUncertaintyDb, coverageFactor }: BudgetBarsProps) {
  const titleId = useId()
  const bars = budgetBars(rows)
  return (
    <figure aria-labelledby={titleId} className="flex flex-col gap-2">
      <figcaption id={titleId} className="font-semibold">
        {title}
      </figcaption>
      <p className="text-sm text-ink-muted">Each bar is the contribution’s share of the combined variance u<sub>c</sub>².</p>
      <ul className="flex flex-col gap-1.5">
        {bars.map((b) => (
          <li key={b.name} className="grid grid-cols-[minmax(0,1fr)_auto] items-center gap-x-3 gap-y-0.5 sm:grid-cols-[minmax(8rem,14rem)_minmax(0,1fr)_auto]">
            <span className="text-sm">{b.name}</span>
            <span
              role="meter"
              aria-label={`${b.name}: share of the variance`}
              aria-valuemin={0}
              aria-valuemax={100}
              aria-valuenow={b.percent}
              aria-valuetext={`${b.percent.toFixed(1)} %`}
              className="col-span-2 h-3 overflow-hidden rounded-sm bg-rule/50 sm:col-span-1"
            >
              <span className="block h-full bg-signal" style={{ width: `${Math.min(100, b.percent)}%` }} />
            </span>
            <span className="col-start-2 row-start-1 text-right font-mono text-sm sm:col-start-3">
              {b.percent.toFixed(1)} % · {dB(b.contributionDb)}
            </span>
          </li>
        ))}
      </ul>
      {(combinedStandardUncertaintyDb !== undefined || expandedUncertaintyDb !== undefined) && (
        <p className="font-mono text-sm">
          {combinedStandardUncertaintyDb !== undefined && <>u<sub>c</sub> = {dB(combinedStandardUncertaintyDb)}</>}
          {combinedStandardUncertaintyDb !== undefined && expandedUncertaintyDb !== undefined && ' · '}
          {expandedUncertaintyDb !== undefined && (
            <>
              U = {dB(expandedUncertaintyDb)}
              {coverageFactor !== undefined && ` (k = ${coverageFactor})`}
            </>
          )}
        </p>
      )}
    </figure>
  )
}
