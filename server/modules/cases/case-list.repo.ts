/**
 * The case list's queries: one page, its capped count, and the CSV rows, for the filters of
 * the list screen within an office scope the service has already decided (no authorization here).
 */
import { and, asc, count, desc, eq, gte, inArray, isNull, lte, sql, type SQL } from 'drizzle-orm'
import { EXACT_TOTAL_UP_TO } from '../../../shared/domain/case-list'
import { PRIORITIES } from '../../../shared/domain/services'
import type { CaseListQuery } from '../../../shared/schemas/cases'
import type { Db } from '../../db/client'
import { cases, offices, users } from '../../db/schema'
import { clockRunsSql, dueSoonSql, notOverdueSql, overdueSql } from './due'

/** The offices whose cases a query may return: one, or all (an administrator). */
export type OfficeScope = { officeId: string } | { all: true }

const SORT_COLUMNS = {
  reference: [cases.reference],
  receivedAt: [cases.receivedAt],
  priority: [cases.priority, cases.receivedAt],
  dueAt: [cases.dueAt],
  status: [cases.status, cases.receivedAt],
  service: [cases.service, cases.receivedAt],
  frequency: [cases.freqLowHz, cases.freqHighHz],
} as const

/** The list's WHERE: the scope, then every filter of the query. `me` is the asking investigator. */
function filters(scope: OfficeScope, q: CaseListQuery, me: string, now: Date): SQL | undefined {
  const where: SQL[] = []
  if ('officeId' in scope) where.push(eq(cases.officeId, scope.officeId))
  if (q.officeId) where.push(eq(cases.officeId, q.officeId))
  if (q.status?.length) where.push(inArray(cases.status, q.status))
  if (q.priority?.length) where.push(inArray(cases.priority, PRIORITIES.filter((p) => q.priority!.includes(p))))
  if (q.service?.length) where.push(inArray(cases.service, q.service))
  if (q.investigatorId === 'me') where.push(eq(cases.investigatorId, me))
  else if (q.investigatorId === 'none') where.push(isNull(cases.investigatorId))
  else if (q.investigatorId) where.push(eq(cases.investigatorId, q.investigatorId))
  if (q.open === true) where.push(clockRunsSql('resolution'))
  if (q.open === false) where.push(sql`not ${clockRunsSql('resolution')}`)
  if (q.overdue === true) where.push(overdueSql('resolution', now))
  if (q.overdue === false) where.push(notOverdueSql('resolution', now))
  if (q.dueSoon) where.push(dueSoonSql('resolution', now))
  if (q.firstResponseOverdue === true) where.push(overdueSql('firstResponse', now))
  if (q.firstResponseOverdue === false) where.push(notOverdueSql('firstResponse', now))
  if (q.receivedToday) where.push(receivedTodaySql(now))
  if (q.closedInLastDays !== undefined) where.push(sql`${cases.closedAt} >= ${daysBefore(now, q.closedInLastDays)}::timestamptz`)
  if (q.respondedInLastDays !== undefined) where.push(sql`${cases.firstRespondedAt} >= ${daysBefore(now, q.respondedInLastDays)}::timestamptz`)
  // a case's range overlaps the asked range
  if (q.freqToHz !== undefined) where.push(lte(cases.freqLowHz, q.freqToHz))
  if (q.freqFromHz !== undefined) where.push(gte(cases.freqHighHz, q.freqFromHz))
  if (q.q) where.push(sql`${cases.searchText} like ${'%' + q.q.toLowerCase().replace(/[\\%_]/g, (m) => '\\' + m) + '%'}`)
  return and(...where)
}

/** `now` minus whole 24-hour days, as an ISO instant (the dashboard's performance windows). */
export function daysBefore(now: Date, days: number): string {
  return new Date(now.getTime() - days * 86_400_000).toISOString()
}

/**
 * Received today: from the last midnight in the case's office time zone (offices.time_zone, IANA;
 * PostgreSQL's tz database does the daylight-saving arithmetic) up to `now`.
 */
export function receivedTodaySql(now: Date): SQL<boolean> {
  const at = now.toISOString()
  // a local day began at most 25 hours ago (a day with a clock change back): a cheap, index-friendly bound first
  const earliest = new Date(now.getTime() - 25 * 3_600_000).toISOString()
  return sql<boolean>`(${cases.receivedAt} <= ${at}::timestamptz and ${cases.receivedAt} >= ${earliest}::timestamptz and ${cases.receivedAt} >= (select date_trunc('day', ${at}::timestamptz at time zone o.time_zone) at time zone o.time_zone from ${offices} o where o.id = ${cases.officeId}))`
}

function rowColumns(now: Date) {
  return {
    id: cases.id,
    reference: cases.reference,
    status: cases.status,
    priority: cases.priority,
    service: cases.service,
    freqLowHz: cases.freqLowHz,
    freqHighHz: cases.freqHighHz,
    address: cases.address,
    officeId: cases.officeId,
    officeName: offices.name,
    investigatorId: cases.investigatorId,
    investigatorName: users.name,
    complainantName: cases.complainantName,
    receivedAt: cases.receivedAt,
    dueAt: cases.dueAt,
    closedAt: cases.closedAt,
    overdue: overdueSql('resolution', now),
  }
}

export type CaseListRow = Awaited<ReturnType<typeof findCasePage>>['rows'][number]

function orderBy(q: CaseListQuery) {
  const dir = q.dir === 'asc' ? asc : desc
  return [...SORT_COLUMNS[q.sort].map((c) => dir(c)), dir(cases.id)]
}

/**
 * One page of the list and how many cases match: exactly up to `exactUpTo` (the list's
 * EXACT_TOTAL_UP_TO), then `capped` (the count stops reading there, so a filter matching the whole table costs as
 * little as one matching a tenth of it).
 */
export async function findCasePage(db: Db, scope: OfficeScope, q: CaseListQuery, me: string, now: Date, exactUpTo = EXACT_TOTAL_UP_TO) {
  const where = filters(scope, q, me, now)
  // Deferred join: the page's ids come from cases alone (an index-only scan in the sort's
  // order, see the cases_list_*_idx indexes), and only those rows are joined and read. A deep
  // page then skips index entries instead of joining every row it passes over.
  const page = db
    .select({ pageId: cases.id })
    .from(cases)
    .where(where)
    .orderBy(...orderBy(q))
    .limit(q.pageSize)
    .offset((q.page - 1) * q.pageSize)
    .as('page')
  const matching = db
    .select({ one: sql`1` })
    .from(cases)
    .where(where)
    .limit(exactUpTo + 1)
    .as('matching')
  const [rows, [counted]] = await Promise.all([
    db
      .select(rowColumns(now))
      .from(page)
      .innerJoin(cases, eq(cases.id, page.pageId))
      .innerJoin(offices, eq(offices.id, cases.officeId))
      .leftJoin(users, eq(users.id, cases.investigatorId))
      .orderBy(...orderBy(q)),
    db.select({ n: count() }).from(matching),
  ])
  const n = counted!.n
  return { rows, total: Math.min(n, exactUpTo), capped: n > exactUpTo }
}

/** The filtered list in the list's order, up to `limit` rows (the CSV export). */
export function findCaseRows(db: Db, scope: OfficeScope, q: CaseListQuery, me: string, now: Date, limit: number) {
  return db
    .select(rowColumns(now))
    .from(cases)
    .innerJoin(offices, eq(offices.id, cases.officeId))
    .leftJoin(users, eq(users.id, cases.investigatorId))
    .where(filters(scope, q, me, now))
    .orderBy(...orderBy(q))
    .limit(limit)
}
