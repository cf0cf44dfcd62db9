/**
 * A case's age against its response target, for display. The target is the span the office
 * allowed for the case's priority (dueAt − receivedAt); whether it is overdue is the shared
 * rule of shared/domain/case-clocks.ts, the same one the server's SQL is built from.
 */
import { differenceInMinutes, formatDistance, parseISO } from 'date-fns'
import { isOverdue } from '@shared/domain/case-clocks'
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
