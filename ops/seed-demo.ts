/**
 * Demo data for the invented Vellmark Coast region: two field offices, their staff, an
 * administrator and two complainants. Nothing here is a real place, person or licensee.
 * Runs only on an empty database (no offices yet).
 */
import type pg from 'pg'
import { createDb } from '../server/db/client'
import { offices, users } from '../server/db/schema'
import { hashPassword } from '../server/modules/auth/passwords'
import { seedDemoCases } from './seed-demo-cases'
import { seedDemoRegion } from './seed-demo-region'
import { seedDemoEquipment } from './seed-demo-equipment'
import { seedDemoStationRegister } from './seed-demo-stations'
import type { ObjectStore } from '../server/storage/object-store'
import { log } from '../server/log/logger'

export const DEMO_PASSWORD = 'quietband-demo'

export const DEMO_OFFICES = [
  { name: 'Harrowmere', regionName: 'Vellmark Coast — north', address: '3 Signal Hill Road, Harrowmere VC2 4HM', centreLatDeg: 48.12, centreLonDeg: -31.4, timeZone: 'Atlantic/Azores', targetP1Hours: 4, targetP2Hours: 24, targetP3Hours: 72, targetP4Hours: 240 },
  { name: 'Kestrel Bay', regionName: 'Vellmark Coast — south', address: 'Harbour Office, 11 Quayside, Kestrel Bay VC7 1KB', centreLatDeg: 47.62, centreLonDeg: -30.55, timeZone: 'Atlantic/Azores', targetP1Hours: 6, targetP2Hours: 36, targetP3Hours: 96, targetP4Hours: 336 },
] as const

export const DEMO_USERS = [
  { email: 'admin@quietband.test', name: 'Idris Vaughan-Ole', role: 'admin', office: null },
  { email: 's.okafor@quietband.test', name: 'Sade Okafor', role: 'supervisor', office: 'Harrowmere' },
  { email: 'm.ferreira@quietband.test', name: 'Marta Ferreira', role: 'investigator', office: 'Harrowmere' },
  { email: 't.nakamura@quietband.test', name: 'Tomas Nakamura', role: 'investigator', office: 'Harrowmere' },
  { email: 'l.brandt@quietband.test', name: 'Lene Brandt', role: 'supervisor', office: 'Kestrel Bay' },
  { email: 'a.kowalczyk@quietband.test', name: 'Aleks Kowalczyk', role: 'investigator', office: 'Kestrel Bay' },
  { email: 'j.mbeki@quietband.test', name: 'Joel Mbeki', role: 'investigator', office: 'Kestrel Bay' },
  { email: 'rosa.lindqvist@example.test', name: 'Rosa Lindqvist', role: 'complainant', office: null },
  { email: 'harbour.master@example.test', name: 'Port of Harrowmere (harbour master)', role: 'complainant', office: null },
] as const

/**
 * Inserts the demo data when the database has no office yet. Returns whether it seeded. With
 * the object store, the demo licence register is imported too while the register has none.
 */
export async function seedDemo(pool: pg.Pool, opts: { objectStore?: ObjectStore } = {}): Promise<boolean> {
  const seeded = await seedDemoPeople(pool)
  await seedDemoEquipment(pool)
  if (opts.objectStore) {
    // the register needs the file store: when it is away the rest of the demo still stands, and the next start imports it
    await seedDemoStationRegister(pool, opts.objectStore).catch((e: unknown) => log().warn(`demo licence register not imported: ${(e as Error)?.message ?? String(e)}`))
  }
  return seeded
}

async function seedDemoPeople(pool: pg.Pool): Promise<boolean> {
  const client = await pool.connect()
  try {
    await client.query('BEGIN')
    // one seeder at a time across processes
    await client.query('SELECT pg_advisory_xact_lock(5172032)')
    const { rows } = await client.query('SELECT count(*)::int AS n FROM offices')
    if (rows[0].n > 0) {
      // a demo database seeded before the region map gets the demo region (nothing else is touched)
      await seedDemoRegion(createDb(client))
      await client.query('COMMIT')
      return false
    }
    const tx = createDb(client)
    const inserted = await tx.insert(offices).values([...DEMO_OFFICES]).returning({ id: offices.id, name: offices.name })
    const officeId = new Map(inserted.map((o) => [o.name, o.id]))
    await seedDemoRegion(tx)
    const passwordHash = await hashPassword(DEMO_PASSWORD)
    await tx.insert(users).values(
      DEMO_USERS.map((u) => ({ email: u.email, name: u.name, role: u.role, officeId: u.office ? officeId.get(u.office)! : null, passwordHash })),
    )
    await client.query('COMMIT')
    await seedDemoCases(pool)
    return true
  } catch (e) {
    await client.query('ROLLBACK').catch(() => {})
    throw e
  } finally {
    client.release()
  }
}
