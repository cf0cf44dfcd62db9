/**
 * The national band-limit list: staff read it, supervisors and administrators revise it. A
 * revision names its reason, is made on the version the editor saw (409 stale_version
 * otherwise) and writes the changed fields before and after into the append-only history in
 * the same transaction.
 */
import { isDeepStrictEqual } from 'node:util'
import { withTransaction } from '../../db/client'
import type { ServiceContext } from '../../context'
import { badRequest, conflict, forbidden, notFound } from '../../http/errors'
import { can, type Actor } from '../../policy/policy'
import { BAND_LIMIT_FIELDS, type BandLimitContent, type BandLimitField, type BandLimitPatch } from '../../../shared/schemas/band-limits'
import type { BandLimitChangeView, BandLimitView } from '../../../shared/schemas/views'
import {
  findBandLimit,
  insertBandLimitChange,
  listBandLimitChanges,
  listBandLimitRows,
  updateBandLimitIfVersion,
  type BandLimitChangeWithAuthor,
  type BandLimitWithEditor,
} from './band-limits.repo'
import { recordAudit } from '../audit/audit.repo'

const bandLimitNotFound = () => notFound('band_limit_not_found', 'No such band limit.')
const staleBandLimit = () => conflict('stale_version', 'Someone else changed this band limit a moment ago. Reload it to see their change, then edit again.')

export function presentBandLimit(b: BandLimitWithEditor): BandLimitView {
  return {
    id: b.id,
    key: b.key,
    title: b.title,
    bandsHz: b.bandsHz,
    spec: b.spec,
    citation: b.citation,
    verified: b.verified,
    statusNote: b.statusNote,
    conditions: b.conditions,
    version: b.version,
    updatedAt: b.updatedAt.toISOString(),
    updatedBy: b.updatedByName,
  }
}

function presentChange(c: BandLimitChangeWithAuthor): BandLimitChangeView {
  return { id: c.id, at: c.changedAt.toISOString(), by: c.changedByName, reason: c.reason, version: c.version, before: c.before, after: c.after }
}

export async function listBandLimits(ctx: ServiceContext, actor: Actor): Promise<BandLimitView[]> {
  if (!can(actor, 'bandLimit.read')) throw forbidden()
  return (await listBandLimitRows(ctx.db)).map(presentBandLimit)
}

/** An entry's changes, newest first. */
export async function bandLimitHistory(ctx: ServiceContext, actor: Actor, bandLimitId: string): Promise<BandLimitChangeView[]> {
  if (!can(actor, 'bandLimit.read')) throw forbidden()
  if (!(await findBandLimit(ctx.db, bandLimitId))) throw bandLimitNotFound()
  return (await listBandLimitChanges(ctx.db, bandLimitId)).map(presentChange)
}

/** A value as JSON keeps it (keys with undefined dropped), so a stored and a sent value compare alike. */
const asStored = (v: unknown): unknown => (v === undefined ? undefined : JSON.parse(JSON.stringify(v)))

/** The fields whose sent value differs from the stored one, as they were and as they become. */
export function changedFields(current: BandLimitContent, changes: Partial<BandLimitContent>): { before: Partial<BandLimitContent>; after: Partial<BandLimitContent> } {
  const before: Record<string, unknown> = {}
  const after: Record<string, unknown> = {}
  for (const field of BAND_LIMIT_FIELDS as readonly BandLimitField[]) {
    const next = asStored(changes[field])
    if (next === undefined) continue
    const was = asStored(current[field])
    if (isDeepStrictEqual(was, next)) continue
    before[field] = was
    after[field] = next
  }
  return { before: before as Partial<BandLimitContent>, after: after as Partial<BandLimitContent> }
}

/**
 * Revises a band limit: the changed fields, the reason and the author (from the session) go
 * into the history with the new version.
 */
export async function reviseBandLimit(ctx: ServiceContext, actor: Actor, bandLimitId: string, patch: BandLimitPatch): Promise<BandLimitView> {
  if (!can(actor, 'bandLimit.edit')) throw forbidden('Only a supervisor or an administrator can change band limits.')
  const current = await findBandLimit(ctx.db, bandLimitId)
  if (!current) throw bandLimitNotFound()
  if (current.version !== patch.version) throw staleBandLimit()
  const { before, after } = changedFields(current, patch.changes)
  if (Object.keys(after).length === 0) {
    throw badRequest('no_change', 'These are the values already stored: change at least one of them.')
  }
  await withTransaction(ctx.pool, async ({ db }) => {
    const row = await updateBandLimitIfVersion(db, bandLimitId, patch.version, after, actor.id)
    if (!row) throw staleBandLimit()
    await insertBandLimitChange(db, { bandLimitId, changedBy: actor.id, reason: patch.reason, version: row.version, before, after })
    await recordAudit(db, {
      actorUserId: actor.id,
      action: 'band_limit.edited',
      targetType: 'band_limit',
      targetId: bandLimitId,
      officeId: null,
      details: { key: current.key, version: row.version, reason: patch.reason, fields: Object.keys(after) },
    })
  })
  return presentBandLimit((await findBandLimit(ctx.db, bandLimitId))!)
}
