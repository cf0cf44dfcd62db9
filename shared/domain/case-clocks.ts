/**
 * The clocks a case runs against, as data: the one definition of "due" and "overdue" that the
 * server's SQL (server/modules/cases/due.ts builds its expressions from these constants), the
 * server's presenters and the web's response meter all use.
 *
 * A clock starts when the report is received and allows the hours its office sets for the
 * case's priority; its due time is stored on the case. It stops when the case reaches one of
 * its stopping states. A case is overdue on a clock while the clock runs and its due time has
 * passed: at the due time itself it is not yet overdue, a moment later it is.
 *
 * Today there is one clock, the resolution target (`due_at`). Another clock (a first-response
 * target, say) joins by adding an entry here, its due column on the case and its target hours
 * on the office (see CLOCK_COLUMNS in server/modules/cases/due.ts); nothing else restates it.
 */
import type { CaseState } from './case-lifecycle'
import type { Priority } from './services'

export interface CaseClock {
  /** What the office calls it. */
  label: string
  /** States in which the clock has stopped: a case in one of them is never overdue on it. */
  stopsIn: readonly CaseState[]
}

export const CASE_CLOCKS = {
  resolution: { label: 'Response target', stopsIn: ['closed'] },
} as const satisfies Record<string, CaseClock>

export type CaseClockName = keyof typeof CASE_CLOCKS

/** Hours an office allows for each priority on one clock. */
export type TargetsHours = Record<Priority, number>

/** Hours in milliseconds. */
const HOUR_MS = 3_600_000

/** A clock's due time: received time plus the office's target hours for the priority. */
export function dueAtFor(receivedAt: Date, priority: Priority, targetsHours: TargetsHours): Date {
  return new Date(receivedAt.getTime() + targetsHours[priority] * HOUR_MS)
}

/** Whether the clock still runs for a case in this state. */
export function clockRuns(clock: CaseClockName, status: CaseState): boolean {
  return !(CASE_CLOCKS[clock].stopsIn as readonly CaseState[]).includes(status)
}

/** Overdue on a clock: the clock still runs and its due time is strictly before `now`. */
export function isOverdue(clock: CaseClockName, c: { status: CaseState; dueAt: Date }, now: Date): boolean {
  return clockRuns(clock, c.status) && c.dueAt.getTime() < now.getTime()
}
