/**
 * Setting up offices (administrators): a new office with its details and area, an edit of
 * them, and a check of an area before it is saved. An area routes every report filed inside it,
 * so it is checked (no crossing edges: the schema) and compared with the other offices' areas
 * (overlaps are saved with a warning that says which report goes where). Every change is audited.
 */
import { areaKm2, areaWarnings, type AreaWarningDraft } from '../../../shared/domain/office-areas'
import type { AreaCheckRequest, OfficeInput, OfficeUpdate } from '../../../shared/schemas/offices'
import type { OfficeView } from '../../../shared/schemas/views'
import type { ServiceContext } from '../../context'
import { isUniqueViolation, withTransaction, type Db } from '../../db/client'
import type { Office } from '../../db/schema'
import { conflict, forbidden, notFound } from '../../http/errors'
import { can, type Actor } from '../../policy/policy'
import { recordAudit } from '../audit/audit.repo'
import { presentOffice } from './offices.service'
import { findOffice, insertOffice, lockOffice, officeAreas, updateOfficeDetails, type OfficeDetails } from './offices.repo'

export interface OfficeSaved {
  office: OfficeView
  warnings: AreaWarningDraft[]
}

const nameTaken = (name: string) => conflict('office_name_taken', `An office named "${name}" exists already; choose another name.`)

function requireManager(actor: Actor): void {
  if (!can(actor, 'office.manage')) throw forbidden('Only an administrator can set up offices and their areas.')
}

async function warningsFor(db: Db, opts: { officeId?: string; officeName: string; area: OfficeInput['area']; latDeg?: number; lonDeg?: number }): Promise<AreaWarningDraft[]> {
  if (!opts.area) return []
  const others = (await officeAreas(db)).filter((o) => o.id !== opts.officeId)
  const position = opts.latDeg !== undefined && opts.lonDeg !== undefined ? { latDeg: opts.latDeg, lonDeg: opts.lonDeg } : undefined
  return areaWarnings({ officeName: opts.officeName, area: opts.area, position, others })
}

const columnsOf = (input: OfficeInput): OfficeDetails => ({
  name: input.name,
  regionName: input.regionName,
  address: input.address,
  centreLatDeg: input.latDeg,
  centreLonDeg: input.lonDeg,
  timeZone: input.timeZone,
  area: input.area,
})

/** A new office; 409 office_name_taken when the name is in use. */
export async function createOffice(ctx: ServiceContext, actor: Actor, input: OfficeInput): Promise<OfficeSaved> {
  requireManager(actor)
  return withTransaction(ctx.pool, async ({ db }) => {
    const o = await insertOffice(db, columnsOf(input))
    if (!o) throw nameTaken(input.name)
    const warnings = await warningsFor(db, { officeId: o.id, officeName: o.name, area: input.area, latDeg: input.latDeg, lonDeg: input.lonDeg })
    await recordAudit(db, { actorUserId: actor.id, action: 'office.created', targetType: 'office', targetId: o.id, officeId: o.id, details: { after: detailsOf(o), warnings: warnings.map((w) => w.code) } })
    return { office: presentOffice(o, actor), warnings }
  })
}

/** Replaces an office's details and area; 409 stale_version when someone saved since `version`. */
export async function updateOffice(ctx: ServiceContext, actor: Actor, officeId: string, input: OfficeUpdate): Promise<OfficeSaved> {
  requireManager(actor)
  return withTransaction(ctx.pool, async ({ db }) => {
    const before = await lockOffice(db, officeId)
    if (!before) throw notFound('office_not_found', 'No such office.')
    if (before.version !== input.version) throw conflict('stale_version', 'Someone else saved this office a moment ago. Reload to see their change, then try again.')
    const after = await updateOfficeDetails(db, officeId, columnsOf(input), ctx.now()).catch((e: unknown) => {
      // the unique name is the database's to keep: a rename to another office's name, even one racing its save
      throw isUniqueViolation(e, 'offices_name_unique') ? nameTaken(input.name) : e
    })
    const warnings = await warningsFor(db, { officeId, officeName: after!.name, area: input.area, latDeg: input.latDeg, lonDeg: input.lonDeg })
    await auditChanges(db, actor, before, after!, warnings)
    return { office: presentOffice(after!, actor), warnings }
  })
}

/** An area's size and warnings, before it is saved (nothing is written). */
export async function checkArea(ctx: ServiceContext, actor: Actor, req: AreaCheckRequest): Promise<{ areaKm2: number; warnings: AreaWarningDraft[] }> {
  requireManager(actor)
  const self = req.officeId ? await findOffice(ctx.db, req.officeId) : undefined
  const warnings = await warningsFor(ctx.db, { officeId: req.officeId, officeName: self?.name ?? 'this office', area: req.area, latDeg: req.latDeg, lonDeg: req.lonDeg })
  return { areaKm2: Math.round(areaKm2(req.area) * 100) / 100, warnings }
}

const detailsOf = (o: Office) => ({ name: o.name, regionName: o.regionName, address: o.address, latDeg: o.centreLatDeg, lonDeg: o.centreLonDeg, timeZone: o.timeZone, hasArea: o.area !== null })

/** One audit entry for the details, another for the area (the area is what routes reports). */
async function auditChanges(db: Db, actor: Actor, before: Office, after: Office, warnings: AreaWarningDraft[]): Promise<void> {
  const base = { actorUserId: actor.id, targetType: 'office', targetId: after.id, officeId: after.id } as const
  const b = detailsOf(before)
  const a = detailsOf(after)
  const changed = (Object.keys(a) as (keyof typeof a)[]).filter((k) => k !== 'hasArea' && a[k] !== b[k])
  if (changed.length > 0) await recordAudit(db, { ...base, action: 'office.updated', details: { changed, before: b, after: a } })
  if (JSON.stringify(before.area) !== JSON.stringify(after.area)) {
    await recordAudit(db, { ...base, action: 'office.area_changed', details: { before: before.area, after: after.area, warnings: warnings.map((w) => w.code) } })
  }
}
