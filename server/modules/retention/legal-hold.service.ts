/**
 * Legal hold on a case: while one is in force the retention run leaves the case untouched.
 * Setting and lifting write a legal_hold_events row, a timeline entry and an audit entry in one
 * transaction.
 */
import type { LegalHoldView } from '../../../shared/schemas/retention'
import type { LiftLegalHoldInput, SetLegalHoldInput } from '../../../shared/schemas/retention'
import type { ServiceContext } from '../../context'
import { withTransaction, type Db } from '../../db/client'
import { badRequest, conflict, forbidden } from '../../http/errors'
import type { Actor } from '../../policy/policy'
import { mayManageLegalHold, mayReadLegalHold } from '../../policy/retention-policy'
import { recordAudit } from '../audit/audit.repo'
import { loadVisibleCase } from '../cases/case-access'
import { appendEvent } from '../cases/cases.repo'
import { findUserById } from '../users/users.repo'
import { insertLegalHoldEvent, latestLegalHolds, legalHoldHistory, lockCaseRow } from './retention.repo'

/** The UTC day of a time, YYYY-MM-DD. */
export const utcDay = (at: Date) => at.toISOString().slice(0, 10)

/** Whether a case's latest legal-hold row holds it on `now`'s day (an `until` day is included). */
export function holdInForce(latest: { action: string; untilDate: string | null } | undefined, now: Date): boolean {
  return !!latest && latest.action === 'set' && (latest.untilDate === null || latest.untilDate >= utcDay(now))
}

async function present(db: Db, actor: Actor, c: { id: string; officeId: string }, now: Date): Promise<LegalHoldView> {
  const history = await legalHoldHistory(db, c.id)
  const latest = history[0]
  const active = holdInForce(latest, now) && latest ? { since: latest.at.toISOString(), byName: latest.byName, reason: latest.reason, until: latest.untilDate } : null
  const manage = mayManageLegalHold(actor, c)
  return {
    caseId: c.id,
    active,
    history: history.map((h) => ({ action: h.action, at: h.at.toISOString(), byName: h.byName, reason: h.reason, until: h.untilDate })),
    abilities: { set: manage, lift: manage && active !== null },
  }
}

/** GET /api/cases/:id/legal-hold */
export async function getLegalHold(ctx: ServiceContext, actor: Actor, caseId: string): Promise<LegalHoldView> {
  const c = await loadVisibleCase(ctx.db, actor, caseId)
  if (!mayReadLegalHold(actor, c)) throw forbidden('Only staff of the case\u2019s office can see its legal hold.')
  return present(ctx.db, actor, c, ctx.now())
}

/** POST /api/cases/:id/legal-hold — sets a hold, or replaces the one in force (new reason or last day). */
export async function setLegalHold(ctx: ServiceContext, actor: Actor, caseId: string, input: SetLegalHoldInput): Promise<LegalHoldView> {
  return withTransaction(ctx.pool, async ({ db }) => {
    const c = await loadVisibleCase(db, actor, caseId)
    if (!mayManageLegalHold(actor, c)) throw forbidden('Only a supervisor of the case\u2019s office or an administrator can set a legal hold.')
    const now = ctx.now()
    if (input.until !== undefined && input.until < utcDay(now)) {
      throw badRequest('validation_failed', 'Some fields need attention.', [{ path: 'until', message: `The last day of the hold cannot be in the past (today is ${utcDay(now)}, UTC).` }])
    }
    await lockCaseRow(db, c.id)
    const until = input.until ?? null
    await insertLegalHoldEvent(db, { caseId: c.id, action: 'set', actorUserId: actor.id, reason: input.reason, untilDate: until })
    const name = (await findUserById(db, actor.id))?.name ?? 'Unknown user'
    await appendEvent(db, {
      caseId: c.id,
      at: now,
      actorUserId: actor.id,
      actorLabel: name,
      kind: 'legal_hold_set',
      visibility: 'internal',
      body: until ? `Legal hold until ${until}: ${input.reason}` : `Legal hold until lifted: ${input.reason}`,
      data: { until },
    })
    await recordAudit(db, { actorUserId: actor.id, action: 'legal_hold.set', targetType: 'case', targetId: c.id, officeId: c.officeId, details: { reference: c.reference, until } })
    return present(db, actor, c, now)
  })
}

/** POST /api/cases/:id/legal-hold/lift — 409 when no hold is in force. */
export async function liftLegalHold(ctx: ServiceContext, actor: Actor, caseId: string, input: LiftLegalHoldInput): Promise<LegalHoldView> {
  return withTransaction(ctx.pool, async ({ db }) => {
    const c = await loadVisibleCase(db, actor, caseId)
    if (!mayManageLegalHold(actor, c)) throw forbidden('Only a supervisor of the case\u2019s office or an administrator can lift a legal hold.')
    const now = ctx.now()
    await lockCaseRow(db, c.id)
    const latest = (await latestLegalHolds(db, [c.id])).get(c.id)
    if (!holdInForce(latest, now)) throw conflict('no_legal_hold', 'This case has no legal hold in force to lift.')
    await insertLegalHoldEvent(db, { caseId: c.id, action: 'lifted', actorUserId: actor.id, reason: input.reason, untilDate: null })
    const name = (await findUserById(db, actor.id))?.name ?? 'Unknown user'
    await appendEvent(db, { caseId: c.id, at: now, actorUserId: actor.id, actorLabel: name, kind: 'legal_hold_lifted', visibility: 'internal', body: `Legal hold lifted: ${input.reason}` })
    await recordAudit(db, { actorUserId: actor.id, action: 'legal_hold.lifted', targetType: 'case', targetId: c.id, officeId: c.officeId, details: { reference: c.reference } })
    return present(db, actor, c, now)
  })
}
