/** An item's changes, newest first: when, who, why, and each changed field before and after. */
import type { EquipmentChangeView } from '@shared/schemas/measurements'
import { Loading } from '@/components/ui/loading'
import { QueryError } from '@/components/ui/query-error'
import { useEquipmentHistory } from '../api/get-equipment-history'
import { EQUIPMENT_FIELD_LABELS, describeValue } from '../lib/describe-equipment'

function Change({ change }: { change: EquipmentChangeView }) {
  const fields = Object.keys(change.after)
  return (
    <li className="flex flex-col gap-1 border-b border-rule py-3 last:border-b-0">
      <p className="text-sm">
        <time dateTime={change.at}>{new Date(change.at).toLocaleString('en-GB', { dateStyle: 'medium', timeStyle: 'short' })}</time> · {change.by} · version {change.version}
      </p>
      {change.reason && (
        <p>
          <span className="font-semibold">Reason:</span> {change.reason}
        </p>
      )}
      <dl className="grid gap-1 text-sm">
        {fields.map((f) => (
          <div key={f} className="break-words">
            <dt className="inline font-semibold">{EQUIPMENT_FIELD_LABELS[f] ?? f}: </dt>
            <dd className="inline">
              {change.version > 1 && (
                <>
                  <del className="text-ink-muted">{describeValue(f, change.before[f])}</del> →{' '}
                </>
              )}
              <ins className="no-underline">{describeValue(f, change.after[f])}</ins>
            </dd>
          </div>
        ))}
      </dl>
    </li>
  )
}

export function EquipmentHistory({ equipmentId, open }: { equipmentId: string; open: boolean }) {
  const history = useEquipmentHistory(equipmentId, open)
  if (!open) return null
  if (history.isPending) return <Loading label="Loading the history…" />
  if (history.isError) return <QueryError error={history.error} what="the history" onRetry={() => void history.refetch()} />
  return (
    <ol aria-label="Changes, newest first" className="flex flex-col">
      {history.data.changes.map((c) => (
        <Change key={c.id} change={c} />
      ))}
    </ol>
  )
}
