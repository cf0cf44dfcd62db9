import { asc, eq } from 'drizzle-orm'
import type { ServiceContext } from '../../context'
import { offices, type Office } from '../../db/schema'
import { forbidden, notFound } from '../../http/errors'
import { can, officeScope, type Actor } from '../../policy/policy'

export interface OfficeView {
  id: string
  name: string
  regionName: string
  centreLatDeg: number
  centreLonDeg: number
  responseTargetsHours: { p1: number; p2: number; p3: number; p4: number }
}

export function presentOffice(o: Office): OfficeView {
  return {
    id: o.id,
    name: o.name,
    regionName: o.regionName,
    centreLatDeg: o.centreLatDeg,
    centreLonDeg: o.centreLonDeg,
    responseTargetsHours: { p1: o.targetP1Hours, p2: o.targetP2Hours, p3: o.targetP3Hours, p4: o.targetP4Hours },
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
  return rows.map(presentOffice)
}

/** One office; another office answers 404 to staff. */
export async function getOffice(ctx: ServiceContext, actor: Actor, officeId: string): Promise<OfficeView> {
  if (!can(actor, 'office.list')) throw forbidden()
  const [o] = await ctx.db.select().from(offices).where(eq(offices.id, officeId))
  if (!o || !can(actor, 'office.read', { officeId: o.id })) throw notFound('office_not_found', 'No such office.')
  return presentOffice(o)
}
