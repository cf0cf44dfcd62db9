/**
 * An office's antennas and instruments register: staff of the office read it, its supervisor and
 * administrators add and edit items. Every edit is made on the version the editor saw (409
 * stale_version otherwise) and writes the changed fields before and after into the append-only
 * history in the same transaction; a new item's first content is kept there too.
 */
import { isDeepStrictEqual } from 'node:util'
import { withTransaction } from '../../db/client'
import type { ServiceContext } from '../../context'
import { badRequest, conflict, forbidden, notFound } from '../../http/errors'
import type { Actor } from '../../policy/policy'
import { mayManageEquipment, mayReadEquipment } from '../../policy/equipment-policy'
import type { EquipmentContentParsed } from '../../../shared/schemas/measurements'
import type { EquipmentChangeView, EquipmentView } from '../../../shared/schemas/measurements'
import type { EquipmentContent } from '../../../shared/measurements/types'
import type { EquipmentRow } from '../../db/schema'
import { findOffice } from '../offices/offices.repo'
import {
  equipmentOfOffice,
  findEquipment,
  insertEquipment,
  insertEquipmentChange,
  listEquipmentChanges,
  updateEquipmentIfVersion,
  type EquipmentChangeWithAuthor,
  type EquipmentWithEditor,
} from './equipment.repo'
import { recordAudit } from '../audit/audit.repo'

export const equipmentNotFound = () => notFound('equipment_not_found', 'No such item in your office’s register.')
const officeNotFound = () => notFound('office_not_found', 'No such office.')
const staleEquipment = () => conflict('stale_version', 'Someone else changed this item a moment ago. Reload it to see their change, then edit again.')
const mayNotManage = () => forbidden('Only the office’s supervisor or an administrator can change its equipment register.')

/** The content fields, in the order the history shows them. */
export const EQUIPMENT_FIELDS = [
  'name', 'type', 'manufacturer', 'model', 'serial', 'antennaGainDbi', 'antennaFactorTable', 'defaultCableLossDb',
  'defaultPreampGainDb', 'minFreqHz', 'maxFreqHz', 'maxInputDbm', 'calibrationDueOn', 'notes',
] as const satisfies readonly (keyof EquipmentContent)[]

/** 'expired' when the due date has passed at `today` (yyyy-mm-dd), 'missing' without one. */
export function calibrationState(dueOn: string | null, today: string): 'ok' | 'expired' | 'missing' {
  if (!dueOn) return 'missing'
  return today > dueOn ? 'expired' : 'ok'
}

export function presentEquipment(e: EquipmentWithEditor, today = new Date().toISOString().slice(0, 10)): EquipmentView {
  return {
    id: e.id,
    officeId: e.officeId,
    name: e.name,
    type: e.type,
    manufacturer: e.manufacturer,
    model: e.model,
    serial: e.serial,
    antennaGainDbi: e.antennaGainDbi,
    antennaFactorTable: e.antennaFactorTable,
    defaultCableLossDb: e.defaultCableLossDb,
    defaultPreampGainDb: e.defaultPreampGainDb,
    minFreqHz: e.minFreqHz,
    maxFreqHz: e.maxFreqHz,
    maxInputDbm: e.maxInputDbm,
    calibrationDueOn: e.calibrationDueOn,
    calibrationState: calibrationState(e.calibrationDueOn, today),
    notes: e.notes,
    version: e.version,
    updatedAt: e.updatedAt.toISOString(),
    updatedBy: e.updatedByName,
  }
}

function presentChange(c: EquipmentChangeWithAuthor): EquipmentChangeView {
  return { id: c.id, at: c.changedAt.toISOString(), by: c.changedByName, reason: c.reason, version: c.version, before: c.before, after: c.after }
}

function contentOf(row: EquipmentRow): EquipmentContent {
  return Object.fromEntries(EQUIPMENT_FIELDS.map((f) => [f, row[f]])) as unknown as EquipmentContent
}

/** A value as JSON keeps it, so a stored and a sent value compare alike. */
const asStored = (v: unknown): unknown => (v === undefined ? null : JSON.parse(JSON.stringify(v)))

function changedFields(current: EquipmentContent, next: EquipmentContent): { before: Partial<EquipmentContent>; after: Partial<EquipmentContent> } {
  const before: Record<string, unknown> = {}
  const after: Record<string, unknown> = {}
  for (const f of EQUIPMENT_FIELDS) {
    const was = asStored(current[f])
    const now = asStored(next[f])
    if (isDeepStrictEqual(was, now)) continue
    before[f] = was
    after[f] = now
  }
  return { before: before as Partial<EquipmentContent>, after: after as Partial<EquipmentContent> }
}

/** An office the actor may see the register of (another office's is 404 to staff). */
async function visibleOffice(ctx: ServiceContext, actor: Actor, officeId: string): Promise<void> {
  if (!mayReadEquipment(actor, officeId)) throw officeNotFound()
  if (!(await findOffice(ctx.db, officeId))) throw officeNotFound()
}

/** An item the actor may see (another office's is 404). */
async function visibleItem(ctx: ServiceContext, actor: Actor, equipmentId: string): Promise<EquipmentWithEditor> {
  const item = await findEquipment(ctx.db, equipmentId)
  if (!item || !mayReadEquipment(actor, item.officeId)) throw equipmentNotFound()
  return item
}

export async function listOfficeEquipment(ctx: ServiceContext, actor: Actor, officeId: string): Promise<{ items: EquipmentView[]; abilities: { manage: boolean } }> {
  await visibleOffice(ctx, actor, officeId)
  const rows = await equipmentOfOffice(ctx.db, officeId)
  return { items: rows.map((r) => presentEquipment(r)), abilities: { manage: mayManageEquipment(actor, officeId) } }
}

/** Adds an item to the office's register; its first content opens its history. */
export async function addEquipment(ctx: ServiceContext, actor: Actor, officeId: string, content: EquipmentContentParsed): Promise<EquipmentView> {
  await visibleOffice(ctx, actor, officeId)
  if (!mayManageEquipment(actor, officeId)) throw mayNotManage()
  const id = await withTransaction(ctx.pool, async ({ db }) => {
    const row = await insertEquipment(db, officeId, content, actor.id)
    await insertEquipmentChange(db, { equipmentId: row.id, changedBy: actor.id, reason: 'Added to the register', version: 1, before: {}, after: contentOf(row) })
    await recordAudit(db, { actorUserId: actor.id, action: 'equipment.changed', targetType: 'equipment', targetId: row.id, officeId, details: { change: 'added', version: 1 } })
    return row.id
  })
  return presentEquipment((await findEquipment(ctx.db, id))!)
}

/** Edits an item: the changed fields, the reason and the author go into the history with the new version. */
export async function reviseEquipment(
  ctx: ServiceContext,
  actor: Actor,
  equipmentId: string,
  patch: { item: EquipmentContentParsed; version: number; reason: string | null },
): Promise<EquipmentView> {
  const current = await visibleItem(ctx, actor, equipmentId)
  if (!mayManageEquipment(actor, current.officeId)) throw mayNotManage()
  if (current.version !== patch.version) throw staleEquipment()
  const { before, after } = changedFields(contentOf(current), patch.item)
  if (Object.keys(after).length === 0) throw badRequest('no_change', 'These are the values already stored: change at least one of them.')
  await withTransaction(ctx.pool, async ({ db }) => {
    const row = await updateEquipmentIfVersion(db, equipmentId, patch.version, after, actor.id)
    if (!row) throw staleEquipment()
    await insertEquipmentChange(db, { equipmentId, changedBy: actor.id, reason: patch.reason, version: row.version, before, after })
    await recordAudit(db, {
      actorUserId: actor.id,
      action: 'equipment.changed',
      targetType: 'equipment',
      targetId: equipmentId,
      officeId: current.officeId,
      details: { change: 'revised', version: row.version, reason: patch.reason, fields: Object.keys(after) },
    })
  })
  return presentEquipment((await findEquipment(ctx.db, equipmentId))!)
}

/** An item's history, newest first. */
export async function equipmentHistory(ctx: ServiceContext, actor: Actor, equipmentId: string): Promise<EquipmentChangeView[]> {
  await visibleItem(ctx, actor, equipmentId)
  return (await listEquipmentChanges(ctx.db, equipmentId)).map(presentChange)
}
