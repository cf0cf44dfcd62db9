/**
 * Follow-ups keep an enforcement deadline in view: what the responsible party must do, by a
 * day of the office's calendar. One is made from the approved finding's compliance deadline
 * when the supervisor approves it (`followUpFromApprovedFinding`, called inside the closing
 * move's transaction) or added by staff; confirming, escalating and reopening are one move
 * each, written with its timeline entry in one transaction and an optimistic version check.
 */
import {
  FOLLOW_UP_MOVE_LABELS,
  FOLLOW_UP_STATE_LABELS,
  FOLLOW_UP_MOVES,
  followUpEventKind,
  followUpMoveAllowedFrom,
  localDay,
  type FollowUpMoveName,
} from '../../../shared/domain/follow-ups'
import { RECOMMENDED_ACTION_LABELS } from '../../../shared/domain/findings'
import type { CaseFollowUpsResponse, DueFollowUpsResponse, FollowUp, FollowUpMove, FollowUpView } from '../../../shared/schemas/follow-ups'
import type { ServiceContext } from '../../context'
import { withTransaction, type Db } from '../../db/client'
import type { CaseRow } from '../../db/schema'
import { badRequest, conflict, forbidden, notFound } from '../../http/errors'
import type { Actor } from '../../policy/policy'
import { canSeeCase, type CaseActor } from '../../policy/case-policy'
import { mayMoveFollowUp, mayReadEnforcement, mayRecordEnforcement } from '../../policy/follow-up-policy'
import { loadVisibleCase } from '../cases/case-access'
import { appendEvent, findCase, lockCase } from '../cases/cases.repo'
import { findUserById } from '../users/users.repo'
import { findingsOfCase } from '../findings/findings.repo'
import { presentFollowUp } from './follow-ups.present'
import { dueFollowUps, findFollowUp, followUpsOfCase, insertFollowUp, officeTimeZone, officesForDigest, updateFollowUpIfVersion } from './follow-ups.repo'

export const followUpNotFound = () => notFound('follow_up_not_found', 'No such follow-up in your office.')

async function todayOf(db: Db, officeId: string, now: Date): Promise<{ today: string; timeZone: string }> {
  const timeZone = (await officeTimeZone(db, officeId)) ?? 'UTC'
  return { today: localDay(now, timeZone), timeZone }
}

/** GET /api/cases/:id/follow-ups */
export async function listCaseFollowUps(ctx: ServiceContext, actor: CaseActor, caseId: string): Promise<CaseFollowUpsResponse> {
  const c = await loadVisibleCase(ctx.db, actor, caseId)
  if (!mayReadEnforcement(actor, c)) throw forbidden('Only staff of the case\u2019s office can read its follow-ups.')
  const { today, timeZone } = await todayOf(ctx.db, c.officeId, ctx.now())
  const rows = await followUpsOfCase(ctx.db, c.id)
  return { today, timeZone, followUps: rows.map((r) => presentFollowUp(r, actor, c, today)), abilities: { add: mayRecordEnforcement(actor, c) } }
}

/** Staff add a follow-up; its deadline may not lie before the office's today. */
export async function addFollowUp(ctx: ServiceContext, actor: CaseActor, caseId: string, input: FollowUp): Promise<FollowUpView> {
  return withTransaction(ctx.pool, async ({ db }) => {
    const c = await loadVisibleCase(db, actor, caseId)
    if (!mayRecordEnforcement(actor, c) || actor.role === 'tracking_link') throw forbidden('Only staff of the case\u2019s office can add follow-ups.')
    const now = ctx.now()
    const { today } = await todayOf(db, c.officeId, now)
    if (input.dueOn < today) {
      throw badRequest('validation_failed', 'Some fields need attention.', [{ path: 'dueOn', message: `The deadline cannot be in the past (today is ${today} at the office).` }])
    }
    const name = (await findUserById(db, actor.id))?.name ?? 'Unknown user'
    const row = (await insertFollowUp(db, { caseId: c.id, dueOn: input.dueOn, expected: input.expected, source: 'staff', findingId: null, createdBy: actor.id }))!
    await appendEvent(db, { caseId: c.id, at: now, actorUserId: actor.id, actorLabel: name, kind: 'follow_up_added', visibility: 'internal', body: `Due ${row.dueOn}: ${row.expected}`, data: { followUpId: row.id, dueOn: row.dueOn } })
    return presentFollowUp(row, actor, c, today)
  })
}

/**
 * The approved finding's compliance deadline becomes a follow-up (once per finding). Called in
 * the approving move's transaction; a finding without a deadline makes none.
 */
export async function followUpFromApprovedFinding(db: Db, c: CaseRow, approver: { id: string; name: string }, now: Date): Promise<void> {
  // the case's current finding is its latest proposal, the one the supervisor approves
  const [finding] = await findingsOfCase(db, c.id)
  if (!finding?.complianceDeadline) return
  const expected = `${RECOMMENDED_ACTION_LABELS[finding.recommendedAction]}: ${finding.sourceDescription}${finding.operator ? ` (${finding.operator})` : ''}`
  const row = await insertFollowUp(db, { caseId: c.id, dueOn: finding.complianceDeadline, expected, source: 'finding', findingId: finding.id, createdBy: approver.id })
  if (!row) return
  await appendEvent(db, {
    caseId: c.id,
    at: now,
    actorUserId: approver.id,
    actorLabel: approver.name,
    kind: 'follow_up_added',
    visibility: 'internal',
    body: `From the approved finding's compliance deadline: due ${row.dueOn}. ${row.expected}`,
    data: { followUpId: row.id, dueOn: row.dueOn, findingId: finding.id },
  })
}

/** One follow-up move (confirm, escalate, reopen): 404 outside the office, 403 wrong role, 409 stale or not allowed from its state. */
export async function moveFollowUp(ctx: ServiceContext, actor: CaseActor, followUpId: string, move: FollowUpMoveName, input: FollowUpMove): Promise<FollowUpView> {
  return withTransaction(ctx.pool, async ({ db }) => {
    const f = await findFollowUp(db, followUpId)
    const c = f ? await findCase(db, f.caseId) : undefined
    if (!f || !c || !canSeeCase(actor, c) || !mayReadEnforcement(actor, c)) throw followUpNotFound()
    if (!mayMoveFollowUp(actor, move, c) || actor.role === 'tracking_link') throw forbidden(`Your role cannot ${FOLLOW_UP_MOVE_LABELS[move].toLowerCase()} on this follow-up.`)
    await lockCase(db, c.id)
    if (f.version !== input.version) throw conflict('stale_version', 'Someone else changed this follow-up a moment ago. Reload to see their change, then try again.')
    if (!followUpMoveAllowedFrom(move, f.state)) {
      throw conflict('invalid_transition', `“${FOLLOW_UP_MOVE_LABELS[move]}” is not possible while the follow-up is “${FOLLOW_UP_STATE_LABELS[f.state]}”.`)
    }
    const now = ctx.now()
    const { today } = await todayOf(db, c.officeId, now)
    if (input.dueOn !== undefined && move !== 'reopen') {
      throw badRequest('validation_failed', 'Some fields need attention.', [{ path: 'dueOn', message: 'A new deadline is set only when reopening.' }])
    }
    if (input.dueOn !== undefined && input.dueOn < today) {
      throw badRequest('validation_failed', 'Some fields need attention.', [{ path: 'dueOn', message: `The deadline cannot be in the past (today is ${today} at the office).` }])
    }
    const to = FOLLOW_UP_MOVES[move].to
    const updated = await updateFollowUpIfVersion(db, f.id, f.version, { state: to, lastNote: input.note, changedAt: now, ...(input.dueOn ? { dueOn: input.dueOn } : {}) })
    if (!updated) throw conflict('stale_version', 'Someone else changed this follow-up a moment ago. Reload to see their change, then try again.')
    const name = (await findUserById(db, actor.id))?.name ?? 'Unknown user'
    await appendEvent(db, {
      caseId: c.id,
      at: now,
      actorUserId: actor.id,
      actorLabel: name,
      kind: followUpEventKind(move),
      visibility: 'internal',
      body: `${f.expected} — ${input.note}${input.dueOn ? ` New deadline: ${input.dueOn}.` : ''}`,
      data: { followUpId: f.id, from: f.state, to, dueOn: updated.dueOn },
    })
    return presentFollowUp(updated, actor, c, today)
  })
}

/**
 * GET /api/follow-ups/due: the open follow-ups due today or overdue at the office — an
 * investigator's own cases, a supervisor's office, every office for an administrator.
 */
export async function listDueFollowUps(ctx: ServiceContext, actor: Actor): Promise<DueFollowUpsResponse> {
  const now = ctx.now()
  if (actor.role === 'admin') {
    const all = await officesForDigest(ctx.db)
    const rows = await dueFollowUps(ctx.db, { officeIds: all.map((o) => o.id) }, now)
    return { today: localDay(now, 'UTC'), timeZone: 'UTC', items: rows.map(queueItem) }
  }
  if ((actor.role !== 'investigator' && actor.role !== 'supervisor') || !actor.officeId) throw forbidden()
  const { today, timeZone } = await todayOf(ctx.db, actor.officeId, now)
  const rows = await dueFollowUps(ctx.db, { officeIds: [actor.officeId], investigatorId: actor.role === 'investigator' ? actor.id : undefined }, now)
  return { today, timeZone, items: rows.map(queueItem) }
}

const queueItem = (r: Awaited<ReturnType<typeof dueFollowUps>>[number]) => ({
  id: r.id,
  caseId: r.caseId,
  caseReference: r.caseReference,
  dueOn: r.dueOn,
  expected: r.expected,
  standing: r.overdue ? ('overdue' as const) : ('due' as const),
  investigatorName: r.investigatorName,
})
