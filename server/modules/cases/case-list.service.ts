/**
 * The case list: server-side paging, sorting and filtering, scoped to the actor's office
 * (an administrator sees every office). The same filters drive the CSV export.
 */
import { CASE_STATE_LABELS } from '../../../shared/domain/case-lifecycle'
import type { CaseListQuery } from '../../../shared/schemas/cases'
import type { CasePage } from '../../../shared/schemas/views'
import type { ServiceContext } from '../../context'
import { forbidden } from '../../http/errors'
import { officeScope, type Actor } from '../../policy/policy'
import { recordAudit } from '../audit/audit.repo'
import { findCasePage, findCaseRows, type OfficeScope } from './case-list.repo'

function listScope(actor: Actor): OfficeScope {
  const scope = officeScope(actor)
  if ('none' in scope) throw forbidden()
  return scope
}

export async function listCases(ctx: ServiceContext, actor: Actor, q: CaseListQuery): Promise<CasePage> {
  const { rows, total, capped } = await findCasePage(ctx.db, listScope(actor), q, actor.id, ctx.now())
  return {
    items: rows.map((r) => ({
      ...r,
      statusLabel: CASE_STATE_LABELS[r.status],
      receivedAt: r.receivedAt.toISOString(),
      dueAt: r.dueAt.toISOString(),
      closedAt: r.closedAt?.toISOString() ?? null,
    })),
    total,
    totalCapped: capped,
    page: q.page,
    pageSize: q.pageSize,
  }
}

/** Most rows one CSV export returns. */
export const CSV_MAX_ROWS = 50_000

export function csvCell(v: unknown): string {
  const s = v === null || v === undefined ? '' : v instanceof Date ? v.toISOString() : String(v)
  // quote always; neutralise spreadsheet formulas in free text
  const safe = /^[=+\-@\t\r]/.test(s) ? `'${s}` : s
  return `"${safe.replace(/"/g, '""')}"`
}

/** The filtered list as CSV (all pages, up to CSV_MAX_ROWS), sorted as on screen. */
export async function exportCasesCsv(ctx: ServiceContext, actor: Actor, q: CaseListQuery): Promise<string> {
  const rows = await findCaseRows(ctx.db, listScope(actor), q, actor.id, ctx.now(), CSV_MAX_ROWS)
  const header = ['reference', 'status', 'priority', 'service', 'freq_low_hz', 'freq_high_hz', 'address', 'office', 'investigator', 'complainant', 'received_at', 'due_at', 'overdue', 'closed_at']
  const lines = rows.map((r) =>
    [r.reference, CASE_STATE_LABELS[r.status], r.priority, r.service, r.freqLowHz, r.freqHighHz, r.address, r.officeName, r.investigatorName, r.complainantName, r.receivedAt, r.dueAt, r.overdue ? 'yes' : 'no', r.closedAt].map(csvCell).join(','),
  )
  // the export carries complainants' names: who took which list is recorded
  await recordAudit(ctx.db, { actorUserId: actor.id, action: 'cases.exported_csv', targetType: 'case_list', targetId: null, officeId: actor.officeId, details: { filters: q, rowCount: rows.length } })
  return [header.join(','), ...lines].join('\r\n') + '\r\n'
}
