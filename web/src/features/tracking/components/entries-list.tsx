/**
 * The conversation on a report: what the office sent (left, marked "From the office") and
 * what the complainant added (right, marked "You added"). Status changes are quiet lines.
 */
import { format, parseISO } from 'date-fns'
import type { ComplainantEntry } from '../api/get-complainant-report'

export function EntriesList({ entries }: { entries: ComplainantEntry[] }) {
  if (entries.length === 0) return <p className="text-ink-muted">Nothing yet.</p>
  return (
    <ol className="flex flex-col gap-3">
      {entries.map((e, i) => (
        <li key={`${e.at}-${i}`}>{e.kind === 'status' ? <StatusLine entry={e} /> : <Message entry={e} />}</li>
      ))}
    </ol>
  )
}

function When({ at }: { at: string }) {
  return (
    <time dateTime={at} className="font-mono text-xs text-ink-muted">
      {format(parseISO(at), 'd MMM yyyy, HH:mm')}
    </time>
  )
}

function StatusLine({ entry }: { entry: ComplainantEntry }) {
  return (
    <p className="flex flex-wrap items-baseline gap-x-3 border-l-2 border-dotted border-field py-1 pl-3 text-sm">
      <When at={entry.at} />
      <span>{entry.text}</span>
    </p>
  )
}

function Message({ entry }: { entry: ComplainantEntry }) {
  const mine = entry.from === 'you'
  const asks = entry.kind === 'information_requested'
  return (
    <article
      className={`flex max-w-[90%] flex-col gap-1 rounded-panel border px-4 py-3 ${
        mine ? 'ml-auto border-field bg-paper' : 'mr-auto border-l-4 border-signal bg-signal-soft'
      }`}
    >
      <header className="flex flex-wrap items-baseline gap-x-3">
        <h3 className="text-sm font-bold">{mine ? 'You added' : asks ? 'From the office — a question for you' : 'From the office'}</h3>
        <When at={entry.at} />
      </header>
      <p className="whitespace-pre-wrap">{entry.text}</p>
    </article>
  )
}
