/**
 * The dashboard: a supervisor's own office, or every office (or one, by filter) for an
 * administrator. The policy decides the scope; the repo counts.
 */
import { CASE_CLOCK_NAMES } from '../../../shared/domain/case-clocks'
import { OPEN_STATES } from '../../../shared/domain/case-lifecycle'
import { PRIORITIES } from '../../../shared/domain/services'
import { DASHBOARD_MAP_LIMIT, DASHBOARD_WINDOWS_DAYS, type DashboardQuery, type DashboardView } from '../../../shared/schemas/dashboard'
import type { ServiceContext } from '../../context'
import { forbidden, notFound } from '../../http/errors'
import { can, officeScope, type Actor } from '../../policy/policy'
import type { OfficeScope } from '../cases/case-list.repo'
import { followUpFigures } from '../follow-ups/follow-ups.repo'
import { findOffice } from '../offices/offices.repo'
import { clockCounts, clockPerformance, investigatorLoads, officeChoices, openByStatePriority, openCasesForMap, scopeOffices, unassignedCounts } from './dashboard.repo'

async function dashboardScope(ctx: ServiceContext, actor: Actor, q: DashboardQuery): Promise<OfficeScope> {
  if (!can(actor, 'dashboard.read')) throw forbidden('The dashboard is for supervisors and administrators.')
  const own = officeScope(actor)
  if ('none' in own) throw forbidden()
  if (!q.officeId) return own
  // another office than one's own is not found, as everywhere for staff
  const o = await findOffice(ctx.db, q.officeId)
  if (!o || !can(actor, 'dashboard.read', { officeId: o.id })) throw notFound('office_not_found', 'No such office.')
  return { officeId: o.id }
}

const hours = (p1: number, p2: number, p3: number, p4: number) => ({ p1, p2, p3, p4 })

export async function getDashboard(ctx: ServiceContext, actor: Actor, q: DashboardQuery): Promise<DashboardView> {
  const scope = await dashboardScope(ctx, actor, q)
  const now = ctx.now()
  const db = ctx.db
  const [offices, choices, grid, clocks, loads, unassigned, perf, mapRows] = await Promise.all([
    scopeOffices(db, scope),
    officeChoices(db, 'officeId' in officeScope(actor) ? [actor.officeId!] : undefined),
    openByStatePriority(db, scope),
    clockCounts(db, scope, now),
    investigatorLoads(db, scope, now),
    unassignedCounts(db, scope, now),
    Promise.all(CASE_CLOCK_NAMES.map((clock) => clockPerformance(db, scope, clock, DASHBOARD_WINDOWS_DAYS, now))),
    openCasesForMap(db, scope, now, DASHBOARD_MAP_LIMIT + 1),
  ])
  // follow-ups: the follow-ups module's own count, per office in scope, summed
  const followUps = await followUpFigures(db, offices.map((o) => o.id), now)
  const counted = new Map(grid.map((g) => [`${g.status}:${g.priority}`, g.count]))
  return {
    asOf: now.toISOString(),
    officeId: 'officeId' in scope ? scope.officeId : null,
    offices: offices.map((o) => ({
      id: o.id,
      name: o.name,
      timeZone: o.timeZone,
      centreLatDeg: o.centreLatDeg,
      centreLonDeg: o.centreLonDeg,
      area: o.area ?? null,
      firstResponseTargetsHours: hours(o.firstResponseP1Hours, o.firstResponseP2Hours, o.firstResponseP3Hours, o.firstResponseP4Hours),
      resolutionTargetsHours: hours(o.targetP1Hours, o.targetP2Hours, o.targetP3Hours, o.targetP4Hours),
    })),
    officeChoices: choices,
    openByStatePriority: OPEN_STATES.flatMap((status) => PRIORITIES.map((priority) => ({ status, priority, count: counted.get(`${status}:${priority}`) ?? 0 }))),
    clocks,
    workload: loads,
    unassigned,
    performance: DASHBOARD_WINDOWS_DAYS.flatMap((windowDays) =>
      CASE_CLOCK_NAMES.flatMap((clock, i) =>
        PRIORITIES.map((priority) => {
          const row = perf[i]!.find((r) => r.windowDays === windowDays && r.priority === priority)
          return { windowDays, clock, priority, count: row?.count ?? 0, medianHours: row?.medianHours ?? null, p90Hours: row?.p90Hours ?? null, metTarget: row?.metTarget ?? 0 }
        }),
      ),
    ),
    followUps: { due: followUps.reduce((n, f) => n + f.due, 0), overdue: followUps.reduce((n, f) => n + f.overdue, 0) },
    map: { cases: mapRows.slice(0, DASHBOARD_MAP_LIMIT), truncated: mapRows.length > DASHBOARD_MAP_LIMIT },
  }
}
