/**
 * The case clocks of shared/domain/case-clocks.ts in SQL: the same rule, built from the same
 * constants, so the list's filter, its overdue column, the CSV and the recomputed due times
 * agree with the presenters and the web. Nothing here restates a state list or a target.
 */
import { sql, type SQL } from 'drizzle-orm'
import type { PgColumn } from 'drizzle-orm/pg-core'
import { CASE_CLOCKS, DUE_SOON_HOURS, dueAtFor, type CaseClock, type CaseClockName, type TargetsHours } from '../../../shared/domain/case-clocks'
import { PRIORITIES, type Priority } from '../../../shared/domain/services'
import { cases, type Office } from '../../db/schema'

export { dueAtFor, isOverdue } from '../../../shared/domain/case-clocks'

/**
 * Where each clock lives: its due time on the case, the recorded moment that stops it (a clock
 * with `stopsWhenRecorded`), and its target hours on the office.
 */
export const CLOCK_COLUMNS: Record<CaseClockName, { dueAt: PgColumn; stoppedAt: PgColumn | null; targetsHours(o: Office): TargetsHours }> = {
  firstResponse: {
    dueAt: cases.firstResponseDueAt,
    stoppedAt: cases.firstRespondedAt,
    targetsHours: (o) => ({ 1: o.firstResponseP1Hours, 2: o.firstResponseP2Hours, 3: o.firstResponseP3Hours, 4: o.firstResponseP4Hours }),
  },
  resolution: {
    stoppedAt: null,
    dueAt: cases.dueAt,
    targetsHours: (o) => ({ 1: o.targetP1Hours, 2: o.targetP2Hours, 3: o.targetP3Hours, 4: o.targetP4Hours }),
  },
}

/** SQL literal list of a clock's stopping states, e.g. ('closed'). Constants only, never input. */
function stopStates(clock: CaseClockName): SQL {
  return sql.raw(`(${CASE_CLOCKS[clock].stopsIn.map((s) => `'${s.replace(/'/g, "''")}'`).join(', ')})`)
}

/** The clock's recorded stop, for a clock that stops at one (checked against CASE_CLOCKS). */
function stoppedAtColumn(clock: CaseClockName): PgColumn | null {
  const c: CaseClock = CASE_CLOCKS[clock]
  const col = CLOCK_COLUMNS[clock].stoppedAt
  if (c.stopsWhenRecorded !== (col !== null)) throw new Error(`clock ${clock}: stopsWhenRecorded and its column disagree`)
  return col
}

/** The clock runs: the case is not in one of its stopping states (nor has the moment that stops it). */
export function clockRunsSql(clock: CaseClockName): SQL {
  const stopped = stoppedAtColumn(clock)
  return stopped ? sql`(${cases.status} not in ${stopStates(clock)} and ${stopped} is null)` : sql`${cases.status} not in ${stopStates(clock)}`
}

/**
 * Overdue on a clock at `now` (the service's clock, sent as a parameter): served by the partial
 * index on the due column where the clock runs (cases_due_open_idx).
 */
export function overdueSql(clock: CaseClockName, now: Date): SQL<boolean> {
  return sql<boolean>`(${clockRunsSql(clock)} and ${CLOCK_COLUMNS[clock].dueAt} < ${now.toISOString()}::timestamptz)`
}

/** Not overdue: the exact complement of overdueSql, written so that each branch can use an index. */
export function notOverdueSql(clock: CaseClockName, now: Date): SQL<boolean> {
  const stopped = stoppedAtColumn(clock)
  const recorded = stopped ? sql` or ${stopped} is not null` : sql``
  return sql<boolean>`(${cases.status} in ${stopStates(clock)}${recorded} or ${CLOCK_COLUMNS[clock].dueAt} >= ${now.toISOString()}::timestamptz)`
}

/** Due soon at `now`: the clock runs and falls due within DUE_SOON_HOURS, not yet overdue (isDueSoon's rule). */
export function dueSoonSql(clock: CaseClockName, now: Date): SQL<boolean> {
  const until = new Date(now.getTime() + DUE_SOON_HOURS * 3_600_000)
  const due = CLOCK_COLUMNS[clock].dueAt
  return sql<boolean>`(${clockRunsSql(clock)} and ${due} >= ${now.toISOString()}::timestamptz and ${due} <= ${until.toISOString()}::timestamptz)`
}

/**
 * A clock's due time for the case row in SQL, from given target hours: received_at plus the
 * hours for its priority (the same sum as dueAtFor).
 */
export function dueAtSql(targetsHours: TargetsHours): SQL {
  const whens = PRIORITIES.map((p) => sql`when ${p}::int then ${targetsHours[p]}::int`)
  return sql`${cases.receivedAt} + make_interval(hours => case ${cases.priority} ${sql.join(whens, sql` `)} end)`
}

/** Both clocks' due times for a case (received time, priority, its office's targets). */
export function dueTimesFor(receivedAt: Date, priority: Priority, office: Office): { dueAt: Date; firstResponseDueAt: Date } {
  return {
    dueAt: dueAtFor(receivedAt, priority, CLOCK_COLUMNS.resolution.targetsHours(office)),
    firstResponseDueAt: dueAtFor(receivedAt, priority, CLOCK_COLUMNS.firstResponse.targetsHours(office)),
  }
}
