/**
 * The moves of a case, one domain verb each. Every move runs in one transaction: load the
 * case, check visibility (404), role and relation (403), version (409 stale_version) and
 * state (409 invalid_transition); write the change with an optimistic version check, append
 * the timeline event, and queue the e-mails it causes. Nothing is half-written.
 */
import type pg from 'pg'
import { CASE_MOVE_LABELS, CASE_STATE_LABELS, moveAllowedFrom, stateAfter, type CaseMoveName, type Resolution } from '../../../shared/domain/case-lifecycle'
import type { Priority } from '../../../shared/domain/services'
import type { ProposeFinding } from '../../../shared/schemas/findings'
import { withTransaction, type Db } from '../../db/client'
import type { CaseRow } from '../../db/schema'
import type { ServiceContext } from '../../context'
import { badRequest, conflict, forbidden } from '../../http/errors'
import { queueMail } from '../../jobs/boss'
import type { OutgoingMail } from '../../mail/mailer'
import {
  caseAssignedComplainantMail,
  caseClosedMail,
  caseReopenedMail,
  findingProposedMail,
  findingReturnedMail,
  investigatorAssignedMail,
} from '../../mail/case-templates'
import { mayMakeMove, type CaseActor } from '../../policy/case-policy'
import { findOffice } from '../offices/offices.repo'
import { activeStaffOf, findUserById } from '../users/users.repo'
import { recordFinding } from '../findings/findings.service'
import { followUpFromApprovedFinding } from '../follow-ups/follow-ups.service'
import { loadVisibleCase, staleVersion } from './case-access'
import { appendEvent, lockCase, lockCasesInIdOrder, mergedReportsOf, repointMergedReports, updateCaseIfVersion, type NewCase } from './cases.repo'
import { dueTimesFor } from './due'
import { issueTrackingLink } from './tracking-tokens'

interface MoveScope {
  c: CaseRow
  /** When the move happens. */
  now: Date
  db: Db
  client: pg.PoolClient
  actorName: string
  /** Queues an e-mail in this transaction. */
  mail(m: OutgoingMail): Promise<void>
  /** A fresh private tracking link for the complainant's e-mails. */
  trackingLink(): Promise<string>
}

interface MovePlan {
  changes?: Partial<NewCase>
  body?: string | null
  data?: Record<string, unknown>
  after?: (updated: CaseRow) => Promise<void>
}

async function makeMove(
  ctx: ServiceContext,
  actor: CaseActor,
  caseId: string,
  move: CaseMoveName,
  version: number | 'current',
  plan: (s: MoveScope) => Promise<MovePlan>,
): Promise<CaseRow> {
  return withTransaction(ctx.pool, async ({ db, client }) => {
    const c = await loadVisibleCase(db, actor, caseId)
    const state = c.status
    if (!mayMakeMove(actor, move, c)) throw forbidden(`Your role cannot ${CASE_MOVE_LABELS[move].toLowerCase()} on this case.`)
    const expected = version === 'current' ? c.version : version
    if (c.version !== expected) throw staleVersion()
    if (!moveAllowedFrom(move, state)) {
      throw conflict('invalid_transition', `“${CASE_MOVE_LABELS[move]}” is not possible while the case is “${CASE_STATE_LABELS[state]}”.`)
    }
    const actorUserId = actor.role === 'tracking_link' ? null : actor.id
    const actorName = actor.role === 'tracking_link' || actor.role === 'complainant' ? 'Complainant' : ((await findUserById(db, actor.id))?.name ?? 'Unknown user')
    const now = ctx.now()
    const scope: MoveScope = {
      c,
      now,
      db,
      client,
      actorName,
      mail: (m) => queueMail(ctx.boss, client, m, ctx.mailQueue),
      trackingLink: () => issueTrackingLink(db, ctx.publicUrl, c.id),
    }
    const p = await plan(scope)
    // only reopening depends on the investigator: back to them, or to triage without one
    const investigatorAfter = p.changes && 'investigatorId' in p.changes ? p.changes.investigatorId : c.investigatorId
    const to = stateAfter(move, investigatorAfter != null)
    const updated = await updateCaseIfVersion(db, c.id, expected, { ...p.changes, status: to })
    if (!updated) throw staleVersion()
    await appendEvent(db, {
      caseId: c.id,
      at: now,
      actorUserId,
      actorLabel: actorName,
      kind: move,
      fromState: state,
      toState: to,
      body: p.body ?? null,
      visibility: 'internal',
      data: p.data,
    })
    await p.after?.(updated)
    return updated
  })
}

const caseLink = (ctx: ServiceContext, id: string) => `${ctx.publicUrl}/cases/${id}`

/**
 * Sets (or confirms) the priority; both targets follow it. The first triage is the case's first
 * response (unless a message to the complainant came before it).
 */
export function triageCase(ctx: ServiceContext, actor: CaseActor, caseId: string, input: { version: number; priority: Priority; note?: string }) {
  return makeMove(ctx, actor, caseId, 'triage', input.version, async ({ c, db, now }) => {
    const office = await findOffice(db, c.officeId)
    return {
      changes: { priority: input.priority, ...dueTimesFor(c.receivedAt, input.priority, office!), firstRespondedAt: c.firstRespondedAt ?? now },
      body: input.note ?? null,
      data: { priority: input.priority, suggestedPriority: c.suggestedPriority },
    }
  })
}

/** Gives the case to an active investigator of its office. */
export function assignCase(ctx: ServiceContext, actor: CaseActor, caseId: string, input: { version: number; investigatorId: string }) {
  return makeMove(ctx, actor, caseId, 'assign', input.version, async ({ c, db, mail, trackingLink }) => {
    const inv = await findUserById(db, input.investigatorId)
    if (!inv || inv.role !== 'investigator' || inv.officeId !== c.officeId || !inv.active) {
      throw badRequest('validation_failed', 'Some fields need attention.', [{ path: 'investigatorId', message: 'Choose an active investigator of this office.' }])
    }
    const firstAssignment = c.investigatorId === null
    return {
      changes: { investigatorId: input.investigatorId },
      data: { investigatorId: input.investigatorId, investigatorName: inv.name, previousInvestigatorId: c.investigatorId },
      body: `Assigned to ${inv.name}.`,
      after: async (u) => {
        await mail(investigatorAssignedMail(inv, u, caseLink(ctx, u.id)))
        if (firstAssignment) await mail(caseAssignedComplainantMail(u, await trackingLink()))
      },
    }
  })
}

/** Hands a new report to another office, which triages it afresh. */
export function transferCase(ctx: ServiceContext, actor: CaseActor, caseId: string, input: { version: number; officeId: string; reason: string }) {
  return makeMove(ctx, actor, caseId, 'transfer', input.version, async ({ c, db }) => {
    const o = await findOffice(db, input.officeId)
    if (!o || o.id === c.officeId) {
      throw badRequest('validation_failed', 'Some fields need attention.', [{ path: 'officeId', message: 'Choose another office.' }])
    }
    return {
      changes: { officeId: o.id, investigatorId: null, ...dueTimesFor(c.receivedAt, c.priority, o) },
      body: input.reason,
      data: { fromOfficeId: c.officeId, toOfficeId: o.id, toOfficeName: o.name },
    }
  })
}

/** How many merge links a merge follows at most (merged reports are re-pointed, so chains stay short). */
const MAX_MERGE_CHAIN = 20

/**
 * Joins a new report to an open case of the same office; the report closes as a duplicate.
 * The rule for merged reports (also in shared/domain/case-lifecycle.ts):
 * - a merge follows the chain: choosing a case that was itself merged meanwhile merges into
 *   the open case at the end of its chain;
 * - merged reports follow their case: when a case that holds merged reports is merged in
 *   turn, they are re-pointed to the new case, so every merged report points at the case
 *   that does the work;
 * - a case that holds merged reports is not closed at triage (see dismissReport).
 */
export function mergeCase(ctx: ServiceContext, actor: CaseActor, caseId: string, input: { version: number; intoCaseId: string }) {
  return makeMove(ctx, actor, caseId, 'merge', input.version, async ({ c, db, mail, trackingLink, actorName, now }) => {
    const refuse = (message: string) => badRequest('validation_failed', 'Some fields need attention.', [{ path: 'intoCaseId', message }])
    if (input.intoCaseId === c.id) throw refuse('Choose another open case of this office.')
    // Lock both cases, always in id order: two merges of the same pair in opposite directions
    // then run one after the other (never deadlock), and the second finds its target closed
    // instead of leaving two cases closed as duplicates of each other. A dismissal or another
    // merge of the target waits for this lock too, and then sees this merge.
    const pair = await lockCasesInIdOrder(db, [c.id, input.intoCaseId])
    let target = pair.find((p) => p.id === input.intoCaseId)
    const chosen = target
    // follow the chain of merges to the open case at its end
    for (let hops = 0; target && target.status === 'closed' && target.resolution === 'duplicate' && target.mergedIntoCaseId && hops < MAX_MERGE_CHAIN; hops++) {
      target = await lockCase(db, target.mergedIntoCaseId)
    }
    if (!target || target.id === c.id || target.officeId !== c.officeId || target.status === 'closed') throw refuse('Choose another open case of this office.')
    const via = chosen && chosen.id !== target.id ? ` (${chosen.reference} had been merged into it)` : ''
    const summary = `Your report describes the same interference as case ${target.reference}, which our engineers are already working on. We have joined the two so the work is done once.`
    const by = { actorUserId: actor.role === 'tracking_link' ? null : actor.id, actorLabel: actorName }
    return {
      changes: { mergedIntoCaseId: target.id, resolution: 'duplicate', closingSummary: summary, closedAt: now },
      body: `Merged into ${target.reference}${via}.`,
      data: { intoCaseId: target.id, intoReference: target.reference, chosenCaseId: chosen?.id ?? null },
      after: async (u) => {
        // the reports merged into this case follow it (this case's row lock keeps new ones out meanwhile)
        const followers = await repointMergedReports(db, u.id, target.id)
        await appendEvent(db, { caseId: target.id, at: now, ...by, kind: 'merged_in', visibility: 'internal', body: `${u.reference} (${u.complainantName}) was merged into this case.`, data: { fromCaseId: u.id, fromReference: u.reference } })
        for (const f of followers) {
          await appendEvent(db, { caseId: f.id, at: now, ...by, kind: 'merge_followed', visibility: 'internal', body: `${u.reference}, into which this report was merged, was merged into ${target.reference}; this report follows it.`, data: { intoCaseId: target.id, intoReference: target.reference, viaCaseId: u.id } })
          await appendEvent(db, { caseId: target.id, at: now, ...by, kind: 'merged_in', visibility: 'internal', body: `${f.reference} (${f.complainantName}) came with ${u.reference}.`, data: { fromCaseId: f.id, fromReference: f.reference, viaCaseId: u.id } })
        }
        await mail(caseClosedMail(u, 'duplicate', summary, await trackingLink()))
      },
    }
  })
}

function closing(resolution: Resolution, summary: string, s: MoveScope): MovePlan {
  return {
    changes: { resolution, closingSummary: summary, closedAt: s.now },
    body: summary,
    data: { resolution },
    after: async (u) => s.mail(caseClosedMail(u, resolution, summary, await s.trackingLink())),
  }
}

/**
 * Closes a report at triage: no interference, or a matter for another authority. Refused
 * (409 holds_merged_reports) while reports are merged into the case: their complainants were
 * told it is being worked on, and closing it at triage would close their reports with an
 * outcome nobody gave them.
 */
export function dismissReport(ctx: ServiceContext, actor: CaseActor, caseId: string, input: { version: number; resolution: Resolution; reason: string }) {
  return makeMove(ctx, actor, caseId, 'dismiss', input.version, async (s) => {
    // under the case's row lock, so a merge into it either comes first (and is seen) or waits
    await lockCase(s.db, s.c.id)
    const merged = await mergedReportsOf(s.db, s.c.id)
    if (merged.length > 0) throw holdsMergedReports(merged.map((m) => m.reference))
    return closing(input.resolution, input.reason, s)
  })
}

/** 409: a case that holds merged reports cannot be closed at triage; says what to do instead. */
export function holdsMergedReports(references: string[]) {
  const which = references.length === 1 ? `Report ${references[0]} was` : `Reports ${references.slice(0, 5).join(', ')}${references.length > 5 ? ` and ${references.length - 5} more` : ''} were`
  return conflict(
    'holds_merged_reports',
    `${which} merged into this case, and ${references.length === 1 ? 'its complainant was' : 'their complainants were'} told it is being worked on, so it cannot be closed at triage. Assign it and close it with a finding, or merge it into another open case (the merged reports follow it there).`,
  )
}

export function startFieldWork(ctx: ServiceContext, actor: CaseActor, caseId: string, input: { version: number }) {
  return makeMove(ctx, actor, caseId, 'startFieldWork', input.version, async () => ({}))
}

/**
 * The investigator proposes a finding; the office's supervisors are asked to review it. The
 * structured finding is written as a new row of `findings` in the move's transaction (a link
 * to another case's calculation refuses the whole move); its summary is the timeline's text.
 */
export function proposeFinding(ctx: ServiceContext, actor: CaseActor, caseId: string, input: ProposeFinding) {
  return makeMove(ctx, actor, caseId, 'proposeFinding', input.version, async ({ c, db, mail, actorName }) => {
    // the move's policy has allowed only the assigned investigator (a signed-in user) here
    if (actor.role === 'tracking_link') throw forbidden('Only the assigned investigator can propose a finding.')
    const finding = await recordFinding(db, c, actor.id, input)
    return {
      body: input.summary,
      data: { findingId: finding.id, recommendedAction: finding.recommendedAction, calculationIds: finding.calculationIds },
      after: async (u) => {
        const supervisors = await activeStaffOf(db, c.officeId, 'supervisor')
        for (const s of supervisors) await mail(findingProposedMail(s, u, actorName, caseLink(ctx, u.id)))
      },
    }
  })
}

/** Sends a finding back for more work: the case returns to its investigator, who is e-mailed. */
export function returnFinding(ctx: ServiceContext, actor: CaseActor, caseId: string, input: { version: number; reason: string }) {
  return makeMove(ctx, actor, caseId, 'returnFinding', input.version, async ({ c, db, mail, actorName }) => ({
    body: input.reason,
    after: async (u) => {
      const investigator = c.investigatorId ? await findUserById(db, c.investigatorId) : undefined
      if (investigator?.active) await mail(findingReturnedMail(investigator, u, actorName, input.reason, caseLink(ctx, u.id)))
    },
  }))
}

/** Approves the finding and closes the case with a resolution and a summary for the complainant. */
export function closeCase(ctx: ServiceContext, actor: CaseActor, caseId: string, input: { version: number; resolution: Resolution; reason: string }) {
  return makeMove(ctx, actor, caseId, 'close', input.version, async (s) => {
    const plan = closing(input.resolution, input.reason, s)
    return {
      ...plan,
      after: async (u) => {
        await plan.after?.(u)
        // the approved finding's compliance deadline becomes a follow-up (the move's policy allowed a supervisor only)
        if (actor.role !== 'tracking_link') await followUpFromApprovedFinding(s.db, u, { id: actor.id, name: s.actorName }, s.now)
      },
    }
  })
}

/** Returns a closed case to work (to its investigator, or to triage) and tells the complainant. */
export function reopenCase(ctx: ServiceContext, actor: CaseActor, caseId: string, input: { version: number; reason: string }) {
  return makeMove(ctx, actor, caseId, 'reopen', input.version, async ({ c, db, mail, trackingLink }) => {
    // an investigator who has left since (deactivated, or moved to another role or office) goes off the case, which then returns to triage
    const investigator = c.investigatorId ? await findUserById(db, c.investigatorId) : undefined
    const keepInvestigator = !!investigator?.active && investigator.role === 'investigator' && investigator.officeId === c.officeId
    return {
      changes: { resolution: null, closingSummary: null, closedAt: null, mergedIntoCaseId: null, ...(keepInvestigator ? {} : { investigatorId: null }) },
      body: input.reason,
      after: async (u) => mail(caseReopenedMail(u, input.reason, await trackingLink())),
    }
  })
}

/** The complainant withdraws their report (through their account or their tracking link). */
export function withdrawReport(ctx: ServiceContext, actor: CaseActor, caseId: string, input: { reason?: string }) {
  const summary = input.reason ? `Withdrawn by the complainant: ${input.reason}` : 'Withdrawn by the complainant.'
  return makeMove(ctx, actor, caseId, 'withdraw', 'current', async (s) => closing('withdrawn', summary, s))
}
