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
 * Two clocks run on every case:
 * - first response (`first_response_due_at`): the office's first answer to the complainant,
 *   which is the first of: the priority set at triage, or a first message from staff to the
 *   complainant. It stops at that moment (`first_responded_at`), or when the case closes;
 * - resolution (`due_at`): closing the case.
 * Each clock has its due column on the case and its target hours on the office (see
 * CLOCK_COLUMNS in server/modules/cases/due.ts); nothing else restates them.
 */
import type { CaseState } from './case-lifecycle'
import type { Priority } from './services'

export interface CaseClock {
  /** What the office calls it. */
  label: string
  /** States in which the clock has stopped: a case in one of them is never overdue on it. */
  stopsIn: readonly CaseState[]
  /** The clock also stops at a recorded moment (the first response): once it is set, never overdue. */
  stopsWhenRecorded: boolean
}

export const CASE_CLOCKS = {
  firstResponse: { label: 'First response', stopsIn: ['closed'], stopsWhenRecorded: true },
  resolution: { label: 'Resolution', stopsIn: ['closed'], stopsWhenRecorded: false },
} as const satisfies Record<string, CaseClock>

/** Both clocks, in the order a case meets them. */
export const CASE_CLOCK_NAMES = ['firstResponse', 'resolution'] as const satisfies readonly (keyof typeof CASE_CLOCKS)[]

/** "Due soon": a running clock due within this many hours from now (and not yet overdue). */
export const DUE_SOON_HOURS = 24

export type CaseClockName = keyof typeof CASE_CLOCKS

/** Hours an office allows for each priority on one clock. */
export type TargetsHours = Record<Priority, number>

/** Hours in milliseconds. */
const HOUR_MS = 3_600_000

/** A clock's due time: received time plus the office's target hours for the priority. */
export function dueAtFor(receivedAt: Date, priority: Priority, targetsHours: TargetsHours): Date {
  return new Date(receivedAt.getTime() + targetsHours[priority] * HOUR_MS)
}

/**
 * Whether the clock still runs for a case in this state (`stoppedAt`: the recorded moment of a
 * clock that stops at one, i.e. the first response; null while it has not happened).
 */
export function clockRuns(clock: CaseClockName, status: CaseState, stoppedAt: Date | null = null): boolean {
  const c: CaseClock = CASE_CLOCKS[clock]
  return !c.stopsIn.includes(status) && !(c.stopsWhenRecorded && stoppedAt !== null)
}

/** Overdue on a clock: the clock still runs and its due time is strictly before `now`. */
export function isOverdue(clock: CaseClockName, c: { status: CaseState; dueAt: Date; stoppedAt?: Date | null }, now: Date): boolean {
  return clockRuns(clock, c.status, c.stoppedAt ?? null) && c.dueAt.getTime() < now.getTime()
}

/** Due soon: the clock runs, it is not overdue, and it falls due within DUE_SOON_HOURS of `now` (inclusive). */
export function isDueSoon(clock: CaseClockName, c: { status: CaseState; dueAt: Date; stoppedAt?: Date | null }, now: Date): boolean {
  const t = c.dueAt.getTime()
  return clockRuns(clock, c.status, c.stoppedAt ?? null) && t >= now.getTime() && t <= now.getTime() + DUE_SOON_HOURS * HOUR_MS
}
