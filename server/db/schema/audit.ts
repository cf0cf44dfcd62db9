import { sql } from 'drizzle-orm'
import { bigserial, check, index, jsonb, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core'
import { AUDIT_ACTIONS } from '../../../shared/domain/audit'
import { offices } from './offices'
import { sqlList } from './sql-list'
import { users } from './users'

/**
 * The audit log: administrative changes, exports and staff opening a complainant's personal
 * details. Append-only (make_append_only in the migration): the application may only add and
 * read rows, and `at` is the database's time. Written in the same transaction as the change.
 */
export const auditLog = pgTable(
  'audit_log',
  {
    id: bigserial('id', { mode: 'number' }).primaryKey(),
    at: timestamp('at', { withTimezone: true }).notNull().defaultNow(),
    /** Who did it; null for the system (scheduled jobs). */
    actorUserId: uuid('actor_user_id').references(() => users.id),
    action: text('action', { enum: AUDIT_ACTIONS }).notNull(),
    /** What it was done to: `user`, `office`, `case`, `band_limit`, `equipment`, `station_register`… */
    targetType: text('target_type').notNull(),
    /** The target's id (a uuid or a stable key); null for actions on a set (an export). */
    targetId: text('target_id'),
    /** The office the target belongs to, for the office filter; null when none. */
    officeId: uuid('office_id').references(() => offices.id),
    /** What changed (before/after, counts, filters of an export); never secrets or personal data. */
    details: jsonb('details').$type<Record<string, unknown>>().notNull().default({}),
  },
  (t) => [
    check('audit_log_action_known', sql`${t.action} in ${sqlList(AUDIT_ACTIONS)}`),
    check('audit_log_details_object', sql`jsonb_typeof(${t.details}) = 'object'`),
    index('audit_log_at_idx').on(t.at),
    index('audit_log_action_at_idx').on(t.action, t.at),
    index('audit_log_actor_at_idx').on(t.actorUserId, t.at),
    index('audit_log_office_at_idx').on(t.officeId, t.at),
    index('audit_log_target_at_idx').on(t.targetType, t.targetId, t.at),
  ],
)

export type AuditLogRow = typeof auditLog.$inferSelect
