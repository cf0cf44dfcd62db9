/**
 * Which case-list filters each dashboard figure stands for, in the list API's spelling
 * (GET /api/cases and the /cases page's query alike). The web links every figure to the list
 * with these; the server's tests count the list with the same ones, so a figure and the list
 * it opens cannot drift apart.
 */
import type { CaseClockName } from './case-clocks'
import type { CaseState } from './case-lifecycle'
import type { Priority } from './services'

export type FigureFilters = Record<string, string>

const scoped = (officeId: string | null): FigureFilters => (officeId ? { officeId } : {})

export const figureFilters = {
  /** Open cases in one state, of one priority (or every priority). */
  open: (officeId: string | null, status?: CaseState, priority?: Priority): FigureFilters => ({
    ...scoped(officeId),
    open: 'true',
    ...(status ? { status } : {}),
    ...(priority ? { priority: String(priority) } : {}),
  }),
  overdue: (officeId: string | null): FigureFilters => ({ ...scoped(officeId), overdue: 'true' }),
  dueSoon: (officeId: string | null): FigureFilters => ({ ...scoped(officeId), dueSoon: 'true' }),
  firstResponseOverdue: (officeId: string | null): FigureFilters => ({ ...scoped(officeId), firstResponseOverdue: 'true' }),
  receivedToday: (officeId: string | null): FigureFilters => ({ ...scoped(officeId), receivedToday: 'true' }),
  /** An investigator's open cases ('none': the unassigned ones); `overdueOnly` for the overdue part. */
  workload: (officeId: string | null, investigatorId: string | 'none', overdueOnly = false): FigureFilters => ({
    ...scoped(officeId),
    investigatorId,
    open: 'true',
    ...(overdueOnly ? { overdue: 'true' } : {}),
  }),
  /** The cases one performance figure is computed from: first answered, or closed, in the window. */
  performance: (officeId: string | null, clock: CaseClockName, windowDays: number, priority: Priority): FigureFilters => ({
    ...scoped(officeId),
    [clock === 'firstResponse' ? 'respondedInLastDays' : 'closedInLastDays']: String(windowDays),
    priority: String(priority),
  }),
}
