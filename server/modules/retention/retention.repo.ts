/**
 * Every query of retention and legal hold: an office's retention period, the closed cases whose
 * period has ended, a case's legal-hold history, and the erasure and disposal writes. Functions
 * of (db, explicit arguments); no authorization here.
 */
import { and, asc, desc, eq, inArray, isNotNull, isNull, or, sql, type SQLWrapper } from 'drizzle-orm'
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

/**
 * `<column> = any(<ids>)` with the ids as one array parameter: a whole batch of cases in one
 * query, however many (a list of parameters would stop at PostgreSQL's 65,535).
 */
const anyOf = (column: SQLWrapper, ids: readonly string[], type: 'uuid' | 'text' = 'uuid') => sql`${column} = any(${sql.param([...ids])}::${sql.raw(type)}[])`

/** Which of the given cases have an open follow-up (one query for the batch). */
export async function casesWithOpenFollowUp(db: Db, caseIds: readonly string[]): Promise<Set<string>> {
  if (caseIds.length === 0) return new Set()
  const rows = await db
    .selectDistinct({ caseId: followUps.caseId })
    .from(followUps)
    .where(and(anyOf(followUps.caseId, caseIds), eq(followUps.state, 'open')))
  return new Set(rows.map((r) => r.caseId))
}

/** The timeline entries with text not yet redacted of the given cases, oldest first. */
export function timelinesWithText(db: Db, caseIds: readonly string[]): Promise<{ caseId: string; id: number; kind: string; body: string }[]> {
  if (caseIds.length === 0) return Promise.resolve([])
  return db
    .select({ caseId: caseEvents.caseId, id: caseEvents.id, kind: caseEvents.kind, body: sql<string>`${caseEvents.body}` })
    .from(caseEvents)
    .where(and(anyOf(caseEvents.caseId, caseIds), isNotNull(caseEvents.body), isNull(caseEvents.redactedAt)))
    .orderBy(asc(caseEvents.id))
}

/** The evidence files of the given cases not yet disposed of, with their objects, in upload order. */
export function evidenceNotDisposed(
  db: Db,
  caseIds: readonly string[],
): Promise<{ caseId: string; evidenceId: string; objectKey: string; sha256: string; thumbnailKey: string | null }[]> {
  if (caseIds.length === 0) return Promise.resolve([])
  return db
    .select({ caseId: evidenceFiles.caseId, evidenceId: evidenceFiles.id, objectKey: storedFiles.objectKey, sha256: storedFiles.sha256, thumbnailKey: evidenceThumbnails.objectKey })
    .from(evidenceFiles)
    .innerJoin(storedFiles, eq(storedFiles.id, evidenceFiles.storedFileId))
    .leftJoin(evidenceThumbnails, eq(evidenceThumbnails.evidenceId, evidenceFiles.id))
    .where(and(anyOf(evidenceFiles.caseId, caseIds), isNull(evidenceFiles.disposedAt)))
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

/**
 * Timeline entries of other cases that a merge wrote about the given cases (they quote their
 * complainants), not yet redacted, oldest first; `aboutCaseId` is the merged case.
 */
export function mergeEntriesAbout(db: Db, caseIds: readonly string[]): Promise<{ id: number; aboutCaseId: string; body: string }[]> {
  if (caseIds.length === 0) return Promise.resolve([])
  const about = sql<string>`${caseEvents.data}->>'fromCaseId'`
  return db
    .select({ id: caseEvents.id, aboutCaseId: about, body: sql<string>`${caseEvents.body}` })
    .from(caseEvents)
    .where(
      and(
        eq(caseEvents.kind, 'merged_in'),
        anyOf(about, caseIds, 'text'),
        sql`${caseEvents.caseId}::text <> ${about}`,
        isNotNull(caseEvents.body),
        isNull(caseEvents.redactedAt),
      ),
    )
    .orderBy(asc(caseEvents.id))
}

/** Every evidence file of the given cases with its stored file's name not yet erased, and the name it shows, in upload order. */
export function evidenceNamesOf(
  db: Db,
  caseIds: readonly string[],
): Promise<{ caseId: string; evidenceId: string; storedFileId: string; originalName: string; displayName: string; sha256: string; nameErased: boolean }[]> {
  if (caseIds.length === 0) return Promise.resolve([])
  return db
    .select({
      caseId: evidenceFiles.caseId,
      evidenceId: evidenceFiles.id,
      storedFileId: storedFiles.id,
      originalName: storedFiles.originalName,
      displayName: evidenceFiles.displayName,
      sha256: storedFiles.sha256,
      nameErased: sql<boolean>`${storedFiles.nameErasedAt} is not null`,
    })
    .from(evidenceFiles)
    .innerJoin(storedFiles, eq(storedFiles.id, evidenceFiles.storedFileId))
    .where(anyOf(evidenceFiles.caseId, caseIds))
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
 * E-mails about each given case still waiting in the mail queue (not yet being sent) to the
 * case's address, oldest first: every case mail's subject starts with "[<reference>]"
 * (server/mail/case-templates.ts).
 */
export async function queuedCaseMails(
  db: Db,
  queue: string,
  wanted: readonly { caseId: string; to: string; reference: string }[],
): Promise<{ caseId: string; jobId: string; subject: string }[]> {
  if (wanted.length === 0) return []
  const r = await db.execute<{ case_id: string; id: string; subject: string }>(sql`
    select w.case_id::text as case_id, j.id::text as id, j.data->>'subject' as subject
    from unnest(${sql.param(wanted.map((w) => w.caseId))}::uuid[], ${sql.param(wanted.map((w) => w.to))}::text[], ${sql.param(wanted.map((w) => `[${w.reference}]`))}::text[]) as w(case_id, to_address, prefix)
    join pgboss.job j on j.name = ${queue} and j.state::text in ('created', 'retry')
      and lower(j.data->>'to') = lower(w.to_address) and starts_with(j.data->>'subject', w.prefix)
    order by j.created_on, j.id`)
  return r.rows.map((x) => ({ caseId: x.case_id, jobId: x.id, subject: x.subject }))
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

/** The complainants' accounts as the run needs them. */
export function findAccounts(db: Db, userIds: readonly string[]): Promise<{ id: string; role: Role; active: boolean; email: string; lastSignedInAt: Date | null }[]> {
  if (userIds.length === 0) return Promise.resolve([])
  return db.select({ id: users.id, role: users.role, active: users.active, email: users.email, lastSignedInAt: users.lastSignedInAt }).from(users).where(anyOf(users.id, userIds))
}

/** The cases that still name each of the accounts as their complainant (erased cases are unlinked). */
export async function casesNamingAccounts(db: Db, userIds: readonly string[]): Promise<{ userId: string; caseId: string }[]> {
  if (userIds.length === 0) return []
  const rows = await db
    .select({ userId: sql<string>`${cases.complainantUserId}`, caseId: cases.id })
    .from(cases)
    .where(anyOf(cases.complainantUserId, userIds))
  return rows
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
