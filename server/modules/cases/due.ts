import { addHours } from 'date-fns'
import type { Priority } from '../../../shared/domain/services'

/** The response target of a case: received time plus the office's target for its priority. */
export function dueAt(receivedAt: Date, priority: Priority, targetsHours: Record<Priority, number>): Date {
  return addHours(receivedAt, targetsHours[priority])
}

/** Overdue: still open after its response target. */
export function isOverdue(c: { status: string; dueAt: Date }, now: Date): boolean {
  return c.status !== 'closed' && c.dueAt.getTime() < now.getTime()
}
