/**
 * The retention run and an office's retention period.
 *
 * When a closed case's office period has ended (closing time + the office's months), the run
 * erases its complainant's personal data — name, e-mail, phone, organisation and the address
 * they wrote become the marker "erased on <date>", the position is rounded to 0.01°; the
 * description, the pattern detail and the text of timeline entries become a redacted copy
 * (shared/domain/retention.ts: addresses, e-mail and web addresses, phone-like numbers and the
 * complainant's own name masked; evidence file names replaced by their marker) — and with it the
 * merge entries other cases' timelines hold about the complainant, the names of its evidence
 * files (`erased-<sha256 prefix>.<ext>`), the unsent e-mails about the case to the complainant,
 * and the complainant's account when no other case and no recent sign-in keeps it (deactivated,
 * name and e-mail replaced, sessions ended). It deletes the case's evidence objects and their
 * thumbnails from the store, keeping the evidence rows marked disposed. A case under a legal
 * hold, or with an open follow-up, is left untouched. Every erasure is recorded in
 * retention_actions and each case's erasure in the audit log, in one transaction; each object
 * deletion is recorded 'pending' in that transaction and 'done' after the store deleted it.
 *
 * runRetention(ctx, { now, dryRun }) answers exactly what it erases and disposes of; a dry run
 * computes the same plan with the same code and changes nothing.
 */
import {
  coarsenDeg,
  ERASED_CASE_FIELDS,
  ERASED_POSITION_STEP_DEG,
  erasedFileName,
  erasureMarker,
  monthsNeededFor,
  redactComplainantText,
  retentionEndsAt,
  type DisposalAction,
  type ErasedCaseField,
} from '../../../shared/domain/retention'
import type { RetentionPlanCase, RetentionRunView, RetentionSettingView } from '../../../shared/schemas/retention'
import type { ServiceContext } from '../../context'
import { withTransaction, type Db } from '../../db/client'
import type { CaseRow } from '../../db/schema'
import { badRequest, forbidden, notFound } from '../../http/errors'
import type { Actor } from '../../policy/policy'
import { mayPreviewRetention, mayReadRetention, maySetRetention } from '../../policy/retention-policy'
import { MAIL_QUEUE } from '../../jobs/boss'
import { log } from '../../log/logger'
import { requireStore } from '../../storage/stored-files'
import { recordAudit } from '../audit/audit.repo'
import { appendEvent } from '../cases/cases.repo'
import { endSessionsOfUser } from '../users/people.repo'
import { disposeObject } from './dispose-object'
import { holdInForce } from './legal-hold.service'
import {
  cancelAndDeleteJobs,
  casesNamingAccounts,
  casesWithOpenFollowUp,
  eraseAccount,
  eraseEvidenceNames,
  erasePersonalData,
  eraseStoredFileName,
  evidenceNamesOf,
  evidenceNotDisposed,
  expiredCases,
  findAccounts,
  findOfficeRetention,
  insertRetentionAction,
  latestLegalHolds,
  lockCaseForRetention,
  lockOfficeRetention,
  markEvidenceDisposed,
  markThumbnailsDisposed,
  mergeEntriesAbout,
  openFollowUpsOfClosedCases,
  pendingDisposals,
  queuedCaseMails,
  redactEvent,
  setOfficeRetentionMonths,
  timelinesWithText,
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
type Disposal = { caseId: string; action: DisposalAction; evidenceId: string; objectKey: string; sha256: string | null }
type Identity = Parameters<typeof redactComplainantText>[1]

/**
 * The redacted copy of a case's text: each evidence file's shown name becomes its marker (the
 * text between the names is redacted, so a marker's hex digits are never taken for a number).
 */
function redactCaseText(text: string, identity: Identity, names: readonly { displayName: string; name: string }[]): string {
  const quoted = names.filter((n) => n.displayName.length > 0)
  if (quoted.length === 0) return redactComplainantText(text, identity)
  const byName = new Map(quoted.map((n) => [n.displayName, n.name]))
  const pattern = new RegExp(`(${[...byName.keys()].sort((a, b) => b.length - a.length).map(escapeRegExp).join('|')})`)
  return text
    .split(pattern)
    .map((piece, i) => (i % 2 === 1 ? byName.get(piece)! : redactComplainantText(piece, identity)))
    .join('')
}

/** The text with each exact, non-empty string replaced by its mask (longest first). */
function maskExact(text: string, masks: [string | null, string][]): string {
  return masks
    .filter((m): m is [string, string] => !!m[0] && m[0].trim().length > 0)
    .sort((a, b) => b[0].length - a[0].length)
    .reduce((out, [s, mask]) => out.split(s).join(mask), text)
}

function escapeRegExp(s: string): string {
  return s.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')
}

/** The e-mail address a deactivated complainant account keeps: unique, lowercase, undeliverable (.invalid, RFC 2606). */
const erasedAccountEmail = (userId: string) => `erased-${userId}@erased.invalid`

/** Rows grouped by a key, each group in the rows' order. */
function groupBy<T>(rows: readonly T[], key: (row: T) => string): Map<string, T[]> {
  const groups = new Map<string, T[]>()
  for (const row of rows) {
    const k = key(row)
    const group = groups.get(k)
    if (group) group.push(row)
    else groups.set(k, [row])
  }
  return groups
}

type PlanReads = Awaited<ReturnType<typeof readPlanInputs>>

/**
 * Everything the plans of a batch of cases read from the database, one query of each kind for
 * the whole batch (the dry run: every case it will list; the real run: the one case it has just
 * locked). Cases whose personal data is already erased only need their evidence.
 */
async function readPlanInputs(ctx: ServiceContext, db: Db, batch: readonly CaseRow[]) {
  const toErase = batch.filter((c) => c.personalDataErasedAt === null)
  const ids = toErase.map((c) => c.id)
  const queue = ctx.mailQueue.queueName ?? MAIL_QUEUE
  const names = groupBy(await evidenceNamesOf(db, ids), (f) => f.caseId)
  const timelines = groupBy(await timelinesWithText(db, ids), (e) => e.caseId)
  const mergeEntries = groupBy(await mergeEntriesAbout(db, ids), (e) => e.aboutCaseId)
  const mails = groupBy(await queuedCaseMails(db, queue, toErase.map((c) => ({ caseId: c.id, to: c.complainantEmail, reference: c.reference }))), (m) => m.caseId)
  const userIds = [...new Set(toErase.flatMap((c) => (c.complainantUserId ? [c.complainantUserId] : [])))]
  const accounts = new Map((await findAccounts(db, userIds)).map((u) => [u.id, u]))
  const complainantIds = [...accounts.values()].filter((u) => u.role === 'complainant').map((u) => u.id)
  const linkedCases = groupBy(await casesNamingAccounts(db, complainantIds), (l) => l.userId)
  const evidence = groupBy(await evidenceNotDisposed(db, batch.map((c) => c.id)), (e) => e.caseId)
  return { queue, names, timelines, mergeEntries, mails, accounts, linkedCases, evidence }
}

/**
 * What happens to the complainant's account when the case is erased: deactivated (its name and
 * e-mail replaced) when no other case still names it and it has not signed in within the
 * office's retention period before `now`; kept otherwise, saying why. `erasedThisRun`: per
 * account, the cases this run erased before (a dry run: would erase), no longer counted.
 */
function planAccount(reads: PlanReads, c: CaseRow, retentionMonths: number, now: Date, erasedThisRun: ReadonlyMap<string, string[]>): RetentionPlanCase['account'] {
  if (!c.complainantUserId) return null
  const u = reads.accounts.get(c.complainantUserId)
  if (!u) return null
  if (u.role !== 'complainant') return { outcome: 'kept', userId: u.id, reason: 'not_a_complainant_account' }
  const notCounted = new Set([c.id, ...(erasedThisRun.get(u.id) ?? [])])
  const otherCases = (reads.linkedCases.get(u.id) ?? []).filter((l) => !notCounted.has(l.caseId)).length
  if (otherCases > 0) return { outcome: 'kept', userId: u.id, reason: 'other_cases', otherCases }
  // the period's months back from now (calendar months, UTC)
  const windowStart = retentionEndsAt(now, -retentionMonths)
  if (u.lastSignedInAt && u.lastSignedInAt > windowStart) return { outcome: 'kept', userId: u.id, reason: 'signed_in', lastSignedInAt: u.lastSignedInAt.toISOString() }
  return { outcome: 'deactivated', userId: u.id }
}

/** What erasing a case changes: the plan's entry, the new field values and the redacted timeline texts (from the batch's reads, which hold the case). */
function planCase(
  reads: PlanReads,
  c: CaseRow,
  expiry: { retentionEndedAt: Date; retentionMonths: number },
  now: Date,
  erasedThisRun: ReadonlyMap<string, string[]>,
) {
  const identity = { name: c.complainantName, email: c.complainantEmail, phone: c.complainantPhone, organisation: c.complainantOrganisation, address: c.address }
  const erase = c.personalDataErasedAt === null
  const fields: ErasedCaseField[] = erase ? ERASED_CASE_FIELDS.filter((f) => c[f] !== null) : []
  const marker = erasureMarker(now)
  // the address the complainant wrote goes; the position stays for statistics and maps, rounded
  // to 0.01° (about 1 km), too coarse to point at one house (ERASED_POSITION_STEP_DEG)
  const coarsePosition = erase ? { latDeg: coarsenDeg(c.latDeg), lonDeg: coarsenDeg(c.lonDeg) } : null
  const names = erase
    ? (reads.names.get(c.id) ?? []).filter((f) => !f.nameErased).map((f) => ({ ...f, name: erasedFileName(f.originalName, f.sha256) }))
    : []
  const changes = {
    complainantName: marker,
    complainantEmail: marker,
    complainantPhone: c.complainantPhone === null ? null : marker,
    complainantOrganisation: c.complainantOrganisation === null ? null : marker,
    address: marker,
    latDeg: coarsePosition?.latDeg ?? c.latDeg,
    lonDeg: coarsePosition?.lonDeg ?? c.lonDeg,
    description: redactComplainantText(c.description, identity),
    patternDetail: c.patternDetail === null ? null : redactComplainantText(c.patternDetail, identity),
  }
  const events: { id: number; body: string }[] = []
  const mergeEvents: { id: number; body: string }[] = []
  if (erase) {
    for (const e of reads.timelines.get(c.id) ?? []) {
      const body = redactCaseText(e.body, identity, names)
      // the complainant's own added text always becomes a marked redacted copy; staff text only when it names them
      if (e.kind === 'complainant_information') events.push({ id: e.id, body: body === e.body ? `${body} [redacted copy, ${marker}]` : body })
      else if (body !== e.body) events.push({ id: e.id, body })
    }
    // a merge wrote "<reference> (<complainant's name>) was merged into this case" on the other
    // case: its own words, so the exact name and contact are masked (the general redaction would
    // also take the case references for phone numbers)
    for (const e of reads.mergeEntries.get(c.id) ?? []) {
      const body = maskExact(e.body, [
        [c.complainantName, '[name removed]'],
        [c.complainantEmail, '[e-mail removed]'],
        [c.complainantPhone, '[number removed]'],
        [c.complainantOrganisation, '[name removed]'],
      ])
      if (body !== e.body) mergeEvents.push({ id: e.id, body })
    }
  }
  const queue = reads.queue
  const queuedMails = erase ? (reads.mails.get(c.id) ?? []).map((m) => ({ jobId: m.jobId, subject: m.subject })) : []
  const account = erase ? planAccount(reads, c, expiry.retentionMonths, now, erasedThisRun) : null
  const evidence = (reads.evidence.get(c.id) ?? []).map((e) => ({ evidenceId: e.evidenceId, objectKey: e.objectKey, sha256: e.sha256, thumbnailKey: e.thumbnailKey }))
  const plan: RetentionPlanCase = {
    caseId: c.id,
    reference: c.reference,
    officeId: c.officeId,
    closedAt: c.closedAt!.toISOString(),
    retentionEndedAt: expiry.retentionEndedAt.toISOString(),
    fields,
    redactedEventIds: events.map((e) => e.id),
    evidence,
    mergeEventIds: mergeEvents.map((e) => e.id),
    coarsePosition,
    fileNames: names.map((f) => ({ evidenceId: f.evidenceId, storedFileId: f.storedFileId, name: f.name })),
    queuedMails,
    account,
  }
  return { plan, erase, changes, events, mergeEvents, queue }
}

/**
 * Deletes the objects of disposals already committed as 'pending' and records each 'done' as it
 * goes. A failure leaves that one (and any the store refuses after it) pending, logged; the
 * next run finishes them. Answers the ones done.
 */
async function finishDisposals(ctx: ServiceContext, disposals: readonly Disposal[]): Promise<Disposal[]> {
  const done: Disposal[] = []
  if (disposals.length === 0) return done
  if (!ctx.objectStore) {
    log().warn(`retention: ${disposals.length} object deletion(s) left pending: no file store is configured`)
    return done
  }
  for (const d of disposals) {
    try {
      // deleting a key that is already gone succeeds (S3 semantics), so finishing twice is harmless
      await disposeObject(ctx.objectStore, d.objectKey)
      if (d.action === 'evidence_disposed') await insertRetentionAction(ctx.db, { caseId: d.caseId, action: d.action, evidenceId: d.evidenceId, objectKey: d.objectKey, sha256: d.sha256!, stage: 'done' })
      else await insertRetentionAction(ctx.db, { caseId: d.caseId, action: d.action, evidenceId: d.evidenceId, objectKey: d.objectKey, stage: 'done' })
      done.push(d)
    } catch (err) {
      log().warn({ err }, `retention: could not delete ${d.objectKey} of case ${d.caseId}; its deletion stays pending and the next run finishes it`)
    }
  }
  return done
}

const pendingView = (d: Disposal): RetentionRunView['pendingDisposals'][number] => ({ caseId: d.caseId, action: d.action, evidenceId: d.evidenceId, objectKey: d.objectKey })

/**
 * The retention run. `dryRun`: what it would erase and dispose of, nothing changed. Otherwise it
 * first finishes the object deletions an earlier run left pending, then erases each case in its
 * own transaction (re-read under a lock: a hold set meanwhile wins) that also records each
 * object deletion as 'pending'; only after that commit are the objects deleted from the store,
 * each recorded 'done'. A store failure leaves its deletion pending for the next run; nothing
 * is ever recorded as gone that is still stored, and no object goes without its record.
 */
export async function runRetention(
  ctx: ServiceContext,
  opts: { now: Date; dryRun: boolean; /** Only these offices (tests); every office when absent. */ officeIds?: readonly string[] },
): Promise<RetentionRunView> {
  const { now, dryRun } = opts
  const scope = opts.officeIds ? { officeIds: opts.officeIds } : ({ all: true } as const)
  const pending = await pendingDisposals(ctx.db, scope)
  const finished = dryRun ? pending : await finishDisposals(ctx, pending)
  const candidates = await expiredCases(ctx.db, now, scope)
  const holds = await latestLegalHolds(ctx.db, candidates.map((x) => x.c.id))
  const withFollowUp = await casesWithOpenFollowUp(ctx.db, candidates.map((x) => x.c.id))
  const keptBecause = (c: CaseRow): Kept['reason'] | null => (holdInForce(holds.get(c.id), now) ? 'legal_hold' : withFollowUp.has(c.id) ? 'open_follow_up' : null)
  // the dry run reads what every plan needs at once; the real run re-reads each case under its lock
  const dryReads = dryRun ? await readPlanInputs(ctx, ctx.db, candidates.filter((x) => keptBecause(x.c) === null).map((x) => x.c)) : null
  const kept: Kept[] = []
  const cases: RetentionPlanCase[] = []
  const erasedThisRun = new Map<string, string[]>()
  const noteErased = (plan: RetentionPlanCase) => {
    if (plan.account) erasedThisRun.set(plan.account.userId, [...(erasedThisRun.get(plan.account.userId) ?? []), plan.caseId])
  }
  for (const { c, retentionEndedAt, retentionMonths } of candidates) {
    const expiry = { retentionEndedAt, retentionMonths }
    const reason = keptBecause(c)
    if (reason) {
      kept.push({ caseId: c.id, reference: c.reference, reason })
      continue
    }
    if (dryReads) {
      const { plan } = planCase(dryReads, c, expiry, now, erasedThisRun)
      cases.push(plan)
      noteErased(plan)
      continue
    }
    const done = await withTransaction(ctx.pool, async ({ db }) => {
      const locked = await lockCaseForRetention(db, c.id)
      if (!locked || locked.status !== 'closed') return null
      if (holdInForce((await latestLegalHolds(db, [c.id])).get(c.id), now)) {
        kept.push({ caseId: c.id, reference: c.reference, reason: 'legal_hold' })
        return null
      }
      if ((await casesWithOpenFollowUp(db, [c.id])).has(c.id)) {
        kept.push({ caseId: c.id, reference: c.reference, reason: 'open_follow_up' })
        return null
      }
      const { plan, erase, changes, events, mergeEvents, queue } = planCase(await readPlanInputs(ctx, db, [locked]), locked, expiry, now, erasedThisRun)
      const marker = erasureMarker(now)
      if (erase) {
        await erasePersonalData(db, c.id, changes, now)
        for (const e of events) await redactEvent(db, e.id, e.body)
        await insertRetentionAction(db, { caseId: c.id, action: 'personal_data_erased', fields: plan.fields, redactedEventIds: plan.redactedEventIds })
        await insertRetentionAction(db, { caseId: c.id, action: 'location_coarsened', details: { positionStepDeg: ERASED_POSITION_STEP_DEG } })
        const merged: number[] = []
        for (const e of mergeEvents) if (await redactEvent(db, e.id, e.body)) merged.push(e.id)
        plan.mergeEventIds = merged
        if (merged.length > 0) await insertRetentionAction(db, { caseId: c.id, action: 'merge_entries_redacted', redactedEventIds: merged })
        for (const f of plan.fileNames) {
          if (!(await eraseStoredFileName(db, f.storedFileId, f.name))) throw new Error(`retention: the name of stored file ${f.storedFileId} could not be erased`)
          await eraseEvidenceNames(db, f.evidenceId, f.name)
        }
        if (plan.fileNames.length > 0) await insertRetentionAction(db, { caseId: c.id, action: 'file_names_erased', details: { files: plan.fileNames } })
        const cancelled = new Set(await cancelAndDeleteJobs(db, queue, plan.queuedMails.map((m) => m.jobId)))
        plan.queuedMails = plan.queuedMails.filter((m) => cancelled.has(m.jobId))
        if (plan.queuedMails.length > 0) {
          await insertRetentionAction(db, { caseId: c.id, action: 'queued_mail_cancelled', details: { count: plan.queuedMails.length, jobIds: plan.queuedMails.map((m) => m.jobId) } })
        }
        if (plan.account?.outcome === 'deactivated') {
          await eraseAccount(db, plan.account.userId, { name: marker, email: erasedAccountEmail(plan.account.userId) })
          const sessionsEnded = await endSessionsOfUser(db, plan.account.userId)
          await insertRetentionAction(db, { caseId: c.id, action: 'account_deactivated', details: { userId: plan.account.userId, sessionsEnded } })
          // the person's own history in the audit log says it too (the account row stays, named by the marker)
          await recordAudit(db, { actorUserId: null, action: 'user.deactivated', targetType: 'user', targetId: plan.account.userId, officeId: null, details: { role: 'complainant', sessionsEnded, byRetentionOf: c.reference } })
        }
        await appendEvent(db, {
          caseId: c.id,
          at: now,
          actorUserId: null,
          actorLabel: 'Quietband',
          kind: 'personal_data_erased',
          visibility: 'internal',
          body:
            `The retention period ended; the complainant's personal data was erased (${plan.fields.join(', ')}); the position was rounded to ${ERASED_POSITION_STEP_DEG}°` +
            (plan.fileNames.length > 0 ? `; ${plan.fileNames.length} file name(s) replaced` : '') +
            (merged.length > 0 ? `; ${merged.length} merge entr${merged.length === 1 ? 'y' : 'ies'} of other cases redacted` : '') +
            (plan.queuedMails.length > 0 ? `; ${plan.queuedMails.length} unsent e-mail(s) cancelled` : '') +
            (plan.account?.outcome === 'deactivated' ? '; the complainant\u2019s account was closed' : '') +
            '.',
          data: { fields: plan.fields, redactedEventIds: plan.redactedEventIds, mergeEventIds: merged, account: plan.account?.outcome ?? null },
        })
      }
      const disposals: Disposal[] = []
      if (plan.evidence.length > 0) {
        requireStore(ctx.objectStore)
        for (const ev of plan.evidence) {
          disposals.push({ caseId: c.id, action: 'evidence_disposed', evidenceId: ev.evidenceId, objectKey: ev.objectKey, sha256: ev.sha256 })
          await insertRetentionAction(db, { caseId: c.id, action: 'evidence_disposed', evidenceId: ev.evidenceId, objectKey: ev.objectKey, sha256: ev.sha256, stage: 'pending' })
          if (ev.thumbnailKey) {
            disposals.push({ caseId: c.id, action: 'thumbnail_disposed', evidenceId: ev.evidenceId, objectKey: ev.thumbnailKey, sha256: null })
            await insertRetentionAction(db, { caseId: c.id, action: 'thumbnail_disposed', evidenceId: ev.evidenceId, objectKey: ev.thumbnailKey, stage: 'pending' })
          }
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
          body: `The retention period ended; ${plan.evidence.length} evidence file(s) are deleted from the store (their records are kept).`,
          data: { evidence: plan.evidence },
        })
      }
      await recordAudit(db, {
        actorUserId: null,
        action: 'retention.run',
        targetType: 'case',
        targetId: c.id,
        officeId: c.officeId,
        details: {
          reference: c.reference,
          fieldsErased: plan.fields,
          eventsRedacted: plan.redactedEventIds.length,
          mergeEntriesRedacted: plan.mergeEventIds.length,
          fileNamesErased: plan.fileNames.length,
          queuedMailsCancelled: plan.queuedMails.length,
          account: plan.account?.outcome ?? null,
          objectsDisposed: disposals.length,
        },
      })
      return { plan, disposals }
    })
    if (!done) continue
    cases.push(done.plan)
    noteErased(done.plan)
    // after the commit: every deletion is recorded 'pending' first, so a crash or a store failure here loses nothing
    await finishDisposals(ctx, done.disposals)
  }
  return { dryRun, at: now.toISOString(), cases, kept, pendingDisposals: finished.map(pendingView) }
}

/** GET /api/admin/retention/dry-run */
export async function previewRetention(ctx: ServiceContext, actor: Actor): Promise<RetentionRunView> {
  if (!mayPreviewRetention(actor)) throw forbidden('Only an administrator can see what the retention run would erase.')
  return runRetention(ctx, { now: ctx.now(), dryRun: true })
}
