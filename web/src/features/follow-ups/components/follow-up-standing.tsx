/** Where a follow-up stands, in words and a sign (never colour alone). */
import type { FollowUpView } from '@shared/schemas/follow-ups'

const LOOK: Record<FollowUpView['standing'], { label: string; className: string }> = {
  overdue: { label: 'Overdue', className: 'border-danger bg-danger-soft text-danger' },
  due: { label: 'Due today', className: 'border-caution bg-caution-soft text-ink' },
  upcoming: { label: 'Upcoming', className: 'border-rule bg-surface text-ink' },
  closed: { label: 'Closed', className: 'border-rule bg-paper text-ink-muted' },
}

export function FollowUpStanding({ standing, label }: { standing: FollowUpView['standing']; label?: string }) {
  const look = LOOK[standing]
  return <span className={`inline-flex items-center rounded-control border px-2 py-0.5 text-sm font-semibold ${look.className}`}>{label ?? look.label}</span>
}
