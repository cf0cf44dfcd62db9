/** Rejected rows of a register file, by line, each with every problem found in it. */
import type { RowProblems } from '@shared/schemas/stations'

export function RejectedRows({ rows, total }: { rows: RowProblems[]; total: number }) {
  if (total === 0) return <p>Every row can be imported.</p>
  return (
    <div className="flex flex-col gap-2">
      {rows.length < total && (
        <p className="text-ink-muted">
          The first {rows.length} of {total} rejected rows:
        </p>
      )}
      <ul className="flex max-h-96 flex-col gap-1 overflow-y-auto rounded-control border border-rule bg-surface p-3">
        {rows.map((r) => (
          <li key={r.line} className="break-words">
            <span className="font-semibold">Line {r.line}:</span> {r.problems.join('; ')}
          </li>
        ))}
      </ul>
    </div>
  )
}
