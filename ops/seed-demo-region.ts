/**
 * Writes the invented Vellmark Coast (ops/demo-data/region.ts: its outline, coast, place names
 * and the two demo offices' areas) to a database through the regions service.
 */
import { inArray } from 'drizzle-orm'
import type { Db } from '../server/db/client'
import { offices, region } from '../server/db/schema'
import { saveOfficeArea, saveRegion } from '../server/modules/regions/regions.service'
import { DEMO_OFFICE_AREAS, DEMO_REGION_MAP } from './demo-data/region'

// kept importable from here too, for callers that seed and then check what was written
export { DEMO_OFFICE_AREAS, DEMO_REGION_MAP } from './demo-data/region'

/**
 * Writes the demo region and the demo offices' areas, when no region is set yet and every demo
 * office exists (so a database seeded before the region map gets it too, and an installation
 * with offices of its own is never touched). Returns whether it wrote.
 */
export async function seedDemoRegion(db: Db): Promise<boolean> {
  const [existing] = await db.select({ id: region.id }).from(region)
  if (existing) return false
  const names = Object.keys(DEMO_OFFICE_AREAS)
  const demoOffices = await db.select({ id: offices.id, name: offices.name, area: offices.area }).from(offices).where(inArray(offices.name, names))
  if (demoOffices.length !== names.length) return false
  await saveRegion(db, DEMO_REGION_MAP)
  for (const o of demoOffices) if (!o.area) await saveOfficeArea(db, o.id, DEMO_OFFICE_AREAS[o.name]!)
  return true
}
