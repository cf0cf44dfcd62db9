/** The queries of evidence files and their custody log. */
import { and, asc, count, eq, gt, inArray, isNull, sql } from 'drizzle-orm'
import { alias } from 'drizzle-orm/pg-core'
import type { CustodyAction, EvidenceUploaderRole, VerificationOutcome } from '../../../shared/domain/evidence'
import type { Db } from '../../db/client'
import { evidenceCustody, evidenceFiles, storedFiles, users, type EvidenceFileRow, type NewEvidenceFile, type NewStoredFile, type StoredFileRow } from '../../db/schema'

const uploader = alias(users, 'evidence_uploader')
const remover = alias(users, 'evidence_remover')
const verifier = alias(users, 'evidence_verifier')

/** An evidence file with its stored object and the names of the people on it. */
export type EvidenceRecord = EvidenceFileRow & {
  file: StoredFileRow
  uploaderName: string | null
  removedByName: string | null
  verifiedByName: string | null
}

const recordColumns = {
  row: evidenceFiles,
  file: storedFiles,
  uploaderName: uploader.name,
  removedByName: remover.name,
  verifiedByName: verifier.name,
}

function selectRecords(db: Db) {
  return db
    .select(recordColumns)
    .from(evidenceFiles)
    .innerJoin(storedFiles, eq(storedFiles.id, evidenceFiles.storedFileId))
    .leftJoin(uploader, eq(uploader.id, evidenceFiles.uploaderUserId))
    .leftJoin(remover, eq(remover.id, evidenceFiles.removedBy))
    .leftJoin(verifier, eq(verifier.id, evidenceFiles.verifiedBy))
}

type Selected = { row: EvidenceFileRow; file: StoredFileRow; uploaderName: string | null; removedByName: string | null; verifiedByName: string | null }
const toRecord = (r: Selected): EvidenceRecord => ({ ...r.row, file: r.file, uploaderName: r.uploaderName, removedByName: r.removedByName, verifiedByName: r.verifiedByName })

/** Writes the stored file's row and the evidence row (call inside the upload's transaction). */
export async function insertEvidence(db: Db, file: NewStoredFile, evidence: Omit<NewEvidenceFile, 'storedFileId'>): Promise<EvidenceFileRow> {
  const [f] = await db.insert(storedFiles).values(file).returning({ id: storedFiles.id })
  const [e] = await db
    .insert(evidenceFiles)
    .values({ ...evidence, storedFileId: f!.id })
    .returning()
  return e!
}

export async function findEvidence(db: Db, id: string): Promise<EvidenceRecord | undefined> {
  const [r] = await selectRecords(db).where(eq(evidenceFiles.id, id))
  return r && toRecord(r)
}

/** A case's files, oldest first; `uploaderRole` narrows to one kind of uploader, `removed: false` leaves removed files out. */
export async function evidenceOfCase(db: Db, caseId: string, opts: { uploaderRole?: EvidenceUploaderRole; removed?: false } = {}): Promise<EvidenceRecord[]> {
  const rows = await selectRecords(db)
    .where(
      and(
        eq(evidenceFiles.caseId, caseId),
        opts.uploaderRole ? eq(evidenceFiles.uploaderRole, opts.uploaderRole) : undefined,
        opts.removed === false ? isNull(evidenceFiles.removedAt) : undefined,
      ),
    )
    .orderBy(asc(evidenceFiles.uploadedAt), asc(evidenceFiles.id))
  return rows.map(toRecord)
}

/** Marks a file removed (once); undefined when it already was. */
export async function markEvidenceRemoved(db: Db, id: string, by: string, reason: string): Promise<EvidenceFileRow | undefined> {
  const [r] = await db
    .update(evidenceFiles)
    .set({ removedAt: sql`now()`, removedBy: by, removedReason: reason })
    .where(and(eq(evidenceFiles.id, id), isNull(evidenceFiles.removedAt)))
    .returning()
  return r
}

/**
 * Shares a staff file with the complainant or stops (only while it is on the case and in the
 * store, and only when that changes something); undefined when nothing changed.
 */
export async function setEvidenceSharing(db: Db, id: string, shared: boolean): Promise<EvidenceFileRow | undefined> {
  const [r] = await db
    .update(evidenceFiles)
    .set({ sharedWithComplainant: shared })
    .where(
      and(
        eq(evidenceFiles.id, id),
        eq(evidenceFiles.uploaderRole, 'staff'),
        eq(evidenceFiles.sharedWithComplainant, !shared),
        isNull(evidenceFiles.removedAt),
        isNull(evidenceFiles.disposedAt),
      ),
    )
    .returning()
  return r
}

/** Records the latest integrity check of a file. */
export async function recordVerification(db: Db, id: string, by: string, outcome: VerificationOutcome): Promise<void> {
  await db.update(evidenceFiles).set({ verifiedAt: sql`now()`, verifiedBy: by, verificationOutcome: outcome }).where(eq(evidenceFiles.id, id))
}

export interface NewCustodyEntry {
  evidenceId: string
  actorUserId: string | null
  actorLabel: string
  action: CustodyAction
  clientAddress: string | null
  detail?: string | null
}

export async function appendCustody(db: Db, e: NewCustodyEntry): Promise<void> {
  await db.insert(evidenceCustody).values({ ...e, detail: e.detail ?? null })
}

export function custodyOf(db: Db, evidenceId: string) {
  return db.select().from(evidenceCustody).where(eq(evidenceCustody.evidenceId, evidenceId)).orderBy(asc(evidenceCustody.at), asc(evidenceCustody.id))
}

/** Which of these object keys have a stored file row. */
export async function knownObjectKeys(db: Db, keys: string[]): Promise<Set<string>> {
  if (keys.length === 0) return new Set()
  const rows = await db.select({ key: storedFiles.objectKey }).from(storedFiles).where(inArray(storedFiles.objectKey, keys))
  return new Set(rows.map((r) => r.key))
}

/** How many files the complainant added to the case since `since` (removed ones included: they were added). */
export async function countComplainantUploadsSince(db: Db, caseId: string, since: Date): Promise<number> {
  const [r] = await db
    .select({ n: count() })
    .from(evidenceFiles)
    .where(and(eq(evidenceFiles.caseId, caseId), eq(evidenceFiles.uploaderRole, 'complainant'), gt(evidenceFiles.uploadedAt, since)))
  return r!.n
}
