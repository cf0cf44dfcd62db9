/**
 * Evidence files on a case: uploading (streamed into the object store, the type decided from
 * the content, the rows written in one transaction with the custody entry and the timeline
 * event), listing, downloading with a custody entry, integrity checks and removal (a soft
 * delete by the office's supervisor). The author of every entry comes from the session.
 */
import type { Readable } from 'node:stream'
import type { Request, Response } from 'express'
import { type EvidenceKind, type VerificationOutcome } from '../../../shared/domain/evidence'
import { evidenceUploadFieldsSchema, removeEvidenceRequestSchema, shareEvidenceRequestSchema, type EvidenceView, type CustodyEntryView } from '../../../shared/schemas/evidence'
import type { ServiceContext } from '../../context'
import { withTransaction, type Db } from '../../db/client'
import type { CaseRow } from '../../db/schema'
import { badRequest, conflict, forbidden, HttpError, notFound } from '../../http/errors'
import { parseWith } from '../../http/validate'
import { log } from '../../log/logger'
import { evidenceAbilities, isCaseStaff, mayComplainantDownloadEvidence, mayDownloadEvidence, mayReadCustody, mayRemoveEvidence, maySeeEvidence, mayShareEvidence, mayUploadEvidence, mayVerifyEvidence } from '../../policy/evidence-policy'
import type { CaseActor } from '../../policy/case-policy'
import type { ObjectStore } from '../../storage/object-store'
import { hashStoredObject, INSPECTED_HEAD_BYTES, readStoredObject, receiveUpload, removeObject, requireStore, storedFileValues } from '../../storage/stored-files'
import { findUserById } from '../users/users.repo'
import { loadVisibleCase } from '../cases/case-access'
import { appendEvent, findCase, lockCase } from '../cases/cases.repo'
import { contentTypeOf } from './content-check'
import { appendCustody, countComplainantUploadsSince, custodyOf, evidenceOfCase, findEvidence, insertEvidence, markEvidenceRemoved, recordVerification, setEvidenceSharing, type EvidenceRecord } from './evidence.repo'
import { cleanFileName, submittedNameRecord } from './file-names'
import { presentCustody, presentEvidence, presentEvidenceForComplainant } from './evidence.present'
import { startEvidenceProcessing } from './start-processing'
import { findThumbnail, thumbnailsOf } from './thumbnails/thumbnails.repo'

/** The largest file a staff member may upload when the configuration does not say (2 GiB). */
export const DEFAULT_EVIDENCE_MAX_BYTES_STAFF = 2 * 1024 ** 3
/** The largest file a complainant may upload when the configuration does not say (25 MiB). */
export const DEFAULT_EVIDENCE_MAX_BYTES_COMPLAINANT = 25 * 1024 ** 2

export const evidenceNotFound = () => notFound('evidence_not_found', 'No such evidence file on a case you can see.')

/** Where a request came from, as the server saw it (the custody log's "from"). */
export type ClientAddress = string | null

async function actorLabel(db: Db, actor: CaseActor, c: CaseRow): Promise<{ userId: string | null; label: string }> {
  if (actor.role === 'tracking_link') return { userId: null, label: 'Complainant' }
  if (!isCaseStaff(actor, c)) return { userId: actor.id, label: 'Complainant' }
  return { userId: actor.id, label: (await findUserById(db, actor.id))?.name ?? 'Unknown user' }
}

function uploadLimit(store: ObjectStore, staff: boolean): number {
  const limits = store.evidenceMaxBytes
  return staff ? (limits?.staff ?? DEFAULT_EVIDENCE_MAX_BYTES_STAFF) : (limits?.complainant ?? DEFAULT_EVIDENCE_MAX_BYTES_COMPLAINANT)
}

/** Files a complainant may add to one case in an hour when the configuration does not say (abuse limit; common practice, no source). */
export const DEFAULT_COMPLAINANT_FILES_PER_HOUR = 20

/**
 * A complainant adds no file to a closed case (409) nor more than the hourly limit to one case
 * (429). Counted in PostgreSQL like the complainant's other additions: checked before the file
 * is received (nothing is stored for a refusal), and again under the case's row lock in the
 * upload's transaction, so parallel uploads and several app processes keep to it.
 */
async function checkComplainantMayAddFile(ctx: ServiceContext, db: Db, c: CaseRow, perHour: number): Promise<void> {
  if (c.status === 'closed') {
    throw conflict('case_closed', 'This report is closed, so no more files can be added to it. If the interference is back, file a new report; the office can reopen this one.')
  }
  const hourAgo = new Date(ctx.now().getTime() - 60 * 60 * 1000)
  if ((await countComplainantUploadsSince(db, c.id, hourAgo)) >= perHour) {
    throw new HttpError(429, 'too_many_files', `${perHour} files have been added to this report in the last hour, the most we take. Please wait an hour before adding more.`)
  }
}

/** The `kind` field, which must come before the file (its content is judged by it). */
function kindBeforeFile(req: Request): EvidenceKind {
  const body = (req.body ?? {}) as Record<string, unknown>
  if (body.kind === undefined) {
    throw new HttpError(400, 'validation_failed', 'Some fields need attention.', [
      { path: 'kind', message: 'Say what the file is (the field "kind", sent before the file).' },
    ])
  }
  return parseWith(evidenceUploadFieldsSchema, body).kind
}

/**
 * Uploads a file to a case: staff of the case's office, or the case's complainant. 413 beyond
 * the uploader's limit, 415 for content that is not accepted, 400 for an empty file, 503
 * when the store cannot take it (no row then).
 */
export async function uploadEvidence(ctx: ServiceContext, actor: CaseActor, caseId: string, req: Request, res: Response, from: ClientAddress): Promise<EvidenceView> {
  const c = await loadVisibleCase(ctx.db, actor, caseId)
  if (!mayUploadEvidence(actor, c)) throw forbidden('Only staff of this office and the report\'s complainant can add files to it.')
  if (!req.is('multipart/form-data')) throw badRequest('not_multipart', 'Send the file as a multipart form: the field "kind", then the field "file".')
  const staff = isCaseStaff(actor, c)
  const perHour = ctx.objectStore?.evidenceComplainantFilesPerHour ?? DEFAULT_COMPLAINANT_FILES_PER_HOUR
  if (!staff) await checkComplainantMayAddFile(ctx, ctx.db, c, perHour)
  const store = requireStore(ctx.objectStore)
  const limited: ObjectStore = { ...store, maxUploadBytes: uploadLimit(store, staff) }
  const received = await receiveUpload(limited, req, res, {
    purpose: 'evidence',
    inspect: async (head) => contentTypeOf(head, head.length < INSPECTED_HEAD_BYTES, kindBeforeFile(req)),
  })
  const who = await actorLabel(ctx.db, actor, c)
  let id: string
  let kind: EvidenceKind
  let displayName: string
  try {
    const fields = parseWith(evidenceUploadFieldsSchema, received.fields)
    kind = fields.kind
    displayName = cleanFileName(received.originalName)
    id = await withTransaction(ctx.pool, async ({ db }) => {
      if (!staff) {
        const locked = await lockCase(db, c.id)
        await checkComplainantMayAddFile(ctx, db, locked ?? c, perHour)
      }
      const row = await insertEvidence(
        db,
        storedFileValues(received.put, { originalName: displayName, contentType: received.declaredType, purpose: 'evidence', uploadedBy: who.userId }),
        {
          caseId: c.id,
          kind: fields.kind,
          uploaderRole: staff ? 'staff' : 'complainant',
          uploaderUserId: who.userId,
          displayName,
          submittedNameJson: submittedNameRecord(received.originalName),
          sharedWithComplainant: !staff,
        },
      )
      await appendCustody(db, { evidenceId: row.id, actorUserId: who.userId, actorLabel: who.label, action: 'uploaded', clientAddress: from, detail: `SHA-256 ${received.put.sha256}, ${received.put.sizeBytes} bytes` })
      await appendEvent(db, {
        caseId: c.id,
        at: ctx.now(),
        actorUserId: who.userId,
        actorLabel: who.label,
        kind: 'evidence_added',
        body: `Added the file "${displayName}".`,
        visibility: staff ? 'internal' : 'complainant',
        data: { evidenceId: row.id, kind: fields.kind, sizeBytes: received.put.sizeBytes, sha256: received.put.sha256 },
      })
      return row.id
    })
  } catch (e) {
    await removeObject(store, received.put.objectKey)
    throw e
  }
  try {
    // after the commit: a crash in between leaves the file for the sweep to queue (processing-sweep.ts)
    await startEvidenceProcessing(ctx, { id, caseId: c.id, kind, displayName, contentType: received.put.sniffedType ?? received.declaredType })
  } catch (e) {
    // the file is stored and recorded; its processing can be queued again
    log().error(`evidence ${id}: could not queue its processing: ${(e as Error)?.message ?? String(e)}`)
  }
  const record = (await findEvidence(ctx.db, id))!
  return presentEvidence(record, evidenceAbilities(actor, c, record))
}

/** A case's files for the actor: staff see every file (removed ones marked); the complainant sees their own uploads and the files the office shared with them. */
export async function listEvidence(ctx: ServiceContext, actor: CaseActor, caseId: string): Promise<EvidenceView[]> {
  const c = await loadVisibleCase(ctx.db, actor, caseId)
  if (!mayUploadEvidence(actor, c)) throw forbidden('Only staff of this office and the report\'s complainant can see its files.')
  const records = isCaseStaff(actor, c) ? await evidenceOfCase(ctx.db, c.id) : await evidenceOfCase(ctx.db, c.id, { removed: false })
  const seen = records.filter((e) => maySeeEvidence(actor, c, e))
  const thumbnails = await thumbnailsOf(ctx.db, seen.map((e) => e.id))
  const present = isCaseStaff(actor, c) ? presentEvidence : presentEvidenceForComplainant
  return seen.map((e) => present(e, evidenceAbilities(actor, c, e), thumbnails.get(e.id)))
}

/** Loads a file and its case for the actor; 404 when either is outside what they may see. */
export async function loadVisibleEvidence(db: Db, actor: CaseActor, evidenceId: string): Promise<{ e: EvidenceRecord; c: CaseRow }> {
  const e = await findEvidence(db, evidenceId)
  if (!e) throw evidenceNotFound()
  const c = await findCase(db, e.caseId)
  if (!c || !maySeeEvidence(actor, c, e)) throw evidenceNotFound()
  return { e, c }
}

export interface EvidenceDownload {
  body: Readable
  fileName: string
  contentType: string
  sizeBytes: number
  sha256: string
}

/** Opens a file for download (staff of the office) and writes the custody entry. */
export async function downloadEvidence(ctx: ServiceContext, actor: CaseActor, evidenceId: string, from: ClientAddress): Promise<EvidenceDownload> {
  const { e, c } = await loadVisibleEvidence(ctx.db, actor, evidenceId)
  if (!mayDownloadEvidence(actor, c, e)) throw forbidden('Only staff of this office can download its evidence.')
  // the retention run deleted the object (its record, key and SHA-256 stay in retention_actions)
  if (e.disposedAt) throw new HttpError(410, 'evidence_disposed', 'This file was deleted from the store when the case’s retention period ended; its record is kept.')
  const body = await readStoredObject(ctx.objectStore, e.file.objectKey)
  const who = await actorLabel(ctx.db, actor, c)
  try {
    await appendCustody(ctx.db, { evidenceId: e.id, actorUserId: who.userId, actorLabel: who.label, action: 'downloaded', clientAddress: from, detail: e.removedAt ? 'Downloaded after its removal from the case.' : null })
  } catch (err) {
    body.destroy()
    throw err
  }
  return { body, fileName: e.displayName, contentType: e.file.contentType, sizeBytes: e.file.sizeBytes, sha256: e.file.sha256 }
}

/**
 * Opens a file the office shared with the complainant for download (the tracking link's holder
 * or the signed-in complainant; `caseId` is the case of the route's path) and writes the
 * custody entry. Their own uploads and files not shared are not found (404).
 */
export async function downloadSharedEvidence(ctx: ServiceContext, actor: CaseActor, caseId: string, evidenceId: string, from: ClientAddress): Promise<EvidenceDownload> {
  const c = await loadVisibleCase(ctx.db, actor, caseId)
  const e = await findEvidence(ctx.db, evidenceId)
  if (!e || e.caseId !== c.id || !mayComplainantDownloadEvidence(actor, c, e)) throw evidenceNotFound()
  if (e.disposedAt) throw new HttpError(410, 'evidence_disposed', 'This file was deleted from the store when the report’s retention period ended.')
  const body = await readStoredObject(ctx.objectStore, e.file.objectKey)
  const who = await actorLabel(ctx.db, actor, c)
  try {
    await appendCustody(ctx.db, { evidenceId: e.id, actorUserId: who.userId, actorLabel: who.label, action: 'downloaded', clientAddress: from, detail: 'Downloaded by the complainant (shared by the office).' })
  } catch (err) {
    body.destroy()
    throw err
  }
  return { body, fileName: e.displayName, contentType: e.file.contentType, sizeBytes: e.file.sizeBytes, sha256: e.file.sha256 }
}

/**
 * Shares a staff file with the case's complainant or stops sharing it (staff of the office).
 * A removed or disposed file cannot be shared (409). Each change writes a custody entry; sharing
 * writes a timeline entry the complainant sees, stopping an internal one. Asking for the state
 * the file is already in changes nothing and writes nothing.
 */
export async function shareEvidence(ctx: ServiceContext, actor: CaseActor, evidenceId: string, input: unknown, from: ClientAddress): Promise<EvidenceView> {
  const { shared, note } = parseWith(shareEvidenceRequestSchema, input)
  const { e, c } = await loadVisibleEvidence(ctx.db, actor, evidenceId)
  if (!isCaseStaff(actor, c) || actor.role === 'tracking_link') throw forbidden('Only staff of this office can share its files with the complainant.')
  if (e.uploaderRole !== 'staff') throw conflict('evidence_from_complainant', 'This file came from the complainant, who already has it; only the office’s own files are shared.')
  if (e.removedAt) throw conflict('evidence_removed', 'This file was removed from the case, so it cannot be shared with the complainant.')
  if (e.disposedAt) throw conflict('evidence_disposed', 'This file was deleted from the store when the case’s retention period ended, so it cannot be shared.')
  if (mayShareEvidence(actor, c, e) && e.sharedWithComplainant !== shared) {
    const who = await actorLabel(ctx.db, actor, c)
    await withTransaction(ctx.pool, async ({ db }) => {
      const changed = await setEvidenceSharing(db, e.id, shared)
      // a parallel change got there first (or the file was removed meanwhile): nothing to record
      if (!changed) return
      await appendCustody(db, {
        evidenceId: e.id,
        actorUserId: who.userId,
        actorLabel: who.label,
        action: shared ? 'shared_with_complainant' : 'sharing_stopped',
        clientAddress: from,
        detail: note || null,
      })
      await appendEvent(db, {
        caseId: c.id,
        at: ctx.now(),
        actorUserId: who.userId,
        actorLabel: who.label,
        kind: shared ? 'evidence_shared' : 'evidence_unshared',
        body: shared ? `A file was shared with you: ${e.displayName}` : `Stopped sharing the file "${e.displayName}" with the complainant.`,
        visibility: shared ? 'complainant' : 'internal',
        data: { evidenceId: e.id },
      })
    })
  }
  const record = (await findEvidence(ctx.db, e.id))!
  if (record.removedAt) throw conflict('evidence_removed', 'This file was removed from the case, so it cannot be shared with the complainant.')
  return presentEvidence(record, evidenceAbilities(actor, c, record), await findThumbnail(ctx.db, e.id))
}

export interface VerificationResult {
  outcome: VerificationOutcome
  expectedSha256: string
  actualSha256: string | null
  evidence: EvidenceView
}

/**
 * Reads the stored object through again and compares its SHA-256 with the one recorded at
 * upload. A mismatch (or a missing object) is a recorded 'failed' outcome, not an error.
 */
export async function verifyEvidence(ctx: ServiceContext, actor: CaseActor, evidenceId: string, from: ClientAddress): Promise<VerificationResult> {
  const { e, c } = await loadVisibleEvidence(ctx.db, actor, evidenceId)
  if (!mayVerifyEvidence(actor, c, e) || actor.role === 'tracking_link') throw forbidden('Only staff of this office can check its evidence.')
  const read = await hashStoredObject(ctx.objectStore, e.file.objectKey)
  const actual = read === 'missing' ? null : read.sha256
  const outcome: VerificationOutcome = read !== 'missing' && read.sha256 === e.file.sha256 && read.sizeBytes === e.file.sizeBytes ? 'verified' : 'failed'
  const detail =
    read === 'missing'
      ? `The stored object is missing (expected SHA-256 ${e.file.sha256}).`
      : outcome === 'verified'
        ? `SHA-256 ${read.sha256} matches.`
        : `Expected SHA-256 ${e.file.sha256} (${e.file.sizeBytes} bytes), found ${read.sha256} (${read.sizeBytes} bytes).`
  const who = await actorLabel(ctx.db, actor, c)
  await withTransaction(ctx.pool, async ({ db }) => {
    await recordVerification(db, e.id, actor.id, outcome)
    await appendCustody(db, { evidenceId: e.id, actorUserId: who.userId, actorLabel: who.label, action: outcome === 'verified' ? 'verified' : 'verification_failed', clientAddress: from, detail })
    if (outcome === 'failed') {
      await appendEvent(db, {
        caseId: c.id,
        at: ctx.now(),
        actorUserId: who.userId,
        actorLabel: who.label,
        kind: 'evidence_integrity_failed',
        body: `The file "${e.displayName}" no longer matches what was uploaded. ${detail}`,
        visibility: 'internal',
        data: { evidenceId: e.id, expectedSha256: e.file.sha256, actualSha256: actual },
      })
    }
  })
  const record = (await findEvidence(ctx.db, e.id))!
  return { outcome, expectedSha256: e.file.sha256, actualSha256: actual, evidence: presentEvidence(record, evidenceAbilities(actor, c, record), await findThumbnail(ctx.db, e.id)) }
}

/** Removes a file from the case (the office's supervisor, with a reason): the row is marked, the object kept. */
export async function removeEvidence(ctx: ServiceContext, actor: CaseActor, evidenceId: string, input: unknown, from: ClientAddress): Promise<EvidenceView> {
  const { reason } = parseWith(removeEvidenceRequestSchema, input)
  const { e, c } = await loadVisibleEvidence(ctx.db, actor, evidenceId)
  if (e.removedAt && isCaseStaff(actor, c)) throw conflict('evidence_already_removed', 'This file has already been removed from the case.')
  if (!mayRemoveEvidence(actor, c, e) || actor.role === 'tracking_link') throw forbidden('Only the office\'s supervisor can remove evidence from a case.')
  const who = await actorLabel(ctx.db, actor, c)
  await withTransaction(ctx.pool, async ({ db }) => {
    const removed = await markEvidenceRemoved(db, e.id, actor.id, reason)
    if (!removed) throw conflict('evidence_already_removed', 'This file has already been removed from the case.')
    await appendCustody(db, { evidenceId: e.id, actorUserId: who.userId, actorLabel: who.label, action: 'removed', clientAddress: from, detail: reason })
    await appendEvent(db, {
      caseId: c.id,
      at: ctx.now(),
      actorUserId: who.userId,
      actorLabel: who.label,
      kind: 'evidence_removed',
      body: `Removed the file "${e.displayName}" from the case: ${reason}`,
      visibility: 'internal',
      data: { evidenceId: e.id },
    })
  })
  const record = (await findEvidence(ctx.db, e.id))!
  return presentEvidence(record, evidenceAbilities(actor, c, record), await findThumbnail(ctx.db, e.id))
}

/** A file's chain of custody, oldest first (staff of the office). */
export async function evidenceCustodyLog(ctx: ServiceContext, actor: CaseActor, evidenceId: string): Promise<CustodyEntryView[]> {
  const { e, c } = await loadVisibleEvidence(ctx.db, actor, evidenceId)
  if (!mayReadCustody(actor, c, e)) throw forbidden('Only staff of this office can read the chain of custody.')
  return (await custodyOf(ctx.db, e.id)).map(presentCustody)
}
