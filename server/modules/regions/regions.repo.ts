/** Every query of the regions module: the one region row and the offices' public map data. */
import { asc, eq } from 'drizzle-orm'
import type { Db } from '../../db/client'
import { offices, region } from '../../db/schema'
import type { AreaGeometry, RegionInput } from '../../../shared/schemas/region'

/** The region (the row with id 1), or undefined when none is configured. */
export async function findRegion(db: Db): Promise<RegionInput | undefined> {
  const [r] = await db.select({ name: region.name, outline: region.outline, coast: region.coast, places: region.places }).from(region).where(eq(region.id, 1))
  return r
}

/** Each office's name, point and area by name: what anyone may see of an office, nothing more. */
export function listOfficesForMap(db: Db): Promise<{ name: string; centreLatDeg: number; centreLonDeg: number; area: AreaGeometry | null }[]> {
  return db
    .select({ name: offices.name, centreLatDeg: offices.centreLatDeg, centreLonDeg: offices.centreLonDeg, area: offices.area })
    .from(offices)
    .orderBy(asc(offices.name))
}

/** Writes the region (there is one row, id 1), replacing what was there. The caller checks the input. */
export async function upsertRegion(db: Db, r: RegionInput): Promise<void> {
  await db
    .insert(region)
    .values({ id: 1, ...r })
    .onConflictDoUpdate({ target: region.id, set: { name: r.name, outline: r.outline, coast: r.coast, places: r.places, updatedAt: new Date() } })
}

/** Sets one office's area (null: none). The caller checks the geometry. */
export async function setOfficeArea(db: Db, officeId: string, area: AreaGeometry | null): Promise<void> {
  await db.update(offices).set({ area }).where(eq(offices.id, officeId))
}
