/**
 * Age against the response target, drawn as a measuring ruler: quarter ticks up to the target
 * mark, a pointer at the case's age, and past the target a hatched stretch (up to one more
 * half of the target) in the danger colour. The words beside it carry everything the drawing
 * shows, so the drawing is hidden from screen readers.
 */
import { format, parseISO } from 'date-fns'
import type { CaseState } from '@shared/domain/case-lifecycle'
import { formatTargetHours, responseClock } from '@/lib/response-clock'

const WIDTH = 240
const TARGET_X = 180 // the target sits at three quarters of the ruler; the rest is overrun
const overrunMax = 1.5 // the ruler shows up to 1.5 × the target

export function ResponseMeter({ status, receivedAt, dueAt, closedAt, now }: { status: CaseState; receivedAt: string; dueAt: string; closedAt: string | null; now: Date }) {
  const clock = responseClock({ status, receivedAt, dueAt, closedAt, now })
  const used = Math.min(overrunMax, Math.max(0, clock.usedFraction))
  const pointerX = 2 + (used / overrunMax) * (WIDTH - 4)
  const late = clock.usedFraction > 1
  return (
    <div className="flex flex-col gap-1">
      <p>
        <span className="font-semibold">{clock.ageText}</span> old{closedAt ? ' when closed' : ''}, against a target of{' '}
        <span className="font-semibold">{formatTargetHours(clock.targetHours)}</span>
      </p>
      <svg aria-hidden="true" width={WIDTH} height="22" viewBox={`0 0 ${WIDTH} 22`} className="max-w-full text-ink-muted">
        <defs>
          <pattern id="qb-overrun" width="5" height="5" patternUnits="userSpaceOnUse" patternTransform="rotate(45)">
            <rect width="2" height="5" className="fill-danger" />
          </pattern>
        </defs>
        <line x1="2" y1="14" x2={WIDTH - 2} y2="14" stroke="currentColor" strokeWidth="1" />
        {[0.25, 0.5, 0.75].map((q) => (
          <line key={q} x1={2 + q * (TARGET_X - 2)} y1="10" x2={2 + q * (TARGET_X - 2)} y2="14" stroke="currentColor" strokeWidth="1" />
        ))}
        <line x1="2" y1="6" x2="2" y2="18" stroke="currentColor" strokeWidth="1.5" />
        <line x1={TARGET_X} y1="4" x2={TARGET_X} y2="20" className="stroke-ink" strokeWidth="2" />
        {late && <rect x={TARGET_X} y="11" width={Math.max(0, pointerX - TARGET_X)} height="6" fill="url(#qb-overrun)" />}
        <rect x="2" y="12" width={Math.max(0, Math.min(pointerX, TARGET_X) - 2)} height="4" className="fill-signal" />
        <path d={`M${pointerX} 12 l-5 -8 h10 Z`} className={late ? 'fill-danger' : 'fill-ink'} />
      </svg>
      <p className={clock.overdue ? 'font-semibold text-danger' : 'text-ink-muted'}>
        Due <time dateTime={dueAt}>{format(parseISO(dueAt), 'd MMM yyyy, HH:mm')}</time> — {clock.standingText}
      </p>
    </div>
  )
}
