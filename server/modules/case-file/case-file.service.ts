/**
 * The case file: a signed PDF of everything a case holds, for a lawyer, a court or the party
 * responsible for the source. Issuing one numbers it (<case reference>-CF<n>), draws it, signs
 * it with the office's certificate and writes a "case file issued" entry with its SHA-256,
 * page count and who issued it onto the append-only timeline — in one transaction holding the
 * case's row, so two files issued at once get different numbers and every issued file is on
 * the record. Staff of the case's office and administrators; another office's case is 404.
 */
import crypto from 'node:crypto'
import { RADIO_LIBRARY_VERSION } from '../../../shared/radio'
import { CASE_FILE_ISSUED_KIND } from '../../../shared/domain/timeline-titles'
import type { ServiceContext } from '../../context'
import { withTransaction } from '../../db/client'
import { forbidden, HttpError } from '../../http/errors'
import { mayIssueCaseFile } from '../../policy/case-file-policy'
import type { Actor } from '../../policy/policy'
import { listCalculations } from '../calculations/calculations.service'
import { loadVisibleCase } from '../cases/case-access'
import { getCaseDetail } from '../cases/case-read.service'
import { appendEvent, lockCase } from '../cases/cases.repo'
import { manifestEntries } from '../evidence-bundle/bundle-manifest'
import { custodyOfEvidence, keptEvidenceOfCase } from '../evidence-bundle/evidence-bundle.repo'
import { listFindings } from '../findings/findings.service'
import { listMeasurements } from '../measurements/measurements.service'
import { findOffice } from '../offices/offices.repo'
import { findUserById } from '../users/users.repo'
import { renderCaseFilePdf } from './case-file-pdf'
import { countIssuedCaseFiles } from './case-file.repo'

export interface IssuedCaseFile {
  fileReference: string
  fileName: string
  pdf: Buffer
  sha256: string
  pageCount: number
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
    const detail = await getCaseDetail({ ...ctx, db: tx.db }, actor, c.id)
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
    return { fileReference, fileName, pdf, sha256, pageCount }
  })
}
