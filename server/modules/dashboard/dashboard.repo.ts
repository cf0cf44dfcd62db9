/**
 * The dashboard's queries: counts and percentiles computed in PostgreSQL for an office scope the
 * service has decided (no authorization here). Each count uses the same SQL pieces as the case
 * list's filter it links to (cases/due.ts, case-list.repo.ts), so the two always agree.
 */
import { and, asc, count, desc, eq, inArray, isNull, or, sql, type SQL } from 'drizzle-orm'
import type { CaseClockName } from '../../../shared/domain/case-clocks'
import type { Db } from '../../db/client'
import { cases, offices, users } from '../../db/schema'
import { daysBefore, receivedTodaySql, type OfficeScope } from '../cases/case-list.repo'
import { CLOCK_COLUMNS, clockRunsSql, dueSoonSql, overdueSql } from '../cases/due'

const inScope = (scope: OfficeScope): SQL | undefined => ('officeId' in scope ? eq(cases.officeId, scope.officeId) : undefined)

/** The offices of the scope, by name. */
export function scopeOffices(db: Db, scope: OfficeScope) {
  return db
    .select()
    .from(offices)
    .where('officeId' in scope ? eq(offices.id, scope.officeId) : undefined)
    .orderBy(asc(offices.name))
}

/** Open cases (the resolution clock runs) counted by state and priority. */
export function openByStatePriority(db: Db, scope: OfficeScope) {
  return db
    .select({ status: cases.status, priority: cases.priority, count: count() })
    .from(cases)
    .where(and(inScope(scope), clockRunsSql('resolution')))
    .groupBy(cases.status, cases.priority)
}

/** The clock figures at `now`, in one pass over the scope's cases. */
export async function clockCounts(db: Db, scope: OfficeScope, now: Date) {
  const [row] = await db
    .select({
      overdue: sql<number>`count(*) filter (where ${overdueSql('resolution', now)})`.mapWith(Number),
      dueSoon: sql<number>`count(*) filter (where ${dueSoonSql('resolution', now)})`.mapWith(Number),
      firstResponseOverdue: sql<number>`count(*) filter (where ${overdueSql('firstResponse', now)})`.mapWith(Number),
      receivedToday: sql<number>`count(*) filter (where ${receivedTodaySql(now)})`.mapWith(Number),
    })
    .from(cases)
    // every clock figure needs a running clock (not closed); "today" a receipt within the last 25 hours
    .where(and(inScope(scope), or(clockRunsSql('resolution'), sql`${cases.receivedAt} >= ${new Date(now.getTime() - 25 * 3_600_000).toISOString()}::timestamptz`)))
  return row!
}

/** Open and overdue cases per active investigator of the scope's offices (zeros included). */
export function investigatorLoads(db: Db, scope: OfficeScope, now: Date) {
  const open = sql<number>`count(${cases.id})`.mapWith(Number)
  return db
    .select({
      investigatorId: users.id,
      name: users.name,
      officeName: offices.name,
      open,
      overdue: sql<number>`count(${cases.id}) filter (where ${overdueSql('resolution', now)})`.mapWith(Number),
    })
    .from(users)
    .innerJoin(offices, eq(offices.id, users.officeId))
    .leftJoin(cases, and(eq(cases.investigatorId, users.id), clockRunsSql('resolution')))
    .where(and(eq(users.role, 'investigator'), eq(users.active, true), 'officeId' in scope ? eq(users.officeId, scope.officeId) : undefined))
    .groupBy(users.id, users.name, offices.name)
    .orderBy(desc(open), asc(users.name))
}

/** Open cases without an investigator, and how many of them are overdue. */
export async function unassignedCounts(db: Db, scope: OfficeScope, now: Date) {
  const [row] = await db
    .select({ open: count(), overdue: sql<number>`count(*) filter (where ${overdueSql('resolution', now)})`.mapWith(Number) })
    .from(cases)
    .where(and(inScope(scope), clockRunsSql('resolution'), isNull(cases.investigatorId)))
  return row!
}

/**
 * One clock's performance over each of the last `windowsDays`: per priority, how many cases
 * stopped the clock in the window, the median and 90th percentile of the hours it took
 * (percentile_cont: linear interpolation between the nearest ranks), and how many did so by
 * their due time. The first response counts cases first answered in the window; resolution,
 * cases closed in it. One pass over the longest window serves them all (FILTER per window).
 */
export async function clockPerformance(db: Db, scope: OfficeScope, clock: CaseClockName, windowsDays: readonly number[], now: Date) {
  const stoppedAt = clock === 'firstResponse' ? cases.firstRespondedAt : cases.closedAt
  const dueAt = CLOCK_COLUMNS[clock].dueAt
  const hours = sql`extract(epoch from (${stoppedAt} - ${cases.receivedAt})) / 3600.0`
  const inWindow = (days: number) => sql`${stoppedAt} >= ${daysBefore(now, days)}::timestamptz`
  // both percentiles from one sort per window: percentile_cont(array[…]) gives them as an array
  const pair = (v: unknown): [number, number] | null => (Array.isArray(v) ? [Number(v[0]), Number(v[1])] : null)
  const columns: Record<string, SQL> = {}
  for (const d of windowsDays) {
    columns[`count${d}`] = sql<number>`count(*) filter (where ${inWindow(d)})`.mapWith(Number)
    columns[`pct${d}`] = sql<[number, number] | null>`percentile_cont(array[0.5, 0.9]::float8[]) within group (order by ${hours}) filter (where ${inWindow(d)})`.mapWith(pair)
    columns[`met${d}`] = sql<number>`count(*) filter (where ${inWindow(d)} and ${stoppedAt} <= ${dueAt})`.mapWith(Number)
  }
  const rows = await db
    .select({ priority: cases.priority, ...columns })
    .from(cases)
    .where(and(inScope(scope), inWindow(Math.max(...windowsDays))))
    .groupBy(cases.priority)
  return windowsDays.flatMap((d) =>
    rows.map((r) => {
      const v = r as unknown as Record<string, unknown>
      const pct = v[`pct${d}`] as [number, number] | null
      return { windowDays: d, priority: r.priority, count: (v[`count${d}`] as number) ?? 0, medianHours: pct?.[0] ?? null, p90Hours: pct?.[1] ?? null, metTarget: (v[`met${d}`] as number) ?? 0 }
    }),
  )
}

/** Open cases to map, most urgent then oldest first, up to `limit`. */
export function openCasesForMap(db: Db, scope: OfficeScope, now: Date, limit: number) {
  return db
    .select({
      id: cases.id,
      reference: cases.reference,
      latDeg: cases.latDeg,
      lonDeg: cases.lonDeg,
      priority: cases.priority,
      status: cases.status,
      overdue: overdueSql('resolution', now),
    })
    .from(cases)
    .where(and(inScope(scope), clockRunsSql('resolution')))
    .orderBy(asc(cases.priority), asc(cases.receivedAt), asc(cases.id))
    .limit(limit)
}

/** Offices an administrator may filter to. */
export function officeChoices(db: Db, ids?: string[]) {
  return db
    .select({ id: offices.id, name: offices.name })
    .from(offices)
    .where(ids ? inArray(offices.id, ids) : undefined)
    .orderBy(asc(offices.name))
}
