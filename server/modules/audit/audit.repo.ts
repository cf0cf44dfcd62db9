/** Every query of the audit module: writing entries (inside the caller's transaction) and reading the log. */
import { and, count, desc, eq, gte, lt, sql, type SQL } from 'drizzle-orm'
import type { Db } from '../../db/client'
import { auditLog, offices, users, type AuditLogRow } from '../../db/schema'
import type { AuditAction } from '../../../shared/domain/audit'

export interface AuditEntry {
  /** Who did it, from the session; null for the system (scheduled jobs). */
  actorUserId: string | null
  action: AuditAction
  targetType: string
  targetId: string | null
  officeId: string | null
  /** What changed; never secrets or personal data. */
  details: Record<string, unknown>
}

/**
 * Adds one entry to the audit log. `db` may be a transaction: write the entry in the same
 * transaction as the change it records, so neither exists without the other. The time is the
 * database's (make_append_only).
 */
export async function recordAudit(db: Db, entry: AuditEntry): Promise<void> {
  await db.insert(auditLog).values({
    actorUserId: entry.actorUserId,
    action: entry.action,
    targetType: entry.targetType,
    targetId: entry.targetId,
    officeId: entry.officeId,
    details: entry.details,
  })
}

/**
 * Records `entry` unless the same actor already has an entry of the same action on the same
 * target within the last `windowMs` (by the database's clock). Takes a transaction-scoped
 * advisory lock on (action, actor, target) first, so two requests at once write one entry;
 * call it inside a transaction. Returns whether an entry was written.
 */
export async function recordAuditOncePerWindow(db: Db, entry: AuditEntry & { actorUserId: string; targetId: string }, windowMs: number): Promise<boolean> {
  await db.execute(sql`SELECT pg_advisory_xact_lock(hashtextextended(${`audit:${entry.action}:${entry.actorUserId}:${entry.targetId}`}, 0))`)
  const [recent] = await db
    .select({ id: auditLog.id })
    .from(auditLog)
    .where(
      and(
        eq(auditLog.actorUserId, entry.actorUserId),
        eq(auditLog.action, entry.action),
        eq(auditLog.targetType, entry.targetType),
        eq(auditLog.targetId, entry.targetId),
        gte(auditLog.at, sql`now() - make_interval(secs => ${windowMs / 1000})`),
      ),
    )
    .limit(1)
  if (recent) return false
  await recordAudit(db, entry)
  return true
}

export interface AuditFilter {
  action?: AuditAction
  actorUserId?: string
  officeId?: string
  targetType?: string
  targetId?: string
  /** Inclusive. */
  from?: Date
  /** Exclusive. */
  to?: Date
}

export type AuditListRow = AuditLogRow & { actorName: string | null; actorEmail: string | null; officeName: string | null }

function whereOf(f: AuditFilter): SQL | undefined {
  const parts: SQL[] = []
  if (f.action) parts.push(eq(auditLog.action, f.action))
  if (f.actorUserId) parts.push(eq(auditLog.actorUserId, f.actorUserId))
  if (f.officeId) parts.push(eq(auditLog.officeId, f.officeId))
  if (f.targetType) parts.push(eq(auditLog.targetType, f.targetType))
  if (f.targetId) parts.push(eq(auditLog.targetId, f.targetId))
  if (f.from) parts.push(gte(auditLog.at, f.from))
  if (f.to) parts.push(lt(auditLog.at, f.to))
  return parts.length ? and(...parts) : undefined
}

/** A page of the log, newest first, with the actor's name and address and the office's name. */
export function listAudit(db: Db, f: AuditFilter, page: { limit: number; offset: number }): Promise<AuditListRow[]> {
  return db
    .select({
      id: auditLog.id,
      at: auditLog.at,
      actorUserId: auditLog.actorUserId,
      action: auditLog.action,
      targetType: auditLog.targetType,
      targetId: auditLog.targetId,
      officeId: auditLog.officeId,
      details: auditLog.details,
      actorName: users.name,
      actorEmail: users.email,
      officeName: offices.name,
    })
    .from(auditLog)
    .leftJoin(users, eq(users.id, auditLog.actorUserId))
    .leftJoin(offices, eq(offices.id, auditLog.officeId))
    .where(whereOf(f))
    .orderBy(desc(auditLog.at), desc(auditLog.id))
    .limit(page.limit)
    .offset(page.offset)
}

export async function countAudit(db: Db, f: AuditFilter): Promise<number> {
  const [row] = await db.select({ n: count() }).from(auditLog).where(whereOf(f))
  return row?.n ?? 0
}
