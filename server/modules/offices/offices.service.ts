import { asc, eq, sql } from 'drizzle-orm'
import { withTransaction } from '../../db/client'
import type { ServiceContext } from '../../context'
import { offices, type Office } from '../../db/schema'
import { forbidden, notFound } from '../../http/errors'
import { can, officeScope, type Actor } from '../../policy/policy'
import type { OfficeView } from '../../../shared/schemas/views'

export function presentOffice(o: Office, actor: Actor): OfficeView {
  return {
    id: o.id,
    name: o.name,
    regionName: o.regionName,
    centreLatDeg: o.centreLatDeg,
    centreLonDeg: o.centreLonDeg,
    responseTargetsHours: { p1: o.targetP1Hours, p2: o.targetP2Hours, p3: o.targetP3Hours, p4: o.targetP4Hours },
    abilities: { setResponseTargets: can(actor, 'office.configure', { officeId: o.id }) },
  }
}

/** Offices the actor may see: their own, or all for an administrator. */
export async function listOffices(ctx: ServiceContext, actor: Actor): Promise<OfficeView[]> {
  if (!can(actor, 'office.list')) throw forbidden()
  const scope = officeScope(actor)
  if ('none' in scope) return []
  const rows = await ctx.db
    .select()
    .from(offices)
    .where('officeId' in scope ? eq(offices.id, scope.officeId) : undefined)
    .orderBy(asc(offices.name))
  return rows.map((o) => presentOffice(o, actor))
}

/** One office; another office answers 404 to staff. */
export async function getOffice(ctx: ServiceContext, actor: Actor, officeId: string): Promise<OfficeView> {
  if (!can(actor, 'office.list')) throw forbidden()
  const [o] = await ctx.db.select().from(offices).where(eq(offices.id, officeId))
  if (!o || !can(actor, 'office.read', { officeId: o.id })) throw notFound('office_not_found', 'No such office.')
  return presentOffice(o, actor)
}

/**
 * Sets an office's response targets. Due dates of its open cases follow, so overdue flags
 * stay true to the targets in force.
 */
export async function setResponseTargets(ctx: ServiceContext, actor: Actor, officeId: string, t: { p1: number; p2: number; p3: number; p4: number }): Promise<OfficeView> {
  const current = await getOffice(ctx, actor, officeId)
  if (!can(actor, 'office.configure', { officeId: current.id })) throw forbidden('Only the office’s supervisor or an administrator can change its targets.')
  return withTransaction(ctx.pool, async ({ db }) => {
    const [o] = await db.update(offices).set({ targetP1Hours: t.p1, targetP2Hours: t.p2, targetP3Hours: t.p3, targetP4Hours: t.p4 }).where(eq(offices.id, officeId)).returning()
    await db.execute(sql`
      update cases set due_at = received_at + make_interval(hours => case priority when 1 then ${t.p1}::int when 2 then ${t.p2}::int when 3 then ${t.p3}::int else ${t.p4}::int end)
      where office_id = ${officeId} and status <> 'closed'`)
    return presentOffice(o!, actor)
  })
}
