/** The audit entries, newest first: a table from 640 px up, cards below. */
import { format, parseISO } from 'date-fns'
import type { AuditEntryView } from '@shared/schemas/audit'
import { TableFrame } from '@/components/ui/table'
import { useTableWidth } from '@/lib/use-media-query'
import { TARGET_TYPE_LABELS, TARGET_TYPES } from './audit-filters-form'

const targetLabel = (type: string) => ((TARGET_TYPES as readonly string[]).includes(type) ? TARGET_TYPE_LABELS[type as (typeof TARGET_TYPES)[number]] : type)

function When({ at }: { at: string }) {
  return (
    <time dateTime={at} className="font-mono text-sm whitespace-nowrap">
      {format(parseISO(at), 'd MMM yyyy HH:mm:ss')}
    </time>
  )
}

function Actor({ entry }: { entry: AuditEntryView }) {
  if (!entry.actor) return <span className="text-ink-muted">System</span>
  return (
    <span>
      {entry.actor.name}
      <span className="block text-sm break-all text-ink-muted">{entry.actor.email}</span>
    </span>
  )
}

function Target({ entry }: { entry: AuditEntryView }) {
  return (
    <span>
      {targetLabel(entry.targetType)}
      {entry.targetId && <span className="block font-mono text-xs break-all text-ink-muted">{entry.targetId}</span>}
    </span>
  )
}

const detailValue = (v: unknown) => (typeof v === 'string' ? v : JSON.stringify(v))

function Details({ details }: { details: Record<string, unknown> }) {
  const keys = Object.keys(details)
  if (keys.length === 0) return <span className="text-ink-muted">—</span>
  return (
    <dl className="grid grid-cols-[auto_1fr] gap-x-2 text-sm">
      {keys.map((k) => (
        <div key={k} className="contents">
          <dt className="text-ink-muted">{k}</dt>
          <dd className="font-mono text-xs break-all">{detailValue(details[k])}</dd>
        </div>
      ))}
    </dl>
  )
}

export function AuditEntries({ entries }: { entries: AuditEntryView[] }) {
  const wide = useTableWidth()
  if (entries.length === 0) return <p className="text-ink-muted">No entries match these filters.</p>
  return wide ? <AuditTable entries={entries} /> : <AuditCards entries={entries} />
}

function AuditTable({ entries }: { entries: AuditEntryView[] }) {
  const head = (
    <tr>
      {['When', 'Action', 'Person', 'Target', 'Office', 'Details'].map((h) => (
        <th key={h} scope="col" className="px-3 py-2 whitespace-nowrap">
          {h}
        </th>
      ))}
    </tr>
  )
  return (
    <TableFrame caption="Audit entries, newest first" head={head}>
      {entries.map((e) => (
        <tr key={e.id} className="border-b border-rule align-top">
          <td className="px-3 py-2">
            <When at={e.at} />
          </td>
          <td className="px-3 py-2">{e.actionLabel}</td>
          <td className="px-3 py-2">
            <Actor entry={e} />
          </td>
          <td className="px-3 py-2">
            <Target entry={e} />
          </td>
          <td className="px-3 py-2">{e.officeName ?? <span className="text-ink-muted">—</span>}</td>
          <td className="px-3 py-2">
            <Details details={e.details} />
          </td>
        </tr>
      ))}
    </TableFrame>
  )
}

function AuditCards({ entries }: { entries: AuditEntryView[] }) {
  return (
    <ul aria-label="Audit entries, newest first" className="flex flex-col gap-2">
      {entries.map((e) => (
        <li key={e.id} className="flex flex-col gap-1 rounded-panel border border-rule bg-surface px-3 py-2">
          <p className="font-semibold">{e.actionLabel}</p>
          <When at={e.at} />
          <Actor entry={e} />
          <p className="text-sm">
            <Target entry={e} />
            {e.officeName ? ` · ${e.officeName}` : ''}
          </p>
          <Details details={e.details} />
        </li>
      ))}
    </ul>
  )
}
