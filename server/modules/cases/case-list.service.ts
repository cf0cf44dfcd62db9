/**
 * The case list: server-side paging, sorting and filtering, scoped to the actor's office
 * (an administrator sees every office). The same filters drive the CSV export.
 */
import { and, asc, count, desc, eq, gte, inArray, isNull, lt, lte, ne, sql, type SQL } from 'drizzle-orm'
import { CASE_STATE_LABELS, type CaseState } from '../../../shared/domain/case-lifecycle'
import type { CaseListQuery } from '../../../shared/schemas/cases'
import type { CasePage, PriorityLevel } from '../../../shared/schemas/views'
import type { ServiceContext } from '../../context'
import { cases, offices, users } from '../../db/schema'
import { forbidden } from '../../http/errors'
import { officeScope, type Actor } from '../../policy/policy'

const SORT_COLUMNS = {
  reference: [cases.reference],
  receivedAt: [cases.receivedAt],
  priority: [cases.priority, cases.receivedAt],
  dueAt: [cases.dueAt],
  status: [cases.status, cases.receivedAt],
  service: [cases.service, cases.receivedAt],
  frequency: [cases.freqLowHz, cases.freqHighHz],
} as const

function filters(actor: Actor, q: CaseListQuery): SQL[] {
  const scope = officeScope(actor)
  if ('none' in scope) throw forbidden()
  const where: SQL[] = []
  if ('officeId' in scope) where.push(eq(cases.officeId, scope.officeId))
  if (q.officeId) where.push(eq(cases.officeId, q.officeId))
  if (q.status?.length) where.push(inArray(cases.status, q.status))
  if (q.priority?.length) where.push(inArray(cases.priority, q.priority))
  if (q.service?.length) where.push(inArray(cases.service, q.service))
  if (q.investigatorId === 'me') where.push(eq(cases.investigatorId, actor.id))
  else if (q.investigatorId === 'none') where.push(isNull(cases.investigatorId))
  else if (q.investigatorId) where.push(eq(cases.investigatorId, q.investigatorId))
  if (q.open === true) where.push(ne(cases.status, 'closed'))
  if (q.open === false) where.push(eq(cases.status, 'closed'))
  if (q.overdue === true) where.push(and(ne(cases.status, 'closed'), lt(cases.dueAt, sql`now()`))!)
  if (q.overdue === false) where.push(sql`not (${cases.status} <> 'closed' and ${cases.dueAt} < now())`)
  // a case's range overlaps the asked range
  if (q.freqToHz !== undefined) where.push(lte(cases.freqLowHz, q.freqToHz))
  if (q.freqFromHz !== undefined) where.push(gte(cases.freqHighHz, q.freqFromHz))
  if (q.q) where.push(sql`${cases.searchText} like ${'%' + q.q.toLowerCase().replace(/[\\%_]/g, (m) => '\\' + m) + '%'}`)
  return where
}

const rowColumns = {
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
  overdue: sql<boolean>`(${cases.status} <> 'closed' and ${cases.dueAt} < now())`,
}

function orderBy(q: CaseListQuery) {
  const dir = q.dir === 'asc' ? asc : desc
  return [...SORT_COLUMNS[q.sort].map((c) => dir(c)), dir(cases.id)]
}

export async function listCases(ctx: ServiceContext, actor: Actor, q: CaseListQuery): Promise<CasePage> {
  const where = and(...filters(actor, q))
  // Deferred join: the page's ids come from cases alone (an index-only scan in the sort's
  // order, see the cases_list_*_idx indexes), and only those rows are joined and read. A deep
  // page then skips index entries instead of joining every row it passes over.
  const page = ctx.db
    .select({ pageId: cases.id })
    .from(cases)
    .where(where)
    .orderBy(...orderBy(q))
    .limit(q.pageSize)
    .offset((q.page - 1) * q.pageSize)
    .as('page')
  const [rows, totals] = await Promise.all([
    ctx.db
      .select(rowColumns)
      .from(page)
      .innerJoin(cases, eq(cases.id, page.pageId))
      .innerJoin(offices, eq(offices.id, cases.officeId))
      .leftJoin(users, eq(users.id, cases.investigatorId))
      .orderBy(...orderBy(q)),
    ctx.db.select({ total: count() }).from(cases).where(where).then((r) => r),
  ])
  const total = totals[0]!.total
  return {
    items: rows.map((r) => ({
      ...r,
      status: r.status as CaseState,
      priority: r.priority as PriorityLevel,
      statusLabel: CASE_STATE_LABELS[r.status as CaseState],
      receivedAt: r.receivedAt.toISOString(),
      dueAt: r.dueAt.toISOString(),
      closedAt: r.closedAt?.toISOString() ?? null,
    })),
    total,
    page: q.page,
    pageSize: q.pageSize,
  }
}

/** Most rows one CSV export returns. */
export const CSV_MAX_ROWS = 50_000

function csvCell(v: unknown): string {
  const s = v === null || v === undefined ? '' : v instanceof Date ? v.toISOString() : String(v)
  // quote always; neutralise spreadsheet formulas in free text
  const safe = /^[=+\-@\t\r]/.test(s) ? `'${s}` : s
  return `"${safe.replace(/"/g, '""')}"`
}

/** The filtered list as CSV (all pages, up to CSV_MAX_ROWS), sorted as on screen. */
export async function exportCasesCsv(ctx: ServiceContext, actor: Actor, q: CaseListQuery): Promise<string> {
  const rows = await ctx.db
    .select(rowColumns)
    .from(cases)
    .innerJoin(offices, eq(offices.id, cases.officeId))
    .leftJoin(users, eq(users.id, cases.investigatorId))
    .where(and(...filters(actor, q)))
    .orderBy(...orderBy(q))
    .limit(CSV_MAX_ROWS)
  const header = ['reference', 'status', 'priority', 'service', 'freq_low_hz', 'freq_high_hz', 'address', 'office', 'investigator', 'complainant', 'received_at', 'due_at', 'overdue', 'closed_at']
  const lines = rows.map((r) =>
    [r.reference, CASE_STATE_LABELS[r.status as CaseState], r.priority, r.service, r.freqLowHz, r.freqHighHz, r.address, r.officeName, r.investigatorName, r.complainantName, r.receivedAt, r.dueAt, r.overdue ? 'yes' : 'no', r.closedAt].map(csvCell).join(','),
  )
  return [header.join(','), ...lines].join('\r\n') + '\r\n'
}
