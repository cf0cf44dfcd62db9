/**
 * A case's clocks against their targets, each drawn as a measuring ruler: quarter ticks up to
 * the target mark, a pointer at the time used, and past the target a hatched stretch (up to
 * one more half of the target) in the danger colour. The words beside a ruler carry
 * everything it shows, so the drawing is hidden from screen readers. `ResponseMeter` is the
 * resolution clock (the case's age), `FirstResponseMeter` the first response.
 */
import { useId } from 'react'
import { format, parseISO } from 'date-fns'
import type { CaseState } from '@shared/domain/case-lifecycle'
import { firstResponseClock, formatTargetHours, responseClock } from '@/lib/response-clock'

const WIDTH = 240
const TARGET_X = 180 // the target sits at three quarters of the ruler; the rest is overrun
const overrunMax = 1.5 // the ruler shows up to 1.5 × the target

function Ruler({ usedFraction }: { usedFraction: number }) {
  const hatchId = `qb-overrun-${useId().replace(/:/g, '')}`
  const used = Math.min(overrunMax, Math.max(0, usedFraction))
  const pointerX = 2 + (used / overrunMax) * (WIDTH - 4)
  const late = usedFraction > 1
  return (
    <svg aria-hidden="true" width={WIDTH} height="22" viewBox={`0 0 ${WIDTH} 22`} className="max-w-full text-ink-muted">
      <defs>
        <pattern id={hatchId} width="5" height="5" patternUnits="userSpaceOnUse" patternTransform="rotate(45)">
          <rect width="2" height="5" className="fill-danger" />
        </pattern>
      </defs>
      <line x1="2" y1="14" x2={WIDTH - 2} y2="14" stroke="currentColor" strokeWidth="1" />
      {[0.25, 0.5, 0.75].map((q) => (
        <line key={q} x1={2 + q * (TARGET_X - 2)} y1="10" x2={2 + q * (TARGET_X - 2)} y2="14" stroke="currentColor" strokeWidth="1" />
      ))}
      <line x1="2" y1="6" x2="2" y2="18" stroke="currentColor" strokeWidth="1.5" />
      <line x1={TARGET_X} y1="4" x2={TARGET_X} y2="20" className="stroke-ink" strokeWidth="2" />
      {late && <rect x={TARGET_X} y="11" width={Math.max(0, pointerX - TARGET_X)} height="6" fill={`url(#${hatchId})`} />}
      <rect x="2" y="12" width={Math.max(0, Math.min(pointerX, TARGET_X) - 2)} height="4" className="fill-signal" />
      <path d={`M${pointerX} 12 l-5 -8 h10 Z`} className={late ? 'fill-danger' : 'fill-ink'} />
    </svg>
  )
}

/** The resolution clock; `label` ("Resolution") leads its words where it stands beside the first response. */
export function ResponseMeter({ status, receivedAt, dueAt, closedAt, now, label }: { status: CaseState; receivedAt: string; dueAt: string; closedAt: string | null; now: Date; label?: string }) {
  const clock = responseClock({ status, receivedAt, dueAt, closedAt, now })
  return (
    <div className="flex flex-col gap-1">
      <p>
        {label && `${label}: `}
        <span className="font-semibold">{clock.ageText}</span> old{closedAt ? ' when closed' : ''}, against a target of{' '}
        <span className="font-semibold">{formatTargetHours(clock.targetHours)}</span>
      </p>
      <Ruler usedFraction={clock.usedFraction} />
      <p className={clock.overdue ? 'font-semibold text-danger' : 'text-ink-muted'}>
        Due <time dateTime={dueAt}>{format(parseISO(dueAt), 'd MMM yyyy, HH:mm')}</time> — {clock.standingText}
      </p>
    </div>
  )
}

/** "First response: answered after about 3 hours (target 8 h)" / "due in …" / "overdue by …", over its ruler. */
export function FirstResponseMeter(props: { status: CaseState; receivedAt: string; firstResponseDueAt: string; firstRespondedAt: string | null; closedAt: string | null; now: Date }) {
  const clock = firstResponseClock(props)
  return (
    <div className="flex flex-col gap-1">
      <p className={clock.overdue ? 'font-semibold text-danger' : undefined}>
        First response: {clock.standingText}{' '}
        <span className="whitespace-nowrap">
          (target <span className="font-semibold">{formatTargetHours(clock.targetHours)}</span>)
        </span>
      </p>
      <Ruler usedFraction={clock.usedFraction} />
      {!clock.stopped && (
        <p className="text-ink-muted">
          Due <time dateTime={props.firstResponseDueAt}>{format(parseISO(props.firstResponseDueAt), 'd MMM yyyy, HH:mm')}</time>
        </p>
      )}
    </div>
  )
}
