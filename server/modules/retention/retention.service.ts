/**
 * The retention run and an office's retention period.
 *
 * When a closed case's office period has ended (closing time + the office's months), the run
 * erases its complainant's personal data — name, e-mail, phone and organisation become the marker
 * "erased on <date>"; the description, the pattern detail and the text of timeline entries become
 * a redacted copy (shared/domain/retention.ts: e-mail and web addresses, phone-like numbers and
 * the complainant's own name masked) — and deletes its evidence objects (and their thumbnails) from the
 * store, keeping the evidence rows marked disposed. A case under a legal hold, or with an open follow-up, is
 * left untouched. Every erasure and every deleted object (its key and SHA-256) is recorded in
 * retention_actions, and each case's erasure in the audit log, in the same transaction.
 *
 * runRetention(ctx, { now, dryRun }) answers exactly what it erases and disposes of; a dry run
 * computes the same plan with the same code and changes nothing.
 */
import {
  ERASED_CASE_FIELDS,
  erasureMarker,
  monthsNeededFor,
  redactComplainantText,
  type ErasedCaseField,
} from '../../../shared/domain/retention'
import type { RetentionPlanCase, RetentionRunView, RetentionSettingView } from '../../../shared/schemas/retention'
import type { ServiceContext } from '../../context'
import { withTransaction, type Db } from '../../db/client'
import type { CaseRow } from '../../db/schema'
import { badRequest, forbidden, notFound } from '../../http/errors'
import type { Actor } from '../../policy/policy'
import { mayPreviewRetention, mayReadRetention, maySetRetention } from '../../policy/retention-policy'
import { requireStore } from '../../storage/stored-files'
import { recordAudit } from '../audit/audit.repo'
import { appendEvent } from '../cases/cases.repo'
import { disposeObject } from './dispose-object'
import { holdInForce } from './legal-hold.service'
import {
  erasePersonalData,
  evidenceNotDisposed,
  expiredCases,
  findOfficeRetention,
  insertRetentionAction,
  latestLegalHolds,
  lockCaseForRetention,
  lockOfficeRetention,
  markEvidenceDisposed,
  markThumbnailsDisposed,
  openFollowUpCount,
  openFollowUpsOfClosedCases,
  redactEvent,
  setOfficeRetentionMonths,
  timelineWithText,
} from './retention.repo'

const officeNotFound = () => notFound('office_not_found', 'No such office.')

/** The fewest months the office's period may be: every closed case kept until its furthest open follow-up is due. */
async function minimumOf(db: Db, officeId: string): Promise<Pick<RetentionSettingView, 'minimumMonths' | 'minimumBecause'>> {
  const rows = await openFollowUpsOfClosedCases(db, officeId)
  let best: { months: number; row: (typeof rows)[number] } | null = null
  for (const row of rows) {
    const months = monthsNeededFor(row.closedAt, row.dueOn)
    if (!best || months > best.months) best = { months, row }
  }
  if (!best) return { minimumMonths: null, minimumBecause: null }
  return { minimumMonths: best.months, minimumBecause: { caseId: best.row.caseId, reference: best.row.reference, closedAt: best.row.closedAt.toISOString(), dueOn: best.row.dueOn } }
}

/** GET /api/offices/:id/retention */
export async function getRetentionSetting(ctx: ServiceContext, actor: Actor, officeId: string): Promise<RetentionSettingView> {
  const o = await findOfficeRetention(ctx.db, officeId)
  if (!o || !mayReadRetention(actor, o.id)) throw officeNotFound()
  return { officeId: o.id, retentionMonths: o.retentionMonths, ...(await minimumOf(ctx.db, o.id)), abilities: { set: maySetRetention(actor) } }
}

/**
 * PUT /api/offices/:id/retention — administrators. Refused (400, nothing changed) when shorter
 * than the office's closed cases need to outlive their furthest open follow-up.
 */
export async function setRetentionSetting(ctx: ServiceContext, actor: Actor, officeId: string, months: number): Promise<RetentionSettingView> {
  if (!maySetRetention(actor)) throw forbidden('Only an administrator can change an office\u2019s retention period.')
  return withTransaction(ctx.pool, async ({ db }) => {
    const o = await lockOfficeRetention(db, officeId)
    if (!o) throw officeNotFound()
    const min = await minimumOf(db, o.id)
    if (min.minimumMonths !== null && months < min.minimumMonths && min.minimumBecause) {
      const b = min.minimumBecause
      throw badRequest('validation_failed', 'Some fields need attention.', [
        {
          path: 'retentionMonths',
          message: `${months} months is too short: closed case ${b.reference} has an open follow-up due ${b.dueOn}, so this office must keep closed cases at least ${min.minimumMonths} months. Settle or move that follow-up first, or choose ${min.minimumMonths} months or more.`,
        },
      ])
    }
    if (months !== o.retentionMonths) {
      await setOfficeRetentionMonths(db, o.id, months)
      await recordAudit(db, { actorUserId: actor.id, action: 'retention.changed', targetType: 'office', targetId: o.id, officeId: o.id, details: { fromMonths: o.retentionMonths, toMonths: months } })
    }
    return { officeId: o.id, retentionMonths: months, ...min, abilities: { set: true } }
  })
}

type Kept = RetentionRunView['kept'][number]

/** What erasing a case changes: the plan's entry, the new field values and the redacted timeline texts. */
async function planCase(db: Db, c: CaseRow, retentionEndedAt: Date, now: Date) {
  const identity = { name: c.complainantName, email: c.complainantEmail, phone: c.complainantPhone, organisation: c.complainantOrganisation }
  const erase = c.personalDataErasedAt === null
  const fields: ErasedCaseField[] = erase ? ERASED_CASE_FIELDS.filter((f) => c[f] !== null) : []
  const marker = erasureMarker(now)
  const changes = {
    complainantName: marker,
    complainantEmail: marker,
    complainantPhone: c.complainantPhone === null ? null : marker,
    complainantOrganisation: c.complainantOrganisation === null ? null : marker,
    description: redactComplainantText(c.description, identity),
    patternDetail: c.patternDetail === null ? null : redactComplainantText(c.patternDetail, identity),
  }
  const events: { id: number; body: string }[] = []
  if (erase) {
    for (const e of await timelineWithText(db, c.id)) {
      const body = redactComplainantText(e.body, identity)
      // the complainant's own added text always becomes a marked redacted copy; staff text only when it names them
      if (e.kind === 'complainant_information') events.push({ id: e.id, body: body === e.body ? `${body} [redacted copy, ${marker}]` : body })
      else if (body !== e.body) events.push({ id: e.id, body })
    }
  }
  const evidence = await evidenceNotDisposed(db, c.id)
  const plan: RetentionPlanCase = {
    caseId: c.id,
    reference: c.reference,
    officeId: c.officeId,
    closedAt: c.closedAt!.toISOString(),
    retentionEndedAt: retentionEndedAt.toISOString(),
    fields,
    redactedEventIds: events.map((e) => e.id),
    evidence,
  }
  return { plan, erase, changes, events }
}

/**
 * The retention run. `dryRun`: what it would erase and dispose of, nothing changed. Otherwise
 * each case is erased in its own transaction (re-read under a lock: a hold set meanwhile wins),
 * its objects deleted before that transaction commits; an object store failure rolls the case
 * back and the next run tries it again.
 */
export async function runRetention(
  ctx: ServiceContext,
  opts: { now: Date; dryRun: boolean; /** Only these offices (tests); every office when absent. */ officeIds?: readonly string[] },
): Promise<RetentionRunView> {
  const { now, dryRun } = opts
  const candidates = await expiredCases(ctx.db, now, opts.officeIds ? { officeIds: opts.officeIds } : { all: true })
  const holds = await latestLegalHolds(ctx.db, candidates.map((x) => x.c.id))
  const kept: Kept[] = []
  const cases: RetentionPlanCase[] = []
  for (const { c, retentionEndedAt } of candidates) {
    if (holdInForce(holds.get(c.id), now)) {
      kept.push({ caseId: c.id, reference: c.reference, reason: 'legal_hold' })
      continue
    }
    if ((await openFollowUpCount(ctx.db, c.id)) > 0) {
      kept.push({ caseId: c.id, reference: c.reference, reason: 'open_follow_up' })
      continue
    }
    if (dryRun) {
      cases.push((await planCase(ctx.db, c, retentionEndedAt, now)).plan)
      continue
    }
    const done = await withTransaction(ctx.pool, async ({ db }) => {
      const locked = await lockCaseForRetention(db, c.id)
      if (!locked || locked.status !== 'closed') return null
      if (holdInForce((await latestLegalHolds(db, [c.id])).get(c.id), now)) {
        kept.push({ caseId: c.id, reference: c.reference, reason: 'legal_hold' })
        return null
      }
      if ((await openFollowUpCount(db, c.id)) > 0) {
        kept.push({ caseId: c.id, reference: c.reference, reason: 'open_follow_up' })
        return null
      }
      const { plan, erase, changes, events } = await planCase(db, locked, retentionEndedAt, now)
      if (erase) {
        await erasePersonalData(db, c.id, changes, now)
        for (const e of events) await redactEvent(db, e.id, e.body)
        await insertRetentionAction(db, { caseId: c.id, action: 'personal_data_erased', fields: plan.fields, redactedEventIds: plan.redactedEventIds })
        await appendEvent(db, {
          caseId: c.id,
          at: now,
          actorUserId: null,
          actorLabel: 'Quietband',
          kind: 'personal_data_erased',
          visibility: 'internal',
          body: `The retention period ended; the complainant's personal data was erased (${plan.fields.join(', ')}).`,
          data: { fields: plan.fields, redactedEventIds: plan.redactedEventIds },
        })
      }
      if (plan.evidence.length > 0) {
        for (const ev of plan.evidence) {
          await insertRetentionAction(db, { caseId: c.id, action: 'evidence_disposed', evidenceId: ev.evidenceId, objectKey: ev.objectKey, sha256: ev.sha256 })
        }
        await markEvidenceDisposed(db, plan.evidence.map((e) => e.evidenceId), now)
        await markThumbnailsDisposed(db, plan.evidence.map((e) => e.evidenceId))
        await appendEvent(db, {
          caseId: c.id,
          at: now,
          actorUserId: null,
          actorLabel: 'Quietband',
          kind: 'evidence_disposed',
          visibility: 'internal',
          body: `The retention period ended; ${plan.evidence.length} evidence file(s) were deleted from the store (their records are kept).`,
          data: { evidence: plan.evidence },
        })
      }
      await recordAudit(db, {
        actorUserId: null,
        action: 'retention.run',
        targetType: 'case',
        targetId: c.id,
        officeId: c.officeId,
        details: { reference: c.reference, fieldsErased: plan.fields, eventsRedacted: plan.redactedEventIds.length, objectsDisposed: plan.evidence.length },
      })
      // last, so a failure here rolls back every record above; deleting an absent key succeeds, so a retry completes
      if (plan.evidence.length > 0) {
        const store = requireStore(ctx.objectStore)
        for (const ev of plan.evidence) {
          await disposeObject(store, ev.objectKey)
          if (ev.thumbnailKey) await disposeObject(store, ev.thumbnailKey)
        }
      }
      return plan
    })
    if (done) cases.push(done)
  }
  return { dryRun, at: now.toISOString(), cases, kept }
}

/** GET /api/admin/retention/dry-run */
export async function previewRetention(ctx: ServiceContext, actor: Actor): Promise<RetentionRunView> {
  if (!mayPreviewRetention(actor)) throw forbidden('Only an administrator can see what the retention run would erase.')
  return runRetention(ctx, { now: ctx.now(), dryRun: true })
}
