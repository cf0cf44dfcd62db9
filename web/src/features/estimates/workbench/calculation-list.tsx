/** The case's stored calculations, newest first: each with its summary; opening one shows its full result and the recompute. */
import { CALCULATION_KIND_LABELS } from '@shared/calculations'
import type { CalculationView } from '@shared/schemas/views'
import { outcomeOfRecord } from '../lib/run-estimate'
import { recordSummary } from '../lib/record-summary'
import { ResultView } from '../results/result-view'
import type { Candidate } from '../results/candidates-table'
import { RecomputePanel } from './recompute-panel'

export function CalculationList({ records, onUseLicence }: { records: CalculationView[]; onUseLicence: (c: Candidate) => void }) {
  const newestFirst = [...records].sort((a, b) => b.at.localeCompare(a.at))
  if (newestFirst.length === 0) return <p className="text-ink-muted">No calculation is stored on this case yet.</p>
  return (
    <ol aria-label="Stored calculations, newest first" className="flex flex-col gap-2">
      {newestFirst.map((r) => (
        <li key={r.id}>
          <details className="rounded-control border border-rule bg-surface">
            <summary className="flex min-h-11 cursor-pointer flex-col gap-0.5 px-4 py-2">
              <span className="font-semibold">{CALCULATION_KIND_LABELS[r.kind]}</span>
              <span className="break-words">{recordSummary(r)}</span>
              <span className="text-sm text-ink-muted">
                {r.author.name}, {new Date(r.at).toLocaleString('en-GB', { dateStyle: 'medium', timeStyle: 'short' })}
                {r.warnings.length > 0 ? ` · ${r.warnings.length} warning${r.warnings.length === 1 ? '' : 's'}` : ''}
              </span>
            </summary>
            <div className="flex flex-col gap-4 border-t border-rule px-4 py-4">
              <ResultView outcome={outcomeOfRecord(r)} title="Stored result" onUseLicence={onUseLicence} />
              <RecomputePanel calculationId={r.id} />
            </div>
          </details>
        </li>
      ))}
    </ol>
  )
}
