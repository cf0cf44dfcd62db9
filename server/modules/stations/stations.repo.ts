/** Every query of the licence register. No authorization here: services ask the policy first. */
import { and, asc, count, desc, eq, ilike, inArray, max, or, sql } from 'drizzle-orm'
import type { Db } from '../../db/client'
import {
  authorisedStations,
  stationRegisterVersions,
  users,
  type AuthorisedStationRow,
  type NewAuthorisedStation,
  type NewStationRegisterVersion,
  type StationRegisterVersionRow,
} from '../../db/schema'

/** A register version with the name of whoever imported it. */
export type RegisterVersionWithImporter = StationRegisterVersionRow & { importedByName: string }

/** The version in force (the newest), or null before the first import. */
export async function currentRegisterVersion(db: Db): Promise<number | null> {
  const [r] = await db.select({ v: max(stationRegisterVersions.version) }).from(stationRegisterVersions)
  return r?.v ?? null
}

/**
 * Takes the register's import lock for the rest of the transaction, so two imports never get
 * the same version number, and answers the next version.
 */
export async function lockNextRegisterVersion(db: Db): Promise<number> {
  await db.execute(sql`SELECT pg_advisory_xact_lock(5172033)`)
  return ((await currentRegisterVersion(db)) ?? 0) + 1
}

export async function insertRegisterVersion(db: Db, row: NewStationRegisterVersion): Promise<StationRegisterVersionRow> {
  const [r] = await db.insert(stationRegisterVersions).values(row).returning()
  return r!
}

/** Inserts a version's stations in batches; returns how many. */
export async function insertStations(db: Db, rows: NewAuthorisedStation[], batchSize = 1000): Promise<number> {
  for (let i = 0; i < rows.length; i += batchSize) await db.insert(authorisedStations).values(rows.slice(i, i + batchSize))
  return rows.length
}

const withImporter = { row: stationRegisterVersions, importedByName: users.name }

/** Every version, newest first. */
export async function listRegisterVersions(db: Db): Promise<RegisterVersionWithImporter[]> {
  const rows = await db
    .select(withImporter)
    .from(stationRegisterVersions)
    .innerJoin(users, eq(users.id, stationRegisterVersions.importedBy))
    .orderBy(desc(stationRegisterVersions.version))
  return rows.map((r) => ({ ...r.row, importedByName: r.importedByName }))
}

export async function findRegisterVersion(db: Db, version: number): Promise<RegisterVersionWithImporter | undefined> {
  const [r] = await db
    .select(withImporter)
    .from(stationRegisterVersions)
    .innerJoin(users, eq(users.id, stationRegisterVersions.importedBy))
    .where(eq(stationRegisterVersions.version, version))
  return r && { ...r.row, importedByName: r.importedByName }
}

/** A station's authorised range as the GiST index holds it (the same expression, edges included). */
const authorisedRange = sql`numrange(${authorisedStations.lowFreqHz}::numeric, ${authorisedStations.highFreqHz}::numeric, '[]')`

/** `%`, `_` and `\` written by a person are matched as themselves. */
const likeText = (s: string) => `%${s.replace(/[\\%_]/g, (c) => `\\${c}`)}%`

/** One page of a version's stations, by station code, filtered by text and by a frequency in the range. */
export async function searchStationRows(
  db: Db,
  q: { version: number; text?: string; freqHz?: number; limit: number; offset: number },
): Promise<{ total: number; rows: AuthorisedStationRow[] }> {
  const where = and(
    eq(authorisedStations.registerVersion, q.version),
    q.text ? or(ilike(authorisedStations.licensee, likeText(q.text)), ilike(authorisedStations.stationCode, likeText(q.text))) : undefined,
    q.freqHz !== undefined ? sql`${authorisedRange} @> ${q.freqHz}::numeric` : undefined,
  )
  const [{ n }] = (await db.select({ n: count() }).from(authorisedStations).where(where)) as [{ n: number }]
  const rows = await db.select().from(authorisedStations).where(where).orderBy(asc(authorisedStations.stationCode)).limit(q.limit).offset(q.offset)
  return { total: n, rows }
}

export async function findStationRow(db: Db, id: string): Promise<AuthorisedStationRow | undefined> {
  const [r] = await db.select().from(authorisedStations).where(eq(authorisedStations.id, id))
  return r
}

export async function stationRowsByIds(db: Db, ids: readonly string[]): Promise<AuthorisedStationRow[]> {
  if (ids.length === 0) return []
  return db.select().from(authorisedStations).where(inArray(authorisedStations.id, [...ids]))
}

/** What the ranking reads of a station, and nothing more (the read-only ranking of many stations). */
const rankableColumns = {
  id: authorisedStations.id,
  registerVersion: authorisedStations.registerVersion,
  stationCode: authorisedStations.stationCode,
  licensee: authorisedStations.licensee,
  service: authorisedStations.service,
  latitudeDeg: authorisedStations.latitudeDeg,
  longitudeDeg: authorisedStations.longitudeDeg,
  lowFreqHz: authorisedStations.lowFreqHz,
  highFreqHz: authorisedStations.highFreqHz,
  authorisedEirpDbm: authorisedStations.authorisedEirpDbm,
}
export type RankableStationRow = { [K in keyof typeof rankableColumns]: AuthorisedStationRow[K] }

/** overlappingStationRows, with the columns the ranking reads only. */
export async function overlappingRankableRows(db: Db, q: { lowFreqHz: number; highFreqHz: number }): Promise<RankableStationRow[]> {
  const current = db.select({ v: max(stationRegisterVersions.version) }).from(stationRegisterVersions)
  return db
    .select(rankableColumns)
    .from(authorisedStations)
    .where(and(eq(authorisedStations.registerVersion, sql`(${current})`), sql`${authorisedRange} && numrange(${q.lowFreqHz}::numeric, ${q.highFreqHz}::numeric, '[]')`))
}

/**
 * The stations of the version in force whose authorised range meets [lowFreqHz, highFreqHz]
 * (edges included; the ranking decides what a shared edge is worth).
 */
export async function overlappingStationRows(db: Db, q: { lowFreqHz: number; highFreqHz: number }): Promise<AuthorisedStationRow[]> {
  const current = db.select({ v: max(stationRegisterVersions.version) }).from(stationRegisterVersions)
  return db
    .select()
    .from(authorisedStations)
    .where(and(eq(authorisedStations.registerVersion, sql`(${current})`), sql`${authorisedRange} && numrange(${q.lowFreqHz}::numeric, ${q.highFreqHz}::numeric, '[]')`))
}
