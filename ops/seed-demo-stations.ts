/**
 * The demo's licence register: the invented register CSV (ops/demo-data/station-register.csv)
 * imported through the same service an administrator's upload goes through — stored in the
 * object store, read with the mapping, made a register version — by the demo administrator.
 * Runs only while the register has no version; needs the object store.
 */
import fs from 'node:fs'
import type pg from 'pg'
import { createDb } from '../server/db/client'
import { log } from '../server/log/logger'
import { currentRegisterVersion } from '../server/modules/stations/stations.repo'
import { importRegisterStream } from '../server/modules/stations/stations.service'
import { findUserForSignIn } from '../server/modules/users/users.repo'
import type { ObjectStore } from '../server/storage/object-store'
import { DEMO_REGISTER_FILE, DEMO_REGISTER_FILE_NAME, DEMO_REGISTER_MAPPING } from './demo-data/station-register'

/** One seeder at a time across processes. */
const REGISTER_SEED_LOCK = 5_172_034

/** Imports the demo register when there is none yet; returns the version made, or null. */
export async function seedDemoStationRegister(pool: pg.Pool, objectStore: ObjectStore, adminEmail = 'admin@quietband.test'): Promise<number | null> {
  const lock = await pool.connect()
  try {
    await lock.query('SELECT pg_advisory_lock($1)', [REGISTER_SEED_LOCK])
    const db = createDb(pool)
    if ((await currentRegisterVersion(db)) !== null) return null
    const admin = await findUserForSignIn(db, adminEmail)
    if (!admin) return null
    const { version, report } = await importRegisterStream({ db, pool, objectStore }, admin.id, fs.createReadStream(DEMO_REGISTER_FILE), {
      fileName: DEMO_REGISTER_FILE_NAME,
      delimiter: 'comma',
      mapping: DEMO_REGISTER_MAPPING,
    })
    if (report.rejectedCount > 0) log().warn(`demo licence register: ${report.rejectedCount} rows rejected (first: line ${report.rejected[0]?.line}: ${report.rejected[0]?.problems.join('; ')})`)
    return version.version
  } finally {
    await lock.query('SELECT pg_advisory_unlock($1)', [REGISTER_SEED_LOCK]).catch(() => {})
    lock.release()
  }
}
