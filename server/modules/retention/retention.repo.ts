/**
 * Every query of retention and legal hold: an office's retention period, the closed cases whose
 * period has ended, a case's legal-hold history, and the erasure and disposal writes. Functions
 * of (db, explicit arguments); no authorization here.
 */
import { and, asc, desc, eq, inArray, isNotNull, isNull, or, sql } from 'drizzle-orm'
import type { ErasedCaseField, LegalHoldAction } from '../../../shared/domain/retention'
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
export function expiredCases(db: Db, now: Date, scope: { officeIds: readonly string[] } | { all: true }): Promise<{ c: CaseRow; retentionEndedAt: Date }[]> {
  // calendar months in UTC, whatever the session's time zone (the same as retentionEndsAt in shared/domain/retention.ts)
  const endsAt = sql`(${cases.closedAt} at time zone 'UTC' + make_interval(months => ${offices.retentionMonths})) at time zone 'UTC'`
  return db
    .select({ c: cases, retentionEndedAt: sql<Date>`${endsAt}`.mapWith(cases.closedAt) })
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

export async function erasePersonalData(db: Db, caseId: string, changes: Pick<CaseRow, 'complainantName' | 'complainantEmail' | 'complainantPhone' | 'complainantOrganisation' | 'description' | 'patternDetail'>, at: Date): Promise<void> {
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

export async function insertRetentionAction(
  db: Db,
  a: { caseId: string; action: 'personal_data_erased'; fields: ErasedCaseField[]; redactedEventIds: number[] } | { caseId: string; action: 'evidence_disposed'; evidenceId: string; objectKey: string; sha256: string },
): Promise<void> {
  await db.insert(retentionActions).values(a)
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
