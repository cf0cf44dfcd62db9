/**
 * The audit log's reading side (administrators only) and the one sensitive read recorded by
 * the read itself: a member of staff opening a complainant's personal details.
 */
import type { ServiceContext } from '../../context'
import { withTransaction } from '../../db/client'
import { forbidden } from '../../http/errors'
import { can, type Actor } from '../../policy/policy'
import { AUDIT_ACTION_LABELS, COMPLAINANT_VIEW_AUDIT_WINDOW_MS } from '../../../shared/domain/audit'
import { AUDIT_CSV_MAX_ROWS, type AuditEntryView, type AuditFilterQuery, type AuditListQuery, type AuditPageView } from '../../../shared/schemas/audit'
import { csvCell } from '../cases/case-list.service'
import { countAudit, listAudit, recordAudit, recordAuditOncePerWindow, type AuditFilter, type AuditListRow } from './audit.repo'

function presentEntry(r: AuditListRow): AuditEntryView {
  return {
    id: r.id,
    at: r.at.toISOString(),
    action: r.action,
    actionLabel: AUDIT_ACTION_LABELS[r.action],
    actor: r.actorUserId ? { id: r.actorUserId, name: r.actorName ?? '', email: r.actorEmail ?? '' } : null,
    targetType: r.targetType,
    targetId: r.targetId,
    officeId: r.officeId,
    officeName: r.officeName,
    details: r.details,
  }
}

function filterOf(q: AuditFilterQuery): AuditFilter {
  return { action: q.action, actorUserId: q.actorUserId, officeId: q.officeId, targetType: q.targetType, targetId: q.targetId, from: q.from, to: q.to }
}

/** A page of the audit log, newest first. */
export async function listAuditEntries(ctx: ServiceContext, actor: Actor, q: AuditListQuery): Promise<AuditPageView> {
  if (!can(actor, 'audit.read')) throw forbidden('Only an administrator can read the audit log.')
  const f = filterOf(q)
  const [rows, total] = await Promise.all([listAudit(ctx.db, f, { limit: q.pageSize, offset: (q.page - 1) * q.pageSize }), countAudit(ctx.db, f)])
  return { entries: rows.map(presentEntry), page: q.page, pageSize: q.pageSize, total }
}

const CSV_HEADER = ['id', 'at', 'action', 'action_label', 'actor_id', 'actor_name', 'actor_email', 'target_type', 'target_id', 'office_id', 'office_name', 'details']

/**
 * The filtered log as CSV, newest first, up to AUDIT_CSV_MAX_ROWS entries (`truncated` says
 * when there were more). Taking the audit list is itself recorded.
 */
export async function exportAuditCsv(ctx: ServiceContext, actor: Actor, q: AuditFilterQuery): Promise<{ csv: string; truncated: boolean }> {
  if (!can(actor, 'audit.read')) throw forbidden('Only an administrator can read the audit log.')
  const f = filterOf(q)
  const rows = await listAudit(ctx.db, f, { limit: AUDIT_CSV_MAX_ROWS + 1, offset: 0 })
  const truncated = rows.length > AUDIT_CSV_MAX_ROWS
  const kept = truncated ? rows.slice(0, AUDIT_CSV_MAX_ROWS) : rows
  const lines = kept.map((r) =>
    [r.id, r.at, r.action, AUDIT_ACTION_LABELS[r.action], r.actorUserId, r.actorName, r.actorEmail, r.targetType, r.targetId, r.officeId, r.officeName, JSON.stringify(r.details)].map(csvCell).join(','),
  )
  await recordAudit(ctx.db, {
    actorUserId: actor.id,
    action: 'audit.exported_csv',
    targetType: 'audit_log',
    targetId: null,
    officeId: null,
    details: { filters: { ...f, from: f.from?.toISOString(), to: f.to?.toISOString() }, rowCount: kept.length, truncated },
  })
  return { csv: [CSV_HEADER.join(','), ...lines].join('\r\n') + '\r\n', truncated }
}

/**
 * Records that a member of staff opened a case's complainant's personal details (name,
 * address, telephone), at most once per person and case per COMPLAINANT_VIEW_AUDIT_WINDOW_MS.
 * A case without any (anonymous, or already erased) records nothing. Returns whether an entry
 * was written.
 */
export async function noteComplainantDetailsViewed(
  ctx: ServiceContext,
  actor: Actor,
  c: { id: string; reference: string; officeId: string; complainant: { name: string | null; email: string | null; phone: string | null } },
): Promise<boolean> {
  const shown = (['name', 'email', 'phone'] as const).filter((k) => c.complainant[k] !== null && c.complainant[k] !== '')
  if (shown.length === 0) return false
  return withTransaction(ctx.pool, ({ db }) =>
    recordAuditOncePerWindow(
      db,
      { actorUserId: actor.id, action: 'complainant_details.viewed', targetType: 'case', targetId: c.id, officeId: c.officeId, details: { reference: c.reference, fields: shown } },
      COMPLAINANT_VIEW_AUDIT_WINDOW_MS,
    ),
  )
}
