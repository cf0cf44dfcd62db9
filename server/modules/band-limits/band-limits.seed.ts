/**
 * The band-limit list starts as the radio library's BAND_LIMITS. Run as the database's owner
 * at every start (after the migrations): entries whose key is not in the list yet are added
 * with their citation and verification status; entries already there, edited or not, are left
 * alone. The list is national reference data every installation needs, so it is not part of
 * the demo seed; and it is not in a migration, so a new library entry reaches the list at the
 * next start without one.
 */
import { BAND_LIMITS, type BandLimitEntry } from '../../../shared/radio/compliance/band-limits'
import type { Db } from '../../db/client'
import type { NewBandLimit } from '../../db/schema'
import { insertMissingBandLimits } from './band-limits.repo'

/** A library entry as a row of the list: `[V-S]` is verified, `[M]` is not. */
export function bandLimitRowOf(entry: BandLimitEntry): NewBandLimit {
  return {
    key: entry.id,
    title: entry.title,
    bandsHz: entry.bandsHz.map((b) => ({ lowHz: b.lowHz, highHz: b.highHz })),
    spec: entry.spec,
    citation: entry.citation,
    verified: entry.status === '[V-S]',
    statusNote: entry.statusNote,
    conditions: entry.conditions ?? null,
  }
}

/** Adds the library's entries missing from the list; returns how many were added. */
export function seedBandLimits(db: Db, entries: readonly BandLimitEntry[] = BAND_LIMITS): Promise<number> {
  return insertMissingBandLimits(db, entries.map(bandLimitRowOf))
}
