/**
 * A case's age against its response target, for display. The target is the span the office
 * allowed for the case's priority (dueAt − receivedAt); whether it is overdue is the shared
 * rule of shared/domain/case-clocks.ts, the same one the server's SQL is built from.
 */
import { differenceInMinutes, formatDistance, parseISO } from 'date-fns'
import { clockRuns, isOverdue } from '@shared/domain/case-clocks'
import type { CaseState } from '@shared/domain/case-lifecycle'

export interface ResponseClock {
  /** The office's response target for this case, in hours. */
  targetHours: number
  /** Time from receipt to now (or to closing), in hours. */
  elapsedHours: number
  /** Share of the target used so far (1 = on the limit; above 1 = past it). */
  usedFraction: number
  overdue: boolean
  /** "about 3 hours" — how old the case is (or was when it closed). */
  ageText: string
  /** "due in about 1 hour", "2 days past the target", "closed within the target". */
  standingText: string
}

export function responseClock(options: { status: CaseState; receivedAt: string; dueAt: string; closedAt: string | null; now: Date }): ResponseClock {
  const received = parseISO(options.receivedAt)
  const due = parseISO(options.dueAt)
  const closed = options.closedAt ? parseISO(options.closedAt) : null
  const end = closed ?? options.now
  const targetHours = differenceInMinutes(due, received) / 60
  const elapsedHours = Math.max(0, differenceInMinutes(end, received) / 60)
  const overdue = isOverdue('resolution', { status: options.status, dueAt: due }, options.now)
  let standingText: string
  if (closed) standingText = closed.getTime() <= due.getTime() ? 'closed within the target' : `closed ${formatDistance(due, closed)} after the target`
  else if (overdue) standingText = `${formatDistance(due, options.now)} past the target`
  else standingText = `due in ${formatDistance(options.now, due)}`
  return {
    targetHours,
    elapsedHours,
    usedFraction: targetHours > 0 ? elapsedHours / targetHours : 0,
    overdue,
    ageText: formatDistance(received, end),
    standingText,
  }
}

/** "4 h" or "10 days" for a target in hours. */
export function formatTargetHours(hours: number): string {
  if (hours < 48) return `${Math.round(hours)} h`
  const days = hours / 24
  return `${Number.isInteger(days) ? days : days.toFixed(1)} days`
}

export interface FirstResponseClock {
  /** The office's first-response target for this case, in hours. */
  targetHours: number
  /** Share of the target used until the first response (or until now, or the closing): 1 = on the limit. */
  usedFraction: number
  overdue: boolean
  /** Whether the clock has stopped: answered, or the case closed before any answer. */
  stopped: boolean
  /** "answered after about 3 hours", "due in about 2 hours", "overdue by 5 hours", "no first response before the case closed". */
  standingText: string
}

/**
 * The first-response clock of a case, for display: the target is the span the office allowed
 * (firstResponseDueAt − receivedAt); whether it is overdue is the shared rule (the
 * `firstResponse` clock of shared/domain/case-clocks.ts), which stops at the first response
 * or when the case closes.
 */
export function firstResponseClock(options: { status: CaseState; receivedAt: string; firstResponseDueAt: string; firstRespondedAt: string | null; closedAt: string | null; now: Date }): FirstResponseClock {
  const received = parseISO(options.receivedAt)
  const due = parseISO(options.firstResponseDueAt)
  const responded = options.firstRespondedAt ? parseISO(options.firstRespondedAt) : null
  const closed = options.closedAt ? parseISO(options.closedAt) : null
  const targetHours = differenceInMinutes(due, received) / 60
  const overdue = isOverdue('firstResponse', { status: options.status, dueAt: due, stoppedAt: responded }, options.now)
  const stopped = !clockRuns('firstResponse', options.status, responded)
  const end = responded ?? (stopped && closed ? closed : options.now)
  let standingText: string
  if (responded) standingText = `answered after ${formatDistance(received, responded)}${responded.getTime() > due.getTime() ? `, ${formatDistance(due, responded)} past the target` : ''}`
  else if (stopped) standingText = 'no first response was recorded before the case closed'
  else if (overdue) standingText = `overdue by ${formatDistance(due, options.now)}`
  else standingText = `due in ${formatDistance(options.now, due)}`
  const elapsedHours = Math.max(0, differenceInMinutes(end, received) / 60)
  return { targetHours, usedFraction: targetHours > 0 ? elapsedHours / targetHours : 0, overdue, stopped, standingText }
}
