/** Every query of the equipment register. No authorization here: services ask the policy first. */
import { and, asc, desc, eq, inArray, sql } from 'drizzle-orm'
import type { Db } from '../../db/client'
import { equipment, equipmentChanges, users, type EquipmentChangeRow, type EquipmentRow } from '../../db/schema'
import type { EquipmentContent } from '../../../shared/measurements/types'

export type EquipmentWithEditor = EquipmentRow & { updatedByName: string | null }
export type EquipmentChangeWithAuthor = EquipmentChangeRow & { changedByName: string }

const withEditor = { row: equipment, updatedByName: users.name }

/** An office's register, by type then name. */
export async function equipmentOfOffice(db: Db, officeId: string): Promise<EquipmentWithEditor[]> {
  const rows = await db
    .select(withEditor)
    .from(equipment)
    .leftJoin(users, eq(users.id, equipment.updatedBy))
    .where(eq(equipment.officeId, officeId))
    .orderBy(asc(equipment.type), asc(equipment.name), asc(equipment.id))
  return rows.map((r) => ({ ...r.row, updatedByName: r.updatedByName }))
}

export async function findEquipment(db: Db, id: string): Promise<EquipmentWithEditor | undefined> {
  const [r] = await db.select(withEditor).from(equipment).leftJoin(users, eq(users.id, equipment.updatedBy)).where(eq(equipment.id, id))
  return r && { ...r.row, updatedByName: r.updatedByName }
}

/** Items of one office by id (ids of other offices are left out). */
export async function equipmentOfOfficeByIds(db: Db, officeId: string, ids: readonly string[]): Promise<EquipmentRow[]> {
  if (ids.length === 0) return []
  return db.select().from(equipment).where(and(eq(equipment.officeId, officeId), inArray(equipment.id, [...ids])))
}

export async function insertEquipment(db: Db, officeId: string, content: EquipmentContent, byUserId: string | null): Promise<EquipmentRow> {
  const [row] = await db.insert(equipment).values({ ...content, officeId, updatedBy: byUserId }).returning()
  return row!
}

/** Applies the content when the row is still at `version`; undefined when it has moved on. */
export async function updateEquipmentIfVersion(db: Db, id: string, version: number, content: Partial<EquipmentContent>, byUserId: string): Promise<EquipmentRow | undefined> {
  const [row] = await db
    .update(equipment)
    .set({ ...content, updatedBy: byUserId, version: sql`${equipment.version} + 1`, updatedAt: sql`now()` })
    .where(and(eq(equipment.id, id), eq(equipment.version, version)))
    .returning()
  return row
}

export async function insertEquipmentChange(
  db: Db,
  change: { equipmentId: string; changedBy: string; reason: string | null; version: number; before: Partial<EquipmentContent>; after: Partial<EquipmentContent> },
): Promise<void> {
  await db.insert(equipmentChanges).values(change)
}

/** An item's changes, newest first. */
export async function listEquipmentChanges(db: Db, equipmentId: string): Promise<EquipmentChangeWithAuthor[]> {
  const rows = await db
    .select({ change: equipmentChanges, changedByName: users.name })
    .from(equipmentChanges)
    .innerJoin(users, eq(users.id, equipmentChanges.changedBy))
    .where(eq(equipmentChanges.equipmentId, equipmentId))
    .orderBy(desc(equipmentChanges.changedAt), desc(equipmentChanges.id))
  return rows.map((r) => ({ ...r.change, changedByName: r.changedByName }))
}

/** How many items an office's register holds (the demo seed adds its items only to an empty register). */
export async function countEquipmentOfOffice(db: Db, officeId: string): Promise<number> {
  const [r] = await db.select({ n: sql<number>`count(*)::int` }).from(equipment).where(eq(equipment.officeId, officeId))
  return Number(r?.n ?? 0)
}
