/**
 * Every query of retention and legal hold: an office's retention period, the closed cases whose
 * period has ended, a case's legal-hold history, and the erasure and disposal writes. Functions
 * of (db, explicit arguments); no authorization here.
 */
import { and, asc, desc, eq, inArray, isNotNull, isNull, or, sql } from 'drizzle-orm'
import type { DisposalAction, DisposalStage, ErasedCaseField, LegalHoldAction, RetentionActionDetails } from '../../../shared/domain/retention'
import type { Role } from '../../../shared/domain/roles'
import type { Db } from '../../db/client'
import { caseEvents, cases, evidenceFiles, evidenceThumbnails, followUps, legalHoldEvents, offices, retentionActions, storedFiles, users, type CaseRow } from '../../db/schema'

export async function findOfficeRetention(db: Db, officeId: string): Promise<{ id: string; retentionMonths: number } | undefined> {
  const [o] = await db.select({ id: offices.id, retentionMonths: offices.retentionMonths }).from(offices).where(eq(offices.id, officeId))
  return o
}

/** Locks the office's row (a concurrent change of its period waits) and returns its period. */
export async function lockOfficeRetention(db: Db, officeId: string): Promise<{ id: string; retentionMonths: number } | undefined> {
  const [o] = await db.select({ id: offices.id, retentionMonths: offices.retentionMonths }).from(offices).where(eq(offices.id, officeId)).for('no key update')
  return o
}

export async function setOfficeRetentionMonths(db: Db, officeId: string, months: number): Promise<void> {
  await db.update(offices).set({ retentionMonths: months }).where(eq(offices.id, officeId))
}

/** Open follow-ups of the office's closed cases whose personal data is still kept. */
export function openFollowUpsOfClosedCases(db: Db, officeId: string): Promise<{ caseId: string; reference: string; closedAt: Date; dueOn: string }[]> {
  return db
    .select({ caseId: cases.id, reference: cases.reference, closedAt: sql<Date>`${cases.closedAt}`.mapWith(cases.closedAt), dueOn: followUps.dueOn })
    .from(followUps)
    .innerJoin(cases, eq(cases.id, followUps.caseId))
    .where(and(eq(cases.officeId, officeId), eq(cases.status, 'closed'), isNotNull(cases.closedAt), isNull(cases.personalDataErasedAt), eq(followUps.state, 'open')))
    .orderBy(asc(followUps.dueOn))
}

/**
 * Closed cases whose office's retention period has ended by `now` (closing time plus the
 * office's months, PostgreSQL's calendar-month arithmetic) and that still hold personal data or
 * an evidence object not yet disposed of.
 */
export function expiredCases(db: Db, now: Date, scope: { officeIds: readonly string[] } | { all: true }): Promise<{ c: CaseRow; retentionEndedAt: Date; retentionMonths: number }[]> {
  // calendar months in UTC, whatever the session's time zone (the same as retentionEndsAt in shared/domain/retention.ts)
  const endsAt = sql`(${cases.closedAt} at time zone 'UTC' + make_interval(months => ${offices.retentionMonths})) at time zone 'UTC'`
  return db
    .select({ c: cases, retentionEndedAt: sql<Date>`${endsAt}`.mapWith(cases.closedAt), retentionMonths: offices.retentionMonths })
    .from(cases)
    .innerJoin(offices, eq(offices.id, cases.officeId))
    .where(
      and(
        eq(cases.status, 'closed'),
        isNotNull(cases.closedAt),
        'all' in scope ? undefined : inArray(cases.officeId, [...scope.officeIds]),
        sql`${endsAt} <= ${now.toISOString()}::timestamptz`,
        or(
          isNull(cases.personalDataErasedAt),
          sql`exists (select 1 from ${evidenceFiles} where ${evidenceFiles.caseId} = ${cases.id} and ${evidenceFiles.disposedAt} is null)`,
        ),
      ),
    )
    .orderBy(asc(cases.closedAt), asc(cases.id))
}

/** Re-reads a case under a lock, with its office's period, for the erasure transaction. */
export async function lockCaseForRetention(db: Db, caseId: string): Promise<CaseRow | undefined> {
  const [c] = await db.select().from(cases).where(eq(cases.id, caseId)).for('update')
  return c
}

export function openFollowUpCount(db: Db, caseId: string): Promise<number> {
  return db.$count(followUps, and(eq(followUps.caseId, caseId), eq(followUps.state, 'open')))
}

export function timelineWithText(db: Db, caseId: string): Promise<{ id: number; kind: string; body: string }[]> {
  return db
    .select({ id: caseEvents.id, kind: caseEvents.kind, body: sql<string>`${caseEvents.body}` })
    .from(caseEvents)
    .where(and(eq(caseEvents.caseId, caseId), isNotNull(caseEvents.body), isNull(caseEvents.redactedAt)))
    .orderBy(asc(caseEvents.id))
}

export function evidenceNotDisposed(db: Db, caseId: string): Promise<{ evidenceId: string; objectKey: string; sha256: string; thumbnailKey: string | null }[]> {
  return db
    .select({ evidenceId: evidenceFiles.id, objectKey: storedFiles.objectKey, sha256: storedFiles.sha256, thumbnailKey: evidenceThumbnails.objectKey })
    .from(evidenceFiles)
    .innerJoin(storedFiles, eq(storedFiles.id, evidenceFiles.storedFileId))
    .leftJoin(evidenceThumbnails, eq(evidenceThumbnails.evidenceId, evidenceFiles.id))
    .where(and(eq(evidenceFiles.caseId, caseId), isNull(evidenceFiles.disposedAt)))
    .orderBy(asc(evidenceFiles.uploadedAt), asc(evidenceFiles.id))
}

export async function erasePersonalData(
  db: Db,
  caseId: string,
  changes: Pick<CaseRow, 'complainantName' | 'complainantEmail' | 'complainantPhone' | 'complainantOrganisation' | 'address' | 'latDeg' | 'lonDeg' | 'description' | 'patternDetail'>,
  at: Date,
): Promise<void> {
  await db
    .update(cases)
    .set({ ...changes, complainantUserId: null, personalDataErasedAt: at, updatedAt: at, version: sql`${cases.version} + 1` })
    .where(eq(cases.id, caseId))
}

/** Replaces a timeline entry's text by its redacted copy (the one change the timeline allows; see the migration). */
export async function redactEvent(db: Db, eventId: number, body: string): Promise<boolean> {
  const r = await db.execute<{ changed: boolean }>(sql`select quietband_redact_case_event(${eventId}, ${body}) as changed`)
  return r.rows[0]?.changed === true
}

export async function markEvidenceDisposed(db: Db, evidenceIds: string[], at: Date): Promise<void> {
  if (evidenceIds.length === 0) return
  await db.update(evidenceFiles).set({ disposedAt: at }).where(and(inArray(evidenceFiles.id, evidenceIds), isNull(evidenceFiles.disposedAt)))
}

/** The thumbnails of disposed files: no object any more, shown as "no thumbnail" with the reason. */
export async function markThumbnailsDisposed(db: Db, evidenceIds: string[]): Promise<void> {
  if (evidenceIds.length === 0) return
  await db
    .update(evidenceThumbnails)
    .set({ state: 'failed', objectKey: null, contentType: null, widthPx: null, heightPx: null, sizeBytes: null, message: 'Deleted with the file when the case’s retention period ended.' })
    .where(inArray(evidenceThumbnails.evidenceId, evidenceIds))
}

export type NewRetentionAction =
  | { caseId: string; action: 'personal_data_erased'; fields: ErasedCaseField[]; redactedEventIds: number[] }
  | { caseId: string; action: 'merge_entries_redacted'; redactedEventIds: number[] }
  | { caseId: string; action: 'evidence_disposed'; evidenceId: string; objectKey: string; sha256: string; stage: DisposalStage }
  | { caseId: string; action: 'thumbnail_disposed'; evidenceId: string; objectKey: string; stage: DisposalStage }
  | { caseId: string; action: 'location_coarsened' | 'file_names_erased' | 'queued_mail_cancelled' | 'account_deactivated'; details: RetentionActionDetails }

export async function insertRetentionAction(db: Db, a: NewRetentionAction): Promise<void> {
  await db.insert(retentionActions).values(a)
}

/**
 * Object deletions recorded 'pending' with no 'done' row for the same object yet (a run that
 * stopped between its commit and the store), oldest first; only cases of the given offices.
 */
export function pendingDisposals(
  db: Db,
  scope: { officeIds: readonly string[] } | { all: true },
): Promise<{ caseId: string; action: DisposalAction; evidenceId: string; objectKey: string; sha256: string | null }[]> {
  const done = sql`exists (select 1 from ${retentionActions} d where d.action = ${retentionActions.action} and d.object_key = ${retentionActions.objectKey} and d.stage = 'done')`
  return db
    .select({ caseId: retentionActions.caseId, action: sql<DisposalAction>`${retentionActions.action}`, evidenceId: sql<string>`${retentionActions.evidenceId}`, objectKey: sql<string>`${retentionActions.objectKey}`, sha256: retentionActions.sha256 })
    .from(retentionActions)
    .innerJoin(cases, eq(cases.id, retentionActions.caseId))
    .where(and(eq(retentionActions.stage, 'pending'), 'all' in scope ? undefined : inArray(cases.officeId, [...scope.officeIds]), sql`not ${done}`))
    .orderBy(asc(retentionActions.id))
}

/** Timeline entries of other cases that a merge wrote about this case (they quote its complainant), not yet redacted. */
export function mergeEntriesAbout(db: Db, caseId: string): Promise<{ id: number; caseId: string; body: string }[]> {
  return db
    .select({ id: caseEvents.id, caseId: caseEvents.caseId, body: sql<string>`${caseEvents.body}` })
    .from(caseEvents)
    .where(
      and(
        sql`${caseEvents.caseId} <> ${caseId}`,
        eq(caseEvents.kind, 'merged_in'),
        sql`${caseEvents.data}->>'fromCaseId' = ${caseId}`,
        isNotNull(caseEvents.body),
        isNull(caseEvents.redactedAt),
      ),
    )
    .orderBy(asc(caseEvents.id))
}

/** Every evidence file of the case with its stored file's name not yet erased, and the name it shows. */
export function evidenceNamesOf(db: Db, caseId: string): Promise<{ evidenceId: string; storedFileId: string; originalName: string; displayName: string; sha256: string; nameErased: boolean }[]> {
  return db
    .select({
      evidenceId: evidenceFiles.id,
      storedFileId: storedFiles.id,
      originalName: storedFiles.originalName,
      displayName: evidenceFiles.displayName,
      sha256: storedFiles.sha256,
      nameErased: sql<boolean>`${storedFiles.nameErasedAt} is not null`,
    })
    .from(evidenceFiles)
    .innerJoin(storedFiles, eq(storedFiles.id, evidenceFiles.storedFileId))
    .where(eq(evidenceFiles.caseId, caseId))
    .orderBy(asc(evidenceFiles.uploadedAt), asc(evidenceFiles.id))
}

/** Replaces a stored file's original name by its marker (the one change stored_files allows; see the migration). */
export async function eraseStoredFileName(db: Db, storedFileId: string, name: string): Promise<boolean> {
  const r = await db.execute<{ changed: boolean }>(sql`select quietband_erase_stored_file_name(${storedFileId}, ${name}) as changed`)
  return r.rows[0]?.changed === true
}

/** The evidence row's shown and submitted names (an ordinary, updatable row). */
export async function eraseEvidenceNames(db: Db, evidenceId: string, name: string): Promise<void> {
  await db.update(evidenceFiles).set({ displayName: name, submittedNameJson: JSON.stringify(name) }).where(eq(evidenceFiles.id, evidenceId))
}

const uuidList = (ids: readonly string[]) => sql.join(ids.map((id) => sql`${id}::uuid`), sql`, `)

/**
 * E-mails about a case still waiting in the mail queue (not yet being sent) to an address: every
 * case mail's subject starts with "[<reference>]" (server/mail/case-templates.ts).
 */
export async function queuedCaseMails(db: Db, queue: string, to: string, reference: string): Promise<{ jobId: string; subject: string }[]> {
  const r = await db.execute<{ id: string; subject: string }>(sql`
    select id::text as id, data->>'subject' as subject from pgboss.job
    where name = ${queue} and state::text in ('created', 'retry')
      and lower(data->>'to') = lower(${to}) and starts_with(data->>'subject', ${`[${reference}]`})
    order by created_on, id`)
  return r.rows.map((x) => ({ jobId: x.id, subject: x.subject }))
}

/**
 * Cancels the given jobs if they are still waiting, then deletes them (the queue's guard lets the
 * application delete a cancelled job, so the message's text leaves the database); the ids done.
 */
export async function cancelAndDeleteJobs(db: Db, queue: string, jobIds: string[]): Promise<string[]> {
  if (jobIds.length === 0) return []
  const cancelled = await db.execute<{ id: string }>(sql`
    update pgboss.job set state = 'cancelled', completed_on = now()
    where name = ${queue} and id in (${uuidList(jobIds)}) and state::text in ('created', 'retry')
    returning id::text as id`)
  const ids = cancelled.rows.map((r) => r.id)
  if (ids.length > 0) await db.execute(sql`delete from pgboss.job where name = ${queue} and id in (${uuidList(ids)}) and state::text = 'cancelled'`)
  return ids
}

/** The complainant's account as the run needs it. */
export async function findAccount(db: Db, userId: string): Promise<{ id: string; role: Role; active: boolean; email: string; lastSignedInAt: Date | null } | undefined> {
  const [u] = await db.select({ id: users.id, role: users.role, active: users.active, email: users.email, lastSignedInAt: users.lastSignedInAt }).from(users).where(eq(users.id, userId))
  return u
}

/** How many cases, other than these, still name the account as their complainant (erased cases are unlinked). */
export function linkedCaseCount(db: Db, userId: string, except: readonly string[]): Promise<number> {
  return db.$count(cases, and(eq(cases.complainantUserId, userId), except.length > 0 ? sql`${cases.id} not in (${uuidList(except)})` : undefined))
}

/** Deactivates a complainant's account and replaces its name and e-mail by markers (the row stays: the audit log points at it). */
export async function eraseAccount(db: Db, userId: string, values: { name: string; email: string }): Promise<void> {
  await db.update(users).set({ ...values, active: false, passwordHash: null }).where(eq(users.id, userId))
}

export function retentionActionsOf(db: Db, caseId: string) {
  return db.select().from(retentionActions).where(eq(retentionActions.caseId, caseId)).orderBy(asc(retentionActions.id))
}

export function legalHoldHistory(db: Db, caseId: string): Promise<{ action: LegalHoldAction; at: Date; byName: string; reason: string; untilDate: string | null }[]> {
  return db
    .select({ action: legalHoldEvents.action, at: legalHoldEvents.at, byName: users.name, reason: legalHoldEvents.reason, untilDate: legalHoldEvents.untilDate })
    .from(legalHoldEvents)
    .innerJoin(users, eq(users.id, legalHoldEvents.actorUserId))
    .where(eq(legalHoldEvents.caseId, caseId))
    .orderBy(desc(legalHoldEvents.id))
}

/** The latest legal-hold row of each given case. */
export async function latestLegalHolds(db: Db, caseIds: string[]): Promise<Map<string, { action: LegalHoldAction; untilDate: string | null }>> {
  if (caseIds.length === 0) return new Map()
  const rows = await db
    .selectDistinctOn([legalHoldEvents.caseId], { caseId: legalHoldEvents.caseId, action: legalHoldEvents.action, untilDate: legalHoldEvents.untilDate })
    .from(legalHoldEvents)
    .where(inArray(legalHoldEvents.caseId, caseIds))
    .orderBy(legalHoldEvents.caseId, desc(legalHoldEvents.id))
  return new Map(rows.map((r) => [r.caseId, { action: r.action, untilDate: r.untilDate }]))
}

export async function insertLegalHoldEvent(db: Db, e: { caseId: string; action: LegalHoldAction; actorUserId: string; reason: string; untilDate: string | null }): Promise<void> {
  await db.insert(legalHoldEvents).values(e)
}

/** Locks the case's row so two hold changes of one case never interleave. */
export async function lockCaseRow(db: Db, caseId: string): Promise<void> {
  await db.select({ id: cases.id }).from(cases).where(eq(cases.id, caseId)).for('no key update')
}
