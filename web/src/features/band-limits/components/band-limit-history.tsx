/** An entry's changes, newest first: when, who, why, and each changed field before and after. */
import { BAND_LIMIT_FIELD_LABELS, BAND_LIMIT_FIELDS, type BandLimitContent } from '@shared/schemas/band-limits'
import type { BandLimitChangeView } from '@shared/schemas/views'
import { Loading } from '@/components/ui/loading'
import { QueryError } from '@/components/ui/query-error'
import { useBandLimitHistory } from '../api/get-band-limit-history'
import { describeLimit, formatBands } from '../lib/describe-limit'

function valueText<F extends keyof BandLimitContent>(field: F, value: BandLimitContent[F] | undefined): string {
  if (value === undefined || value === null) return '—'
  if (field === 'spec') return describeLimit(value as BandLimitContent['spec']).join(' ')
  if (field === 'bandsHz') return formatBands(value as BandLimitContent['bandsHz'])
  if (field === 'verified') return value ? 'verified' : 'not verified'
  return String(value)
}

function Change({ change }: { change: BandLimitChangeView }) {
  const fields = BAND_LIMIT_FIELDS.filter((f) => f in change.after)
  return (
    <li className="flex flex-col gap-1 border-b border-rule py-3 last:border-b-0">
      <p className="text-sm">
        <time dateTime={change.at}>{new Date(change.at).toLocaleString('en-GB', { dateStyle: 'medium', timeStyle: 'short' })}</time> · {change.by} · version {change.version}
      </p>
      <p>
        <span className="font-semibold">Reason:</span> {change.reason}
      </p>
      <dl className="grid gap-1 text-sm">
        {fields.map((f) => (
          <div key={f} className="break-words">
            <dt className="inline font-semibold">{BAND_LIMIT_FIELD_LABELS[f]}: </dt>
            <dd className="inline">
              <del className="text-ink-muted">{valueText(f, change.before[f])}</del> → <ins className="no-underline">{valueText(f, change.after[f])}</ins>
            </dd>
          </div>
        ))}
      </dl>
    </li>
  )
}

export function BandLimitHistory({ bandLimitId, open }: { bandLimitId: string; open: boolean }) {
  const history = useBandLimitHistory(bandLimitId, open)
  if (!open) return null
  if (history.isPending) return <Loading label="Loading the history…" />
  if (history.isError) return <QueryError error={history.error} what="the history" onRetry={() => void history.refetch()} />
  if (history.data.changes.length === 0) return <p className="text-sm text-ink-muted">No change since it was taken from the library.</p>
  return (
    <ol aria-label="Changes, newest first" className="flex flex-col">
      {history.data.changes.map((c) => (
        <Change key={c.id} change={c} />
      ))}
    </ol>
  )
}
