/** Age against the response target: a short bar (full = target reached) plus words. */
import { format, parseISO } from 'date-fns'
import type { CaseState } from '@shared/domain/case-lifecycle'
import { formatTargetHours, responseClock } from '@/lib/response-clock'

export function ResponseMeter({ status, receivedAt, dueAt, closedAt, now }: { status: CaseState; receivedAt: string; dueAt: string; closedAt: string | null; now: Date }) {
  const clock = responseClock({ status, receivedAt, dueAt, closedAt, now })
  const widthPct = Math.min(100, Math.round(clock.usedFraction * 100))
  return (
    <div className="flex flex-col gap-1">
      <p>
        <span className="font-semibold">{clock.ageText}</span> old{closedAt ? ' when closed' : ''}, against a target of{' '}
        <span className="font-semibold">{formatTargetHours(clock.targetHours)}</span>
      </p>
      <div aria-hidden="true" className="h-2 w-full max-w-xs overflow-hidden rounded-full bg-rule">
        <div className={`h-full ${clock.overdue ? 'bg-danger' : 'bg-signal'}`} style={{ width: `${widthPct}%` }} />
      </div>
      <p className={clock.overdue ? 'font-semibold text-danger' : 'text-ink-muted'}>
        Due <time dateTime={dueAt}>{format(parseISO(dueAt), 'd MMM yyyy, HH:mm')}</time> — {clock.standingText}
      </p>
    </div>
  )
}
