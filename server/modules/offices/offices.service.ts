import { withTransaction } from '../../db/client'
import type { ServiceContext } from '../../context'
import type { Office } from '../../db/schema'
import { forbidden, notFound } from '../../http/errors'
import { can, officeScope, type Actor } from '../../policy/policy'
import type { OfficeView } from '../../../shared/schemas/views'
import { recordAudit } from '../audit/audit.repo'
import { findOffice, listOffices as listOfficeRows, setOfficeFirstResponseTargets, setOfficeTargets, setOfficeTimeZone } from './offices.repo'

export function presentOffice(o: Office, actor: Actor): OfficeView {
  return {
    id: o.id,
    name: o.name,
    regionName: o.regionName,
    address: o.address,
    centreLatDeg: o.centreLatDeg,
    centreLonDeg: o.centreLonDeg,
    area: o.area ?? null,
    version: o.version,
    responseTargetsHours: { p1: o.targetP1Hours, p2: o.targetP2Hours, p3: o.targetP3Hours, p4: o.targetP4Hours },
    firstResponseTargetsHours: { p1: o.firstResponseP1Hours, p2: o.firstResponseP2Hours, p3: o.firstResponseP3Hours, p4: o.firstResponseP4Hours },
    timeZone: o.timeZone,
    abilities: { setResponseTargets: can(actor, 'office.configure', { officeId: o.id }), edit: can(actor, 'office.manage') },
  }
}

/** Offices the actor may see: their own, or all for an administrator. */
export async function listOffices(ctx: ServiceContext, actor: Actor): Promise<OfficeView[]> {
  if (!can(actor, 'office.list')) throw forbidden()
  const scope = officeScope(actor)
  if ('none' in scope) return []
  const rows = await listOfficeRows(ctx.db, scope)
  return rows.map((o) => presentOffice(o, actor))
}

/** One office; another office answers 404 to staff. */
export async function getOffice(ctx: ServiceContext, actor: Actor, officeId: string): Promise<OfficeView> {
  if (!can(actor, 'office.list')) throw forbidden()
  const o = await findOffice(ctx.db, officeId)
  if (!o || !can(actor, 'office.read', { officeId: o.id })) throw notFound('office_not_found', 'No such office.')
  return presentOffice(o, actor)
}

/** The two clocks an office sets targets for: what each writes and how the audit names it. */
const TARGET_CLOCKS = {
  resolution: { write: setOfficeTargets, action: 'office.response_targets_changed', read: (o: OfficeView) => o.responseTargetsHours },
  firstResponse: { write: setOfficeFirstResponseTargets, action: 'office.first_response_targets_changed', read: (o: OfficeView) => o.firstResponseTargetsHours },
} as const

/**
 * Sets an office's targets for one clock (hours per harm class): resolution, or first response.
 * The due times of its cases whose clock still runs follow, so overdue flags stay true to the
 * targets in force.
 */
export async function setTargets(ctx: ServiceContext, actor: Actor, officeId: string, clock: keyof typeof TARGET_CLOCKS, t: { p1: number; p2: number; p3: number; p4: number }): Promise<OfficeView> {
  const current = await getOffice(ctx, actor, officeId)
  if (!can(actor, 'office.configure', { officeId: current.id })) throw forbidden('Only the office’s supervisor or an administrator can change its targets.')
  const { write, action, read } = TARGET_CLOCKS[clock]
  return withTransaction(ctx.pool, async ({ db }) => {
    const o = await write(db, officeId, { 1: t.p1, 2: t.p2, 3: t.p3, 4: t.p4 })
    const after = presentOffice(o!, actor)
    await recordAudit(db, { actorUserId: actor.id, action, targetType: 'office', targetId: officeId, officeId, details: { beforeHours: read(current), afterHours: read(after) } })
    return after
  })
}

/** Sets an office's time zone: its "today" on the dashboard and its digest follow it. */
export async function setTimeZone(ctx: ServiceContext, actor: Actor, officeId: string, timeZone: string): Promise<OfficeView> {
  const current = await getOffice(ctx, actor, officeId)
  if (!can(actor, 'office.configure', { officeId: current.id })) throw forbidden('Only the office’s supervisor or an administrator can change its time zone.')
  return withTransaction(ctx.pool, async ({ db }) => {
    const o = await setOfficeTimeZone(db, officeId, timeZone)
    await recordAudit(db, {
      actorUserId: actor.id,
      action: 'office.time_zone_changed',
      targetType: 'office',
      targetId: officeId,
      officeId,
      details: { before: current.timeZone, after: timeZone },
    })
    return presentOffice(o!, actor)
  })
}
