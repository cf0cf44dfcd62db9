/** A stored calculation in brief (for the finding form's checklist) and in full (for the review). */
import { format, parseISO } from 'date-fns'
import type { CalculationView } from '@shared/schemas/views'
import { formatFigure, mainFigure } from '../lib/calculation-figures'

/** The main value with its interval, in one line: "eirp 23.01 dBm (interval 21.5 to 24.5 dBm)". */
export function CalculationFigure({ calc }: { calc: Pick<CalculationView, 'outputs'> }) {
  const f = mainFigure(calc)
  if (!f) return <span>No single figure: see the record.</span>
  const u = f.unit ? ` ${f.unit}` : ''
  return (
    <span>
      {f.name && <span className="capitalize">{f.name} </span>}
      <strong className="tabular-nums">
        {formatFigure(f.value)}
        {u}
      </strong>
      {f.interval && (
        <span className="tabular-nums">
          {' '}
          (interval {formatFigure(f.interval.low)} to {formatFigure(f.interval.high)}
          {u})
        </span>
      )}
      {f.verdict && <span>, verdict: {f.verdict.replace(/[-_]/g, ' ')}</span>}
    </span>
  )
}

const warningsText = (n: number) => (n === 0 ? 'no warnings' : n === 1 ? '1 warning' : `${n} warnings`)

/** One line for a checklist: kind, main value with interval, warnings count. */
export function CalculationBrief({ calc }: { calc: CalculationView }) {
  return (
    <span className="flex flex-col">
      <span className="font-semibold">{calc.kindLabel}</span>
      <CalculationFigure calc={calc} />
      <span className={`text-sm ${calc.warnings.length > 0 ? 'font-semibold text-caution' : 'text-ink-muted'}`}>
        {warningsText(calc.warnings.length)} · stored {format(parseISO(calc.at), 'd MMM yyyy, HH:mm')} by {calc.author.name}
      </span>
    </span>
  )
}

/** A linked calculation as the supervisor reviews it: the numbers, the interval, every warning, methods and library version. */
export function LinkedCalculation({ calc }: { calc: CalculationView }) {
  const interval = calc.outputs.interval
  return (
    <article aria-label={calc.kindLabel} className="flex flex-col gap-2 rounded-control border border-rule p-3">
      <h4 className="font-semibold">{calc.kindLabel}</h4>
      <p>
        <CalculationFigure calc={calc} />
      </p>
      {interval && <p className="text-sm text-ink-muted">Interval: {interval.basis}</p>}
      {calc.warnings.length > 0 ? (
        <div className="rounded-control border-l-4 border-caution bg-caution-soft px-3 py-2 text-sm">
          <p className="font-semibold">{warningsText(calc.warnings.length)}</p>
          <ul className="list-disc pl-5">
            {calc.warnings.map((w) => (
              <li key={w}>{w}</li>
            ))}
          </ul>
        </div>
      ) : (
        <p className="text-sm text-ink-muted">No warnings.</p>
      )}
      <p className="text-sm text-ink-muted">
        Methods: {calc.methods.map((m) => m.id).join(', ') || 'none recorded'} · library {calc.libraryVersion} · stored{' '}
        {format(parseISO(calc.at), 'd MMM yyyy, HH:mm')} by {calc.author.name}
      </p>
    </article>
  )
}
