/**
 * The demo offices' antennas and instruments (invented items of the invented Vellmark Coast
 * offices): a log-periodic antenna with an antenna-factor table, a biconical (Harrowmere's with
 * a calibration that has run out, to show the warning), a whip with a gain, a handheld analyser,
 * a cable and a preamplifier. Added only to a demo office whose register is empty; the first
 * content of each item opens its history, written in the name of the office's supervisor.
 */
import type pg from 'pg'
import { createDb } from '../server/db/client'
import { countEquipmentOfOffice, insertEquipment, insertEquipmentChange } from '../server/modules/equipment/equipment.repo'
import type { EquipmentContent } from '../shared/measurements/types'

const none = { manufacturer: null, model: null, serial: null, antennaGainDbi: null, antennaFactorTable: null, defaultCableLossDb: null, defaultPreampGainDb: null, minFreqHz: null, maxFreqHz: null, maxInputDbm: null, calibrationDueOn: null, notes: null }
const item = (c: Partial<EquipmentContent> & Pick<EquipmentContent, 'name' | 'type'>): EquipmentContent => ({ ...none, ...c })
const af = (rows: [number, number][]) => rows.map(([mhz, dbPerM]) => ({ freqHz: mhz * 1e6, antennaFactorDbPerM: dbPerM }))

/** Invented calibration tables (shaped like real ones: AF ≈ 20·log10 f(MHz) − G − 29.77 at 50 Ω). */
const LOG_PERIODIC_AF = af([[200, 10.6], [300, 13.9], [500, 18.1], [800, 22.2], [1000, 24.1], [1500, 27.6], [2000, 30.2], [3000, 33.9]])
const BICONICAL_AF = af([[30, 13.4], [50, 10.2], [80, 8.9], [100, 9.6], [150, 12.3], [200, 15.0], [300, 18.1]])

function kit(office: string, seq: number, dueSoon: string, expiredOrNot: string): EquipmentContent[] {
  return [
    item({ name: `Log-periodic antenna LP-${seq}`, type: 'antenna', manufacturer: 'Vellmark Instruments', model: 'LP-0230', serial: `${office}-LP-0${seq}`, antennaFactorTable: LOG_PERIODIC_AF, minFreqHz: 200e6, maxFreqHz: 3e9, defaultCableLossDb: 1.8, calibrationDueOn: dueSoon }),
    item({ name: `Biconical antenna BC-${seq}`, type: 'antenna', manufacturer: 'Vellmark Instruments', model: 'BC-0330', serial: `${office}-BC-0${seq}`, antennaFactorTable: BICONICAL_AF, minFreqHz: 30e6, maxFreqHz: 300e6, defaultCableLossDb: 1.2, calibrationDueOn: expiredOrNot }),
    item({ name: `Whip antenna WH-${seq}`, type: 'antenna', model: 'WH-440', serial: `${office}-WH-0${seq}`, antennaGainDbi: 2.1, minFreqHz: 400e6, maxFreqHz: 470e6, calibrationDueOn: dueSoon, notes: 'Gain from the maker’s sheet, checked on the office’s range.' }),
    item({ name: `Handheld analyser HA-${seq}`, type: 'analyser', manufacturer: 'Coastline Test', model: 'HA-6', serial: `${office}-HA-0${seq}`, minFreqHz: 9e3, maxFreqHz: 6e9, maxInputDbm: 20, defaultCableLossDb: 1.8, calibrationDueOn: dueSoon }),
    item({ name: `Measuring cable CB-${seq} (N–N, 3 m)`, type: 'cable', serial: `${office}-CB-0${seq}`, defaultCableLossDb: 1.8, minFreqHz: 9e3, maxFreqHz: 6e9, calibrationDueOn: dueSoon, notes: '1.8 dB at 1 GHz; 0.9 dB at 200 MHz.' }),
    item({ name: `Preamplifier PA-${seq}`, type: 'preamplifier', serial: `${office}-PA-0${seq}`, defaultPreampGainDb: 20, minFreqHz: 10e6, maxFreqHz: 3e9, calibrationDueOn: dueSoon }),
  ]
}

const KITS: Record<string, EquipmentContent[]> = {
  // Harrowmere's biconical ran out of calibration: measurements with it carry the warning
  Harrowmere: kit('HM', 1, '2027-06-30', '2026-09-30'),
  'Kestrel Bay': kit('KB', 2, '2027-04-30', '2027-02-28'),
}

/** Adds the demo items to each demo office whose register is empty; returns how many. */
export async function seedDemoEquipment(pool: pg.Pool): Promise<number> {
  const client = await pool.connect()
  let added = 0
  try {
    await client.query('BEGIN')
    await client.query('SELECT pg_advisory_xact_lock(5172033)')
    const db = createDb(client)
    for (const [officeName, items] of Object.entries(KITS)) {
      const { rows } = await client.query<{ office_id: string; supervisor_id: string | null }>(
        `SELECT o.id AS office_id, (SELECT u.id FROM users u WHERE u.office_id = o.id AND u.role = 'supervisor' ORDER BY u.created_at LIMIT 1) AS supervisor_id
           FROM offices o WHERE o.name = $1`,
        [officeName],
      )
      const office = rows[0]
      if (!office?.supervisor_id || (await countEquipmentOfOffice(db, office.office_id)) > 0) continue
      for (const content of items) {
        const row = await insertEquipment(db, office.office_id, content, office.supervisor_id)
        await insertEquipmentChange(db, { equipmentId: row.id, changedBy: office.supervisor_id, reason: 'Added to the register', version: 1, before: {}, after: content })
        added++
      }
    }
    await client.query('COMMIT')
    return added
  } catch (e) {
    await client.query('ROLLBACK').catch(() => {})
    throw e
  } finally {
    client.release()
  }
}
