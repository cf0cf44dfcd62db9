/**
 * The case file: a signed PDF of everything a case holds, for a lawyer, a court or the party
 * responsible for the source. Issuing one numbers it (<case reference>-CF<n>), draws it, signs
 * it with the office's certificate and writes a "case file issued" entry with its SHA-256,
 * page count and who issued it onto the append-only timeline — in one transaction holding the
 * case's row, so two files issued at once get different numbers and every issued file is on
 * the record. Staff of the case's office and administrators; another office's case is 404.
 * The timeline and the enforcement record (responsible party, notices, replies, follow-ups) are
 * read under that lock, so the file prints them as they stood when it was numbered.
 */
import crypto from 'node:crypto'
import { RADIO_LIBRARY_VERSION } from '../../../shared/radio'
import type { ResponsiblePartyResponse } from '../../../shared/schemas/follow-ups'
import { CASE_FILE_ISSUED_KIND } from '../../../shared/domain/timeline-titles'
import type { ServiceContext } from '../../context'
import { withTransaction, type Db } from '../../db/client'
import { forbidden, HttpError } from '../../http/errors'
import { mayIssueCaseFile } from '../../policy/case-file-policy'
import type { Actor } from '../../policy/policy'
import { listCalculations } from '../calculations/calculations.service'
import { loadVisibleCase } from '../cases/case-access'
import { getCaseDetail } from '../cases/case-read.service'
import { appendEvent, lockCase } from '../cases/cases.repo'
import { manifestEntries } from '../evidence-bundle/bundle-manifest'
import { evidenceOfCase } from '../evidence/evidence.repo'
import { custodyOfEvidence, keptEvidenceOfCase } from '../evidence-bundle/evidence-bundle.repo'
import { listFindings } from '../findings/findings.service'
import { listMeasurements } from '../measurements/measurements.service'
import { listCaseFollowUps } from '../follow-ups/follow-ups.service'
import { findOffice } from '../offices/offices.repo'
import { presentNotice, presentParty, presentReply } from '../responsible-parties/responsible-parties.present'
import { noticesOfCase, partyVersionsOfCase, repliesOfCase } from '../responsible-parties/responsible-parties.repo'
import { findUserById } from '../users/users.repo'
import { renderCaseFilePdf } from './case-file-pdf'
import { recordAudit } from '../audit/audit.repo'
import { countIssuedCaseFiles } from './case-file.repo'

export interface IssuedCaseFile {
  fileReference: string
  fileName: string
  pdf: Buffer
  sha256: string
  pageCount: number
}

/**
 * The responsible party's versions, the notices and the replies as the case page's API presents
 * them, read one after another on the transaction's one connection (whoever may issue the case
 * file may read them: staff of the office and administrators, mayReadEnforcement).
 */
async function partyRecordOf(db: Db, caseId: string): Promise<ResponsiblePartyResponse> {
  const versions = (await partyVersionsOfCase(db, caseId)).map(presentParty)
  const notices = (await noticesOfCase(db, caseId)).map(presentNotice)
  const replies = (await repliesOfCase(db, caseId)).map(presentReply)
  return { current: versions[0] ?? null, earlier: versions.slice(1), notices, replies, abilities: { record: false } }
}

export const signingUnavailable = () =>
  new HttpError(503, 'case_file_signing_unavailable', 'Case files cannot be signed: no signing certificate is configured (CASE_FILE_P12_PATH).')

/** Draws, signs and records a new case file of the case; returns the signed bytes. */
export async function issueCaseFile(ctx: ServiceContext, actor: Actor, caseId: string): Promise<IssuedCaseFile> {
  const c = await loadVisibleCase(ctx.db, actor, caseId)
  if (!mayIssueCaseFile(actor, c)) throw forbidden('Only staff of the case\u2019s office and administrators can issue its case file.')
  const signer = ctx.caseFileSigner?.()
  if (!signer) throw signingUnavailable()
  // checked at start, but a server runs for months: a certificate that has since expired signs nothing
  if (signer.notAfter < ctx.now()) throw new HttpError(503, 'case_file_certificate_expired', `Case files cannot be signed: the office\u2019s certificate expired on ${signer.notAfter.toISOString().slice(0, 10)} (CASE_FILE_P12_PATH).`)
  const [office, me, measurements, calculations, findings, evidence] = await Promise.all([
    findOffice(ctx.db, c.officeId),
    findUserById(ctx.db, actor.id),
    listMeasurements(ctx, actor, c.id),
    listCalculations(ctx, actor, c.id),
    listFindings(ctx, actor, c.id),
    keptEvidenceOfCase(ctx.db, c.id),
  ])
  const custody = await custodyOfEvidence(
    ctx.db,
    evidence.map((f) => f.evidenceId),
  )
  const issuedBy = me?.name ?? 'Staff'
  return withTransaction(ctx.pool, async (tx) => {
    await lockCase(tx.db, c.id)
    // read under the lock: the timeline printed is the one this file's entry follows
    const txCtx = { ...ctx, db: tx.db }
    const detail = await getCaseDetail(txCtx, actor, c.id)
    // the enforcement record (proof of notice) as the case page reads it, under the same lock
    const party = await partyRecordOf(tx.db, c.id)
    const followUps = await listCaseFollowUps(txCtx, actor, c.id)
    // a notice or reply may point at a file removed since: it is still named, with its hash
    const linked = new Set([...party.notices, ...party.replies].map((x) => x.evidenceId).filter((x): x is string => x !== null))
    const linkedEvidence = linked.size === 0 ? [] : (await evidenceOfCase(tx.db, c.id)).filter((f) => linked.has(f.id)).map((f) => ({ id: f.id, name: f.displayName, sha256: f.file.sha256, removed: f.removedAt !== null }))
    const n = (await countIssuedCaseFiles(tx.db, c.id)) + 1
    const fileReference = `${c.reference}-CF${n}`
    const issuedAt = ctx.now()
    const { pdf: unsigned, pageCount } = await renderCaseFilePdf({
      fileReference,
      issuedAt,
      issuedBy,
      timeZone: office?.timeZone ?? 'UTC',
      detail,
      measurements: measurements.measurements,
      calculations,
      findings,
      evidence: manifestEntries(evidence, custody),
      party,
      followUps,
      linkedEvidence,
      libraryVersion: RADIO_LIBRARY_VERSION,
      signer: { subject: signer.subject, demo: signer.demo, certificateSha256: signer.certificateSha256 },
    })
    const pdf = await signer.sign(unsigned, {
      reason: `Case file ${fileReference} of case ${c.reference}`,
      location: detail.officeName,
      contactInfo: detail.officeName,
      signingTime: issuedAt,
    })
    const sha256 = crypto.createHash('sha256').update(pdf).digest('hex')
    const fileName = `${fileReference}.pdf`
    await appendEvent(tx.db, {
      caseId: c.id,
      actorUserId: actor.id,
      actorLabel: issuedBy,
      kind: CASE_FILE_ISSUED_KIND,
      body: `Signed case file ${fileName}: ${pageCount} pages, ${pdf.length} bytes, SHA-256 ${sha256}.`,
      visibility: 'internal',
      data: { fileReference, fileName, sha256, pageCount, sizeBytes: pdf.length, issuedById: actor.id, issuedByName: issuedBy, signer: signer.subject, certificateSha256: signer.certificateSha256, demoSignature: signer.demo },
    })
    await recordAudit(tx.db, { actorUserId: actor.id, action: 'case_file.issued', targetType: 'case', targetId: c.id, officeId: c.officeId, details: { reference: c.reference, fileReference, sha256 } })
    return { fileReference, fileName, pdf, sha256, pageCount }
  })
}
