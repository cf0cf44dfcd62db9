/** A case's state as a word in a box, with an overdue flag that never relies on colour alone. */
import { Sign } from '../ui/sign'

export function StatusTag({ label, closed }: { label: string; closed: boolean }) {
  return (
    <span className={`inline-flex items-center gap-1.5 rounded-sm border px-2 py-0.5 text-sm font-semibold ${closed ? 'border-ok text-ok' : 'border-field text-ink'}`}>
      {closed && <Sign kind="ok" sizePx={14} />}
      {label}
    </span>
  )
}

export function OverdueFlag({ compact = false }: { compact?: boolean }) {
  return (
    <span className={`inline-flex items-center gap-1 rounded-sm bg-danger px-2 py-0.5 font-bold uppercase tracking-wide text-surface ${compact ? 'text-xs' : 'text-sm'}`}>
      <Sign kind="danger" sizePx={compact ? 12 : 14} />
      Overdue
    </span>
  )
}
