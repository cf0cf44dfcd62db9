/**
 * Every query of the responsible-party records: the party's versions, notices and replies are
 * only inserted and read (append-only in the database); no authorization here.
 */
import { and, asc, desc, eq, isNull, sql } from 'drizzle-orm'
import type { Db } from '../../db/client'
import { evidenceFiles, partyNotices, partyReplies, responsibleParties, users, type PartyNoticeRow, type PartyReplyRow, type ResponsiblePartyRow } from '../../db/schema'

export type WithRecorder<T> = T & { recordedByName: string }

/**
 * Stores the next version of the case's party (the caller holds the case's row lock, so two
 * edits cannot take the same version; the unique constraint stands behind it).
 */
export async function insertPartyVersion(db: Db, v: { caseId: string; recordedBy: string; name: string; address: string | null; email: string | null; phone: string | null }): Promise<ResponsiblePartyRow> {
  const [row] = await db
    .insert(responsibleParties)
    .values({
      ...v,
      version: sql`(select coalesce(max(${responsibleParties.version}), 0) + 1 from ${responsibleParties} where ${responsibleParties.caseId} = ${v.caseId})`,
    })
    .returning()
  return row!
}

/** Every version of the case's party, newest first. */
export async function partyVersionsOfCase(db: Db, caseId: string): Promise<WithRecorder<ResponsiblePartyRow>[]> {
  const rows = await db
    .select({ row: responsibleParties, name: users.name })
    .from(responsibleParties)
    .innerJoin(users, eq(users.id, responsibleParties.recordedBy))
    .where(eq(responsibleParties.caseId, caseId))
    .orderBy(desc(responsibleParties.version))
  return rows.map((r) => ({ ...r.row, recordedByName: r.name }))
}

export async function insertNotice(db: Db, v: Omit<typeof partyNotices.$inferInsert, 'id' | 'recordedAt'>): Promise<PartyNoticeRow> {
  const [row] = await db.insert(partyNotices).values(v).returning()
  return row!
}

/** The case's notices, most recently served first. */
export async function noticesOfCase(db: Db, caseId: string): Promise<WithRecorder<PartyNoticeRow>[]> {
  const rows = await db
    .select({ row: partyNotices, name: users.name })
    .from(partyNotices)
    .innerJoin(users, eq(users.id, partyNotices.recordedBy))
    .where(eq(partyNotices.caseId, caseId))
    .orderBy(desc(partyNotices.servedOn), desc(partyNotices.recordedAt))
  return rows.map((r) => ({ ...r.row, recordedByName: r.name }))
}

/** Whether the notice is one of the case's. */
export async function isNoticeOfCase(db: Db, caseId: string, noticeId: string): Promise<boolean> {
  const rows = await db.select({ id: partyNotices.id }).from(partyNotices).where(and(eq(partyNotices.caseId, caseId), eq(partyNotices.id, noticeId)))
  return rows.length > 0
}

export async function insertReply(db: Db, v: Omit<typeof partyReplies.$inferInsert, 'id' | 'recordedAt'>): Promise<PartyReplyRow> {
  const [row] = await db.insert(partyReplies).values(v).returning()
  return row!
}

/** The case's replies, most recently received first. */
export async function repliesOfCase(db: Db, caseId: string): Promise<WithRecorder<PartyReplyRow>[]> {
  const rows = await db
    .select({ row: partyReplies, name: users.name })
    .from(partyReplies)
    .innerJoin(users, eq(users.id, partyReplies.recordedBy))
    .where(eq(partyReplies.caseId, caseId))
    .orderBy(desc(partyReplies.receivedOn), desc(partyReplies.recordedAt))
  return rows.map((r) => ({ ...r.row, recordedByName: r.name }))
}

/** Whether the evidence file is one of the case's, not removed. */
export async function isLiveEvidenceOfCase(db: Db, caseId: string, evidenceId: string): Promise<boolean> {
  const rows = await db
    .select({ id: evidenceFiles.id })
    .from(evidenceFiles)
    .where(and(eq(evidenceFiles.caseId, caseId), eq(evidenceFiles.id, evidenceId), isNull(evidenceFiles.removedAt)))
    .orderBy(asc(evidenceFiles.id))
  return rows.length > 0
}
